package org.pointcall.models.balance;

import java.util.Objects;

/**
 * Settings of {@link Smote}.
 *
 * @param k        nearest minority neighbours each synthetic sample may be drawn towards (5 in the published method)
 * @param seed     seed of every random choice: the same inputs and seed give the same samples
 * @param distance how nearness is measured
 */
public record SmoteSettings(int k, long seed, NeighbourDistance distance) {
    /** The published method's k. */
    public static final int DEFAULT_K = 5;

    public SmoteSettings {
        if (k < 1) {
            throw new IllegalArgumentException("SMOTE needs k >= 1 neighbours, got " + k);
        }
        Objects.requireNonNull(distance, "distance");
    }

    /** k = 5, Euclidean distance, this seed. */
    public static SmoteSettings withSeed(long seed) {
        return new SmoteSettings(DEFAULT_K, seed, NeighbourDistance.EUCLIDEAN);
    }

    public SmoteSettings withK(int neighbours) {
        return new SmoteSettings(neighbours, seed, distance);
    }

    public SmoteSettings withDistance(NeighbourDistance d) {
        return new SmoteSettings(k, seed, d);
    }
}
