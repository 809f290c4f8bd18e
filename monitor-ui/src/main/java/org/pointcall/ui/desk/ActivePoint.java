package org.pointcall.ui.desk;

import java.util.List;
import java.util.Objects;

/**
 * The point being flown, as the active-point panel shows it.
 *
 * @param pointId  card id
 * @param title    card title
 * @param config   the card's configuration line
 * @param elapsedS time since the point began, seconds
 * @param holdS    time the point has held its bands so far, seconds
 * @param holdRequiredS hold the card asks for, seconds; 0 when none
 * @param gauges   one per band, in card order
 * @param traceBands bands to draw on the traces now
 */
public record ActivePoint(String pointId, String title, String config, double elapsedS, double holdS,
                          double holdRequiredS, List<BandGauge> gauges, List<TraceBand> traceBands) {
    public ActivePoint {
        Objects.requireNonNull(pointId, "pointId");
        title = title == null ? "" : title;
        config = config == null ? "" : config;
        gauges = List.copyOf(gauges);
        traceBands = List.copyOf(traceBands);
        if (!(elapsedS >= 0) || !(holdS >= 0) || !(holdRequiredS >= 0)) {
            throw new IllegalArgumentException("times of point " + pointId + " must be >= 0 s");
        }
    }
}
