package org.pointcall.replay.play;

import java.nio.ByteBuffer;

/** Where replayed packets go: see {@link ReplayTargets}. Called on the replay thread. */
public interface ReplayTarget extends AutoCloseable {
    /** One wire packet between position and limit, valid during the call. */
    void onPacket(ByteBuffer packet, long dataTimeNs);

    /** Called when the replay ends or pauses, so nothing waits in a batch. */
    default void flush() {
    }

    @Override
    default void close() {
    }
}
