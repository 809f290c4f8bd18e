package org.pointcall.ui.trace;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.SplittableRandom;

import org.junit.jupiter.api.Test;

/**
 * The screen's envelope must keep what a pixel column can show: per column the lowest and highest sample, in the
 * order they occurred, and nothing outside the span.
 */
class TraceHistoryTest {
    @Test
    void envelopeKeepsEveryColumnsExtremesAndOnlyThem() {
        TraceHistory h = new TraceHistory(1 << 15);
        SplittableRandom r = new SplittableRandom(7);
        int n = 20_000; // 20 s at 1,000 samples/s
        double[] t = new double[n];
        double[] v = new double[n];
        for (int i = 0; i < n; i++) {
            t[i] = i / 1000.0;
            v[i] = Math.sin(t[i]) + r.nextGaussian() * 0.1 + (i == 12_345 ? 9 : 0); // one wild spike
            h.add(t[i], v[i]);
        }
        int columns = 400;
        double[] x = new double[2 * columns + 2];
        double[] y = new double[2 * columns + 2];
        int m = h.envelope(0, 20, columns, x, y);
        assertTrue(m <= 2 * columns && m >= columns, "points " + m);
        double w = 20.0 / columns; // bins anchored at time zero, as the envelope defines them
        // brute force: per column min and max of the raw samples
        double[] lo = new double[columns];
        double[] hi = new double[columns];
        java.util.Arrays.fill(lo, Double.POSITIVE_INFINITY);
        java.util.Arrays.fill(hi, Double.NEGATIVE_INFINITY);
        for (int i = 0; i < n; i++) {
            int c = (int) Math.floor(t[i] / w);
            lo[c] = Math.min(lo[c], v[i]);
            hi[c] = Math.max(hi[c], v[i]);
        }
        double[] gotLo = new double[columns];
        double[] gotHi = new double[columns];
        java.util.Arrays.fill(gotLo, Double.POSITIVE_INFINITY);
        java.util.Arrays.fill(gotHi, Double.NEGATIVE_INFINITY);
        for (int k = 0; k < m; k++) {
            if (k > 0) {
                assertTrue(x[k] > x[k - 1], "points stay in time order");
            }
            int c = (int) Math.floor(x[k] / w);
            gotLo[c] = Math.min(gotLo[c], y[k]);
            gotHi[c] = Math.max(gotHi[c], y[k]);
        }
        for (int c = 0; c < columns; c++) {
            assertEquals(lo[c], gotLo[c], 0.0, "column " + c + " low");
            assertEquals(hi[c], gotHi[c], 0.0, "column " + c + " high");
        }
    }

    /**
     * Drawn redraw after redraw while samples arrive and the span scrolls, the kept bins must give exactly what a
     * fresh history holding the same samples gives in one go; after a clear (a replay seek back) the old bins are
     * gone.
     */
    @Test
    void envelopeKeptAcrossRedrawsEqualsOneMadeAfresh() {
        TraceHistory live = new TraceHistory(1 << 15);
        SplittableRandom r = new SplittableRandom(11);
        int columns = 300;
        double span = 20;
        double[] x = new double[2 * columns + 2];
        double[] y = new double[2 * columns + 2];
        double[] fx = new double[2 * columns + 2];
        double[] fy = new double[2 * columns + 2];
        java.util.List<double[]> all = new java.util.ArrayList<>();
        int compared = 0;
        for (int frame = 0; frame < 200; frame++) {
            for (int k = 0; k < 40; k++) { // 1,000 samples/s, a redraw every 40 ms
                int i = frame * 40 + k;
                double ti = 100 + i / 1000.0;
                double vi = Math.sin(ti * 3) + r.nextGaussian() * 0.2;
                live.add(ti, vi);
                all.add(new double[] {ti, vi});
            }
            double now = all.get(all.size() - 1)[0];
            int m = live.envelope(now - span, now, columns, x, y);
            if (frame % 20 == 19) {
                TraceHistory fresh = new TraceHistory(1 << 15);
                for (double[] s : all) {
                    fresh.add(s[0], s[1]);
                }
                int fm = fresh.envelope(now - span, now, columns, fx, fy);
                assertEquals(fm, m, "points at frame " + frame);
                for (int k = 0; k < m; k++) {
                    assertEquals(fx[k], x[k], 0.0, "time of point " + k + " at frame " + frame);
                    assertEquals(fy[k], y[k], 0.0, "value of point " + k + " at frame " + frame);
                }
                compared++;
            }
        }
        assertEquals(10, compared);
        live.clear();
        live.add(50.0, 1.0);
        live.add(50.5, 2.0);
        int m = live.envelope(40, 60, columns, x, y);
        assertEquals(2, m, "only the samples after the clear");
        assertEquals(50.0, x[0]);
        assertEquals(2.0, y[1]);
    }

    @Test
    void spansCopyOnlyTheirOwnSamplesAndNaNIsNotKept() {
        TraceHistory h = new TraceHistory(16);
        for (int i = 0; i < 40; i++) {
            h.add(i, i % 5 == 0 ? Double.NaN : i);
        }
        assertEquals(16, h.size(), "a full ring keeps its capacity of samples");
        double[] x = new double[16];
        double[] y = new double[16];
        int m = h.copySpan(30, 35, x, y);
        assertEquals(4, m, "31 to 34; 30 and 35 were NaN");
        assertEquals(31, x[0]);
        assertEquals(34, y[m - 1]);
        assertEquals(39, h.lastValue());
    }
}
