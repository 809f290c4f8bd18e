package org.pointcall.models.data;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;

import org.junit.jupiter.api.Test;
import org.pointcall.shared.error.PointcallException;
import org.pointcall.shared.kind.ManoeuvreKind;

class SortieSplitsTest {
    private static final int STALL = LabelledRows.classIndex(ManoeuvreKind.STALL_LEVEL);
    private static final int LOOP = LabelledRows.classIndex(ManoeuvreKind.LOOP);

    /** Six sorties: three fly stalls, three fly loops; every one has 100 rows of none. */
    private static LabelledRows sixSorties() {
        List<SortieInfo> sorties = new ArrayList<>();
        int[][] plan = {{STALL, 30}, {STALL, 20}, {STALL, 25}, {LOOP, 40}, {LOOP, 35}, {LOOP, 30}};
        for (int s = 0; s < plan.length; s++) {
            sorties.add(new SortieInfo("s" + s, s % 2 == 0 ? "demo-a" : "demo-b", "", ""));
        }
        LabelledRows.Builder b = LabelledRows.builder(List.of("x", "y"), sorties);
        for (int s = 0; s < plan.length; s++) {
            long t = 0;
            for (int i = 0; i < 100; i++) {
                b.add(new double[] {s, i}, 0, t++, s, false);
            }
            for (int i = 0; i < plan[s][1]; i++) {
                b.add(new double[] {s, -i}, plan[s][0], t++, s, false);
            }
        }
        return b.build();
    }

    @Test
    void eachFoldTestsOneStallSortieAndOneLoopSortie() {
        LabelledRows rows = sixSorties();
        for (long seed = 0; seed < 20; seed++) {
            List<SortieSplit> folds = SortieSplits.kFold(rows, 3, seed);
            assertEquals(3, folds.size());
            for (SortieSplit f : folds) {
                int stallSorties = 0;
                int loopSorties = 0;
                for (int s : f.testSorties()) {
                    if (s < 3) {
                        stallSorties++;
                    } else {
                        loopSorties++;
                    }
                }
                assertEquals(1, stallSorties, "seed " + seed + " " + f);
                assertEquals(1, loopSorties, "seed " + seed + " " + f);
            }
        }
    }

    @Test
    void noSortieHasRowsOnBothSidesAndEveryRowIsTestedOnce() {
        LabelledRows rows = sixSorties();
        for (int k = 2; k <= 6; k++) {
            int[] tested = new int[rows.rows()];
            for (SortieSplit f : SortieSplits.kFold(rows, k, 11)) {
                Set<Integer> train = new HashSet<>();
                for (int r : f.trainRows()) {
                    train.add(rows.sortieOf(r));
                }
                Set<Integer> test = new HashSet<>();
                for (int r : f.testRows()) {
                    test.add(rows.sortieOf(r));
                    tested[r]++;
                }
                assertFalse(test.isEmpty(), f.toString());
                Set<Integer> both = new HashSet<>(train);
                both.retainAll(test);
                assertTrue(both.isEmpty(), "sorties on both sides: " + both);
                assertEquals(rows.rows(), f.trainRows().length + f.testRows().length);
                assertEquals(test, new HashSet<>(f.testSorties()));
                assertEquals(train, new HashSet<>(f.trainSorties()));
            }
            for (int r = 0; r < tested.length; r++) {
                assertEquals(1, tested[r], "row " + r + " with k = " + k);
            }
        }
    }

    @Test
    void heldOutSortiesAreChosenByAPredicate() {
        LabelledRows rows = sixSorties();
        SortieSplit split = SortieSplits.holdOut(rows, s -> s.airframe().equals("demo-b"));
        assertEquals(List.of(1, 3, 5), split.testSorties());
        assertEquals(List.of(0, 2, 4), split.trainSorties());
        for (int r : split.testRows()) {
            assertEquals("demo-b", rows.sorties().get(rows.sortieOf(r)).airframe());
        }
        for (int r : split.trainRows()) {
            assertEquals("demo-a", rows.sorties().get(rows.sortieOf(r)).airframe());
        }
        assertEquals(100 * 3 + 20 + 40 + 30, split.test(rows).rows());
        PointcallException none = assertThrows(PointcallException.class,
                () -> SortieSplits.holdOut(rows, s -> s.airframe().equals("demo-c")));
        assertTrue(none.getMessage().contains("no test rows"), none.getMessage());
    }

    @Test
    void refusesTooFewSortiesAndSyntheticRows() {
        LabelledRows rows = sixSorties();
        PointcallException few = assertThrows(PointcallException.class, () -> SortieSplits.kFold(rows, 7, 1));
        assertEquals("7-fold cross-validation by sortie needs at least 7 sorties with rows; the data set has 6",
                few.getMessage());
        LabelledRows.Builder b = LabelledRows.builder(rows.featureNames(), rows.sorties());
        for (int i = 0; i < rows.rows(); i++) {
            b.add(rows.row(i), rows.classOf(i), rows.timeNs(i), rows.sortieOf(i), i == 5);
        }
        LabelledRows withSynthetic = b.build();
        PointcallException syn = assertThrows(PointcallException.class,
                () -> SortieSplits.kFold(withSynthetic, 3, 1));
        assertTrue(syn.getMessage().contains("1 synthetic rows; split by sortie first"), syn.getMessage());
    }
}
