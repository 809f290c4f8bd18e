package org.pointcall.models.train;

/** Range checks shared by the settings records. */
final class TreeChecks {
    private TreeChecks() {
    }

    static void atLeast(String what, int value, int min) {
        if (value < min) {
            throw new IllegalArgumentException(what + " must be at least " + min + ", got " + value);
        }
    }

    static void share(String what, double value) {
        if (!(value > 0 && value <= 1)) {
            throw new IllegalArgumentException(what + " must be in (0, 1], got " + value);
        }
    }

    static void positive(String what, double value) {
        if (!(value > 0 && Double.isFinite(value))) {
            throw new IllegalArgumentException(what + " must be a positive number, got " + value);
        }
    }
}
