package org.pointcall.ingest.wire;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.ByteBuffer;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;

import org.junit.jupiter.api.Test;
import org.pointcall.ingest.frame.Frame;
import org.pointcall.shared.dictionary.ParameterDictionary;

/** Frames split into parts, lost packets, reordering, duplicates and restarts, through the decoder. */
class ReassemblyTest {
    private static final int STREAM = 7;
    private final ParameterDictionary wide = TestDictionaries.dictionary("wide", 256);
    private final List<Frame> sent = WireTestSupport.randomFrames(new SplittableRandom(3), 256, 40, 1_000);
    private final Collected got = new Collected();
    private final PacketDecoder dec = new PacketDecoder(new DictionaryRegistry(List.of(wide)),
            TestDictionaries.READER, got, DecoderOptions.DEFAULT, new FaultLog(line -> { }, 100, 1));

    /** Fragments of the announce, which come first. */
    private int announces;

    /** Packets of the 40 frames: the announce fragments, then frame i part p at announces + 2i + p. */
    private List<byte[]> packets(int epoch) {
        Collected.Packets out = new Collected.Packets();
        StreamEncoder enc = new StreamEncoder(STREAM, epoch, wide, TestDictionaries.toText(wide),
                WireOptions.DEFAULT.withAnnounceIntervalNs(0), out);
        assertEquals(2, enc.partsPerFrame());
        sent.forEach(enc::onFrame);
        announces = out.list.size() - 80;
        assertTrue(announces > 1, "a 256-slot dictionary's text takes several fragments");
        return out.list;
    }

    private void feed(List<byte[]> ps) {
        for (byte[] p : ps) {
            dec.decode(ByteBuffer.wrap(p), "127.0.0.1:40123", 0);
        }
    }

    private int part(int frame, int p) {
        return announces + 2 * frame + p;
    }

    @Test
    void aFrameMissingAPartIsDeliveredWithNaNInItsSlotsFlaggedAndCounted() {
        List<byte[]> ps = new ArrayList<>(packets(1));
        ps.remove(part(10, 1));
        feed(ps);
        List<Frame> back = got.of(STREAM);
        assertEquals(40, back.size());
        Frame f10 = back.get(10);
        assertTrue(f10.hasFlag(Frame.PARTS_MISSING));
        assertEquals(0, f10.flags() & Frame.GAP_BEFORE, "no frame is missing, so no gap flag");
        for (int k = 0; k < 128; k++) {
            assertEquals(Double.doubleToRawLongBits(sent.get(10).value(k)), Double.doubleToRawLongBits(f10.value(k)));
        }
        for (int k = 128; k < 256; k++) {
            assertTrue(Double.isNaN(f10.value(k)), "slot " + k + " of the lost part");
        }
        assertEquals(0, back.get(11).flags(), "the next frame is whole and follows on");
        assertEquals(1, dec.counters().framesPartial());
        assertEquals(1, dec.tracker(STREAM).lost());
        assertEquals(1, dec.tracker(STREAM).gapEvents());
    }

    @Test
    void framesLostWholeMakeTheNextFrameCarryTheGapFlag() {
        List<byte[]> ps = new ArrayList<>(packets(1));
        ps.remove(part(20, 1));
        ps.remove(part(20, 0));
        feed(ps);
        List<Frame> back = got.of(STREAM);
        assertEquals(39, back.size());
        assertEquals(21, back.get(20).sequence());
        assertTrue(back.get(20).hasFlag(Frame.GAP_BEFORE));
        assertEquals(1, countFlag(back, Frame.GAP_BEFORE));
        assertEquals(0, countFlag(back, Frame.PARTS_MISSING));
        assertEquals(2, dec.tracker(STREAM).lost());
    }

    @Test
    void partsArrivingInReverseOrderStillMakeAWholeFrame() {
        List<byte[]> ps = new ArrayList<>(packets(1));
        byte[] a = ps.get(part(5, 0));
        ps.set(part(5, 0), ps.get(part(5, 1)));
        ps.set(part(5, 1), a);
        feed(ps);
        List<Frame> back = got.of(STREAM);
        assertEquals(40, back.size());
        assertEquals(0, countFlag(back, Frame.PARTS_MISSING | Frame.GAP_BEFORE));
        assertArrayEquals(DecoderFuzzTest.rawBits(sent.get(5)), DecoderFuzzTest.rawBits(back.get(5)));
        assertEquals(1, dec.tracker(STREAM).late());
        assertEquals(0, dec.tracker(STREAM).lost());
    }

    @Test
    void aLatePartOfAnOlderFrameIsDeliveredAtOnceSoFramesStayInOrder() {
        List<byte[]> ps = new ArrayList<>(packets(1));
        // frame 8 part 0 lost; frame 8 part 1 arrives after frame 9 part 0
        byte[] f8p1 = ps.get(part(8, 1));
        ps.remove(part(8, 1));
        ps.remove(part(8, 0));
        ps.add(part(9, 0) - 1, f8p1); // after 9p0, which moved two places down
        feed(ps);
        List<Frame> back = got.of(STREAM);
        assertEquals(40, back.size());
        for (int i = 0; i < 40; i++) {
            assertEquals(i, back.get(i).sequence());
        }
        assertTrue(back.get(8).hasFlag(Frame.PARTS_MISSING));
        assertEquals(0, back.get(9).flags());
        assertEquals(1, dec.tracker(STREAM).lost());
    }

    @Test
    void duplicatedPacketsAreDroppedAndCounted() {
        List<byte[]> ps = new ArrayList<>(packets(1));
        ps.add(30, ps.get(29));
        ps.add(ps.get(3));
        feed(ps);
        assertEquals(40, got.of(STREAM).size());
        assertEquals(2, dec.counters().get(DecodeResult.DUPLICATE));
        assertEquals(2, dec.tracker(STREAM).duplicates());
    }

    @Test
    void aSenderRestartFlushesTheHalfFrameAndFlagsTheFirstNewFrame() {
        List<byte[]> first = packets(1);
        feed(first.subList(0, part(12, 1))); // stops after frame 12 part 0
        feed(packets(2));
        List<Frame> back = got.of(STREAM);
        assertEquals(12 + 1 + 40, back.size());
        assertTrue(back.get(12).hasFlag(Frame.PARTS_MISSING), "the half frame of the old session");
        Frame firstNew = back.get(13);
        assertEquals(0, firstNew.sequence());
        assertTrue(firstNew.hasFlag(Frame.GAP_BEFORE));
        assertEquals(1, dec.tracker(STREAM).restarts());
    }

    @Test
    void flushPendingDeliversTheLastHalfFrameWhenTheSourceStops() {
        List<byte[]> ps = packets(1);
        feed(ps.subList(0, ps.size() - 1));
        assertEquals(39, got.of(STREAM).size());
        dec.flushPending();
        assertEquals(40, got.of(STREAM).size());
        assertTrue(got.of(STREAM).get(39).hasFlag(Frame.PARTS_MISSING));
    }

    @Test
    void framesBeforeTheirAnnounceAreCountedAndDroppedThenDecoded() {
        PacketDecoder fresh = new PacketDecoder(new DictionaryRegistry(), TestDictionaries.READER, got,
                DecoderOptions.DEFAULT, new FaultLog(line -> { }, 100, 1));
        List<byte[]> ps = packets(1);
        for (int i = announces; i < ps.size(); i++) { // frames first
            assertEquals(DecodeResult.UNKNOWN_DICTIONARY, fresh.decode(ByteBuffer.wrap(ps.get(i)), "x", 0));
        }
        // the sender's next announce (its fragments in reverse order), then a frame: it decodes now
        Collected.Packets more = new Collected.Packets();
        StreamEncoder enc = new StreamEncoder(STREAM, 1, wide, TestDictionaries.toText(wide),
                WireOptions.DEFAULT.withAnnounceIntervalNs(0), more);
        enc.nextSequence(ps.size());
        enc.onFrame(sent.get(0));
        for (int i = announces - 1; i >= 0; i--) {
            assertEquals(DecodeResult.ANNOUNCE, fresh.decode(ByteBuffer.wrap(more.list.get(i)), "x", 0));
        }
        assertEquals(1, fresh.counters().dictionariesLearnt());
        assertEquals(80, fresh.counters().unknownDictionary());
        assertEquals(0, got.of(STREAM).size());
        for (int i = announces; i < more.list.size(); i++) {
            assertEquals(DecodeResult.FRAMES, fresh.decode(ByteBuffer.wrap(more.list.get(i)), "x", 0));
        }
        assertEquals(1, got.of(STREAM).size());
        assertEquals(ps.size() - announces + more.list.size(), fresh.tracker(STREAM).received());
        assertEquals(0, fresh.tracker(STREAM).lost());
    }

    @Test
    void aStreamThatChangesDictionaryIsToldAndGetsFramesOfTheNewWidth() {
        ParameterDictionary small = TestDictionaries.dictionary("small", 5);
        DictionaryRegistry reg = new DictionaryRegistry(List.of(wide, small));
        PacketDecoder d = new PacketDecoder(reg, TestDictionaries.READER, got);
        for (byte[] p : packets(1)) {
            d.decode(ByteBuffer.wrap(p), "x", 0);
        }
        Collected.Packets out = new Collected.Packets();
        StreamEncoder enc = new StreamEncoder(STREAM, 1, small, TestDictionaries.toText(small),
                WireOptions.DEFAULT.withMaxFramesPerPacket(1), out);
        enc.nextSequence(announces + 80);
        WireTestSupport.randomFrames(new SplittableRandom(4), 5, 3, 1L << 40).forEach(enc::onFrame);
        for (byte[] p : out.list) {
            d.decode(ByteBuffer.wrap(p), "x", 0);
        }
        assertEquals(List.of(wide, small), got.dictionaries);
        List<Frame> back = got.of(STREAM);
        assertEquals(43, back.size());
        assertEquals(5, back.get(42).slots());
        assertTrue(back.get(40).hasFlag(Frame.GAP_BEFORE), "a new layout starts a new series");
        assertEquals(small, d.dictionary(STREAM));
    }

    private static int countFlag(List<Frame> fs, int flag) {
        int n = 0;
        for (Frame f : fs) {
            if ((f.flags() & flag) != 0) {
                n++;
            }
        }
        return n;
    }
}
