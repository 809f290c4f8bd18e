package org.pointcall.models.train;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;

import org.pointcall.ingest.window.WindowSpec;
import org.pointcall.models.data.LabelledRows;
import org.pointcall.models.data.SortieInfo;
import org.pointcall.models.modelfile.ModelDescription;

/**
 * Labelled rows made up for tests: six classes ({@code none} and the first five kinds) as separable but noisy
 * Gaussian clusters, over the 12 features of two windows, in several sorties of two airframes, {@code none} the
 * majority as in flight data.
 *
 * <p>Features: 0..5 carry one class each (mean 3 for that class, 0 otherwise, unit noise), 6 is feature 1 again in
 * other units (1000 + 200 x, so that standardisation matters), 7..10 are noise, 11 is constant. Each sortie adds
 * its own offset (sd 0.3) to every noisy feature, as an airframe or day would.
 */
public final class SyntheticRows {
    /** The windows whose feature names the rows carry. */
    public static final List<WindowSpec> WINDOWS = List.of(WindowSpec.of("KCAS", 2.0), WindowSpec.of("AoA", 2.0));
    public static final List<String> FEATURES = ModelDescription.featureNames(WINDOWS);
    /** Class indices used: none and the first five kinds. */
    public static final int CLASSES = 6;
    public static final int NOISE_FEATURE = 8;
    public static final int CONSTANT_FEATURE = 11;

    private SyntheticRows() {
    }

    /**
     * @param sorties     sorties, the first half flown by {@code airframe-a}, the rest by {@code airframe-b}
     * @param rowsPerSortie rows of each sortie
     * @param seed        every random draw
     */
    public static LabelledRows make(int sorties, int rowsPerSortie, long seed) {
        return make(sorties, rowsPerSortie, seed, 1.0);
    }

    /** With class means {@code separation} times the standard ones (1: easy; smaller: harder). */
    public static LabelledRows make(int sorties, int rowsPerSortie, long seed, double separation) {
        SplittableRandom r = new SplittableRandom(seed);
        List<SortieInfo> infos = new ArrayList<>();
        for (int s = 0; s < sorties; s++) {
            infos.add(new SortieInfo("sortie-" + (s + 1), s < (sorties + 1) / 2 ? "airframe-a" : "airframe-b",
                    "", ""));
        }
        LabelledRows.Builder b = LabelledRows.builder(FEATURES, infos);
        int d = FEATURES.size();
        double[] row = new double[d];
        for (int s = 0; s < sorties; s++) {
            double[] offset = new double[d];
            for (int f = 0; f < d; f++) {
                offset[f] = 0.3 * r.nextGaussian();
            }
            for (int i = 0; i < rowsPerSortie; i++) {
                double u = r.nextDouble();
                // none 55 %, each of the five kinds 9 %
                int c = u < 0.55 ? 0 : 1 + Math.min(4, (int) ((u - 0.55) / 0.09));
                for (int f = 0; f < d; f++) {
                    row[f] = offset[f] + r.nextGaussian();
                }
                for (int f = 0; f < CLASSES; f++) {
                    if (f == c) {
                        row[f] += 3.0 * separation;
                    }
                }
                row[6] = 1000 + 200 * row[1];
                row[CONSTANT_FEATURE] = 0.0;
                b.add(row, c, (long) i * 50_000_000L, s, false);
            }
        }
        return b.build();
    }
}
