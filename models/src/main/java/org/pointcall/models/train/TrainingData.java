package org.pointcall.models.train;

import java.util.List;

import org.pointcall.models.data.LabelledRows;
import org.pointcall.shared.error.PointcallException;

/**
 * Balanced training rows in the form the fitters take: flat values, and each row's class as the index of its
 * class among the classes present (Smile's outputs are numbered that way), with the map back to class indices.
 */
final class TrainingData {
    final double[] x;
    final int n;
    final int d;
    /** Output index (0..k-1) of each row. */
    final int[] y;
    /** Class index of each output, ascending. */
    final int[] outputClass;
    final long[] rowsPerClass;
    /** The extractor's features, which a fitted classifier reads. */
    final List<String> featureNames;
    /** From those to the model's own ({@link #x}, {@link #d}); null when they are the same. */
    final FeatureMap map;
    private final List<String> modelNames;

    TrainingData(LabelledRows rows) {
        this(rows, null);
    }

    TrainingData(LabelledRows rows, FeatureMap map) {
        this.featureNames = rows.featureNames();
        this.map = map;
        LabelledRows fitted = map == null ? rows : map.apply(rows);
        this.modelNames = fitted.featureNames();
        this.n = fitted.rows();
        this.d = fitted.featureCount();
        int[] counts = rows.classCounts();
        this.rowsPerClass = new long[counts.length];
        int[] outputOf = new int[counts.length];
        int k = 0;
        for (int c = 0; c < counts.length; c++) {
            rowsPerClass[c] = counts[c];
            outputOf[c] = counts[c] > 0 ? k++ : -1;
        }
        if (k < 2) {
            throw new PointcallException("the training rows hold " + (k == 0 ? "no class" : "only class "
                    + LabelledRows.CLASS_NAMES.get(firstPresent(counts))) + "; a classifier needs at least two");
        }
        this.outputClass = new int[k];
        for (int c = 0; c < counts.length; c++) {
            if (outputOf[c] >= 0) {
                outputClass[outputOf[c]] = c;
            }
        }
        this.x = fitted.flatValues();
        this.y = new int[n];
        for (int i = 0; i < n; i++) {
            y[i] = outputOf[rows.classOf(i)];
        }
    }

    private static int firstPresent(int[] counts) {
        for (int c = 0; c < counts.length; c++) {
            if (counts[c] > 0) {
                return c;
            }
        }
        return 0;
    }

    int outputs() {
        return outputClass.length;
    }

    /** Rows per output index. */
    int[] outputCounts() {
        int[] c = new int[outputClass.length];
        for (int v : y) {
            c[v]++;
        }
        return c;
    }

    /** Names of the model's own features (those of {@link #x}). */
    String[] names() {
        return modelNames.toArray(new String[0]);
    }
}
