package org.pointcall.models.train;

import java.util.List;
import java.util.Objects;

import org.pointcall.models.metrics.ClassConfusion;

/**
 * What one split gave: its row counts before and after balancing the training side, and the row-level confusion
 * on its test side (measured rows only, never balanced).
 *
 * @param name         the split's name ({@code fold 2 of 5}, {@code held out})
 * @param trainRows    training rows as split
 * @param fittedRows   training rows after balancing, what the classifier was fitted on
 * @param testRows     test rows scored
 * @param testSorties  names of the test sorties
 * @param confusion    the test rows' confusion
 * @param fitSeconds   wall time of balancing and fitting, for the record (never asserted)
 */
public record FoldResult(String name, int trainRows, int fittedRows, int testRows, List<String> testSorties,
                         ClassConfusion confusion, double fitSeconds) {
    public FoldResult {
        Objects.requireNonNull(name, "name");
        testSorties = List.copyOf(testSorties);
        Objects.requireNonNull(confusion, "confusion");
        if (confusion.total() != testRows) {
            throw new IllegalArgumentException("confusion holds " + confusion.total() + " rows, not the "
                    + testRows + " test rows");
        }
    }

    public double macroF1() {
        return confusion.macroF1();
    }
}
