package org.pointcall.ingest.wire;

import java.util.Arrays;
import java.util.concurrent.atomic.AtomicLongArray;

/**
 * Sequence tracking of one stream: counts gaps (packets missing), duplicates, late (reordered) packets, stale
 * packets and sender restarts, and keeps going after any of them.
 *
 * <p>Sequence numbers are uint32 and wrap from 0xFFFFFFFF to 0; they are compared by their signed 32-bit
 * difference (serial number arithmetic, common practice), so a number up to 2^31 - 1 ahead of the newest is a gap
 * and anything else is behind it. A bit per number over the last {@code reorderWindow} numbers tells late packets
 * from duplicates. A sender announces its restart with a new epoch; a packet with another epoch restarts tracking
 * at once. A sender that restarts without changing epoch shows as packets far behind the newest: those are dropped
 * as stale until {@code resyncAfter} arrive in a row, and then tracking restarts at that packet.
 *
 * <p>{@link #lost()} is the number still missing: counted at each gap, less those that arrived late. When the last
 * packet sent has arrived, sent = {@link #received()} + {@link #lost()} (+ stale and duplicates, which are repeats
 * or too old to place).
 *
 * <p>Confined to the decoding thread for {@link #observe}; the counts may be read from any thread.
 */
public final class StreamTracker {
    public static final int DEFAULT_REORDER_WINDOW = 1024;
    public static final int DEFAULT_RESYNC_AFTER = 8;

    private static final int RECEIVED = 0;
    private static final int GAP_EVENTS = 1;
    private static final int GAP_PACKETS = 2;
    private static final int MISSING = 3;
    private static final int LATE = 4;
    private static final int DUPLICATES = 5;
    private static final int STALE = 6;
    private static final int RESTARTS = 7;
    private static final int RESYNCS = 8;

    private final int window;
    private final int mask;
    private final int resyncAfter;
    private final long[] seen;
    private final AtomicLongArray c = new AtomicLongArray(9);

    private boolean started;
    private int epoch;
    private int start;
    private int highest;
    private int staleRun;
    private int lastGap;
    private int previousEpoch;

    public StreamTracker() {
        this(DEFAULT_REORDER_WINDOW, DEFAULT_RESYNC_AFTER);
    }

    /**
     * @param reorderWindow how far behind the newest a packet may arrive and still be placed; a power of two, 64 to
     *                      2^20
     * @param resyncAfter   stale packets in a row that mean the sender restarted without a new epoch
     */
    public StreamTracker(int reorderWindow, int resyncAfter) {
        check(reorderWindow, resyncAfter);
        this.window = reorderWindow;
        this.mask = reorderWindow - 1;
        this.resyncAfter = resyncAfter;
        this.seen = new long[reorderWindow / 64];
    }

    static void check(int reorderWindow, int resyncAfter) {
        if (reorderWindow < 64 || reorderWindow > (1 << 20) || Integer.bitCount(reorderWindow) != 1) {
            throw new IllegalArgumentException("reorder window must be a power of two in [64, 2^20], got "
                    + reorderWindow);
        }
        if (resyncAfter < 1) {
            throw new IllegalArgumentException("resyncAfter must be >= 1, got " + resyncAfter);
        }
    }

    /** Places one packet. Allocation-free. */
    public SequenceVerdict observe(int packetEpoch, int sequence) {
        if (!started) {
            begin(packetEpoch, sequence);
            inc(RECEIVED);
            return SequenceVerdict.FIRST;
        }
        if (packetEpoch != epoch) {
            previousEpoch = epoch;
            begin(packetEpoch, sequence);
            inc(RESTARTS);
            inc(RECEIVED);
            return SequenceVerdict.RESTART;
        }
        int d = sequence - highest;
        if (d > 0) {
            staleRun = 0;
            advance(sequence, d);
            inc(RECEIVED);
            if (d == 1) {
                return SequenceVerdict.IN_ORDER;
            }
            lastGap = d - 1;
            inc(GAP_EVENTS);
            add(GAP_PACKETS, d - 1);
            add(MISSING, d - 1);
            return SequenceVerdict.AFTER_GAP;
        }
        long behind = -(long) d;
        if (behind < window) {
            staleRun = 0;
            if (sequence - start < 0) {
                // older than the first packet tracked: never counted missing, so it cannot fill a gap
                inc(STALE);
                return SequenceVerdict.STALE;
            }
            int bit = sequence & mask;
            long m = 1L << (bit & 63);
            if ((seen[bit >>> 6] & m) != 0) {
                inc(DUPLICATES);
                return SequenceVerdict.DUPLICATE;
            }
            seen[bit >>> 6] |= m;
            add(MISSING, -1);
            inc(LATE);
            inc(RECEIVED);
            return SequenceVerdict.LATE;
        }
        if (++staleRun >= resyncAfter) {
            begin(packetEpoch, sequence);
            inc(RESYNCS);
            inc(RECEIVED);
            return SequenceVerdict.RESYNC;
        }
        inc(STALE);
        return SequenceVerdict.STALE;
    }

    private void begin(int packetEpoch, int sequence) {
        started = true;
        epoch = packetEpoch;
        start = sequence;
        highest = sequence;
        staleRun = 0;
        Arrays.fill(seen, 0L);
        mark(sequence);
    }

    private void advance(int sequence, int d) {
        if (d >= window) {
            Arrays.fill(seen, 0L);
        } else {
            for (int s = highest + 1; s != sequence; s++) {
                int bit = s & mask;
                seen[bit >>> 6] &= ~(1L << (bit & 63));
            }
        }
        highest = sequence;
        mark(sequence);
    }

    private void mark(int sequence) {
        int bit = sequence & mask;
        seen[bit >>> 6] |= 1L << (bit & 63);
    }

    private void inc(int i) {
        c.lazySet(i, c.get(i) + 1);
    }

    private void add(int i, long n) {
        c.lazySet(i, c.get(i) + n);
    }

    /** Packets accepted: first, in order, after a gap, late, restart and resync. */
    public long received() {
        return c.get(RECEIVED);
    }

    /** Gaps seen (each a run of one or more missing numbers). */
    public long gapEvents() {
        return c.get(GAP_EVENTS);
    }

    /** Packets counted missing at gaps, before any arrived late. */
    public long gapPackets() {
        return c.get(GAP_PACKETS);
    }

    /** Packets still missing: gap packets less late arrivals. */
    public long lost() {
        return c.get(MISSING);
    }

    public long late() {
        return c.get(LATE);
    }

    public long duplicates() {
        return c.get(DUPLICATES);
    }

    public long stale() {
        return c.get(STALE);
    }

    public long restarts() {
        return c.get(RESTARTS);
    }

    public long resyncs() {
        return c.get(RESYNCS);
    }

    /** Size of the most recent gap, for the log line. */
    int lastGap() {
        return lastGap;
    }

    int epoch() {
        return epoch;
    }

    int previousEpoch() {
        return previousEpoch;
    }

    /** Newest sequence number accepted, as uint32. */
    public long highestSequence() {
        return Integer.toUnsignedLong(highest);
    }
}
