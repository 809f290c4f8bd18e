package org.pointcall.ingest.wire;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Random;
import java.util.SplittableRandom;

import org.junit.jupiter.api.Test;

class StreamTrackerTest {
    private static final int E = 0x1234;

    @Test
    void inOrderPacketsCountNoProblem() {
        StreamTracker t = new StreamTracker();
        assertEquals(SequenceVerdict.FIRST, t.observe(E, 100));
        for (int s = 101; s < 200; s++) {
            assertEquals(SequenceVerdict.IN_ORDER, t.observe(E, s));
        }
        assertEquals(100, t.received());
        assertEquals(0, t.gapEvents() + t.lost() + t.duplicates() + t.late() + t.stale());
    }

    @Test
    void gapsCountTheMissingPacketsExactly() {
        StreamTracker t = new StreamTracker();
        t.observe(E, 0);
        assertEquals(SequenceVerdict.AFTER_GAP, t.observe(E, 5)); // 1..4 missing
        t.observe(E, 6);
        assertEquals(SequenceVerdict.AFTER_GAP, t.observe(E, 8)); // 7 missing
        assertEquals(2, t.gapEvents());
        assertEquals(5, t.gapPackets());
        assertEquals(5, t.lost());
        assertEquals(4, t.received());
    }

    @Test
    void lateArrivalsFillTheirGapAndRepeatsAreDuplicates() {
        StreamTracker t = new StreamTracker();
        t.observe(E, 10);
        t.observe(E, 14); // 11, 12, 13 missing
        assertEquals(SequenceVerdict.LATE, t.observe(E, 12));
        assertEquals(SequenceVerdict.DUPLICATE, t.observe(E, 12));
        assertEquals(SequenceVerdict.DUPLICATE, t.observe(E, 14));
        assertEquals(SequenceVerdict.DUPLICATE, t.observe(E, 10));
        assertEquals(SequenceVerdict.LATE, t.observe(E, 11));
        assertEquals(3, t.gapPackets());
        assertEquals(1, t.lost()); // 13 still missing
        assertEquals(2, t.late());
        assertEquals(3, t.duplicates());
        assertEquals(4, t.received());
    }

    @Test
    void shuffledAndRepeatedPacketsWithinTheWindowAreAccountedExactly() {
        SplittableRandom r = new SplittableRandom(7);
        List<Integer> order = new ArrayList<>();
        for (int s = 0; s < 5000; s++) {
            if (r.nextInt(20) != 0) { // 1 in 20 lost
                order.add(s);
            }
        }
        int sentUnique = order.size();
        // local shuffles of up to 64 places, then 300 repeats of random earlier packets, each within the window
        for (int i = 0; i + 64 < order.size(); i += 64) {
            Collections.shuffle(order.subList(i + 1, i + 64), new Random(r.nextLong()));
        }
        for (int k = 0; k < 300; k++) {
            int at = 100 + r.nextInt(order.size() - 100);
            order.add(at, order.get(at - 1 - r.nextInt(50)));
        }
        order.add(0, -1); // the first packet tracked precedes all the others
        StreamTracker t = new StreamTracker();
        for (int s : order) {
            t.observe(E, s);
        }
        int last = Collections.max(order);
        assertEquals(sentUnique + 1, t.received());
        assertEquals(300, t.duplicates());
        assertEquals(0, t.stale());
        // lost is what never came, up to the newest seen
        assertEquals(last + 1 - sentUnique, t.lost());
    }

    @Test
    void sequenceWrapsAtUint32() {
        StreamTracker t = new StreamTracker();
        t.observe(E, 0xFFFFFFFE);
        assertEquals(SequenceVerdict.IN_ORDER, t.observe(E, 0xFFFFFFFF));
        assertEquals(SequenceVerdict.IN_ORDER, t.observe(E, 0));
        assertEquals(SequenceVerdict.AFTER_GAP, t.observe(E, 3)); // 1, 2 missing across the wrap
        assertEquals(SequenceVerdict.LATE, t.observe(E, 1));
        assertEquals(SequenceVerdict.DUPLICATE, t.observe(E, 0xFFFFFFFF));
        assertEquals(1, t.lost());
        assertEquals(3, t.highestSequence());
    }

    @Test
    void gapAcrossTheWrapIsCountedExactly() {
        StreamTracker t = new StreamTracker();
        t.observe(E, 0xFFFFFFF0);
        assertEquals(SequenceVerdict.AFTER_GAP, t.observe(E, 0x10)); // 0xFFFFFFF1..0xFFFFFFFF and 0..0xF
        assertEquals(15 + 16, t.lost());
    }

    @Test
    void aNewEpochRestartsTrackingAtOnceAndKeepsEarlierLoss() {
        StreamTracker t = new StreamTracker();
        t.observe(E, 500);
        t.observe(E, 503); // 2 lost before the restart
        assertEquals(SequenceVerdict.RESTART, t.observe(E + 1, 0));
        assertEquals(SequenceVerdict.IN_ORDER, t.observe(E + 1, 1));
        assertEquals(1, t.restarts());
        assertEquals(2, t.lost());
        assertEquals(4, t.received());
        // a straggler of the old session is a restart back to it: epochs identify sessions, they do not order them
        assertEquals(SequenceVerdict.RESTART, t.observe(E, 504));
    }

    @Test
    void farBehindPacketsAreStaleUntilEnoughInARowMeanARestartWithoutNewEpoch() {
        StreamTracker t = new StreamTracker(1024, 8);
        t.observe(E, 1_000_000);
        for (int s = 1_000_001; s < 1_000_100; s++) {
            t.observe(E, s);
        }
        // one stray from long ago is dropped, tracking undisturbed
        assertEquals(SequenceVerdict.STALE, t.observe(E, 5));
        assertEquals(SequenceVerdict.IN_ORDER, t.observe(E, 1_000_100));
        // a sender restarted at 0 with the same epoch: 7 stale, the 8th resyncs
        for (int s = 0; s < 7; s++) {
            assertEquals(SequenceVerdict.STALE, t.observe(E, s));
        }
        assertEquals(SequenceVerdict.RESYNC, t.observe(E, 7));
        assertEquals(SequenceVerdict.IN_ORDER, t.observe(E, 8));
        assertEquals(8, t.stale());
        assertEquals(1, t.resyncs());
        assertEquals(0, t.lost());
    }

    @Test
    void packetsOlderThanTheFirstTrackedAreStaleNotLate() {
        StreamTracker t = new StreamTracker();
        t.observe(E, 50);
        assertEquals(SequenceVerdict.STALE, t.observe(E, 49));
        assertEquals(0, t.late());
        assertEquals(0, t.lost());
    }

    @Test
    void aHugeForwardJumpIsAGapNotARestart() {
        StreamTracker t = new StreamTracker();
        t.observe(E, 0);
        // a network outage of about a minute at 20,000 packets/s
        assertEquals(SequenceVerdict.AFTER_GAP, t.observe(E, 1_200_001));
        assertEquals(1_200_000, t.lost());
        assertEquals(SequenceVerdict.IN_ORDER, t.observe(E, 1_200_002));
    }

    @Test
    void badWindowIsRefused() {
        assertThrows(IllegalArgumentException.class, () -> new StreamTracker(1000, 8));
        assertThrows(IllegalArgumentException.class, () -> new StreamTracker(1024, 0));
    }
}
