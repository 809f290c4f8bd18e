package org.pointcall.models.run;

import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Objects;
import java.util.Set;

import org.pointcall.ingest.sim.truth.SortieTruth;
import org.pointcall.ingest.window.ExtractorSettings;
import org.pointcall.ingest.window.WindowSpec;
import org.pointcall.models.data.DatasetBuilder;
import org.pointcall.models.data.DatasetSettings;
import org.pointcall.models.data.IncompleteRows;
import org.pointcall.models.data.LabelledRows;
import org.pointcall.models.data.SortieInfo;
import org.pointcall.models.label.Labels;
import org.pointcall.models.modelfile.ModelDescription;
import org.pointcall.models.modelfile.ModelFiles;
import org.pointcall.models.modelfile.ModelMetadata;
import org.pointcall.models.modelfile.RequiredParameter;
import org.pointcall.models.rank.FeatureRanking;
import org.pointcall.models.rank.HeatMap;
import org.pointcall.models.train.Classifier;
import org.pointcall.models.train.ForestClassifier;
import org.pointcall.models.train.Trainer;
import org.pointcall.models.train.TrainerSettings;
import org.pointcall.models.train.TrainingProgress;
import org.pointcall.models.train.TrainingRun;
import org.pointcall.shared.dictionary.Parameter;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.PointcallException;

/**
 * A whole training job from simulated sortie folders to a model file: rows through the live pipeline's stages
 * ({@link DatasetBuilder}), the {@link Trainer}'s run (cross-validation by sortie, held-out set, final model), the
 * model's description, and the feature ranking. Runs on the caller's thread.
 */
public final class ModelTraining {
    /** Ticks this close to a label's begin or end are left out of training, s: the truth is exact, a window not. */
    public static final double BOUNDARY_MARGIN_S = 0.5;
    /** Share of the progress given to reading the sorties. */
    private static final double READ_SHARE = 0.3;

    private ModelTraining() {
    }

    /**
     * What a job made.
     *
     * @param rows     the labelled rows of every sortie
     * @param run      the trainer's report and final classifier
     * @param model    the description written into the model file
     * @param ranking  the features ranked (forest importance when the classifier is a forest)
     * @param metadata what the model file says
     */
    public record Result(LabelledRows rows, TrainingRun run, ModelDescription model, FeatureRanking ranking,
                         ModelMetadata metadata) {
    }

    /** The data-set settings a model is trained with: these windows, the extractor's defaults, the margin above. */
    public static DatasetSettings datasetSettings(List<WindowSpec> windows) {
        return new DatasetSettings(windows, ExtractorSettings.defaults(), BOUNDARY_MARGIN_S, IncompleteRows.DROP);
    }

    /**
     * Labelled rows of simulated sortie folders, each named by its truth's sortie, or by its folder when two truths
     * share a name (sorties flown one by one from the same card do).
     */
    public static LabelledRows rows(List<Path> sortieDirs, ParameterDictionary dictionary, DatasetSettings settings,
                                    TrainingProgress progress) {
        DatasetBuilder builder = DatasetBuilder.create(dictionary, settings);
        Set<String> names = new HashSet<>();
        for (int i = 0; i < sortieDirs.size(); i++) {
            Path dir = sortieDirs.get(i);
            progress.progress(i / (double) sortieDirs.size(), "reading " + dir);
            SortieTruth truth = SortieTruth.read(dir.resolve(DatasetBuilder.SIM_TRUTH));
            String name = names.add(truth.sortie()) ? truth.sortie() : dir.toString();
            names.add(name);
            Path recording = dir.resolve(DatasetBuilder.SIM_RECORDING);
            builder.addRecording(recording, Labels.fromTruth(truth), new SortieInfo(name, truth.airframe(),
                    recording.toString(), dir.resolve(DatasetBuilder.SIM_TRUTH).toString()));
        }
        progress.progress(1.0, "read " + sortieDirs.size() + " sorties");
        return builder.build();
    }

    /**
     * Trains on the sortie folders and writes the model file.
     *
     * @param created the time the model file records
     * @throws PointcallException when a folder lacks its files, a window names a parameter the dictionary lacks, or
     *                            the rows hold fewer than two classes
     */
    public static Result train(List<Path> sortieDirs, ParameterDictionary dictionary, List<WindowSpec> windows,
                               TrainerSettings settings, Path modelFile, Instant created, TrainingProgress progress) {
        Objects.requireNonNull(progress, "progress");
        for (Path dir : sortieDirs) {
            if (!java.nio.file.Files.isRegularFile(dir.resolve(DatasetBuilder.SIM_TRUTH))) {
                throw new PointcallException(dir + ": no " + DatasetBuilder.SIM_TRUTH + " in it");
            }
        }
        DatasetSettings ds = datasetSettings(windows);
        LabelledRows rows = rows(sortieDirs, dictionary, ds, progress.within(0, READ_SHARE, ""));
        if (rows.rows() == 0) {
            throw new PointcallException("the sorties gave no complete decision tick to train on");
        }
        TrainingRun run = new Trainer(settings).run(rows, progress.within(READ_SHARE, 0.95, ""));
        Classifier c = run.classifier();
        List<RequiredParameter> params = new ArrayList<>();
        for (WindowSpec w : windows) {
            Parameter p = dictionary.parameter(dictionary.indexOf(w.parameter()));
            params.add(new RequiredParameter(p.name(), p.unit()));
        }
        ModelDescription model = new ModelDescription(params, windows, ds.extractor(), rows.featureNames(),
                LabelledRows.CLASS_NAMES, Trainer.summary(rows, run));
        progress.progress(0.96, "writing " + modelFile);
        ModelMetadata metadata = ModelFiles.write(modelFile, model, c, created);
        // ranked in the features the model itself was fitted on
        LabelledRows ranked = c.featureMap() == null ? rows : c.featureMap().apply(rows);
        FeatureRanking ranking = c instanceof ForestClassifier f
                ? FeatureRanking.withImportance(ranked, f.importance())
                : FeatureRanking.correlations(ranked);
        progress.progress(1.0, "done");
        return new Result(rows, run, model, ranking, metadata);
    }

    /** Writes {@code ranking.csv} and {@code ranking.png} into {@code dir}; returns their paths. */
    public static List<Path> writeRanking(FeatureRanking ranking, String title, Path dir) {
        Path csv = dir.resolve("ranking.csv");
        Path png = dir.resolve("ranking.png");
        ranking.writeCsv(csv);
        HeatMap.writePng(ranking, title, png);
        return List.of(csv, png);
    }
}
