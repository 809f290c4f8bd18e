package org.pointcall.models.train;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.pointcall.models.data.LabelledRows;
import org.pointcall.models.data.SortieSplit;
import org.pointcall.models.data.SortieSplits;
import org.pointcall.models.modelfile.ModelFiles;
import org.pointcall.models.modelfile.ModelMetadata;

class TrainerTest {
    static LabelledRows rows;

    @BeforeAll
    static void data() {
        rows = SyntheticRows.make(8, 250, 5);
    }

    static TrainerSettings forest(BalanceSettings b) {
        TrainerSettings d = ClassifierTest.settings(ClassifierKind.FOREST);
        return d.withBalance(b).withFolds(4).withForest(d.forest().withTrees(25));
    }

    @Test
    void balancingTouchesTheTrainingSideOnlyAndTestRowsAreScoredAsSplit() {
        List<SortieSplit> folds = SortieSplits.kFold(rows, 4, 99);
        for (BalanceSettings b : List.of(BalanceSettings.none(), BalanceSettings.undersample(1),
                BalanceSettings.smote(1), BalanceSettings.classWeights())) {
            TrainingReport r = new Trainer(forest(b)).crossValidate(rows, folds, TrainingProgress.NONE);
            assertEquals(4, r.folds().size());
            for (int i = 0; i < 4; i++) {
                FoldResult f = r.folds().get(i);
                SortieSplit split = folds.get(i);
                assertEquals(split.testRows().length, f.testRows(), b.describe());
                assertEquals(split.trainRows().length, f.trainRows(), b.describe());
                // the confusion counts every measured test row once, by its true class
                assertEquals(f.testRows(), f.confusion().total());
                int[] truth = split.test(rows).classCounts();
                for (int c = 0; c < truth.length; c++) {
                    assertEquals(truth[c], f.confusion().support(c), b.describe() + " class " + c);
                }
                switch (b.method()) {
                    case NONE, CLASS_WEIGHTS -> assertEquals(f.trainRows(), f.fittedRows());
                    case UNDERSAMPLE -> assertTrue(f.fittedRows() < f.trainRows(), f.toString());
                    case SMOTE -> assertTrue(f.fittedRows() > f.trainRows(), f.toString());
                }
            }
        }
    }

    @Test
    void crossValidationMeansAreTheMeansOfTheFolds() {
        TrainingReport r = new Trainer(forest(BalanceSettings.undersample(2))).crossValidate(rows,
                TrainingProgress.NONE);
        double sum = 0;
        double min = 1;
        for (FoldResult f : r.folds()) {
            sum += f.macroF1();
            min = Math.min(min, f.macroF1());
        }
        assertEquals(sum / 4, r.meanMacroF1(), 1e-12);
        assertEquals(min, r.minMacroF1());
        double recall = 0;
        for (FoldResult f : r.folds()) {
            recall += f.confusion().recall(2);
        }
        assertEquals(recall / 4, r.meanRecall(2), 1e-12);
        List<String> lines = r.lines();
        assertTrue(lines.contains("classifier: forest"));
        assertTrue(lines.contains("balance: undersample 2:1"));
        assertTrue(lines.contains("cv.folds: 4"));
        assertTrue(lines.contains("cv.mean.rows.macro.f1: "
                + org.pointcall.shared.error.Plain.of(r.meanMacroF1())), lines.toString());
        for (String l : lines) {
            assertTrue(l.matches("[a-z0-9.\\-]+: .*"), "name: value line: " + l);
        }
        assertTrue(r.meanMacroF1() > 0.85, "easy problem: " + r.meanMacroF1());
    }

    @Test
    void theSameSettingsGiveTheSameReport() {
        List<String> a = withoutTimes(new Trainer(forest(BalanceSettings.smote(2))).crossValidate(rows,
                TrainingProgress.NONE).lines());
        List<String> b = withoutTimes(new Trainer(forest(BalanceSettings.smote(2))).crossValidate(rows,
                TrainingProgress.NONE).lines());
        assertEquals(a, b);
    }

    private static List<String> withoutTimes(List<String> lines) {
        return lines.stream().filter(l -> !l.contains(".fit.s: ")).toList();
    }

    @Test
    void aHeldOutAirframeIsNeverTrainedOnAndIsScoredWhole() {
        TrainerSettings s = forest(BalanceSettings.undersample(3)).withFolds(2)
                .withHoldOut(new HoldOutSettings(List.of("airframe-b"), List.of()));
        List<double[]> seen = new ArrayList<>();
        TrainingRun run = new Trainer(s).run(rows, (f, label) -> {
            assertFalse(label.isBlank());
            seen.add(new double[] {f});
        });
        FoldResult held = run.report().heldOut().orElseThrow();
        assertEquals(List.of("sortie-5", "sortie-6", "sortie-7", "sortie-8"), held.testSorties());
        int heldRows = 0;
        for (int sortie = 4; sortie < 8; sortie++) {
            heldRows += rows.rowsOfSortie(sortie).length;
        }
        assertEquals(heldRows, held.testRows());
        assertEquals(rows.rows() - heldRows, held.trainRows());
        for (FoldResult f : run.report().folds()) {
            for (String name : f.testSorties()) {
                assertFalse(held.testSorties().contains(name), "cross-validation kept out the held-out " + name);
            }
        }
        long fitted = 0;
        for (long v : run.classifier().trainingRowsPerClass().values()) {
            fitted += v;
        }
        assertEquals(held.fittedRows(), fitted, "the final model is fitted on the same (non-held-out) rows");
        assertTrue(run.report().lines().contains("held-out.rows: " + heldRows));
        // progress: never backwards, ends at 1
        for (int i = 1; i < seen.size(); i++) {
            assertTrue(seen.get(i)[0] >= seen.get(i - 1)[0], "progress " + seen.get(i)[0]);
        }
        assertEquals(1.0, seen.get(seen.size() - 1)[0]);
        assertTrue(seen.size() >= 4, "a report per fold at least: " + seen.size());
    }

    @Test
    void aRunsSummaryGoesIntoTheModelFile(@TempDir Path dir) {
        TrainingRun run = new Trainer(forest(BalanceSettings.undersample(3)).withFolds(2)).run(rows,
                TrainingProgress.NONE);
        Path file = dir.resolve("forest.model");
        ModelFiles.write(file, ClassifierTest.description(Trainer.summary(rows, run)),
                run.classifier(), Instant.parse("2031-04-02T09:30:00Z"));
        ModelMetadata m = ModelFiles.readMetadata(file);
        assertEquals(ForestClassifier.class.getName(), m.payloadClass());
        assertEquals("smile.classification.RandomForest", m.description().training().classifier());
        assertEquals("undersample 3:1", m.description().training().balance());
        assertEquals("25", m.description().training().classifierSettings().get("trees"));
        assertEquals(run.report().meanMacroF1(),
                m.description().training().crossValidation().get("macro-f1-mean"), 1e-12);
        assertEquals(run.classifier().trainingRowsPerClass(), m.description().training().rowsPerClass());
    }

    @Test
    void forestClassWeightsAreInverseFrequencyDivisors() {
        // counts 600, 100, 50: inverse-frequency weights n / (K n_c) are in ratio 1/600 : 1/100 : 1/50, so the
        // divisors that leave each class drawn equally are 600/50, 100/50, 50/50
        LabelledRows.Builder b = LabelledRows.builder(SyntheticRows.FEATURES,
                List.of(new org.pointcall.models.data.SortieInfo("s", "", "", "")));
        double[] row = new double[SyntheticRows.FEATURES.size()];
        int[] counts = {600, 100, 50};
        for (int c = 0; c < 3; c++) {
            for (int i = 0; i < counts[c]; i++) {
                row[0] = i;
                b.add(row, c == 2 ? 4 : c, i, 0, false);
            }
        }
        assertArrayEquals(new int[] {12, 2, 1}, ForestClassifier.divisors(new TrainingData(b.build())));
    }

    @Test
    void theSvmIsFittedOnAStratifiedSubsampleAndCalibratedOnOtherRows() {
        TrainerSettings s = ClassifierTest.settings(ClassifierKind.SVM);
        s = s.withSvm(new SvmSettings(4, Double.NaN, 1e-3, 300, 200));
        SvmClassifier svm = (SvmClassifier) new Trainer(s).fit(rows);
        // each class gets its share of the cap, rounded, and at least 20 rows (all it has when fewer)
        int[] all = rows.classCounts();
        int expectedFitted = 0;
        for (int c = 0; c < SyntheticRows.CLASSES; c++) {
            expectedFitted += Math.max(20, (int) Math.round(300.0 * all[c] / rows.rows()));
        }
        assertEquals(expectedFitted, svm.fittedRows());
        assertTrue(svm.calibrationRows() > 0 && svm.calibrationRows() <= 200 + 20 * SyntheticRows.CLASSES,
                "calibrated on " + svm.calibrationRows());
        boolean[] taken = new boolean[rows.rows()];
        TrainingData data = new TrainingData(rows);
        int[] first = SvmClassifier.stratified(data, 300, taken, new java.util.SplittableRandom(1));
        int[] second = SvmClassifier.stratified(data, 200, taken, new java.util.SplittableRandom(2));
        for (int r : second) {
            assertTrue(java.util.Arrays.binarySearch(first, r) < 0, "row " + r + " in both");
        }
        int[] perClass = new int[SyntheticRows.CLASSES];
        for (int r : first) {
            perClass[rows.classOf(r)]++;
        }
        for (int c = 0; c < SyntheticRows.CLASSES; c++) {
            int expected = Math.max(20, (int) Math.round(300.0 * all[c] / rows.rows()));
            assertEquals(expected, perClass[c], "class " + c);
        }
    }
}
