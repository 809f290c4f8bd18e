package org.pointcall.models.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.SplittableRandom;

import org.apache.commons.math3.stat.regression.SimpleRegression;
import org.junit.jupiter.api.Test;

/** The running least-squares slope against Apache Commons Math's SimpleRegression on the same samples. */
class SlopeSumsTest {
    @Test
    void theSlopeIsCommonsMathsRegressionSlope() {
        SplittableRandom r = new SplittableRandom(4L);
        SlopeSums fit = new SlopeSums();
        SimpleRegression reference = new SimpleRegression();
        for (int i = 0; i < 1200; i++) {
            double t = i * 0.05 + 0.01 * r.nextDouble();
            // an altitude climbing at 1.5 m/s with 3 m of noise
            double v = 3000 + 1.5 * t + 3 * (2 * r.nextDouble() - 1);
            fit.add(t, v);
            reference.addData(t, v);
        }
        assertEquals(reference.getSlope(), fit.slope(), 1e-9 * Math.abs(reference.getSlope()));
        assertEquals(1.5, fit.slope(), 0.05);
    }

    @Test
    void fewerThanThreeSamplesOrNoSpreadGiveNoSlope() {
        SlopeSums fit = new SlopeSums();
        fit.add(0, 1);
        fit.add(1, 2);
        assertTrue(Double.isNaN(fit.slope()));
        fit.reset();
        for (int i = 0; i < 5; i++) {
            fit.add(2.0, i);
        }
        assertTrue(Double.isNaN(fit.slope()));
        fit.add(3.0, 10);
        assertTrue(Double.isFinite(fit.slope()));
    }
}
