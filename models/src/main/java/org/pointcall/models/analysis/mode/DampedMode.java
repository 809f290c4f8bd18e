package org.pointcall.models.analysis.mode;

/**
 * A damped second-order mode {@code s^2 + 2 zeta wn s + wn^2}, as identified from a response.
 *
 * @param naturalFrequencyRadS undamped natural frequency wn
 * @param dampingRatio         zeta; negative for a divergent mode
 * @param dampedFrequencyRadS  wd = wn sqrt(1 - zeta^2) (0 when not oscillatory)
 */
public record DampedMode(double naturalFrequencyRadS, double dampingRatio, double dampedFrequencyRadS) {
    public static final DampedMode NONE = new DampedMode(Double.NaN, Double.NaN, Double.NaN);

    /** The mode with decay rate {@code sigma} (1/s, positive when decaying) and damped frequency {@code wd}. */
    public static DampedMode ofDecay(double sigma, double wd) {
        double wn = Math.hypot(sigma, wd);
        return new DampedMode(wn, wn > 0 ? sigma / wn : Double.NaN, wd);
    }

    public boolean isValid() {
        return Double.isFinite(naturalFrequencyRadS) && Double.isFinite(dampingRatio);
    }

    /** Damped period 2 pi / wd, s; NaN when not oscillatory. */
    public double periodS() {
        return dampedFrequencyRadS > 0 ? 2 * Math.PI / dampedFrequencyRadS : Double.NaN;
    }
}
