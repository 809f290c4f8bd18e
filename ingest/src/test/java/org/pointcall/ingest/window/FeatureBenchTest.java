package org.pointcall.ingest.window;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;

import org.junit.jupiter.api.Test;

/** The bench harness runs and reports its lines; its timings are not asserted (the machine is shared). */
class FeatureBenchTest {
    @Test
    void oneSecondOfW1ReportsCountsAndNameValueUnitLines() {
        FeatureBench.Result r = FeatureBench.run(1, 100_000_000L);
        assertEquals(1000, r.frames());
        assertEquals(20, r.ticks(), "20 Hz decisions over 1 s");
        // 6 each of 1000, 200, 50 and 10 Hz parameters: 6 * 1260 samples per second
        assertEquals(7560, r.selectedSamples());
        List<String> lines = r.lines();
        assertEquals(10, lines.size());
        for (String l : lines) {
            assertTrue(l.matches("window\\.w1\\.[A-Za-z0-9.]+: -?[0-9.]+ .+"), l);
        }
        assertTrue(r.extractNsPerFrame() > 0 && r.crcNsPerFrame() > 0);
    }
}
