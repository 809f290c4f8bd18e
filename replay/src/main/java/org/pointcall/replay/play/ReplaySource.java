package org.pointcall.replay.play;

/** Something that can be played from a point in its time line, packet by packet. */
public interface ReplaySource {
    /** Plays from data time {@code fromNs} (Long.MIN_VALUE: the start) until the end or the emitter says stop. */
    void play(long fromNs, PacketEmitter emitter);

    /** What is played, for messages. */
    String name();
}
