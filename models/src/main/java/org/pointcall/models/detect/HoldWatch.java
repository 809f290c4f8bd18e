package org.pointcall.models.detect;

import org.pointcall.shared.units.Units;

/**
 * {@code hold-signature}: finds a stabilised point in the air data and attitude alone, without the classifier, for
 * an airframe whose holds the classifier does not call: steady, unaccelerated, wings-level flight, held.
 *
 * <p>Steady means, on values smoothed first-order over {@link #SMOOTHING_S} (a gust or a noisy sample is not the
 * pilot moving): climb rate within {@link #CLIMB_MPS}, CAS rate within {@link #CAS_RATE_MPS2}, bank within
 * {@link #BANK_RAD}, Nz within {@link #NZ_OFF} of 1 g and roll rate within {@link #P_RAD_S} (common practice for a
 * trimmed steady point, thresholds from memory; none depends on the airframe). Hp and CAS are needed; bank, Nz and
 * P are checked when the source has them. A run of steady flight survives an unsteady stretch up to
 * {@link #BRIDGE_NS}; a stale input (no fresh sample for {@link #STALE_NS}) ends it.
 *
 * <p>Allocation-free; single-threaded, fed every frame.
 */
final class HoldWatch {
    static final double DEG = Math.PI / 180;
    static final double SMOOTHING_S = 1.5;
    static final double CLIMB_MPS = 50 * Units.M_PER_FT / 60;
    static final double CAS_RATE_MPS2 = 0.06 * Units.MPS_PER_KT;
    static final double BANK_RAD = 3 * DEG;
    static final double NZ_OFF = 0.05;
    static final double P_RAD_S = 3 * DEG;
    static final long BRIDGE_NS = 1_000_000_000L;
    static final long STALE_NS = 2_000_000_000L;
    static final long NONE = PointEvent.UNKNOWN_NS;

    private final SmoothedRate[] signal = new SmoothedRate[5];
    private long steadySinceNs = NONE;
    private long lastSteadyNs = NONE;
    private long unsteadySinceNs = NONE;
    /** The last steady instant of the run that ended most recently, or {@link #NONE}. */
    private long endedRunNs = NONE;

    private static final int HP = 0;
    private static final int CAS = 1;
    private static final int ROLL = 2;
    private static final int NZ = 3;
    private static final int P = 4;

    HoldWatch() {
        for (int i = 0; i < signal.length; i++) {
            signal[i] = new SmoothedRate(SMOOTHING_S);
        }
        clear();
    }

    /** Forgets everything (a new stream). */
    void clear() {
        for (SmoothedRate x : signal) {
            x.clear();
        }
        reset();
    }

    /** Forgets the current run; the smoothed values stay. */
    void reset() {
        steadySinceNs = NONE;
        lastSteadyNs = NONE;
        unsteadySinceNs = NONE;
        endedRunNs = NONE;
    }

    void onState(PhysicalState s) {
        long t = s.timeNs();
        take(HP, s, PhysicalQuantity.HP, s.hpM(), t);
        take(CAS, s, PhysicalQuantity.CAS, s.casMps(), t);
        take(ROLL, s, PhysicalQuantity.ROLL, s.rollRad(), t);
        take(NZ, s, PhysicalQuantity.NZ, s.nz(), t);
        take(P, s, PhysicalQuantity.P, s.pRadS(), t);
        boolean steady = steadyNow(t);
        if (steady) {
            unsteadySinceNs = NONE;
            if (steadySinceNs == NONE) {
                steadySinceNs = t;
            }
            lastSteadyNs = t;
        } else if (steadySinceNs != NONE) {
            if (unsteadySinceNs == NONE) {
                unsteadySinceNs = t;
            }
            if (t - unsteadySinceNs > BRIDGE_NS) {
                long end = lastSteadyNs;
                reset();
                endedRunNs = end;
            }
        }
    }

    private void take(int i, PhysicalState s, PhysicalQuantity q, double v, long t) {
        SmoothedRate x = signal[i];
        if (!s.fresh(q) || !Double.isFinite(v)) {
            if (x.lastNs() != NONE && t - x.lastNs() > STALE_NS) {
                x.clear();
            }
            return;
        }
        x.add(v, t);
    }

    private boolean steadyNow(long t) {
        double climb = signal[HP].rate();
        double casRate = signal[CAS].rate();
        double roll = signal[ROLL].value();
        double nz = signal[NZ].value();
        double p = signal[P].value();
        if (Double.isNaN(climb) || Double.isNaN(casRate)) {
            return false;
        }
        return Math.abs(climb) <= CLIMB_MPS && Math.abs(casRate) <= CAS_RATE_MPS2
                && (Double.isNaN(roll) || Math.abs(roll) <= BANK_RAD)
                && (Double.isNaN(nz) || Math.abs(nz - 1) <= NZ_OFF)
                && (Double.isNaN(p) || Math.abs(p) <= P_RAD_S);
    }

    /** Start of the current steady run, or {@link #NONE}. */
    long steadySinceNs() {
        return steadySinceNs;
    }

    /** The last instant of the current run that was steady, or {@link #NONE}. */
    long lastSteadyNs() {
        return lastSteadyNs;
    }

    /** The last steady instant of the run that ended most recently (since the last reset), or {@link #NONE}. */
    long endedRunNs() {
        return endedRunNs;
    }

    /** True while a run is under way (steady now, or unsteady for no longer than the bridge). */
    boolean holding() {
        return steadySinceNs != NONE;
    }

    /** How long the current run has lasted up to its last steady instant, ns; 0 with none. */
    long heldNs() {
        return steadySinceNs == NONE ? 0 : lastSteadyNs - steadySinceNs;
    }

    /** The smoothed climb rate, m/s, and CAS rate, m/s^2, for the evidence. */
    String describe() {
        return String.format(java.util.Locale.ROOT, "steady from %.3f s to %.3f s (climb within %.0f ft/min, CAS"
                + " within %.2f kt/s, wings level, 1 g)", steadySinceNs / 1e9, lastSteadyNs / 1e9,
                CLIMB_MPS / Units.M_PER_FT * 60, CAS_RATE_MPS2 / Units.MPS_PER_KT);
    }
}
