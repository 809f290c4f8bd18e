package org.pointcall.ingest.window;

/**
 * One time window over a {@link Track}: the samples with time in {@code [t - L, t]}, with O(1) amortised updates.
 * Samples are added as they come; they leave in batches, at decision ticks (or when the shared ring is full), which
 * keeps the removal loop tight.
 *
 * <p>Numerics. Running sums are kept about an anchor (a sample value and a sample time of the window), so a large
 * offset such as an altitude of 1e6 m never reaches the sums of squares, and times stay within a window length of
 * zero. The anchor is re-chosen, and the sums recomputed exactly from the buffer about the newest sample, each time
 * as many samples have left the window as it held at the last recompute: an O(n) pass every n removals, O(1)
 * amortised. Hence the anchor is always a sample of the current window. Adding and later subtracting the same term
 * does not cancel exactly in floating point, and after a large excursion has left the window its rounding errors
 * would swamp a quiet remainder until the next recompute; so the three value-dependent sums also carry their own
 * rounding error (Knuth's TwoSum, branch-free), which leaves only a second-order trace of departed samples. Min and
 * max come from the track's monotonic deques and are exact; a window whose min equals its max is constant, and gets
 * a standard deviation and slope of exactly 0.
 */
final class SlidingWindow {
    final Track track;
    final long lengthNs;
    final int index;
    private final int offset;

    /** First sample in the window; equals the track's next sequence number when the window is empty. */
    long startSeq;
    private int n;
    private double anchorValue;
    private long anchorTimeNs;
    // compensated sums (sum, carried rounding error) of dx, dx^2 and dt dx; plain sums of dt and dt^2
    private double sumX;
    private double errX;
    private double sumXX;
    private double errXX;
    private double sumTX;
    private double errTX;
    private double sumT;
    private double sumTT;
    private long gapSumNs;
    private int removalsSinceAnchor;
    private int countAtAnchor;
    /** Position in the track's min (max) deque of the first entry inside this window. */
    private long minPos;
    private long maxPos;
    int recomputes;

    SlidingWindow(Track track, long lengthNs, int index) {
        this.track = track;
        this.lengthNs = lengthNs;
        this.index = index;
        this.offset = index * Stat.COUNT;
    }

    /**
     * Takes the track's newest sample {@code seq} (time, value, gap before it), already pushed on the deques at
     * {@code newestMinPos} and {@code newestMaxPos}. Entries behind a window's position are older than the window
     * and were not popped, so the window's part of a deque starts at its old position, or at the new sample if the
     * push popped past it.
     */
    void add(long seq, long t, double x, long gap, long newestMinPos, long newestMaxPos) {
        if (n == 0) {
            startSeq = seq;
            anchorValue = x;
            anchorTimeNs = t;
            countAtAnchor = 0;
            removalsSinceAnchor = 0;
        }
        double dx = x - anchorValue;
        double dt = (t - anchorTimeNs) * 1e-9;
        double a = dx;
        double s = sumX;
        double u = s + a;
        double z = u - s;
        errX += (s - (u - z)) + (a - z);
        sumX = u;
        a = dx * dx;
        s = sumXX;
        u = s + a;
        z = u - s;
        errXX += (s - (u - z)) + (a - z);
        sumXX = u;
        a = dt * dx;
        s = sumTX;
        u = s + a;
        z = u - s;
        errTX += (s - (u - z)) + (a - z);
        sumTX = u;
        sumT += dt;
        sumTT += dt * dt;
        gapSumNs += gap;
        n++;
        if (minPos > newestMinPos) {
            minPos = newestMinPos;
        }
        if (maxPos > newestMaxPos) {
            maxPos = newestMaxPos;
        }
    }

    void evictBefore(long cutoffNs) {
        long[] times = track.timesNs;
        int mask = track.mask;
        if (n == 0 || times[(int) (startSeq & mask)] >= cutoffNs) {
            return;
        }
        double[] values = track.values;
        long[] gaps = track.gapNs;
        double x0 = anchorValue;
        long t0 = anchorTimeNs;
        double sx = sumX;
        double ex = errX;
        double sxx = sumXX;
        double exx = errXX;
        double stx = sumTX;
        double etx = errTX;
        double st = sumT;
        double stt = sumTT;
        long gapSum = gapSumNs;
        long seq = startSeq;
        int left = n;
        do {
            int p = (int) (seq & mask);
            double dx = values[p] - x0;
            double dt = (times[p] - t0) * 1e-9;
            double a = -dx;
            double u = sx + a;
            double z = u - sx;
            ex += (sx - (u - z)) + (a - z);
            sx = u;
            a = -(dx * dx);
            u = sxx + a;
            z = u - sxx;
            exx += (sxx - (u - z)) + (a - z);
            sxx = u;
            a = -(dt * dx);
            u = stx + a;
            z = u - stx;
            etx += (stx - (u - z)) + (a - z);
            stx = u;
            st -= dt;
            stt -= dt * dt;
            gapSum -= gaps[p];
            seq++;
            left--;
        } while (left > 0 && times[(int) (seq & mask)] < cutoffNs);
        removalsSinceAnchor += n - left;
        startSeq = seq;
        n = left;
        SeqDeque minQ = track.minQ;
        SeqDeque maxQ = track.maxQ;
        long tail = minQ.tailPos();
        while (minPos < tail && minQ.seqAt(minPos) < seq) {
            minPos++;
        }
        tail = maxQ.tailPos();
        while (maxPos < tail && maxQ.seqAt(maxPos) < seq) {
            maxPos++;
        }
        if (n == 0) {
            clearSums();
            return;
        }
        sumX = sx;
        errX = ex;
        sumXX = sxx;
        errXX = exx;
        sumTX = stx;
        errTX = etx;
        sumT = st;
        sumTT = stt;
        gapSumNs = gapSum;
        if (removalsSinceAnchor >= countAtAnchor) {
            reanchor();
        }
    }

    /**
     * Recomputes the sums from the buffer about the newest sample. The value sums are compensated here too: the
     * window may still hold a large excursion whose rounding would otherwise outlive it.
     */
    private void reanchor() {
        int mask = track.mask;
        double[] values = track.values;
        long[] times = track.timesNs;
        long end = startSeq + n;
        int newest = (int) ((end - 1) & mask);
        double x0 = values[newest];
        long t0 = times[newest];
        double sx = 0;
        double ex = 0;
        double sxx = 0;
        double exx = 0;
        double stx = 0;
        double etx = 0;
        double st = 0;
        double stt = 0;
        for (long s = startSeq; s < end; s++) {
            int p = (int) (s & mask);
            double dx = values[p] - x0;
            double dt = (times[p] - t0) * 1e-9;
            double a = dx;
            double u = sx + a;
            double z = u - sx;
            ex += (sx - (u - z)) + (a - z);
            sx = u;
            a = dx * dx;
            u = sxx + a;
            z = u - sxx;
            exx += (sxx - (u - z)) + (a - z);
            sxx = u;
            a = dt * dx;
            u = stx + a;
            z = u - stx;
            etx += (stx - (u - z)) + (a - z);
            stx = u;
            st += dt;
            stt += dt * dt;
        }
        anchorValue = x0;
        anchorTimeNs = t0;
        sumX = sx;
        errX = ex;
        sumXX = sxx;
        errXX = exx;
        sumTX = stx;
        errTX = etx;
        sumT = st;
        sumTT = stt;
        countAtAnchor = n;
        removalsSinceAnchor = 0;
        recomputes++;
    }

    private void clearSums() {
        sumX = 0;
        errX = 0;
        sumXX = 0;
        errXX = 0;
        sumTX = 0;
        errTX = 0;
        sumT = 0;
        sumTT = 0;
        gapSumNs = 0;
        countAtAnchor = 0;
        removalsSinceAnchor = 0;
    }

    void evaluate(long nowNs, double[] features, boolean[] valid, double[] coverage, int minSamples, boolean keep) {
        long startNs = nowNs - lengthNs;
        evictBefore(startNs);
        int o = offset;
        if (n == 0) {
            valid[index] = false;
            coverage[index] = 0.0;
            fillNaN(features, o);
            return;
        }
        int mask = track.mask;
        double[] values = track.values;
        int first = (int) (startSeq & mask);
        int last = (int) ((startSeq + n - 1) & mask);

        // uncovered time: gaps between samples inside, the part before the first sample when history does not
        // reach back continuously, and the time since the newest sample when it is stale or a flagged gap follows
        long firstGap = track.gapNs[first];
        long uncovered = gapSumNs - firstGap;
        if (firstGap != 0) {
            uncovered += track.timesNs[first] - startNs;
        }
        long staleNs = nowNs - track.lastTimeNs;
        if (track.pendingGap || staleNs > track.maxGapNs) {
            uncovered += staleNs;
        }
        if (uncovered > lengthNs) {
            uncovered = lengthNs;
        }
        boolean ok = uncovered == 0 && n >= minSamples;
        valid[index] = ok;
        coverage[index] = 1.0 - (double) uncovered / lengthNs;
        if (!ok && !keep) {
            fillNaN(features, o);
            return;
        }

        double min = values[(int) (track.minQ.seqAt(minPos) & mask)];
        double max = values[(int) (track.maxQ.seqAt(maxPos) & mask)];
        double mean;
        double std;
        double slope;
        if (min == max) {
            mean = min;
            std = 0.0;
            slope = n >= 2 ? 0.0 : Double.NaN;
        } else {
            // min != max implies n >= 2
            double inv = 1.0 / n;
            double sx = sumX + errX;
            double sxx = sumXX + errXX;
            double stx = sumTX + errTX;
            mean = anchorValue + sx * inv;
            if (mean < min) {
                mean = min;
            } else if (mean > max) {
                mean = max;
            }
            double var = (sxx - sx * sx * inv) / (n - 1);
            std = var > 0 ? Math.sqrt(var) : 0.0;
            double stt = sumTT - sumT * sumT * inv;
            slope = stt > 0 ? (stx - sumT * sx * inv) / stt : Double.NaN;
        }
        features[o + Stat.MEAN.ordinal()] = mean;
        features[o + Stat.STD.ordinal()] = std;
        features[o + Stat.MIN.ordinal()] = min;
        features[o + Stat.MAX.ordinal()] = max;
        features[o + Stat.SLOPE.ordinal()] = slope;
        features[o + Stat.CHANGE.ordinal()] = values[last] - values[first];
    }

    private static void fillNaN(double[] features, int o) {
        for (int i = 0; i < Stat.COUNT; i++) {
            features[o + i] = Double.NaN;
        }
    }

    void reset() {
        startSeq = 0;
        n = 0;
        minPos = 0;
        maxPos = 0;
        clearSums();
    }
}
