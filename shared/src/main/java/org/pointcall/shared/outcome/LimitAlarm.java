package org.pointcall.shared.outcome;

import java.util.Objects;

/**
 * A sortie-wide safety limit broken ({@code raised}) or back inside ({@code raised == false}).
 *
 * @param parameter the limited parameter
 * @param unit      the limit's unit symbol, as on the card
 * @param limit     the limit in words ({@code at most 6 g})
 * @param raised    true when the limit was broken at {@code timeNs}, false when the value came back inside
 * @param timeNs    data time of the change
 * @param value     the value at the change, in {@code unit}
 * @param peak      the furthest value beyond the limit so far in this exceedance, in {@code unit}
 * @param cardId    the card point being flown at the time, or null
 */
public record LimitAlarm(String parameter, String unit, String limit, boolean raised, long timeNs, double value,
                         double peak, String cardId) {
    public LimitAlarm {
        Objects.requireNonNull(parameter, "parameter");
        Objects.requireNonNull(unit, "unit");
        Objects.requireNonNull(limit, "limit");
        if (!Double.isFinite(value) || !Double.isFinite(peak)) {
            throw new IllegalArgumentException("alarm values must be finite");
        }
    }
}
