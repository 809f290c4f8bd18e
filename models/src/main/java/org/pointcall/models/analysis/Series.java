package org.pointcall.models.analysis;

import java.util.Arrays;

import org.pointcall.shared.error.PointcallException;

/**
 * One parameter of a {@link PointHistory} over a stretch of time, as the analysers read it: the finite samples
 * only (a dropout or a rate lower than the frame rate leaves NaN frames, which are skipped), times in seconds from
 * an origin, values in SI. Immutable; every operation returns a new series.
 *
 * <p>Telemetry carries rare wild points; {@link #despiked} removes them with a Hampel filter (a sample further
 * than a few scaled median absolute deviations from its neighbourhood's median is replaced by that median; Pearson,
 * "Outliers in process modeling and identification", IEEE Trans. Control Systems Technology, 2002), before any
 * extreme is taken.
 */
public final class Series {
    private final double[] tS;
    private final double[] v;

    private Series(double[] tS, double[] v) {
        this.tS = tS;
        this.v = v;
    }

    /** A series from raw arrays (copied); times must not decrease. */
    public static Series of(double[] tS, double[] v) {
        if (tS.length != v.length) {
            throw new IllegalArgumentException("times and values differ in length");
        }
        int n = 0;
        double[] t = new double[tS.length];
        double[] x = new double[v.length];
        for (int i = 0; i < tS.length; i++) {
            if (Double.isFinite(v[i]) && Double.isFinite(tS[i])) {
                if (n > 0 && tS[i] < t[n - 1]) {
                    throw new IllegalArgumentException("times must not decrease");
                }
                t[n] = tS[i];
                x[n] = v[i];
                n++;
            }
        }
        return new Series(Arrays.copyOf(t, n), Arrays.copyOf(x, n));
    }

    /**
     * The finite samples of {@code name} from {@code fromNs} to {@code toNs} inclusive, times in seconds from
     * {@code originNs}.
     *
     * @throws PointcallException when the history does not hold the parameter
     */
    public static Series of(PointHistory h, String name, long originNs, long fromNs, long toNs) {
        if (!h.has(name)) {
            throw new PointcallException("parameter '" + name + "' is not in this history");
        }
        int a = h.firstAtOrAfter(fromNs);
        int b = h.firstAtOrAfter(toNs);
        while (b < h.size() && h.timeNs(b) == toNs) {
            b++;
        }
        double[] t = new double[Math.max(0, b - a)];
        double[] x = new double[t.length];
        int n = 0;
        for (int i = a; i < b; i++) {
            double val = h.valueSi(name, i);
            if (Double.isFinite(val)) {
                t[n] = (h.timeNs(i) - originNs) * 1e-9;
                x[n] = val;
                n++;
            }
        }
        return new Series(Arrays.copyOf(t, n), Arrays.copyOf(x, n));
    }

    public int size() {
        return tS.length;
    }

    public boolean isEmpty() {
        return tS.length == 0;
    }

    public double t(int i) {
        return tS[i];
    }

    public double v(int i) {
        return v[i];
    }

    public double[] times() {
        return tS.clone();
    }

    public double[] values() {
        return v.clone();
    }

    public double firstT() {
        return tS[0];
    }

    public double lastT() {
        return tS[tS.length - 1];
    }

    /** Index of the first sample at or after {@code t} ({@link #size()} when none). */
    public int firstAtOrAfter(double t) {
        int i = Arrays.binarySearch(tS, t);
        if (i < 0) {
            return -i - 1;
        }
        while (i > 0 && tS[i - 1] == t) {
            i--;
        }
        return i;
    }

    /** Index of the sample nearest {@code t}; -1 when empty. */
    public int nearest(double t) {
        if (tS.length == 0) {
            return -1;
        }
        int hi = firstAtOrAfter(t);
        if (hi == 0) {
            return 0;
        }
        if (hi >= tS.length) {
            return tS.length - 1;
        }
        return t - tS[hi - 1] <= tS[hi] - t ? hi - 1 : hi;
    }

    /** Linear interpolation at {@code t}, clamped to the ends; NaN when empty. */
    public double at(double t) {
        int n = tS.length;
        if (n == 0) {
            return Double.NaN;
        }
        if (t <= tS[0]) {
            return v[0];
        }
        if (t >= tS[n - 1]) {
            return v[n - 1];
        }
        int hi = firstAtOrAfter(t);
        double t0 = tS[hi - 1];
        double t1 = tS[hi];
        return t1 == t0 ? v[hi] : v[hi - 1] + (v[hi] - v[hi - 1]) * (t - t0) / (t1 - t0);
    }

    /** The samples with {@code from <= t <= to}. */
    public Series between(double from, double to) {
        int a = firstAtOrAfter(from);
        int b = a;
        while (b < tS.length && tS[b] <= to) {
            b++;
        }
        return new Series(Arrays.copyOfRange(tS, a, b), Arrays.copyOfRange(v, a, b));
    }

    /** A copy with every value mapped through {@code f}. */
    public Series map(java.util.function.DoubleUnaryOperator f) {
        double[] x = new double[v.length];
        for (int i = 0; i < v.length; i++) {
            x[i] = f.applyAsDouble(v[i]);
        }
        return new Series(tS, x);
    }

    /**
     * Hampel filter over {@code halfWidthS} each side: a sample more than {@code 5} scaled MADs (and more than
     * {@code floor}) from the local median is replaced by that median. The floor keeps quantised, nearly constant
     * stretches (MAD zero) from flagging ordinary samples.
     */
    public Series despiked(double halfWidthS, double floor) {
        int n = v.length;
        double[] x = v.clone();
        double[] buf = new double[n];
        int a = 0;
        int b = 0;
        for (int i = 0; i < n; i++) {
            while (tS[a] < tS[i] - halfWidthS) {
                a++;
            }
            while (b < n && tS[b] <= tS[i] + halfWidthS) {
                b++;
            }
            int m = b - a;
            if (m < 5) {
                continue;
            }
            System.arraycopy(v, a, buf, 0, m);
            double med = median(buf, m);
            for (int k = 0; k < m; k++) {
                buf[k] = Math.abs(v[a + k] - med);
            }
            double mad = 1.4826 * median(buf, m);
            if (Math.abs(v[i] - med) > Math.max(5.0 * mad, floor)) {
                x[i] = med;
            }
        }
        return new Series(tS, x);
    }

    private static double median(double[] buf, int m) {
        Arrays.sort(buf, 0, m);
        return (m & 1) == 1 ? buf[m / 2] : 0.5 * (buf[m / 2 - 1] + buf[m / 2]);
    }

    /**
     * Local linear least-squares smoothing over {@code halfWidthS} each side (a straight line fitted around each
     * sample and read at the sample): removes noise without the lag of a causal filter and follows a ramp
     * exactly.
     */
    public Series smoothed(double halfWidthS) {
        int n = v.length;
        double[] x = new double[n];
        int a = 0;
        int b = 0;
        for (int i = 0; i < n; i++) {
            while (tS[a] < tS[i] - halfWidthS) {
                a++;
            }
            while (b < n && tS[b] <= tS[i] + halfWidthS) {
                b++;
            }
            LineFit f = LineFit.of(tS, v, a, b);
            x[i] = f.isValid() ? f.at(tS[i]) : v[i];
        }
        return new Series(tS, x);
    }

    /** Least-squares line over the samples with {@code from <= t <= to}. */
    public LineFit line(double from, double to) {
        int a = firstAtOrAfter(from);
        int b = a;
        while (b < tS.length && tS[b] <= to) {
            b++;
        }
        return LineFit.of(tS, v, a, b);
    }

    /** Index of the largest value over {@code from..to} (inclusive times); -1 when none. */
    public int argMax(double from, double to) {
        int best = -1;
        for (int i = firstAtOrAfter(from); i < tS.length && tS[i] <= to; i++) {
            if (best < 0 || v[i] > v[best]) {
                best = i;
            }
        }
        return best;
    }

    /** Index of the smallest value over {@code from..to}; -1 when none. */
    public int argMin(double from, double to) {
        int best = -1;
        for (int i = firstAtOrAfter(from); i < tS.length && tS[i] <= to; i++) {
            if (best < 0 || v[i] < v[best]) {
                best = i;
            }
        }
        return best;
    }

    /** Mean over {@code from..to}; NaN when no sample. */
    public double mean(double from, double to) {
        double s = 0;
        int n = 0;
        for (int i = firstAtOrAfter(from); i < tS.length && tS[i] <= to; i++) {
            s += v[i];
            n++;
        }
        return n == 0 ? Double.NaN : s / n;
    }

    /** Sample standard deviation over {@code from..to}; NaN with fewer than two samples. */
    public double std(double from, double to) {
        double m = mean(from, to);
        double s = 0;
        int n = 0;
        for (int i = firstAtOrAfter(from); i < tS.length && tS[i] <= to; i++) {
            s += (v[i] - m) * (v[i] - m);
            n++;
        }
        return n < 2 ? Double.NaN : Math.sqrt(s / (n - 1));
    }

    /** A copy resampled every {@code stepS} from {@code from} to {@code to} by linear interpolation. */
    public Series resampled(double from, double to, double stepS) {
        int n = (int) Math.floor((to - from) / stepS + 1e-9) + 1;
        if (n <= 0 || tS.length == 0) {
            return new Series(new double[0], new double[0]);
        }
        double[] t = new double[n];
        double[] x = new double[n];
        for (int k = 0; k < n; k++) {
            t[k] = from + k * stepS;
            x[k] = at(t[k]);
        }
        return new Series(t, x);
    }

    /** Angles unwrapped from the first sample (a heading across north stays continuous), radians. */
    public Series unwrapped() {
        double[] x = v.clone();
        for (int i = 1; i < x.length; i++) {
            x[i] = x[i - 1] + Math.IEEEremainder(v[i] - v[i - 1], 2 * Math.PI);
        }
        return new Series(tS, x);
    }

    /**
     * The parameter over the whole history, wild points removed (Hampel filter, 0.25 s each side), times from
     * {@code originNs}; angles that wrap (heading) should be read with {@link #angleOf} instead.
     */
    public static Series cleanOf(PointHistory h, String name, long originNs) {
        if (h.isEmpty()) {
            return new Series(new double[0], new double[0]);
        }
        return of(h, name, originNs, h.firstNs(), h.lastNs()).despiked(0.25, 0.0);
    }

    /** An angle that wraps (heading), unwrapped before wild points are removed. */
    public static Series angleOf(PointHistory h, String name, long originNs) {
        if (h.isEmpty()) {
            return new Series(new double[0], new double[0]);
        }
        return of(h, name, originNs, h.firstNs(), h.lastNs()).unwrapped().despiked(0.25, 0.0);
    }

    /** Local least-squares slope over {@code halfWidthS} each side, per second, at every sample. */
    public Series slopes(double halfWidthS) {
        int n = v.length;
        double[] x = new double[n];
        int a = 0;
        int b = 0;
        for (int i = 0; i < n; i++) {
            while (tS[a] < tS[i] - halfWidthS) {
                a++;
            }
            while (b < n && tS[b] <= tS[i] + halfWidthS) {
                b++;
            }
            x[i] = LineFit.of(tS, v, a, b).slope();
        }
        return new Series(tS, x);
    }
}
