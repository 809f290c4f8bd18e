package org.pointcall.models.balance;

import java.util.SplittableRandom;

import org.pointcall.models.data.LabelledRows;
import org.pointcall.shared.error.PointcallException;

/**
 * SMOTE, the Synthetic Minority Over-sampling Technique of N. V. Chawla, K. W. Bowyer, L. O. Hall and W. P.
 * Kegelmeyer, "SMOTE: Synthetic Minority Over-sampling Technique", Journal of Artificial Intelligence Research 16
 * (2002), 321-357, implemented from the paper.
 *
 * <p>For each minority sample {@code x} its {@code k} nearest neighbours among the other minority samples are found
 * (k = 5 by default, Euclidean distance, as in the paper). A synthetic sample is {@code x + u (nn - x)} with
 * {@code nn} one of those neighbours chosen uniformly and {@code u ~ U(0, 1)}: a random point on the segment
 * between the two. The paper's text describes exactly this point on the line segment; its pseudo-code draws the
 * gap per attribute, which would fill the box between the two instead [memory]; we follow the text, one {@code u}
 * per synthetic sample.
 *
 * <p>The paper asks for N% more samples with N a multiple of 100 (N / 100 synthetic per sample), or, below 100%, a
 * random N% of the samples each used once. Here any count is asked for: each minority sample makes
 * {@code count / m} synthetic samples and a seeded random {@code count % m} of them one more, which is the paper's
 * rule for both cases. With fewer than {@code k + 1} minority samples, all the others are the neighbours.
 *
 * <p>Neighbours are found by exhaustive search, O(m^2 d) for m minority samples of d features: a few seconds for
 * ten thousand. Every random choice comes from one seeded generator. Synthetic rows carry their origin sample's
 * sortie and time and are flagged synthetic; oversample training rows only, after splitting by sortie.
 */
public final class Smote {
    private Smote() {
    }

    /**
     * Synthetic samples of one class.
     *
     * @param minority {@code m x d} samples, row-major, every value finite
     * @param m        number of samples, at least 2
     * @param d        features per sample
     * @param count    synthetic samples to make
     * @return {@code count x d} synthetic samples, row-major, grouped by origin sample in sample order
     */
    public static double[] synthesise(double[] minority, int m, int d, int count, SmoteSettings settings) {
        return synthesise(minority, m, d, count, settings, new SplittableRandom(settings.seed()), null);
    }

    private static double[] synthesise(double[] x, int m, int d, int count, SmoteSettings settings,
                                       SplittableRandom rnd, int[] originOut) {
        if (x.length != m * d) {
            throw new IllegalArgumentException("minority holds " + x.length + " values, not " + m + " x " + d);
        }
        if (count < 0) {
            throw new IllegalArgumentException("synthetic count must be >= 0, got " + count);
        }
        if (count == 0) {
            return new double[0];
        }
        if (m < 2) {
            throw new PointcallException("SMOTE needs at least 2 samples of a class to draw between, got " + m);
        }
        for (int i = 0; i < x.length; i++) {
            if (!Double.isFinite(x[i])) {
                throw new PointcallException("SMOTE needs finite features: sample " + (i / d) + ", feature "
                        + (i % d) + " is " + x[i] + " (drop incomplete rows first)");
            }
        }
        int k = Math.min(settings.k(), m - 1);
        int[] nn = neighbours(x, m, d, k, weights(x, m, d, settings.distance()));

        int[] quota = new int[m];
        int base = count / m;
        int extra = count % m;
        java.util.Arrays.fill(quota, base);
        int[] order = new int[m];
        for (int i = 0; i < m; i++) {
            order[i] = i;
        }
        for (int i = 0; i < extra; i++) {
            int j = i + rnd.nextInt(m - i);
            int tmp = order[i];
            order[i] = order[j];
            order[j] = tmp;
            quota[order[i]]++;
        }
        double[] out = new double[count * d];
        int o = 0;
        for (int i = 0; i < m; i++) {
            for (int q = 0; q < quota[i]; q++) {
                int j = nn[i * k + rnd.nextInt(k)];
                double u = rnd.nextDouble();
                int xi = i * d;
                int xj = j * d;
                for (int f = 0; f < d; f++) {
                    out[o * d + f] = x[xi + f] + u * (x[xj + f] - x[xi + f]);
                }
                if (originOut != null) {
                    originOut[o] = i;
                }
                o++;
            }
        }
        return out;
    }

    /** Per-feature weights of the squared distance: 1, or 1 / variance over the class (0 when constant). */
    private static double[] weights(double[] x, int m, int d, NeighbourDistance distance) {
        double[] w = new double[d];
        if (distance == NeighbourDistance.EUCLIDEAN) {
            java.util.Arrays.fill(w, 1.0);
            return w;
        }
        for (int f = 0; f < d; f++) {
            double mean = 0;
            for (int i = 0; i < m; i++) {
                mean += x[i * d + f];
            }
            mean /= m;
            double ss = 0;
            for (int i = 0; i < m; i++) {
                double e = x[i * d + f] - mean;
                ss += e * e;
            }
            double var = ss / (m - 1);
            w[f] = var > 0 ? 1.0 / var : 0.0;
        }
        return w;
    }

    /** The k nearest other samples of each sample, nearest first (ties to the lower index), by exhaustive search. */
    private static int[] neighbours(double[] x, int m, int d, int k, double[] w) {
        int[] nn = new int[m * k];
        double[] best = new double[k];
        int[] idx = new int[k];
        for (int i = 0; i < m; i++) {
            int found = 0;
            for (int j = 0; j < m; j++) {
                if (j == i) {
                    continue;
                }
                double dist = 0;
                for (int f = 0; f < d; f++) {
                    double e = x[i * d + f] - x[j * d + f];
                    dist += w[f] * e * e;
                }
                if (found == k && dist >= best[k - 1]) {
                    continue;
                }
                int p = found < k ? found++ : k - 1;
                while (p > 0 && best[p - 1] > dist) {
                    best[p] = best[p - 1];
                    idx[p] = idx[p - 1];
                    p--;
                }
                best[p] = dist;
                idx[p] = j;
            }
            System.arraycopy(idx, 0, nn, i * k, k);
        }
        return nn;
    }

    /**
     * {@code rows} with {@code count} synthetic rows of class {@code classIndex} appended (after every original
     * row, which is kept as it is).
     */
    public static LabelledRows oversample(LabelledRows rows, int classIndex, int count, SmoteSettings settings) {
        return append(rows, new int[] {classIndex}, new int[] {count}, settings);
    }

    /**
     * Raises every class that has rows, other than the most frequent one, to exactly
     * {@code round(majority / ratio)} rows, where {@code majority} is the row count of the most frequent class: a
     * ratio of 1 balances all classes, 4 leaves the majority four times as frequent as each of the others. A class
     * already at or above its target is left as it is.
     */
    public static LabelledRows toRatio(LabelledRows rows, double ratio, SmoteSettings settings) {
        if (!(ratio >= 1.0) || Double.isInfinite(ratio)) {
            throw new IllegalArgumentException("SMOTE ratio is majority rows per minority row, >= 1; got " + ratio);
        }
        int[] counts = rows.classCounts();
        int majority = 0;
        for (int c = 1; c < counts.length; c++) {
            if (counts[c] > counts[majority]) {
                majority = c;
            }
        }
        long target = Math.round(counts[majority] / ratio);
        int[] classes = new int[counts.length];
        int[] add = new int[counts.length];
        int n = 0;
        for (int c = 0; c < counts.length; c++) {
            if (c != majority && counts[c] > 0 && counts[c] < target) {
                classes[n] = c;
                add[n] = (int) (target - counts[c]);
                n++;
            }
        }
        return append(rows, java.util.Arrays.copyOf(classes, n), java.util.Arrays.copyOf(add, n), settings);
    }

    private static LabelledRows append(LabelledRows rows, int[] classes, int[] counts, SmoteSettings settings) {
        SplittableRandom rnd = new SplittableRandom(settings.seed());
        LabelledRows.Builder b = LabelledRows.builder(rows.featureNames(), rows.sorties());
        double[] row = new double[rows.featureCount()];
        for (int i = 0; i < rows.rows(); i++) {
            rows.copyRow(i, row);
            b.add(row, rows.classOf(i), rows.timeNs(i), rows.sortieOf(i), rows.isSynthetic(i));
        }
        int d = rows.featureCount();
        for (int c = 0; c < classes.length; c++) {
            int[] members = rowsOf(rows, classes[c]);
            double[] x = new double[members.length * d];
            for (int i = 0; i < members.length; i++) {
                rows.copyRow(members[i], row);
                System.arraycopy(row, 0, x, i * d, d);
            }
            int[] origin = new int[counts[c]];
            double[] syn;
            try {
                syn = synthesise(x, members.length, d, counts[c], settings, rnd, origin);
            } catch (PointcallException e) {
                throw new PointcallException("class " + LabelledRows.CLASS_NAMES.get(classes[c]) + ": "
                        + e.getMessage(), e);
            }
            for (int s = 0; s < counts[c]; s++) {
                System.arraycopy(syn, s * d, row, 0, d);
                int from = members[origin[s]];
                b.add(row, classes[c], rows.timeNs(from), rows.sortieOf(from), true);
            }
        }
        return b.build();
    }

    private static int[] rowsOf(LabelledRows rows, int cls) {
        int n = 0;
        for (int i = 0; i < rows.rows(); i++) {
            if (rows.classOf(i) == cls) {
                n++;
            }
        }
        int[] out = new int[n];
        int k = 0;
        for (int i = 0; i < rows.rows(); i++) {
            if (rows.classOf(i) == cls) {
                out[k++] = i;
            }
        }
        return out;
    }
}
