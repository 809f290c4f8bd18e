package org.pointcall.models.detect;

/** What a guard rule concluded about a point. */
public enum RuleOutcome {
    /** The physics shows what the kind requires. */
    PASSED,
    /** The physics was there and does not show it: the point is discarded. */
    FAILED,
    /** The quantities the rule reads were never sampled: the rule cannot judge, the point is kept. */
    NO_DATA
}
