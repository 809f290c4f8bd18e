package org.pointcall.ingest.sim.sortie;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

class FitsTest {
    private static Trajectory signal(double omegaN, double zeta, double offset) {
        Trajectory tr = new Trajectory();
        double wd = omegaN * Math.sqrt(1.0 - zeta * zeta);
        for (int k = 0; k <= 1000; k++) {
            double t = k * 0.01;
            double[] row = new double[Trajectory.CHANNELS];
            row[Trajectory.TIME] = t;
            row[Trajectory.Q] = offset + 2.0 * Math.exp(-zeta * omegaN * t) * Math.cos(wd * t + 0.3);
            row[Trajectory.HP] = 100.0 + 3.0 * t;
            tr.add(row);
        }
        return tr;
    }

    @Test
    void modeOfASampledDampedOscillationIsExact() {
        // a sampled second-order free response obeys the two-term recursion exactly: only rounding is left
        double[] m = Fits.mode(signal(3.0, 0.4, 0.7), Trajectory.Q, 0.5, 6.0, 0.05);
        assertEquals(3.0, m[0], 1e-7);
        assertEquals(0.4, m[1], 1e-7);
        assertEquals(3.0 * Math.sqrt(1.0 - 0.16), m[2], 1e-7);
    }

    @Test
    void lightlyDampedModeIsExactToo() {
        double[] m = Fits.mode(signal(0.09, 0.05, 150.0), Trajectory.Q, 0.0, 10.0, 0.5);
        assertEquals(0.09, m[0], 1e-7);
        assertEquals(0.05, m[1], 1e-6);
    }

    @Test
    void slopeOfALineIsItsSlope() {
        Trajectory tr = signal(3.0, 0.4, 0.0);
        assertEquals(3.0, Fits.rate(tr, Trajectory.HP, 100, 900), 1e-9);
    }
}
