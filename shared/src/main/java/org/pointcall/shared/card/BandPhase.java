package org.pointcall.shared.card;

import java.util.Optional;

/** When a tolerance band applies during a test point. */
public enum BandPhase {
    /** At the start of the technique (the condition the point is flown from). */
    ENTRY("entry"),
    /** At every sample from the start of the technique to its end. */
    THROUGHOUT("throughout"),
    /** The parameter's rate of change over a stated interval before a named key instant (stall entry rate). */
    RATE("rate"),
    /** At a named key instant of the kind (the stall break, the loop apex). */
    INSTANT("instant"),
    /** On a metric of the kind's analysis, once the point has ended. */
    RESULT("result");

    private final String key;

    BandPhase(String key) {
        this.key = key;
    }

    /** The word used in card files. */
    public String key() {
        return key;
    }

    public static Optional<BandPhase> byKey(String key) {
        for (BandPhase p : values()) {
            if (p.key.equals(key)) {
                return Optional.of(p);
            }
        }
        return Optional.empty();
    }

    /** Every key, comma-separated, for messages. */
    public static String keys() {
        StringBuilder b = new StringBuilder();
        for (BandPhase p : values()) {
            b.append(b.length() == 0 ? "" : ", ").append(p.key);
        }
        return b.toString();
    }
}
