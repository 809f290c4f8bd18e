package org.pointcall.ingest.sim.airframe;

import org.pointcall.shared.error.Plain;

/** Compact-constructor guards shared by the profile records: one plain line naming the field and the rule. */
final class Checks {
    private Checks() {
    }

    static double finite(String field, double v) {
        if (!Double.isFinite(v)) {
            throw new IllegalArgumentException(field + " must be a finite number, got " + Plain.of(v));
        }
        return v;
    }

    static double positive(String field, double v) {
        if (!(v > 0.0 && v < Double.POSITIVE_INFINITY)) {
            throw new IllegalArgumentException(field + " must be positive, got " + Plain.of(v));
        }
        return v;
    }

    static double nonNegative(String field, double v) {
        if (!(v >= 0.0 && v < Double.POSITIVE_INFINITY)) {
            throw new IllegalArgumentException(field + " must be zero or positive, got " + Plain.of(v));
        }
        return v;
    }

    static double between(String field, double v, double lo, double hi) {
        if (!(v >= lo && v <= hi)) {
            throw new IllegalArgumentException(field + " must be between " + Plain.of(lo) + " and " + Plain.of(hi)
                    + ", got " + Plain.of(v));
        }
        return v;
    }
}
