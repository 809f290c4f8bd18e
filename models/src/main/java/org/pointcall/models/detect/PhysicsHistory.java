package org.pointcall.models.detect;

import java.util.Arrays;

/**
 * The recent physical states at a fixed rate, for the boundary rules that place a point's begin and end from the
 * physics once the classifier has found it ({@link BoundaryRefiner}). A frame is kept when it is at least one step
 * after the last one kept, with the latest value of every quantity (NaN when never sampled), so a faster stream costs
 * no more; a ring of {@link #CAPACITY} slots, allocated once.
 */
final class PhysicsHistory {
    /** Step between kept states, ns (20 Hz). */
    static final long STEP_NS = 50_000_000L;
    /** Slots: 240 s at 20 Hz, enough for the longest level acceleration's begin to be still there at its end. */
    static final int CAPACITY = 4800;

    private final long[] times = new long[CAPACITY];
    private final double[] values = new double[CAPACITY * PhysicalQuantity.COUNT];
    private int next;
    private int size;
    private long lastNs = PointEvent.UNKNOWN_NS;

    void clear() {
        next = 0;
        size = 0;
        lastNs = PointEvent.UNKNOWN_NS;
        Arrays.fill(times, PointEvent.UNKNOWN_NS);
    }

    /** Keeps the state when it is a step after the last one kept. */
    void add(PhysicalState s) {
        long t = s.timeNs();
        if (lastNs != PointEvent.UNKNOWN_NS && t - lastNs < STEP_NS) {
            return;
        }
        lastNs = t;
        times[next] = t;
        int o = next * PhysicalQuantity.COUNT;
        for (PhysicalQuantity q : QUANTITIES) {
            values[o + q.ordinal()] = s.value(q);
        }
        next = (next + 1) % CAPACITY;
        if (size < CAPACITY) {
            size++;
        }
    }

    private static final PhysicalQuantity[] QUANTITIES = PhysicalQuantity.values();

    /** States kept, at most {@link #CAPACITY}. */
    int size() {
        return size;
    }

    private int slot(int i) {
        return (next - size + i + CAPACITY) % CAPACITY;
    }

    /** Time of the {@code i}-th state kept, oldest first. */
    long timeNs(int i) {
        return times[slot(i)];
    }

    /** Value of {@code q} in the {@code i}-th state kept, SI. */
    double value(int i, PhysicalQuantity q) {
        return values[slot(i) * PhysicalQuantity.COUNT + q.ordinal()];
    }

    /** Index of the first state kept at or after {@code tNs}; {@link #size()} when none. */
    int indexAtOrAfter(long tNs) {
        int lo = 0;
        int hi = size;
        while (lo < hi) {
            int mid = (lo + hi) >>> 1;
            if (timeNs(mid) < tNs) {
                lo = mid + 1;
            } else {
                hi = mid;
            }
        }
        return lo;
    }
}
