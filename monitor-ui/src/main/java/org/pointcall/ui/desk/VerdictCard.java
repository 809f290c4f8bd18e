package org.pointcall.ui.desk;

import java.util.List;
import java.util.Objects;

/**
 * The verdict proposed at the end of a point, shown large until the engineer acknowledges it.
 *
 * @param pointId      card id
 * @param outcome      proposed outcome
 * @param reasons      why, one line each (bands outside, missing data...)
 * @param acknowledged the engineer has seen it
 */
public record VerdictCard(String pointId, Outcome outcome, List<String> reasons, boolean acknowledged) {
    public VerdictCard {
        Objects.requireNonNull(pointId, "pointId");
        Objects.requireNonNull(outcome, "outcome");
        reasons = List.copyOf(reasons);
    }
}
