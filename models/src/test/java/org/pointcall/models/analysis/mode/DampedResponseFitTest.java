package org.pointcall.models.analysis.mode;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Random;

import org.apache.commons.math3.fitting.leastsquares.LeastSquaresBuilder;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresOptimizer;
import org.apache.commons.math3.fitting.leastsquares.LevenbergMarquardtOptimizer;
import org.apache.commons.math3.fitting.leastsquares.MultivariateJacobianFunction;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.RealVector;
import org.apache.commons.math3.util.Pair;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class DampedResponseFitTest {
    private static double[] times(int n, double stepS) {
        double[] t = new double[n];
        for (int i = 0; i < n; i++) {
            t[i] = i * stepS;
        }
        return t;
    }

    private static double[] response(double[] t, double c, double a, double b, double zeta, double wn, double noise,
                                     long seed) {
        Random rnd = new Random(seed);
        double sigma = zeta * wn;
        double wd = wn * Math.sqrt(1 - zeta * zeta);
        double[] y = new double[t.length];
        for (int i = 0; i < t.length; i++) {
            y[i] = c + Math.exp(-sigma * t[i]) * (a * Math.cos(wd * t[i]) + b * Math.sin(wd * t[i]))
                    + noise * rnd.nextGaussian();
        }
        return y;
    }

    /** On an exact response the fit gives the mode back to the limit of its convergence test. */
    @ParameterizedTest
    @CsvSource({"0.04, 3.0", "0.20, 4.8", "0.35, 2.0", "0.74, 4.8", "0.90, 6.0"})
    void recoversTheModeOfAnExactResponse(double zeta, double wn) {
        double[] t = times(257, 1.0 / 64);
        DampedResponseFit.Fit f = DampedResponseFit.fit(t, response(t, 0.01, 0.05, -0.03, zeta, wn, 0, 1), 0.5, 20);
        assertEquals(wn, f.mode().naturalFrequencyRadS(), 1e-6 * wn);
        assertEquals(zeta, f.mode().dampingRatio(), 1e-6);
        assertEquals(0.01, f.offset(), 1e-7);
    }

    /**
     * Reference: Apache Commons Math 3 LevenbergMarquardtOptimizer minimising the same sum of squares over all five
     * parameters (c, a, b, sigma, wd) with an analytic Jacobian, started 10 % off our answer. Both are least-squares
     * minima of one smooth problem, so they must agree to the optimisers' convergence (1e-6 relative here).
     */
    @Test
    void agreesWithCommonsMathLevenbergMarquardtOnANoisyResponse() {
        double[] t = times(257, 1.0 / 64);
        double[] y = response(t, 0.002, 0.04, 0.02, 0.7, 4.8, 0.0017, 42);
        DampedResponseFit.Fit ours = DampedResponseFit.fit(t, y, 0.5, 20);
        double sigma = ours.mode().dampingRatio() * ours.mode().naturalFrequencyRadS();
        double wd = ours.mode().dampedFrequencyRadS();

        MultivariateJacobianFunction model = p -> {
            double c = p.getEntry(0);
            double a = p.getEntry(1);
            double b = p.getEntry(2);
            double s = p.getEntry(3);
            double w = p.getEntry(4);
            RealVector v = new ArrayRealVector(t.length);
            double[][] j = new double[t.length][5];
            for (int i = 0; i < t.length; i++) {
                double e = Math.exp(-s * t[i]);
                double cs = Math.cos(w * t[i]);
                double sn = Math.sin(w * t[i]);
                double osc = a * cs + b * sn;
                v.setEntry(i, c + e * osc);
                j[i][0] = 1;
                j[i][1] = e * cs;
                j[i][2] = e * sn;
                j[i][3] = -t[i] * e * osc;
                j[i][4] = e * t[i] * (-a * sn + b * cs);
            }
            return new Pair<>(v, new Array2DRowRealMatrix(j, false));
        };
        LeastSquaresOptimizer.Optimum ref = new LevenbergMarquardtOptimizer()
                .withCostRelativeTolerance(1e-15).withParameterRelativeTolerance(1e-15)
                .optimize(new LeastSquaresBuilder()
                        .model(model)
                        .target(y)
                        .start(new double[] {ours.offset() * 1.1, ours.cosine() * 0.9, ours.sine() * 1.1,
                                sigma * 0.9, wd * 1.1})
                        .maxEvaluations(10_000).maxIterations(10_000)
                        .build());
        RealVector p = ref.getPoint();
        assertEquals(p.getEntry(3), sigma, 1e-6 * sigma);
        assertEquals(p.getEntry(4), wd, 1e-6 * wd);
        assertEquals(p.getEntry(1), ours.cosine(), 1e-6 * Math.abs(ours.cosine()));
        assertEquals(p.getEntry(2), ours.sine(), 1e-6 * Math.abs(ours.sine()));
        assertEquals(ref.getRMS(), ours.rms(), 1e-9);
    }

    /** Channels sharing one mode: the joint fit's mode is the one they share, whatever their amplitudes. */
    @Test
    void jointFitRecoversTheSharedMode() {
        double[] t = times(257, 1.0 / 64);
        double[] q = response(t, 0.0, 0.05, 0.01, 0.6, 4.0, 0.0002, 3);
        double[] aoa = response(t, 0.06, -0.01, 0.02, 0.6, 4.0, 0.0002, 4);
        DampedResponseFit.JointFit j = DampedResponseFit.fitJoint(new double[][] {t, t}, new double[][] {q, aoa},
                new double[] {1, 1}, 0.0, 0.5, 20);
        // signal-to-noise ratio 100 to 250 on a response that dies within a second: about 1 % (seeded)
        assertEquals(4.0, j.mode().naturalFrequencyRadS(), 0.04);
        assertEquals(0.6, j.mode().dampingRatio(), 0.01);
        assertEquals(0.06, j.channels().get(1).offset(), 0.001);
    }
}
