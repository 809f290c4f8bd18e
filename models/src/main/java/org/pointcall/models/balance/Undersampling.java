package org.pointcall.models.balance;

import java.util.Arrays;
import java.util.SplittableRandom;

import org.pointcall.models.data.LabelledRows;

/**
 * Random undersampling of the majority class: every row of the other classes is kept, and of the majority class a
 * seeded uniform random subset of {@code round(ratio * m)} rows, where {@code m} is the row count of the largest
 * other class. A majority class already at or below that target is kept whole (nothing is ever duplicated).
 * Kept rows stay in their original order.
 */
public final class Undersampling {
    private Undersampling() {
    }

    /**
     * Indices of the rows to keep, ascending.
     *
     * @param classIndex    class of each row
     * @param majorityClass the class to thin out
     * @param ratio         majority rows per row of the largest other class after undersampling, positive
     * @param seed          seed of the random choice: the same inputs and seed keep the same rows
     */
    public static int[] keptRows(int[] classIndex, int majorityClass, double ratio, long seed) {
        if (!(ratio > 0) || Double.isInfinite(ratio)) {
            throw new IllegalArgumentException("undersampling ratio must be a positive number, got " + ratio);
        }
        int majority = 0;
        int maxClass = majorityClass;
        for (int c : classIndex) {
            maxClass = Math.max(maxClass, c);
        }
        int[] counts = new int[maxClass + 1];
        for (int c : classIndex) {
            counts[c]++;
        }
        majority = counts[majorityClass];
        int largestOther = 0;
        for (int c = 0; c < counts.length; c++) {
            if (c != majorityClass) {
                largestOther = Math.max(largestOther, counts[c]);
            }
        }
        long target = Math.round(ratio * largestOther);
        if (target >= majority) {
            int[] all = new int[classIndex.length];
            for (int i = 0; i < all.length; i++) {
                all[i] = i;
            }
            return all;
        }
        int[] majorityRows = new int[majority];
        int m = 0;
        for (int i = 0; i < classIndex.length; i++) {
            if (classIndex[i] == majorityClass) {
                majorityRows[m++] = i;
            }
        }
        // partial Fisher-Yates: the first `target` entries become a uniform random subset
        SplittableRandom rnd = new SplittableRandom(seed);
        int keep = (int) target;
        for (int i = 0; i < keep; i++) {
            int j = i + rnd.nextInt(majority - i);
            int tmp = majorityRows[i];
            majorityRows[i] = majorityRows[j];
            majorityRows[j] = tmp;
        }
        boolean[] kept = new boolean[classIndex.length];
        for (int i = 0; i < classIndex.length; i++) {
            kept[i] = classIndex[i] != majorityClass;
        }
        for (int i = 0; i < keep; i++) {
            kept[majorityRows[i]] = true;
        }
        int[] out = new int[classIndex.length - majority + keep];
        int k = 0;
        for (int i = 0; i < kept.length; i++) {
            if (kept[i]) {
                out[k++] = i;
            }
        }
        return Arrays.copyOf(out, k);
    }

    /** Undersamples the most frequent class (the lowest index on a tie; in flight data, {@code none}). */
    public static LabelledRows apply(LabelledRows rows, double ratio, long seed) {
        int[] counts = rows.classCounts();
        int majority = 0;
        for (int c = 1; c < counts.length; c++) {
            if (counts[c] > counts[majority]) {
                majority = c;
            }
        }
        return apply(rows, majority, ratio, seed);
    }

    public static LabelledRows apply(LabelledRows rows, int majorityClass, double ratio, long seed) {
        return rows.select(keptRows(rows.classIndices(), majorityClass, ratio, seed));
    }
}
