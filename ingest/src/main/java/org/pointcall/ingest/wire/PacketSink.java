package org.pointcall.ingest.wire;

import java.nio.ByteBuffer;

/**
 * Takes encoded packets, one datagram each, between position and limit. The buffer is reused by the encoder: a sink
 * must send or copy it before returning.
 */
@FunctionalInterface
public interface PacketSink {
    void onPacket(ByteBuffer packet);
}
