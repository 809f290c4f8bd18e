package org.pointcall.shared.table;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;

import org.apache.commons.math3.analysis.interpolation.LinearInterpolator;
import org.apache.commons.math3.analysis.polynomials.PolynomialSplineFunction;
import org.junit.jupiter.api.Test;

class LinearTableTest {
    @Test
    void agreesWithCommonsMathInsideAndHoldsOrExtendsOutside() {
        Random rnd = new Random(9);
        for (int trial = 0; trial < 200; trial++) {
            int n = 2 + rnd.nextInt(30);
            double[] x = new double[n];
            double[] y = new double[n];
            double t = -50 * rnd.nextDouble();
            for (int i = 0; i < n; i++) {
                t += 0.01 + 5 * rnd.nextDouble();
                x[i] = t;
                y[i] = 100 * rnd.nextGaussian();
            }
            // Reference: Apache Commons Math LinearInterpolator (a general-purpose library), inside the table.
            PolynomialSplineFunction ref = new LinearInterpolator().interpolate(x, y);
            for (int k = 0; k < 50; k++) {
                double v = x[0] + (x[n - 1] - x[0]) * rnd.nextDouble();
                double expected = ref.value(v);
                assertEquals(expected, LinearTable.at(x, y, v, LinearTable.Ends.FLAT), 1e-9 * (1 + Math.abs(expected)));
                assertEquals(expected, LinearTable.at(x, y, v, LinearTable.Ends.EXTEND), 1e-9 * (1 + Math.abs(expected)));
            }
            assertEquals(y[0], LinearTable.at(x, y, x[0] - 10, LinearTable.Ends.FLAT), 0.0);
            assertEquals(y[n - 1], LinearTable.at(x, y, x[n - 1] + 10, LinearTable.Ends.FLAT), 0.0);
            double slope = (y[n - 1] - y[n - 2]) / (x[n - 1] - x[n - 2]);
            assertEquals(y[n - 1] + 10 * slope, LinearTable.at(x, y, x[n - 1] + 10, LinearTable.Ends.EXTEND),
                    1e-9 * (1 + Math.abs(y[n - 1] + 10 * slope)));
        }
        assertTrue(Double.isNaN(LinearTable.at(new double[] {0, 1}, new double[] {0, 1}, Double.NaN, LinearTable.Ends.FLAT)));
    }
}
