package org.pointcall.models.train;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

import org.pointcall.models.data.LabelledRows;
import org.pointcall.shared.error.Plain;

/**
 * A {@link Comparison}'s figures: one entry per classifier and balance method (a report, or why there is none),
 * and each classifier's cost per prediction when measured. Immutable.
 */
public final class ComparisonResult {
    /** One classifier with one balance method; {@code report} null when it could not be trained so. */
    public record Entry(ClassifierKind classifier, BalanceSettings balance, TrainingReport report, String note) {
        public Entry {
            Objects.requireNonNull(classifier, "classifier");
            Objects.requireNonNull(balance, "balance");
            note = note == null ? "" : note;
        }
    }

    /** Cost per prediction of one classifier. */
    public record Cost(ClassifierKind classifier, PredictionCost cost) {
    }

    private final int rows;
    private final int sorties;
    private final int folds;
    private final List<Entry> entries;
    private final List<Cost> costs;

    ComparisonResult(int rows, int sorties, int folds, List<Entry> entries, List<Cost> costs) {
        this.rows = rows;
        this.sorties = sorties;
        this.folds = folds;
        this.entries = List.copyOf(entries);
        this.costs = List.copyOf(costs);
    }

    public List<Entry> entries() {
        return entries;
    }

    public List<Cost> costs() {
        return costs;
    }

    /** The entry with the highest mean macro F1 (the first on a tie). */
    public Entry best() {
        Entry best = null;
        for (Entry e : entries) {
            if (e.report() != null && (best == null || e.report().meanMacroF1() > best.report().meanMacroF1())) {
                best = e;
            }
        }
        return best;
    }

    /**
     * A markdown table, one line per entry: mean, spread and worst fold of the macro F1, macro precision and
     * recall, and the mean recall of each class seen; then the costs per prediction.
     */
    public List<String> table() {
        List<Integer> classes = new ArrayList<>();
        for (Entry e : entries) {
            if (e.report() != null) {
                for (int c : e.report().classesSeen()) {
                    if (!classes.contains(c)) {
                        classes.add(c);
                    }
                }
            }
        }
        classes.sort(null);
        List<String> out = new ArrayList<>();
        out.add("Row-level scores, " + folds + "-fold cross-validation by sortie (" + rows + " rows, " + sorties
                + " sorties); macro F1 as mean ± sd [worst fold]; recall by class is the mean over folds.");
        out.add("");
        StringBuilder h = new StringBuilder("| classifier | balance | macro F1 | macro precision | macro recall |");
        StringBuilder rule = new StringBuilder("| --- | --- | --- | --- | --- |");
        for (int c : classes) {
            h.append(" recall ").append(LabelledRows.CLASS_NAMES.get(c)).append(" |");
            rule.append(" --- |");
        }
        h.append(" fit s per fold |");
        rule.append(" --- |");
        out.add(h.toString());
        out.add(rule.toString());
        for (Entry e : entries) {
            StringBuilder b = new StringBuilder("| ").append(e.classifier().key()).append(" | ")
                    .append(e.balance().describe()).append(" | ");
            TrainingReport r = e.report();
            if (r == null) {
                b.append("n/a: ").append(e.note()).append(" |").append(" |".repeat(3 + classes.size()));
            } else {
                b.append(f3(r.meanMacroF1())).append(" ± ").append(f3(r.sdMacroF1())).append(" [")
                        .append(f3(r.minMacroF1())).append("] | ").append(f3(r.meanMacroPrecision())).append(" | ")
                        .append(f3(r.meanMacroRecall())).append(" |");
                for (int c : classes) {
                    b.append(' ').append(f3(r.meanRecall(c))).append(" |");
                }
                double fit = 0;
                for (FoldResult f : r.folds()) {
                    fit += f.fitSeconds();
                }
                b.append(' ').append(Plain.of(Math.round(fit / r.folds().size() * 100) / 100.0)).append(" |");
            }
            out.add(b.toString());
        }
        if (!costs.isEmpty()) {
            out.add("");
            out.add("| classifier | ns per prediction | bytes allocated per prediction |");
            out.add("| --- | --- | --- |");
            for (Cost c : costs) {
                out.add("| " + c.classifier().key() + " | " + Math.round(c.cost().nsPerCall()) + " | "
                        + (Double.isNaN(c.cost().bytesPerCall()) ? "unknown"
                        : Plain.of(Math.round(c.cost().bytesPerCall() * 10) / 10.0)) + " |");
            }
        }
        return out;
    }

    /** {@code name: value} lines: per entry its mean, sd and worst macro F1; per classifier its cost. */
    public List<String> lines() {
        List<String> out = new ArrayList<>();
        out.add("rows: " + rows);
        out.add("sorties: " + sorties);
        out.add("folds: " + folds);
        for (Entry e : entries) {
            String p = e.classifier().key() + "." + e.balance().describe().replace(' ', '_') + ".";
            if (e.report() == null) {
                out.add(p + "skipped: " + e.note());
            } else {
                out.add(p + "macro.f1.mean: " + Plain.of(e.report().meanMacroF1()));
                out.add(p + "macro.f1.sd: " + Plain.of(e.report().sdMacroF1()));
                out.add(p + "macro.f1.min: " + Plain.of(e.report().minMacroF1()));
            }
        }
        for (Cost c : costs) {
            out.add(c.classifier().key() + ".ns.per.prediction: " + Plain.of(c.cost().nsPerCall()));
            out.add(c.classifier().key() + ".bytes.per.prediction: " + Plain.of(c.cost().bytesPerCall()));
        }
        return out;
    }

    private static String f3(double v) {
        return Double.isNaN(v) ? "-" : String.format(java.util.Locale.ROOT, "%.3f", v);
    }
}
