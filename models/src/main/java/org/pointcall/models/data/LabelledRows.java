package org.pointcall.models.data;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

import org.pointcall.shared.error.PointcallException;
import org.pointcall.shared.kind.ManoeuvreKind;

/**
 * Feature rows with their class, for training and evaluation: one row per decision tick of a recording, stored
 * flat ({@code n x d}, row-major) with parallel primitive arrays for the class index, the tick time, the sortie and
 * whether the row is synthetic (made by oversampling, never measured).
 *
 * <p>Classes are fixed: index 0 is {@code none} (everything that is not a test point, transit included), index
 * {@code k.ordinal() + 1} is manoeuvre kind {@code k}, named by its key. A set can hold zero rows of a class.
 *
 * <p>Immutable: every accessor that returns an array returns a copy, and subsets are new sets. Safe to share
 * between threads.
 */
public final class LabelledRows {
    /** Name of class 0. */
    public static final String NONE = "none";
    /** Class names by index: {@code none}, then every kind key in registry order. */
    public static final List<String> CLASS_NAMES = classNames();

    private final double[] values;
    private final int n;
    private final int d;
    private final int[] classIndex;
    private final long[] timeNs;
    private final int[] sortie;
    private final boolean[] synthetic;
    private final List<String> featureNames;
    private final List<SortieInfo> sorties;

    private LabelledRows(double[] values, int n, List<String> featureNames, int[] classIndex, long[] timeNs,
                         int[] sortie, boolean[] synthetic, List<SortieInfo> sorties) {
        this.values = values;
        this.n = n;
        this.d = featureNames.size();
        this.classIndex = classIndex;
        this.timeNs = timeNs;
        this.sortie = sortie;
        this.synthetic = synthetic;
        this.featureNames = featureNames;
        this.sorties = sorties;
    }

    private static List<String> classNames() {
        List<String> names = new ArrayList<>();
        names.add(NONE);
        for (ManoeuvreKind k : ManoeuvreKind.values()) {
            names.add(k.key());
        }
        return List.copyOf(names);
    }

    /** Number of classes, {@code none} included. */
    public static int classCount() {
        return CLASS_NAMES.size();
    }

    /** Class index of a kind; {@code null} is {@code none}, index 0. */
    public static int classIndex(ManoeuvreKind kind) {
        return kind == null ? 0 : kind.ordinal() + 1;
    }

    /** The kind of a class index, {@code null} for {@code none}. */
    public static ManoeuvreKind kindOf(int classIndex) {
        if (classIndex < 0 || classIndex >= CLASS_NAMES.size()) {
            throw new IllegalArgumentException("class index " + classIndex + " is not in [0, " + CLASS_NAMES.size()
                    + ")");
        }
        return classIndex == 0 ? null : ManoeuvreKind.values()[classIndex - 1];
    }

    /** Class index of a name ({@code none} or a kind key), or -1. */
    public static int classIndex(String name) {
        return CLASS_NAMES.indexOf(name);
    }

    /** Starts a set of rows with these features, from these sorties (rows name a sortie by its index here). */
    public static Builder builder(List<String> featureNames, List<SortieInfo> sorties) {
        return new Builder(featureNames, sorties);
    }

    /** Number of rows. */
    public int rows() {
        return n;
    }

    /** Number of features per row. */
    public int featureCount() {
        return d;
    }

    public List<String> featureNames() {
        return featureNames;
    }

    public List<SortieInfo> sorties() {
        return sorties;
    }

    public double value(int row, int feature) {
        Objects.checkIndex(row, n);
        Objects.checkIndex(feature, d);
        return values[row * d + feature];
    }

    /** Copies row {@code row} into {@code into} (length at least {@link #featureCount()}). */
    public void copyRow(int row, double[] into) {
        Objects.checkIndex(row, n);
        System.arraycopy(values, row * d, into, 0, d);
    }

    /** A copy of row {@code row}. */
    public double[] row(int row) {
        double[] r = new double[d];
        copyRow(row, r);
        return r;
    }

    /** All values, flat and row-major ({@code n * d}); a copy. */
    public double[] flatValues() {
        return values.clone();
    }

    /** All values as {@code double[n][d]}, the form Smile's classifiers take; a copy. */
    public double[][] matrix() {
        double[][] m = new double[n][];
        for (int i = 0; i < n; i++) {
            m[i] = Arrays.copyOfRange(values, i * d, (i + 1) * d);
        }
        return m;
    }

    public int classOf(int row) {
        return classIndex[row];
    }

    /** Class index of every row; a copy. */
    public int[] classIndices() {
        return classIndex.clone();
    }

    /** Decision-tick time of the row, ns of the recording's time line (for a synthetic row, its origin's). */
    public long timeNs(int row) {
        return timeNs[row];
    }

    public long[] timesNs() {
        return timeNs.clone();
    }

    /** Index into {@link #sorties()} of the sortie the row came from (for a synthetic row, its origin's). */
    public int sortieOf(int row) {
        return sortie[row];
    }

    public int[] sortieIndices() {
        return sortie.clone();
    }

    /** True for rows made by oversampling rather than measured. */
    public boolean isSynthetic(int row) {
        return synthetic[row];
    }

    public int syntheticRows() {
        int s = 0;
        for (boolean b : synthetic) {
            if (b) {
                s++;
            }
        }
        return s;
    }

    /** Rows per class index. */
    public int[] classCounts() {
        int[] c = new int[CLASS_NAMES.size()];
        for (int k : classIndex) {
            c[k]++;
        }
        return c;
    }

    /** Rows per sortie index. */
    public int[] sortieCounts() {
        int[] c = new int[sorties.size()];
        for (int s : sortie) {
            c[s]++;
        }
        return c;
    }

    /** Rows per class name, classes with no row left out, in class order: for summaries. */
    public Map<String, Integer> rowsPerClass() {
        Map<String, Integer> m = new java.util.LinkedHashMap<>();
        int[] c = classCounts();
        for (int k = 0; k < c.length; k++) {
            if (c[k] > 0) {
                m.put(CLASS_NAMES.get(k), c[k]);
            }
        }
        return java.util.Collections.unmodifiableMap(m);
    }

    /** The rows at {@code rowIndices}, in that order (an index may repeat); same features and sorties. */
    public LabelledRows select(int[] rowIndices) {
        int m = rowIndices.length;
        double[] v = new double[m * d];
        int[] c = new int[m];
        long[] t = new long[m];
        int[] s = new int[m];
        boolean[] syn = new boolean[m];
        for (int i = 0; i < m; i++) {
            int r = Objects.checkIndex(rowIndices[i], n);
            System.arraycopy(values, r * d, v, i * d, d);
            c[i] = classIndex[r];
            t[i] = timeNs[r];
            s[i] = sortie[r];
            syn[i] = synthetic[r];
        }
        return new LabelledRows(v, m, featureNames, c, t, s, syn, sorties);
    }

    /** Indices of the rows of sortie index {@code s}. */
    public int[] rowsOfSortie(int s) {
        int count = 0;
        for (int x : sortie) {
            if (x == s) {
                count++;
            }
        }
        int[] out = new int[count];
        int k = 0;
        for (int i = 0; i < n; i++) {
            if (sortie[i] == s) {
                out[k++] = i;
            }
        }
        return out;
    }

    /**
     * The rows of several sets in one, sorties renumbered in order.
     *
     * @throws PointcallException when the sets have different features, or two sorties share a name
     */
    public static LabelledRows concat(List<LabelledRows> sets) {
        if (sets.isEmpty()) {
            throw new IllegalArgumentException("nothing to concatenate");
        }
        List<String> features = sets.get(0).featureNames;
        List<SortieInfo> sorties = new ArrayList<>();
        Map<String, Integer> names = new HashMap<>();
        int total = 0;
        for (LabelledRows r : sets) {
            if (!r.featureNames.equals(features)) {
                throw new PointcallException("row sets have different features (" + features.size() + " named "
                        + features.get(0) + "... against " + r.featureNames.size() + " named "
                        + (r.featureNames.isEmpty() ? "nothing" : r.featureNames.get(0)) + "...); build them with "
                        + "the same windows");
            }
            total += r.n;
        }
        for (LabelledRows r : sets) {
            for (SortieInfo si : r.sorties) {
                if (names.put(si.name(), sorties.size()) != null) {
                    throw new PointcallException("sortie '" + si.name() + "' is in two row sets; each sortie once");
                }
                sorties.add(si);
            }
        }
        Builder b = new Builder(features, sorties);
        b.reserve(total);
        int base = 0;
        for (LabelledRows r : sets) {
            for (int i = 0; i < r.n; i++) {
                b.addFrom(r.values, i * r.d, r.classIndex[i], r.timeNs[i], base + r.sortie[i], r.synthetic[i]);
            }
            base += r.sorties.size();
        }
        return b.build();
    }

    @Override
    public String toString() {
        return "LabelledRows[" + n + " rows x " + d + " features, " + sorties.size() + " sorties, "
                + rowsPerClass() + "]";
    }

    /** Collects rows one at a time into growing primitive arrays; single-threaded. */
    public static final class Builder {
        private final List<String> featureNames;
        private final List<SortieInfo> sorties;
        private final int d;
        private double[] values = new double[0];
        private int[] classIndex = new int[0];
        private long[] timeNs = new long[0];
        private int[] sortie = new int[0];
        private boolean[] synthetic = new boolean[0];
        private int n;
        private boolean built;

        Builder(List<String> featureNames, List<SortieInfo> sorties) {
            this.featureNames = List.copyOf(featureNames);
            this.sorties = List.copyOf(sorties);
            this.d = this.featureNames.size();
            if (d == 0) {
                throw new IllegalArgumentException("rows need at least one feature");
            }
            if (new java.util.HashSet<>(this.featureNames).size() != d) {
                throw new IllegalArgumentException("feature names must be unique");
            }
            Map<String, Integer> seen = new HashMap<>();
            for (SortieInfo s : this.sorties) {
                if (seen.put(s.name(), 0) != null) {
                    throw new IllegalArgumentException("sortie '" + s.name() + "' is listed twice");
                }
            }
            reserve(256);
        }

        void reserve(int rows) {
            if (rows <= classIndex.length) {
                return;
            }
            if ((long) rows * d > Integer.MAX_VALUE - 8) {
                throw new PointcallException("too many rows for one set: " + rows + " x " + d + " features");
            }
            values = Arrays.copyOf(values, rows * d);
            classIndex = Arrays.copyOf(classIndex, rows);
            timeNs = Arrays.copyOf(timeNs, rows);
            sortie = Arrays.copyOf(sortie, rows);
            synthetic = Arrays.copyOf(synthetic, rows);
        }

        /**
         * Adds a row (its first {@code featureCount} values are copied).
         *
         * @param classIdx class index, see {@link LabelledRows#CLASS_NAMES}
         * @param sortieIdx index of the sortie in the builder's list
         */
        public Builder add(double[] row, int classIdx, long tNs, int sortieIdx, boolean isSynthetic) {
            if (row.length < d) {
                throw new IllegalArgumentException("row has " + row.length + " values, " + d + " features needed");
            }
            return addFrom(row, 0, classIdx, tNs, sortieIdx, isSynthetic);
        }

        Builder addFrom(double[] src, int offset, int classIdx, long tNs, int sortieIdx, boolean isSynthetic) {
            if (built) {
                throw new IllegalStateException("already built");
            }
            Objects.checkIndex(classIdx, CLASS_NAMES.size());
            if (sortieIdx < 0 || sortieIdx >= sorties.size()) {
                throw new IndexOutOfBoundsException("sortie index " + sortieIdx + " of " + sorties.size());
            }
            if (n == classIndex.length) {
                reserve(Math.max(256, n + (n >> 1)));
            }
            System.arraycopy(src, offset, values, n * d, d);
            classIndex[n] = classIdx;
            timeNs[n] = tNs;
            sortie[n] = sortieIdx;
            synthetic[n] = isSynthetic;
            n++;
            return this;
        }

        public int rows() {
            return n;
        }

        public LabelledRows build() {
            built = true;
            return new LabelledRows(Arrays.copyOf(values, n * d), n, featureNames, Arrays.copyOf(classIndex, n),
                    Arrays.copyOf(timeNs, n), Arrays.copyOf(sortie, n), Arrays.copyOf(synthetic, n), sorties);
        }
    }
}
