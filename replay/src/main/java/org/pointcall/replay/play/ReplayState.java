package org.pointcall.replay.play;

/** Where a replay's transport stands. */
public enum ReplayState {
    PLAYING,
    PAUSED,
    /** The data ran out. */
    ENDED,
    /** Stopped on request. */
    STOPPED
}
