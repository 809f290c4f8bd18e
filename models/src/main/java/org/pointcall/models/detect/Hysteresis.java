package org.pointcall.models.detect;

/**
 * A two-level switch on one probability with a hold time each way: off to on once {@code p > onLevel} has held at
 * every tick for {@code onS}, on to off once {@code p < offLevel} has held for {@code offS}. Between the levels
 * nothing changes, which is the asymmetry that stops a point flickering at one threshold. Each switch is dated back
 * to the first tick of the stretch that caused it ({@link #edgeNs}), so callers know when the condition began, not
 * only when it was confirmed. With both levels equal it is a debounced threshold.
 *
 * <p>Plain fields, no allocation. Single-threaded.
 */
public final class Hysteresis {
    private final double onLevel;
    private final double offLevel;
    private final long onNs;
    private final long offNs;
    private boolean on;
    private long edgeNs = PointEvent.UNKNOWN_NS;
    private long pendingNs = PointEvent.UNKNOWN_NS;

    /**
     * @param onLevel  switch on above this
     * @param onS      after it held this long, s
     * @param offLevel switch off below this, at most {@code onLevel}
     * @param offS     after it held this long, s
     */
    public Hysteresis(double onLevel, double onS, double offLevel, double offS) {
        if (!(offLevel <= onLevel)) {
            throw new IllegalArgumentException("off level " + offLevel + " must not exceed on level " + onLevel);
        }
        if (!(onS >= 0) || !(offS >= 0) || Double.isInfinite(onS) || Double.isInfinite(offS)) {
            throw new IllegalArgumentException("hold times must be finite and >= 0, got " + onS + " and " + offS);
        }
        this.onLevel = onLevel;
        this.offLevel = offLevel;
        this.onNs = Math.round(onS * 1e9);
        this.offNs = Math.round(offS * 1e9);
    }

    /** Takes one tick and returns whether the switch is on after it. */
    public boolean update(long timeNs, double p) {
        boolean opposing = on ? p < offLevel : p > onLevel;
        if (!opposing) {
            pendingNs = PointEvent.UNKNOWN_NS;
            return on;
        }
        if (pendingNs == PointEvent.UNKNOWN_NS) {
            pendingNs = timeNs;
        }
        if (timeNs - pendingNs >= (on ? offNs : onNs)) {
            on = !on;
            edgeNs = pendingNs;
            pendingNs = PointEvent.UNKNOWN_NS;
        }
        return on;
    }

    public boolean isOn() {
        return on;
    }

    /** First tick of the stretch that caused the latest switch; {@link PointEvent#UNKNOWN_NS} before any. */
    public long edgeNs() {
        return edgeNs;
    }

    /**
     * First tick of the current stretch arguing for the other state (above the on level while off, below the off
     * level while on), or {@link PointEvent#UNKNOWN_NS} when there is none.
     */
    public long pendingNs() {
        return pendingNs;
    }

    /**
     * Start of the latest rise: the edge while on, the pending stretch while off, {@link PointEvent#UNKNOWN_NS}
     * when off and nothing is rising.
     */
    public long riseNs() {
        return on ? edgeNs : pendingNs;
    }

    /**
     * Start of the latest fall: the edge while off (if there was one), the pending stretch while on,
     * {@link PointEvent#UNKNOWN_NS} otherwise.
     */
    public long fallNs() {
        return on ? pendingNs : edgeNs;
    }

    /** Back to off, with no history. */
    public void reset() {
        on = false;
        edgeNs = PointEvent.UNKNOWN_NS;
        pendingNs = PointEvent.UNKNOWN_NS;
    }
}
