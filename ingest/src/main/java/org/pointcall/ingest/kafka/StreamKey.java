package org.pointcall.ingest.kafka;

/**
 * Record key of the frames and events topics: the stream id as a 4-byte big-endian int (network order, the same
 * bytes as Kafka's own {@code IntegerSerializer}), so Kafka's partitioner puts each stream in one partition.
 */
public final class StreamKey {
    /** Bytes of a key. */
    public static final int LENGTH = 4;

    /** Keys of the low stream ids are shared: the producer never changes a key, and most streams have small ids. */
    private static final byte[][] CACHE = new byte[1024][];

    static {
        for (int i = 0; i < CACHE.length; i++) {
            CACHE[i] = encode(i);
        }
    }

    private StreamKey() {
    }

    /** The key of {@code streamId}; callers must not change the array (low ids return a shared one). */
    public static byte[] bytes(int streamId) {
        return streamId >= 0 && streamId < CACHE.length ? CACHE[streamId] : encode(streamId);
    }

    private static byte[] encode(int id) {
        return new byte[] {(byte) (id >>> 24), (byte) (id >>> 16), (byte) (id >>> 8), (byte) id};
    }
}
