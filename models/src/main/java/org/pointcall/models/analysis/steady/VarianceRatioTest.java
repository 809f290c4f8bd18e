package org.pointcall.models.analysis.steady;

/**
 * The steady-state test of Cao and Rhinehart ("An efficient method for on-line identification of steady state",
 * Journal of Process Control 5(6), 1995): three first-order filters on a signal sampled at a steady interval,
 *
 * <pre>
 *   xf(i)  = l1 x(i) + (1 - l1) xf(i-1)                       filtered value
 *   v2(i)  = l2 (x(i) - xf(i-1))^2 + (1 - l2) v2(i-1)         filtered squared deviation from the filtered value
 *   d2(i)  = l3 (x(i) - x(i-1))^2 + (1 - l3) d2(i-1)          filtered squared difference of successive samples
 *   R(i)   = (2 - l1) v2(i) / d2(i)
 * </pre>
 *
 * With independent noise about a constant, both variance estimates measure the noise variance and R is near 1;
 * a drift or a ramp inflates the deviation from the (lagging) filtered value far more than the successive
 * differences, and R grows. The signal is judged steady while R stays below a critical value. The filter factors
 * 0.2, 0.1, 0.1 and a critical ratio of 2 are the values the authors recommend [memory].
 *
 * @param l1       filter factor of the value
 * @param l2       filter factor of the deviation
 * @param l3       filter factor of the differences
 * @param critical R below which the signal is steady
 */
public record VarianceRatioTest(double l1, double l2, double l3, double critical) {
    public static final VarianceRatioTest RECOMMENDED = new VarianceRatioTest(0.2, 0.1, 0.1, 2.0);

    public VarianceRatioTest {
        for (double l : new double[] {l1, l2, l3}) {
            if (!(l > 0 && l <= 1)) {
                throw new IllegalArgumentException("filter factors must be in (0, 1], got " + l);
            }
        }
        if (!(critical > 0)) {
            throw new IllegalArgumentException("the critical ratio must be positive, got " + critical);
        }
    }

    /** R at every sample of {@code x} (equally spaced); the first is NaN (no difference yet). */
    public double[] ratios(double[] x) {
        int n = x.length;
        double[] r = new double[n];
        if (n == 0) {
            return r;
        }
        r[0] = Double.NaN;
        double xf = x[0];
        double v2 = 0;
        double d2 = 0;
        for (int i = 1; i < n; i++) {
            v2 = l2 * (x[i] - xf) * (x[i] - xf) + (1 - l2) * v2;
            xf = l1 * x[i] + (1 - l1) * xf;
            d2 = l3 * (x[i] - x[i - 1]) * (x[i] - x[i - 1]) + (1 - l3) * d2;
            r[i] = d2 > 0 ? (2 - l1) * v2 / d2 : (v2 > 0 ? Double.POSITIVE_INFINITY : 1.0);
        }
        return r;
    }

    /** Samples needed for the filters to forget their start, about three time constants of the slowest. */
    public int warmUp() {
        return (int) Math.ceil(3.0 / Math.min(l1, Math.min(l2, l3)));
    }

    /** True at each sample judged steady (R below the critical value, after the warm-up). */
    public boolean[] steady(double[] x) {
        double[] r = ratios(x);
        boolean[] s = new boolean[x.length];
        for (int i = warmUp(); i < x.length; i++) {
            s[i] = r[i] < critical;
        }
        return s;
    }
}
