package org.pointcall.ingest.kafka;

import java.nio.ByteBuffer;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * Test packets that carry their stream id, a per-stream sequence number and their own length, with a filler derived
 * from both, and a {@link PacketHandler} that checks them as they arrive: every stream in strict sequence (no loss,
 * no duplicate, no reordering), each stream in one partition, offsets rising within each partition.
 */
final class NumberedPackets implements PacketHandler {
    static final int HEADER = 16;

    private final long[] next;
    private final int[] partitionOfStream;
    private final long[] lastOffset;
    private final List<String> faults = new ArrayList<>();
    private long faultCount;
    private long packets;
    private long bytes;

    NumberedPackets(int streams, int partitions) {
        next = new long[streams];
        partitionOfStream = new int[streams];
        Arrays.fill(partitionOfStream, -1);
        lastOffset = new long[partitions];
        Arrays.fill(lastOffset, -1);
    }

    /** A packet of {@code size} bytes (at least {@value #HEADER}). */
    static byte[] make(int streamId, long seq, int size) {
        byte[] b = new byte[size];
        ByteBuffer w = ByteBuffer.wrap(b);
        w.putInt(streamId).putLong(seq).putInt(size);
        byte f = filler(streamId, seq);
        for (int i = HEADER; i < size; i++) {
            b[i] = f;
        }
        return b;
    }

    /** A size between 200 and 1400 bytes, as real frame packets, spread deterministically over sequence numbers. */
    static int sizeOf(long seq) {
        return 200 + (int) Math.floorMod(seq * 2654435761L, 1201L);
    }

    private static byte filler(int streamId, long seq) {
        return (byte) (seq * 31 + streamId);
    }

    @Override
    public void onPacket(int streamId, ByteBuffer packet, long timestampMs, int partition, long offset) {
        int size = packet.remaining();
        int p = packet.position();
        int id = packet.getInt(p);
        long seq = packet.getLong(p + 4);
        int declared = packet.getInt(p + 12);
        packets++;
        bytes += size;
        if (id != streamId || declared != size || size < HEADER || streamId < 0 || streamId >= next.length) {
            fault("p" + partition + "@" + offset + ": key " + streamId + " carries stream " + id + ", " + size
                    + " bytes for " + declared);
            return;
        }
        if (size > HEADER && packet.get(p + size - 1) != filler(id, seq)) {
            fault("p" + partition + "@" + offset + ": stream " + id + " seq " + seq + " content damaged");
        }
        if (seq != next[id]) {
            fault("p" + partition + "@" + offset + ": stream " + id + " seq " + seq + " where " + next[id]
                    + " was due" + (seq < next[id] ? " (duplicate or reordered)" : " (gap)"));
        }
        next[id] = Math.max(next[id], seq + 1);
        if (partitionOfStream[id] < 0) {
            partitionOfStream[id] = partition;
        } else if (partitionOfStream[id] != partition) {
            fault("stream " + id + " seen in partitions " + partitionOfStream[id] + " and " + partition);
        }
        if (offset <= lastOffset[partition]) {
            fault("p" + partition + ": offset " + offset + " after " + lastOffset[partition]);
        }
        lastOffset[partition] = offset;
    }

    private void fault(String s) {
        faultCount++;
        if (faults.size() < 10) {
            faults.add(s);
        }
    }

    long packets() {
        return packets;
    }

    long bytes() {
        return bytes;
    }

    /** Next sequence number due on each stream: the count received when nothing was lost or doubled. */
    long[] nextDue() {
        return next.clone();
    }

    int partitionOf(int streamId) {
        return partitionOfStream[streamId];
    }

    /** Number of faults and the first ten, for an assertion message. */
    String faultReport() {
        return faultCount + " faults " + faults;
    }

    long faultCount() {
        return faultCount;
    }
}
