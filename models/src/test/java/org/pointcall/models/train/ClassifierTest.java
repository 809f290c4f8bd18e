package org.pointcall.models.train;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.lang.management.ManagementFactory;
import java.nio.file.Path;
import java.time.Instant;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;
import org.pointcall.ingest.window.ExtractorSettings;
import org.pointcall.models.data.LabelledRows;
import org.pointcall.models.data.SortieSplit;
import org.pointcall.models.data.SortieSplits;
import org.pointcall.models.metrics.ClassConfusion;
import org.pointcall.models.modelfile.LoadedModel;
import org.pointcall.models.modelfile.ModelDescription;
import org.pointcall.models.modelfile.ModelFiles;
import org.pointcall.models.modelfile.RequiredParameter;
import org.pointcall.models.modelfile.TrainingSummary;
import org.pointcall.shared.units.Unit;

import smile.data.Tuple;

class ClassifierTest {
    /** Small models: the problem is easy, and the suite must stay fast. */
    static TrainerSettings settings(ClassifierKind kind) {
        TrainerSettings d = TrainerSettings.defaults();
        return d.withClassifier(kind).withBalance(BalanceSettings.none()).withSeed(7)
                .withForest(d.forest().withTrees(40))
                .withBoosting(d.boosting().withTrees(30))
                .withSvm(d.svm().withRowCap(800));
    }

    static LabelledRows rows;
    static SortieSplit split;
    static LabelledRows train;
    static LabelledRows test;
    static final Map<ClassifierKind, Classifier> FITTED = new EnumMap<>(ClassifierKind.class);

    @BeforeAll
    static void data() {
        rows = SyntheticRows.make(8, 300, 11);
        // the model never sees airframe-b
        split = SortieSplits.holdOut(rows, s -> s.airframe().equals("airframe-b"));
        train = split.train(rows);
        test = split.test(rows);
    }

    static Classifier fitted(ClassifierKind k) {
        return FITTED.computeIfAbsent(k, kind -> new Trainer(settings(kind)).fit(train));
    }

    @ParameterizedTest
    @EnumSource(ClassifierKind.class)
    void eachClassifierSeparatesAnEasyProblemOnSortiesItNeverSaw(ClassifierKind kind) {
        Classifier c = fitted(kind);
        ClassConfusion cc = ClassConfusion.of(test.classIndices(), c.predict(test));
        // clusters 3 sd apart along their own axis: the Bayes rate is near 0.95 macro F1; a model that ignored a
        // class or confused two would score below 0.85
        assertTrue(cc.macroF1() > 0.85, kind + " macro F1 " + cc.macroF1());
        for (int k = 0; k < SyntheticRows.CLASSES; k++) {
            assertTrue(cc.recall(k) > 0.7, kind + " recall of class " + k + ": " + cc.recall(k));
        }
    }

    @ParameterizedTest
    @EnumSource(ClassifierKind.class)
    void probabilitiesCoverEveryClassSumToOneAndTheAnswerIsTheMostProbable(ClassifierKind kind) {
        Classifier c = fitted(kind);
        double[] p = new double[c.classCount()];
        double[] row = new double[test.featureCount()];
        assertEquals(LabelledRows.classCount(), c.classCount());
        for (int i = 0; i < test.rows(); i += 7) {
            test.copyRow(i, row);
            int best = c.predict(row, p);
            double sum = 0;
            for (int k = 0; k < p.length; k++) {
                assertTrue(p[k] >= 0 && p[k] <= 1, kind + " p[" + k + "] = " + p[k]);
                sum += p[k];
                assertTrue(p[k] <= p[best]);
                if (k >= SyntheticRows.CLASSES) {
                    assertEquals(0.0, p[k], "class " + k + " had no training row");
                }
            }
            assertEquals(1.0, sum, 1e-9, kind + " row " + i);
        }
        for (int k = 0; k < c.classCount(); k++) {
            assertEquals(k < SyntheticRows.CLASSES, c.knows(k));
        }
    }

    @ParameterizedTest
    @EnumSource(ClassifierKind.class)
    void theSameSeedGivesTheSameModel(ClassifierKind kind) {
        Classifier a = fitted(kind);
        Classifier b = new Trainer(settings(kind)).fit(train);
        assertArrayEquals(probabilities(a, test), probabilities(b, test));
        if (kind != ClassifierKind.LOGISTIC) {
            // the seed matters where there is randomness (logistic regression has none)
            Classifier other = new Trainer(settings(kind).withSeed(8)).fit(train);
            assertFalse(java.util.Arrays.equals(probabilities(a, test), probabilities(other, test)), kind.key());
        }
    }

    @ParameterizedTest
    @EnumSource(ClassifierKind.class)
    void aModelFileGivesBackTheSameProbabilities(ClassifierKind kind, @TempDir Path dir) {
        Classifier c = fitted(kind);
        Path file = dir.resolve(kind.key() + ".model");
        ModelFiles.write(file, description(c), c, Instant.parse("2031-04-02T09:30:00Z"));
        LoadedModel<Classifier> loaded = ModelFiles.load(file, Classifier.class);
        assertEquals(c.getClass(), loaded.model().getClass());
        assertArrayEquals(probabilities(c, test), probabilities(loaded.model(), test));
        assertEquals(c.settings(), loaded.model().settings());
        assertEquals(c.trainingRowsPerClass(), loaded.model().trainingRowsPerClass());
    }

    static ModelDescription description(Classifier c) {
        TrainingRun run = new TrainingRun(new TrainingReport(c.kind(), BalanceSettings.none(), c.settings(), 7,
                List.of(), null), c);
        return description(Trainer.summary(rows, run));
    }

    static ModelDescription description(TrainingSummary summary) {
        return new ModelDescription(List.of(new RequiredParameter("KCAS", Unit.KNOT),
                new RequiredParameter("AoA", Unit.DEGREE)), SyntheticRows.WINDOWS, ExtractorSettings.defaults(),
                SyntheticRows.FEATURES, LabelledRows.CLASS_NAMES, summary);
    }

    @Test
    void theForestsOwnSoftVoteIsSmilesExactly() {
        ForestClassifier f = (ForestClassifier) fitted(ClassifierKind.FOREST);
        double[] ours = new double[f.classCount()];
        double[] smile = new double[SyntheticRows.CLASSES];
        double[] row = new double[test.featureCount()];
        for (int i = 0; i < test.rows(); i++) {
            test.copyRow(i, row);
            int answer = f.predict(row, ours);
            int smileAnswer = f.smileModel().predict(Tuple.of(row.clone(), f.smileModel().schema()), smile);
            for (int k = 0; k < SyntheticRows.CLASSES; k++) {
                // same sums in the same order; only the final division may round differently
                assertEquals(smile[k], ours[k], 1e-15, "row " + i + " class " + k);
            }
            // our outputs are class indices 0..5, so Smile's labels are ours
            assertEquals(smileAnswer, answer, "row " + i);
        }
    }

    @Test
    void aMissingFeatureIsItsTrainingMedian() {
        for (ClassifierKind kind : ClassifierKind.values()) {
            Classifier c = fitted(kind);
            double[] row = test.row(0);
            double[] imputed = row.clone();
            row[3] = Double.NaN;
            imputed[3] = c.prep().median(3);
            assertArrayEquals(probabilities(c, imputed), probabilities(c, row), kind.key());
        }
    }

    @Test
    void aCopyPredictsTheSameOnAnotherThread() throws Exception {
        Classifier c = fitted(ClassifierKind.FOREST);
        Classifier copy = c.copy();
        double[][] fromThread = new double[1][];
        Thread t = new Thread(() -> fromThread[0] = probabilities(copy, test));
        t.start();
        double[] here = probabilities(c, test);
        t.join();
        assertArrayEquals(here, fromThread[0]);
    }

    /**
     * Behavioural allocation check: after a warm-up, many calls allocate (almost) nothing on this thread. One
     * object per call would be at least 16 bytes per call; the bound is under 1 byte per call on average.
     */
    @ParameterizedTest
    @EnumSource(value = ClassifierKind.class, names = {"FOREST", "LOGISTIC", "SVM"})
    void predictingAllocatesNothingAfterWarmUp(ClassifierKind kind) {
        com.sun.management.ThreadMXBean mx = (com.sun.management.ThreadMXBean) ManagementFactory.getThreadMXBean();
        Classifier c = fitted(kind).copy();
        double[][] x = new double[test.rows()][];
        for (int i = 0; i < x.length; i++) {
            x[i] = test.row(i);
        }
        double[] p = new double[c.classCount()];
        long sink = 0;
        int calls = kind == ClassifierKind.SVM ? 5_000 : 50_000;
        for (int i = 0; i < calls; i++) {
            sink += c.predict(x[i % x.length], p);
        }
        long id = Thread.currentThread().getId();
        long before = mx.getThreadAllocatedBytes(id);
        for (int i = 0; i < calls; i++) {
            sink += c.predict(x[i % x.length], p);
        }
        long bytes = mx.getThreadAllocatedBytes(id) - before;
        assertTrue(bytes < calls, kind + ": " + bytes + " bytes in " + calls + " calls (sink " + sink + ")");
    }

    /** The probe above sees allocation: Smile's boosting makes a projected tuple per call (24 bytes measured). */
    @Test
    void theAllocationProbeSeesSmilesBoostingAllocate() {
        com.sun.management.ThreadMXBean mx = (com.sun.management.ThreadMXBean) ManagementFactory.getThreadMXBean();
        Classifier c = fitted(ClassifierKind.BOOSTING).copy();
        double[] row = test.row(0);
        double[] p = new double[c.classCount()];
        for (int i = 0; i < 20_000; i++) {
            c.predict(row, p);
        }
        long id = Thread.currentThread().getId();
        long before = mx.getThreadAllocatedBytes(id);
        for (int i = 0; i < 20_000; i++) {
            c.predict(row, p);
        }
        long bytes = mx.getThreadAllocatedBytes(id) - before;
        assertTrue(bytes >= 16L * 20_000, bytes + " bytes in 20000 calls");
    }

    static double[] probabilities(Classifier c, LabelledRows rows) {
        double[] all = new double[rows.rows() * c.classCount()];
        double[] p = new double[c.classCount()];
        double[] row = new double[rows.featureCount()];
        for (int i = 0; i < rows.rows(); i++) {
            rows.copyRow(i, row);
            c.predict(row, p);
            System.arraycopy(p, 0, all, i * p.length, p.length);
        }
        return all;
    }

    static double[] probabilities(Classifier c, double[] row) {
        double[] p = new double[c.classCount()];
        c.predict(row, p);
        return p;
    }
}
