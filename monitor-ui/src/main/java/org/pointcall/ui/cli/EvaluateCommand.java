package org.pointcall.ui.cli;

import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;

import org.pointcall.models.detect.DetectorSettings;
import org.pointcall.models.modelfile.LoadedModel;
import org.pointcall.models.modelfile.ModelFiles;
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
            "and end errors, live-begin latency, false points per hour, and the classifier's cost per tick."
        })
public final class EvaluateCommand implements Callable<Integer> {

    @Option(names = "--model", required = true, paramLabel = "MODEL", description = "model file")
    Path modelFile;

    @Option(names = "--data", required = true, arity = "1..*", paramLabel = "DIR",
            description = "sortie folders, or folders of sortie folders")
    List<Path> data;

    @Option(names = "--dictionary", paramLabel = "FILE",
            description = "parameter dictionary (default: each sortie's dictionary.yaml, else the demo one)")
    Path dictionaryFile;

    @Spec
    CommandSpec spec;

    @Override
    public Integer call() {
        PrintWriter w = spec.commandLine().getOut();
        if (!Files.isRegularFile(modelFile)) {
            throw new PointcallException(modelFile + ": no such model file");
        }
        List<Path> sorties = SortieSets.find(data);
        LoadedModel<Classifier> model = ModelFiles.load(modelFile, Classifier.class);
        List<SortieResult> results = new ArrayList<>();
        for (Path dir : sorties) {
            ParameterDictionary dict = dictionary(dir);
            StreamingScorer scorer;
            try {
                scorer = new StreamingScorer(model.model(), model.metadata().description(), dict,
                        DetectorSettings.defaults());
            } catch (PointcallException e) {
                throw new PointcallException(dir + ": " + e.getMessage(), e);
            }
            results.add(scorer.scoreSimulated(dir));
        }
        Evaluation e = Evaluation.of(results);
        for (String l : e.matrixTable()) {
            w.println(l);
        }
        for (String l : e.lines()) {
            w.println(l);
        }
        w.flush();
        return 0;
    }

    private ParameterDictionary dictionary(Path sortie) {
        if (dictionaryFile != null) {
            return DictionaryFiles.load(dictionaryFile);
        }
        Path own = sortie.resolve("dictionary.yaml");
        return Files.isRegularFile(own) ? DictionaryFiles.load(own) : DemoFiles.dictionary();
    }
}
