package org.pointcall.models.detect;

/**
 * A signal smoothed first-order over a time constant, and its rate of change smoothed the same way: the physics
 * watches' view of a noisy parameter (a gust or a noisy sample is not the pilot moving). The first sample is taken
 * as it is and has no rate; a sample not after the last one is ignored. Allocation-free; single-threaded.
 */
public final class SmoothedRate {
    private static final long NONE = PointEvent.UNKNOWN_NS;
    private final double tauS;
    private double value;
    private double rate;
    private long lastNs;

    /** @param tauS the time constant, s, above 0 */
    public SmoothedRate(double tauS) {
        if (!(tauS > 0 && Double.isFinite(tauS))) {
            throw new IllegalArgumentException("a smoothing time constant must be above 0 s");
        }
        this.tauS = tauS;
        clear();
    }

    /** Forgets every sample. */
    public void clear() {
        value = Double.NaN;
        rate = Double.NaN;
        lastNs = NONE;
    }

    /** Takes a finite sample at data time {@code timeNs}. */
    public void add(double v, long timeNs) {
        if (lastNs == NONE) {
            value = v;
            lastNs = timeNs;
            return;
        }
        double dt = (timeNs - lastNs) * 1e-9;
        if (dt <= 0) {
            return;
        }
        double a = 1 - Math.exp(-dt / tauS);
        double before = value;
        value += a * (v - value);
        double r = (value - before) / dt;
        rate = Double.isNaN(rate) ? r : rate + a * (r - rate);
        lastNs = timeNs;
    }

    /** The smoothed value, NaN before the first sample. */
    public double value() {
        return value;
    }

    /** The smoothed rate per second, NaN before the second sample. */
    public double rate() {
        return rate;
    }

    /** Data time of the last sample taken, {@link PointEvent#UNKNOWN_NS} before the first. */
    public long lastNs() {
        return lastNs;
    }
}
