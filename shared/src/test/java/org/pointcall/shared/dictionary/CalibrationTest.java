package org.pointcall.shared.dictionary;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;

import org.junit.jupiter.api.Test;

class CalibrationTest {

    @Test
    void polynomialsInvertOverTheirMonotonicRange() {
        Random rnd = new Random(3);
        Calibration lin = new Calibration.Polynomial(new double[] {-30, 0.01221});
        Calibration cubic = new Calibration.Polynomial(new double[] {1, 2, 0.1, 0.01}); // derivative > 0 everywhere
        for (int i = 0; i < 20_000; i++) {
            double raw = -100 + 200 * rnd.nextDouble();
            assertEquals(raw, lin.toRaw(lin.toEngineering(raw)), 1e-12 * Math.max(1, Math.abs(raw)));
            assertEquals(raw, cubic.toRaw(cubic.toEngineering(raw)), 1e-10 * Math.max(1, Math.abs(raw)));
        }
        // TMATS worked example (RCC 106 Chapter 9): CO:0, CO-1:.03125 maps raw 32 to 1.0 EU.
        Calibration tmats = new Calibration.Polynomial(new double[] {0, 0.03125});
        assertEquals(1.0, tmats.toEngineering(32), 0.0);
        assertEquals(32.0, tmats.toRaw(1.0), 0.0);
    }

    @Test
    void tablesInvertInsideAndOnTheExtendedEnds() {
        Calibration t = new Calibration.Breakpoints(new double[] {0, 10, 20}, new double[] {5, 7, 13});
        Random rnd = new Random(4);
        for (int i = 0; i < 20_000; i++) {
            double raw = -10 + 40 * rnd.nextDouble();
            assertEquals(raw, t.toRaw(t.toEngineering(raw)), 1e-12 * Math.max(1, Math.abs(raw)));
        }
        Calibration falling = new Calibration.Breakpoints(new double[] {0, 1, 2}, new double[] {10, 4, 1});
        assertEquals(1.5, falling.toRaw(falling.toEngineering(1.5)), 1e-12);
        Calibration notMonotonic = new Calibration.Breakpoints(new double[] {0, 1, 2}, new double[] {0, 1, 0});
        assertTrue(Double.isNaN(notMonotonic.toRaw(0.5)), "two raw values give 0.5: no inverse");
    }
}
