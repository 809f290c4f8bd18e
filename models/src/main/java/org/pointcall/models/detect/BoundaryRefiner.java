package org.pointcall.models.detect;

import org.pointcall.models.analysis.SlopeSums;
import org.pointcall.shared.atmosphere.StandardAtmosphere;
import org.pointcall.shared.kind.ManoeuvreKind;

/**
 * The {@link BoundaryRules boundary rules}' work: a point's begin and end placed on the {@link PhysicsHistory},
 * once the classifier has found the point. Work arrays are allocated once; a call costs O(samples of the window).
 *
 * <ul>
 * <li>{@code begin-departure}: a departure measure per sample, the largest of |dCAS/dt| (least-squares slope over
 * 2 s), |Nz cos(bank) - 1| (off the level or steady-turn value), |AoS|, |Q| and |P| (means over half a second), each
 * over its threshold. The onset is a sample where the measure reaches 1 after a quiet stretch below 1 and stays at 1
 * or more for a while; of those near the classifier's begin, the one nearest to it; it is then moved back to where
 * the measure last was below a half, the foot of the rise (the threshold crossing lags the input).</li>
 * <li>{@code end-recovery}: after the manoeuvre's core (the AoA maximum of a stall, the last highest third of the
 * roll rate of a roll, of the load factor of a wind-up turn, of |AoS| of a sideslip), the first stretch of steady
 * flight ({@link BoundarySettings}) as long as the dwell; the end is the end of that stretch.</li>
 * <li>{@code stabilised-extent}: the end goes on over every sample that still holds the point's Hp (within 50 ft
 * of its mean) and CAS (within 1 %), wings level, with no departure; the begin is left to the classifier, because
 * the approach to a stabilised point holds its numbers too before the point is called.</li>
 * <li>{@code accel-extent}: the begin goes back over every sample still gaining speed; the end is the highest CAS
 * (mean over 2 s) before it has dropped by {@link BoundarySettings#accelDropMps()}.</li>
 * </ul>
 */
final class BoundaryRefiner {
    private static final long NONE = PointEvent.UNKNOWN_NS;
    /** AoA fall after its peak that shows a stall's break is behind, rad. */
    private static final double BREAK_FALL_RAD = Math.toRadians(2);
    /** The foot of a departure is looked for at most this far before its threshold crossing, s. */
    private static final double FOOT_S = 2.0;
    /** Level acceleration: Nz off the level value by this, or a bank beyond this, ends the run. */
    private static final double ACCEL_END_NZ = 0.2;
    private static final double ACCEL_END_BANK_RAD = Math.toRadians(15);
    /** ...and its foot, where Nz and bank were last near level. */
    private static final double ACCEL_FOOT_NZ = 0.1;
    private static final double ACCEL_FOOT_BANK_RAD = Math.toRadians(5);
    /** Stabilised hold: Hp within this of the point's mean (the 100 ft band usual for such points [memory]). */
    private static final double HOLD_HP_M = 50 * 0.3048;
    /** Stabilised hold: CAS within this fraction of the point's mean. */
    private static final double HOLD_CAS_FRACTION = 0.01;

    private final PhysicsHistory h;
    private final BoundarySettings s;
    private final double[] ts = new double[PhysicsHistory.CAPACITY];
    /** The series being smoothed ({@link #fill}, then {@link #centred}). */
    private final double[] work = new double[PhysicsHistory.CAPACITY];
    private final double[] climb = new double[PhysicsHistory.CAPACITY];
    private final double[] casMean = new double[PhysicsHistory.CAPACITY];
    private final double[] casRate = new double[PhysicsHistory.CAPACITY];
    private final double[] gamma = new double[PhysicsHistory.CAPACITY];
    private final double[] pMean = new double[PhysicsHistory.CAPACITY];
    private final double[] qMean = new double[PhysicsHistory.CAPACITY];
    private final double[] dep = new double[PhysicsHistory.CAPACITY];
    private final double[] p1 = new double[PhysicsHistory.CAPACITY + 1];
    private final double[] p2 = new double[PhysicsHistory.CAPACITY + 1];
    private final double[] p3 = new double[PhysicsHistory.CAPACITY + 1];
    private final double[] p4 = new double[PhysicsHistory.CAPACITY + 1];
    private final double[] p5 = new double[PhysicsHistory.CAPACITY + 1];
    private int from;
    private int to;

    BoundaryRefiner(PhysicsHistory history, BoundarySettings settings) {
        this.h = history;
        this.s = settings;
    }

    /** Fills the derived signals over the kept states [i0, i1), with the departure measure. */
    private void prepare(int i0, int i1) {
        prepare(i0, i1, true);
    }

    /** Fills the derived signals over the kept states [i0, i1); the departure measure only if asked (it costs most). */
    private void prepare(int i0, int i1, boolean departures) {
        from = i0;
        to = i1;
        if (i1 <= i0) {
            return;
        }
        long origin = h.timeNs(i0);
        for (int i = i0; i < i1; i++) {
            ts[i] = (h.timeNs(i) - origin) * 1e-9;
        }
        fill(PhysicalQuantity.CAS);
        centred(1.0, casMean, casRate);
        flightPath();
        fill(PhysicalQuantity.P);
        centred(0.25, pMean, null);
        if (!departures) {
            return;
        }
        fill(PhysicalQuantity.Q);
        centred(0.25, qMean, null);
        for (int i = i0; i < i1; i++) {
            dep[i] = departure(i);
        }
    }

    /** Copies {@code q} over the prepared range into the work series. */
    private void fill(PhysicalQuantity q) {
        for (int i = from; i < to; i++) {
            work[i] = h.value(i, q);
        }
    }

    /**
     * Over the prepared range, for each sample the mean and (when {@code slope} is not null) the least-squares
     * slope per second of the work series' finite values within +-{@code halfS}, by prefix sums of count, t, t^2,
     * v and t v: one pass whatever the window.
     */
    private void centred(double halfS, double[] mean, double[] slope) {
        p1[from] = p2[from] = p3[from] = p4[from] = p5[from] = 0;
        for (int i = from; i < to; i++) {
            double v = work[i];
            boolean ok = Double.isFinite(v);
            p1[i + 1] = p1[i] + (ok ? 1 : 0);
            p4[i + 1] = p4[i] + (ok ? v : 0);
            if (slope != null) {
                p2[i + 1] = p2[i] + (ok ? ts[i] : 0);
                p3[i + 1] = p3[i] + (ok ? ts[i] * ts[i] : 0);
                p5[i + 1] = p5[i] + (ok ? ts[i] * v : 0);
            }
        }
        int lo = from;
        int hi = from;
        for (int i = from; i < to; i++) {
            while (ts[lo] < ts[i] - halfS) {
                lo++;
            }
            while (hi < to && ts[hi] <= ts[i] + halfS) {
                hi++;
            }
            double n = p1[hi] - p1[lo];
            double sv = p4[hi] - p4[lo];
            if (mean != null) {
                mean[i] = n > 0 ? sv / n : Double.NaN;
            }
            if (slope != null) {
                double st = p2[hi] - p2[lo];
                double den = n * (p3[hi] - p3[lo]) - st * st;
                slope[i] = n >= 3 && den > 1e-12 ? (n * (p5[hi] - p5[lo]) - st * sv) / den : Double.NaN;
            }
        }
    }

    /**
     * Flight-path angle per sample of the prepared range: the least-squares slope of Hp over 2 s against the true
     * airspeed, CAS over the square root of the standard atmosphere's density ratio at that Hp (Hp and CAS are what
     * any air-data system gives, unlike a body AoA: a vane's AoA may be offset from the body's, so pitch minus AoA
     * is not used).
     */
    private void flightPath() {
        fill(PhysicalQuantity.HP);
        centred(1.0, null, climb);
        for (int i = from; i < to; i++) {
            double hp = work[i];
            double cas = casMean[i];
            if (Double.isFinite(climb[i]) && Double.isFinite(hp) && Double.isFinite(cas) && cas > 1.0) {
                // pressure altitude is the standard atmosphere's geopotential altitude (1976 U.S. Standard Atmosphere)
                double h = Math.min(Math.max(hp, StandardAtmosphere.MIN_GEOPOTENTIAL_M),
                        StandardAtmosphere.MAX_GEOPOTENTIAL_M);
                double sigma = StandardAtmosphere.densityKgM3(h) / StandardAtmosphere.SEA_LEVEL_DENSITY_KG_M3;
                gamma[i] = Math.atan2(climb[i], cas / Math.sqrt(sigma));
            } else {
                gamma[i] = Double.NaN;
            }
        }
    }

    /** Number of departure terms: speed rate, Nz, AoS, Q, P. */
    private static final int TERMS = 5;

    private double departure(int i) {
        double d = 0;
        for (int c = 0; c < TERMS; c++) {
            double x = term(i, c);
            if (Double.isFinite(x)) {
                d = Math.max(d, x);
            }
        }
        return d;
    }

    /** The largest term at sample {@code i}. */
    private int strongestTerm(int i) {
        int best = 0;
        double bestX = Double.NEGATIVE_INFINITY;
        for (int c = 0; c < TERMS; c++) {
            double x = term(i, c);
            if (Double.isFinite(x) && x > bestX) {
                bestX = x;
                best = c;
            }
        }
        return best;
    }

    /** Departure term {@code c} at sample {@code i}, over its threshold; NaN without data. */
    private double term(int i, int c) {
        switch (c) {
            case 0:
                return Math.abs(casRate[i]) / s.departureSpeedRateMps2();
            case 1: {
                double nz = h.value(i, PhysicalQuantity.NZ);
                double bank = h.value(i, PhysicalQuantity.ROLL);
                return Math.abs(nz * (Double.isFinite(bank) ? Math.cos(bank) : 1.0) - 1.0) / s.departureNz();
            }
            case 2:
                return Math.abs(h.value(i, PhysicalQuantity.AOS)) / s.departureBetaRad();
            case 3:
                return Math.abs(qMean[i]) / s.departurePitchRateRadS();
            default:
                return Math.abs(pMean[i]) / s.departureRollRateRadS();
        }
    }

    /**
     * The bottom of a stall's pull-out: the first sample after the break at {@code core} where the flight path is
     * back within the steady flight-path angle of level or climbing, having dived below it; {@code core} when it never
     * dived; -1 while it is still diving. The recovery is over there once the rates are steady: a pilot who climbs
     * away to regain the height lost is recovered, not yet in level flight.
     */
    private int pullOutBottom(int core, int i1) {
        boolean dived = false;
        for (int i = core; i < i1; i++) {
            if (!Double.isFinite(gamma[i])) {
                continue;
            }
            if (gamma[i] < -s.steadyGammaRad()) {
                dived = true;
            } else if (dived) {
                return i;
            }
        }
        return dived ? -1 : core;
    }

    /** Rates and bank steady at kept state {@code i}, whatever the flight-path angle. */
    private boolean steadyRates(int i) {
        double p = h.value(i, PhysicalQuantity.P);
        double q = h.value(i, PhysicalQuantity.Q);
        double bank = h.value(i, PhysicalQuantity.ROLL);
        return !(Double.isFinite(p) && Math.abs(p) >= s.steadyRollRateRadS())
                && !(Double.isFinite(q) && Math.abs(q) >= s.steadyPitchRateRadS())
                && !(Double.isFinite(bank) && Math.abs(bank) >= s.steadyBankRad());
    }

    /** Sideslip back within {@link #ZERO_BETA_RAD} of zero at kept state {@code i} (NaN: nothing against it). */
    private boolean nearZeroBeta(int i) {
        double b = h.value(i, PhysicalQuantity.AOS);
        return !(Double.isFinite(b) && Math.abs(b) >= ZERO_BETA_RAD);
    }

    /** Sideslip this small is back to coordinated flight (2 deg: common practice, a vane's noise and trim). */
    private static final double ZERO_BETA_RAD = Math.toRadians(2.0);

    /** Steady flight at kept state {@code i}: rates, bank and flight-path angle small (NaN quantities skipped). */
    private boolean steady(int i) {
        return steadyRates(i) && (!Double.isFinite(gamma[i]) || Math.abs(gamma[i]) < s.steadyGammaRad());
    }

    /**
     * {@code begin-departure}: where the aircraft left its steady entry, near {@code beginNs}, not before
     * {@code floorNs} (the previous kept point's end, or NONE) nor after {@code nowNs}; NONE when no onset is seen.
     */
    long departureBegin(long beginNs, long floorNs, long nowNs) {
        long lookNs = Math.round(s.departureLookS() * 1e9);
        long quietNs = Math.round(s.departureQuietS() * 1e9);
        long activeNs = Math.round(s.departureActiveS() * 1e9);
        long a = beginNs - lookNs - quietNs;
        if (floorNs != NONE) {
            a = Math.max(a, floorNs);
        }
        long b = Math.min(nowNs, beginNs + lookNs + activeNs);
        int i0 = h.indexAtOrAfter(a);
        int i1 = h.indexAtOrAfter(b + 1);
        if (i1 - i0 < 4) {
            return NONE;
        }
        prepare(Math.max(0, i0 - 25), Math.min(h.size(), i1 + 25));
        double quietS = s.departureQuietS();
        double activeS = s.departureActiveS();
        int best = -1;
        long bestDist = Long.MAX_VALUE;
        int quietFrom = -1;
        for (int j = i0; j < i1; j++) {
            if (dep[j] < 1.0) {
                if (quietFrom < 0) {
                    quietFrom = j;
                }
                continue;
            }
            boolean quietBefore = quietFrom >= 0 && ts[j] - ts[quietFrom] >= quietS;
            quietFrom = -1;
            if (!quietBefore) {
                continue;
            }
            int k = j;
            while (k < i1 && dep[k] >= 1.0 && ts[k] - ts[j] < activeS) {
                k++;
            }
            if (k >= i1 || ts[k] - ts[j] < activeS) {
                continue;
            }
            long dist = Math.abs(h.timeNs(j) - beginNs);
            if (dist < bestDist) {
                bestDist = dist;
                best = j;
            }
        }
        if (best < 0) {
            // straight on from the previous point: departed from its end to the classifier's begin, never quiet
            if (floorNs != NONE && a == floorNs) {
                int ib = h.indexAtOrAfter(beginNs);
                boolean departed = ib > i0;
                for (int j = i0; j < ib && departed; j++) {
                    departed = dep[j] >= 1.0;
                }
                if (departed) {
                    return h.timeNs(i0);
                }
            }
            return NONE;
        }
        // the foot of the rise of the term that departed first (others may sit below their thresholds anyway)
        int c = strongestTerm(best);
        int foot = best;
        while (foot - 1 >= i0 && term(foot - 1, c) >= 0.5 && ts[best] - ts[foot - 1] <= FOOT_S) {
            foot--;
        }
        return h.timeNs(foot);
    }

    /**
     * {@code end-recovery}: the end of the first steady stretch after the core of a {@code kind} point begun at
     * {@code beginNs}, seen by {@code nowNs}; NONE when there is none yet.
     */
    long recoveryEnd(ManoeuvreKind kind, long beginNs, long coreUntilNs, long nowNs) {
        return recovery(kind, beginNs, coreUntilNs, nowNs, false);
    }

    /**
     * {@code end-recovery} once the wait for it is over: the end of the longest steady stretch after the core, when it
     * lasted at least a quarter of the dwell (the pilot went on to the next point before steady flight had been held
     * for the whole dwell); NONE when there is none.
     */
    long settledRecoveryEnd(ManoeuvreKind kind, long beginNs, long coreUntilNs, long nowNs) {
        return recovery(kind, beginNs, coreUntilNs, nowNs, true);
    }

    private long recovery(ManoeuvreKind kind, long beginNs, long coreUntilNs, long nowNs, boolean longest) {
        int i0 = h.indexAtOrAfter(beginNs);
        int i1 = h.indexAtOrAfter(nowNs + 1);
        if (i1 - i0 < 4) {
            return NONE;
        }
        prepare(i0, i1, false);
        int core = core(kind, i0, Math.min(i1, h.indexAtOrAfter(coreUntilNs + 1)), i1);
        if (core < 0) {
            return NONE;
        }
        boolean stall = kind == ManoeuvreKind.STALL_LEVEL || kind == ManoeuvreKind.STALL_TURN;
        boolean sideslip = kind == ManoeuvreKind.SIDESLIP;
        int from = stall ? pullOutBottom(core, i1) : core;
        if (from < 0) {
            return NONE;
        }
        int start = -1;
        double bestS = s.steadyDwellS() / 4;
        long best = NONE;
        for (int i = from; i < i1; i++) {
            // out of a stall the aircraft climbs back, out of a sideslip it may dive for the next point's speed: the
            // flight path does not tell that either is over; a sideslip is over back near zero sideslip
            boolean over = stall ? steadyRates(i) : sideslip ? steadyRates(i) && nearZeroBeta(i) : steady(i);
            if (!over) {
                start = -1;
                continue;
            }
            if (start < 0) {
                start = i;
            }
            double heldS = ts[i] - ts[start];
            if (heldS >= s.steadyDwellS()) {
                // a sideslip is flown steady: it is over when it is back at zero sideslip, wings level, which the
                // dwell confirms; a stall, roll or wind-up turn is over once steady flight has been held
                return kind == ManoeuvreKind.SIDESLIP ? h.timeNs(start) : h.timeNs(i);
            }
            if (longest && heldS >= bestS) {
                bestS = heldS;
                best = kind == ManoeuvreKind.SIDESLIP ? h.timeNs(start) : h.timeNs(i);
            }
        }
        return best;
    }

    /** The last sample of the manoeuvre's core in [i0, ic), with what follows up to i1; or -1. */
    private int core(ManoeuvreKind kind, int i0, int ic, int i1) {
        switch (kind) {
            case STALL_LEVEL:
            case STALL_TURN: {
                // the break: the first AoA maximum at least 4 deg (twice the stall rule's noise floor) above the
                // lowest AoA before it, after which AoA falls by 4 deg and by a third of that rise (a stall lets go of
                // much of its AoA; the nose coming up at the entry or a wobble on the way does not); a later pull-up's
                // AoA peak is not a break
                double low = Double.POSITIVE_INFINITY;
                double best = Double.NEGATIVE_INFINITY;
                double lowAtBest = Double.NaN;
                int at = -1;
                for (int i = i0; i < i1; i++) {
                    double a = h.value(i, PhysicalQuantity.AOA);
                    if (!Double.isFinite(a)) {
                        continue;
                    }
                    low = Math.min(low, a);
                    if (i < ic && a > best) {
                        best = a;
                        at = i;
                        lowAtBest = low;
                    }
                    double rise = best - lowAtBest;
                    if (at >= 0 && rise >= 2 * BREAK_FALL_RAD && a <= best - Math.max(2 * BREAK_FALL_RAD, rise / 3)) {
                        return at;
                    }
                }
                return -1;
            }
            case AILERON_ROLL:
                return lastAbove(i0, ic, pMean, 0.0, 2.0 / 3.0);
            case SIDESLIP:
                return lastAbove(i0, ic, null, 0.0, 2.0 / 3.0);
            case WIND_UP_TURN:
            case LOOP:
                // a wind-up turn's highest g; a loop's pull-out at the bottom, its last stretch of high g
                return lastAboveNz(i0, ic);
            default:
                return -1;
        }
    }

    /** Last sample whose |x| (AoS when {@code x} is null) is at least {@code fraction} of its largest. */
    private int lastAbove(int i0, int i1, double[] x, double base, double fraction) {
        double peak = 0;
        for (int i = i0; i < i1; i++) {
            double v = x == null ? h.value(i, PhysicalQuantity.AOS) : x[i];
            if (Double.isFinite(v)) {
                peak = Math.max(peak, Math.abs(v - base));
            }
        }
        if (peak == 0) {
            return -1;
        }
        for (int i = i1 - 1; i >= i0; i--) {
            double v = x == null ? h.value(i, PhysicalQuantity.AOS) : x[i];
            if (Double.isFinite(v) && Math.abs(v - base) >= fraction * peak) {
                return i;
            }
        }
        return -1;
    }

    private int lastAboveNz(int i0, int i1) {
        double peak = Double.NEGATIVE_INFINITY;
        for (int i = i0; i < i1; i++) {
            double v = h.value(i, PhysicalQuantity.NZ);
            if (Double.isFinite(v)) {
                peak = Math.max(peak, v);
            }
        }
        if (!(peak > 1.0)) {
            return -1;
        }
        double level = 1.0 + (peak - 1.0) * 2.0 / 3.0;
        for (int i = i1 - 1; i >= i0; i--) {
            double v = h.value(i, PhysicalQuantity.NZ);
            if (Double.isFinite(v) && v >= level) {
                return i;
            }
        }
        return -1;
    }

    /**
     * A stall's break between {@code beginNs} and {@code endNs} (the first AoA maximum it lets go of, as
     * {@code end-recovery} finds it); NONE when there is none.
     */
    long stallBreak(ManoeuvreKind kind, long beginNs, long endNs) {
        int i0 = h.indexAtOrAfter(beginNs);
        int i1 = h.indexAtOrAfter(endNs + 1);
        if (i1 - i0 < 4) {
            return NONE;
        }
        int core = core(kind, i0, i1, i1);
        return core < 0 ? NONE : h.timeNs(core);
    }

    /**
     * {@code begin-departure} of a stall: the first sample of the run of steady slowing (dCAS/dt below minus the
     * settings' acceleration rate) that holds {@code beginNs}, up to the look-back of a level acceleration; NONE
     * when the aircraft is not slowing there. A slow stall entry is long, and the classifier may rise late in it.
     */
    long decelBegin(long beginNs, long floorNs) {
        return speedRunBegin(beginNs, floorNs, -1);
    }

    /** {@code accel-extent}: the first sample of the run of speed gain that holds {@code beginNs}; NONE if none. */
    long accelBegin(long beginNs, long floorNs) {
        return speedRunBegin(beginNs, floorNs, 1);
    }

    /**
     * The first sample of the run, holding {@code beginNs}, in which dCAS/dt times {@code sign} stays above the
     * settings' acceleration rate, looked for back to the level acceleration's look-back and not before
     * {@code floorNs}; NONE when the speed is not changing that way at {@code beginNs}.
     */
    private long speedRunBegin(long beginNs, long floorNs, int sign) {
        long a = beginNs - Math.round(s.accelLookBackS() * 1e9);
        if (floorNs != NONE) {
            a = Math.max(a, floorNs);
        }
        int i0 = h.indexAtOrAfter(a);
        int ib = h.indexAtOrAfter(beginNs);
        int i1 = Math.min(h.size(), ib + 40);
        if (ib >= h.size() || ib - i0 < 2) {
            return NONE;
        }
        prepare(i0, i1, false);
        int i = ib;
        if (!(sign * casRate[i] > s.accelRateMps2())) {
            return NONE;
        }
        while (i - 1 >= i0 && sign * casRate[i - 1] > s.accelRateMps2()) {
            i--;
        }
        return h.timeNs(i);
    }

    /** Last sample in [at, until) whose CAS mean is still within a quarter of the drop of {@code best}. */
    private int lastNear(int at, int until, double best) {
        int last = at;
        for (int i = at; i < until; i++) {
            if (casMean[i] >= best - 0.25 * s.accelDropMps()) {
                last = i;
            }
        }
        return last;
    }

    /**
     * {@code stabilised-extent}: where the hold ended after {@code endNs}: the first sample from there that no longer
     * holds the point's Hp and CAS or departs, seen by {@code nowNs}; NONE while it still holds.
     */
    long holdEnd(long beginNs, long endNs, long nowNs) {
        int ib = h.indexAtOrAfter(beginNs);
        int ie = h.indexAtOrAfter(endNs);
        int i1 = h.indexAtOrAfter(nowNs + 1);
        if (ie - ib < 4 || i1 <= ie) {
            return NONE;
        }
        prepare(ib, i1);
        holdReference(ib, ie);
        // the classifier's own end may lie past the hold: look from the last sample that still held before it
        int i = ib;
        while (i < i1 && (holding(i) || i < ie && holdingAhead(i, ie))) {
            i++;
        }
        // a departure is seen with up to a second of smoothing: the last full second must be in
        if (i >= i1 || ts[i1 - 1] - ts[i] < 1.0) {
            return NONE;
        }
        return h.timeNs(i);
    }

    /** True when a sample in (i, ie) holds again (a brief gust inside the classifier's stretch). */
    private boolean holdingAhead(int i, int ie) {
        for (int k = i + 1; k < ie && ts[k] - ts[i] <= 1.0; k++) {
            if (holding(k)) {
                return true;
            }
        }
        return false;
    }

    private double refHp;
    private double refCas;

    private void holdReference(int i0, int i1) {
        double sh = 0;
        double sc = 0;
        int nh = 0;
        int nc = 0;
        for (int i = i0; i < i1; i++) {
            double hp = h.value(i, PhysicalQuantity.HP);
            if (Double.isFinite(hp)) {
                sh += hp;
                nh++;
            }
            if (Double.isFinite(casMean[i])) {
                sc += casMean[i];
                nc++;
            }
        }
        refHp = nh > 0 ? sh / nh : Double.NaN;
        refCas = nc > 0 ? sc / nc : Double.NaN;
    }

    /** Sample {@code i} holds the reference Hp and CAS, wings level, with no departure. */
    private boolean holding(int i) {
        if (dep[i] >= 1.0) {
            return false;
        }
        double hp = h.value(i, PhysicalQuantity.HP);
        if (Double.isFinite(hp) && Double.isFinite(refHp) && Math.abs(hp - refHp) > HOLD_HP_M) {
            return false;
        }
        if (Double.isFinite(casMean[i]) && Double.isFinite(refCas)
                && Math.abs(casMean[i] - refCas) > HOLD_CAS_FRACTION * refCas) {
            return false;
        }
        double bank = h.value(i, PhysicalQuantity.ROLL);
        return !Double.isFinite(bank) || Math.abs(bank) < s.steadyBankRad() + Math.toRadians(1);
    }

    /**
     * Whether the latest state holds what the end of a {@code kind} point is placed by (CAS for a level acceleration
     * or a stabilised point, a rate or the bank otherwise): without it there is nothing to wait for.
     */
    boolean canPlaceEnd(ManoeuvreKind kind) {
        int last = h.size() - 1;
        if (last < 0) {
            return false;
        }
        if (kind == ManoeuvreKind.LEVEL_ACCEL || kind == ManoeuvreKind.STABILISED) {
            return Double.isFinite(h.value(last, PhysicalQuantity.CAS));
        }
        return Double.isFinite(h.value(last, PhysicalQuantity.P))
                || Double.isFinite(h.value(last, PhysicalQuantity.ROLL));
    }

    /** Median |bank| from {@code beginNs} to the AoA maximum before {@code endNs}; NaN without bank or AoA. */
    double bankToBreak(long beginNs, long endNs) {
        int i0 = h.indexAtOrAfter(beginNs);
        int i1 = h.indexAtOrAfter(endNs + 1);
        int at = -1;
        double best = Double.NEGATIVE_INFINITY;
        for (int i = i0; i < i1; i++) {
            double a = h.value(i, PhysicalQuantity.AOA);
            if (Double.isFinite(a) && a > best) {
                best = a;
                at = i;
            }
        }
        if (at < 0) {
            return Double.NaN;
        }
        int n = 0;
        for (int i = i0; i <= at; i++) {
            double b = h.value(i, PhysicalQuantity.ROLL);
            if (Double.isFinite(b)) {
                dep[n++] = Math.abs(b);
            }
        }
        if (n == 0) {
            return Double.NaN;
        }
        java.util.Arrays.sort(dep, 0, n);
        return n % 2 == 1 ? dep[n / 2] : 0.5 * (dep[n / 2 - 1] + dep[n / 2]);
    }

    /** {@code accel-settled-entry}: settled flight has |bank| below this... */
    static final double SETTLED_BANK_RAD = Math.toRadians(10);
    /** ...|AoS| below this... */
    static final double SETTLED_BETA_RAD = Math.toRadians(3);
    /** ...and |P| below this. */
    static final double SETTLED_ROLL_RATE_RAD_S = Math.toRadians(5);

    /**
     * {@code accel-settled-entry}: the share of the states from {@code fromNs} to {@code toNs} in settled,
     * wings-level flight without sideslip (each bound quantity within its limit above); NaN when none of bank, AoS
     * and P was sampled there. A share, not every sample, so one wild point does not decide.
     */
    double settledShare(long fromNs, long toNs) {
        int i0 = h.indexAtOrAfter(fromNs);
        int i1 = h.indexAtOrAfter(toNs + 1);
        int seen = 0;
        int settled = 0;
        for (int i = i0; i < i1; i++) {
            double bank = h.value(i, PhysicalQuantity.ROLL);
            double beta = h.value(i, PhysicalQuantity.AOS);
            double p = h.value(i, PhysicalQuantity.P);
            if (!Double.isFinite(bank) && !Double.isFinite(beta) && !Double.isFinite(p)) {
                continue;
            }
            seen++;
            if (!(Math.abs(bank) >= SETTLED_BANK_RAD) && !(Math.abs(beta) >= SETTLED_BETA_RAD)
                    && !(Math.abs(p) >= SETTLED_ROLL_RATE_RAD_S)) {
                settled++;
            }
        }
        return seen == 0 ? Double.NaN : settled / (double) seen;
    }

    private final SlopeSums hpFit = new SlopeSums();

    /** Least-squares slope of Hp from {@code beginNs} to {@code endNs}, m/s; NaN with fewer than 3 samples. */
    double hpRate(long beginNs, long endNs) {
        int i1 = h.indexAtOrAfter(endNs + 1);
        SlopeSums fit = hpFit.reset();
        for (int i = h.indexAtOrAfter(beginNs); i < i1; i++) {
            double v = h.value(i, PhysicalQuantity.HP);
            if (Double.isFinite(v)) {
                fit.add((h.timeNs(i) - beginNs) * 1e-9, v);
            }
        }
        return fit.slope();
    }

    /** Relative CAS gain from {@code beginNs} to {@code endNs} (means over 2 s); NaN without CAS. */
    double speedGain(long beginNs, long endNs) {
        int i0 = h.indexAtOrAfter(beginNs);
        int i1 = h.indexAtOrAfter(endNs + 1);
        if (i1 - i0 < 2) {
            return Double.NaN;
        }
        prepare(i0, i1, false);
        double lo = Double.NaN;
        double hi = Double.NaN;
        for (int i = i0; i < i1; i++) {
            if (Double.isFinite(casMean[i])) {
                lo = Double.isNaN(lo) ? casMean[i] : Math.min(lo, casMean[i]);
                hi = Double.isNaN(hi) ? casMean[i] : Math.max(hi, casMean[i]);
            }
        }
        return lo > 0 ? (hi - lo) / lo : Double.NaN;
    }

    /**
     * {@code accel-extent}: the time of the highest CAS (mean over 2 s) from {@code beginNs} up to where it has
     * dropped by the settings' drop below it, seen by {@code nowNs}; NONE while it has not dropped.
     */
    long accelEnd(long beginNs, long nowNs) {
        int i0 = h.indexAtOrAfter(beginNs);
        int i1 = h.indexAtOrAfter(nowNs + 1);
        if (i1 - i0 < 4) {
            return NONE;
        }
        prepare(i0, i1, false);
        double best = Double.NEGATIVE_INFINITY;
        int at = -1;
        // the mean over 2 s is complete 1 s before now; a pull or a bank ends the run at once
        for (int i = i0; i < i1 && ts[i] <= ts[i1 - 1] - 1.0; i++) {
            double v = casMean[i];
            if (!Double.isFinite(v)) {
                continue;
            }
            boolean manoeuvre = ts[i] - ts[i0] > 5.0 && (term(i, 1) * s.departureNz() > ACCEL_END_NZ
                    || Math.abs(h.value(i, PhysicalQuantity.ROLL)) > ACCEL_END_BANK_RAD);
            if (v > best && !manoeuvre) {
                best = v;
                at = i;
            } else if (v < best - s.accelDropMps() || manoeuvre) {
                if (at < 0) {
                    return NONE;
                }
                int end = lastNear(at, i, best);
                if (manoeuvre) {
                    // back to the foot of the pull or bank that ended the run
                    int j = i;
                    while (j > at && (term(j, 1) * s.departureNz() > ACCEL_FOOT_NZ
                            || Math.abs(h.value(j, PhysicalQuantity.ROLL)) > ACCEL_FOOT_BANK_RAD)) {
                        j--;
                    }
                    end = Math.min(end, j);
                }
                return h.timeNs(end);
            }
        }
        return NONE;
    }
}
