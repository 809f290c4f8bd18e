package org.pointcall.ingest.sim.sortie;

/** Least-squares fits on trajectory samples: straight-line slopes and a damped second-order mode. */
final class Fits {
    private Fits() {
    }

    /** Least-squares slope of channel {@code y} against channel {@code x} over samples {@code i0..i1}; NaN if
     *  fewer than two samples or no spread in x. */
    static double slope(Trajectory tr, int x, int y, int i0, int i1) {
        int n = i1 - i0 + 1;
        if (n < 2) {
            return Double.NaN;
        }
        // centred sums: the time channel is large next to its spread
        double mx = 0.0;
        double my = 0.0;
        for (int i = i0; i <= i1; i++) {
            mx += tr.get(x, i);
            my += tr.get(y, i);
        }
        mx /= n;
        my /= n;
        double sxx = 0.0;
        double sxy = 0.0;
        for (int i = i0; i <= i1; i++) {
            double dx = tr.get(x, i) - mx;
            sxx += dx * dx;
            sxy += dx * (tr.get(y, i) - my);
        }
        return sxx > 0.0 ? sxy / sxx : Double.NaN;
    }

    /** Slope of a channel against time, per second. */
    static double rate(Trajectory tr, int y, int i0, int i1) {
        return slope(tr, Trajectory.TIME, y, i0, i1);
    }

    /**
     * The dominant damped mode of a free response: the channel sampled every {@code stepS} seconds from
     * {@code t0} to {@code t1} is fitted by least squares with {@code y[k] = a1 y[k-1] + a2 y[k-2] + c} (an
     * autoregression that a sampled second-order free response plus a constant obeys exactly), and the roots of
     * {@code z^2 - a1 z - a2} mapped to {@code s = ln(z) / step}.
     *
     * @return {undamped natural frequency rad/s, damping ratio, damped frequency rad/s}; NaN when the fit fails
     */
    static double[] mode(Trajectory tr, int channel, double t0, double t1, double stepS) {
        int n = (int) Math.floor((t1 - t0) / stepS) + 1;
        double[] nan = {Double.NaN, Double.NaN, Double.NaN};
        if (n < 6) {
            return nan;
        }
        double[] y = new double[n];
        for (int k = 0; k < n; k++) {
            y[k] = tr.get(channel, tr.indexAt(t0 + k * stepS));
        }
        // normal equations for (a1, a2, c), centred on the mean for conditioning
        double mean = 0.0;
        for (double v : y) {
            mean += v;
        }
        mean /= n;
        double[][] m = new double[3][3];
        double[] r = new double[3];
        for (int k = 2; k < n; k++) {
            double[] row = {y[k - 1] - mean, y[k - 2] - mean, 1.0};
            double t = y[k] - mean;
            for (int i = 0; i < 3; i++) {
                for (int j = 0; j < 3; j++) {
                    m[i][j] += row[i] * row[j];
                }
                r[i] += row[i] * t;
            }
        }
        double[] a = solve3(m, r);
        if (a == null) {
            return nan;
        }
        double a1 = a[0];
        double a2 = a[1];
        double disc = a1 * a1 + 4.0 * a2;
        if (disc < 0.0) {
            double mod = Math.sqrt(-a2);
            double arg = Math.atan2(Math.sqrt(-disc) / 2.0, a1 / 2.0);
            double sigma = Math.log(mod) / stepS;
            double wd = arg / stepS;
            double wn = Math.hypot(sigma, wd);
            return new double[] {wn, -sigma / wn, wd};
        }
        double z1 = (a1 + Math.sqrt(disc)) / 2.0;
        double z2 = (a1 - Math.sqrt(disc)) / 2.0;
        if (!(z1 > 0.0 && z2 > 0.0)) {
            return nan;
        }
        double s1 = Math.log(z1) / stepS;
        double s2 = Math.log(z2) / stepS;
        double wn = Math.sqrt(s1 * s2);
        return s1 * s2 > 0.0 ? new double[] {wn, -(s1 + s2) / (2.0 * wn), 0.0} : nan;
    }

    /** Gaussian elimination with partial pivoting on a 3 x 3 system; null when singular. */
    static double[] solve3(double[][] a, double[] b) {
        double[][] m = {a[0].clone(), a[1].clone(), a[2].clone()};
        double[] v = b.clone();
        for (int c = 0; c < 3; c++) {
            int p = c;
            for (int i = c + 1; i < 3; i++) {
                if (Math.abs(m[i][c]) > Math.abs(m[p][c])) {
                    p = i;
                }
            }
            if (Math.abs(m[p][c]) < 1e-300) {
                return null;
            }
            double[] tmp = m[c];
            m[c] = m[p];
            m[p] = tmp;
            double tv = v[c];
            v[c] = v[p];
            v[p] = tv;
            for (int i = c + 1; i < 3; i++) {
                double f = m[i][c] / m[c][c];
                for (int j = c; j < 3; j++) {
                    m[i][j] -= f * m[c][j];
                }
                v[i] -= f * v[c];
            }
        }
        double[] x = new double[3];
        for (int i = 2; i >= 0; i--) {
            double s = v[i];
            for (int j = i + 1; j < 3; j++) {
                s -= m[i][j] * x[j];
            }
            x[i] = s / m[i][i];
        }
        return x;
    }
}
