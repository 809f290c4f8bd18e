package org.pointcall.models.data;

import java.util.List;

/**
 * One split of a data set into training and test rows, by whole sorties: no sortie has rows on both sides, because
 * neighbouring ticks of one sortie are nearly the same row and would leak the answer across.
 */
public final class SortieSplit {
    private final String name;
    private final int[] trainRows;
    private final int[] testRows;
    private final List<Integer> trainSorties;
    private final List<Integer> testSorties;

    SortieSplit(String name, int[] trainRows, int[] testRows, List<Integer> trainSorties, List<Integer> testSorties) {
        this.name = name;
        this.trainRows = trainRows;
        this.testRows = testRows;
        this.trainSorties = List.copyOf(trainSorties);
        this.testSorties = List.copyOf(testSorties);
    }

    /** For example {@code fold 2 of 5} or {@code held out}. */
    public String name() {
        return name;
    }

    /** Indices of the training rows, ascending; a copy. */
    public int[] trainRows() {
        return trainRows.clone();
    }

    /** Indices of the test rows, ascending; a copy. */
    public int[] testRows() {
        return testRows.clone();
    }

    /** Sortie indices on the training side, ascending. */
    public List<Integer> trainSorties() {
        return trainSorties;
    }

    /** Sortie indices on the test side, ascending. */
    public List<Integer> testSorties() {
        return testSorties;
    }

    public LabelledRows train(LabelledRows rows) {
        return rows.select(trainRows);
    }

    public LabelledRows test(LabelledRows rows) {
        return rows.select(testRows);
    }

    @Override
    public String toString() {
        return name + ": " + trainRows.length + " training rows from " + trainSorties.size() + " sorties, "
                + testRows.length + " test rows from " + testSorties.size();
    }
}
