package org.pointcall.models.detect;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.SplittableRandom;

import org.junit.jupiter.api.Test;

class SmootherTest {
    private static final long TICK = 50_000_000L;

    /** Seconds from the first tick of a step 0.05 -> 0.9 until the output first exceeds 0.6. */
    private static double measuredDelayS(Smoother s) {
        double[] in = new double[2];
        double[] out = new double[2];
        for (int i = 0; i < 200; i++) {
            in[0] = 0.05;
            in[1] = 0.95;
            s.smooth(i * TICK, in, out);
        }
        for (int i = 200; i < 400; i++) {
            in[0] = 0.9;
            in[1] = 0.1;
            s.smooth(i * TICK, in, out);
            if (out[0] > 0.6) {
                return (i - 200) * TICK / 1e9;
            }
        }
        return Double.POSITIVE_INFINITY;
    }

    @Test
    void exponentialStepDelayIsTheContinuousResponseWithinOneTick() {
        ExponentialSmoother s = new ExponentialSmoother(0.3, 2);
        double bound = s.stepDelayS(0.05, 0.9, 0.6);
        // first-order step response 0.9 - 0.85 exp(-t / 0.3) reaches 0.6 at 0.3 ln(0.85 / 0.3)
        assertEquals(0.3 * Math.log(0.85 / 0.3), bound, 1e-15);
        double measured = measuredDelayS(s);
        assertTrue(measured <= bound && measured > bound - 0.05 - 1e-12, measured + " vs " + bound);
    }

    @Test
    void exponentialIsExactForUnevenTicks() {
        // one 0.2 s step equals four 0.05 s steps for a first-order filter
        ExponentialSmoother a = new ExponentialSmoother(0.3, 1);
        ExponentialSmoother b = new ExponentialSmoother(0.3, 1);
        double[] out = new double[1];
        a.smooth(0, new double[] {0}, out);
        b.smooth(0, new double[] {0}, out);
        a.smooth(200_000_000L, new double[] {1}, out);
        double one = out[0];
        for (int i = 1; i <= 4; i++) {
            b.smooth(i * TICK, new double[] {1}, out);
        }
        assertEquals(one, out[0], 1e-15);
        assertEquals(1 - Math.exp(-0.2 / 0.3), one, 1e-15);
    }

    @Test
    void movingAverageStepDelayIsItsShareOfTheWindow() {
        MovingAverageSmoother s = new MovingAverageSmoother(0.6, 2);
        double bound = s.stepDelayS(0.05, 0.9, 0.6);
        assertEquals(0.6 * 0.55 / 0.85, bound, 1e-15);
        double measured = measuredDelayS(s);
        assertTrue(measured <= bound && measured > bound - 0.05 - 1e-12, measured + " vs " + bound);
    }

    @Test
    void movingAverageIsTheMeanOfTheTicksInsideTheWindowAndKeepsTheSumOne() {
        MovingAverageSmoother s = new MovingAverageSmoother(1.0, 3);
        SplittableRandom r = new SplittableRandom(3L);
        int n = 5000;
        double[][] in = new double[n][3];
        double[] out = new double[3];
        for (int i = 0; i < n; i++) {
            double a = r.nextDouble();
            double b = r.nextDouble() * (1 - a);
            in[i] = new double[] {a, b, 1 - a - b};
            s.smooth(i * TICK, in[i], out);
            // (t - 1 s, t]: this tick and the 19 before it
            double mean = 0;
            int from = Math.max(0, i - 19);
            for (int j = from; j <= i; j++) {
                mean += in[j][0];
            }
            mean /= (i - from + 1);
            assertEquals(mean, out[0], 1e-12);
            assertEquals(1.0, out[0] + out[1] + out[2], 1e-12);
        }
    }

    @Test
    void movingAverageGrowsWhenTicksComeFasterThanItsRing() {
        MovingAverageSmoother s = new MovingAverageSmoother(1.0, 1);
        double[] out = new double[1];
        for (int i = 0; i < 1000; i++) {
            s.smooth(i * 5_000_000L, new double[] {i % 2}, out);
        }
        assertTrue(s.growths() > 0);
        assertEquals(0.5, out[0], 1e-12, "200 ticks in the window, half of them 1");
    }

    @Test
    void passThroughHasNoDelay() {
        Smoother s = Smoothing.NONE.create(0, 2);
        assertEquals(0.0, s.stepDelayS(0.05, 0.9, 0.6));
        assertEquals(0.0, measuredDelayS(s));
        assertEquals(Double.POSITIVE_INFINITY, s.stepDelayS(0.05, 0.5, 0.6));
    }
}
