package org.pointcall.models.run;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.List;
import java.util.Set;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.pointcall.ingest.sim.airframe.AirframeVariation;
import org.pointcall.ingest.sim.pilot.PilotSettings;
import org.pointcall.ingest.sim.sensor.SensorSettings;
import org.pointcall.ingest.sim.truth.SortieTruth;
import org.pointcall.ingest.window.WindowSpec;
import org.pointcall.models.detect.DetectorSettings;
import org.pointcall.models.metrics.DetectedPoint;
import org.pointcall.models.metrics.TruePoint;
import org.pointcall.models.modelfile.LoadedModel;
import org.pointcall.models.modelfile.ModelFiles;
import org.pointcall.models.train.Classifier;
import org.pointcall.models.train.TrainerSettings;
import org.pointcall.models.train.TrainingProgress;
import org.pointcall.shared.card.CardFiles;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.demo.DemoFiles;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.PointcallException;
import org.pointcall.shared.kind.ManoeuvreKind;

/**
 * Trains a small forest on short simulated sorties of a two-point card (a loop and an aileron roll), then plays
 * unseen sorties of the same card through it as live.
 */
class StreamingScorerTest {
    static final String CARD = String.join("\n",
            "sortie: RUN-T",
            "airframe: veskarn-02",
            "points:",
            "  - id: LP-1",
            "    kind: loop",
            "    title: Loop",
            "    bands:",
            "      - {parameter: KCAS, phase: entry, target: 320, tol: 10, unit: kt}",
            "      - {parameter: Hp, phase: entry, target: 8000, tol: 300, unit: ft}",
            "  - id: AR-1",
            "    kind: aileron-roll",
            "    title: Aileron roll",
            "    bands:",
            "      - {parameter: KCAS, phase: entry, target: 300, tol: 10, unit: kt}",
            "      - {parameter: Hp, phase: entry, target: 12000, tol: 500, unit: ft}",
            "");

    @TempDir
    static Path dir;
    static ParameterDictionary dict;
    static List<Path> training;
    static List<Path> unseen;
    static LoadedModel<Classifier> model;

    @BeforeAll
    static void trainOnShortSorties() {
        dict = DemoFiles.dictionary();
        TestCard card = CardFiles.parse(CARD, "card.yaml", dict);
        SortieSets.Flying clean = new SortieSets.Flying(32.0, SensorSettings.CLEAN, PilotSettings.NO_FLAWS);
        training = SortieSets.generate(List.of("veskarn-02"), 3, 10, card, dict, clean, dir.resolve("train"),
                (d, t) -> { });
        unseen = SortieSets.generate(List.of("veskarn-02"), 2, 500, card, dict, clean, dir.resolve("test"),
                (d, t) -> { });
        TrainerSettings settings = TrainerSettings.defaults().withFolds(3)
                .withForest(TrainerSettings.defaults().forest().withTrees(20).withMaxDepth(10));
        List<WindowSpec> windows = List.of(WindowSpec.of("Roll", 1.0, 4.0), WindowSpec.of("Pitch", 1.0, 4.0),
                WindowSpec.of("P", 1.0), WindowSpec.of("Nz", 1.0, 4.0));
        Path file = dir.resolve("m.pcm");
        ModelTraining.train(training, dict, windows, settings, file, Instant.parse("2031-04-02T09:30:00Z"),
                TrainingProgress.NONE);
        model = ModelFiles.load(file, Classifier.class);
    }

    private static StreamingScorer scorer() {
        return new StreamingScorer(model.model(), model.metadata().description(), dict, DetectorSettings.defaults());
    }

    @Test
    void aSetIsOneFolderPerSortieWithUniqueNamesAndSeeds() throws Exception {
        assertEquals(List.of(dir.resolve("train/veskarn-02-01"), dir.resolve("train/veskarn-02-02"),
                dir.resolve("train/veskarn-02-03")), training);
        Set<String> names = new java.util.HashSet<>();
        for (Path p : training) {
            for (String f : List.of("sortie.csv", "truth.json", "dictionary.yaml", "card.yaml")) {
                assertTrue(Files.isRegularFile(p.resolve(f)), p + "/" + f);
            }
            SortieTruth t = SortieTruth.read(p.resolve("truth.json"));
            assertTrue(names.add(t.sortie()), "sortie names are unique: " + t.sortie());
            assertEquals(2, t.points().size());
        }
        assertEquals(11, SortieTruth.read(training.get(0).resolve("truth.json")).seed(), "seed 10 + 1000*0 + 1");
        assertEquals(training, SortieSets.find(List.of(dir.resolve("train"))));
        assertEquals(List.of(training.get(1)), SortieSets.find(List.of(training.get(1))));
    }

    @Test
    void unseenSortiesGiveTheirPointsKinds() {
        List<SortieResult> results = new ArrayList<>();
        for (Path p : unseen) {
            SortieResult r = scorer().scoreSimulated(p);
            results.add(r);
            Set<ManoeuvreKind> truthKinds = EnumSet.noneOf(ManoeuvreKind.class);
            for (TruePoint t : r.truth()) {
                truthKinds.add(t.kind());
            }
            Set<ManoeuvreKind> found = EnumSet.noneOf(ManoeuvreKind.class);
            for (DetectedPoint d : r.detected()) {
                found.add(d.kind());
                assertTrue(d.reportedAtS() >= d.beginS(), "a point is reported live after its begin: " + d);
            }
            assertEquals(EnumSet.of(ManoeuvreKind.LOOP, ManoeuvreKind.AILERON_ROLL), truthKinds);
            assertTrue(found.containsAll(truthKinds), p + ": detected " + r.detected() + ", truth " + r.truth());
            assertTrue(r.ticks() > 0);
            assertEquals(r.ticks(), r.truthClass().length);
        }
        Evaluation e = Evaluation.of(results);
        assertTrue(e.events().overall().recall() >= 0.5, e.lines().toString());
        List<String> keys = e.lines().stream().map(l -> l.substring(0, l.indexOf(": "))).toList();
        assertTrue(keys.containsAll(List.of("sorties", "ticks", "rows.macro.f1", "events.f1",
                "events.loop.f1", "events.live-begin-latency.p95-s", "events.false-points-per-hour",
                "cost.classifier-ns-per-tick")), keys.toString());
        assertEquals("2", e.lines().get(0).substring("sorties: ".length()));
        assertFalse(e.matrixTable().isEmpty());
    }

    /** Sum of |begin error| of the detected points of the true points' kinds, s; each must have one. */
    private static double worst;

    private static double beginErrors(DetectorSettings settings, List<String> lines) {
        double sum = 0;
        for (Path p : unseen) {
            SortieResult r = new StreamingScorer(model.model(), model.metadata().description(), dict, settings)
                    .scoreSimulated(p);
            for (TruePoint t : r.truth()) {
                DetectedPoint d = r.detected().stream().filter(x -> x.kind() == t.kind()
                        && x.endS() > t.beginS() && x.beginS() < t.endS()).findFirst().orElseThrow();
                lines.add(t.kind().key() + " begin " + d.beginS() + " truth " + t.beginS());
                sum += Math.abs(d.beginS() - t.beginS());
                worst = Math.max(worst, Math.abs(d.beginS() - t.beginS()));
            }
        }
        return sum;
    }

    @Test
    void theBeginsOfRollsAndLoopsComeFromWhereTheAircraftLeftItsEntry() {
        List<String> withRule = new ArrayList<>();
        worst = 0;
        double refined = beginErrors(DetectorSettings.defaults(), withRule);
        // the truth's begin is where the simulated pilot started the technique: the pull of a loop, the pull before
        // a roll; the classifier alone rises about half a second later
        assertTrue(worst <= 0.3, "each begin within 0.3 s of the truth: " + withRule);
        List<String> without = new ArrayList<>();
        double plain = beginErrors(DetectorSettings.defaults().withDisabledRules(
                Set.of(org.pointcall.models.detect.BoundaryRules.BEGIN_DEPARTURE)), without);
        assertTrue(plain > 2 * refined, "switched off, the classifier's begins are later: " + without + " against "
                + withRule);
    }

    @Test
    void sortiesLaidEndToEndKeepEveryPointAndTheirOwnTime() {
        SortieResult a = scorer().scoreSimulated(unseen.get(0));
        SortieResult b = scorer().scoreSimulated(unseen.get(1));
        Evaluation both = Evaluation.of(List.of(a, b));
        assertEquals(a.truth().size() + b.truth().size(), both.events().truth().size());
        assertEquals(Evaluation.of(List.of(a)).events().matches().size()
                + Evaluation.of(List.of(b)).events().matches().size(), both.events().matches().size(),
                "no point of one sortie matches one of the other");
        assertEquals(a.ticks() + b.ticks(), both.rows().total());
    }

    @Test
    void variedAirframesFlyOtherSortiesTheSameWayEachTime() throws Exception {
        TestCard card = CardFiles.parse(CARD, "card.yaml", dict);
        SortieSets.Flying clean = new SortieSets.Flying(32.0, SensorSettings.CLEAN, PilotSettings.NO_FLAWS);
        SortieSets.Flying varied = clean.withVariation(new AirframeVariation(0.2));
        Path a = SortieSets.generate(List.of("veskarn-02"), 1, 10, card, dict, varied, dir.resolve("va"),
                (d, t) -> { }).get(0);
        Path b = SortieSets.generate(List.of("veskarn-02"), 1, 10, card, dict, varied, dir.resolve("vb"),
                (d, t) -> { }).get(0);
        // the same seeds as the first training sortie, flown on a variant: another flight, the same twice
        assertArrayEquals(Files.readAllBytes(a.resolve("sortie.csv")), Files.readAllBytes(b.resolve("sortie.csv")));
        assertFalse(java.util.Arrays.equals(Files.readAllBytes(a.resolve("sortie.csv")),
                Files.readAllBytes(training.get(0).resolve("sortie.csv"))));
        SortieTruth t = SortieTruth.read(a.resolve("truth.json"));
        assertEquals("veskarn-02", t.airframe(), "a variant keeps its type's name");
        assertEquals(2, t.points().size());
    }

    @Test
    void aDictionaryLackingAModelParameterIsRefused() {
        ParameterDictionary without = new ParameterDictionary(dict.name() + " without P",
                dict.parameters().stream().filter(p -> !p.name().equals("P")).toList());
        PointcallException e = assertThrows(PointcallException.class, () -> new StreamingScorer(model.model(),
                model.metadata().description(), without, DetectorSettings.defaults()));
        assertTrue(e.getMessage().contains("P"), e.getMessage());
    }

    @Test
    void aFolderWithoutItsRecordingIsNamed() throws Exception {
        Path empty = Files.createDirectories(dir.resolve("empty"));
        PointcallException e = assertThrows(PointcallException.class, () -> scorer().scoreSimulated(empty));
        assertEquals(empty + ": no sortie.csv in it", e.getMessage());
        PointcallException f = assertThrows(PointcallException.class, () -> SortieSets.find(List.of(empty)));
        assertEquals(empty + ": no sortie.csv in it or in its subfolders", f.getMessage());
    }
}
