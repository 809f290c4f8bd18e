package org.pointcall.models.train;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;

import org.pointcall.models.metrics.ClassConfusion;
import org.pointcall.shared.error.Plain;

/**
 * Row-level scores of one classifier and balance: per fold of the cross-validation by sortie, their mean, spread
 * and worst, and the held-out set when there is one. Per-class means are over the folds where the figure is defined
 * (a fold without rows of a class has no recall for it; one that never predicts it, no precision). Immutable.
 */
public final class TrainingReport {
    private final ClassifierKind classifier;
    private final BalanceSettings balance;
    private final Map<String, String> settings;
    private final long seed;
    private final List<FoldResult> folds;
    private final FoldResult heldOut;

    public TrainingReport(ClassifierKind classifier, BalanceSettings balance, Map<String, String> settings, long seed,
                          List<FoldResult> folds, FoldResult heldOut) {
        this.classifier = Objects.requireNonNull(classifier, "classifier");
        this.balance = Objects.requireNonNull(balance, "balance");
        this.settings = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(settings));
        this.seed = seed;
        this.folds = List.copyOf(folds);
        this.heldOut = heldOut;
    }

    public ClassifierKind classifier() {
        return classifier;
    }

    public BalanceSettings balance() {
        return balance;
    }

    public Map<String, String> settings() {
        return settings;
    }

    public List<FoldResult> folds() {
        return folds;
    }

    public Optional<FoldResult> heldOut() {
        return Optional.ofNullable(heldOut);
    }

    /** The same report with a held-out result. */
    public TrainingReport withHeldOut(FoldResult h) {
        return new TrainingReport(classifier, balance, settings, seed, folds, h);
    }

    /** Mean over folds of the row-level macro F1; NaN without folds. */
    public double meanMacroF1() {
        return mean(ClassConfusion::macroF1);
    }

    public double meanMacroPrecision() {
        return mean(ClassConfusion::macroPrecision);
    }

    public double meanMacroRecall() {
        return mean(ClassConfusion::macroRecall);
    }

    /** Sample standard deviation over folds of the macro F1; NaN with fewer than two folds. */
    public double sdMacroF1() {
        if (folds.size() < 2) {
            return Double.NaN;
        }
        double m = meanMacroF1();
        double ss = 0;
        for (FoldResult f : folds) {
            double e = f.macroF1() - m;
            ss += e * e;
        }
        return Math.sqrt(ss / (folds.size() - 1));
    }

    /** The worst fold's macro F1. */
    public double minMacroF1() {
        double min = Double.NaN;
        for (FoldResult f : folds) {
            min = Double.isNaN(min) ? f.macroF1() : Math.min(min, f.macroF1());
        }
        return min;
    }

    /** Mean over the folds where it is defined of class {@code c}'s precision; NaN when it is defined in none. */
    public double meanPrecision(int c) {
        return mean(cc -> cc.precision(c));
    }

    public double meanRecall(int c) {
        return mean(cc -> cc.recall(c));
    }

    public double meanF1(int c) {
        return mean(cc -> cc.f1(c));
    }

    private double mean(java.util.function.ToDoubleFunction<ClassConfusion> f) {
        double s = 0;
        int n = 0;
        for (FoldResult r : folds) {
            double v = f.applyAsDouble(r.confusion());
            if (!Double.isNaN(v)) {
                s += v;
                n++;
            }
        }
        return n == 0 ? Double.NaN : s / n;
    }

    /** Classes present (in truth or prediction) in any fold or the held-out set, ascending. */
    public List<Integer> classesSeen() {
        List<Integer> out = new ArrayList<>();
        if (folds.isEmpty() && heldOut == null) {
            return out;
        }
        int k = (folds.isEmpty() ? heldOut : folds.get(0)).confusion().classCount();
        for (int c = 0; c < k; c++) {
            boolean seen = heldOut != null && heldOut.confusion().present(c);
            for (FoldResult f : folds) {
                seen |= f.confusion().present(c);
            }
            if (seen) {
                out.add(c);
            }
        }
        return out;
    }

    /** Scores for a model file's training summary ({@code macro-f1-mean}, ...). */
    public Map<String, Double> scores() {
        Map<String, Double> m = new LinkedHashMap<>();
        if (!folds.isEmpty()) {
            m.put("folds", (double) folds.size());
            m.put("macro-f1-mean", meanMacroF1());
            if (folds.size() > 1) {
                m.put("macro-f1-sd", sdMacroF1());
            }
            m.put("macro-f1-min", minMacroF1());
        }
        if (heldOut != null) {
            m.put("held-out-macro-f1", heldOut.macroF1());
        }
        return m;
    }

    /** {@code name: value} lines: the run, every fold, the means, and the held-out set. */
    public List<String> lines() {
        List<String> out = new ArrayList<>();
        out.add("classifier: " + classifier.key());
        out.add("balance: " + balance.describe());
        out.add("seed: " + seed);
        for (Map.Entry<String, String> e : settings.entrySet()) {
            out.add("settings." + e.getKey() + ": " + e.getValue());
        }
        List<String> names = folds.isEmpty() ? List.of()
                : folds.get(0).confusion().classNames();
        List<Integer> classes = classesSeen();
        out.add("cv.folds: " + folds.size());
        for (int i = 0; i < folds.size(); i++) {
            FoldResult f = folds.get(i);
            String p = "cv.fold." + (i + 1) + ".";
            out.add(p + "name: " + f.name());
            out.add(p + "test.sorties: " + String.join(", ", f.testSorties()));
            out.add(p + "train.rows: " + f.trainRows());
            out.add(p + "fitted.rows: " + f.fittedRows());
            out.add(p + "test.rows: " + f.testRows());
            out.add(p + "rows.macro.f1: " + Plain.of(f.macroF1()));
            for (int c : classes) {
                out.add(p + "rows." + names.get(c) + ".precision: " + Plain.of(f.confusion().precision(c)));
                out.add(p + "rows." + names.get(c) + ".recall: " + Plain.of(f.confusion().recall(c)));
            }
            out.add(p + "fit.s: " + Plain.of(f.fitSeconds()));
        }
        if (!folds.isEmpty()) {
            out.add("cv.mean.rows.macro.f1: " + Plain.of(meanMacroF1()));
            out.add("cv.sd.rows.macro.f1: " + Plain.of(sdMacroF1()));
            out.add("cv.min.rows.macro.f1: " + Plain.of(minMacroF1()));
            out.add("cv.mean.rows.macro.precision: " + Plain.of(meanMacroPrecision()));
            out.add("cv.mean.rows.macro.recall: " + Plain.of(meanMacroRecall()));
            for (int c : classes) {
                out.add("cv.mean.rows." + names.get(c) + ".precision: " + Plain.of(meanPrecision(c)));
                out.add("cv.mean.rows." + names.get(c) + ".recall: " + Plain.of(meanRecall(c)));
            }
        }
        if (heldOut != null) {
            out.add("held-out.sorties: " + String.join(", ", heldOut.testSorties()));
            out.add("held-out.train.rows: " + heldOut.trainRows());
            out.add("held-out.fitted.rows: " + heldOut.fittedRows());
            for (String l : heldOut.confusion().lines()) {
                out.add("held-out." + l);
            }
        }
        return out;
    }
}
