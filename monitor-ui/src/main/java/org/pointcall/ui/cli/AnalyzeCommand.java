package org.pointcall.ui.cli;

import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;

import org.pointcall.ingest.file.ReadReport;
import org.pointcall.models.card.CardAnalysers;
import org.pointcall.models.card.CardSession;
import org.pointcall.models.card.RecordingPlayer;
import org.pointcall.models.card.SessionSetup;
import org.pointcall.models.modelfile.LoadedModel;
import org.pointcall.models.train.Classifier;
import org.pointcall.shared.card.CardFiles;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.demo.DemoFiles;
import org.pointcall.shared.dictionary.DictionaryFiles;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.PointcallException;
import org.pointcall.shared.outcome.MetricValue;
import org.pointcall.shared.outcome.Numbers;
import org.pointcall.shared.outcome.PointOutcome;
import org.pointcall.shared.outcome.PointsFile;
import org.pointcall.shared.outcome.PointsFiles;
import org.pointcall.shared.outcome.Reason;

import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** Finds, analyses and judges the test points of a recorded sortie. */
@Command(name = "analyze",
        header = "Find, analyse and judge the test points of a recorded sortie: points.json and points.csv.",
        mixinStandardHelpOptions = true,
        description = {
            "Plays the recording through the live pipeline (derive, the detector model, the point detector),",
            "binds each point to the test card, analyses it with its kind's method and judges every band in",
            "its phase: GOOD, REPEAT with the reasons, or INCOMPLETE. Without a card, every detected point is",
            "analysed and listed with no verdict. The tool proposes; the test team decides."
        })
public final class AnalyzeCommand implements Callable<Integer> {

    @Option(names = "--input", required = true, paramLabel = "FILE", description = "recorded sortie (.csv, .xlsx)")
    Path input;

    @Option(names = "--dictionary", paramLabel = "DICT",
            description = "parameter dictionary (default: dictionary.yaml beside the input, else the demo one)")
    Path dictionaryFile;

    @Option(names = "--card", paramLabel = "CARD", description = "test card (without one: no verdicts)")
    Path cardFile;

    @Option(names = "--model", paramLabel = "MODEL", description = "detector model (default: the one in the jar)")
    Path modelFile;

    @Option(names = "--out", required = true, paramLabel = "DIR", description = "folder for points.json, points.csv")
    Path out;

    @Spec
    CommandSpec spec;

    @Override
    public Integer call() {
        PrintWriter w = spec.commandLine().getOut();
        if (!Files.isRegularFile(input)) {
            throw new PointcallException(input + ": no such recording");
        }
        ParameterDictionary dict = dictionary(dictionaryFile, input);
        TestCard card = cardFile == null ? null : loadCard(cardFile, dict);
        LoadedModel<Classifier> model = DetectorModel.load(modelFile);
        CardSession session = new CardSession(SessionSetup.of(dict, card, model.model(),
                model.metadata().description(), CardAnalysers.standard()), e -> { });
        ReadReport read = RecordingPlayer.play(input, session);
        PointsFile points = session.pointsFile(input.getFileName().toString());
        List<Path> files = PointsFiles.write(out, points);
        summary(w, points);
        w.printf(Locale.ROOT, "read: %d frames, %d rows skipped%n", read.framesDelivered(), read.rowsSkipped());
        w.println("wrote: " + files.get(0) + ", " + files.get(1));
        w.flush();
        return 0;
    }

    static ParameterDictionary dictionary(Path file, Path input) {
        if (file != null) {
            return DictionaryFiles.load(file);
        }
        Path own = input.toAbsolutePath().getParent() == null ? null
                : input.toAbsolutePath().getParent().resolve("dictionary.yaml");
        return own != null && Files.isRegularFile(own) ? DictionaryFiles.load(own) : DemoFiles.dictionary();
    }

    static TestCard loadCard(Path file, ParameterDictionary dict) {
        if (!Files.isRegularFile(file)) {
            throw new PointcallException(file + ": no such card file");
        }
        return CardFiles.load(file, dict);
    }

    /** The table on standard output: one line per point, its reasons indented below. */
    static void summary(PrintWriter w, PointsFile f) {
        w.printf(Locale.ROOT, "%-8s %-14s %9s %9s  %-10s %s%n", "point", "kind", "begin s", "end s", "verdict",
                "key metrics");
        for (PointOutcome p : f.points()) {
            StringBuilder m = new StringBuilder();
            for (int i = 0; i < p.metrics().size() && i < 3; i++) {
                MetricValue v = p.metrics().get(i);
                m.append(i == 0 ? "" : ", ").append(v.name()).append(' ').append(Numbers.near(v.value(), 4))
                        .append(v.unit().equals("1") ? "" : " " + v.unit());
            }
            String verdict = p.verdict() == null ? (p.cardId() == null && !f.sortie().isEmpty() ? "unplanned" : "-")
                    : p.verdict().key().toUpperCase(Locale.ROOT);
            w.printf(Locale.ROOT, "%-8s %-14s %9.1f %9.1f  %-10s %s%n", p.cardId() == null ? "-" : p.cardId(),
                    p.kind(), p.beginNs() / 1e9, p.endNs() / 1e9, verdict, m);
            for (Reason r : p.reasons()) {
                w.println("           - " + r.text());
            }
        }
        if (!f.sortie().isEmpty()) {
            w.println("not flown: " + (f.notFlown().isEmpty() ? "none" : String.join(", ", f.notFlown())));
        }
        long raised = f.alarms().stream().filter(a -> a.raised()).count();
        w.println("limit alarms: " + raised);
    }
}
