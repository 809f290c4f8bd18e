package org.pointcall.models.card;

import java.util.ArrayList;
import java.util.List;

import org.pointcall.models.analysis.PointHistory;
import org.pointcall.models.detect.PhysicalQuantity;
import org.pointcall.models.detect.PhysicalState;
import org.pointcall.models.detect.SmoothedRate;
import org.pointcall.shared.card.Band;
import org.pointcall.shared.card.BandPhase;
import org.pointcall.shared.card.TestPoint;
import org.pointcall.shared.kind.ManoeuvreKind;
import org.pointcall.shared.units.Units;

/**
 * When the card's next point begins, from the card and the flight alone: the pilot sets the point up on its entry
 * and holds it steady, then starts it; the start is the first departure from that steady entry of the kind the point
 * begins with. The detector needs seconds of a manoeuvre to tell its kind; the card already says what comes next, so
 * the console can show the point flying within a second of its start, and the detector confirms it later (or the
 * session withdraws the begin).
 *
 * <p><b>Armed</b>: quiet flight (smoothed over {@link #SMOOTHING_S}: roll rate within {@link #QUIET_P}, pitch rate
 * within {@link #QUIET_Q} and Nz within {@link #QUIET_NZ}, each of its own held value, so that a steady turn is quiet
 * too; CAS rate within {@link #QUIET_CAS_RATE}: no manoeuvre under way) for {@link #ARM_NS}, with every band that describes where the point starts
 * near: each two-sided entry or throughout band widened by one band width on either side, each one-sided throughout
 * band (gear, flaps) as it is, but none on the throttle (the input of several points). A point without such a band
 * is never armed: quiet flight anywhere would do.
 *
 * <p><b>Departure</b>, by the kind's first move (each against the value held while armed; common practice for how
 * each test point is entered, thresholds from memory, none airframe-specific):
 * <ul>
 *   <li>stalls: slowing (CAS rate below -{@link #CAS_RATE}) or the throttle pulled back {@link #THROTTLE_PCT} %;</li>
 *   <li>level acceleration: speeding up (CAS rate above {@link #CAS_RATE}) or the throttle pushed up;</li>
 *   <li>loop: Nz up {@link #LOOP_NZ} g;</li>
 *   <li>wind-up turn: Nz up {@link #TURN_NZ} g, bank changed {@link #TURN_BANK_DEG} deg, roll rate
 *       {@link #ROLL_P_DEG} deg/s, or the throttle moved;</li>
 *   <li>aileron roll: roll rate {@link #ROLL_P_DEG} deg/s or pitch rate {@link #PITCH_Q_DEG} deg/s (the pitch-up
 *       first);</li>
 *   <li>pitch doublet: pitch rate {@link #PITCH_Q_DEG} deg/s;</li>
 *   <li>phugoid: pitch rate {@link #PHUGOID_Q_DEG} deg/s, Nz moved {@link #PHUGOID_NZ} g or CAS rate
 *       {@link #CAS_RATE};</li>
 *   <li>sideslip: sideslip moved {@link #BETA_DEG} deg or yaw rate {@link #YAW_DEG} deg/s (the rudder's first
 *       effect).</li>
 * </ul>
 * The throttle and the yaw rate (standard names {@link #THROTTLE}, {@link #YAW_RATE}) are read when the source
 * has them. A stabilised point has no departure (the session's condition watch begins it). The departure is dated to where the
 * move began: the last instant its signal was within half its threshold of the armed value.
 *
 * <p>Fed every frame; allocates only when the point changes. Single-threaded.
 */
final class OnsetWatch {
    static final long NONE = Long.MIN_VALUE;
    private static final double DEG = Math.PI / 180;
    static final double SMOOTHING_S = 0.3;
    /** CAS is smoothed longer, then differentiated and smoothed again, s. */
    static final double CAS_SMOOTHING_S = 0.5;
    static final long ARM_NS = 2_000_000_000L;
    static final double QUIET_P = 5 * DEG;
    static final double QUIET_Q = 1.5 * DEG;
    /** Pitch rate a steady turn adds (about 6 deg/s at 45 deg of bank and 100 kt), allowed when a quiet run starts. */
    static final double Q_TURN = 6 * DEG;
    static final double QUIET_CAS_RATE = 0.25 * Units.MPS_PER_KT;
    static final double QUIET_NZ = 0.1;
    /** Time constant of the armed values (the mean the departure is measured from), s. */
    static final double BASELINE_S = 2.0;
    static final double CAS_RATE = 0.4 * Units.MPS_PER_KT;
    static final double THROTTLE_PCT = 10;
    /** Time constant of the throttle's held value while the flight is not quiet, s. */
    static final double THROTTLE_BASELINE_S = 5.0;
    static final double LOOP_NZ = 0.3;
    static final double TURN_NZ = 0.2;
    static final double TURN_BANK_DEG = 10;
    static final double ROLL_P_DEG = 10;
    static final double PITCH_Q_DEG = 2.5;
    static final double PHUGOID_Q_DEG = 1.5;
    static final double PHUGOID_NZ = 0.1;
    static final double BETA_DEG = 1.0;
    /** A sample older than this is no value, ns. */
    static final long STALE_NS = 2_000_000_000L;
    /** The standard name of the power lever's position (percent of travel), read from the history when recorded. */
    static final String THROTTLE = "Throttle";
    /** The standard name of the body yaw rate, read from the history when recorded. */
    static final String YAW_RATE = "R";
    static final double YAW_DEG = 1.5;

    // signals, smoothed
    private static final int NZ = 0;
    private static final int P = 1;
    private static final int Q = 2;
    private static final int BETA = 3;
    private static final int BANK = 4;
    private static final int CAS_RATE_I = 5;
    private static final int THR = 6;
    private static final int YAW = 7;
    private static final int N = 8;
    private static final String[] NAMES = {"Nz", "roll rate", "pitch rate", "sideslip", "bank", "CAS rate",
        "throttle", "yaw rate"};
    private static final String[] UNITS = {"g", "deg/s", "deg/s", "deg", "deg", "kt/s", "%", "deg/s"};
    private static final double[] SHOW = {1, 1 / DEG, 1 / DEG, 1 / DEG, 1 / DEG, 1 / Units.MPS_PER_KT, 1, 1 / DEG};

    /** Per signal, smoothed; the CAS-rate signal is the rate of the smoothed CAS ({@link #v}). */
    private final SmoothedRate[] signal = new SmoothedRate[N];
    private final double[] base = new double[N];
    /** Per signal, the threshold of the departure for the watched kind (0: not a cue), and its sign (0: either). */
    private final double[] threshold = new double[N];
    private final int[] sign = new int[N];
    /** Per signal, the last instant it was within half its threshold of the armed value. */
    private final long[] nearNs = new long[N];

    private TestPoint point;
    private final List<Band> bands = new ArrayList<>();
    private long quietSinceNs = NONE;
    private long followedNs = NONE;
    private boolean armed;
    private long armedNs = NONE;
    private long departedNs = NONE;
    private long departureBeginNs = NONE;
    private String cue;

    OnsetWatch() {
        for (int i = 0; i < N; i++) {
            signal[i] = new SmoothedRate(i == CAS_RATE_I ? CAS_SMOOTHING_S : SMOOTHING_S);
        }
    }

    /** True when a point of this kind begins with a departure this watch can see. */
    static boolean watches(ManoeuvreKind kind) {
        return kind != ManoeuvreKind.STABILISED;
    }

    /** Forgets the point and its arming; the smoothed signals stay. */
    void reset() {
        point = null;
        bands.clear();
        disarm();
    }

    /**
     * The move seen was not the point, and the flight is quiet again at the entry: armed again at once, on the values
     * held now (the pilot may start the point at any moment).
     */
    void rearm(long nowNs) {
        departedNs = NONE;
        departureBeginNs = NONE;
        cue = null;
        armed = true;
        armedNs = nowNs;
        quietSinceNs = nowNs - ARM_NS;
        followedNs = nowNs;
        holdNow();
        java.util.Arrays.fill(nearNs, nowNs);
    }

    /** The armed values become the signals now. */
    private void holdNow() {
        for (int i = 0; i < N; i++) {
            base[i] = v(i);
        }
    }

    private void disarm() {
        quietSinceNs = NONE;
        followedNs = NONE;
        armed = false;
        armedNs = NONE;
        departedNs = NONE;
        departureBeginNs = NONE;
        cue = null;
    }

    /**
     * One frame: the detector's physics now, and the session's history (for the bands and the throttle). With
     * {@code p} null only the signals are followed (a point is being flown).
     */
    void update(TestPoint p, PhysicalState s, PointHistory h, long nowNs) {
        if (p != point) {
            reset();
            point = p;
            if (p != null) {
                for (Band b : p.bands()) {
                    if (describesStart(b) && h.has(b.parameter())) {
                        bands.add(b);
                    }
                }
                cues(p.kind());
            }
        }
        take(NZ, s, PhysicalQuantity.NZ, s.nz(), nowNs);
        take(P, s, PhysicalQuantity.P, s.pRadS(), nowNs);
        take(Q, s, PhysicalQuantity.Q, s.qRadS(), nowNs);
        take(BETA, s, PhysicalQuantity.AOS, s.aosRad(), nowNs);
        take(BANK, s, PhysicalQuantity.ROLL, s.rollRad(), nowNs);
        take(CAS_RATE_I, s, PhysicalQuantity.CAS, s.casMps(), nowNs);
        double throttle = newRow(h, THROTTLE, nowNs);
        if (Double.isFinite(throttle)) {
            // in percent of travel, whatever the dictionary's unit (a fraction is taken as one)
            org.pointcall.shared.units.Unit u = h.unit(THROTTLE);
            sample(THR, "%".equals(u.symbol()) ? u.fromSi(throttle) : 100 * throttle, nowNs);
        }
        sample(YAW, newRow(h, YAW_RATE, nowNs), nowNs);
        if (p == null || departedNs != NONE || bands.isEmpty()) {
            return;
        }
        boolean near = nearStart(h, nowNs);
        if (!armed) {
            if (near && quiet(nowNs)) {
                if (quietSinceNs == NONE) {
                    quietSinceNs = nowNs;
                    holdNow();
                }
                follow(nowNs);
                if (nowNs - quietSinceNs >= ARM_NS) {
                    armed = true;
                    armedNs = nowNs;
                }
            } else {
                quietSinceNs = NONE;
            }
            return;
        }
        for (int i = 0; i < N; i++) {
            if (threshold[i] <= 0 || !fresh(i, nowNs)) {
                continue;
            }
            double d = v(i) - base[i];
            double signed = sign[i] == 0 ? Math.abs(d) : sign[i] * d;
            if (Math.abs(d) <= 0.5 * threshold[i]) {
                nearNs[i] = nowNs;
            }
            if (signed >= threshold[i]) {
                departedNs = nowNs;
                departureBeginNs = Math.max(armedNs - ARM_NS, nearNs[i]);
                cue = String.format(java.util.Locale.ROOT, "%s %+.2f %s from the %.2f %s held", NAMES[i],
                        d * SHOW[i], UNITS[i], base[i] * SHOW[i], UNITS[i]);
                return;
            }
        }
        if (near && quiet(nowNs)) {
            follow(nowNs);
        } else if (fresh(THR, nowNs)) {
            // the throttle's held value follows its setting whatever the flight does: the pilot trims the power
            // while settling; only a step is the point's input
            base[THR] += (v(THR) - base[THR]) * (1 - Math.exp(-followedS(nowNs) / THROTTLE_BASELINE_S));
        }
        if (!near) {
            // drifted off the start without a departure of the kind: set up again
            disarm();
        }
    }

    /** The bands that say where a point starts (see the class comment). */
    static boolean describesStart(Band b) {
        if (b.parameter() == null || THROTTLE.equals(b.parameter())) {
            return false;
        }
        boolean two = Double.isFinite(b.lowSi()) && Double.isFinite(b.highSi());
        return b.phase() == BandPhase.ENTRY && two || b.phase() == BandPhase.THROUGHOUT;
    }

    private boolean nearStart(PointHistory h, long nowNs) {
        if (h.isEmpty()) {
            return false;
        }
        for (Band b : bands) {
            double v = newest(h, b.parameter(), nowNs);
            if (Double.isNaN(v)) {
                return false;
            }
            double width = b.highSi() - b.lowSi();
            double pad = Double.isFinite(width) ? width : 0;
            if (v < b.lowSi() - pad || v > b.highSi() + pad) {
                return false;
            }
        }
        return true;
    }

    private static double newest(PointHistory h, String name, long nowNs) {
        for (int i = h.size() - 1; i >= 0 && h.timeNs(i) >= nowNs - STALE_NS; i--) {
            double v = h.valueSi(name, i);
            if (Double.isFinite(v)) {
                return v;
            }
        }
        return Double.NaN;
    }

    private boolean quiet(long nowNs) {
        if (!fresh(NZ, nowNs) || !fresh(CAS_RATE_I, nowNs)) {
            return false;
        }
        // Nz and the body rates against their own held values: a steady turn (more than 1 g, a steady pitch rate) is
        // quiet too
        boolean first = quietSinceNs == NONE;
        return (first || Math.abs(v(NZ) - base[NZ]) <= QUIET_NZ)
                && Math.abs(v(CAS_RATE_I)) <= QUIET_CAS_RATE
                && (!fresh(P, nowNs) || Math.abs(v(P) - (first ? 0 : base[P])) <= QUIET_P)
                && (!fresh(Q, nowNs) || first && Math.abs(v(Q)) <= QUIET_Q + Q_TURN
                || !first && Math.abs(v(Q) - base[Q]) <= QUIET_Q);
    }

    /** The armed values follow quiet flight slowly. */
    private void follow(long nowNs) {
        double a = 1 - Math.exp(-followedS(nowNs) / BASELINE_S);
        for (int i = 0; i < N; i++) {
            if (fresh(i, nowNs)) {
                base[i] = Double.isNaN(base[i]) ? v(i) : base[i] + (v(i) - base[i]) * a;
                if (!armed) {
                    nearNs[i] = nowNs;
                }
            }
        }
        if (armed) {
            java.util.Arrays.fill(nearNs, nowNs);
        }
    }

    private void cues(ManoeuvreKind kind) {
        java.util.Arrays.fill(threshold, 0);
        java.util.Arrays.fill(sign, 0);
        switch (kind) {
            case STALL_LEVEL, STALL_TURN -> {
                cue(CAS_RATE_I, CAS_RATE, -1);
                cue(THR, THROTTLE_PCT, -1);
            }
            case LEVEL_ACCEL -> {
                cue(CAS_RATE_I, CAS_RATE, 1);
                cue(THR, THROTTLE_PCT, 1);
            }
            case LOOP -> cue(NZ, LOOP_NZ, 1);
            case WIND_UP_TURN -> {
                cue(NZ, TURN_NZ, 1);
                cue(BANK, TURN_BANK_DEG * DEG, 0);
                cue(P, ROLL_P_DEG * DEG, 0);
                cue(THR, THROTTLE_PCT, 0);
            }
            case AILERON_ROLL -> {
                cue(P, ROLL_P_DEG * DEG, 0);
                cue(Q, PITCH_Q_DEG * DEG, 0);
            }
            case PITCH_DOUBLET -> cue(Q, PITCH_Q_DEG * DEG, 0);
            case PHUGOID -> {
                cue(Q, PHUGOID_Q_DEG * DEG, 0);
                cue(NZ, PHUGOID_NZ, 0);
                cue(CAS_RATE_I, CAS_RATE, 0);
            }
            case SIDESLIP -> {
                cue(BETA, BETA_DEG * DEG, 0);
                cue(YAW, YAW_DEG * DEG, 0);
            }
            case STABILISED -> {
            }
        }
    }

    private void cue(int i, double t, int s) {
        threshold[i] = t;
        sign[i] = s;
    }

    private void take(int i, PhysicalState s, PhysicalQuantity q, double v, long nowNs) {
        if (s.fresh(q)) {
            sample(i, v, nowNs);
        }
    }

    /** A finite sample into a signal; after a gap longer than {@link #STALE_NS} it starts again. */
    private void sample(int i, double v, long nowNs) {
        if (!Double.isFinite(v)) {
            return;
        }
        SmoothedRate x = signal[i];
        if (x.lastNs() != NONE && nowNs - x.lastNs() > STALE_NS) {
            x.clear();
        }
        x.add(v, nowNs);
    }

    /** The history's value of {@code name} when its newest row is this frame's, else NaN. */
    private static double newRow(PointHistory h, String name, long nowNs) {
        return !h.isEmpty() && h.has(name) && h.timeNs(h.size() - 1) == nowNs ? h.valueSi(name, h.size() - 1)
                : Double.NaN;
    }

    /** Signal {@code i} now: smoothed, the CAS rate the rate of smoothed CAS; NaN without one. */
    private double v(int i) {
        return i == CAS_RATE_I ? signal[i].rate() : signal[i].value();
    }

    /** Data time since the armed values last followed the flight, s (0 the first time, at most 1). */
    private double followedS(long nowNs) {
        double dt = followedNs == NONE ? 0 : Math.min(1.0, (nowNs - followedNs) * 1e-9);
        followedNs = nowNs;
        return dt;
    }

    private boolean fresh(int i, long nowNs) {
        long at = signal[i].lastNs();
        return at != NONE && nowNs - at <= STALE_NS && !Double.isNaN(v(i));
    }

    /** The point watched, or null. */
    TestPoint point() {
        return point;
    }

    boolean armed() {
        return armed;
    }

    /** When the watch armed, or {@link #NONE}. */
    long armedNs() {
        return armedNs;
    }

    /** True once the point's departure was seen (until {@link #reset}). */
    boolean departed() {
        return departedNs != NONE;
    }

    /** Where the departure began, or {@link #NONE}. */
    long departureBeginNs() {
        return departureBeginNs;
    }

    /** The instant the departure was seen, or {@link #NONE}. */
    long departedNs() {
        return departedNs;
    }

    /** What moved, for the evidence. */
    String cue() {
        return cue;
    }

    /**
     * True while the flight is quiet again with every cue of the kind back within half its threshold of the armed
     * value: held, that was a set-up, not the point.
     */
    boolean settledAgain(long nowNs) {
        if (!quiet(nowNs)) {
            return false;
        }
        for (int i = 0; i < N; i++) {
            if (threshold[i] > 0 && fresh(i, nowNs) && Math.abs(v(i) - base[i]) > 0.5 * threshold[i]) {
                return false;
            }
        }
        return true;
    }
}
