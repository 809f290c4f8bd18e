package org.pointcall.ui.cli;

import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;

import org.pointcall.models.detect.DetectorSettings;
import org.pointcall.models.label.LabelFiles;
import org.pointcall.models.modelfile.LoadedModel;
import org.pointcall.models.run.AnalysisAccuracy;
import org.pointcall.models.run.Evaluation;
import org.pointcall.models.run.SortieResult;
import org.pointcall.models.run.SortieSets;
import org.pointcall.models.run.StreamingScorer;
import org.pointcall.models.train.Classifier;
import org.pointcall.shared.demo.DemoFiles;
import org.pointcall.shared.dictionary.DictionaryFiles;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.PointcallException;

import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** Runs a model over labelled sorties as live and scores it by rows and by events. */
@Command(name = "evaluate",
        header = "Run a model over labelled sorties as live; print row- and event-level scores.",
        mixinStandardHelpOptions = true,
        description = {
            "Plays each sortie frame by frame through the live pipeline (derive, the model's windows, the",
            "classifier at every decision tick, the point detector with its default settings) and compares",
            "with the sortie's truth: the row-level confusion matrix, per-class precision and recall, and",
            "per-kind and overall event scores (a match: same kind, intersection over union >= 0.5), begin",
            "and end errors, live-begin latency, false points per hour, and the classifier's cost per tick.",
            "A recorded file with a label file of its own (--recording, --labels) is scored the same way."
        })
public final class EvaluateCommand implements Callable<Integer> {

    @Option(names = "--model", paramLabel = "MODEL",
            description = "model file (default: the model shipped in the jar)")
    Path modelFile;

    @Option(names = "--analysis",
            description = "instead: analyse each truth point of the --data sorties on their noisy telemetry and "
                    + "print the error of every metric against the truth")
    boolean analysis;

    @Option(names = "--details", description = "with --analysis: also one line per point and metric; with "
            + "--verdicts: one line per point, when it began and when the session showed it begun")
    boolean details;

    @Option(names = "--data", arity = "1..*", paramLabel = "DIR",
            description = "sortie folders, or folders of sortie folders")
    List<Path> data = new ArrayList<>();

    @Option(names = "--recording", paramLabel = "FILE", description = "a recorded file (.csv, .xlsx) to score too")
    Path recording;

    @Option(names = "--labels", paramLabel = "FILE", description = "with --recording: its label file")
    Path labelFile;

    @Option(names = "--dictionary", paramLabel = "FILE",
            description = "parameter dictionary (default: each sortie's dictionary.yaml, else the demo one)")
    Path dictionaryFile;

    @Option(names = "--verdicts", description = "compare the card verdicts with each sortie's truth instead")
    boolean verdicts;

    @Option(names = "--card", paramLabel = "CARD", description = "with --verdicts: card (default: each sortie's)")
    Path cardFile;

    @Option(names = "--without", arity = "1..*", paramLabel = "RULE",
            description = "with --verdicts: switch these detector and session rules off, for comparison")
    List<String> without = new ArrayList<>();

    @Spec
    CommandSpec spec;

    @Override
    public Integer call() {
        PrintWriter w = spec.commandLine().getOut();
        if (verdicts) {
            VerdictCheck.run(w, modelFile, cardFile, dictionaryFile, data, without, details);
            return 0;
        }
        if (analysis) {
            if (data.isEmpty()) {
                throw new PointcallException("--analysis needs --data DIR...");
            }
            AnalysisAccuracy accuracy = AnalysisAccuracy.run(SortieSets.find(data), this::dictionary);
            for (String l : details ? accuracy.details() : List.<String>of()) {
                w.println(l);
            }
            for (String l : accuracy.lines()) {
                w.println(l);
            }
            w.flush();
            return 0;
        }
        if (modelFile != null && !Files.isRegularFile(modelFile)) {
            throw new PointcallException(modelFile + ": no such model file");
        }
        if (data.isEmpty() && recording == null) {
            throw new PointcallException("give --data DIR... or --recording FILE --labels FILE");
        }
        if ((recording == null) != (labelFile == null)) {
            throw new PointcallException("--recording and --labels go together");
        }
        List<Path> sorties = data.isEmpty() ? List.of() : SortieSets.find(data);
        LoadedModel<Classifier> model = DetectorModel.load(modelFile);
        List<SortieResult> results = new ArrayList<>();
        if (recording != null) {
            ParameterDictionary dict = dictionaryFile == null ? DemoFiles.dictionary()
                    : DictionaryFiles.load(dictionaryFile);
            StreamingScorer scorer = scorer(model, dict, recording);
            results.add(scorer.score(recording, LabelFiles.load(labelFile), recording.toString(), ""));
        }
        for (Path dir : sorties) {
            results.add(scorer(model, dictionary(dir), dir).scoreSimulated(dir));
        }
        Evaluation e = Evaluation.of(results);
        for (String l : e.matrixTable()) {
            w.println(l);
        }
        for (String l : e.lines()) {
            w.println(l);
        }
        w.println("model: " + (modelFile == null ? ShippedModel.NAME : modelFile.toString()));
        w.flush();
        return 0;
    }

    private static StreamingScorer scorer(LoadedModel<Classifier> model, ParameterDictionary dict, Path where) {
        try {
            return new StreamingScorer(model.model(), model.metadata().description(), dict,
                    DetectorSettings.defaults());
        } catch (PointcallException e) {
            throw new PointcallException(where + ": " + e.getMessage(), e);
        }
    }

    private ParameterDictionary dictionary(Path sortie) {
        if (dictionaryFile != null) {
            return DictionaryFiles.load(dictionaryFile);
        }
        Path own = sortie.resolve("dictionary.yaml");
        return Files.isRegularFile(own) ? DictionaryFiles.load(own) : DemoFiles.dictionary();
    }
}
