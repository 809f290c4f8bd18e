package org.pointcall.ingest.wire;

import java.util.Locale;
import java.util.concurrent.atomic.AtomicLongArray;

/**
 * Exact counts kept by one {@link PacketDecoder}. Written by the decoding thread only (ordered stores, no locks);
 * safe to read from any thread.
 */
public final class DecodeCounters {
    private static final DecodeResult[] RESULTS = DecodeResult.values();
    private static final int FRAMES_DELIVERED = RESULTS.length;
    private static final int FRAMES_PARTIAL = FRAMES_DELIVERED + 1;
    private static final int FRAMES_LATE = FRAMES_DELIVERED + 2;
    private static final int DICTIONARIES_LEARNT = FRAMES_DELIVERED + 3;
    private static final int ANNOUNCES_ABANDONED = FRAMES_DELIVERED + 4;
    private static final int SIZE = FRAMES_DELIVERED + 5;

    private final AtomicLongArray c = new AtomicLongArray(SIZE);

    void count(DecodeResult r) {
        inc(r.ordinal());
    }

    void frameDelivered(boolean partial) {
        inc(FRAMES_DELIVERED);
        if (partial) {
            inc(FRAMES_PARTIAL);
        }
    }

    void frameLate() {
        inc(FRAMES_LATE);
    }

    void dictionaryLearnt() {
        inc(DICTIONARIES_LEARNT);
    }

    void announceAbandoned() {
        inc(ANNOUNCES_ABANDONED);
    }

    private void inc(int i) {
        c.lazySet(i, c.get(i) + 1);
    }

    /** Datagrams counted under this result. */
    public long get(DecodeResult r) {
        return c.get(r.ordinal());
    }

    /** Every datagram offered to the decoder. */
    public long datagrams() {
        long n = 0;
        for (DecodeResult r : RESULTS) {
            n += c.get(r.ordinal());
        }
        return n;
    }

    /** Datagrams rejected as bad, all kinds. */
    public long faults() {
        long n = 0;
        for (DecodeResult r : RESULTS) {
            if (r.isFault()) {
                n += c.get(r.ordinal());
            }
        }
        return n;
    }

    public long badMagic() {
        return get(DecodeResult.BAD_MAGIC);
    }

    public long badVersion() {
        return get(DecodeResult.BAD_VERSION);
    }

    public long badCrc() {
        return get(DecodeResult.BAD_CRC);
    }

    public long truncated() {
        return get(DecodeResult.TRUNCATED);
    }

    public long lengthMismatch() {
        return get(DecodeResult.LENGTH_MISMATCH);
    }

    public long badHeader() {
        return get(DecodeResult.BAD_HEADER);
    }

    public long unknownDictionary() {
        return get(DecodeResult.UNKNOWN_DICTIONARY);
    }

    public long slotCountMismatch() {
        return get(DecodeResult.SLOT_COUNT_MISMATCH);
    }

    public long oversize() {
        return get(DecodeResult.OVERSIZE);
    }

    public long streamLimit() {
        return get(DecodeResult.STREAM_LIMIT);
    }

    public long badAnnounce() {
        return get(DecodeResult.BAD_ANNOUNCE);
    }

    /** Frames handed to the sink, whole or partial. */
    public long framesDelivered() {
        return c.get(FRAMES_DELIVERED);
    }

    /** Frames delivered with parts lost: NaN in those slots, {@link org.pointcall.ingest.frame.Frame#PARTS_MISSING}. */
    public long framesPartial() {
        return c.get(FRAMES_PARTIAL);
    }

    /** Frames or frame parts dropped because a later frame of their stream had been delivered already. */
    public long framesLate() {
        return c.get(FRAMES_LATE);
    }

    /** Dictionaries learnt from complete announces. */
    public long dictionariesLearnt() {
        return c.get(DICTIONARIES_LEARNT);
    }

    /** Announce assemblies given up because fragments of a different announce arrived before they completed. */
    public long announcesAbandoned() {
        return c.get(ANNOUNCES_ABANDONED);
    }

    /** Every count as {@code name: value} lines, for logs and the bench. */
    @Override
    public String toString() {
        StringBuilder sb = new StringBuilder();
        for (DecodeResult r : RESULTS) {
            sb.append(r.name().toLowerCase(Locale.ROOT)).append(": ").append(get(r)).append('\n');
        }
        sb.append("frames_delivered: ").append(framesDelivered()).append('\n');
        sb.append("frames_partial: ").append(framesPartial()).append('\n');
        sb.append("frames_late: ").append(framesLate()).append('\n');
        sb.append("dictionaries_learnt: ").append(dictionariesLearnt()).append('\n');
        sb.append("announces_abandoned: ").append(announcesAbandoned()).append('\n');
        return sb.toString();
    }
}
