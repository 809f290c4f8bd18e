package org.pointcall.models.card;

/** Where a card point stands in the sortie. */
public enum CardPointState {
    /** Not flown yet. */
    PENDING("pending"),
    /** The engineer armed it: the next detection of its kind binds to it. */
    ARMED("armed"),
    /** A detection bound to it is under way. */
    FLYING("flying"),
    /** Its latest flight was called good. */
    GOOD("good"),
    /** Its latest flight was called repeat. */
    REPEAT("repeat"),
    /** Its latest flight was abandoned; it is still to be flown. */
    INCOMPLETE("incomplete");

    private final String key;

    CardPointState(String key) {
        this.key = key;
    }

    public String key() {
        return key;
    }

    /** True while the point still waits for a completed flight (pending, armed or abandoned). */
    public boolean awaitsFlight() {
        return this == PENDING || this == ARMED || this == INCOMPLETE;
    }
}
