package org.pointcall.ingest.frame;

import java.util.Arrays;

import org.pointcall.shared.dictionary.ParameterDictionary;

/**
 * One time instant of a stream: time on the stream's clock, a sequence number, one value per dictionary slot (NaN
 * when the parameter was not sampled at this instant or is invalid) and frame-level quality flags.
 *
 * <p>Mutable on purpose: sources fill one instance per stream and hand it to a {@link FrameSink}, so the hot path
 * allocates nothing. A sink that keeps a frame beyond its callback must {@link #copyFrom copy} it.
 */
public final class Frame {
    /** A sequence gap (lost frames or packets) lies immediately before this frame. */
    public static final int GAP_BEFORE = 1;
    /** At least one value was rejected as a wild point (outside its valid range) and set to NaN. */
    public static final int WILD_POINT = 1 << 1;
    /** Time went backwards or repeated at this frame; the frame is kept but its time is suspect. */
    public static final int TIME_SUSPECT = 1 << 2;
    /** The frame came from a simulator or replay, not from a live aircraft. */
    public static final int SYNTHETIC = 1 << 3;
    /** Part of the frame was lost in transport: those slots are NaN, the rest is as sent. */
    public static final int PARTS_MISSING = 1 << 4;

    private final double[] values;
    private long timeNs;
    private long sequence;
    private int flags;

    public Frame(int slots) {
        if (slots <= 0) {
            throw new IllegalArgumentException("a frame needs at least one slot");
        }
        this.values = new double[slots];
        Arrays.fill(values, Double.NaN);
    }

    public static Frame forDictionary(ParameterDictionary dictionary) {
        return new Frame(dictionary.size());
    }

    public int slots() {
        return values.length;
    }

    public long timeNs() {
        return timeNs;
    }

    public void timeNs(long t) {
        this.timeNs = t;
    }

    public long sequence() {
        return sequence;
    }

    public void sequence(long s) {
        this.sequence = s;
    }

    public int flags() {
        return flags;
    }

    public void flags(int f) {
        this.flags = f;
    }

    public void addFlags(int f) {
        this.flags |= f;
    }

    public boolean hasFlag(int f) {
        return (flags & f) != 0;
    }

    public double value(int slot) {
        return values[slot];
    }

    public void value(int slot, double v) {
        values[slot] = v;
    }

    /** Direct access to the value array for bulk decode; the array is owned by this frame. */
    public double[] values() {
        return values;
    }

    /** Sets every value to NaN and clears the flags, ready for the next instant. */
    public void clear() {
        Arrays.fill(values, Double.NaN);
        flags = 0;
    }

    public void copyFrom(Frame other) {
        if (other.values.length != values.length) {
            throw new IllegalArgumentException("frame slot counts differ: " + other.values.length + " vs "
                    + values.length);
        }
        System.arraycopy(other.values, 0, values, 0, values.length);
        timeNs = other.timeNs;
        sequence = other.sequence;
        flags = other.flags;
    }

    public Frame copy() {
        Frame f = new Frame(values.length);
        f.copyFrom(this);
        return f;
    }
}
