package org.pointcall.replay.play;

import java.util.Locale;

/**
 * The transport of one replay: play, pause, speed, seek, stop. Safe to call from any thread (the console's); the
 * replay thread sees each change before its next packet, or within 20 ms while it waits.
 */
public final class ReplayControl {
    /** As fast as the target takes the packets. */
    public static final double MAX_SPEED = Double.POSITIVE_INFINITY;
    public static final double MIN_PACED = 0.1;
    public static final double MAX_PACED = 100.0;

    private ReplayState state;
    private double speed;
    private boolean seekPending;
    private long seekToNs;
    private int version;
    private volatile long positionNs = Long.MIN_VALUE;
    private volatile long catchUpToNs = Long.MIN_VALUE;

    /** @param speed {@link #MAX_SPEED}, or 0.1 to 100 times real time */
    public ReplayControl(double speed, boolean startPaused) {
        this.speed = checkSpeed(speed);
        this.state = startPaused ? ReplayState.PAUSED : ReplayState.PLAYING;
    }

    /** "max", or a multiple of real time 0.1 to 100 (a trailing 'x' allowed: "20x"). */
    public static double parseSpeed(String text) {
        String s = text.trim().toLowerCase(Locale.ROOT);
        if (s.equals("max")) {
            return MAX_SPEED;
        }
        if (s.endsWith("x")) {
            s = s.substring(0, s.length() - 1);
        }
        double v;
        try {
            v = Double.parseDouble(s);
        } catch (NumberFormatException e) {
            throw new IllegalArgumentException("speed '" + text + "' is not a number: give 0.1 to 100, or max");
        }
        return checkSpeed(v);
    }

    static double checkSpeed(double v) {
        if (v == MAX_SPEED || (v >= MIN_PACED && v <= MAX_PACED)) {
            return v;
        }
        throw new IllegalArgumentException("speed " + v + " is outside 0.1 to 100 times real time (or max)");
    }

    public synchronized void play() {
        if (state == ReplayState.PAUSED) {
            state = ReplayState.PLAYING;
            changed();
        }
    }

    public synchronized void pause() {
        if (state == ReplayState.PLAYING) {
            state = ReplayState.PAUSED;
            changed();
        }
    }

    public synchronized void speed(double x) {
        speed = checkSpeed(x);
        changed();
    }

    /** Goes to archive (or file) time {@code timeNs}: the next packet played is the first at or after it. */
    public synchronized void seek(long timeNs) {
        seekPending = true;
        seekToNs = Math.max(timeNs, Long.MIN_VALUE + 1);
        changed();
    }

    /**
     * Plays every packet before archive time {@code timeNs} as fast as the target takes it, then goes on at the
     * speed asked: a jump that still passes everything in between through the pipeline, so that points, verdicts
     * and alarms on the way are seen as they would have been live. Pausing does not stop a catch-up (the
     * position is reached first, then the replay holds).
     */
    public synchronized void catchUpTo(long timeNs) {
        catchUpToNs = timeNs;
        changed();
    }

    /** Archive time a catch-up is running to, or Long.MIN_VALUE when none runs. */
    public long catchingUpTo() {
        long c = catchUpToNs;
        long p = positionNs;
        return c != Long.MIN_VALUE && (p == Long.MIN_VALUE || p < c) ? c : Long.MIN_VALUE;
    }

    public synchronized void stop() {
        if (state == ReplayState.PLAYING || state == ReplayState.PAUSED) {
            state = ReplayState.STOPPED;
            changed();
        }
    }

    public synchronized ReplayState state() {
        return state;
    }

    public synchronized double speed() {
        return speed;
    }

    /** Data time of the last packet played, or Long.MIN_VALUE before the first. */
    public long positionNs() {
        return positionNs;
    }

    /** Waits until the state is {@code s}; false on time-out. */
    public synchronized boolean awaitState(ReplayState s, long timeoutMs) throws InterruptedException {
        long end = System.nanoTime() + timeoutMs * 1_000_000L;
        while (state != s) {
            long left = end - System.nanoTime();
            if (left <= 0) {
                return false;
            }
            wait(Math.max(1, left / 1_000_000L));
        }
        return true;
    }

    // replay thread side

    synchronized int version() {
        return version;
    }

    /** Waits for a change after {@code seen}, at most {@code timeoutMs}. */
    synchronized void awaitChange(int seen, long timeoutMs) throws InterruptedException {
        if (version == seen) {
            wait(timeoutMs);
        }
    }

    /** The pending seek's target, clearing it, or Long.MIN_VALUE when none is pending. */
    synchronized long takeSeek() {
        if (!seekPending) {
            return Long.MIN_VALUE;
        }
        seekPending = false;
        return seekToNs;
    }

    synchronized boolean seekPending() {
        return seekPending;
    }

    synchronized void ended() {
        if (state != ReplayState.STOPPED) {
            state = ReplayState.ENDED;
            changed();
        }
    }

    void position(long t) {
        positionNs = t;
    }

    private void changed() {
        version++;
        notifyAll();
    }
}
