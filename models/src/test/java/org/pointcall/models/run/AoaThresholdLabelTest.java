package org.pointcall.models.run;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.BufferedReader;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.pointcall.ingest.sim.pilot.PilotSettings;
import org.pointcall.ingest.sim.sensor.SensorSettings;
import org.pointcall.ingest.window.WindowSpec;
import org.pointcall.models.data.DatasetBuilder;
import org.pointcall.models.data.LabelledRows;
import org.pointcall.models.data.SortieInfo;
import org.pointcall.models.detect.BoundaryRules;
import org.pointcall.models.detect.DetectorSettings;
import org.pointcall.models.label.LabelFiles;
import org.pointcall.models.label.Labels;
import org.pointcall.models.metrics.DetectedPoint;
import org.pointcall.models.modelfile.ModelDescription;
import org.pointcall.models.modelfile.RequiredParameter;
import org.pointcall.models.train.FeatureForm;
import org.pointcall.models.train.Trainer;
import org.pointcall.models.train.TrainerSettings;
import org.pointcall.models.train.TrainingProgress;
import org.pointcall.models.train.TrainingRun;
import org.pointcall.shared.card.CardFiles;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.demo.DemoFiles;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.kind.ManoeuvreKind;

/**
 * A user's own labels made by the simplest rule of the trade: a stall lasts from AoA rising through a threshold to
 * AoA falling back through it. The recordings are simulated (the user's "recorded stalls"), but their truth files
 * are not used: the label files written by the AoA rule are loaded like any user's, a model is trained on three
 * recordings and run as live on a fourth, and its stalls must begin and end where the rule says, give or take the
 * timing targets.
 */
class AoaThresholdLabelTest {
    static final String CARD = String.join("\n",
            "sortie: AOA-T",
            "airframe: veskarn-02",
            "points:",
            "  - id: SL-1",
            "    kind: stall-level",
            "    title: Wings-level stall",
            "    bands:",
            "      - {parameter: Hp, phase: entry, target: 10000, tol: 500, unit: ft}",
            "      - {parameter: KCAS, phase: rate, before: break, over: 10, target: -1.0, tol: 0.25, unit: kt/s}",
            "  - id: SL-2",
            "    kind: stall-level",
            "    title: Wings-level stall again",
            "    bands:",
            "      - {parameter: Hp, phase: entry, target: 10000, tol: 500, unit: ft}",
            "      - {parameter: KCAS, phase: rate, before: break, over: 10, target: -1.0, tol: 0.25, unit: kt/s}",
            "");
    /**
     * The user's threshold, deg: between this airframe's AoA at a stall entry's trim (about 10 deg at 1.3 times the
     * stall speed) and its stall (17 deg, the profile's figure); a rule of thumb, common practice.
     */
    static final double THRESHOLD_DEG = 14.0;
    /** Crossings closer than this are one stall, s. */
    static final double MERGE_S = 5.0;
    /** Shorter stretches above the threshold are not stalls, s. */
    static final double SHORTEST_S = 4.0;
    /** Begin and end target: p95 timing error at most 1.5 s (issue 5's timing target). */
    static final double TOLERANCE_S = 1.5;

    @TempDir
    Path dir;

    @Test
    void stallsLabelledByAnAoaThresholdAreFoundInsideTheirLabels() throws IOException {
        ParameterDictionary dict = DemoFiles.dictionary();
        TestCard card = CardFiles.parse(CARD, "card.yaml", dict);
        SortieSets.Flying clean = new SortieSets.Flying(32.0, SensorSettings.CLEAN, PilotSettings.NO_FLAWS);
        List<Path> sorties = SortieSets.generate(List.of("veskarn-02"), 4, 40, card, dict, clean, dir.resolve("s"),
                (d, t) -> { });
        List<Labels> labels = new ArrayList<>();
        for (Path s : sorties) {
            Path file = s.resolve("stalls.csv");
            Files.writeString(file, aoaRuleLabels(s.resolve(DatasetBuilder.SIM_RECORDING)), StandardCharsets.UTF_8);
            Labels l = LabelFiles.load(file);
            assertEquals(2, l.size(), "the rule finds both stalls of " + s);
            labels.add(l);
        }

        List<WindowSpec> windows = List.of(WindowSpec.of("AoA", 1.0, 4.0, 30.0), WindowSpec.of("KCAS", 1.0, 4.0, 30.0),
                WindowSpec.of("Nz", 1.0, 4.0), WindowSpec.of("Q", 1.0, 4.0));
        var ds = ModelTraining.datasetSettings(windows);
        DatasetBuilder b = DatasetBuilder.create(dict, ds);
        for (int i = 0; i < 3; i++) {
            Path rec = sorties.get(i).resolve(DatasetBuilder.SIM_RECORDING);
            b.addRecording(rec, labels.get(i), new SortieInfo("own-" + i, "veskarn-02", rec.toString(),
                    sorties.get(i).resolve("stalls.csv").toString()));
        }
        LabelledRows rows = b.build();
        TrainerSettings settings = TrainerSettings.defaults().withFolds(3).withFeatures(FeatureForm.RELATIVE)
                .withForest(TrainerSettings.defaults().forest().withTrees(20).withMaxDepth(10));
        TrainingRun run = new Trainer(settings).run(rows, TrainingProgress.NONE);
        List<RequiredParameter> params = new ArrayList<>();
        for (WindowSpec w : windows) {
            params.add(new RequiredParameter(w.parameter(), dict.parameter(dict.indexOf(w.parameter())).unit()));
        }
        ModelDescription model = new ModelDescription(params, windows, ds.extractor(), rows.featureNames(),
                LabelledRows.CLASS_NAMES, Trainer.summary(rows, run));

        Path unseen = sorties.get(3).resolve(DatasetBuilder.SIM_RECORDING);
        Labels truth = labels.get(3);
        // these labels say where AoA is past a threshold, not where the technique began and the aircraft was back in
        // steady flight: the boundary rules that place a stall's begin and end by the latter are switched off
        DetectorSettings own = DetectorSettings.defaults().withDisabledRules(java.util.Set.of(
                BoundaryRules.BEGIN_DEPARTURE, BoundaryRules.END_RECOVERY));
        SortieResult r = new StreamingScorer(run.classifier(), model, dict, own)
                .score(unseen, truth, "own-3", "veskarn-02");
        List<DetectedPoint> stalls = r.detected().stream().filter(d -> d.kind() == ManoeuvreKind.STALL_LEVEL)
                .toList();
        assertEquals(2, stalls.size(), "detected " + r.detected() + ", labelled " + r.truth());
        for (int i = 0; i < 2; i++) {
            double lb = truth.interval(i).beginNs() * 1e-9;
            double le = truth.interval(i).endNs() * 1e-9;
            DetectedPoint d = stalls.get(i);
            assertTrue(d.beginS() >= lb - TOLERANCE_S && d.beginS() <= lb + TOLERANCE_S,
                    "begin " + d.beginS() + " s against the label's " + lb + " s");
            assertTrue(d.endS() >= le - TOLERANCE_S && d.endS() <= le + TOLERANCE_S,
                    "end " + d.endS() + " s against the label's " + le + " s");
        }
    }

    /**
     * The user's rule on their recording: a stall from AoA rising through the threshold to AoA falling back through
     * it, stretches closer than {@value #MERGE_S} s taken as one (buffet at the break crosses the line many times)
     * and stretches shorter than {@value #SHORTEST_S} s ignored; written as a label file. Reads the recorded file's
     * own AoA column (deg).
     */
    private static String aoaRuleLabels(Path csv) throws IOException {
        List<double[]> spans = new ArrayList<>();
        try (BufferedReader r = Files.newBufferedReader(csv, StandardCharsets.UTF_8)) {
            String[] head = r.readLine().split(",");
            int aoa = -1;
            for (int i = 0; i < head.length; i++) {
                if (head[i].startsWith("AOA_VANE")) {
                    aoa = i;
                }
            }
            assertTrue(aoa >= 0, "the recording has an AoA column");
            double begin = Double.NaN;
            for (String line = r.readLine(); line != null; line = r.readLine()) {
                String[] cells = line.split(",", -1);
                if (cells.length <= aoa || cells[aoa].isEmpty()) {
                    continue;
                }
                double t = Double.parseDouble(cells[0]);
                double a = Double.parseDouble(cells[aoa]);
                if (Double.isNaN(begin) && a > THRESHOLD_DEG) {
                    begin = t;
                } else if (!Double.isNaN(begin) && a < THRESHOLD_DEG) {
                    if (!spans.isEmpty() && begin - spans.get(spans.size() - 1)[1] < MERGE_S) {
                        spans.get(spans.size() - 1)[1] = t;
                    } else {
                        spans.add(new double[] {begin, t});
                    }
                    begin = Double.NaN;
                }
            }
        }
        StringBuilder out = new StringBuilder("# stalls by AoA above " + THRESHOLD_DEG + " deg\nkind,begin,end\n");
        for (double[] s : spans) {
            if (s[1] - s[0] >= SHORTEST_S) {
                out.append(String.format(Locale.ROOT, "stall-level,%.3f,%.3f%n", s[0], s[1]));
            }
        }
        return out.toString();
    }
}
