package org.pointcall.models.rank;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Objects;

import org.pointcall.models.data.LabelledRows;
import org.pointcall.models.train.ClassifierKind;
import org.pointcall.models.train.ForestClassifier;
import org.pointcall.models.train.Trainer;
import org.pointcall.models.train.TrainerSettings;
import org.pointcall.shared.error.PointcallException;

/**
 * How much each feature says about each class: the point-biserial correlation of the feature with the class's 0/1
 * indicator (Pearson's r between the feature and the indicator), and, when asked for, the random forest's variable
 * importance (Smile's Gini decrease, summed over trees, here as a share of the total). Only the classes with rows
 * are kept. Features are listed in ranking order: by importance when there is one, else by their largest
 * {@code |r|}. Immutable.
 */
public final class FeatureRanking {
    private final List<String> features;
    private final List<String> classes;
    private final int[] classIndex;
    /** [feature][class], in ranking order. */
    private final double[][] correlation;
    /** Share of the total importance per feature, in ranking order; null when not computed. */
    private final double[] importance;
    private final int rows;

    private FeatureRanking(List<String> features, List<String> classes, int[] classIndex, double[][] correlation,
                           double[] importance, int rows) {
        this.features = List.copyOf(features);
        this.classes = List.copyOf(classes);
        this.classIndex = classIndex;
        this.correlation = correlation;
        this.importance = importance;
        this.rows = rows;
    }

    /** Correlations only. */
    public static FeatureRanking correlations(LabelledRows rows) {
        return build(rows, null);
    }

    /**
     * Correlations and the importance of a forest fitted on {@code rows} with the settings' forest, balance and
     * seed (the balance applies as in training: the forest sees balanced rows; the correlations are on the rows as
     * measured).
     */
    public static FeatureRanking withForestImportance(LabelledRows rows, TrainerSettings settings) {
        ForestClassifier forest = (ForestClassifier) new Trainer(settings.withClassifier(ClassifierKind.FOREST))
                .fit(rows);
        return build(rows, forest.importance());
    }

    /** Correlations with a given importance per feature (in {@code rows}' feature order, for example Smile's). */
    public static FeatureRanking withImportance(LabelledRows rows, double[] importance) {
        if (importance.length != rows.featureCount()) {
            throw new IllegalArgumentException(importance.length + " importances for " + rows.featureCount()
                    + " features");
        }
        return build(rows, importance.clone());
    }

    private static FeatureRanking build(LabelledRows rows, double[] rawImportance) {
        if (rows.rows() < 2) {
            throw new PointcallException("ranking features needs at least 2 rows, got " + rows.rows());
        }
        double[][] r = pointBiserial(rows);
        int[] counts = rows.classCounts();
        List<Integer> present = new ArrayList<>();
        for (int c = 0; c < counts.length; c++) {
            if (counts[c] > 0) {
                present.add(c);
            }
        }
        int d = rows.featureCount();
        double[] share = null;
        if (rawImportance != null) {
            double total = 0;
            for (double v : rawImportance) {
                total += v;
            }
            share = new double[d];
            for (int f = 0; f < d; f++) {
                share[f] = total > 0 ? rawImportance[f] / total : 0;
            }
        }
        double[] key = new double[d];
        for (int f = 0; f < d; f++) {
            if (share != null) {
                key[f] = share[f];
            } else {
                for (int c : present) {
                    double v = Math.abs(r[f][c]);
                    key[f] = Double.isNaN(v) ? key[f] : Math.max(key[f], v);
                }
            }
        }
        Integer[] order = new Integer[d];
        for (int f = 0; f < d; f++) {
            order[f] = f;
        }
        Arrays.sort(order, (a, b) -> Double.compare(key[b], key[a]));
        List<String> names = new ArrayList<>();
        double[][] corr = new double[d][present.size()];
        double[] imp = share == null ? null : new double[d];
        List<String> classNames = new ArrayList<>();
        int[] ci = new int[present.size()];
        for (int j = 0; j < present.size(); j++) {
            ci[j] = present.get(j);
            classNames.add(LabelledRows.CLASS_NAMES.get(ci[j]));
        }
        for (int i = 0; i < d; i++) {
            int f = order[i];
            names.add(rows.featureNames().get(f));
            for (int j = 0; j < ci.length; j++) {
                corr[i][j] = r[f][ci[j]];
            }
            if (imp != null) {
                imp[i] = share[f];
            }
        }
        return new FeatureRanking(names, classNames, ci, corr, imp, rows.rows());
    }

    /**
     * Point-biserial correlation of every feature with every class indicator, {@code [feature][class index]} over
     * all classes of {@link LabelledRows#CLASS_NAMES}: Pearson's r between the feature and 1 for rows of the class,
     * 0 otherwise, over the rows where the feature is finite. NaN when the feature is constant over those rows or
     * the class holds all or none of them. Centred sums in two passes, for accuracy on features far from zero.
     */
    public static double[][] pointBiserial(LabelledRows rows) {
        int n = rows.rows();
        int d = rows.featureCount();
        int k = LabelledRows.classCount();
        double[][] r = new double[d][k];
        for (int f = 0; f < d; f++) {
            double sum = 0;
            int m = 0;
            int[] inClass = new int[k];
            for (int i = 0; i < n; i++) {
                double v = rows.value(i, f);
                if (Double.isFinite(v)) {
                    sum += v;
                    m++;
                    inClass[rows.classOf(i)]++;
                }
            }
            double mean = sum / m;
            double sxx = 0;
            double sx = 0;
            double[] sxy = new double[k];
            for (int i = 0; i < n; i++) {
                double v = rows.value(i, f);
                if (Double.isFinite(v)) {
                    double e = v - mean;
                    sxx += e * e;
                    sx += e;
                    sxy[rows.classOf(i)] += e;
                }
            }
            for (int c = 0; c < k; c++) {
                // the indicator's centred value is (1 - p) in the class and -p outside, so
                // sum (x - mean)(I - p) = (in-class sum of (x - mean)) - p (sum of (x - mean), 0 but for rounding)
                double p = m == 0 ? Double.NaN : inClass[c] / (double) m;
                double syy = m * p * (1 - p);
                double cov = sxy[c] - p * sx;
                r[f][c] = sxx > 0 && syy > 0 ? clamp(cov / Math.sqrt(sxx * syy)) : Double.NaN;
            }
        }
        return r;
    }

    private static double clamp(double v) {
        return Math.max(-1.0, Math.min(1.0, v));
    }

    /** Feature names, in ranking order. */
    public List<String> features() {
        return features;
    }

    /** Names of the classes with rows, ascending class index. */
    public List<String> classes() {
        return classes;
    }

    /** Class index (of {@link LabelledRows#CLASS_NAMES}) of each column. */
    public int classIndex(int column) {
        return classIndex[column];
    }

    /** Correlation of the {@code i}-th feature in ranking order with the {@code j}-th class column. */
    public double correlation(int i, int j) {
        return correlation[i][j];
    }

    public boolean hasImportance() {
        return importance != null;
    }

    /** Share of the total forest importance of the {@code i}-th feature in ranking order. */
    public double importance(int i) {
        if (importance == null) {
            throw new IllegalStateException("no importance was computed");
        }
        return importance[i];
    }

    public int rows() {
        return rows;
    }

    /** CSV: {@code feature,importance,r_<class>...}, ranking order, values in Java's shortest round-trip form. */
    public String csv() {
        StringBuilder b = new StringBuilder("feature");
        if (importance != null) {
            b.append(",importance");
        }
        for (String c : classes) {
            b.append(",r_").append(c);
        }
        b.append('\n');
        for (int i = 0; i < features.size(); i++) {
            b.append(csvCell(features.get(i)));
            if (importance != null) {
                b.append(',').append(importance[i]);
            }
            for (int j = 0; j < classes.size(); j++) {
                double v = correlation[i][j];
                b.append(',').append(Double.isNaN(v) ? "" : Double.toString(v));
            }
            b.append('\n');
        }
        return b.toString();
    }

    private static String csvCell(String s) {
        return s.contains(",") || s.contains("\"") ? '"' + s.replace("\"", "\"\"") + '"' : s;
    }

    /** A markdown table, ranking order, three decimals ({@code -} for an undefined correlation). */
    public List<String> markdown() {
        List<String> out = new ArrayList<>();
        StringBuilder h = new StringBuilder("| feature |");
        StringBuilder rule = new StringBuilder("| --- |");
        if (importance != null) {
            h.append(" forest importance |");
            rule.append(" ---: |");
        }
        for (String c : classes) {
            h.append(" r ").append(c).append(" |");
            rule.append(" ---: |");
        }
        out.add(h.toString());
        out.add(rule.toString());
        for (int i = 0; i < features.size(); i++) {
            StringBuilder b = new StringBuilder("| ").append(features.get(i)).append(" |");
            if (importance != null) {
                b.append(' ').append(f3(importance[i])).append(" |");
            }
            for (int j = 0; j < classes.size(); j++) {
                b.append(' ').append(f3(correlation[i][j])).append(" |");
            }
            out.add(b.toString());
        }
        return out;
    }

    static String f3(double v) {
        return Double.isNaN(v) ? "-" : String.format(Locale.ROOT, "%.3f", v);
    }

    public void writeCsv(Path file) {
        write(file, csv());
    }

    public void writeMarkdown(Path file) {
        write(file, String.join("\n", markdown()) + "\n");
    }

    private static void write(Path file, String text) {
        Objects.requireNonNull(file, "file");
        try {
            Files.writeString(file, text, StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new PointcallException("cannot write " + file + ": " + e.getMessage(), e);
        }
    }
}
