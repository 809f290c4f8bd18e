package org.pointcall.ingest.wire;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.lang.management.ManagementFactory;
import java.util.List;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.pointcall.ingest.frame.Frame;
import org.pointcall.shared.dictionary.ParameterDictionary;

/** Encode and decode of known streams allocate nothing per frame (bytes counted by the JVM for this thread). */
class AllocationTest {

    private static long allocatedBytes() {
        return ((com.sun.management.ThreadMXBean) ManagementFactory.getThreadMXBean())
                .getCurrentThreadAllocatedBytes();
    }

    @ParameterizedTest(name = "{0} slots")
    @ValueSource(ints = {32, 256})
    void encodeAndDecodeAllocateNothingPerFrame(int slots) {
        ParameterDictionary d = TestDictionaries.dictionary("alloc", slots);
        long[] frames = new long[1];
        StreamFrameSink count = (streamId, frame, receiveTimeNs) -> frames[0]++;
        PacketDecoder dec = new PacketDecoder(new DictionaryRegistry(List.of(d)), TestDictionaries.READER, count);
        PacketSink loop = packet -> dec.decode(packet, "loop", 0);
        StreamEncoder enc = new StreamEncoder(1, 1, d, TestDictionaries.toText(d), WireOptions.DEFAULT, loop);
        Frame f = Frame.forDictionary(d);
        run(enc, f, 0, 50_000); // warm-up: interpreter and JIT
        long before = allocatedBytes();
        run(enc, f, 50_000, 200_000);
        long allocated = allocatedBytes() - before;
        enc.flush();
        assertEquals(200_000, frames[0]);
        assertEquals(0, dec.counters().faults());
        assertTrue(allocated < 150_000, allocated + " bytes allocated for 150,000 frames");
    }

    private static void run(StreamEncoder enc, Frame f, int from, int to) {
        for (int i = from; i < to; i++) {
            f.timeNs(i * 1_000_000L); // 1 kHz: re-announces every 1,000 frames
            f.values()[0] = i;
            enc.onFrame(f);
        }
    }

    @Test
    void theThreadAllocationCounterSeesAllocation() {
        long before = allocatedBytes();
        Object[] keep = new Object[1000];
        for (int i = 0; i < keep.length; i++) {
            keep[i] = new long[16];
        }
        assertTrue(allocatedBytes() - before >= 1000L * 16 * 8, "counter works");
        assertEquals(1000, keep.length);
    }
}
