package org.pointcall.models.train;

import java.util.List;

import org.pointcall.models.data.LabelledRows;

/**
 * Measures each classifier's cost per prediction on one thread (not a test: timings are never asserted). Trains
 * every classifier with the shipped default settings on synthetic rows, then times {@code calls} predictions after
 * a warm-up and prints {@code name: value unit} lines, then the comparison table of the classifiers and balance
 * methods on the same rows.
 *
 * <p>Arguments (all optional): sorties, rows per sortie, calls. See the models README for the command.
 */
public final class PredictionCostHarness {
    private PredictionCostHarness() {
    }

    /**
     * Baseline in the same run: Smile's own {@code RandomForest.predict(Tuple, double[])} on the same rows, with
     * one schema and a reused posterior, as a caller would write it without our wrapper.
     */
    static double smileForestNs(ForestClassifier f, LabelledRows rows, long calls) {
        smile.classification.RandomForest rf = f.smileModel();
        smile.data.type.StructType schema = rf.schema();
        int n = Math.min(rows.rows(), 4096);
        double[][] x = new double[n][];
        for (int i = 0; i < n; i++) {
            x[i] = rows.row(i);
        }
        double[] p = new double[rf.numClasses()];
        long sink = 0;
        for (long i = 0; i < calls; i++) {
            sink += rf.predict(smile.data.Tuple.of(x[(int) (i % n)], schema), p);
        }
        long t0 = System.nanoTime();
        for (long i = 0; i < calls; i++) {
            sink += rf.predict(smile.data.Tuple.of(x[(int) (i % n)], schema), p);
        }
        long t1 = System.nanoTime();
        if (sink == Long.MIN_VALUE) {
            throw new IllegalStateException();
        }
        return (t1 - t0) / (double) calls;
    }

    public static void main(String[] args) {
        int sorties = args.length > 0 ? Integer.parseInt(args[0]) : 12;
        int perSortie = args.length > 1 ? Integer.parseInt(args[1]) : 1500;
        long calls = args.length > 2 ? Long.parseLong(args[2]) : 200_000;
        LabelledRows rows = SyntheticRows.make(sorties, perSortie, 2031, 0.6);
        TrainerSettings settings = TrainerSettings.defaults();
        System.out.println("rows: " + rows.rows());
        System.out.println("features: " + rows.featureCount());
        System.out.println("classes: " + SyntheticRows.CLASSES);
        for (ClassifierKind k : ClassifierKind.values()) {
            TrainerSettings s = settings.withClassifier(k);
            long t0 = System.nanoTime();
            Classifier c = new Trainer(s).fit(rows);
            double fitS = (System.nanoTime() - t0) * 1e-9;
            long n = k == ClassifierKind.SVM ? Math.max(1000, calls / 20) : calls;
            PredictionCost cost = PredictionCost.measure(c, rows, n, n);
            System.out.printf(java.util.Locale.ROOT, "%s.fit: %.1f s (%s)%n", k.key(), fitS, s.balance().describe());
            System.out.printf(java.util.Locale.ROOT, "%s.predict: %.0f ns per call%n", k.key(), cost.nsPerCall());
            System.out.printf(java.util.Locale.ROOT, "%s.allocated: %.1f bytes per call%n", k.key(),
                    cost.bytesPerCall());
            if (c instanceof ForestClassifier f) {
                double smileNs = smileForestNs(f, rows, n);
                System.out.printf(java.util.Locale.ROOT, "forest.smile-own-soft-predict: %.0f ns per call "
                        + "(ours / Smile's: %.2f)%n", smileNs, cost.nsPerCall() / smileNs);
            }
        }
        if (args.length > 3 && args[3].equals("compare")) {
            ComparisonResult r = Comparison.everything(settings, 0).run(rows, (f, label) -> {
                System.err.printf(java.util.Locale.ROOT, "\r%5.1f %% %-70s", 100 * f, label);
            });
            System.err.println();
            List<String> table = r.table();
            table.forEach(System.out::println);
        }
    }
}
