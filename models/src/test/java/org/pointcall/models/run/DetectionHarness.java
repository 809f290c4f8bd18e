package org.pointcall.models.run;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Set;

import org.pointcall.models.detect.DetectorSettings;
import org.pointcall.models.metrics.DetectedPoint;
import org.pointcall.models.metrics.EventScore;
import org.pointcall.models.metrics.EventScoring;
import org.pointcall.models.metrics.TruePoint;
import org.pointcall.models.modelfile.LoadedModel;
import org.pointcall.models.modelfile.ModelFiles;
import org.pointcall.models.train.Classifier;
import org.pointcall.shared.dictionary.DictionaryFiles;
import org.pointcall.shared.dictionary.ParameterDictionary;

/**
 * A developer's look at the detector on simulated sorties: every true point with the detection that overlaps it
 * most (IoU, begin and end errors, live-begin latency), every detection that overlaps none, then the evaluation's
 * lines. Not a test. Arguments: model file, then sortie folders (or folders of them). {@code -Ddisable=a,b} switches
 * rules off by name.
 */
public final class DetectionHarness {
    private DetectionHarness() {
    }

    public static void main(String[] args) {
        LoadedModel<Classifier> model = ModelFiles.load(Path.of(args[0]), Classifier.class);
        List<Path> dirs = new ArrayList<>();
        for (int i = 1; i < args.length; i++) {
            dirs.add(Path.of(args[i]));
        }
        DetectorSettings settings = DetectorSettings.defaults();
        String off = System.getProperty("disable", "");
        if (!off.isBlank()) {
            settings = settings.withDisabledRules(Set.of(off.split(",")));
        }
        List<SortieResult> results = new ArrayList<>();
        for (Path dir : SortieSets.find(dirs)) {
            Path d = dir.resolve("dictionary.yaml");
            ParameterDictionary dict = DictionaryFiles.load(d);
            StreamingScorer scorer = new StreamingScorer(model.model(), model.metadata().description(), dict,
                    settings);
            if (Boolean.getBoolean("events")) {
                scorer.watchEvents(e -> {
                    if (e.type() != org.pointcall.models.detect.PointEvent.Type.REFINED) {
                        System.out.println(String.format(Locale.ROOT, "    %-9s %-14s %8.1f %8.1f at %8.1f  %s",
                                e.type(), e.kind().key(), e.beginNs() / 1e9,
                                e.endNs() == org.pointcall.models.detect.PointEvent.UNKNOWN_NS ? Double.NaN
                                        : e.endNs() / 1e9, e.reportedAtNs() / 1e9,
                                e.type() == org.pointcall.models.detect.PointEvent.Type.BEGUN ? ""
                                        : String.join(" | ", e.evidence().stream()
                                        .filter(x -> !x.startsWith("feature")).toList())));
                    }
                });
            }
            SortieResult r = scorer.scoreSimulated(dir);
            results.add(r);
            System.out.println("== " + dir.getFileName() + " (" + r.detected().size() + " kept, " + r.discarded()
                    + " discarded)");
            String range = System.getProperty("ticks", "");
            if (!range.isBlank()) {
                double a = Double.parseDouble(range.split(",")[0]);
                double b = Double.parseDouble(range.split(",")[1]);
                StringBuilder sb = new StringBuilder("    ticks:");
                int last = -1;
                for (int i = 0; i < r.ticks(); i++) {
                    double ts = r.spanBeginS() + i * 0.05;
                    if (ts < a || ts > b) {
                        continue;
                    }
                    int c = r.predictedClass()[i];
                    if (c != last) {
                        sb.append(String.format(Locale.ROOT, " %.1f:%s", ts,
                                org.pointcall.models.data.LabelledRows.CLASS_NAMES.get(c)));
                        last = c;
                    }
                }
                System.out.println(sb);
            }
            boolean[] used = new boolean[r.detected().size()];
            for (TruePoint t : r.truth()) {
                int best = -1;
                double bestIou = 0;
                for (int j = 0; j < r.detected().size(); j++) {
                    DetectedPoint p = r.detected().get(j);
                    double iou = EventScoring.iou(t.beginS(), t.endS(), p.beginS(), p.endS());
                    if (iou > bestIou) {
                        bestIou = iou;
                        best = j;
                    }
                }
                if (best < 0) {
                    System.out.println(String.format(Locale.ROOT, "  %-5s %-14s %8.1f %8.1f  MISSED", t.cardId(),
                            t.kind().key(), t.beginS(), t.endS()));
                    continue;
                }
                used[best] = true;
                DetectedPoint p = r.detected().get(best);
                boolean ok = p.kind() == t.kind() && bestIou >= 0.5;
                System.out.println(String.format(Locale.ROOT,
                        "  %-5s %-14s %8.1f %8.1f  %s %-14s %8.1f %8.1f iou %.2f  db %+6.1f de %+6.1f live %+6.1f",
                        t.cardId(), t.kind().key(), t.beginS(), t.endS(), ok ? "ok " : "BAD", p.kind().key(),
                        p.beginS(), p.endS(), bestIou, p.beginS() - t.beginS(), p.endS() - t.endS(),
                        p.reportedAtS() - t.beginS()));
            }
            for (int j = 0; j < used.length; j++) {
                if (!used[j]) {
                    DetectedPoint p = r.detected().get(j);
                    System.out.println(String.format(Locale.ROOT, "  FALSE %-14s %8.1f %8.1f",
                            p.kind().key(), p.beginS(), p.endS()));
                }
            }
        }
        Evaluation e = Evaluation.of(results);
        EventScore s = e.events();
        for (String l : s.lines()) {
            System.out.println(l);
        }
        int discarded = 0;
        for (SortieResult r : results) {
            discarded += r.discarded();
        }
        System.out.println("events.discarded: " + discarded);
        System.out.println(String.format(Locale.ROOT, "cost.classifier-ns-per-tick: %.0f", e.classifierNsPerTick()));
        System.out.println(String.format(Locale.ROOT, "cost.detector-ns-per-tick: %.0f", e.detectorNsPerTick()));
    }
}
