package org.pointcall.ingest.window;

import java.util.Arrays;

import org.apache.commons.math3.stat.descriptive.DescriptiveStatistics;
import org.apache.commons.math3.stat.regression.SimpleRegression;
import org.pointcall.ingest.frame.Frame;

/**
 * Test-side reference for the window features: keeps every sample of every selected parameter and recomputes each
 * window from scratch, straight from the definitions, at every tick. Independent of the extractor's code: no ring,
 * no running sums, no deques, coverage as the measure of the covered part of {@code [T - L, T]}.
 */
final class WindowReference {
    /** One window's expected values. */
    record Expected(int n, double mean, double std, double min, double max, double slope, double change,
                    double coverage, boolean valid, int from, int to) {
        double range() {
            return max - min;
        }
    }

    private final int[] slots;
    private final long[] maxGapNs;
    private final long[][] times;
    private final double[][] values;
    private final int[] counts;
    private long[] gapFrameTimes = new long[16];
    private int gapFrames;

    WindowReference(int[] slots, long[] maxGapNs) {
        this.slots = slots.clone();
        this.maxGapNs = maxGapNs.clone();
        times = new long[slots.length][1024];
        values = new double[slots.length][1024];
        counts = new int[slots.length];
    }

    /** Records a frame the extractor is about to accept (strictly later than the previous one). */
    void record(Frame f) {
        if (f.hasFlag(Frame.GAP_BEFORE)) {
            if (gapFrames == gapFrameTimes.length) {
                gapFrameTimes = Arrays.copyOf(gapFrameTimes, gapFrames * 2);
            }
            gapFrameTimes[gapFrames++] = f.timeNs();
        }
        for (int p = 0; p < slots.length; p++) {
            double x = f.value(slots[p]);
            if (Double.isNaN(x) || Double.isInfinite(x)) {
                continue;
            }
            if (counts[p] == times[p].length) {
                times[p] = Arrays.copyOf(times[p], counts[p] * 2);
                values[p] = Arrays.copyOf(values[p], counts[p] * 2);
            }
            times[p][counts[p]] = f.timeNs();
            values[p][counts[p]] = x;
            counts[p]++;
        }
    }

    /** True when a frame flagged GAP_BEFORE has a time in (a, b]. */
    private boolean gapFrameIn(long a, long b) {
        int i = Arrays.binarySearch(gapFrameTimes, 0, gapFrames, a + 1);
        if (i < 0) {
            i = -i - 1;
        }
        return i < gapFrames && gapFrameTimes[i] <= b;
    }

    private boolean continuous(int p, long a, long b) {
        return b - a <= maxGapNs[p] && !gapFrameIn(a, b);
    }

    Expected expected(int p, long nowNs, long lengthNs, int minSamples) {
        long[] t = times[p];
        double[] x = values[p];
        long startNs = nowNs - lengthNs;
        int from = lowerBound(t, counts[p], startNs);
        int to = lowerBound(t, counts[p], nowNs + 1);
        int n = to - from;
        if (n == 0) {
            return new Expected(0, Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN, 0.0,
                    false, from, to);
        }
        long covered = 0;
        if (from > 0 && continuous(p, t[from - 1], t[from])) {
            covered += t[from] - startNs;
        }
        for (int i = from; i + 1 < to; i++) {
            if (continuous(p, t[i], t[i + 1])) {
                covered += t[i + 1] - t[i];
            }
        }
        long last = t[to - 1];
        if (nowNs - last <= maxGapNs[p] && !gapFrameIn(last, nowNs)) {
            covered += nowNs - last;
        }
        long uncovered = Math.min(lengthNs, Math.max(0, lengthNs - covered));
        double coverage = 1.0 - (double) uncovered / lengthNs;
        boolean valid = uncovered == 0 && n >= minSamples;

        double min = Double.POSITIVE_INFINITY;
        double max = Double.NEGATIVE_INFINITY;
        double sum = 0;
        for (int i = from; i < to; i++) {
            min = Math.min(min, x[i]);
            max = Math.max(max, x[i]);
            sum += x[i];
        }
        // two-pass mean with correction: the plain sum of 8,000 values near 1e6 would carry errors of ~1e-8
        double mean = sum / n;
        double corr = 0;
        for (int i = from; i < to; i++) {
            corr += x[i] - mean;
        }
        mean += corr / n;
        double ss = 0;
        double tMean = 0;
        for (int i = from; i < to; i++) {
            ss += (x[i] - mean) * (x[i] - mean);
            tMean += (t[i] - t[from]) * 1e-9;
        }
        tMean /= n;
        double std = n > 1 ? Math.sqrt(ss / (n - 1)) : 0.0;
        double stt = 0;
        double stx = 0;
        for (int i = from; i < to; i++) {
            double dt = (t[i] - t[from]) * 1e-9 - tMean;
            stt += dt * dt;
            stx += dt * (x[i] - mean);
        }
        double slope = n > 1 ? stx / stt : Double.NaN;
        return new Expected(n, mean, std, min, max, slope, x[to - 1] - x[from], coverage, valid, from, to);
    }

    /** The same window through Apache Commons Math 3.6.1 (DescriptiveStatistics, SimpleRegression). */
    Expected commons(int p, Expected e) {
        long[] t = times[p];
        double[] x = values[p];
        DescriptiveStatistics ds = new DescriptiveStatistics(Arrays.copyOfRange(x, e.from(), e.to()));
        // Values go in relative to the window's first one: the slope is shift-invariant, and SimpleRegression's
        // running means otherwise lose about n u |y| (seen: 6e-9 relative on a ramp at 1e5 over 501 samples).
        SimpleRegression reg = new SimpleRegression();
        for (int i = e.from(); i < e.to(); i++) {
            reg.addData((t[i] - t[e.from()]) * 1e-9, x[i] - x[e.from()]);
        }
        return new Expected(e.n(), ds.getMean(), ds.getStandardDeviation(), ds.getMin(), ds.getMax(), reg.getSlope(),
                x[e.to() - 1] - x[e.from()], e.coverage(), e.valid(), e.from(), e.to());
    }

    /** Time span of a window's samples in seconds. */
    double spanS(int p, Expected e) {
        return (times[p][e.to() - 1] - times[p][e.from()]) * 1e-9;
    }

    private static int lowerBound(long[] a, int n, long key) {
        int lo = 0;
        int hi = n;
        while (lo < hi) {
            int mid = (lo + hi) >>> 1;
            if (a[mid] < key) {
                lo = mid + 1;
            } else {
                hi = mid;
            }
        }
        return lo;
    }
}
