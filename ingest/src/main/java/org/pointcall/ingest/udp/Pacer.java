package org.pointcall.ingest.udp;

import java.util.concurrent.locks.LockSupport;
import java.util.function.LongSupplier;

/**
 * Holds a steady event rate on an absolute schedule: slot {@code k} falls at {@code start + k / rate}. A late
 * caller is not made to wait, so after a stall the schedule catches up in a burst and the average rate holds.
 * Parks rather than spins, so a paced sender leaves the cores to the receiver (the park overshoot makes small
 * bursts, harmless next to socket buffers).
 */
public final class Pacer {
    private final double intervalNs;
    private final LongSupplier nowNs;
    private boolean started;
    private long startNs;
    private long slot;

    /** @param eventsPerSecond 0 or less: never wait */
    public Pacer(double eventsPerSecond, LongSupplier nowNs) {
        if (Double.isNaN(eventsPerSecond) || Double.isInfinite(eventsPerSecond)) {
            throw new IllegalArgumentException("a pacing rate must be a finite number, got " + eventsPerSecond);
        }
        this.intervalNs = eventsPerSecond > 0 ? 1e9 / eventsPerSecond : 0;
        this.nowNs = nowNs;
    }

    /** Returns when the next slot is due (at once for the first call, or when unpaced). */
    public void awaitNext() {
        if (intervalNs == 0) {
            return;
        }
        if (!started) {
            started = true;
            startNs = nowNs.getAsLong();
            slot = 1;
            return;
        }
        long due = startNs + (long) (slot * intervalNs);
        slot++;
        long wait;
        while ((wait = due - nowNs.getAsLong()) > 0) {
            LockSupport.parkNanos(wait);
        }
    }
}
