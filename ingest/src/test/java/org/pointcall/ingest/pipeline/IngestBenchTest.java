package org.pointcall.ingest.pipeline;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/** Runs the benchmark once, briefly, to check its accounting (no timing is asserted). */
class IngestBenchTest {
    @Test
    void benchDecodesEveryFrameAndTicksAtTheDecisionRate() {
        IngestBench.Result r = IngestBench.run(1);
        assertEquals(1000, r.frames());
        assertEquals(2000, r.packets(), "256 float64 slots do not fit 1,472 bytes: two parts a frame");
        // 1 s of frames at a 20 Hz decision rate: ticks at 0, 0.05 ... 0.95 s.
        assertEquals(20, r.ticks());
        assertTrue(r.ingestNsPerFrame() > 0 && r.crcNsPerFrame() > 0);
        assertTrue(r.lines().stream().anyMatch(l -> l.startsWith("ingest.speed: ")));
    }
}
