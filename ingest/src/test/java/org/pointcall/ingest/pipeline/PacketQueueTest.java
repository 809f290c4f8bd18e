package org.pointcall.ingest.pipeline;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.ByteBuffer;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicLong;

import org.junit.jupiter.api.Test;

class PacketQueueTest {

    @Test
    void everyPacketOfferedIsEitherDeliveredInOrderOrCountedAsDropped() throws Exception {
        PacketQueue q = new PacketQueue(64, 16);
        long total = 500_000;
        AtomicLong delivered = new AtomicLong();
        AtomicLong lastSeq = new AtomicLong(-1);
        AtomicLong outOfOrder = new AtomicLong();
        AtomicLong corrupt = new AtomicLong();
        AtomicBoolean done = new AtomicBoolean();
        Thread consumer = new Thread(() -> {
            PacketQueue.Handler h = (buf, arrival, tag) -> {
                long seq = buf.getLong(0);
                if (seq != arrival || seq != tag || buf.getLong(8) != ~seq) {
                    corrupt.incrementAndGet();
                }
                if (seq <= lastSeq.get()) {
                    outOfOrder.incrementAndGet();
                }
                lastSeq.set(seq);
                delivered.incrementAndGet();
                if ((seq & 1023) == 0) {
                    Thread.onSpinWait(); // uneven consumer pace so that the queue fills at times
                }
            };
            while (!done.get() || q.depth() > 0) {
                if (q.drain(h, 32) == 0) {
                    Thread.onSpinWait();
                }
            }
        });
        consumer.start();
        ByteBuffer b = ByteBuffer.allocate(16);
        long accepted = 0;
        for (long s = 0; s < total; s++) {
            b.clear();
            b.putLong(s).putLong(~s).flip();
            if (q.offer(b, s, s)) {
                accepted++;
            }
            assertEquals(0, b.position(), "offer must not move the caller's buffer");
        }
        done.set(true);
        consumer.join(30_000);
        assertEquals(0, corrupt.get(), "slot contents must arrive as written");
        assertEquals(0, outOfOrder.get(), "a single consumer sees the producer's order");
        assertEquals(accepted, delivered.get());
        assertEquals(total, delivered.get() + q.droppedFull(), "nothing lost without a counter");
        assertTrue(q.highWater() <= q.capacity());
    }

    @Test
    void fullQueueRefusesAndCountsWithoutBlocking() {
        PacketQueue q = new PacketQueue(4, 8);
        ByteBuffer b = ByteBuffer.allocate(8);
        for (int i = 0; i < 4; i++) {
            assertTrue(q.offer(b, i, i));
        }
        assertFalse(q.offer(b, 9, 9));
        assertEquals(1, q.droppedFull());
        assertEquals(4, q.drain((buf, a, t) -> { }, 100));
        assertTrue(q.offer(b, 10, 10));
    }

    @Test
    void oversizePacketIsCountedApart() {
        PacketQueue q = new PacketQueue(4, 8);
        assertFalse(q.offer(ByteBuffer.allocate(9), 0, 0));
        assertEquals(1, q.droppedOversize());
        assertEquals(0, q.droppedFull());
    }

    @Test
    void capacityRoundsUpToAPowerOfTwo() {
        assertEquals(8, new PacketQueue(5, 1).capacity());
        assertEquals(4, new PacketQueue(4, 1).capacity());
    }
}
