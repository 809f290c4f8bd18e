package org.pointcall.replay.record;

import java.util.Objects;

import org.pointcall.ingest.wire.WireFormat;

/**
 * How the recorder writes. The data at risk in a crash is at most the chunk being filled, that is
 * {@code maxChunkAgeNs} of it (or less when the chunk fills first), plus with {@link SyncMode#OS_DECIDES} whatever
 * the operating system has not written back.
 *
 * @param maxChunkBytes   payload size at which a chunk is sealed and written
 * @param maxChunkAgeNs   a chunk is sealed and written at most this long after its first record arrived
 * @param sync            when written chunks are forced to the device
 * @param memoryLimitBytes sealed chunks kept in memory while the disk refuses them; beyond it the oldest go
 * @param retryIntervalNs how often a refused write is tried again
 * @param queuePackets    packets the hand-off queue from the receiver holds
 * @param maxPacketBytes  largest packet taken; longer ones are counted and not recorded
 */
public record RecorderPolicy(int maxChunkBytes, long maxChunkAgeNs, SyncMode sync, long memoryLimitBytes,
                             long retryIntervalNs, int queuePackets, int maxPacketBytes) {
    /** 1 MiB chunks, at most 200 ms old, synced each, 64 MiB held while the disk is full, retried every second. */
    public static final RecorderPolicy DEFAULT = new RecorderPolicy(1 << 20, 200_000_000L, SyncMode.EACH_CHUNK,
            64L << 20, 1_000_000_000L, 8192, WireFormat.DEFAULT_MAX_DATAGRAM_BYTES + 1);

    public RecorderPolicy {
        Objects.requireNonNull(sync, "sync");
        if (maxChunkBytes < 1024 || maxChunkBytes > 32 << 20) {
            throw new IllegalArgumentException("chunk size must be 1 KiB to 32 MiB, got " + maxChunkBytes);
        }
        if (maxChunkAgeNs < 1_000_000L || maxChunkAgeNs > 60_000_000_000L) {
            throw new IllegalArgumentException("chunk age must be 1 ms to 60 s, got " + maxChunkAgeNs + " ns");
        }
        if (memoryLimitBytes < maxChunkBytes) {
            throw new IllegalArgumentException("memory limit must hold at least one chunk (" + maxChunkBytes
                    + " bytes), got " + memoryLimitBytes);
        }
        if (retryIntervalNs < 1_000_000L) {
            throw new IllegalArgumentException("retry interval must be at least 1 ms, got " + retryIntervalNs + " ns");
        }
        if (queuePackets < 2 || maxPacketBytes < 64 || maxPacketBytes > 65_536) {
            throw new IllegalArgumentException("queue must hold at least 2 packets of 64 to 65,536 bytes");
        }
    }

    public RecorderPolicy withMaxChunkBytes(int bytes) {
        return new RecorderPolicy(bytes, maxChunkAgeNs, sync, Math.max(memoryLimitBytes, bytes), retryIntervalNs,
                queuePackets, maxPacketBytes);
    }

    public RecorderPolicy withMaxChunkAgeNs(long ns) {
        return new RecorderPolicy(maxChunkBytes, ns, sync, memoryLimitBytes, retryIntervalNs, queuePackets,
                maxPacketBytes);
    }

    public RecorderPolicy withSync(SyncMode s) {
        return new RecorderPolicy(maxChunkBytes, maxChunkAgeNs, s, memoryLimitBytes, retryIntervalNs, queuePackets,
                maxPacketBytes);
    }

    public RecorderPolicy withMemoryLimitBytes(long bytes) {
        return new RecorderPolicy(maxChunkBytes, maxChunkAgeNs, sync, bytes, retryIntervalNs, queuePackets,
                maxPacketBytes);
    }

    public RecorderPolicy withRetryIntervalNs(long ns) {
        return new RecorderPolicy(maxChunkBytes, maxChunkAgeNs, sync, memoryLimitBytes, ns, queuePackets,
                maxPacketBytes);
    }

    public RecorderPolicy withQueuePackets(int n) {
        return new RecorderPolicy(maxChunkBytes, maxChunkAgeNs, sync, memoryLimitBytes, retryIntervalNs, n,
                maxPacketBytes);
    }
}
