package org.pointcall.ingest.derive;

/**
 * Least-squares slope of the samples of the last {@code spanS} seconds, O(1) per sample and allocation-free.
 *
 * <p>Sums are kept relative to an anchor sample so that nanosecond clocks and large values (altitudes in metres)
 * keep their significant digits; after every {@code capacity} removals the anchor moves to the oldest sample held
 * and the sums are recomputed exactly, so rounding cannot accumulate (amortised O(1)).
 */
final class RunningSlope {
    private final double spanS;
    private final long[] timeNs;
    private final double[] value;
    private final int minSamples;
    private int head;
    private int size;
    private long anchorNs;
    private double anchorValue;
    private double st;
    private double sv;
    private double stt;
    private double stv;
    private int removals;

    RunningSlope(double spanS, int capacity, int minSamples) {
        if (!(spanS > 0) || capacity < 2 || minSamples < 2) {
            throw new IllegalArgumentException("span must be positive, capacity and minimum samples at least 2");
        }
        this.spanS = spanS;
        this.timeNs = new long[capacity];
        this.value = new double[capacity];
        this.minSamples = minSamples;
    }

    /** Adds a sample (NaN is ignored) and drops those older than the span before it. */
    void add(long tNs, double v) {
        if (Double.isNaN(v)) {
            return;
        }
        if (size == 0) {
            anchorNs = tNs;
            anchorValue = v;
        }
        if (size == timeNs.length) {
            removeOldest();
        }
        int i = (head + size) % timeNs.length;
        timeNs[i] = tNs;
        value[i] = v;
        size++;
        accumulate(tNs, v, 1.0);
        long oldestNs = tNs - Math.round(spanS * 1e9);
        while (size > 1 && timeNs[head] < oldestNs) {
            removeOldest();
        }
    }

    private void accumulate(long tNs, double v, double sign) {
        double t = (tNs - anchorNs) * 1e-9;
        double d = v - anchorValue;
        st += sign * t;
        sv += sign * d;
        stt += sign * t * t;
        stv += sign * t * d;
    }

    private void removeOldest() {
        accumulate(timeNs[head], value[head], -1.0);
        head = (head + 1) % timeNs.length;
        size--;
        if (++removals >= timeNs.length) {
            reanchor();
        }
    }

    private void reanchor() {
        removals = 0;
        st = sv = stt = stv = 0;
        if (size == 0) {
            return;
        }
        anchorNs = timeNs[head];
        anchorValue = value[head];
        for (int k = 0; k < size; k++) {
            int i = (head + k) % timeNs.length;
            accumulate(timeNs[i], value[i], 1.0);
        }
    }

    /** Slope in value units per second; NaN with fewer than the minimum samples or no spread in time. */
    double slopePerS() {
        if (size < minSamples) {
            return Double.NaN;
        }
        double n = size;
        double den = n * stt - st * st;
        if (!(den > 1e-12 * n * stt)) {
            return Double.NaN;
        }
        return (n * stv - st * sv) / den;
    }

    /** Newest sample time, or Long.MIN_VALUE when empty. */
    long newestNs() {
        return size == 0 ? Long.MIN_VALUE : timeNs[(head + size - 1) % timeNs.length];
    }

    void reset() {
        head = 0;
        size = 0;
        removals = 0;
        st = sv = stt = stv = 0;
    }
}
