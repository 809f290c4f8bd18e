package org.pointcall.models.train;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

import org.pointcall.models.data.LabelledRows;
import org.pointcall.models.data.SortieSplit;
import org.pointcall.models.data.SortieSplits;

/**
 * Cross-validates every classifier with every balance method on the same folds by sortie, so that their row-level
 * figures can be read side by side and a default chosen with reasons; optionally also measures each classifier's
 * cost per prediction (a model fitted on all rows, one thread). A classifier that cannot take a balance method
 * (class weights outside the forest) gets an entry saying so.
 */
public final class Comparison {
    private final TrainerSettings base;
    private final List<ClassifierKind> classifiers;
    private final List<BalanceSettings> balances;
    private final long costCalls;

    /**
     * @param base        settings of every classifier, the folds and the seed
     * @param costCalls   calls per cost measurement; 0 to skip measuring costs
     */
    public Comparison(TrainerSettings base, List<ClassifierKind> classifiers, List<BalanceSettings> balances,
                      long costCalls) {
        this.base = Objects.requireNonNull(base, "base");
        this.classifiers = List.copyOf(classifiers);
        this.balances = List.copyOf(balances);
        if (this.classifiers.isEmpty() || this.balances.isEmpty()) {
            throw new IllegalArgumentException("a comparison needs at least one classifier and one balance method");
        }
        if (costCalls < 0) {
            throw new IllegalArgumentException("cost calls must be >= 0");
        }
        this.costCalls = costCalls;
    }

    /** Every classifier against none, the configured undersampling and SMOTE ratios, and class weights. */
    public static Comparison everything(TrainerSettings base, long costCalls) {
        List<BalanceSettings> b = new ArrayList<>();
        b.add(BalanceSettings.none());
        b.add(base.balance().method() == BalanceMethod.UNDERSAMPLE ? base.balance() : BalanceSettings.undersample(3));
        b.add(base.balance().method() == BalanceMethod.SMOTE ? base.balance() : BalanceSettings.smote(1));
        b.add(BalanceSettings.classWeights());
        return new Comparison(base, List.of(ClassifierKind.values()), b, costCalls);
    }

    public ComparisonResult run(LabelledRows rows, TrainingProgress progress) {
        List<SortieSplit> folds = SortieSplits.kFold(rows, base.folds(), base.seed());
        int combos = classifiers.size() * balances.size();
        int steps = combos + (costCalls > 0 ? classifiers.size() : 0);
        List<ComparisonResult.Entry> entries = new ArrayList<>();
        int step = 0;
        for (ClassifierKind k : classifiers) {
            for (BalanceSettings b : balances) {
                String label = k.key() + " / " + b.describe();
                if (!b.supports(k)) {
                    entries.add(new ComparisonResult.Entry(k, b, null, k.key() + " takes no class weights"));
                } else {
                    TrainerSettings s = base.withClassifier(k).withBalance(b);
                    TrainingReport r = new Trainer(s).crossValidate(rows, folds,
                            progress.within(step / (double) steps, (step + 1) / (double) steps, label));
                    entries.add(new ComparisonResult.Entry(k, b, r, ""));
                }
                step++;
            }
        }
        List<ComparisonResult.Cost> costs = new ArrayList<>();
        if (costCalls > 0) {
            for (ClassifierKind k : classifiers) {
                progress.progress(step / (double) steps, "cost of " + k.key() + ": fitting on all rows");
                BalanceSettings b = base.balance().supports(k) ? base.balance() : BalanceSettings.undersample(3);
                Classifier c = new Trainer(base.withClassifier(k).withBalance(b)).fit(rows);
                progress.progress((step + 0.5) / steps, "cost of " + k.key() + ": measuring");
                costs.add(new ComparisonResult.Cost(k, PredictionCost.measure(c, rows, Math.max(1000, costCalls / 2),
                        costCalls)));
                step++;
            }
        }
        progress.progress(1.0, "comparison done");
        return new ComparisonResult(rows.rows(), rows.sorties().size(), base.folds(), entries, costs);
    }
}
