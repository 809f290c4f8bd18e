package org.pointcall.replay.play;

import java.util.concurrent.atomic.AtomicLong;

/** A clock that moves only when told, or by exactly the time a replay waits: pacing without real time. */
public final class ManualClock implements ReplayClock {
    private final AtomicLong now;

    public ManualClock(long startNs) {
        this.now = new AtomicLong(startNs);
    }

    @Override
    public long nowNs() {
        return now.get();
    }

    /** Moves the clock on by exactly {@code ns} at once. */
    @Override
    public void parkNanos(long ns) {
        if (ns > 0) {
            now.addAndGet(ns);
        }
    }

    public void advance(long ns) {
        parkNanos(ns);
    }
}
