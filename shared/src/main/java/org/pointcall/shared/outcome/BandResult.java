package org.pointcall.shared.outcome;

import java.util.Objects;

/**
 * How one band of a flown point came out.
 *
 * @param index          the band's position in its card point (0 first)
 * @param subject        parameter or metric name
 * @param phase          band phase key ({@code entry}, {@code throughout}, {@code rate}, {@code instant},
 *                       {@code result})
 * @param unit           the band's unit symbol, as on the card
 * @param band           the band as an engineer reads it ({@code 320 +/- 10 kt})
 * @param value          the value judged, in {@code unit}; for {@code throughout} the one furthest from the band's
 *                       middle in its own direction, i.e. the worst; null when there was none
 * @param marginFraction signed margin to the nearer edge as a fraction of the band's width (negative outside);
 *                       null with no value
 * @param status         where the value stands
 * @param held           whether the band held in its phase
 * @param outsideS       time spent outside, s ({@code throughout} bands; 0 for the others)
 */
public record BandResult(int index, String subject, String phase, String unit, String band, Double value,
                         Double marginFraction, BandStatus status, boolean held, double outsideS) {
    public BandResult {
        Objects.requireNonNull(subject, "subject");
        Objects.requireNonNull(phase, "phase");
        Objects.requireNonNull(status, "status");
        if (index < 0) {
            throw new IllegalArgumentException("band index must not be negative");
        }
        if (value != null && !Double.isFinite(value) || marginFraction != null && Double.isNaN(marginFraction)) {
            throw new IllegalArgumentException("band value must be finite or absent");
        }
        if (!(outsideS >= 0)) {
            throw new IllegalArgumentException("time outside must not be negative");
        }
    }
}
