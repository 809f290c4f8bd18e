package org.pointcall.models.analysis.accel;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;
import org.pointcall.models.analysis.Series;

class ExcessPowerTest {
    /**
     * Ps = dh/dt + (V/g) dV/dt (USNTPS FTM-108 ch. 5; check-values.md worked value, computed): dh/dt 10 m/s,
     * dV/dt 1 m/s^2 at 200 m/s gives 30.39 m/s, printed to 4 digits.
     */
    @Test
    void specificExcessPowerAtTheWorkedValue() {
        assertEquals(30.39, ExcessPower.ps(10.0, 200.0, 1.0), 0.005);
    }

    /** A level run accelerating 2 m/s^2 from 100 m/s: Ps = (V/g) 2 in every Mach bin, and no climb term. */
    @Test
    void levelAccelerationCurveIsVOverGTimesTheAcceleration() {
        int n = 64 * 60;
        double[] t = new double[n];
        double[] v = new double[n];
        double[] h = new double[n];
        double[] m = new double[n];
        for (int i = 0; i < n; i++) {
            t[i] = i / 64.0;
            v[i] = 100 + 2 * t[i];
            h[i] = 4572.0;
            m[i] = v[i] / 322.2;
        }
        ExcessPower ps = ExcessPower.of(Series.of(t, h), Series.of(t, v), Series.of(t, m), 2, 58);
        double[] mach = ps.mach();
        double[] p = ps.psMps();
        for (int i = 0; i < ps.size(); i++) {
            // the bin averages V over its samples: compare with V at the bin's own mean Mach, to 0.5 %
            double vBin = mach[i] * 322.2;
            assertEquals(vBin / 9.80665 * 2, p[i], 0.005 * p[i] + 0.2);
        }
    }
}
