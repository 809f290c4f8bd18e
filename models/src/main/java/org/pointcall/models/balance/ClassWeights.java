package org.pointcall.models.balance;

import org.pointcall.models.data.LabelledRows;

/**
 * Class weights by inverse frequency, for classifiers that weigh rows instead of resampling them. For the
 * {@code K} classes that have rows, {@code w_c = n / (K n_c)}; a class with no row weighs 0. Normalised so that
 * the weights of all rows sum to {@code n} (a mean row weight of 1) and every class present weighs
 * {@code n / K} in total, as much as any other.
 */
public final class ClassWeights {
    private ClassWeights() {
    }

    /** One weight per class index in {@code [0, classCount)}. */
    public static double[] inverseFrequency(int[] classIndex, int classCount) {
        int[] counts = new int[classCount];
        for (int c : classIndex) {
            counts[c]++;
        }
        int present = 0;
        for (int c : counts) {
            if (c > 0) {
                present++;
            }
        }
        double[] w = new double[classCount];
        for (int c = 0; c < classCount; c++) {
            w[c] = counts[c] == 0 ? 0.0 : classIndex.length / ((double) present * counts[c]);
        }
        return w;
    }

    /** One weight per class of {@link LabelledRows#CLASS_NAMES}. */
    public static double[] inverseFrequency(LabelledRows rows) {
        return inverseFrequency(rows.classIndices(), LabelledRows.classCount());
    }

    /** Each row's weight, {@code classWeights[classIndex[i]]}. */
    public static double[] rowWeights(int[] classIndex, double[] classWeights) {
        double[] w = new double[classIndex.length];
        for (int i = 0; i < w.length; i++) {
            w[i] = classWeights[classIndex[i]];
        }
        return w;
    }
}
