package org.pointcall.models.analysis;

/**
 * Running sums for the ordinary least-squares slope of samples taken one at a time (no arrays): add each
 * {@code (t, v)}, then read {@link #slope()}. Reusable after {@link #reset()}; allocation-free. For the fitted line and
 * its residuals over arrays, see {@link LineFit}.
 */
public final class SlopeSums {
    private double st;
    private double sv;
    private double stt;
    private double stv;
    private int n;

    public SlopeSums reset() {
        st = 0;
        sv = 0;
        stt = 0;
        stv = 0;
        n = 0;
        return this;
    }

    /** One sample; {@code t} best measured from near the first sample (the sums are not centred). */
    public void add(double t, double v) {
        st += t;
        sv += v;
        stt += t * t;
        stv += t * v;
        n++;
    }

    /** dv/dt; NaN with fewer than 3 samples or no spread in t. */
    public double slope() {
        double den = n * stt - st * st;
        return n < 3 || !(den > 0) ? Double.NaN : (n * stv - st * sv) / den;
    }

    /** The fitted line's value at {@code t} (same origin as the samples'); NaN where {@link #slope()} is. */
    public double at(double t) {
        double b = slope();
        return Double.isNaN(b) ? Double.NaN : (sv - b * st) / n + b * t;
    }
}
