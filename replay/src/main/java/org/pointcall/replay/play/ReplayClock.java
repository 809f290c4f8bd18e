package org.pointcall.replay.play;

import java.util.concurrent.locks.LockSupport;

/** The clock a replay is paced on: real time, or a {@link ManualClock} in tests. */
public interface ReplayClock {
    long nowNs();

    /** Waits about {@code ns} (a real clock may wake early or late; the replayer rechecks). */
    void parkNanos(long ns);

    /** {@link System#nanoTime()} and {@link LockSupport#parkNanos(long)}. */
    ReplayClock SYSTEM = new ReplayClock() {
        @Override
        public long nowNs() {
            return System.nanoTime();
        }

        @Override
        public void parkNanos(long ns) {
            LockSupport.parkNanos(ns);
        }
    };
}
