package org.pointcall.ingest.sim.pilot;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

class TrackingErrorTest {
    @Test
    void zeroScaleIsAPerfectPilot() {
        TrackingError e = new TrackingError(3L, 0.0);
        for (int i = 0; i < 1000; i++) {
            e.advance(0.01);
            assertEquals(0.0, e.nzG(), 0.0);
            assertEquals(0.0, e.altitudeM(), 0.0);
            assertEquals(0.0, e.bankRad(), 0.0);
        }
    }

    @Test
    void sameSeedSameErrors() {
        TrackingError a = new TrackingError(3L, 1.0);
        TrackingError b = new TrackingError(3L, 1.0);
        for (int i = 0; i < 1000; i++) {
            a.advance(0.01);
            b.advance(0.01);
            assertEquals(a.nzG(), b.nzG());
            assertEquals(a.speedMps(), b.speedMps());
        }
    }

    @Test
    void quickErrorHasItsStatedSpread() {
        // a first-order Gauss-Markov process stepped exactly keeps the stationary variance sigma^2 (textbook
        // property of the exact discretisation); 200,000 steps of 0.01 s hold some 1,250 correlation times of
        // 0.8 s, so the estimate of sigma is good to about 2 %, checked to 8 %
        TrackingError e = new TrackingError(7L, 1.0);
        double sum = 0.0;
        double sum2 = 0.0;
        int n = 200_000;
        for (int i = 0; i < n; i++) {
            e.advance(0.01);
            sum += e.nzG();
            sum2 += e.nzG() * e.nzG();
        }
        double mean = sum / n;
        double sd = Math.sqrt(sum2 / n - mean * mean);
        assertEquals(0.008, sd, 0.08 * 0.008);
        // looser tracking scales what is there, it does not draw anew
        double before = e.nzG();
        e.setLooseness(4.0);
        assertEquals(4.0 * before, e.nzG(), 1e-15);
    }
}
