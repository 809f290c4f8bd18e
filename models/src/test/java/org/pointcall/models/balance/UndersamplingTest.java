package org.pointcall.models.balance;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;

import org.junit.jupiter.api.Test;
import org.pointcall.models.data.LabelledRows;
import org.pointcall.models.data.SortieInfo;
import org.pointcall.shared.kind.ManoeuvreKind;

class UndersamplingTest {
    private static final int STALL = LabelledRows.classIndex(ManoeuvreKind.STALL_LEVEL);

    /**
     * A 3-hour sortie at 20 Hz with twenty 25 s stalls, one every 9 minutes: 10,000 stall rows against 206,000
     * none rows, 20.6 to 1 (a sortie of about twenty stalls gives over twenty non-stall rows per stall row: common
     * practice).
     */
    private static LabelledRows twentyStallSortie() {
        LabelledRows.Builder b = LabelledRows.builder(List.of("KCAS.mean.2s", "AoA.max.2s"),
                List.of(new SortieInfo("sortie-20-stalls", "demo-a", "", "")));
        double[] row = new double[2];
        int ticks = 3 * 3600 * 20;
        for (int i = 0; i < ticks; i++) {
            double s = i / 20.0;
            double intoPoint = s % 540.0;
            boolean stall = s >= 60 && s < 60 + 20 * 540 && intoPoint >= 60 && intoPoint < 85;
            row[0] = stall ? 180 - 2 * (intoPoint - 60) : 300;
            row[1] = stall ? 8 + 0.4 * (intoPoint - 60) : 3;
            b.add(row, stall ? STALL : 0, i * 50_000_000L, 0, false);
        }
        return b.build();
    }

    @Test
    void aTypicalSortieIsBroughtToThePromisedRatioKeepingEveryStallRow() {
        LabelledRows rows = twentyStallSortie();
        int[] before = rows.classCounts();
        assertEquals(10_000, before[STALL]);
        assertEquals(206_000, before[0]);
        assertTrue(before[0] > 20 * before[STALL]);

        int[] kept = Undersampling.keptRows(rows.classIndices(), 0, 3.0, 42);
        LabelledRows thinned = rows.select(kept);
        int[] after = thinned.classCounts();
        assertEquals(30_000, after[0], "3 none rows per stall row, exactly");
        assertEquals(10_000, after[STALL]);
        // every stall row kept, by index; order preserved
        int stallSeen = 0;
        for (int i = 1; i < kept.length; i++) {
            assertTrue(kept[i] > kept[i - 1]);
        }
        for (int r : kept) {
            if (rows.classOf(r) == STALL) {
                stallSeen++;
            }
        }
        assertEquals(10_000, stallSeen);
        assertArrayEquals(kept, Undersampling.keptRows(rows.classIndices(), 0, 3.0, 42), "seeded");

        // the combination common in practice: undersample none to 3:1, then SMOTE the stalls up to 1:1
        LabelledRows balanced = Smote.toRatio(Undersampling.apply(rows, 3.0, 42), 1.0, SmoteSettings.withSeed(7));
        assertEquals(30_000, balanced.classCounts()[0]);
        assertEquals(30_000, balanced.classCounts()[STALL]);
        assertEquals(20_000, balanced.syntheticRows());
    }

    @Test
    void aMajorityAlreadyBelowTheTargetIsKeptWhole() {
        int[] classes = {0, 0, 0, 1, 1, 2};
        assertArrayEquals(new int[] {0, 1, 2, 3, 4, 5}, Undersampling.keptRows(classes, 0, 2.0, 1));
        int[] kept = Undersampling.keptRows(classes, 0, 0.5, 1);
        // round(0.5 x 2) = 1 row of class 0, every other row
        assertEquals(4, kept.length);
        assertArrayEquals(new int[] {3, 4, 5}, java.util.Arrays.copyOfRange(kept, 1, 4));
    }

    @Test
    void classWeightsMakeEveryPresentClassWeighTheSame() {
        int[] classes = new int[1000];
        for (int i = 0; i < 1000; i++) {
            classes[i] = i < 800 ? 0 : i < 950 ? 1 : 3;
        }
        double[] w = ClassWeights.inverseFrequency(classes, 5);
        // by hand: n / (K n_c) with n = 1000, K = 3 classes present
        assertEquals(1000.0 / (3 * 800), w[0], 1e-15);
        assertEquals(1000.0 / (3 * 150), w[1], 1e-15);
        assertEquals(0.0, w[2]);
        assertEquals(1000.0 / (3 * 50), w[3], 1e-15);
        double sum = 0;
        for (double x : ClassWeights.rowWeights(classes, w)) {
            sum += x;
        }
        assertEquals(1000.0, sum, 1e-9);
    }
}
