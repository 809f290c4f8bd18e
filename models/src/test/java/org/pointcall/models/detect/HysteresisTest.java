package org.pointcall.models.detect;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class HysteresisTest {
    private static final long TICK = 50_000_000L;

    /** Feeds {@code p} for {@code ticks} ticks from tick {@code from}; returns the next tick index. */
    private static int feed(Hysteresis h, int from, int ticks, double p) {
        for (int i = from; i < from + ticks; i++) {
            h.update(i * TICK, p);
        }
        return from + ticks;
    }

    @Test
    void switchesOnOnlyAfterTheHoldAndDatesTheEdgeToWhereTheStretchBegan() {
        Hysteresis h = new Hysteresis(0.6, 0.5, 0.35, 0.75);
        int k = feed(h, 0, 20, 0.1);
        // 10 ticks above cover 0.45 s of hold: not yet
        k = feed(h, k, 10, 0.7);
        assertFalse(h.isOn());
        assertEquals(20 * TICK, h.pendingNs());
        k = feed(h, k, 1, 0.7);
        assertTrue(h.isOn(), "the 11th tick is 0.5 s after the first");
        assertEquals(20 * TICK, h.edgeNs());
        assertEquals(20 * TICK, h.riseNs());
        assertEquals(PointEvent.UNKNOWN_NS, h.pendingNs());
    }

    @Test
    void betweenTheLevelsNothingChangesEitherWay() {
        Hysteresis h = new Hysteresis(0.6, 0.0, 0.35, 0.0);
        int k = feed(h, 0, 100, 0.5);
        assertFalse(h.isOn(), "0.5 does not switch on");
        k = feed(h, k, 1, 0.61);
        assertTrue(h.isOn());
        feed(h, k, 100, 0.36);
        assertTrue(h.isOn(), "0.36 does not switch off");
    }

    @Test
    void anInterruptedStretchStartsOver() {
        Hysteresis h = new Hysteresis(0.6, 0.5, 0.35, 0.75);
        int k = feed(h, 0, 8, 0.9);
        k = feed(h, k, 1, 0.5);
        k = feed(h, k, 8, 0.9);
        assertFalse(h.isOn(), "two 0.35 s stretches are not one 0.5 s hold");
        feed(h, k, 3, 0.9);
        assertTrue(h.isOn());
        assertEquals(9 * TICK, h.edgeNs());
    }

    @Test
    void switchesOffAfterItsOwnLongerHold() {
        Hysteresis h = new Hysteresis(0.6, 0.0, 0.35, 0.75);
        int k = feed(h, 0, 5, 0.9);
        k = feed(h, k, 15, 0.1);
        assertTrue(h.isOn(), "0.70 s below is short of 0.75 s");
        assertEquals(5 * TICK, h.fallNs());
        feed(h, k, 1, 0.1);
        assertFalse(h.isOn());
        assertEquals(5 * TICK, h.edgeNs());
        assertEquals(5 * TICK, h.fallNs());
    }

    @Test
    void equalLevelsMakeADebouncedThreshold() {
        Hysteresis h = new Hysteresis(0.25, 0.2, 0.25, 0.2);
        int k = feed(h, 0, 3, 0.9);
        k = feed(h, k, 2, 0.1);
        assertFalse(h.isOn(), "0.15 s above is bounce");
        k = feed(h, k, 5, 0.9);
        assertTrue(h.isOn());
        k = feed(h, k, 2, 0.1);
        k = feed(h, k, 3, 0.9);
        assertTrue(h.isOn(), "a 0.1 s dip is bounce");
        assertEquals(5 * TICK, h.riseNs());
    }

    @Test
    void rejectsAnOffLevelAboveTheOnLevel() {
        assertThrows(IllegalArgumentException.class, () -> new Hysteresis(0.3, 0.1, 0.4, 0.1));
        assertThrows(IllegalArgumentException.class, () -> new Hysteresis(0.6, -1, 0.4, 0.1));
    }
}
