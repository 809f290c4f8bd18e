package org.pointcall.models.analysis.steady;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;

import org.junit.jupiter.api.Test;

class VarianceRatioTestTest {
    /**
     * Cao and Rhinehart (J. Process Control 5(6), 1995): for independent noise about a constant the ratio tends to
     * 1, and a ramp makes it grow well past the critical value. A synthetic signal: 300 steady samples of unit
     * Gaussian noise, then 300 on a ramp of 0.5 noise standard deviations per sample, then 300 steady again.
     */
    @Test
    void steadyNoiseReadsSteadyAndARampDoesNot() {
        Random rnd = new Random(11);
        double[] x = new double[900];
        for (int i = 0; i < x.length; i++) {
            double level = i < 300 ? 0 : i < 600 ? 0.5 * (i - 300) : 150;
            x[i] = level + rnd.nextGaussian();
        }
        VarianceRatioTest test = VarianceRatioTest.RECOMMENDED;
        boolean[] steady = test.steady(x);
        int steadyFirst = count(steady, test.warmUp(), 300);
        int steadyRamp = count(steady, 330, 600);
        int steadyLast = count(steady, 660, 900);
        // the statistic is noisy itself: most of a steady stretch reads steady (a type-I error of a few percent
        // at the recommended critical value [memory]), and almost none of the ramp does
        assertTrue(steadyFirst > 0.85 * (300 - test.warmUp()), "steady stretch: " + steadyFirst);
        assertTrue(steadyLast > 0.85 * 240, "second steady stretch: " + steadyLast);
        assertTrue(steadyRamp < 0.05 * 270, "ramp: " + steadyRamp);
    }

    private static int count(boolean[] s, int from, int to) {
        int n = 0;
        for (int i = from; i < to; i++) {
            n += s[i] ? 1 : 0;
        }
        return n;
    }
}
