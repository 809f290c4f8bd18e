package org.pointcall.replay.report;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;
import org.pointcall.ingest.frame.Frame;

class FrameTimelineTest {

    private static void feed(FrameTimeline t, long fromNs, long toNs, long stepNs) {
        Frame f = new Frame(1);
        for (long ns = fromNs; ns < toNs; ns += stepNs) {
            f.timeNs(ns);
            t.onFrame(f);
        }
    }

    @Test
    void aMissingStretchIsOneGapOfItsLengthLessOneStep() {
        FrameTimeline t = new FrameTimeline();
        long step = 10_000_000L; // 100 Hz
        feed(t, 0, 20_000_000_000L, step); // 20 s: past the learning steps
        feed(t, 21_500_000_000L, 30_000_000_000L, step); // 1.5 s after the last frame at 19.99 s
        t.finish();
        assertEquals(0.01, t.stepS(), 1e-12);
        assertEquals(1, t.gapCount());
        // the last frame before is at 19.99 s, the first after at 21.5 s: a 1.51 s step, one usual step of it is not
        // missing
        assertEquals(1.50, t.missingS(), 1e-9);
        assertEquals(1.51, t.longestGapS(), 1e-9);
        assertEquals(19_990_000_000L, t.gaps().get(0).fromNs());
        assertEquals(21_500_000_000L, t.gaps().get(0).toNs());
    }

    @Test
    void aGapInsideTheLearningStepsIsFoundOnceTheStepIsKnown() {
        FrameTimeline t = new FrameTimeline();
        long step = 15_625_000L; // 64 Hz
        feed(t, 0, 100 * step, step);
        feed(t, 103 * step, 200 * step, step); // frames 100 to 102 missing: one step of four
        t.finish();
        assertEquals(1, t.gapCount());
        assertEquals(3 * step * 1e-9, t.missingS(), 1e-12);
        assertEquals(197, t.frames());
    }

    @Test
    void jitterBelowTheGapFactorIsNoGap() {
        FrameTimeline t = new FrameTimeline();
        Frame f = new Frame(1);
        long ns = 0;
        for (int i = 0; i < 5000; i++) {
            ns += i % 2 == 0 ? 9_000_000L : 11_000_000L; // +/-10 % around 10 ms
            f.timeNs(ns);
            t.onFrame(f);
        }
        t.finish();
        assertEquals(0, t.gapCount());
    }
}
