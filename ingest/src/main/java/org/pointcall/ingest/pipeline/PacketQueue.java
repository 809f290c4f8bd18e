package org.pointcall.ingest.pipeline;

import java.nio.ByteBuffer;
import java.util.concurrent.atomic.AtomicLong;

/**
 * Bounded single-producer, single-consumer hand-off of packets between two threads (a receiver and a pipeline, or
 * a pipeline and the recorder), with every slot's buffer allocated up front.
 *
 * <p>Back-pressure is a return value: {@link #offer} returns {@code false} when the queue is full and counts the
 * packet as dropped; the producer never waits. Packets larger than a slot are refused and counted separately.
 */
public final class PacketQueue {
    /** Receives one packet; the buffer is only valid during the call. */
    @FunctionalInterface
    public interface Handler {
        void onPacket(ByteBuffer packet, long arrivalNs, long tag);
    }

    private final byte[][] slots;
    private final int[] lengths;
    private final long[] arrivalNs;
    private final long[] tags;
    private final ByteBuffer[] views;
    private final int mask;
    private final int slotBytes;
    /** Next slot the consumer reads; written only by the consumer. */
    private final AtomicLong head = new AtomicLong();
    /** Next slot the producer writes; written only by the producer. */
    private final AtomicLong tail = new AtomicLong();
    private final AtomicLong dropped = new AtomicLong();
    private final AtomicLong oversize = new AtomicLong();
    private volatile long highWater;

    /**
     * @param capacity  number of packets held, rounded up to a power of two
     * @param slotBytes largest packet accepted
     */
    public PacketQueue(int capacity, int slotBytes) {
        if (capacity < 2 || slotBytes < 1) {
            throw new IllegalArgumentException("capacity must be at least 2 and slots at least 1 byte");
        }
        int cap = Integer.highestOneBit(capacity - 1) << 1;
        this.slots = new byte[cap][slotBytes];
        this.lengths = new int[cap];
        this.arrivalNs = new long[cap];
        this.tags = new long[cap];
        this.views = new ByteBuffer[cap];
        for (int i = 0; i < cap; i++) {
            views[i] = ByteBuffer.wrap(slots[i]);
        }
        this.mask = cap - 1;
        this.slotBytes = slotBytes;
    }

    /**
     * Copies the remaining bytes of {@code packet} into the queue (its position is not moved). Producer thread only.
     *
     * @return false when the queue was full or the packet too large; either is counted
     */
    public boolean offer(ByteBuffer packet, long arrivalTimeNs, long tag) {
        int len = packet.remaining();
        if (len > slotBytes) {
            oversize.incrementAndGet();
            return false;
        }
        long t = tail.get();
        long depth = t - head.get();
        if (depth >= slots.length) {
            dropped.incrementAndGet();
            return false;
        }
        int i = (int) (t & mask);
        packet.get(packet.position(), slots[i], 0, len);
        lengths[i] = len;
        arrivalNs[i] = arrivalTimeNs;
        tags[i] = tag;
        tail.lazySet(t + 1);
        if (depth + 1 > highWater) {
            highWater = depth + 1;
        }
        return true;
    }

    /**
     * Hands up to {@code limit} packets to {@code handler}. Consumer thread only.
     *
     * @return the number of packets handled (0 when empty), so a caller's idle strategy can back off
     */
    public int drain(Handler handler, int limit) {
        long h = head.get();
        long available = tail.get() - h;
        int n = (int) Math.min(available, limit);
        for (int k = 0; k < n; k++) {
            int i = (int) ((h + k) & mask);
            ByteBuffer view = views[i];
            view.clear().limit(lengths[i]);
            try {
                handler.onPacket(view, arrivalNs[i], tags[i]);
            } finally {
                head.lazySet(h + k + 1);
            }
        }
        return n;
    }

    public int capacity() {
        return slots.length;
    }

    /** Packets waiting; a snapshot that may be stale by the time it is read. */
    public int depth() {
        return (int) (tail.get() - head.get());
    }

    public long droppedFull() {
        return dropped.get();
    }

    public long droppedOversize() {
        return oversize.get();
    }

    /** Deepest the queue has been since it was made. */
    public long highWater() {
        return highWater;
    }
}
