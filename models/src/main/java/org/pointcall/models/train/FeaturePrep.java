package org.pointcall.models.train;

import java.io.Serializable;
import java.util.Arrays;

import org.pointcall.shared.error.PointcallException;

/**
 * What a classifier does to a feature row before its model sees it, learnt from the training rows and kept with
 * the model: a missing (NaN) feature is replaced by its training median, and for the models that need it each
 * feature is standardised to zero mean and unit standard deviation over the training rows (a constant feature
 * becomes 0). Immutable once made; {@link #apply} writes into a caller's array and allocates nothing.
 */
public final class FeaturePrep implements Serializable {
    private static final long serialVersionUID = 1L;

    private final double[] median;
    /** Null when the features are not standardised. */
    private final double[] mean;
    private final double[] inverseSd;

    private FeaturePrep(double[] median, double[] mean, double[] inverseSd) {
        this.median = median;
        this.mean = mean;
        this.inverseSd = inverseSd;
    }

    /**
     * Learns the medians (over the finite values of each feature) and, when {@code standardise}, the means and
     * standard deviations of the imputed values, from {@code x} ({@code n x d}, row-major).
     *
     * @throws PointcallException when a feature has no finite value
     */
    static FeaturePrep fit(double[] x, int n, int d, boolean standardise, String[] featureNames) {
        double[] median = new double[d];
        double[] column = new double[n];
        for (int f = 0; f < d; f++) {
            int m = 0;
            for (int i = 0; i < n; i++) {
                double v = x[i * d + f];
                if (Double.isFinite(v)) {
                    column[m++] = v;
                }
            }
            if (m == 0) {
                throw new PointcallException("feature " + featureNames[f] + " has no finite value in the "
                        + n + " training rows");
            }
            Arrays.sort(column, 0, m);
            median[f] = (m & 1) == 1 ? column[m / 2] : 0.5 * (column[m / 2 - 1] + column[m / 2]);
        }
        if (!standardise) {
            return new FeaturePrep(median, null, null);
        }
        double[] mean = new double[d];
        double[] inverseSd = new double[d];
        for (int f = 0; f < d; f++) {
            double s = 0;
            for (int i = 0; i < n; i++) {
                s += imputed(x[i * d + f], median[f]);
            }
            double mu = s / n;
            double ss = 0;
            for (int i = 0; i < n; i++) {
                double e = imputed(x[i * d + f], median[f]) - mu;
                ss += e * e;
            }
            double sd = n > 1 ? Math.sqrt(ss / (n - 1)) : 0;
            mean[f] = mu;
            inverseSd[f] = sd > 0 ? 1.0 / sd : 0.0;
        }
        return new FeaturePrep(median, mean, inverseSd);
    }

    private static double imputed(double v, double median) {
        return Double.isFinite(v) ? v : median;
    }

    public int featureCount() {
        return median.length;
    }

    public boolean standardises() {
        return mean != null;
    }

    /** Training median of feature {@code f}, what a missing value becomes. */
    public double median(int f) {
        return median[f];
    }

    /** Prepares {@code in} into {@code out} (both at least {@link #featureCount()} long). */
    public void apply(double[] in, double[] out) {
        int d = median.length;
        if (mean == null) {
            for (int f = 0; f < d; f++) {
                double v = in[f];
                out[f] = Double.isFinite(v) ? v : median[f];
            }
        } else {
            for (int f = 0; f < d; f++) {
                double v = in[f];
                out[f] = ((Double.isFinite(v) ? v : median[f]) - mean[f]) * inverseSd[f];
            }
        }
    }

    /** Every row of {@code x} ({@code n x d}, row-major) prepared, as Smile's {@code double[n][d]}. */
    double[][] applyAll(double[] x, int n) {
        int d = median.length;
        double[][] out = new double[n][d];
        double[] in = new double[d];
        for (int i = 0; i < n; i++) {
            System.arraycopy(x, i * d, in, 0, d);
            apply(in, out[i]);
        }
        return out;
    }
}
