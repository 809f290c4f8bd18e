package org.pointcall.ingest.kafka;

import java.nio.ByteBuffer;

/**
 * Receives the wire packets a {@link KafkaFrameSource} reads, one at a time on the source's thread, in order within
 * each partition (hence within each stream). This is where the wire decoder plugs in.
 */
@FunctionalInterface
public interface PacketHandler {
    /**
     * @param streamId    the record key decoded (see {@link StreamKey})
     * @param packet      the record value, from its position to its limit; valid only during the call (copy what
     *                    you keep); it may be a read-only view into the fetch buffer, so read it with its get
     *                    methods rather than {@code array()}; the handler may move its position
     * @param timestampMs the record's time stamp, milliseconds since the epoch (producer time unless the topic
     *                    uses log-append time)
     * @param partition   partition the record came from
     * @param offset      offset of the record in its partition
     */
    void onPacket(int streamId, ByteBuffer packet, long timestampMs, int partition, long offset);
}
