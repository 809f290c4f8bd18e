package org.pointcall.replay.play;

import java.nio.ByteBuffer;

/**
 * Plays a source into a target, paced on a clock: packet {@code k} goes out when the clock has moved on from the
 * anchor by its data time's distance from the anchor divided by the speed. The anchor is set at the first packet
 * and again after every pause, speed change and seek, so a change never makes the replay rush or stall to catch
 * up. At {@link ReplayControl#MAX_SPEED} nothing waits. Runs on the caller's thread; steer it through its
 * {@link ReplayControl} from any other.
 */
public final class Replayer {
    /** Longest single wait, so that the transport is seen promptly. */
    private static final long SLICE_NS = 20_000_000L;

    private final ReplaySource source;
    private final ReplayTarget target;
    private final ReplayClock clock;
    private final ReplayControl control;

    private int seenVersion = -1;
    private double speed;
    private boolean anchored;
    private long anchorDataNs;
    private long anchorClockNs;
    private long lastDataNs = Long.MIN_VALUE;
    private long packets;
    private long bytes;
    private long firstDataNs = Long.MIN_VALUE;
    private long firstClockNs;
    private long lastClockNs;
    private int seeks;
    private boolean abort;

    public Replayer(ReplaySource source, ReplayTarget target, ReplayClock clock, ReplayControl control) {
        this.source = source;
        this.target = target;
        this.clock = clock;
        this.control = control;
    }

    public ReplayControl control() {
        return control;
    }

    /** Plays until the data ends or the control stops it; flushes the target (it does not close it). */
    public ReplaySummary run() {
        long from = control.takeSeek();
        if (from != Long.MIN_VALUE) {
            seeks++;
        }
        PacketEmitter emit = this::emit;
        while (true) {
            abort = false;
            anchored = false;
            source.play(from, emit);
            long next = control.takeSeek();
            if (next != Long.MIN_VALUE && control.state() != ReplayState.STOPPED) {
                from = next;
                seeks++;
                target.flush();
                continue;
            }
            break;
        }
        target.flush();
        boolean stopped = control.state() == ReplayState.STOPPED;
        control.ended();
        return new ReplaySummary(packets, bytes, firstDataNs, lastDataNs, packets == 0 ? 0 : lastClockNs - firstClockNs,
                seeks, stopped);
    }

    private boolean emit(ByteBuffer packet, long dataNs) {
        if (abort || !waitFor(dataNs)) {
            abort = true;
            return false;
        }
        int len = packet.remaining();
        long now = clock.nowNs(); // the release instant: what a slow first send costs is not timing
        target.onPacket(packet, dataNs);
        if (packets == 0) {
            firstDataNs = dataNs;
            firstClockNs = now;
        }
        packets++;
        bytes += len;
        lastDataNs = dataNs;
        lastClockNs = now;
        control.position(dataNs);
        return true;
    }

    /** Waits until {@code dataNs} is due; false when a seek or stop means this packet is not to be played. */
    private boolean waitFor(long dataNs) {
        long catchUp = control.catchingUpTo();
        if (catchUp != Long.MIN_VALUE && dataNs < catchUp) {
            if (control.state() == ReplayState.STOPPED || control.seekPending()) {
                return false;
            }
            anchored = false; // paced play starts again from the packet that ends the catch-up
            return true;
        }
        while (true) {
            if (control.version() != seenVersion && !transportChanged()) {
                return false;
            }
            if (speed == ReplayControl.MAX_SPEED) {
                return true;
            }
            long now = clock.nowNs();
            if (!anchored) {
                anchored = true;
                anchorDataNs = dataNs;
                anchorClockNs = now;
                return true;
            }
            long due = anchorClockNs + (long) ((dataNs - anchorDataNs) / speed);
            long wait = due - now;
            if (wait <= 0) {
                return true;
            }
            clock.parkNanos(Math.min(wait, SLICE_NS));
        }
    }

    /** Takes in a transport change; false when the current pass must end (seek or stop). */
    private boolean transportChanged() {
        while (true) {
            int v = control.version();
            ReplayState s = control.state();
            if (s == ReplayState.STOPPED || control.seekPending()) {
                seenVersion = v;
                return false;
            }
            double newSpeed = control.speed();
            if (anchored && newSpeed != speed && lastDataNs != Long.MIN_VALUE) {
                anchorDataNs = lastDataNs;
                anchorClockNs = clock.nowNs();
            }
            speed = newSpeed;
            seenVersion = v;
            if (s != ReplayState.PAUSED) {
                return true;
            }
            target.flush();
            try {
                control.awaitChange(v, 50);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                control.stop();
            }
            if (control.version() != v) {
                // resumed, or changed again: take the new state; a resume re-anchors at the current position
                anchored = anchored && lastDataNs != Long.MIN_VALUE;
                if (anchored) {
                    anchorDataNs = lastDataNs;
                    anchorClockNs = clock.nowNs();
                }
            }
        }
    }
}
