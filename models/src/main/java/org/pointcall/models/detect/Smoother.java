package org.pointcall.models.detect;

/**
 * Smooths a vector of class probabilities tick by tick. Implementations keep all their state in arrays sized at
 * construction (a moving average may grow its ring while warming up) and allocate nothing per tick. Linear
 * smoothers keep a probability vector summing to one. Single-threaded.
 */
public interface Smoother {
    /** Forgets the history: the next tick's output equals its input. */
    void reset();

    /**
     * Smooths one tick.
     *
     * @param timeNs data time, after the previous tick's
     * @param raw    probabilities of this tick
     * @param out    receives the smoothed probabilities; may not be {@code raw}
     */
    void smooth(long timeNs, double[] raw, double[] out);

    /**
     * Upper bound on the time, in seconds, from the first tick of a step in the input from {@code from} to
     * {@code to} (held constant) until the output exceeds {@code threshold}: 0 when {@code from} already does,
     * infinite when {@code to} never does. Lets callers bound the live-begin delay without running anything.
     */
    double stepDelayS(double from, double to, double threshold);
}
