package org.pointcall.models.train;

import java.util.Arrays;
import java.util.SplittableRandom;

import smile.classification.OneVersusRest;
import smile.classification.PlattScaling;
import smile.classification.SVM;
import smile.math.MathEx;
import smile.math.kernel.GaussianKernel;

/**
 * Gaussian-kernel SVMs, one per class against the rest, with Platt scaling of each decision value into a
 * probability and the probabilities normalised to sum to 1 (Smile's {@link OneVersusRest}). Smile 3.1.1's SVM is
 * binary only (LASVM solver), so the one-against-rest set is fitted here, one class at a time on the calling thread
 * with Smile's generator seeded, which makes it deterministic (Smile's own multi-class fit runs the classes on a
 * parallel stream whose threads' generators are not seeded).
 *
 * <p>Kernel machines do not scale: the SVMs are fitted on a class-stratified random subsample of at most
 * {@link SvmSettings#rowCap()} rows, and each class's Platt scaling on up to {@link SvmSettings#calibrationRows()}
 * other training rows (on the fitted rows themselves when a class has no row left over). Features are standardised and
 * missing values imputed by training medians. A call allocates nothing; its cost grows with the support vectors.
 */
public final class SvmClassifier extends Classifier {
    private static final long serialVersionUID = 1L;
    /** Fewest rows of a class kept in the subsample (all of them when it has fewer). */
    static final int MIN_ROWS_PER_CLASS = 20;

    private final OneVersusRest<double[]> model;
    private final int fittedRows;
    private final int calibrationRowsUsed;

    private SvmClassifier(TrainingData data, FeaturePrep prep, SvmSettings settings, OneVersusRest<double[]> model,
                          int fittedRows, int calibrationRowsUsed) {
        super(ClassifierKind.SVM, data.featureNames, data.map, data.outputClass, prep, data.rowsPerClass, settings.asMap());
        this.model = model;
        this.fittedRows = fittedRows;
        this.calibrationRowsUsed = calibrationRowsUsed;
    }

    static SvmClassifier fit(TrainingData data, SvmSettings s, long seed) {
        SplittableRandom rnd = new SplittableRandom(seed);
        boolean[] taken = new boolean[data.n];
        int[] fitRows = stratified(data, s.rowCap(), taken, rnd);
        int[] calRows = stratified(data, s.calibrationRows(), taken, rnd);
        boolean inSample = !everyClassIn(data, calRows);
        if (inSample) {
            calRows = fitRows;
        }
        FeaturePrep prep = FeaturePrep.fit(data.x, data.n, data.d, true, data.names());
        double[][] all = prep.applyAll(data.x, data.n);
        double[][] fx = pick(all, fitRows);
        double[][] cx = pick(all, calRows);
        int k = data.outputs();
        GaussianKernel kernel = new GaussianKernel(Math.sqrt(1.0 / (2.0 * s.gammaFor(data.d))));
        @SuppressWarnings("unchecked")
        smile.classification.Classifier<double[]>[] binaries = new smile.classification.Classifier[k];
        PlattScaling[] platt = new PlattScaling[k];
        int[] fy = new int[fitRows.length];
        int[] cy = new int[calRows.length];
        double[] scores = new double[calRows.length];
        for (int j = 0; j < k; j++) {
            for (int i = 0; i < fitRows.length; i++) {
                fy[i] = data.y[fitRows[i]] == j ? 1 : -1;
            }
            MathEx.setSeed(seed + 31L * (j + 1));
            SVM<double[]> svm = SVM.fit(fx, fy, kernel, s.c(), s.tolerance());
            binaries[j] = svm;
            for (int i = 0; i < calRows.length; i++) {
                cy[i] = data.y[calRows[i]] == j ? 1 : -1;
                scores[i] = svm.score(cx[i]);
            }
            platt[j] = PlattScaling.fit(scores, cy);
        }
        return new SvmClassifier(data, prep, s, new OneVersusRest<>(binaries, platt), fitRows.length,
                inSample ? 0 : calRows.length);
    }

    /**
     * A class-stratified random choice of about {@code cap} rows not yet {@code taken} (marked taken on return),
     * ascending: each class gets its share of the cap, at least {@link #MIN_ROWS_PER_CLASS} (or all it has).
     */
    static int[] stratified(TrainingData data, int cap, boolean[] taken, SplittableRandom rnd) {
        int k = data.outputs();
        int[][] free = new int[k][];
        int[] count = new int[k];
        for (int i = 0; i < data.n; i++) {
            if (!taken[i]) {
                count[data.y[i]]++;
            }
        }
        int total = 0;
        for (int j = 0; j < k; j++) {
            free[j] = new int[count[j]];
            total += count[j];
        }
        if (cap == 0 || total == 0) {
            return new int[0];
        }
        int[] fill = new int[k];
        for (int i = 0; i < data.n; i++) {
            if (!taken[i]) {
                free[data.y[i]][fill[data.y[i]]++] = i;
            }
        }
        int[] out = new int[Math.max(total, 0)];
        int m = 0;
        for (int j = 0; j < k; j++) {
            int quota = total <= cap ? count[j] : (int) Math.round((double) cap * count[j] / total);
            quota = Math.min(count[j], Math.max(quota, Math.min(count[j], MIN_ROWS_PER_CLASS)));
            int[] f = free[j];
            for (int i = 0; i < quota; i++) {
                int r = i + rnd.nextInt(f.length - i);
                int tmp = f[i];
                f[i] = f[r];
                f[r] = tmp;
                out[m++] = f[i];
                taken[f[i]] = true;
            }
        }
        int[] rows = Arrays.copyOf(out, m);
        Arrays.sort(rows);
        return rows;
    }

    /** Whether every output class has a row among {@code rows}: Platt scaling needs positives of each. */
    private static boolean everyClassIn(TrainingData data, int[] rows) {
        boolean[] seen = new boolean[data.outputs()];
        int left = seen.length;
        for (int r : rows) {
            if (!seen[data.y[r]]) {
                seen[data.y[r]] = true;
                left--;
            }
        }
        return left == 0;
    }

    private static double[][] pick(double[][] all, int[] rows) {
        double[][] out = new double[rows.length][];
        for (int i = 0; i < rows.length; i++) {
            out[i] = all[rows[i]];
        }
        return out;
    }

    public OneVersusRest<double[]> smileModel() {
        return model;
    }

    /** Rows the SVMs were fitted on (the subsample). */
    public int fittedRows() {
        return fittedRows;
    }

    /** Rows the Platt scaling was fitted on, outside the subsample; 0 when it was fitted on the subsample. */
    public int calibrationRows() {
        return calibrationRowsUsed;
    }

    @Override
    void predictOutputs(double[] x, double[] out) {
        model.predict(x, out);
    }
}
