package org.pointcall.models.train;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;

import org.junit.jupiter.api.Test;
import org.pointcall.models.data.LabelledRows;

class ComparisonTest {
    @Test
    void everyClassifierAndBalanceIsScoredOnTheSameFoldsSideBySide() {
        LabelledRows rows = SyntheticRows.make(6, 200, 3);
        TrainerSettings base = ClassifierTest.settings(ClassifierKind.FOREST).withFolds(3);
        base = base.withForest(base.forest().withTrees(15));
        List<BalanceSettings> balances = List.of(BalanceSettings.none(), BalanceSettings.undersample(2),
                BalanceSettings.classWeights());
        double[] last = {-1};
        ComparisonResult r = new Comparison(base, List.of(ClassifierKind.FOREST, ClassifierKind.LOGISTIC), balances,
                2_000).run(rows, (f, label) -> {
                    assertTrue(f >= last[0], "progress goes forward");
                    last[0] = f;
                });
        assertEquals(1.0, last[0]);
        assertEquals(6, r.entries().size());
        ComparisonResult.Entry skipped = r.entries().get(5);
        assertEquals(ClassifierKind.LOGISTIC, skipped.classifier());
        assertNull(skipped.report());
        assertEquals("logistic takes no class weights", skipped.note());
        // the same folds for everyone: identical test rows per fold
        TrainingReport first = r.entries().get(0).report();
        for (ComparisonResult.Entry e : r.entries()) {
            if (e.report() == null) {
                continue;
            }
            for (int i = 0; i < 3; i++) {
                assertEquals(first.folds().get(i).testSorties(), e.report().folds().get(i).testSorties());
                assertEquals(first.folds().get(i).testRows(), e.report().folds().get(i).testRows());
            }
            assertTrue(e.report().meanMacroF1() > 0.8, e.classifier() + " " + e.balance().describe());
        }
        assertNotNull(r.best().report());
        List<String> table = r.table();
        assertTrue(table.contains("| classifier | balance | macro F1 | macro precision | macro recall | recall none |"
                + " recall stall-level | recall stall-turn | recall loop | recall wind-up-turn | recall level-accel |"
                + " fit s per fold |"), String.join("\n", table));
        long rowsOfEntries = table.stream().filter(l -> l.startsWith("| forest |") || l.startsWith("| logistic |"))
                .count();
        assertEquals(6 + 2, rowsOfEntries, "one line per entry, one per cost");
        assertTrue(table.stream().anyMatch(l -> l.startsWith("| logistic | class-weights | n/a: logistic takes no "
                + "class weights |")));
        assertEquals(2, r.costs().size());
        assertTrue(r.costs().get(0).cost().nsPerCall() > 0);
        assertTrue(r.lines().contains("logistic.class-weights.skipped: logistic takes no class weights"));
    }
}
