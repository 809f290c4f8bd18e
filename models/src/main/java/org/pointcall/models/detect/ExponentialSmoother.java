package org.pointcall.models.detect;

/**
 * First-order low pass {@code s += a (x - s)} with {@code a = 1 - exp(-dt / tau)}, so that uneven tick spacing and
 * dropped ticks give the same response as the continuous filter sampled at the tick times. The first tick after
 * construction or {@link #reset} passes through.
 */
public final class ExponentialSmoother implements Smoother {
    private final double tauNs;
    private final double tauS;
    private final double[] state;
    private long lastNs;
    private boolean primed;

    public ExponentialSmoother(double tauS, int classes) {
        if (!(tauS > 0) || Double.isInfinite(tauS)) {
            throw new IllegalArgumentException("smoothing time constant must be a positive number of seconds, got "
                    + tauS);
        }
        if (classes <= 0) {
            throw new IllegalArgumentException("need at least one class");
        }
        this.tauS = tauS;
        this.tauNs = tauS * 1e9;
        this.state = new double[classes];
    }

    @Override
    public void reset() {
        primed = false;
    }

    @Override
    public void smooth(long timeNs, double[] raw, double[] out) {
        int n = state.length;
        if (!primed) {
            System.arraycopy(raw, 0, state, 0, n);
            primed = true;
        } else {
            double a = -Math.expm1(-(timeNs - lastNs) / tauNs);
            for (int i = 0; i < n; i++) {
                state[i] += a * (raw[i] - state[i]);
            }
        }
        lastNs = timeNs;
        System.arraycopy(state, 0, out, 0, n);
    }

    /**
     * The continuous response {@code to - (to - from) exp(-t / tau)} reaches the threshold at
     * {@code tau ln((to - from) / (to - threshold))}; the sampled filter is at least one tick ahead of it.
     */
    @Override
    public double stepDelayS(double from, double to, double threshold) {
        if (from > threshold) {
            return 0.0;
        }
        if (!(to > threshold)) {
            return Double.POSITIVE_INFINITY;
        }
        return tauS * Math.log((to - from) / (to - threshold));
    }
}
