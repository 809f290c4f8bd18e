package org.pointcall.ui.desk;

/**
 * A card point's state as the console names it. Each state has a word and a shape of its own, so that it reads
 * without colour (colour-blind users, monochrome projectors); colour only repeats what word and shape say.
 */
public enum PointMark {
    /** Not yet flown, not armed. */
    WAITING("waiting", Shape.RING),
    /** Armed by the engineer: the next detection of its kind binds to it. */
    PRIMED("primed", Shape.DIAMOND),
    /** Being flown now. */
    FLYING("flying", Shape.WEDGE),
    /** Called good. */
    GOOD("good", Shape.DISC),
    /** Called for a repeat. */
    REPEAT("repeat", Shape.CROSS),
    /** Ended before its bands could be judged. */
    INCOMPLETE("incomplete", Shape.HALF),
    /** Left out of this sortie. */
    SKIPPED("skipped", Shape.BAR);

    /** Shapes the console draws beside the word. */
    public enum Shape { RING, DIAMOND, WEDGE, DISC, CROSS, HALF, BAR }

    private final String word;
    private final Shape shape;

    PointMark(String word, Shape shape) {
        this.word = word;
        this.shape = shape;
    }

    public String word() {
        return word;
    }

    public Shape shape() {
        return shape;
    }
}
