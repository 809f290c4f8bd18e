package org.pointcall.models.metrics;

import java.util.Arrays;

/**
 * Sample quantiles by linear interpolation between order statistics: for sorted {@code x_1..x_n} the p-quantile
 * is {@code x_h' + (h - h')(x_{h'+1} - x_h')} with {@code h = (n - 1) p + 1}, {@code h' = floor(h)} (definition 7
 * of R. J. Hyndman and Y. Fan, "Sample Quantiles in Statistical Packages", The American Statistician 50(4), 1996;
 * the default of R and NumPy). NaN for no values.
 */
public final class Percentiles {
    private Percentiles() {
    }

    /** The p-quantile ({@code p} in [0, 1]) of {@code values}, which are not changed. */
    public static double of(double[] values, double p) {
        if (!(p >= 0 && p <= 1)) {
            throw new IllegalArgumentException("quantile must be in [0, 1], got " + p);
        }
        if (values.length == 0) {
            return Double.NaN;
        }
        double[] x = values.clone();
        Arrays.sort(x);
        double h = (x.length - 1) * p;
        int lo = (int) Math.floor(h);
        if (lo >= x.length - 1) {
            return x[x.length - 1];
        }
        return x[lo] + (h - lo) * (x[lo + 1] - x[lo]);
    }

    public static double median(double[] values) {
        return of(values, 0.5);
    }
}
