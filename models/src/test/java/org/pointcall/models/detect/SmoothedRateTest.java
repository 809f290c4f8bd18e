package org.pointcall.models.detect;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/**
 * The first-order smoothing of the physics watches against the textbook response of a first-order lag
 * (time constant tau): to a ramp of slope k it settles to the ramp delayed by tau (a lag of k * tau) with rate k; to
 * a step it has covered 1 - 1/e of the step after tau (any control text's first-order system; the discrete update
 * with a = 1 - exp(-dt / tau) is exact for a held input).
 */
class SmoothedRateTest {
    private static final long MS = 1_000_000L;

    @Test
    void aRampIsFollowedOneTimeConstantLateAtItsOwnRate() {
        SmoothedRate x = new SmoothedRate(1.5);
        for (int i = 0; i <= 64 * 30; i++) {
            double t = i / 64.0;
            x.add(2.0 * t, Math.round(t * 1000) * MS);
        }
        assertEquals(2.0, x.rate(), 1e-3);
        // sampled at 64 Hz, the lag is k * tau to within one sample of the ramp (k * dt)
        assertEquals(2.0 * 30 - 2.0 * 1.5, x.value(), 2.0 / 64 + 1e-3);
    }

    @Test
    void aStepIsCoveredToOneMinusOneOverEAfterOneTimeConstant() {
        SmoothedRate x = new SmoothedRate(0.5);
        x.add(0.0, 0);
        for (int i = 1; i <= 32; i++) {
            x.add(1.0, i * 1000 * MS / 64);
        }
        assertEquals(1 - Math.exp(-1), x.value(), 1e-9);
        assertTrue(x.rate() > 0);
        // a sample not after the last is ignored; a cleared one starts again from its first sample
        x.add(5.0, 32 * 1000 * MS / 64);
        assertEquals(1 - Math.exp(-1), x.value(), 1e-9);
        x.clear();
        assertTrue(Double.isNaN(x.value()) && Double.isNaN(x.rate()));
        x.add(3.0, 0);
        assertEquals(3.0, x.value());
        assertTrue(Double.isNaN(x.rate()), "one sample has no rate");
        assertThrows(IllegalArgumentException.class, () -> new SmoothedRate(0));
    }
}
