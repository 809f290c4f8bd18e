package org.pointcall.models.data;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Objects;
import java.util.SplittableRandom;
import java.util.function.Predicate;

import org.pointcall.shared.error.PointcallException;

/**
 * Splits labelled rows by sortie, never by row. Split before balancing: a set with synthetic rows is refused,
 * since a synthetic row mixes two measured ones that may sit on either side.
 */
public final class SortieSplits {
    private SortieSplits() {
    }

    /**
     * K-fold cross-validation by sortie: each sortie with rows is the test side of exactly one fold. Sorties are
     * dealt so that each fold's share of every class is as close to 1/k as whole sorties allow: in order of how
     * much of the rarer classes they carry (ties in a seeded random order), each goes to the fold where it least
     * increases the sum over classes of the squared difference between the fold's share of the class and 1/k;
     * every fold gets at least one sortie.
     *
     * @throws PointcallException when fewer sorties have rows than {@code k}, or the set has synthetic rows
     */
    public static List<SortieSplit> kFold(LabelledRows rows, int k, long seed) {
        refuseSynthetic(rows);
        if (k < 2) {
            throw new IllegalArgumentException("k-fold needs k >= 2, got " + k);
        }
        int[] perSortie = rows.sortieCounts();
        List<Integer> used = new ArrayList<>();
        for (int s = 0; s < perSortie.length; s++) {
            if (perSortie[s] > 0) {
                used.add(s);
            }
        }
        if (used.size() < k) {
            throw new PointcallException(k + "-fold cross-validation by sortie needs at least " + k
                    + " sorties with rows; the data set has " + used.size());
        }
        int classes = LabelledRows.classCount();
        int[][] counts = new int[perSortie.length][classes];
        int[] total = new int[classes];
        for (int i = 0; i < rows.rows(); i++) {
            counts[rows.sortieOf(i)][rows.classOf(i)]++;
            total[rows.classOf(i)]++;
        }
        // seeded shuffle, then a stable sort by the share of classes carried (rare classes weigh most)
        Integer[] order = used.toArray(new Integer[0]);
        SplittableRandom rnd = new SplittableRandom(seed);
        for (int i = order.length - 1; i > 0; i--) {
            int j = rnd.nextInt(i + 1);
            Integer tmp = order[i];
            order[i] = order[j];
            order[j] = tmp;
        }
        double[] weight = new double[perSortie.length];
        for (int s : used) {
            for (int c = 0; c < classes; c++) {
                if (total[c] > 0) {
                    weight[s] += counts[s][c] / (double) total[c];
                }
            }
        }
        Arrays.sort(order, (a, b) -> Double.compare(weight[b], weight[a]));

        double target = 1.0 / k;
        double[][] share = new double[k][classes];
        int[] foldSorties = new int[k];
        long[] foldRows = new long[k];
        int[] foldOf = new int[perSortie.length];
        Arrays.fill(foldOf, -1);
        int emptyFolds = k;
        for (int idx = 0; idx < order.length; idx++) {
            int s = order[idx];
            boolean mustFillEmpty = order.length - idx <= emptyFolds;
            int best = -1;
            double bestCost = Double.POSITIVE_INFINITY;
            for (int f = 0; f < k; f++) {
                if (mustFillEmpty && foldSorties[f] > 0) {
                    continue;
                }
                double cost = 0;
                for (int c = 0; c < classes; c++) {
                    if (total[c] == 0) {
                        continue;
                    }
                    double add = counts[s][c] / (double) total[c];
                    double before = share[f][c] - target;
                    double after = share[f][c] + add - target;
                    cost += after * after - before * before;
                }
                if (best < 0 || cost < bestCost - 1e-12 || (Math.abs(cost - bestCost) <= 1e-12
                        && (foldSorties[f] < foldSorties[best]
                        || foldSorties[f] == foldSorties[best] && foldRows[f] < foldRows[best]))) {
                    best = f;
                    bestCost = cost;
                }
            }
            if (foldSorties[best] == 0) {
                emptyFolds--;
            }
            foldOf[s] = best;
            foldSorties[best]++;
            foldRows[best] += perSortie[s];
            for (int c = 0; c < classes; c++) {
                if (total[c] > 0) {
                    share[best][c] += counts[s][c] / (double) total[c];
                }
            }
        }
        List<SortieSplit> folds = new ArrayList<>(k);
        for (int f = 0; f < k; f++) {
            final int fold = f;
            folds.add(split("fold " + (f + 1) + " of " + k, rows, s -> foldOf[s] == fold, foldOf));
        }
        return folds;
    }

    /**
     * A held-out test set of the sorties {@code heldOut} accepts (for example one airframe, or the latest
     * sorties); the others train.
     *
     * @throws PointcallException when either side would be empty, or the set has synthetic rows
     */
    public static SortieSplit holdOut(LabelledRows rows, Predicate<SortieInfo> heldOut) {
        Objects.requireNonNull(heldOut, "heldOut");
        refuseSynthetic(rows);
        List<SortieInfo> sorties = rows.sorties();
        boolean[] test = new boolean[sorties.size()];
        for (int s = 0; s < test.length; s++) {
            test[s] = heldOut.test(sorties.get(s));
        }
        SortieSplit split = split("held out", rows, s -> test[s], null);
        if (split.testRows().length == 0 || split.trainRows().length == 0) {
            throw new PointcallException("the held-out set leaves " + (split.testRows().length == 0
                    ? "no test rows" : "no training rows") + " (" + split.testSorties().size() + " of "
                    + sorties.size() + " sorties held out)");
        }
        return split;
    }

    private interface SortiePredicate {
        boolean test(int sortie);
    }

    private static SortieSplit split(String name, LabelledRows rows, SortiePredicate isTest, int[] foldOf) {
        int testCount = 0;
        for (int i = 0; i < rows.rows(); i++) {
            if (isTest.test(rows.sortieOf(i))) {
                testCount++;
            }
        }
        int[] train = new int[rows.rows() - testCount];
        int[] test = new int[testCount];
        int a = 0;
        int b = 0;
        for (int i = 0; i < rows.rows(); i++) {
            if (isTest.test(rows.sortieOf(i))) {
                test[b++] = i;
            } else {
                train[a++] = i;
            }
        }
        List<Integer> trainSorties = new ArrayList<>();
        List<Integer> testSorties = new ArrayList<>();
        for (int s = 0; s < rows.sorties().size(); s++) {
            if (foldOf != null && foldOf[s] < 0) {
                continue;
            }
            (isTest.test(s) ? testSorties : trainSorties).add(s);
        }
        return new SortieSplit(name, train, test, trainSorties, testSorties);
    }

    private static void refuseSynthetic(LabelledRows rows) {
        int syn = rows.syntheticRows();
        if (syn > 0) {
            throw new PointcallException("the data set has " + syn + " synthetic rows; split by sortie first and "
                    + "balance only the training side");
        }
    }
}
