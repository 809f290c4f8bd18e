package org.pointcall.models.metrics;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

import org.pointcall.models.data.LabelledRows;
import org.pointcall.shared.error.Plain;

/**
 * Row-level confusion matrix of a multi-class classifier, {@code [truth][predicted]}, with per-class precision,
 * recall and F1 (each class against the rest) and their macro averages.
 *
 * <p>Conventions: precision {@code tp / (tp + fp)} is NaN for a class never predicted, recall {@code tp / (tp +
 * fn)} NaN for a class with no true row, and F1 {@code 2 tp / (2 tp + fp + fn)} (the harmonic mean of the two,
 * written so that it is 0 rather than undefined for a class that was missed or only falsely predicted) NaN only
 * when the class neither occurs nor is predicted. Macro averages are unweighted means over the classes that occur
 * in the truth or the predictions, with an undefined precision or recall counted as 0 (a class that is never
 * predicted scores nothing). Immutable.
 */
public final class ClassConfusion {
    private final List<String> classNames;
    private final long[][] m;
    private final long total;

    private ClassConfusion(List<String> classNames, long[][] m, long total) {
        this.classNames = classNames;
        this.m = m;
        this.total = total;
    }

    /** Over the classes of {@link LabelledRows#CLASS_NAMES}. */
    public static ClassConfusion of(int[] truth, int[] predicted) {
        return of(truth, predicted, LabelledRows.CLASS_NAMES);
    }

    /**
     * @param truth      true class index of each row
     * @param predicted  predicted class index of each row, same length
     * @param classNames name of each class index
     */
    public static ClassConfusion of(int[] truth, int[] predicted, List<String> classNames) {
        Objects.requireNonNull(classNames, "classNames");
        if (truth.length != predicted.length) {
            throw new IllegalArgumentException("truth has " + truth.length + " rows, predictions "
                    + predicted.length);
        }
        int k = classNames.size();
        long[][] m = new long[k][k];
        for (int i = 0; i < truth.length; i++) {
            Objects.checkIndex(truth[i], k);
            Objects.checkIndex(predicted[i], k);
            m[truth[i]][predicted[i]]++;
        }
        return new ClassConfusion(List.copyOf(classNames), m, truth.length);
    }

    public List<String> classNames() {
        return classNames;
    }

    public int classCount() {
        return classNames.size();
    }

    /** Rows of class {@code truth} predicted as {@code predicted}. */
    public long count(int truth, int predicted) {
        return m[truth][predicted];
    }

    /** The matrix, {@code [truth][predicted]}; a copy. */
    public long[][] matrix() {
        long[][] c = new long[m.length][];
        for (int i = 0; i < m.length; i++) {
            c[i] = m[i].clone();
        }
        return c;
    }

    public long total() {
        return total;
    }

    /** True rows of class {@code c}. */
    public long support(int c) {
        long s = 0;
        for (long v : m[c]) {
            s += v;
        }
        return s;
    }

    /** Rows predicted as class {@code c}. */
    public long predictedCount(int c) {
        long s = 0;
        for (long[] row : m) {
            s += row[c];
        }
        return s;
    }

    public double precision(int c) {
        long p = predictedCount(c);
        return p == 0 ? Double.NaN : m[c][c] / (double) p;
    }

    public double recall(int c) {
        long s = support(c);
        return s == 0 ? Double.NaN : m[c][c] / (double) s;
    }

    public double f1(int c) {
        long tp = m[c][c];
        long denominator = support(c) + predictedCount(c);
        return denominator == 0 ? Double.NaN : 2.0 * tp / denominator;
    }

    /** Share of rows predicted right; NaN for no rows. */
    public double accuracy() {
        if (total == 0) {
            return Double.NaN;
        }
        long right = 0;
        for (int c = 0; c < m.length; c++) {
            right += m[c][c];
        }
        return right / (double) total;
    }

    /** Whether class {@code c} occurs in the truth or the predictions. */
    public boolean present(int c) {
        return support(c) + predictedCount(c) > 0;
    }

    public double macroPrecision() {
        return macro(0);
    }

    public double macroRecall() {
        return macro(1);
    }

    public double macroF1() {
        return macro(2);
    }

    private double macro(int which) {
        double sum = 0;
        int n = 0;
        for (int c = 0; c < m.length; c++) {
            if (!present(c)) {
                continue;
            }
            double v = which == 0 ? precision(c) : which == 1 ? recall(c) : f1(c);
            sum += Double.isNaN(v) ? 0.0 : v;
            n++;
        }
        return n == 0 ? Double.NaN : sum / n;
    }

    /**
     * {@code name: value} lines: totals, accuracy, macro averages, then per present class its support,
     * precision, recall and F1, then every non-zero cell as {@code rows.confusion.<truth>.<predicted>}.
     */
    public List<String> lines() {
        List<String> out = new ArrayList<>();
        out.add("rows: " + total);
        out.add("rows.accuracy: " + Plain.of(accuracy()));
        out.add("rows.macro.precision: " + Plain.of(macroPrecision()));
        out.add("rows.macro.recall: " + Plain.of(macroRecall()));
        out.add("rows.macro.f1: " + Plain.of(macroF1()));
        for (int c = 0; c < m.length; c++) {
            if (!present(c)) {
                continue;
            }
            String p = "rows." + classNames.get(c) + ".";
            out.add(p + "support: " + support(c));
            out.add(p + "precision: " + Plain.of(precision(c)));
            out.add(p + "recall: " + Plain.of(recall(c)));
            out.add(p + "f1: " + Plain.of(f1(c)));
        }
        for (int t = 0; t < m.length; t++) {
            for (int p = 0; p < m.length; p++) {
                if (m[t][p] != 0) {
                    out.add("rows.confusion." + classNames.get(t) + "." + classNames.get(p) + ": " + m[t][p]);
                }
            }
        }
        return out;
    }
}
