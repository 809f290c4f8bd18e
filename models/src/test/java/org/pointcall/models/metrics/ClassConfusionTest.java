package org.pointcall.models.metrics;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.SplittableRandom;

import org.junit.jupiter.api.Test;
import org.pointcall.models.data.LabelledRows;

import smile.validation.metric.ConfusionMatrix;
import smile.validation.metric.FScore;
import smile.validation.metric.Precision;
import smile.validation.metric.Recall;

class ClassConfusionTest {

    /** Imbalanced random predictions over the 11 classes, mostly right, some classes never true or never predicted. */
    private static int[][] randomCase(long seed, int n) {
        SplittableRandom r = new SplittableRandom(seed);
        int[] truth = new int[n];
        int[] pred = new int[n];
        for (int i = 0; i < n; i++) {
            truth[i] = r.nextDouble() < 0.7 ? 0 : 1 + r.nextInt(8);          // classes 9 and 10 never true
            double u = r.nextDouble();
            pred[i] = u < 0.75 ? truth[i] : u < 0.97 ? r.nextInt(8) : 10;    // class 9 never predicted
        }
        return new int[][] {truth, pred};
    }

    @Test
    void matrixAndPerClassScoresAgreeWithSmile() {
        for (long seed = 1; seed <= 5; seed++) {
            int[][] c = randomCase(seed, 5000);
            ClassConfusion ours = ClassConfusion.of(c[0], c[1]);
            // Smile 3.1.1 smile.validation.metric.ConfusionMatrix, [truth][prediction]
            int[][] smile = ConfusionMatrix.of(c[0], c[1]).matrix;
            for (int t = 0; t < ours.classCount(); t++) {
                for (int p = 0; p < ours.classCount(); p++) {
                    long expected = t < smile.length && p < smile[t].length ? smile[t][p] : 0;
                    assertEquals(expected, ours.count(t, p), "cell " + t + "," + p);
                }
            }
            // Smile's Precision, Recall and F-score are binary (label 1 positive): apply them one class against
            // the rest on the same predictions; same arithmetic, so equal to the last bit
            for (int k = 0; k < ours.classCount(); k++) {
                int[] bt = new int[c[0].length];
                int[] bp = new int[c[0].length];
                for (int i = 0; i < bt.length; i++) {
                    bt[i] = c[0][i] == k ? 1 : 0;
                    bp[i] = c[1][i] == k ? 1 : 0;
                }
                if (ours.predictedCount(k) > 0) {
                    assertEquals(Precision.of(bt, bp), ours.precision(k), 1e-15, "precision of class " + k);
                } else {
                    assertTrue(Double.isNaN(ours.precision(k)));
                }
                if (ours.support(k) > 0) {
                    assertEquals(Recall.of(bt, bp), ours.recall(k), 1e-15, "recall of class " + k);
                } else {
                    assertTrue(Double.isNaN(ours.recall(k)));
                }
                if (ours.count(k, k) > 0) {
                    assertEquals(FScore.of(1.0, bt, bp), ours.f1(k), 1e-12, "F1 of class " + k);
                }
            }
        }
    }

    @Test
    void macroAveragesOfAHandCountedCase() {
        // truth    a a a a b b c c
        // predict  a a b c b b a d     (d never true; e neither true nor predicted)
        int[] truth = {0, 0, 0, 0, 1, 1, 2, 2};
        int[] pred = {0, 0, 1, 2, 1, 1, 0, 3};
        ClassConfusion m = ClassConfusion.of(truth, pred, List.of("a", "b", "c", "d", "e"));
        // a: tp 2, fp 1, fn 2 -> P 2/3, R 1/2, F1 4/7
        // b: tp 2, fp 1, fn 0 -> P 2/3, R 1,   F1 4/5
        // c: tp 0, fp 1, fn 2 -> P 0,   R 0,   F1 0
        // d: tp 0, fp 1, fn 0 -> P 0,   R NaN (counts 0), F1 0
        assertEquals(2.0 / 3, m.precision(0), 1e-15);
        assertEquals(0.5, m.recall(0), 1e-15);
        assertEquals(4.0 / 7, m.f1(0), 1e-15);
        assertTrue(Double.isNaN(m.recall(3)));
        assertTrue(Double.isNaN(m.f1(4)));
        assertEquals((2.0 / 3 + 2.0 / 3 + 0 + 0) / 4, m.macroPrecision(), 1e-15);
        assertEquals((0.5 + 1 + 0 + 0) / 4, m.macroRecall(), 1e-15);
        assertEquals((4.0 / 7 + 0.8 + 0 + 0) / 4, m.macroF1(), 1e-15);
        assertEquals(4.0 / 8, m.accuracy(), 1e-15);
        List<String> lines = m.lines();
        assertEquals("rows: 8", lines.get(0));
        assertEquals("rows.accuracy: 0.5", lines.get(1));
        assertEquals("rows.macro.precision: 0.333333", lines.get(2));
        assertTrue(lines.contains("rows.a.f1: 0.571429"), lines.toString());
        assertTrue(lines.contains("rows.d.recall: NaN"), lines.toString());
        assertTrue(lines.contains("rows.confusion.c.d: 1"), lines.toString());
        assertTrue(lines.stream().noneMatch(l -> l.startsWith("rows.e.")), "absent class left out");
        assertEquals(LabelledRows.classCount(), ClassConfusion.of(new int[0], new int[0]).classCount());
    }
}
