package org.pointcall.models.detect;

/** How class probabilities are smoothed over time before the hysteresis sees them. */
public enum Smoothing {
    /** Raw probabilities, unchanged (for comparison). */
    NONE,
    /** First-order low pass with time constant {@code smoothingS}, exact for uneven tick spacing. */
    EXPONENTIAL,
    /** Mean of the ticks in the last {@code smoothingS} seconds. */
    MOVING_AVERAGE;

    /** A fresh smoother of this kind for {@code classes} probabilities. */
    public Smoother create(double smoothingS, int classes) {
        switch (this) {
            case NONE:
                return new PassThroughSmoother(classes);
            case EXPONENTIAL:
                return new ExponentialSmoother(smoothingS, classes);
            default:
                return new MovingAverageSmoother(smoothingS, classes);
        }
    }
}
