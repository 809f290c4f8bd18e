package org.pointcall.ingest.sim.model;

import java.util.SplittableRandom;

/**
 * Seeded standard normal deviates by Marsaglia's polar method over {@link SplittableRandom}, whose algorithm is
 * specified, so a seed gives the same sequence on every JVM. Allocation-free.
 */
final class GaussianSource {
    private final SplittableRandom random;
    private double spare;
    private boolean hasSpare;

    GaussianSource(long seed) {
        random = new SplittableRandom(seed);
    }

    double next() {
        if (hasSpare) {
            hasSpare = false;
            return spare;
        }
        double u;
        double v;
        double s;
        do {
            u = 2.0 * random.nextDouble() - 1.0;
            v = 2.0 * random.nextDouble() - 1.0;
            s = u * u + v * v;
        } while (s >= 1.0 || s == 0.0);
        double m = Math.sqrt(-2.0 * Math.log(s) / s);
        spare = v * m;
        hasSpare = true;
        return u * m;
    }

    boolean nextBoolean() {
        return random.nextBoolean();
    }
}
