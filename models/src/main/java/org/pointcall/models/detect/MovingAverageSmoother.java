package org.pointcall.models.detect;

/**
 * Mean of the ticks inside {@code (t - window, t]}, one running sum per class over a ring of past ticks. The ring
 * doubles when more ticks fall in the window than it holds (warm-up only, at a steady tick rate); the sums are
 * recomputed exactly once per ring turnover so rounding cannot drift.
 */
public final class MovingAverageSmoother implements Smoother {
    private final long windowNs;
    private final double windowS;
    private final int classes;
    private long[] times;
    private double[] values;
    private final double[] sums;
    private int head;
    private int count;
    private int sinceRecompute;
    private int growths;

    public MovingAverageSmoother(double windowS, int classes) {
        if (!(windowS > 0) || Double.isInfinite(windowS)) {
            throw new IllegalArgumentException("moving-average window must be a positive number of seconds, got "
                    + windowS);
        }
        if (classes <= 0) {
            throw new IllegalArgumentException("need at least one class");
        }
        this.windowS = windowS;
        this.windowNs = Math.max(1L, Math.round(windowS * 1e9));
        this.classes = classes;
        this.times = new long[64];
        this.values = new double[64 * classes];
        this.sums = new double[classes];
    }

    @Override
    public void reset() {
        head = 0;
        count = 0;
        java.util.Arrays.fill(sums, 0.0);
    }

    @Override
    public void smooth(long timeNs, double[] raw, double[] out) {
        // drop ticks that left the window
        while (count > 0) {
            int oldest = (head - count + times.length) % times.length;
            if (timeNs - times[oldest] < windowNs) {
                break;
            }
            int base = oldest * classes;
            for (int c = 0; c < classes; c++) {
                sums[c] -= values[base + c];
            }
            count--;
        }
        if (count == times.length) {
            grow();
        }
        int base = head * classes;
        times[head] = timeNs;
        for (int c = 0; c < classes; c++) {
            values[base + c] = raw[c];
            sums[c] += raw[c];
        }
        head = (head + 1) % times.length;
        count++;
        if (++sinceRecompute >= times.length) {
            recompute();
        }
        for (int c = 0; c < classes; c++) {
            out[c] = sums[c] / count;
        }
    }

    private void grow() {
        int cap = times.length;
        long[] t = new long[cap * 2];
        double[] v = new double[cap * 2 * classes];
        for (int i = 0; i < count; i++) {
            int from = (head - count + i + cap) % cap;
            t[i] = times[from];
            System.arraycopy(values, from * classes, v, i * classes, classes);
        }
        times = t;
        values = v;
        head = count;
        growths++;
    }

    private void recompute() {
        java.util.Arrays.fill(sums, 0.0);
        for (int i = 0; i < count; i++) {
            int base = ((head - count + i + times.length) % times.length) * classes;
            for (int c = 0; c < classes; c++) {
                sums[c] += values[base + c];
            }
        }
        sinceRecompute = 0;
    }

    /** Times the ring had to grow; flat after warm-up. */
    public int growths() {
        return growths;
    }

    /**
     * After a step, the share of new ticks in the window grows by one tick per tick; the output passes the threshold
     * once that share exceeds {@code (threshold - from) / (to - from)}, at most that share of the window later.
     */
    @Override
    public double stepDelayS(double from, double to, double threshold) {
        if (from > threshold) {
            return 0.0;
        }
        if (!(to > threshold)) {
            return Double.POSITIVE_INFINITY;
        }
        return windowS * (threshold - from) / (to - from);
    }
}
