package org.pointcall.ui.trace;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.ArrayList;
import java.util.List;

import org.junit.jupiter.api.Test;

/** The pipeline-to-screen ring: everything in order while the reader keeps up, the oldest counted lost when not. */
class SampleRingTest {
    @Test
    void aReaderThatKeepsUpGetsEverySampleInOrder() {
        SampleRing ring = new SampleRing(2, 8);
        List<Long> times = new ArrayList<>();
        double[] v = new double[2];
        for (int round = 0; round < 5; round++) {
            for (int i = 0; i < 6; i++) {
                long t = round * 6L + i;
                v[0] = t;
                v[1] = -t;
                ring.write(t, v, 0);
            }
            ring.drain((t, x) -> {
                assertEquals(t, x[0]);
                assertEquals(-t, x[1]);
                times.add(t);
            }, 100);
        }
        assertEquals(30, times.size());
        for (int i = 0; i < times.size(); i++) {
            assertEquals(i, times.get(i));
        }
        assertEquals(0, ring.lost());
    }

    @Test
    void aStalledReaderLosesTheOldestAndCountsThem() {
        SampleRing ring = new SampleRing(1, 8);
        double[] v = new double[1];
        for (long t = 0; t < 20; t++) {
            v[0] = t;
            ring.write(t, v, 0);
        }
        List<Long> got = new ArrayList<>();
        ring.drain((t, x) -> got.add(t), 100);
        // capacity 8: the writer keeps writing; the 7 newest complete slots are handed on, the rest counted
        assertEquals(19L, got.get(got.size() - 1));
        assertEquals(20, got.size() + ring.lost());
        for (int i = 1; i < got.size(); i++) {
            assertEquals(got.get(i - 1) + 1, got.get(i));
        }
    }

    @Test
    void framesFeedTheirChosenSlots() {
        SampleRing ring = new SampleRing(2, 4);
        double[] frame = {10, 11, 12, 13};
        ring.write(5, frame, new int[] {3, 1});
        ring.drain((t, x) -> {
            assertEquals(5, t);
            assertEquals(13, x[0]);
            assertEquals(11, x[1]);
        }, 10);
    }
}
