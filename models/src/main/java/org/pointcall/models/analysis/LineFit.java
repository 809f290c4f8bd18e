package org.pointcall.models.analysis;

/**
 * Ordinary least-squares straight line {@code y = intercept + slope x}, with sums centred on the means (time
 * stamps are large next to their spread).
 *
 * @param slope     dy/dx
 * @param intercept value at x = 0
 * @param meanX     mean of x over the fitted samples
 * @param count     samples fitted
 * @param residualStd standard deviation of the residuals (n - 2 degrees of freedom), NaN with fewer than 3
 */
public record LineFit(double slope, double intercept, double meanX, int count, double residualStd) {
    private static final LineFit NONE = new LineFit(Double.NaN, Double.NaN, Double.NaN, 0, Double.NaN);

    /** Fit over {@code x[a..b)} and {@code y[a..b)}; an invalid fit (NaN slope) with fewer than 2 samples or no spread. */
    public static LineFit of(double[] x, double[] y, int a, int b) {
        int n = b - a;
        if (n < 2) {
            return NONE;
        }
        double mx = 0;
        double my = 0;
        for (int i = a; i < b; i++) {
            mx += x[i];
            my += y[i];
        }
        mx /= n;
        my /= n;
        double sxx = 0;
        double sxy = 0;
        for (int i = a; i < b; i++) {
            double dx = x[i] - mx;
            sxx += dx * dx;
            sxy += dx * (y[i] - my);
        }
        if (!(sxx > 0)) {
            return NONE;
        }
        double slope = sxy / sxx;
        double c = my - slope * mx;
        double ss = 0;
        for (int i = a; i < b; i++) {
            double r = y[i] - c - slope * x[i];
            ss += r * r;
        }
        return new LineFit(slope, c, mx, n, n > 2 ? Math.sqrt(ss / (n - 2)) : Double.NaN);
    }

    /** Fit over all of {@code x} and {@code y}. */
    public static LineFit of(double[] x, double[] y) {
        return of(x, y, 0, Math.min(x.length, y.length));
    }

    public boolean isValid() {
        return Double.isFinite(slope);
    }

    public double at(double x) {
        return intercept + slope * x;
    }
}
