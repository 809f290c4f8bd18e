package org.pointcall.ui.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.pointcall.ingest.sim.truth.PointTruth;
import org.pointcall.ingest.sim.truth.SortieTruth;
import org.pointcall.models.modelfile.ModelFiles;

/** sortie-set, train and evaluate end to end on a tiny set of short sorties. */
class TrainEvaluateCommandTest {
    private static final String CARD = String.join("\n",
            "sortie: CMD-T",
            "airframe: veskarn-02",
            "points:",
            "  - id: AR-1",
            "    kind: aileron-roll",
            "    title: Aileron roll",
            "    bands:",
            "      - {parameter: KCAS, phase: entry, target: 300, tol: 10, unit: kt}",
            "      - {parameter: Hp, phase: entry, target: 12000, tol: 500, unit: ft}",
            "  - id: SS-1",
            "    kind: sideslip",
            "    title: Steady heading sideslip",
            "    bands:",
            "      - {parameter: KCAS, phase: entry, target: 250, tol: 10, unit: kt}",
            "      - {parameter: Hp, phase: entry, target: 10000, tol: 500, unit: ft}",
            "");
    private static final String CONFIG = String.join("\n",
            "folds: 2",
            "forest:",
            "  trees: 5",
            "  max-depth: 6",
            "");

    @TempDir
    static Path dir;
    static CommandRun sortieSet;
    static CommandRun train;

    @BeforeAll
    static void flyAndTrain() throws Exception {
        Path card = dir.resolve("card.yaml");
        Files.writeString(card, CARD, StandardCharsets.UTF_8);
        Path config = dir.resolve("config.yaml");
        Files.writeString(config, CONFIG, StandardCharsets.UTF_8);
        sortieSet = CommandRun.of("sortie-set", "--airframe", "veskarn-02", "sparrel-a1", "--count", "2",
                "--seed", "40", "--card", card.toString(), "--rate", "32", "--out", dir.resolve("set").toString());
        train = CommandRun.of("train", "--data", dir.resolve("set").toString(), "--config", config.toString(),
                "--hold-out-airframe", "sparrel-a1", "--out", dir.resolve("model/m.pcm").toString());
    }

    @Test
    void evaluateAnalysisComparesEveryTruthPointWithItsAnalysis() {
        CommandRun r = CommandRun.of("evaluate", "--analysis", "--data", dir.resolve("set").toString());
        assertEquals(0, r.exitCode(), r.err());
        assertEquals("4", r.figures().get("analysis.sorties"));
        // this card flies an aileron roll and a sideslip: their metrics are compared
        assertTrue(r.figures().containsKey("analysis.aileron-roll.time-to-90.median-abs-error"), r.out());
        assertTrue(r.figures().containsKey("analysis.sideslip.rudder-per-beta.median-abs-error"), r.out());
    }

    @Test
    void sortieSetWritesOneFolderPerSortie() {
        assertEquals(0, sortieSet.exitCode(), sortieSet.err());
        assertEquals("4", sortieSet.figures().get("sorties"));
        for (String s : List.of("veskarn-02-01", "veskarn-02-02", "sparrel-a1-01", "sparrel-a1-02")) {
            assertTrue(Files.isRegularFile(dir.resolve("set").resolve(s).resolve("sortie.csv")), s);
            assertTrue(Files.isRegularFile(dir.resolve("set").resolve(s).resolve("truth.json")), s);
        }
    }

    @Test
    void trainWritesTheModelItsReportAndTheRanking() throws Exception {
        assertEquals(0, train.exitCode(), train.err());
        Map<String, String> f = train.figures();
        assertEquals("4", f.get("sorties"));
        for (String key : List.of("rows", "features", "cv.mean.rows.macro.f1", "held-out.rows.macro.f1",
                "model.bytes")) {
            assertTrue(f.containsKey(key), key + " in:\n" + train.out());
        }
        Path model = dir.resolve("model/m.pcm");
        assertEquals(Long.parseLong(f.get("model.bytes")), Files.size(model));
        assertTrue(ModelFiles.readMetadata(model).description().features().contains("Roll.mean.1s"));
        assertTrue(Files.readAllLines(dir.resolve("model/m-report.txt")).contains("sorties: 4"));
        assertTrue(Files.readString(dir.resolve("model/ranking.csv")).startsWith("feature,importance,"));
        byte[] png = Files.readAllBytes(dir.resolve("model/ranking.png"));
        // PNG signature, ISO/IEC 15948 section 5.2
        assertEquals(0x89, png[0] & 0xff);
        assertEquals('P', png[1]);
        assertTrue(train.err().contains("progress 100% done"), "plain progress lines off a terminal: " + train.err());
    }

    @Test
    void evaluatePrintsRowAndEventScores() {
        assertEquals(0, train.exitCode(), train.err());
        CommandRun r = CommandRun.of("evaluate", "--model", dir.resolve("model/m.pcm").toString(), "--data",
                dir.resolve("set/sparrel-a1-01").toString(), dir.resolve("set/sparrel-a1-02").toString());
        assertEquals(0, r.exitCode(), r.err());
        assertTrue(r.out().startsWith("truth \\ predicted"), r.out());
        Map<String, String> f = r.figures();
        for (String key : List.of("sorties", "ticks", "rows.accuracy", "rows.macro.f1", "rows.none.precision",
                "rows.none.recall", "rows.aileron-roll.recall", "events.f1", "events.precision", "events.recall",
                "events.aileron-roll.f1", "events.sideslip.f1", "events.begin-error.abs-median-s",
                "events.end-error.abs-p95-s", "events.live-begin-latency.p95-s", "events.false-points-per-hour",
                "cost.classifier-ns-per-tick", "cost.detector-ns-per-tick")) {
            assertTrue(f.containsKey(key), key + " in:\n" + r.out());
        }
        assertEquals("2", f.get("sorties"));
        assertEquals("4", f.get("events.true"), "two points in each of two sorties");
        assertEquals(r.number("ticks"), r.number("rows"));
    }

    @Test
    void compareWritesEveryClassifierWithEveryBalanceMethod() throws Exception {
        Path config = dir.resolve("compare.yaml");
        Files.writeString(config, CONFIG + String.join("\n", "boosting:", "  trees: 5", "logistic:",
                "  iterations: 50", "svm:", "  row-cap: 200", "  calibration-rows: 100", ""), StandardCharsets.UTF_8);
        Path table = dir.resolve("compare/table.md");
        Files.createDirectories(table.getParent());
        CommandRun r = CommandRun.of("train", "--compare", "--thin", "10", "--cost-calls", "0", "--data",
                dir.resolve("set").toString(), "--config", config.toString(), "--out", table.toString());
        assertEquals(0, r.exitCode(), r.err());
        List<String> lines = Files.readAllLines(table);
        assertTrue(lines.get(0).startsWith("# Classifiers and balance methods"), lines.toString());
        for (String classifier : List.of("forest", "boosting", "logistic", "svm")) {
            List<String> rows = lines.stream().filter(l -> l.startsWith("| " + classifier + " | ")).toList();
            assertEquals(4, rows.size(), classifier + ": one row per balance method in " + lines);
            assertEquals(!classifier.equals("forest"), rows.stream().anyMatch(l -> l.contains("n/a: ")),
                    "only the forest takes class weights: " + rows);
        }
        assertTrue(r.out().contains("wrote: " + table), r.out());
        assertFalse(Files.exists(dir.resolve("compare/ranking.csv")), "a comparison writes no model");
    }

    @Test
    void evaluateWithoutAModelUsesTheShippedOne() {
        assertEquals(0, train.exitCode(), train.err());
        CommandRun r = CommandRun.of("evaluate", "--data", dir.resolve("set/sparrel-a1-01").toString());
        assertEquals(0, r.exitCode(), r.err());
        Map<String, String> f = r.figures();
        assertEquals("the shipped default model", f.get("model"));
        assertEquals("1", f.get("sorties"));
        assertEquals("2", f.get("events.true"));
        assertTrue(f.containsKey("events.f1"), r.out());
    }

    @Test
    void aRecordingWithItsLabelFileScoresAsItsSortieFolder() throws Exception {
        assertEquals(0, train.exitCode(), train.err());
        Path sortie = dir.resolve("set/sparrel-a1-02");
        StringBuilder labels = new StringBuilder("kind,begin,end,card_id\n");
        for (PointTruth p : SortieTruth.read(sortie.resolve("truth.json")).points()) {
            labels.append(p.kind()).append(',').append(p.beginS()).append(',').append(p.endS()).append(',')
                    .append(p.cardId()).append('\n');
        }
        Path labelFile = dir.resolve("labels.csv");
        Files.writeString(labelFile, labels, StandardCharsets.UTF_8);
        String model = dir.resolve("model/m.pcm").toString();
        CommandRun byFolder = CommandRun.of("evaluate", "--model", model, "--data", sortie.toString());
        CommandRun byFile = CommandRun.of("evaluate", "--model", model, "--recording",
                sortie.resolve("sortie.csv").toString(), "--labels", labelFile.toString(), "--dictionary",
                sortie.resolve("dictionary.yaml").toString());
        assertEquals(0, byFile.exitCode(), byFile.err());
        Map<String, String> a = byFolder.figures();
        Map<String, String> b = byFile.figures();
        // a wall-clock figure, different on every run
        a.remove("cost.classifier-ns-per-tick");
        b.remove("cost.classifier-ns-per-tick");
        a.remove("cost.detector-ns-per-tick");
        b.remove("cost.detector-ns-per-tick");
        assertEquals(a, b);
    }

    @Test
    void badInputIsOneLineAndExitTwo() throws Exception {
        Path missing = dir.resolve("nowhere");
        CommandRun a = CommandRun.of("evaluate", "--model", dir.resolve("model/m.pcm").toString(), "--data",
                missing.toString());
        assertEquals(2, a.exitCode());
        assertEquals("pointcall evaluate: " + missing + ": no such folder", a.err().strip());

        Path empty = Files.createDirectories(dir.resolve("empty"));
        CommandRun b = CommandRun.of("train", "--data", empty.toString(), "--out", dir.resolve("x.pcm").toString());
        assertEquals(2, b.exitCode());
        assertEquals("pointcall train: " + empty + ": no sortie.csv in it or in its subfolders", b.err().strip());

        CommandRun c = CommandRun.of("evaluate", "--model", dir.resolve("no.pcm").toString(), "--data",
                dir.resolve("set").toString());
        assertEquals(2, c.exitCode());
        assertEquals("pointcall evaluate: " + dir.resolve("no.pcm") + ": no such model file", c.err().strip());

        // a sortie whose dictionary lacks a parameter the model reads
        assertEquals(0, train.exitCode(), train.err());
        Path sortie = dir.resolve("set/sparrel-a1-01");
        Path noRoll = dir.resolve("no-roll.yaml");
        String dict = Files.readString(sortie.resolve("dictionary.yaml"), StandardCharsets.UTF_8);
        Files.writeString(noRoll, withoutParameter(dict, "Roll"), StandardCharsets.UTF_8);
        CommandRun d = CommandRun.of("evaluate", "--model", dir.resolve("model/m.pcm").toString(), "--data",
                sortie.toString(), "--dictionary", noRoll.toString());
        assertEquals(2, d.exitCode(), d.out() + d.err());
        assertEquals(1, d.err().strip().lines().count(), d.err());
        assertTrue(d.err().startsWith("pointcall evaluate: " + sortie + ": "), d.err());
        assertTrue(d.err().contains("Roll"), d.err());

        CommandRun e = CommandRun.of("evaluate", "--model", dir.resolve("model/m.pcm").toString(), "--recording",
                sortie.resolve("sortie.csv").toString());
        assertEquals(2, e.exitCode());
        assertEquals("pointcall evaluate: --recording and --labels go together", e.err().strip());
    }

    /** The dictionary text with one parameter's block (from its "- name:" line to the next) left out. */
    private static String withoutParameter(String yaml, String name) {
        StringBuilder out = new StringBuilder();
        boolean skipping = false;
        for (String line : yaml.split("\n", -1)) {
            if (line.trim().startsWith("- name:")) {
                skipping = line.trim().equals("- name: " + name);
            }
            if (!skipping) {
                out.append(line).append('\n');
            }
        }
        return out.toString();
    }
}
