package org.pointcall.shared.card;

import java.util.Objects;

import org.pointcall.shared.units.Unit;

/**
 * A sortie-wide limit on one parameter, checked on every frame whether a point is being flown or not.
 *
 * @param parameter dictionary parameter name
 * @param unit      the card's unit for it, kept for display and writing back
 * @param minSi     lowest allowed value, SI; {@code -Infinity} when there is no lower limit
 * @param maxSi     highest allowed value, SI; {@code +Infinity} when there is no upper limit
 */
public record SafetyLimit(String parameter, Unit unit, double minSi, double maxSi) {
    public SafetyLimit {
        Objects.requireNonNull(parameter, "parameter");
        Objects.requireNonNull(unit, "unit");
        minSi += 0.0;
        maxSi += 0.0;
        if (Double.isNaN(minSi) || Double.isNaN(maxSi) || minSi == Double.POSITIVE_INFINITY
                || maxSi == Double.NEGATIVE_INFINITY || (Double.isInfinite(minSi) && Double.isInfinite(maxSi))) {
            throw new IllegalArgumentException("limit on " + parameter + " needs min, max or both");
        }
        if (!(minSi < maxSi)) {
            throw new IllegalArgumentException("limit on " + parameter + " must have max above min");
        }
    }

    /** A limit with values in {@code unit}; an absent side is given as an infinity. */
    public static SafetyLimit of(String parameter, Unit unit, double min, double max) {
        return new SafetyLimit(parameter, unit, Double.isInfinite(min) ? min : unit.toSi(min),
                Double.isInfinite(max) ? max : unit.toSi(max));
    }

    public boolean hasMin() {
        return minSi != Double.NEGATIVE_INFINITY;
    }

    public boolean hasMax() {
        return maxSi != Double.POSITIVE_INFINITY;
    }

    /** True when {@code valueSi} breaks the limit. NaN (no value) breaks nothing; staleness is checked elsewhere. */
    public boolean isExceededBy(double valueSi) {
        return valueSi < minSi || valueSi > maxSi;
    }
}
