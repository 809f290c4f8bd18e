package org.pointcall.ingest.sim.pilot;

import java.util.SplittableRandom;

/**
 * The pilot's seeded imperfection: small quick errors on what it commands (g, bank, sideslip) and slow drifts of
 * what it believes the targets to be (altitude, speed, heading), each a first-order Gauss-Markov process with the
 * stated standard deviation and correlation time. Sizes are those of a careful pilot on a test point (common
 * practice): a few thousandths of a g, half a degree of bank, a few feet and a few tenths of a knot drifting over a
 * minute or so.
 */
final class TrackingError {
    private static final double NZ_G = 0.008;
    private static final double NZ_TAU_S = 0.8;
    private static final double BANK_RAD = Math.toRadians(0.4);
    private static final double BANK_TAU_S = 1.5;
    private static final double BETA_RAD = Math.toRadians(0.12);
    private static final double BETA_TAU_S = 2.0;
    private static final double ALT_M = 2.0;
    private static final double ALT_TAU_S = 60.0;
    private static final double SPEED_MPS = 0.2;
    private static final double SPEED_TAU_S = 60.0;
    private static final double HEADING_RAD = Math.toRadians(0.6);
    private static final double HEADING_TAU_S = 60.0;

    private final SplittableRandom random;
    private final double baseScale;
    private double scale;
    private double nz;
    private double bank;
    private double beta;
    private double alt;
    private double speed;
    private double heading;

    TrackingError(long seed, double scale) {
        this.random = new SplittableRandom(seed);
        this.baseScale = scale;
        this.scale = scale;
    }

    /** Loosens (factor above 1) or restores (1) the tracking for one point. */
    void setLooseness(double factor) {
        scale = baseScale * factor;
    }

    void advance(double dtS) {
        nz = markov(nz, NZ_G, NZ_TAU_S, dtS);
        bank = markov(bank, BANK_RAD, BANK_TAU_S, dtS);
        beta = markov(beta, BETA_RAD, BETA_TAU_S, dtS);
        alt = markov(alt, ALT_M, ALT_TAU_S, dtS);
        speed = markov(speed, SPEED_MPS, SPEED_TAU_S, dtS);
        heading = markov(heading, HEADING_RAD, HEADING_TAU_S, dtS);
    }

    private double markov(double x, double sigma, double tauS, double dtS) {
        double a = Math.exp(-dtS / tauS);
        // the random draw is taken even at zero scale, so that the scale never changes the sequence
        double n = nextGaussian();
        return a * x + Math.sqrt(1.0 - a * a) * sigma * n;
    }

    private double nextGaussian() {
        // Box-Muller on SplittableRandom, whose sequence is fixed by its specification for a seed
        double u1 = random.nextDouble();
        double u2 = random.nextDouble();
        return Math.sqrt(-2.0 * Math.log(1.0 - u1)) * Math.cos(2.0 * Math.PI * u2);
    }

    double nzG() {
        return scale * nz;
    }

    double bankRad() {
        return scale * bank;
    }

    double betaRad() {
        return scale * beta;
    }

    double altitudeM() {
        return scale * alt;
    }

    double speedMps() {
        return scale * speed;
    }

    double headingRad() {
        return scale * heading;
    }
}
