package org.pointcall.ingest.wire;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import java.nio.ByteBuffer;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.EnumMap;
import java.util.EnumSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.SplittableRandom;

import org.junit.jupiter.api.Test;
import org.pointcall.ingest.frame.Frame;
import org.pointcall.shared.dictionary.ParameterDictionary;

/**
 * Feeds the decoder 100,000 damaged packets with good ones interleaved. Damaged packets are made from real packets
 * of streams 1 and 3; the good ones are stream 2. Every damaged packet must end in a result its damage allows,
 * counted in exactly one counter, and every good frame must come through intact.
 */
class DecoderFuzzTest {
    private static final int GOOD = 2;
    private static final int DAMAGED = 100_000;
    private static final Set<DecodeResult> ACCEPTED = EnumSet.of(DecodeResult.FRAMES, DecodeResult.ANNOUNCE,
            DecodeResult.DUPLICATE, DecodeResult.STALE);

    enum Damage {
        BIT_FLIPS, TRUNCATE, EXTEND, RANDOM_BYTES, RANDOM_WITH_MAGIC, RANDOM_SEALED, FIELD_UNSEALED, MAGIC_SEALED,
        VERSION_SEALED, LENGTH_SEALED, TYPE_SEALED, TYPE_SWAP_SEALED, RESERVED_FLAG_SEALED, FLOAT_FLAG_SEALED,
        HASH_RANDOM_SEALED, HASH_OTHER_SEALED, DICT_SLOTS_SEALED, COUNTS_SEALED, FRAGMENT_SEALED, STREAM_SEALED,
        SEQUENCE_SEALED, EPOCH_SEALED, CONTENT_SEALED
    }

    @Test
    void damagedPacketsAreEachCountedOnceAndGoodOnesAroundThemAllArrive() {
        SplittableRandom r = new SplittableRandom(20240601L);
        ParameterDictionary narrow = TestDictionaries.dictionary("narrow", 24);
        ParameterDictionary wide = TestDictionaries.dictionary("wide", 300);
        ParameterDictionary good = TestDictionaries.dictionary("good", 16);
        DictionaryRegistry registry = new DictionaryRegistry(List.of(narrow, wide, good));

        List<byte[]> bases = new ArrayList<>();
        bases.addAll(encode(1, narrow, WireOptions.DEFAULT, r, 300));
        bases.addAll(encode(3, wide, WireOptions.DEFAULT.withFloat32(r.nextBoolean()), r, 100));
        bases.addAll(encode(3, wide, WireOptions.DEFAULT, r, 100));
        List<Frame> goodFrames = WireTestSupport.randomFrames(r, 16, 30_000, 0);
        Collected.Packets goodPackets = new Collected.Packets();
        StreamEncoder goodEnc = new StreamEncoder(GOOD, 42, good, TestDictionaries.toText(good),
                WireOptions.DEFAULT.withMaxFramesPerPacket(1 + r.nextInt(3)), goodPackets);
        goodFrames.forEach(goodEnc::onFrame);
        goodEnc.flush();

        GoodOnly sink = new GoodOnly();
        long[] logLines = new long[1];
        PacketDecoder dec = new PacketDecoder(registry, TestDictionaries.READER, sink, DecoderOptions.DEFAULT,
                new FaultLog(line -> logLines[0]++, 10, 1_000_000_000L));
        DecodeCounters c = dec.counters();

        // streams 1 and 3 get their state first, so the stream limit (reached by damaged stream ids) cannot hide
        // what the damage to their packets does
        dec.decode(ByteBuffer.wrap(bases.get(0)), "setup", 0);
        dec.decode(ByteBuffer.wrap(bases.get(bases.size() - 1)), "setup", 0);

        Map<Damage, Integer> seen = new EnumMap<>(Damage.class);
        int nextGood = 0;
        long now = 0;
        for (int i = 0; i < DAMAGED; i++) {
            if (i % 4 == 0 && nextGood < goodPackets.list.size()) {
                DecodeResult res = dec.decode(WireTestSupport.wrapAt(goodPackets.list.get(nextGood++), r.nextInt(16),
                        r), "good", now);
                assertTrue(res == DecodeResult.FRAMES || res == DecodeResult.ANNOUNCE, "good packet gave " + res);
            }
            byte[] base = bases.get(r.nextInt(bases.size()));
            Damage kind = Damage.values()[r.nextInt(Damage.values().length)];
            seen.merge(kind, 1, Integer::sum);
            Damaged d = damage(kind, base, r, wide.hash(), narrow.hash());
            long faultsBefore = c.faults();
            long datagramsBefore = c.datagrams();
            long[] before = snapshot(c);
            ByteBuffer buf = WireTestSupport.wrapAt(d.bytes, r.nextInt(16), r);
            int pos = buf.position();
            int lim = buf.limit();
            DecodeResult res = dec.decode(buf, "fuzz", now);
            now += 1000;
            if (!d.allowed.contains(res)) {
                fail(kind + " gave " + res + ", allowed " + d.allowed);
            }
            assertEquals(pos, buf.position(), "position left as it was");
            assertEquals(lim, buf.limit(), "limit left as it was");
            assertEquals(datagramsBefore + 1, c.datagrams());
            long[] after = snapshot(c);
            for (DecodeResult k : DecodeResult.values()) {
                long expected = before[k.ordinal()] + (k == res ? 1 : 0);
                assertEquals(expected, after[k.ordinal()], "counter " + k + " after " + kind);
            }
            assertEquals(faultsBefore + (res.isFault() ? 1 : 0), c.faults());
        }
        while (nextGood < goodPackets.list.size()) {
            DecodeResult res = dec.decode(ByteBuffer.wrap(goodPackets.list.get(nextGood++)), "good", now);
            assertTrue(res == DecodeResult.FRAMES || res == DecodeResult.ANNOUNCE, "good packet gave " + res);
        }

        assertEquals(Damage.values().length, seen.size(), "every kind of damage was tried");
        assertTrue(c.faults() > DAMAGED / 2, "most damaged packets are faults: " + c.faults());
        // the flood of faults reached the log as a handful of lines: 10 in the one window of fake time + summary
        assertTrue(logLines[0] <= 11, "log lines " + logLines[0]);

        assertEquals(goodFrames.size(), sink.frames.size(), "every good frame arrived");
        for (int i = 0; i < goodFrames.size(); i++) {
            Frame s = goodFrames.get(i);
            Frame b = sink.frames.get(i);
            assertEquals(s.timeNs(), b.timeNs());
            assertEquals(i, b.sequence());
            assertEquals(0, b.flags() & (Frame.GAP_BEFORE | Frame.PARTS_MISSING), "flags of good frame " + i);
            assertArrayEquals(rawBits(s), rawBits(b), "values of good frame " + i);
        }
        StreamTracker t = dec.tracker(GOOD);
        assertEquals(goodPackets.list.size(), t.received());
        assertEquals(0, t.lost());
        assertEquals(0, t.duplicates());
    }

    private record Damaged(byte[] bytes, Set<DecodeResult> allowed) {
    }

    private static Damaged damage(Damage kind, byte[] base, SplittableRandom r, long wideHash, long narrowHash) {
        byte[] p = base.clone();
        ByteBuffer b = ByteBuffer.wrap(p).order(WireFormat.ORDER);
        boolean frames = p[WireFormat.OFF_TYPE] == WireFormat.TYPE_FRAMES;
        switch (kind) {
            case BIT_FLIPS -> {
                // CRC-32C detects every error of up to 3 bits at these lengths (Hamming distance >= 4 below
                // 2^31 bits: Castagnoli 1993, Koopman 2002 [memory]); flips in magic, version or length are caught
                // earlier
                int flips = 1 + r.nextInt(3);
                int[] bits = distinct(r, flips, p.length * 8);
                for (int bit : bits) {
                    p[bit >>> 3] ^= (byte) (1 << (bit & 7));
                }
                return new Damaged(p, EnumSet.of(DecodeResult.BAD_MAGIC, DecodeResult.BAD_VERSION,
                        DecodeResult.TRUNCATED, DecodeResult.LENGTH_MISMATCH, DecodeResult.BAD_CRC));
            }
            case TRUNCATE -> {
                return new Damaged(Arrays.copyOf(p, r.nextInt(p.length)), EnumSet.of(DecodeResult.TRUNCATED));
            }
            case EXTEND -> {
                byte[] q = Arrays.copyOf(p, p.length + 1 + r.nextInt(64));
                for (int k = p.length; k < q.length; k++) {
                    q[k] = (byte) r.nextInt();
                }
                return new Damaged(q, EnumSet.of(DecodeResult.LENGTH_MISMATCH, DecodeResult.OVERSIZE));
            }
            case RANDOM_BYTES -> {
                byte[] q = new byte[r.nextInt(1600)];
                r.nextBytes(q);
                return new Damaged(q, EnumSet.of(DecodeResult.OVERSIZE, DecodeResult.TRUNCATED,
                        DecodeResult.BAD_MAGIC));
            }
            case RANDOM_WITH_MAGIC -> {
                byte[] q = randomFramed(r);
                return new Damaged(q, EnumSet.of(DecodeResult.BAD_CRC));
            }
            case RANDOM_SEALED -> {
                byte[] q = randomFramed(r);
                ByteBuffer qb = ByteBuffer.wrap(q).order(WireFormat.ORDER);
                q[WireFormat.OFF_TYPE] = (byte) (r.nextInt(4) == 0 ? r.nextInt() : 1 + r.nextInt(2));
                qb.putInt(WireFormat.OFF_STREAM, notGood(r));
                WireTestSupport.reseal(q);
                // random content never makes frames: no random hash names a known dictionary
                Set<DecodeResult> allowed = EnumSet.allOf(DecodeResult.class);
                allowed.removeAll(EnumSet.of(DecodeResult.FRAMES, DecodeResult.BAD_MAGIC, DecodeResult.BAD_VERSION,
                        DecodeResult.BAD_CRC));
                return new Damaged(q, allowed);
            }
            case FIELD_UNSEALED -> {
                int at = WireFormat.OFF_TYPE + r.nextInt(p.length - 4 - WireFormat.OFF_TYPE);
                if (at >= WireFormat.OFF_LENGTH && at < WireFormat.OFF_LENGTH + 4) {
                    at = WireFormat.OFF_STREAM;
                }
                p[at] ^= (byte) (1 + r.nextInt(255));
                return new Damaged(p, EnumSet.of(DecodeResult.BAD_CRC));
            }
            case MAGIC_SEALED -> {
                b.putInt(WireFormat.OFF_MAGIC, WireFormat.MAGIC ^ (1 + r.nextInt(Integer.MAX_VALUE)));
                WireTestSupport.reseal(p);
                return new Damaged(p, EnumSet.of(DecodeResult.BAD_MAGIC));
            }
            case VERSION_SEALED -> {
                p[WireFormat.OFF_VERSION] = (byte) (WireFormat.VERSION + 1 + r.nextInt(255));
                WireTestSupport.reseal(p);
                return new Damaged(p, EnumSet.of(DecodeResult.BAD_VERSION));
            }
            case LENGTH_SEALED -> {
                int declared;
                do {
                    declared = r.nextInt(4) == 0 ? r.nextInt() : p.length + r.nextInt(-40, 40);
                } while (declared == p.length);
                b.putInt(WireFormat.OFF_LENGTH, declared);
                WireTestSupport.reseal(p);
                return new Damaged(p, EnumSet.of(DecodeResult.TRUNCATED, DecodeResult.LENGTH_MISMATCH));
            }
            case TYPE_SEALED -> {
                p[WireFormat.OFF_TYPE] = (byte) (3 + r.nextInt(253));
                WireTestSupport.reseal(p);
                return new Damaged(p, EnumSet.of(DecodeResult.BAD_HEADER));
            }
            case TYPE_SWAP_SEALED -> {
                p[WireFormat.OFF_TYPE] = (byte) (frames ? WireFormat.TYPE_ANNOUNCE : WireFormat.TYPE_FRAMES);
                WireTestSupport.reseal(p);
                Set<DecodeResult> allowed = faultsBut(DecodeResult.BAD_MAGIC, DecodeResult.BAD_VERSION,
                        DecodeResult.BAD_CRC);
                allowed.addAll(ACCEPTED);
                allowed.remove(DecodeResult.FRAMES);
                return new Damaged(p, allowed);
            }
            case RESERVED_FLAG_SEALED -> {
                b.putShort(WireFormat.OFF_FLAGS, (short) (b.getShort(WireFormat.OFF_FLAGS) | (4 << r.nextInt(14))));
                WireTestSupport.reseal(p);
                return new Damaged(p, EnumSet.of(DecodeResult.BAD_HEADER));
            }
            case FLOAT_FLAG_SEALED -> {
                b.putShort(WireFormat.OFF_FLAGS, (short) (b.getShort(WireFormat.OFF_FLAGS) ^ WireFormat.FLAG_FLOAT32));
                WireTestSupport.reseal(p);
                return new Damaged(p, EnumSet.of(frames ? DecodeResult.LENGTH_MISMATCH : DecodeResult.BAD_HEADER));
            }
            case HASH_RANDOM_SEALED -> {
                b.putLong(WireFormat.OFF_DICT_HASH, r.nextLong());
                WireTestSupport.reseal(p);
                // an announce of an unknown hash starts an assembly (or completes one that fails its checks)
                return new Damaged(p, frames ? EnumSet.of(DecodeResult.UNKNOWN_DICTIONARY)
                        : EnumSet.of(DecodeResult.ANNOUNCE, DecodeResult.BAD_ANNOUNCE, DecodeResult.DUPLICATE,
                        DecodeResult.STALE));
            }
            case HASH_OTHER_SEALED -> {
                long h = b.getLong(WireFormat.OFF_DICT_HASH);
                b.putLong(WireFormat.OFF_DICT_HASH, h == wideHash ? narrowHash : wideHash);
                WireTestSupport.reseal(p);
                return new Damaged(p, EnumSet.of(DecodeResult.SLOT_COUNT_MISMATCH));
            }
            case DICT_SLOTS_SEALED -> {
                int old = b.getShort(WireFormat.OFF_DICT_SLOTS) & 0xffff;
                int slots;
                do {
                    slots = r.nextInt(2) == 0 ? r.nextInt(0x10000) : Math.max(0, old + r.nextInt(-3, 4));
                } while (slots == old);
                b.putShort(WireFormat.OFF_DICT_SLOTS, (short) slots);
                WireTestSupport.reseal(p);
                return new Damaged(p, EnumSet.of(DecodeResult.BAD_HEADER, DecodeResult.SLOT_COUNT_MISMATCH));
            }
            case COUNTS_SEALED -> {
                // frame count, first slot or part slots of a frames packet; fragment fields of an announce
                int at = frames ? WireFormat.OFF_FRAME_COUNT + 2 * r.nextInt(3) : WireFormat.OFF_FRAGMENT_INDEX
                        + 2 * r.nextInt(3);
                int old = b.getShort(at) & 0xffff;
                int v;
                do {
                    v = r.nextInt(3) == 0 ? r.nextInt(0x10000) : Math.max(0, old + r.nextInt(-2, 3));
                } while (v == old);
                b.putShort(at, (short) v);
                WireTestSupport.reseal(p);
                Set<DecodeResult> allowed = EnumSet.of(DecodeResult.BAD_HEADER, DecodeResult.LENGTH_MISMATCH);
                if (!frames || at == WireFormat.OFF_FIRST_SLOT) {
                    allowed.addAll(ACCEPTED); // a fragment index or a part moved within range is still valid
                }
                return new Damaged(p, allowed);
            }
            case FRAGMENT_SEALED -> {
                if (frames) {
                    // the first frame index or time: still a valid packet
                    b.putLong(WireFormat.OFF_FIRST_INDEX + 8 * r.nextInt(2), r.nextLong());
                    WireTestSupport.reseal(p);
                    return new Damaged(p, ACCEPTED);
                }
                int at = WireFormat.OFF_TEXT_LENGTH + 4 * r.nextInt(3);
                b.putInt(at, r.nextInt(3) == 0 ? r.nextInt() : b.getInt(at) + r.nextInt(-3, 4));
                WireTestSupport.reseal(p);
                Set<DecodeResult> allowed = EnumSet.of(DecodeResult.BAD_HEADER, DecodeResult.OVERSIZE);
                allowed.addAll(ACCEPTED);
                return new Damaged(p, allowed);
            }
            case STREAM_SEALED -> {
                b.putInt(WireFormat.OFF_STREAM, notGood(r));
                WireTestSupport.reseal(p);
                Set<DecodeResult> allowed = EnumSet.of(DecodeResult.STREAM_LIMIT);
                allowed.addAll(ACCEPTED);
                return new Damaged(p, allowed);
            }
            case SEQUENCE_SEALED, EPOCH_SEALED -> {
                int at = kind == Damage.SEQUENCE_SEALED ? WireFormat.OFF_SEQUENCE : WireFormat.OFF_EPOCH;
                b.putInt(at, r.nextInt(2) == 0 ? r.nextInt() : b.getInt(at) + r.nextInt(-2000, 2000));
                WireTestSupport.reseal(p);
                return new Damaged(p, ACCEPTED);
            }
            case CONTENT_SEALED -> {
                // time offsets, values or text: a CRC over changed content is a valid packet
                int start = frames ? WireFormat.FRAMES_HEADER_BYTES : WireFormat.ANNOUNCE_HEADER_BYTES;
                if (p.length - 4 > start) {
                    p[start + r.nextInt(p.length - 4 - start)] ^= (byte) (1 + r.nextInt(255));
                }
                WireTestSupport.reseal(p);
                return new Damaged(p, ACCEPTED);
            }
            default -> throw new IllegalStateException(kind.toString());
        }
    }

    /** Random bytes with the magic, version and a matching length field: well framed, nonsense inside. */
    private static byte[] randomFramed(SplittableRandom r) {
        byte[] q = new byte[WireFormat.MIN_PACKET_BYTES + r.nextInt(1472 - WireFormat.MIN_PACKET_BYTES + 1)];
        r.nextBytes(q);
        ByteBuffer qb = ByteBuffer.wrap(q).order(WireFormat.ORDER);
        qb.putInt(WireFormat.OFF_MAGIC, WireFormat.MAGIC);
        q[WireFormat.OFF_VERSION] = (byte) WireFormat.VERSION;
        qb.putInt(WireFormat.OFF_LENGTH, q.length);
        return q;
    }

    private static Set<DecodeResult> faultsBut(DecodeResult... not) {
        Set<DecodeResult> s = EnumSet.noneOf(DecodeResult.class);
        for (DecodeResult d : DecodeResult.values()) {
            if (d.isFault()) {
                s.add(d);
            }
        }
        for (DecodeResult d : not) {
            s.remove(d);
        }
        return s;
    }

    private static int notGood(SplittableRandom r) {
        int id;
        do {
            id = r.nextInt(3) == 0 ? r.nextInt() : r.nextInt(8);
        } while (id == GOOD);
        return id;
    }

    private static int[] distinct(SplittableRandom r, int n, int bound) {
        int[] out = new int[n];
        for (int k = 0; k < n; k++) {
            int v;
            boolean dup;
            do {
                v = r.nextInt(bound);
                dup = false;
                for (int j = 0; j < k; j++) {
                    dup |= out[j] == v;
                }
            } while (dup);
            out[k] = v;
        }
        return out;
    }

    private static List<byte[]> encode(int stream, ParameterDictionary d, WireOptions o, SplittableRandom r, int n) {
        Collected.Packets packets = new Collected.Packets();
        StreamEncoder enc = new StreamEncoder(stream, r.nextInt(), d, TestDictionaries.toText(d),
                o.withMaxFramesPerPacket(r.nextInt(4)), packets);
        WireTestSupport.randomFrames(r, d.size(), n, r.nextLong()).forEach(enc::onFrame);
        enc.flush();
        return packets.list;
    }

    private static long[] snapshot(DecodeCounters c) {
        long[] s = new long[DecodeResult.values().length];
        for (DecodeResult k : DecodeResult.values()) {
            s[k.ordinal()] = c.get(k);
        }
        return s;
    }

    static long[] rawBits(Frame f) {
        long[] bits = new long[f.slots()];
        for (int k = 0; k < bits.length; k++) {
            bits[k] = Double.doubleToRawLongBits(f.value(k));
        }
        return bits;
    }

    /** Keeps copies of the good stream's frames only (the damaged streams' frames are only counted). */
    private static final class GoodOnly implements StreamFrameSink {
        final List<Frame> frames = new ArrayList<>();

        @Override
        public void onFrame(int streamId, Frame frame, long receiveTimeNs) {
            if (streamId == GOOD) {
                frames.add(frame.copy());
            }
        }
    }
}
