package org.pointcall.ui.trace;

import java.util.concurrent.atomic.AtomicLong;

/**
 * Single-producer, single-consumer ring of samples of a few channels, between the pipeline thread (writer) and the
 * screen (reader). The writer never waits: it overwrites the oldest slot. A reader that fell more than the capacity
 * behind loses the oldest samples, counts them and goes on from the oldest still intact; the pipeline is not
 * slowed by a frozen screen.
 *
 * <p>Allocation-free on both sides: primitive arrays, an index published with an ordered store.
 */
public final class SampleRing {
    /** Called by {@link #drain} per sample; {@code values} holds one value per channel and is reused. */
    @FunctionalInterface
    public interface Reader {
        void onSample(long timeNs, double[] values);
    }

    private final int channels;
    private final int mask;
    private final long[] timeNs;
    private final double[] values;
    private final AtomicLong written = new AtomicLong();
    private final double[] readBuf;
    private long readCursor;
    private long lost;

    /** @param capacity samples held, rounded up to a power of two */
    public SampleRing(int channels, int capacity) {
        if (channels < 1) {
            throw new IllegalArgumentException("a sample ring needs at least one channel");
        }
        if (capacity < 2 || capacity > (1 << 24)) {
            throw new IllegalArgumentException("ring capacity must be 2 to 16M samples, got " + capacity);
        }
        int cap = Integer.highestOneBit(capacity - 1) << 1;
        this.channels = channels;
        this.mask = cap - 1;
        this.timeNs = new long[cap];
        this.values = new double[cap * channels];
        this.readBuf = new double[channels];
    }

    public int channels() {
        return channels;
    }

    public int capacity() {
        return mask + 1;
    }

    /** Writer side. {@code v} holds at least {@link #channels()} values from {@code offset}. */
    public void write(long t, double[] v, int offset) {
        long w = written.get();
        int slot = (int) (w & mask);
        timeNs[slot] = t;
        System.arraycopy(v, offset, values, slot * channels, channels);
        written.lazySet(w + 1);
    }

    /** Writer side: the slot values are given by index into a frame's values. */
    public void write(long t, double[] frameValues, int[] slots) {
        long w = written.get();
        int slot = (int) (w & mask);
        timeNs[slot] = t;
        int base = slot * channels;
        for (int c = 0; c < channels; c++) {
            values[base + c] = frameValues[slots[c]];
        }
        written.lazySet(w + 1);
    }

    /**
     * Writer side: channel 0 gets {@code tag}, channel {@code c + 1} the frame value at {@code slots[c]} (NaN for a
     * slot below 0).
     */
    public void write(long t, double tag, double[] frameValues, int[] slots) {
        long w = written.get();
        int slot = (int) (w & mask);
        timeNs[slot] = t;
        int base = slot * channels;
        values[base] = tag;
        for (int c = 1; c < channels; c++) {
            int s = slots[c - 1];
            values[base + c] = s < 0 ? Double.NaN : frameValues[s];
        }
        written.lazySet(w + 1);
    }

    /** Samples written so far. */
    public long written() {
        return written.get();
    }

    /** Reader side: samples the reader lost because it fell more than a ring behind. */
    public long lost() {
        return lost;
    }

    /**
     * Reader side: hands every sample written since the last drain to {@code reader}, oldest first, at most
     * {@code max}; returns how many. Samples the writer may have overwritten while they were read are not handed
     * on, and count as lost.
     */
    public int drain(Reader reader, int max) {
        long w = written.get();
        long oldestSafe = w - capacity() + 1;
        if (readCursor < oldestSafe) {
            lost += oldestSafe - readCursor;
            readCursor = oldestSafe;
        }
        int n = 0;
        while (readCursor < w && n < max) {
            int slot = (int) (readCursor & mask);
            long t = timeNs[slot];
            System.arraycopy(values, slot * channels, readBuf, 0, channels);
            // the writer may have lapped this slot while it was copied: then the copy is torn, skip it
            if (written.get() - readCursor >= capacity()) {
                long now = written.get() - capacity() + 1;
                lost += now - readCursor;
                readCursor = now;
                continue;
            }
            readCursor++;
            n++;
            reader.onSample(t, readBuf);
        }
        return n;
    }
}
