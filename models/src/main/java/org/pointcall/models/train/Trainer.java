package org.pointcall.models.train;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.function.Predicate;

import org.pointcall.models.data.LabelledRows;
import org.pointcall.models.data.SortieInfo;
import org.pointcall.models.data.SortieSplit;
import org.pointcall.models.data.SortieSplits;
import org.pointcall.models.metrics.ClassConfusion;
import org.pointcall.models.modelfile.TrainingSummary;

/**
 * Trains and evaluates the configured classifier. Every evaluation splits by sortie first ({@link SortieSplits}),
 * balances the training side only, fits, and scores the test side's measured rows as they are. Runs on the caller's
 * thread (Smile's forest fits its trees on the common fork-join pool); one trainer may serve several runs.
 */
public final class Trainer {
    private final TrainerSettings settings;

    public Trainer(TrainerSettings settings) {
        this.settings = Objects.requireNonNull(settings, "settings");
    }

    public TrainerSettings settings() {
        return settings;
    }

    /** Balances {@code training} and fits the configured classifier on it. */
    public Classifier fit(LabelledRows training) {
        return fit(Balancer.apply(training, settings.balance(), settings.seed()), settings.classifier(),
                settings.balance(), settings);
    }

    /** Fits a classifier of {@code kind} on rows already balanced by {@code balance}. */
    static Classifier fit(LabelledRows balanced, ClassifierKind kind, BalanceSettings balance, TrainerSettings s) {
        TrainingData data = new TrainingData(balanced, s.features().mapFor(balanced.featureNames()));
        return switch (kind) {
            case FOREST -> ForestClassifier.fit(data, s.forest(),
                    balance.method() == BalanceMethod.CLASS_WEIGHTS, s.seed());
            case BOOSTING -> BoostingClassifier.fit(data, s.boosting(), s.seed());
            case LOGISTIC -> LogisticClassifier.fit(data, s.logistic());
            case SVM -> SvmClassifier.fit(data, s.svm(), s.seed());
        };
    }

    /** Scores one split: balance and fit on its training side, predict its test side. */
    public FoldResult evaluate(LabelledRows rows, SortieSplit split) {
        long t0 = System.nanoTime();
        LabelledRows train = split.train(rows);
        LabelledRows balanced = Balancer.apply(train, settings.balance(), settings.seed());
        Classifier c = fit(balanced, settings.classifier(), settings.balance(), settings);
        double fitS = (System.nanoTime() - t0) * 1e-9;
        LabelledRows test = split.test(rows);
        ClassConfusion confusion = ClassConfusion.of(test.classIndices(), c.predict(test));
        List<String> sorties = new ArrayList<>();
        for (int s : split.testSorties()) {
            sorties.add(rows.sorties().get(s).name());
        }
        return new FoldResult(split.name(), train.rows(), balanced.rows(), test.rows(), sorties, confusion, fitS);
    }

    /** Cross-validation over {@link TrainerSettings#folds()} folds by sortie dealt with the settings' seed. */
    public TrainingReport crossValidate(LabelledRows rows, TrainingProgress progress) {
        return crossValidate(rows, SortieSplits.kFold(rows, settings.folds(), settings.seed()), progress);
    }

    /** Cross-validation over given folds (so that several trainers can share them). */
    public TrainingReport crossValidate(LabelledRows rows, List<SortieSplit> folds, TrainingProgress progress) {
        List<FoldResult> results = new ArrayList<>();
        for (int i = 0; i < folds.size(); i++) {
            SortieSplit f = folds.get(i);
            progress.progress(i / (double) folds.size(), f.name() + ": fitting " + settings.classifier().key());
            results.add(evaluate(rows, f));
        }
        progress.progress(1.0, "cross-validation done");
        return new TrainingReport(settings.classifier(), settings.balance(), settings.classifierSettings(),
                settings.seed(), results, null);
    }

    /** Trains on every sortie {@code heldOut} rejects and scores the ones it accepts. */
    public FoldResult holdOut(LabelledRows rows, Predicate<SortieInfo> heldOut) {
        return evaluate(rows, SortieSplits.holdOut(rows, heldOut));
    }

    /**
     * A whole run: cross-validation, the configured held-out set (if any; its sorties are then kept out of the
     * cross-validation and of the final model too, so that it stays unseen), and the final model fitted on every
     * other row.
     */
    public TrainingRun run(LabelledRows rows, TrainingProgress progress) {
        LabelledRows pool = rows;
        SortieSplit held = null;
        if (!settings.holdOut().isEmpty()) {
            held = SortieSplits.holdOut(rows, settings.holdOut());
            pool = held.train(rows);
        }
        int steps = settings.folds() + (held == null ? 0 : 1) + 1;
        TrainingReport report = crossValidate(pool, progress.within(0, settings.folds() / (double) steps, "cv"));
        if (held != null) {
            progress.progress(settings.folds() / (double) steps, "held out: fitting " + settings.classifier().key());
            report = report.withHeldOut(evaluate(rows, held));
        }
        progress.progress((steps - 1) / (double) steps, "final model: fitting " + settings.classifier().key());
        Classifier c = fit(pool);
        progress.progress(1.0, "done");
        return new TrainingRun(report, c);
    }

    /**
     * The model file's training summary of a run: data sets are the sortie names of {@code rows}, rows per class
     * those the final model was fitted on.
     */
    public static TrainingSummary summary(LabelledRows rows, TrainingRun run) {
        List<String> datasets = new ArrayList<>();
        for (SortieInfo s : rows.sorties()) {
            datasets.add(s.name());
        }
        return new TrainingSummary(datasets, run.classifier().trainingRowsPerClass(),
                run.report().balance().describe(), run.classifier().kind().smileClass(),
                run.classifier().settings(), run.report().scores());
    }
}
