package org.pointcall.ingest.window;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;
import static org.pointcall.ingest.window.ScenarioRun.dictionary;
import static org.pointcall.ingest.window.ScenarioRun.parameter;

import java.lang.management.ManagementFactory;
import java.util.List;
import java.util.SplittableRandom;

import org.junit.jupiter.api.Test;
import org.pointcall.ingest.frame.Frame;
import org.pointcall.shared.dictionary.ParameterDictionary;

/**
 * The per-sample path and the decision ticks allocate nothing once the buffers have their working size. Measured
 * with the JVM's per-thread allocation counter (com.sun.management.ThreadMXBean); a behavioural check, no timing.
 */
class FeatureExtractorAllocationTest {
    private static final long MS = 1_000_000L;

    private double sink;

    @Test
    void aMillionFramesAfterWarmUpAllocateNothing() {
        assumeTrue(ManagementFactory.getThreadMXBean() instanceof com.sun.management.ThreadMXBean,
                "needs the HotSpot thread allocation counter");
        com.sun.management.ThreadMXBean mx = (com.sun.management.ThreadMXBean) ManagementFactory.getThreadMXBean();
        assumeTrue(mx.isThreadAllocatedMemorySupported() && mx.isThreadAllocatedMemoryEnabled());

        ParameterDictionary d = dictionary(parameter("Alt", 1000), parameter("KCAS", 10), parameter("AoA", 200),
                parameter("Unused", 1000));
        List<WindowSpec> specs = List.of(WindowSpec.of("Alt", 0.5, 2.0, 8.0), WindowSpec.of("KCAS", 0.5, 2.0, 8.0),
                WindowSpec.of("AoA", 0.5, 2.0, 8.0));
        FeatureExtractor fx = FeatureExtractor.bind(d, specs, ExtractorSettings.defaults(),
                (timeNs, features, valid, coverage) -> sink += features[0] + coverage[3] + (valid[5] ? 1 : 0));
        Frame f = Frame.forDictionary(d);
        SplittableRandom rnd = new SplittableRandom(11L);
        long k = feed(fx, f, rnd, 0, 300_000);
        int growthsAfterWarmUp = fx.bufferGrowths();

        long before = mx.getCurrentThreadAllocatedBytes();
        feed(fx, f, rnd, k, 1_000_000);
        long allocated = mx.getCurrentThreadAllocatedBytes() - before;

        assertEquals(growthsAfterWarmUp, fx.bufferGrowths(), "no buffer growth in the measured stretch");
        assertTrue(fx.ticksEmitted() > 25_000, "ticks ran inside the measured loop");
        // < 1 KB leaves room for the counter's own bookkeeping; one allocation per sample would be >= 16 MB
        assertTrue(allocated < 1024, "allocated " + allocated + " bytes over 1e6 frames");
    }

    private static long feed(FeatureExtractor fx, Frame f, SplittableRandom rnd, long from, int frames) {
        long k = from;
        for (int i = 0; i < frames; i++, k++) {
            f.clear();
            f.timeNs(k * MS + rnd.nextLong(-200_000, 200_000));
            f.sequence(k);
            if (k % 50_000 == 0) {
                f.addFlags(Frame.GAP_BEFORE);
            }
            f.value(0, 1e6 + 0.01 * rnd.nextGaussian());
            if (k % 100 == 0) {
                f.value(1, 250 + rnd.nextGaussian());
            }
            if (k % 5 == 0 && rnd.nextInt(100) != 0) {
                f.value(2, Math.sin(k * 1e-3));
            }
            f.value(3, 1.0);
            fx.onFrame(f);
        }
        return k;
    }
}
