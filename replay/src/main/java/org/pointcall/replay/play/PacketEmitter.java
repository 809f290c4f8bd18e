package org.pointcall.replay.play;

import java.nio.ByteBuffer;

/** What a source hands each packet to, in data order. */
@FunctionalInterface
public interface PacketEmitter {
    /**
     * @param packet     one wire packet between position and limit, valid during the call
     * @param dataTimeNs its place on the data's time line (arrival time for an archive, frame time for a file)
     * @return false to stop the source (a seek or a stop)
     */
    boolean emit(ByteBuffer packet, long dataTimeNs);
}
