package org.pointcall.ui.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;

import org.pointcall.models.data.LabelledRows;
import org.pointcall.models.run.FeatureWindows;
import org.pointcall.models.run.ModelTraining;
import org.pointcall.models.run.SortieSets;
import org.pointcall.models.train.Comparison;
import org.pointcall.models.train.ComparisonResult;
import org.pointcall.models.train.HoldOutSettings;
import org.pointcall.models.train.TrainerSettings;
import org.pointcall.shared.demo.DemoFiles;
import org.pointcall.shared.dictionary.DictionaryFiles;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.PointcallException;

import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** Trains a detector model on labelled simulated sorties and writes the model file, its report and ranking. */
@Command(name = "train",
        header = "Train a detector model on labelled sorties; write the model file, report and feature ranking.",
        mixinStandardHelpOptions = true,
        description = {
            "Reads each sortie (a folder with sortie.csv and truth.json, or a folder of such folders) through",
            "the live pipeline's stages (read, derive, sliding windows of KCAS, Hp, AoA, AoS, Pitch, Roll,",
            "P, Q, Nz and Elevator over 1, 4 and 12 s, KCAS, Hp, AoA and Elevator also over 30 s), cross-validates",
            "by sortie, scores the held-out",
            "sorties, fits the final model on the rest and writes MODEL; beside it MODEL-report.txt (the",
            "report's name: value lines, also printed), ranking.csv and ranking.png (features against classes).",
            "Progress goes to standard error: a bar on a terminal, plain lines otherwise."
        })
public final class TrainCommand implements Callable<Integer> {

    @Option(names = "--data", required = true, arity = "1..*", paramLabel = "DIR",
            description = "sortie folders, or folders of sortie folders")
    List<Path> data;

    @Option(names = "--out", required = true, paramLabel = "MODEL", description = "model file to write")
    Path out;

    @Option(names = "--config", paramLabel = "FILE", description = "training config (default: the shipped one)")
    Path config;

    @Option(names = "--hold-out-airframe", paramLabel = "NAME", arity = "1..*",
            description = "score the sorties of this airframe once and never train on them")
    List<String> holdOutAirframes;

    @Option(names = "--dictionary", paramLabel = "FILE",
            description = "parameter dictionary (default: the first sortie's dictionary.yaml, else the demo one)")
    Path dictionaryFile;

    @Option(names = "--compare", description = "instead of training one model, cross-validate every classifier"
            + " (forest, boosting, logistic, SVM) with every balance method (none, undersample, SMOTE, class"
            + " weights) on the same folds by sortie and write the side-by-side table to OUT (markdown)")
    boolean compare;

    @Option(names = "--cost-calls", paramLabel = "N", defaultValue = "20000",
            description = "with --compare: predictions timed per classifier for its cost (0: skip; default:"
                    + " ${DEFAULT-VALUE})")
    long costCalls;

    @Option(names = "--thin", paramLabel = "N", defaultValue = "1",
            description = "with --compare: keep every N-th decision tick of each sortie (neighbouring ticks are nearly"
                    + " the same row; default: ${DEFAULT-VALUE}, all)")
    int thin;

    @Spec
    CommandSpec spec;

    @Override
    public Integer call() throws IOException {
        PrintWriter w = spec.commandLine().getOut();
        List<Path> sorties = SortieSets.find(data);
        if (config != null && !Files.isRegularFile(config)) {
            throw new PointcallException(config + ": no such file");
        }
        TrainerSettings settings = config == null ? TrainerSettings.defaults() : TrainerSettings.load(config);
        if (holdOutAirframes != null && !holdOutAirframes.isEmpty()) {
            List<String> airframes = new ArrayList<>(settings.holdOut().airframes());
            airframes.addAll(holdOutAirframes);
            settings = settings.withHoldOut(new HoldOutSettings(airframes, settings.holdOut().sorties()));
        }
        ParameterDictionary dict = dictionary(sorties.get(0));
        Path parent = out.toAbsolutePath().getParent();
        Files.createDirectories(parent);
        ProgressBar bar = new ProgressBar(spec.commandLine().getErr(), System.console() != null);
        if (compare) {
            return compare(sorties, dict, settings, bar, w);
        }
        ModelTraining.Result r = ModelTraining.train(sorties, dict, FeatureWindows.standard(), settings, out,
                Instant.now(), bar);
        List<String> lines = new ArrayList<>();
        lines.add("sorties: " + r.rows().sorties().size());
        lines.add("rows: " + r.rows().rows());
        lines.add("features: " + r.rows().featureCount());
        lines.addAll(r.run().report().lines());
        lines.add("model.bytes: " + Files.size(out));
        Path report = parent.resolve(stem(out) + "-report.txt");
        Files.write(report, lines, StandardCharsets.UTF_8);
        List<Path> ranking = ModelTraining.writeRanking(r.ranking(), "features of " + out.getFileName(), parent);
        for (String l : lines) {
            w.println(l);
        }
        w.printf(Locale.ROOT, "wrote: %s, %s, %s, %s%n", out, report, ranking.get(0), ranking.get(1));
        w.flush();
        return 0;
    }

    private int compare(List<Path> sorties, ParameterDictionary dict, TrainerSettings settings, ProgressBar bar,
                        PrintWriter w) throws IOException {
        if (costCalls < 0) {
            throw new PointcallException("--cost-calls must be 0 or more, got " + costCalls);
        }
        LabelledRows rows = ModelTraining.rows(sorties, dict, ModelTraining.datasetSettings(FeatureWindows.standard()),
                bar.within(0, 0.2, ""));
        if (thin < 1) {
            throw new PointcallException("--thin must be 1 or more, got " + thin);
        }
        if (thin > 1) {
            int[] keep = new int[(rows.rows() + thin - 1) / thin];
            for (int i = 0; i < keep.length; i++) {
                keep[i] = i * thin;
            }
            rows = rows.select(keep);
        }
        if (rows.rows() == 0) {
            throw new PointcallException("the sorties gave no complete decision tick to compare on");
        }
        ComparisonResult r = Comparison.everything(settings, costCalls).run(rows, bar.within(0.2, 1.0, ""));
        List<String> lines = new ArrayList<>();
        lines.add("# Classifiers and balance methods side by side");
        lines.add("");
        lines.add(String.format(Locale.ROOT, "%d sorties, %d rows (every %d. tick), %d features (%s), %d folds by"
                + " sortie, seed %d. Row-level scores of the cross-validation; cost per prediction on one thread.",
                rows.sorties().size(), rows.rows(), thin, rows.featureCount(), settings.features().key(),
                settings.folds(), settings.seed()));
        lines.add("");
        lines.addAll(r.table());
        Files.write(out, lines, StandardCharsets.UTF_8);
        for (String l : lines) {
            w.println(l);
        }
        w.println("wrote: " + out);
        w.flush();
        return 0;
    }

    private ParameterDictionary dictionary(Path firstSortie) {
        if (dictionaryFile != null) {
            return DictionaryFiles.load(dictionaryFile);
        }
        Path own = firstSortie.resolve("dictionary.yaml");
        return Files.isRegularFile(own) ? DictionaryFiles.load(own) : DemoFiles.dictionary();
    }

    private static String stem(Path file) {
        String n = file.getFileName().toString();
        int dot = n.lastIndexOf('.');
        return dot > 0 ? n.substring(0, dot) : n;
    }
}
