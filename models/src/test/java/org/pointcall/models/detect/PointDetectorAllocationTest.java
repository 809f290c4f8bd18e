package org.pointcall.models.detect;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.lang.management.ManagementFactory;

import org.junit.jupiter.api.Test;
import org.pointcall.models.detect.SyntheticSortie.Bump;
import org.pointcall.models.detect.SyntheticSortie.Probabilities;
import org.pointcall.shared.kind.ManoeuvreKind;

/**
 * Ticks and frames allocate nothing in steady state, idle and inside an open point with its rules running. Measured
 * with the JVM's per-thread allocation counter (com.sun.management.ThreadMXBean); a behavioural check, no timing.
 */
class PointDetectorAllocationTest {

    @Test
    void ticksAndFramesAfterWarmUpAllocateNothing() {
        assumeTrue(ManagementFactory.getThreadMXBean() instanceof com.sun.management.ThreadMXBean,
                "needs the HotSpot thread allocation counter");
        com.sun.management.ThreadMXBean mx = (com.sun.management.ThreadMXBean) ManagementFactory.getThreadMXBean();
        assumeTrue(mx.isThreadAllocatedMemorySupported() && mx.isThreadAllocatedMemoryEnabled());

        for (Smoothing smoothing : Smoothing.values()) {
            DetectorSettings st = DetectorSettings.defaults().withSmoothing(smoothing, 0.5);
            SyntheticSortie s = new SyntheticSortie(st);
            double[] p = new double[SyntheticSortie.CLASSES.size()];
            // warm-up with a complete point (its events may allocate), then one left open for the measurement
            Probabilities probs = new Probabilities(17L, 0.05, 0.01, new Bump(ManoeuvreKind.LOOP, 10, 25, 0.9),
                    new Bump(ManoeuvreKind.AILERON_ROLL, 40, 1e9, 0.9));
            s.run(60, probs, SyntheticSortie::level);
            int events = s.events.size();
            assertTrue(s.detector.pointOpen());
            // pre-draw the probabilities, so the measured loop runs only the detector and the frame filling
            double[][] ticks = new double[20 * 200][];
            for (int i = 0; i < ticks.length; i++) {
                probs.fill(60 + (i + 1) * 0.05, p);
                ticks[i] = p.clone();
            }
            org.pointcall.ingest.frame.Frame f = org.pointcall.ingest.frame.Frame.forDictionary(s.dictionary);
            PointDetector d = s.detector;

            long before = mx.getCurrentThreadAllocatedBytes();
            for (int i = 0; i < ticks.length; i++) {
                long tickNs = 60_000_000_000L + (i + 1) * SyntheticSortie.TICK_NS;
                for (int j = 4; j >= 0; j--) {
                    long t = tickNs - j * SyntheticSortie.FRAME_NS;
                    f.timeNs(t);
                    SyntheticSortie.level(t / 1e9, f, s.slots);
                    // bank rocking +-30 deg: the roll rule integrates every sample but never confirms
                    f.value(s.dictionary.indexOf("Roll"), Math.abs((i * 5 + 5 - j) % 120 - 60) - 30.0);
                    d.onFrame(f);
                }
                d.onTick(tickNs, ticks[i]);
            }
            long allocated = mx.getCurrentThreadAllocatedBytes() - before;

            assertEquals(events, s.events.size(), "no event in the measured stretch");
            assertTrue(d.pointOpen());
            assertEquals(0, d.ticksRejected() + d.framesRejected());
            // < 1 KB leaves room for the counter's own bookkeeping; one object per tick would be > 60 KB
            assertTrue(allocated < 1024, smoothing + ": allocated " + allocated + " bytes over 4,000 ticks and "
                    + "20,000 frames");
        }
    }
}
