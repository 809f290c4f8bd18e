package org.pointcall.models.train;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.pointcall.models.balance.NeighbourDistance;
import org.pointcall.models.data.SortieInfo;
import org.pointcall.shared.error.InputRejectedException;
import org.pointcall.shared.error.Problem;

class TrainerSettingsTest {
    @Test
    void theShippedDefaultsReadIntoTheRightFields() {
        TrainerSettings d = TrainerSettings.defaults();
        assertEquals(ClassifierKind.FOREST, d.classifier());
        assertEquals(20310402L, d.seed());
        assertEquals(5, d.folds());
        assertEquals(new BalanceSettings(BalanceMethod.UNDERSAMPLE, 3, 5, NeighbourDistance.STANDARDISED),
                d.balance());
        assertTrue(d.holdOut().isEmpty());
        assertEquals(new ForestSettings(100, 16, 0, 2, 0, 1.0), d.forest());
        assertEquals(new BoostingSettings(100, 6, 16, 5, 0.1, 0.7), d.boosting());
        assertEquals(new LogisticSettings(0.01, 1e-5, 500), d.logistic());
        SvmSettings svm = d.svm();
        assertEquals(4.0, svm.c());
        assertTrue(Double.isNaN(svm.gamma()), "gamma auto");
        assertEquals(1.0 / 12, svm.gammaFor(12));
        assertEquals(1e-3, svm.tolerance());
        assertEquals(5000, svm.rowCap());
        assertEquals(2000, svm.calibrationRows());
    }

    @Test
    void aFileOfOnesOwnOverridesOnlyWhatItSays(@TempDir Path dir) throws IOException {
        Path f = write(dir, "mine.yaml", """
                classifier: boosting
                seed: -12345678901234
                forest:
                  trees: 12
                hold-out:
                  airframes: [airframe-b]
                  sorties: [sortie-3]
                balance:
                  method: smote
                  ratio: 2
                  distance: euclidean
                svm:
                  gamma: 0.25
                """);
        TrainerSettings s = TrainerSettings.load(f);
        TrainerSettings d = TrainerSettings.defaults();
        assertEquals(ClassifierKind.BOOSTING, s.classifier());
        assertEquals(-12345678901234L, s.seed(), "a seed beyond 2^53 is read exactly, not through a double");
        assertEquals(d.forest().withTrees(12), s.forest());
        assertEquals(d.boosting(), s.boosting());
        assertEquals(new BalanceSettings(BalanceMethod.SMOTE, 2, 5, NeighbourDistance.EUCLIDEAN), s.balance());
        assertEquals(0.25, s.svm().gamma());
        assertEquals(d.svm().rowCap(), s.svm().rowCap());
        assertTrue(s.holdOut().test(new SortieInfo("sortie-9", "airframe-b", "", "")));
        assertTrue(s.holdOut().test(new SortieInfo("sortie-3", "airframe-a", "", "")));
        assertTrue(!s.holdOut().test(new SortieInfo("sortie-4", "airframe-a", "", "")));
    }

    @Test
    void everyMistakeIsReportedAtOnceWithItsLineAndColumn(@TempDir Path dir) throws IOException {
        Path f = write(dir, "bad.yaml", """
                # a training config with mistakes
                classifier: tree
                folds: 1
                balance:
                  method: smote
                  ratio: 0.5
                forest:
                  trees: 10.5
                  depth: 4
                svm:
                  gamma: wide
                seed: twelve
                """);
        InputRejectedException e = assertThrows(InputRejectedException.class, () -> TrainerSettings.load(f));
        assertEquals(List.of(
                f + ":2:13: unknown classifier 'tree'; expected one of: forest, boosting, logistic, svm",
                f + ":3:8: folds must be at least 2, got '1'",
                f + ":6:10: ratio must be a number of at least 1, got '0.5'",
                f + ":8:10: trees must be a whole number, got '10.5'",
                f + ":9:3: unknown key 'depth'; expected one of: trees, max-depth, max-nodes, node-size, "
                        + "split-features, sample",
                f + ":11:10: gamma must be auto or a positive number, got 'wide'",
                f + ":12:7: seed must be a whole number, got 'twelve'"), lines(e));
    }

    @Test
    void classWeightsWithAClassifierThatTakesNoneIsRefusedAtTheMethod() {
        InputRejectedException e = assertThrows(InputRejectedException.class, () -> TrainerSettings.parse("""
                classifier: svm
                balance:
                  method: class-weights
                """, "svm.yaml"));
        assertEquals(List.of("svm.yaml:3:11: balance method class-weights works with the forest only (Smile's "
                + "boosting, logistic regression and SVM take no class weights); use undersample or smote with "
                + "classifier svm"), lines(e));
    }

    @Test
    void balanceMistakes() {
        InputRejectedException e = assertThrows(InputRejectedException.class, () -> TrainerSettings.parse("""
                balance:
                  method: none
                  ratio: 2
                """, "b.yaml"));
        assertEquals(List.of("b.yaml:3:10: ratio goes with balance method undersample or smote, not none"),
                lines(e));
        e = assertThrows(InputRejectedException.class, () -> TrainerSettings.parse("""
                balance:
                  ratio: 2
                """, "b.yaml"));
        assertEquals(List.of("b.yaml:2:3: balance is missing required key 'method'"), lines(e));
        e = assertThrows(InputRejectedException.class, () -> TrainerSettings.parse("""
                balance:
                  method: oversample
                """, "b.yaml"));
        assertEquals(List.of("b.yaml:2:11: unknown balance method 'oversample'; expected one of: none, "
                + "undersample, smote, class-weights"), lines(e));
        e = assertThrows(InputRejectedException.class, () -> TrainerSettings.parse("""
                balance:
                  method: undersample
                forest:
                  max-nodes: 1
                  sample: 0
                """, "b.yaml"));
        assertEquals(List.of("b.yaml:2:3: balance is missing required key 'ratio'",
                "b.yaml:4:14: max-nodes must be 0 (a fifth of the training rows) or at least 2, got '1'",
                "b.yaml:5:11: sample must be a share in (0, 1], got '0'"), lines(e));
    }

    @Test
    void notAMappingAndBrokenYaml() {
        InputRejectedException e = assertThrows(InputRejectedException.class,
                () -> TrainerSettings.parse("- forest\n", "list.yaml"));
        assertEquals(List.of("list.yaml:1:1: a training config must be a mapping of keys (classifier, seed, folds, "
                + "balance, hold-out, forest, boosting, logistic, svm, features), got a list"), lines(e));
        e = assertThrows(InputRejectedException.class,
                () -> TrainerSettings.parse("classifier: [forest\nfolds: 3\n", "broken.yaml"));
        assertEquals(1, e.problems().size());
        Problem p = e.problems().get(0);
        assertTrue(p.line() > 0 && p.message().startsWith("YAML syntax error: "), p.toString());
    }

    @Test
    void aMissingFileIsOneLine(@TempDir Path dir) {
        Path f = dir.resolve("absent.yaml");
        InputRejectedException e = assertThrows(InputRejectedException.class, () -> TrainerSettings.load(f));
        assertEquals(List.of(f + ": no such file"), lines(e));
    }

    private static List<String> lines(InputRejectedException e) {
        return e.problems().stream().map(Problem::toString).toList();
    }

    private static Path write(Path dir, String name, String text) throws IOException {
        Path f = dir.resolve(name);
        Files.writeString(f, text);
        return f;
    }
}
