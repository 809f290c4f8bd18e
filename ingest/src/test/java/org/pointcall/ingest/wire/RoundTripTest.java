package org.pointcall.ingest.wire;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.ByteBuffer;
import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.SplittableRandom;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.pointcall.ingest.frame.Frame;
import org.pointcall.shared.dictionary.ParameterDictionary;

class RoundTripTest {

    @ParameterizedTest(name = "{0} slots, {1}-byte datagrams, float32 {2}")
    @CsvSource({
        "1, 1472, false", "7, 1472, false", "32, 1472, false", "176, 1472, false", "177, 1472, false",
        "256, 1472, false", "1000, 1472, false", "4000, 1472, false", "256, 600, false", "32, 68, false",
        "300, 9000, false", "2000, 65507, false", "32, 1472, true", "353, 1472, true", "354, 1472, true",
        "1000, 1472, true"})
    void framesComeBackBitExactThroughAnnounceAndParts(int slots, int maxDatagram, boolean float32) {
        SplittableRandom r = new SplittableRandom(1000L * slots + maxDatagram + (float32 ? 1 : 0));
        ParameterDictionary d = TestDictionaries.dictionary("rt" + slots, slots);
        List<Frame> sent = WireTestSupport.randomFrames(r, slots, 400, r.nextLong(-1L << 60, 1L << 60));
        WireOptions opts = WireOptions.DEFAULT.withMaxDatagramBytes(maxDatagram).withFloat32(float32)
                .withSynthetic(slots % 2 == 1);
        Collected.Packets packets = new Collected.Packets();
        StreamEncoder enc = new StreamEncoder(9, 0x5eed, d, TestDictionaries.toText(d), opts, packets);
        for (Frame f : sent) {
            enc.onFrame(f);
        }
        enc.flush();

        Collected got = new Collected();
        // the receiver starts knowing no dictionary: it must learn it from the (fragmented) announce
        PacketDecoder dec = new PacketDecoder(new DictionaryRegistry(), TestDictionaries.READER, got,
                DecoderOptions.DEFAULT.withMaxDatagramBytes(maxDatagram), new FaultLog(line -> { }, 10, 1));
        int announces = 0;
        for (byte[] p : packets.list) {
            assertTrue(p.length <= maxDatagram, "packet of " + p.length + " bytes over the limit");
            DecodeResult res = dec.decode(ByteBuffer.wrap(p), "test", 0);
            assertTrue(res == DecodeResult.FRAMES || res == DecodeResult.ANNOUNCE, res.toString());
            if (p[WireFormat.OFF_TYPE] == WireFormat.TYPE_ANNOUNCE) {
                announces++;
            }
        }
        assertEquals(1, dec.counters().dictionariesLearnt());
        int textBytes = TestDictionaries.toText(d).getBytes(StandardCharsets.UTF_8).length;
        int fragments = (textBytes + WireFormat.announceChunkBytes(maxDatagram) - 1)
                / WireFormat.announceChunkBytes(maxDatagram);
        assertEquals(0, announces % fragments, "announces come in whole sets of fragments");

        List<Frame> back = got.of(9);
        assertEquals(sent.size(), back.size());
        assertEquals(0, dec.counters().faults());
        assertEquals(0, dec.counters().framesPartial());
        for (int i = 0; i < sent.size(); i++) {
            Frame s = sent.get(i);
            Frame b = back.get(i);
            assertEquals(s.timeNs(), b.timeNs(), "time of frame " + i);
            assertEquals(i, b.sequence(), "index of frame " + i);
            int flags = opts.synthetic() ? Frame.SYNTHETIC : 0;
            if (i > 0 && s.timeNs() <= sent.get(i - 1).timeNs()) {
                flags |= Frame.TIME_SUSPECT;
            }
            assertEquals(flags, b.flags(), "flags of frame " + i);
            if (float32) {
                // float32 carries the float rounding of each value
                double[] rounded = new double[slots];
                for (int k = 0; k < slots; k++) {
                    rounded[k] = (float) s.value(k);
                }
                assertArrayEquals(rounded, b.values(), "values of frame " + i);
            } else {
                assertArrayEquals(DecoderFuzzTest.rawBits(s), DecoderFuzzTest.rawBits(b), "values of frame " + i);
            }
        }
    }

    @Test
    void wideFramesAreSplitIntoNearEqualPartsUnderTheEthernetLimit() {
        ParameterDictionary d = TestDictionaries.dictionary("wide", 256);
        StreamEncoder enc = new StreamEncoder(1, 1, d, TestDictionaries.toText(d), WireOptions.DEFAULT,
                new Collected.Packets());
        // 256 float64 values are 2048 bytes: over 1472, so two parts of 128 slots (56 + 1024 + 4 bytes each)
        assertEquals(2, enc.partsPerFrame());
        assertEquals(1084, WireFormat.framesPacketBytes(1, 128, 8));
        assertEquals(176, WireFormat.maxSlotsPerPart(1472, 8));
        // 32 slots: 5 frames of 260 bytes (4-byte offset + 256 values) share one 1472-byte datagram
        assertEquals(5, WireFormat.framesPerPacket(1472, 32, 8));
        assertTrue(WireFormat.framesPacketBytes(5, 32, 8) <= 1472);
        assertTrue(WireFormat.framesPacketBytes(6, 32, 8) > 1472);
    }

    @Test
    void sequenceWrapsFromTheTopOfUint32ToZeroWithoutAGap() {
        ParameterDictionary d = TestDictionaries.dictionary("wrap", 4);
        Collected.Packets packets = new Collected.Packets();
        StreamEncoder enc = new StreamEncoder(3, 77, d, TestDictionaries.toText(d),
                WireOptions.DEFAULT.withMaxFramesPerPacket(1), packets);
        enc.nextSequence(-5); // 0xFFFFFFFB
        List<Frame> sent = WireTestSupport.randomFrames(new SplittableRandom(5), 4, 20, 0);
        sent.forEach(enc::onFrame);
        Collected got = new Collected();
        PacketDecoder dec = new PacketDecoder(new DictionaryRegistry(List.of(d)), TestDictionaries.READER, got);
        for (byte[] p : packets.list) {
            dec.decode(ByteBuffer.wrap(p), "test", 0);
        }
        StreamTracker t = dec.tracker(3);
        assertEquals(packets.list.size(), t.received());
        assertEquals(0, t.gapEvents());
        assertEquals(0, t.lost());
        assertEquals(packets.list.size() - 6L, t.highestSequence()); // first packet carried 0xFFFFFFFB
        assertEquals(20, got.of(3).size());
        for (Frame f : got.of(3)) {
            assertEquals(0, f.flags() & Frame.GAP_BEFORE);
        }
    }
}
