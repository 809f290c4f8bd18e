package org.pointcall.ui.trace;

/**
 * The screen's own history of one trace: a primitive ring of (time, value) with NaN samples left out, and the
 * min/max envelope that reduces any span to at most two points per pixel column before ChartFX sees it.
 * Used by one thread only (the JavaFX thread).
 */
public final class TraceHistory {
    private final double[] t;
    private final double[] v;
    private final int mask;
    private long count;

    /** @param capacity samples kept, rounded up to a power of two */
    public TraceHistory(int capacity) {
        int cap = Integer.highestOneBit(Math.max(2, capacity) - 1) << 1;
        this.t = new double[cap];
        this.v = new double[cap];
        this.mask = cap - 1;
    }

    public int capacity() {
        return mask + 1;
    }

    /** Adds a sample; NaN values (not sampled in this frame, invalid) are not kept. */
    public void add(double timeS, double value) {
        if (Double.isNaN(value)) {
            return;
        }
        int i = (int) (count & mask);
        t[i] = timeS;
        v[i] = value;
        count++;
    }

    public int size() {
        return (int) Math.min(count, capacity());
    }

    /** Newest value, NaN when empty. */
    public double lastValue() {
        return count == 0 ? Double.NaN : v[(int) ((count - 1) & mask)];
    }

    /** Newest time, NaN when empty. */
    public double lastTime() {
        return count == 0 ? Double.NaN : t[(int) ((count - 1) & mask)];
    }

    public void clear() {
        count = 0;
    }

    /** Index (0 = oldest kept) of the first sample at or after {@code fromS}. */
    private int firstAtOrAfter(double fromS) {
        int n = size();
        long base = count - n;
        int lo = 0;
        int hi = n;
        while (lo < hi) {
            int mid = (lo + hi) >>> 1;
            if (t[(int) ((base + mid) & mask)] < fromS) {
                lo = mid + 1;
            } else {
                hi = mid;
            }
        }
        return lo;
    }

    /**
     * Copies the samples in {@code [fromS, toS]} into {@code x}/{@code y} as they are; returns the count. The
     * arrays must hold every sample of the span (the unreduced path, for the baseline).
     */
    public int copySpan(double fromS, double toS, double[] x, double[] y) {
        int n = size();
        long base = count - n;
        int out = 0;
        for (int k = firstAtOrAfter(fromS); k < n && out < x.length; k++) {
            int i = (int) ((base + k) & mask);
            if (t[i] > toS) {
                break;
            }
            x[out] = t[i];
            y[out] = v[i];
            out++;
        }
        return out;
    }

    /**
     * Min/max envelope of {@code [fromS, toS]} over {@code columns} equal time columns: each column gives its
     * lowest and highest sample, in the order they occurred, so a line through them shows every excursion a
     * pixel could show. Spans with few samples are copied as they are. Returns the number of points written
     * ({@code x} and {@code y} must hold {@code 2 * columns}).
     */
    public int envelope(double fromS, double toS, int columns, double[] x, double[] y) {
        if (columns < 1 || x.length < 2 * columns || y.length < 2 * columns) {
            throw new IllegalArgumentException("envelope needs columns >= 1 and room for 2 points per column");
        }
        int n = size();
        long base = count - n;
        int first = firstAtOrAfter(fromS);
        double width = toS - fromS;
        if (!(width > 0)) {
            return 0;
        }
        int out = 0;
        int col = -1;
        double minV = 0;
        double maxV = 0;
        double minT = 0;
        double maxT = 0;
        for (int k = first; k < n; k++) {
            int i = (int) ((base + k) & mask);
            double ti = t[i];
            if (ti > toS) {
                break;
            }
            int c = (int) ((ti - fromS) / width * columns);
            if (c >= columns) {
                c = columns - 1;
            }
            double vi = v[i];
            if (c != col) {
                if (col >= 0) {
                    out = emit(out, x, y, minT, minV, maxT, maxV);
                }
                col = c;
                minV = vi;
                maxV = vi;
                minT = ti;
                maxT = ti;
            } else if (vi < minV) {
                minV = vi;
                minT = ti;
            } else if (vi > maxV) {
                maxV = vi;
                maxT = ti;
            }
        }
        if (col >= 0) {
            out = emit(out, x, y, minT, minV, maxT, maxV);
        }
        return out;
    }

    private static int emit(int out, double[] x, double[] y, double minT, double minV, double maxT, double maxV) {
        if (minT == maxT) {
            x[out] = minT;
            y[out] = minV;
            return out + 1;
        }
        if (minT < maxT) {
            x[out] = minT;
            y[out] = minV;
            x[out + 1] = maxT;
            y[out + 1] = maxV;
        } else {
            x[out] = maxT;
            y[out] = maxV;
            x[out + 1] = minT;
            y[out + 1] = minV;
        }
        return out + 2;
    }
}
