package org.pointcall.ui.desk;

/** A verdict or an engineer's call, as the console shows and sends it. */
public enum Outcome {
    GOOD, REPEAT, INCOMPLETE;

    /** The point state the outcome leaves on the card. */
    public PointMark mark() {
        return switch (this) {
            case GOOD -> PointMark.GOOD;
            case REPEAT -> PointMark.REPEAT;
            case INCOMPLETE -> PointMark.INCOMPLETE;
        };
    }
}
