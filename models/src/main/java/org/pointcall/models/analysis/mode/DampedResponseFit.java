package org.pointcall.models.analysis.mode;

/**
 * Least-squares fit of a free second-order response with an offset,
 * {@code y(t) = c + exp(-sigma t) (a cos(wd t) + b sin(wd t))}, to samples of a response after a release.
 *
 * <p>Method: variable projection (Golub and Pereyra, SIAM J. Numer. Anal. 10, 1973): for a given decay rate and
 * damped frequency the model is linear in {@code c, a, b}, which are solved exactly, so the nonlinear search is over
 * {@code (sigma, wd)} alone: a coarse grid over frequency and damping ratio for the start, then Levenberg-Marquardt
 * (Marquardt, J. SIAM 11, 1963) with a finite-difference Jacobian of the projected residual. Stateless.
 */
public final class DampedResponseFit {
    private static final int MAX_ITERATIONS = 200;

    /**
     * The fitted response.
     *
     * @param mode        the mode (natural frequency, damping ratio, damped frequency)
     * @param offset      c
     * @param cosine      a
     * @param sine        b
     * @param rms         root-mean-square residual
     * @param iterations  Levenberg-Marquardt iterations taken
     */
    public record Fit(DampedMode mode, double offset, double cosine, double sine, double rms, int iterations) {
        /** The fitted curve at {@code t} seconds after the first fitted sample (a and b refer to that origin). */
        public double at(double t) {
            double sigma = mode.dampingRatio() * mode.naturalFrequencyRadS();
            double wd = mode.dampedFrequencyRadS();
            double e = Math.exp(-sigma * t);
            return offset + e * (cosine * Math.cos(wd * t) + sine * Math.sin(wd * t));
        }

        public boolean isValid() {
            return mode.isValid();
        }
    }

    public static final Fit NONE = new Fit(DampedMode.NONE, Double.NaN, Double.NaN, Double.NaN, Double.NaN, 0);

    private DampedResponseFit() {
    }

    /**
     * Fits samples {@code (t, y)} (t in seconds from the release or any origin), searching damped frequencies
     * from {@code wdMinRadS} to {@code wdMaxRadS}; an invalid fit with fewer than 8 samples.
     */
    public static Fit fit(double[] t, double[] y, double wdMinRadS, double wdMaxRadS) {
        if (Math.min(t.length, y.length) < 8) {
            return NONE;
        }
        JointFit j = fitJoint(new double[][] {t}, new double[][] {y}, new double[] {1.0}, t[0], wdMinRadS, wdMaxRadS);
        return j.channels().isEmpty() ? NONE : j.channels().get(0);
    }

    /**
     * One mode fitted to several responses at once.
     *
     * @param mode     the shared mode
     * @param channels each response's own fit (offset, amplitudes, rms residual), all with the shared mode
     */
    public record JointFit(DampedMode mode, java.util.List<Fit> channels) {
        public JointFit {
            channels = java.util.List.copyOf(channels);
        }
    }

    /**
     * Fits one mode to several responses (for example pitch rate, angle of attack and load factor after a doublet,
     * which share the short period): each response has its own offset and amplitudes, the residuals are weighted
     * by {@code weights} (the inverse of each response's noise variance makes the fit maximum-likelihood under
     * independent Gaussian noise), and times are taken from {@code originS}.
     */
    public static JointFit fitJoint(double[][] t, double[][] y, double[] weights, double originS, double wdMinRadS,
                                    double wdMaxRadS) {
        int m = t.length;
        int total = 0;
        double[][] tt = new double[m][];
        for (int k = 0; k < m; k++) {
            int n = Math.min(t[k].length, y[k].length);
            tt[k] = new double[n];
            for (int i = 0; i < n; i++) {
                tt[k][i] = t[k][i] - originS;
            }
            total += n;
        }
        if (total < 8 || !(wdMaxRadS > wdMinRadS) || !(wdMinRadS > 0)) {
            return new JointFit(DampedMode.NONE, java.util.List.of());
        }
        Problem pb = new Problem(tt, y, weights, total);
        double bestCost = Double.POSITIVE_INFINITY;
        double sigma = Double.NaN;
        double wd = Double.NaN;
        int nw = 48;
        double[] zetas = {0.02, 0.05, 0.1, 0.15, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 0.95};
        for (int i = 0; i < nw; i++) {
            double w = wdMinRadS * Math.pow(wdMaxRadS / wdMinRadS, i / (nw - 1.0));
            for (double z : zetas) {
                double sg = z / Math.sqrt(1 - z * z) * w;
                double c = pb.residuals(sg, w, pb.work);
                if (c < bestCost) {
                    bestCost = c;
                    sigma = sg;
                    wd = w;
                }
            }
        }
        double lambda = 1e-3;
        double[] r0 = new double[total];
        double[] rs = new double[total];
        double[] rw = new double[total];
        int it = 0;
        for (; it < MAX_ITERATIONS; it++) {
            double cost = pb.residuals(sigma, wd, r0);
            double hs = 1e-6 * Math.max(1.0, Math.abs(sigma));
            double hw = 1e-6 * Math.max(1.0, Math.abs(wd));
            pb.residuals(sigma + hs, wd, rs);
            pb.residuals(sigma, wd + hw, rw);
            double jss = 0;
            double jsw = 0;
            double jww = 0;
            double gs = 0;
            double gw = 0;
            for (int i = 0; i < total; i++) {
                double js = (rs[i] - r0[i]) / hs;
                double jw = (rw[i] - r0[i]) / hw;
                jss += js * js;
                jsw += js * jw;
                jww += jw * jw;
                gs += js * r0[i];
                gw += jw * r0[i];
            }
            boolean improved = false;
            boolean done = false;
            for (int tries = 0; tries < 30; tries++) {
                double a11 = jss * (1 + lambda);
                double a22 = jww * (1 + lambda);
                double det = a11 * a22 - jsw * jsw;
                if (!(Math.abs(det) > 0)) {
                    lambda *= 10;
                    continue;
                }
                double ds = -(a22 * gs - jsw * gw) / det;
                double dw = -(a11 * gw - jsw * gs) / det;
                double ns = sigma + ds;
                double nwd = Math.max(1e-6, wd + dw);
                double c = pb.residuals(ns, nwd, pb.work);
                if (c < cost) {
                    done = cost - c <= 1e-14 * cost || (Math.abs(ds) < 1e-12 * Math.max(1, Math.abs(sigma))
                            && Math.abs(dw) < 1e-12 * Math.max(1, wd));
                    sigma = ns;
                    wd = nwd;
                    lambda = Math.max(lambda / 10, 1e-12);
                    improved = true;
                    break;
                }
                lambda *= 10;
            }
            if (!improved || done) {
                break;
            }
        }
        DampedMode mode = DampedMode.ofDecay(sigma, wd);
        java.util.List<Fit> fits = new java.util.ArrayList<>();
        for (int k = 0; k < m; k++) {
            double[] abc = linear(tt[k], y[k], tt[k].length, sigma, wd);
            if (abc == null) {
                return new JointFit(DampedMode.NONE, java.util.List.of());
            }
            double ss = 0;
            for (int i = 0; i < tt[k].length; i++) {
                double e = Math.exp(-sigma * tt[k][i]);
                double v = y[k][i] - abc[0] - e * (abc[1] * Math.cos(wd * tt[k][i]) + abc[2] * Math.sin(wd * tt[k][i]));
                ss += v * v;
            }
            fits.add(new Fit(mode, abc[0], abc[1], abc[2], Math.sqrt(ss / Math.max(1, tt[k].length)),
                    Math.min(it + 1, MAX_ITERATIONS)));
        }
        return new JointFit(mode, fits);
    }

    /** The projected problem: every channel's residuals, weighted, end to end. */
    private static final class Problem {
        final double[][] t;
        final double[][] y;
        final double[] sqrtW;
        final double[] work;

        Problem(double[][] t, double[][] y, double[] weights, int total) {
            this.t = t;
            this.y = y;
            this.sqrtW = new double[weights.length];
            for (int k = 0; k < weights.length; k++) {
                sqrtW[k] = Math.sqrt(weights[k]);
            }
            this.work = new double[total];
        }

        /** Weighted residuals into {@code r}; their sum of squares (infinite when a basis is degenerate). */
        double residuals(double sigma, double wd, double[] r) {
            int at = 0;
            double ss = 0;
            for (int k = 0; k < t.length; k++) {
                int n = t[k].length;
                double[] abc = linear(t[k], y[k], n, sigma, wd);
                if (abc == null) {
                    java.util.Arrays.fill(r, 1e150);
                    return Double.POSITIVE_INFINITY;
                }
                for (int i = 0; i < n; i++) {
                    double e = Math.exp(-sigma * t[k][i]);
                    double v = sqrtW[k] * (y[k][i] - abc[0] - e * (abc[1] * Math.cos(wd * t[k][i])
                            + abc[2] * Math.sin(wd * t[k][i])));
                    r[at++] = v;
                    ss += v * v;
                }
            }
            return ss;
        }
    }

    /** c, a, b by linear least squares for a given sigma and wd; null when the basis is degenerate. */
    private static double[] linear(double[] t, double[] y, int n, double sigma, double wd) {
        double[][] m = new double[3][3];
        double[] v = new double[3];
        double[] phi = new double[3];
        for (int i = 0; i < n; i++) {
            double e = Math.exp(-sigma * t[i]);
            if (!Double.isFinite(e)) {
                return null;
            }
            phi[0] = 1.0;
            phi[1] = e * Math.cos(wd * t[i]);
            phi[2] = e * Math.sin(wd * t[i]);
            for (int a = 0; a < 3; a++) {
                for (int b = 0; b < 3; b++) {
                    m[a][b] += phi[a] * phi[b];
                }
                v[a] += phi[a] * y[i];
            }
        }
        return solve3(m, v);
    }

    /** Gaussian elimination with partial pivoting; null when singular. */
    static double[] solve3(double[][] a, double[] b) {
        double[][] m = {a[0].clone(), a[1].clone(), a[2].clone()};
        double[] v = b.clone();
        double scale = 0;
        for (double[] row : m) {
            for (double x : row) {
                scale = Math.max(scale, Math.abs(x));
            }
        }
        for (int c = 0; c < 3; c++) {
            int p = c;
            for (int i = c + 1; i < 3; i++) {
                if (Math.abs(m[i][c]) > Math.abs(m[p][c])) {
                    p = i;
                }
            }
            if (!(Math.abs(m[p][c]) > 1e-13 * scale)) {
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
