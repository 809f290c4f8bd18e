package org.pointcall.models.balance;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.List;
import java.util.SplittableRandom;

import org.junit.jupiter.api.Test;
import org.pointcall.models.data.LabelledRows;
import org.pointcall.models.data.SortieInfo;
import org.pointcall.shared.error.PointcallException;
import org.pointcall.shared.kind.ManoeuvreKind;

class SmoteTest {
    private static final int STALL = LabelledRows.classIndex(ManoeuvreKind.STALL_LEVEL);
    private static final int LOOP = LabelledRows.classIndex(ManoeuvreKind.LOOP);

    private static double[] randomSamples(int m, int d, long seed) {
        SplittableRandom r = new SplittableRandom(seed);
        double[] x = new double[m * d];
        for (int i = 0; i < x.length; i++) {
            x[i] = r.nextDouble(-3, 3) * (1 + i % d);
        }
        return x;
    }

    /** The k nearest other samples of sample i, by exhaustive search written independently of the main code. */
    private static int[] kNearest(double[] x, int m, int d, int i, int k) {
        Integer[] others = new Integer[m - 1];
        int n = 0;
        for (int j = 0; j < m; j++) {
            if (j != i) {
                others[n++] = j;
            }
        }
        double[] dist = new double[m];
        for (int j = 0; j < m; j++) {
            double s = 0;
            for (int f = 0; f < d; f++) {
                s += (x[i * d + f] - x[j * d + f]) * (x[i * d + f] - x[j * d + f]);
            }
            dist[j] = s;
        }
        Arrays.sort(others, (a, b) -> Double.compare(dist[a], dist[b]));
        int[] out = new int[k];
        for (int q = 0; q < k; q++) {
            out[q] = others[q];
        }
        return out;
    }

    /**
     * A minority sample {@code x} for which the point is {@code x + u (nn - x)} with {@code nn} among its k nearest
     * and {@code u} in [0, 1], to 1e-12, or -1 when there is none. (Two samples that are each other's neighbours
     * share a segment, so the origin is not always unique.)
     */
    private static int originOf(double[] s, double[] x, int m, int d, int[][] nn) {
        int origin = -1;
        for (int i = 0; i < m; i++) {
            for (int j : nn[i]) {
                double dot = 0;
                double len2 = 0;
                for (int f = 0; f < d; f++) {
                    double seg = x[j * d + f] - x[i * d + f];
                    dot += (s[f] - x[i * d + f]) * seg;
                    len2 += seg * seg;
                }
                double u = dot / len2;
                if (u < -1e-12 || u > 1 + 1e-12) {
                    continue;
                }
                double off = 0;
                for (int f = 0; f < d; f++) {
                    double e = s[f] - (x[i * d + f] + u * (x[j * d + f] - x[i * d + f]));
                    off += e * e;
                }
                if (Math.sqrt(off) <= 1e-12) {
                    origin = i;
                }
            }
        }
        return origin;
    }

    @Test
    void everySyntheticSampleLiesOnASegmentToOneOfItsOriginsKNearestNeighbours() {
        int m = 40;
        int d = 3;
        int k = SmoteSettings.DEFAULT_K;
        double[] x = randomSamples(m, d, 5);
        int[][] nn = new int[m][];
        for (int i = 0; i < m; i++) {
            nn[i] = kNearest(x, m, d, i, k);
        }
        int count = 200;
        double[] syn = Smote.synthesise(x, m, d, count, SmoteSettings.withSeed(99));
        assertEquals(count * d, syn.length);
        double[] s = new double[d];
        for (int q = 0; q < count; q++) {
            System.arraycopy(syn, q * d, s, 0, d);
            int origin = originOf(s, x, m, d, nn);
            assertTrue(origin >= 0, "synthetic " + q + " " + Arrays.toString(s) + " is on no segment from a sample"
                    + " to one of its 5 nearest minority neighbours (Chawla et al. 2002, section 4.2)");
        }
    }

    @Test
    void segmentsGoOnlyToNearNeighbours() {
        // negative control of the check above: with k = 1 every point is on the segment to the single nearest one,
        // so none may be explained only by a farther neighbour
        int m = 30;
        int d = 2;
        double[] x = randomSamples(m, d, 8);
        int[][] nearest = new int[m][];
        for (int i = 0; i < m; i++) {
            nearest[i] = kNearest(x, m, d, i, 1);
        }
        double[] syn = Smote.synthesise(x, m, d, 90, SmoteSettings.withSeed(1).withK(1));
        double[] s = new double[d];
        for (int q = 0; q < 90; q++) {
            System.arraycopy(syn, q * d, s, 0, d);
            assertTrue(originOf(s, x, m, d, nearest) >= 0, "synthetic " + q);
        }
    }

    @Test
    void seededAndRepeatable() {
        double[] x = randomSamples(25, 4, 2);
        assertArrayEquals(Smote.synthesise(x, 25, 4, 33, SmoteSettings.withSeed(4)),
                Smote.synthesise(x, 25, 4, 33, SmoteSettings.withSeed(4)));
        assertFalse(Arrays.equals(Smote.synthesise(x, 25, 4, 33, SmoteSettings.withSeed(4)),
                Smote.synthesise(x, 25, 4, 33, SmoteSettings.withSeed(5))));
    }

    @Test
    void standardisedDistanceChangesOnlyTheChoiceOfNeighbours() {
        // feature 0 spans thousands (feet), feature 1 spans one (g): raw distance sees only feature 0
        int m = 30;
        int d = 2;
        SplittableRandom r = new SplittableRandom(12);
        double[] x = new double[m * d];
        for (int i = 0; i < m; i++) {
            x[2 * i] = r.nextDouble() * 4000;
            x[2 * i + 1] = r.nextDouble();
        }
        double[] scaled = x.clone();
        for (int f = 0; f < d; f++) {
            double mean = 0;
            for (int i = 0; i < m; i++) {
                mean += x[i * d + f] / m;
            }
            double ss = 0;
            for (int i = 0; i < m; i++) {
                ss += (x[i * d + f] - mean) * (x[i * d + f] - mean);
            }
            double sd = Math.sqrt(ss / (m - 1));
            for (int i = 0; i < m; i++) {
                scaled[i * d + f] = x[i * d + f] / sd;
            }
        }
        int[][] nnStd = new int[m][];
        int[][] nnRaw = new int[m][];
        for (int i = 0; i < m; i++) {
            nnStd[i] = kNearest(scaled, m, d, i, 1);
            nnRaw[i] = kNearest(x, m, d, i, 1);
        }
        double[] syn = Smote.synthesise(x, m, d, 300, SmoteSettings.withSeed(3).withK(1)
                .withDistance(NeighbourDistance.STANDARDISED));
        double[] s = new double[d];
        int explainedByRaw = 0;
        for (int q = 0; q < 300; q++) {
            System.arraycopy(syn, q * d, s, 0, d);
            assertTrue(originOf(s, x, m, d, nnStd) >= 0, "synthetic " + q + " in original units, on a segment "
                    + "to the standardised nearest neighbour");
            explainedByRaw += originOf(s, x, m, d, nnRaw) >= 0 ? 1 : 0;
        }
        assertTrue(explainedByRaw < 300, "standardising changed some neighbours");
    }

    private static LabelledRows rows(int none, int stall, int loop) {
        LabelledRows.Builder b = LabelledRows.builder(List.of("a", "b"), List.of(new SortieInfo("s", "", "", "")));
        SplittableRandom r = new SplittableRandom(17);
        long t = 0;
        int[][] plan = {{0, none}, {STALL, stall}, {LOOP, loop}};
        for (int[] p : plan) {
            for (int i = 0; i < p[1]; i++) {
                b.add(new double[] {r.nextDouble() + p[0], r.nextDouble()}, p[0], t++, 0, false);
            }
        }
        return b.build();
    }

    @Test
    void toRatioGivesExactlyThePromisedCounts() {
        LabelledRows rows = rows(1000, 37, 120);
        LabelledRows balanced = Smote.toRatio(rows, 4.0, SmoteSettings.withSeed(1));
        int[] c = balanced.classCounts();
        assertEquals(1000, c[0]);
        assertEquals(250, c[STALL]);
        assertEquals(250, c[LOOP]);
        assertEquals(250 - 37 + 250 - 120, balanced.syntheticRows());
        // originals first and unchanged
        for (int i = 0; i < rows.rows(); i++) {
            assertArrayEquals(rows.row(i), balanced.row(i));
            assertFalse(balanced.isSynthetic(i));
        }
        for (int i = rows.rows(); i < balanced.rows(); i++) {
            assertTrue(balanced.isSynthetic(i));
        }
        LabelledRows three = Smote.toRatio(rows, 3.0, SmoteSettings.withSeed(1));
        assertEquals(333, three.classCounts()[STALL], "round(1000 / 3)");
        LabelledRows even = Smote.toRatio(rows, 1.0, SmoteSettings.withSeed(1));
        assertEquals(1000, even.classCounts()[LOOP]);
    }

    @Test
    void refusesClassesItCannotDrawBetween() {
        LabelledRows one = rows(10, 1, 0);
        PointcallException e = assertThrows(PointcallException.class,
                () -> Smote.toRatio(one, 1.0, SmoteSettings.withSeed(1)));
        assertEquals("class stall-level: SMOTE needs at least 2 samples of a class to draw between, got 1",
                e.getMessage());
        double[] nan = {0, 1, Double.NaN, 2};
        PointcallException n = assertThrows(PointcallException.class,
                () -> Smote.synthesise(nan, 2, 2, 1, SmoteSettings.withSeed(1)));
        assertTrue(n.getMessage().contains("sample 1, feature 0 is NaN"), n.getMessage());
    }
}
