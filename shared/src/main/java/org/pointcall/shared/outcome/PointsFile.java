package org.pointcall.shared.outcome;

import java.util.List;

/**
 * What {@code analyze} and a headless monitor write at the end: every flown point, every limit alarm and the card
 * points not flown. The format is described in the models module's README ("Points files").
 *
 * @param format   {@link #FORMAT}
 * @param source   the recording or stream it came from
 * @param sortie   the card's sortie id, or empty without a card
 * @param airframe the card's airframe, or empty
 * @param points   flown points in time order (planned, unplanned and abandoned ones)
 * @param alarms   safety-limit alarms (raised and cleared) in time order
 * @param notFlown card point ids never completed, in card order
 */
public record PointsFile(String format, String source, String sortie, String airframe, List<PointOutcome> points,
                         List<LimitAlarm> alarms, List<String> notFlown) {
    /** Format name and version of points files. */
    public static final String FORMAT = "pointcall-points/1";

    public PointsFile {
        format = format == null ? "" : format;
        source = source == null ? "" : source;
        sortie = sortie == null ? "" : sortie;
        airframe = airframe == null ? "" : airframe;
        points = points == null ? List.of() : List.copyOf(points);
        alarms = alarms == null ? List.of() : List.copyOf(alarms);
        notFlown = notFlown == null ? List.of() : List.copyOf(notFlown);
    }

    public static PointsFile of(String source, String sortie, String airframe, List<PointOutcome> points,
                                List<LimitAlarm> alarms, List<String> notFlown) {
        return new PointsFile(FORMAT, source, sortie, airframe, points, alarms, notFlown);
    }
}
