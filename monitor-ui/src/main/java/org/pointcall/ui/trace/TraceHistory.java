package org.pointcall.ui.trace;

/**
 * The screen's own history of one trace: a primitive ring of (time, value) with NaN samples left out, and the
 * min/max envelope that reduces any span to at most two points per pixel column before ChartFX sees it, kept
 * from one redraw to the next.
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

    /** Samples ever added (NaN left out): changes whenever the trace has something new. */
    public long added() {
        return count;
    }

    public void clear() {
        count = 0;
        binWidth = Double.NaN;
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
     * Min/max envelope of {@code [fromS, toS]}: time is cut into bins of {@code (toS - fromS) / columns} seconds
     * anchored at time zero (bin {@code b} holds {@code b * w <= t < (b + 1) * w}), and each bin that overlaps the
     * span and holds samples at or before {@code toS} gives its lowest and highest sample, in the order they
     * occurred, so a line through them shows every excursion a pixel could show. Because the bins do not move with
     * the span, a trace that scrolls keeps its shape from one redraw to the next, and a bin, once past, is kept and
     * not scanned again: a call costs the samples added since the last call plus the bins in view. Returns the
     * number of points written ({@code x} and {@code y} must hold {@code 2 * columns + 2}: the span may touch
     * {@code columns + 1} bins).
     */
    public int envelope(double fromS, double toS, int columns, double[] x, double[] y) {
        if (columns < 1 || x.length < 2 * columns + 2 || y.length < 2 * columns + 2) {
            throw new IllegalArgumentException("envelope needs columns >= 1 and room for 2 points per column, + 2");
        }
        double width = toS - fromS;
        if (!(width > 0)) {
            return 0;
        }
        double w = width / columns;
        long firstBin = (long) Math.floor(fromS / w);
        long lastInView = (long) Math.floor(toS / w);
        if (w != binWidth || toS < foldedToS || bins == null || bins.length < 2 * columns + 8) {
            resetBins(w, columns, firstBin * w);
        }
        fold(toS);
        if (lastBin == Long.MIN_VALUE) {
            return 0;
        }
        int out = 0;
        long from = Math.max(firstBin, lastBin - binMask);
        long to = Math.min(lastBin, lastInView);
        for (long b = from; b <= to; b++) {
            int s = (int) (b & binMask);
            if (bins[s] == b) {
                out = emit(out, x, y, binMinT[s], binMinV[s], binMaxT[s], binMaxV[s]);
            }
        }
        return out;
    }

    /** Bins of the envelope: a ring keyed by bin number, the newest bin still open. */
    private double binWidth = Double.NaN;
    private long[] bins;
    private double[] binMinT;
    private double[] binMinV;
    private double[] binMaxT;
    private double[] binMaxV;
    private int binMask;
    private long lastBin = Long.MIN_VALUE;
    /** Samples before this count are in the bins. */
    private long folded;
    private double foldedToS = Double.NEGATIVE_INFINITY;

    private void resetBins(double w, int columns, double fromS) {
        int cap = Integer.highestOneBit(2 * columns + 8 - 1) << 1;
        if (bins == null || bins.length != cap) {
            bins = new long[cap];
            binMinT = new double[cap];
            binMinV = new double[cap];
            binMaxT = new double[cap];
            binMaxV = new double[cap];
        }
        java.util.Arrays.fill(bins, Long.MIN_VALUE);
        binMask = cap - 1;
        binWidth = w;
        lastBin = Long.MIN_VALUE;
        int n = size();
        folded = count - n + firstAtOrAfter(fromS);
        foldedToS = Double.NEGATIVE_INFINITY;
    }

    /** Puts the samples added since the last call, up to {@code toS}, into their bins. */
    private void fold(double toS) {
        long oldest = count - size();
        if (folded < oldest) {
            folded = oldest; // the ring overwrote samples the screen had not drawn yet
        }
        for (; folded < count; folded++) {
            int i = (int) (folded & mask);
            double ti = t[i];
            if (ti > toS) {
                break;
            }
            double vi = v[i];
            long b = (long) Math.floor(ti / binWidth);
            int s = (int) (b & binMask);
            if (b > lastBin) {
                lastBin = b;
                bins[s] = b;
                binMinT[s] = ti;
                binMinV[s] = vi;
                binMaxT[s] = ti;
                binMaxV[s] = vi;
            } else if (b == lastBin) {
                if (vi < binMinV[s]) {
                    binMinV[s] = vi;
                    binMinT[s] = ti;
                } else if (vi > binMaxV[s]) {
                    binMaxV[s] = vi;
                    binMaxT[s] = ti;
                }
            }
            // a sample older than the open bin (time went back without a clear) is left out of the envelope
        }
        foldedToS = toS;
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
