package org.pointcall.ingest.udp;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Duration;

import org.junit.jupiter.api.Test;

/** Tiny runs of the bench: the accounting must hold; no figure of speed is asserted. */
class WireBenchTest {

    @Test
    void pacedRunAccountsForEveryPacket() {
        BenchReport r = WireBench.paced(2000, Duration.ofMillis(500), UdpSourceConfig.DEFAULT_RECEIVE_BUFFER_BYTES);
        assertTrue(r.value("sent") > 0);
        assertEquals(r.value("sent") - r.value("received"), r.value("lost_from_gaps"));
        assertEquals(1, r.value("loss_accounting_exact"));
        assertEquals(0, r.value("decode_faults"));
        for (String line : r.lines()) {
            assertTrue(line.matches("[a-z_0-9]+: \\S+( .+)?"), line);
        }
    }

    @Test
    void overloadRunCountsItsLossFromSequenceGapsExactly() {
        BenchReport r = WireBench.overload(20_000, 4096);
        assertEquals(20_000 + 20 + 1, r.value("sent"), "frames, tail and one announce");
        assertEquals(r.value("sent") - r.value("received"), r.value("lost_from_gaps"));
        assertEquals(1, r.value("loss_accounting_exact"));
    }
}
