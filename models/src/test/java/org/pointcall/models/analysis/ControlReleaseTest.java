package org.pointcall.models.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class ControlReleaseTest {
    /** Elevator trace of a phugoid: a 2 s pull at the start, held still, then the pilot's recovery input at the end. */
    private static Series phugoidElevator() {
        int n = 1201;
        double[] t = new double[n];
        double[] v = new double[n];
        for (int i = 0; i < n; i++) {
            t[i] = i * 0.1;
            double e = -0.02;
            if (t[i] >= 3.0 && t[i] < 5.0) {
                e = -0.10;
            }
            if (t[i] >= 115.0) {
                e = -0.06;
            }
            v[i] = e;
        }
        return Series.of(t, v);
    }

    @Test
    void firstSettleFindsTheReleaseOfTheStartInputNotTheRecoveryAtTheEnd() {
        Series s = phugoidElevator();
        double first = ControlRelease.firstSettle(s, 0.0, 120.0, 30.0, 0.002);
        assertEquals(5.0, first, 1e-9);
        // the last-move rule, made for short inputs, takes the recovery for the release
        double last = ControlRelease.lastMove(s, 0.0, 120.0, 10.0, 0.002);
        assertTrue(last > 100.0 || Double.isNaN(last), "lastMove gave " + last);
    }

    @Test
    void aHeldControlHasNoRelease() {
        double[] t = {0, 1, 2, 3, 4, 5};
        double[] v = {0.01, 0.0101, 0.0099, 0.01, 0.01, 0.0100};
        assertTrue(Double.isNaN(ControlRelease.firstSettle(Series.of(t, v), 0, 5, 5, 0.002)));
    }
}
