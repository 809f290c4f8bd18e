package org.pointcall.ui.desk;

import java.util.Objects;

/**
 * One band of the active point as a gauge shows it. Values are in the card's unit for the band (display units).
 *
 * @param subject    parameter or metric name
 * @param phase      when the band applies (entry, throughout, rate, instant, result)
 * @param text       the band as the card states it, e.g. {@code 320 +/- 10 kt}
 * @param unit       display unit symbol
 * @param low        lowest value inside, {@code -Infinity} when open
 * @param high       highest value inside, {@code +Infinity} when open
 * @param target     target, NaN for a range band
 * @param value      current (or judged) value, NaN when not known yet
 * @param marginToEdge distance to the nearer edge, positive inside, negative outside; NaN when unknown
 * @param outsideS   time spent outside so far, seconds
 * @param standing   where the session says the band stands
 */
public record BandGauge(String subject, String phase, String text, String unit, double low, double high,
                        double target, double value, double marginToEdge, double outsideS, Standing standing) {
    /** The session's reading of a band. */
    public enum Standing { WAITING, CLEAR, MARGINAL, OUT }

    public BandGauge {
        Objects.requireNonNull(subject, "subject");
        phase = phase == null ? "" : phase;
        text = text == null ? "" : text;
        unit = unit == null ? "" : unit;
        if (!(low < high)) {
            throw new IllegalArgumentException("band on " + subject + " needs low < high, got " + low + ", " + high);
        }
        java.util.Objects.requireNonNull(standing, "standing");
        if (!(outsideS >= 0)) {
            throw new IllegalArgumentException("time outside must be >= 0 s, got " + outsideS);
        }
    }

    /** True when the value is known and lies inside, edges included. */
    public boolean inside() {
        return value >= low && value <= high;
    }

    public boolean known() {
        return !Double.isNaN(value);
    }
}
