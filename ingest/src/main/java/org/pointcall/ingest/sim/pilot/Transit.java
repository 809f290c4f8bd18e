package org.pointcall.ingest.sim.pilot;

import org.pointcall.shared.card.Band;
import org.pointcall.shared.card.BandPhase;

/**
 * Flying from wherever the last point left the aircraft to the next point's entry: configuration first (gear and
 * flaps, in level flight), then climb or descend, speed up or slow down and turn (up to 45 deg of bank) all at
 * once, the throttle on the total energy rate and pitch on its balance, then hold the entry until it has been
 * steady within a fifth of the point's own entry tolerances (clamped to what a pilot can settle on) for three
 * seconds. After 90 s of trying the point starts anyway, as a pilot would in rough air.
 */
final class Transit {
    private static final double DEG = Math.PI / 180.0;
    private static final double FT = 0.3048;
    private static final double KT = 1852.0 / 3600.0;
    /** How long the entry must be held within tolerance before the point starts, s. */
    private static final double STABLE_S = 3.0;
    /** Give up waiting for the tolerances (and start anyway) after this long holding, s. */
    private static final double STABILISE_TIMEOUT_S = 90.0;
    private static final double FLY_TIMEOUT_S = 420.0;
    /** Smoothing of what the pilot reads to judge the entry steady, s. */
    private static final double CUE_LAG_S = 1.5;

    private final PointPlan plan;
    private final Loops loops;
    private final Limits limits;
    private final double headingRad;
    private final double climbMaxMps;
    private final double tolHpM;
    private final double tolCasMps;
    private final double tolMach;
    private double startS = Double.NaN;
    private double holdingSinceS = Double.NaN;
    private double withinSinceS = Double.NaN;
    private boolean configured;
    private final double[] f = new double[8];
    private final boolean[] started = new boolean[8];

    Transit(PointPlan plan, Loops loops, Limits limits, double headingRad, double climbMaxMps, boolean configured) {
        this.plan = plan;
        this.loops = loops;
        this.limits = limits;
        this.headingRad = headingRad;
        this.climbMaxMps = climbMaxMps;
        this.configured = configured;
        // as tight as a fifth of the point's own entry tolerance, within what a pilot can settle on
        this.tolHpM = tolerance(plan, "Hp", 0.2, 20 * FT, 60 * FT);
        this.tolCasMps = tolerance(plan, "KCAS", 0.2, 0.7 * KT, 2.0 * KT);
        this.tolMach = tolerance(plan, "Mach", 0.2, 0.0015, 0.004);
    }

    /** A fraction of the half-width of the point's entry or throughout band on a parameter, clamped; the most
     *  without a band. */
    private static double tolerance(PointPlan plan, String parameter, double fraction, double min, double max) {
        double t = max;
        for (Band b : plan.point.bands()) {
            if (parameter.equals(b.parameter()) && (b.phase() == BandPhase.ENTRY || b.phase() == BandPhase.THROUGHOUT)
                    && Double.isFinite(b.lowSi()) && Double.isFinite(b.highSi())) {
                t = Math.min(t, fraction * 0.5 * (b.highSi() - b.lowSi()));
            }
        }
        return Math.max(min, t);
    }

    /** First-order smoothing of the stabilisation cues, started on the first value. */
    private void smooth(int i, double v, double dtS) {
        if (!started[i]) {
            f[i] = v;
            started[i] = true;
        } else {
            f[i] += (v - f[i]) * Math.min(1.0, dtS / CUE_LAG_S);
        }
    }

    /** Gear and flaps as the entry needs them are now set. */
    void configurationDone() {
        configured = true;
    }

    /** True while the transit waits, in steady level flight, for the configuration to change. */
    boolean wantsConfiguration(SensedState s) {
        return !configured && Math.abs(s.gammaRad) < 1.0 * DEG && Math.abs(s.phiRad) < 3.0 * DEG
                && Math.abs(s.qRadS) < 0.5 * DEG && Math.abs(s.pRadS) < 1.0 * DEG;
    }

    double entryTas(SensedState s) {
        return plan.onMach ? s.tasForMach(plan.mach) : s.tasForCas(plan.casMps);
    }

    /** One tick; true once the entry has been held steady and the point may begin. */
    boolean tick(SensedState s, double dtS) {
        if (Double.isNaN(startS)) {
            startS = s.timeS;
        }
        double hpCmd = Math.max(plan.hpM, limits.hpMinM + 1000 * FT);
        double tasCmd = entryTas(s);
        if (!configured) {
            // configure level at the present altitude, at the slower of the present and the entry speed
            double tas = Math.min(s.tasMps, tasCmd);
            level(s, s.hpM, Math.max(tas, tasCmd * 0.9), Double.NaN, 0.0, dtS);
            return false;
        }
        double bankCmd = plan.bankRad;
        boolean near = Math.abs(s.hpM - hpCmd) < 150 * FT && Math.abs(s.tasMps - tasCmd) < 5 * KT
                && (Double.isNaN(headingRad) || Math.abs(SensedState.wrap(s.psiRad - headingRad)) < 10 * DEG);
        if (near && Double.isNaN(holdingSinceS)) {
            holdingSinceS = s.timeS;
        }
        boolean turning = bankCmd != 0.0 && !Double.isNaN(holdingSinceS);
        double heading = bankCmd != 0.0 && turning ? Double.NaN : headingRad;
        level(s, hpCmd, tasCmd, heading, turning ? bankCmd : 0.0, dtS);
        if (Double.isNaN(holdingSinceS)) {
            return s.timeS - startS > FLY_TIMEOUT_S;
        }
        // steady: on the numbers, neither climbing nor speeding up, the g of the bank flown, no roll going on;
        // judged on values smoothed over a second or two, as a pilot reads needles that a gust shakes
        double speedErr = plan.onMach ? (s.mach - plan.mach) / tolMach : (s.casMps - plan.casMps) / tolCasMps;
        double vDotNow = s.alongMps2 - SensedState.G * Math.sin(s.gammaRad);
        double phiErr = SensedState.wrap(s.phiRad - (turning ? bankCmd : 0.0));
        double psiErr = turning || Double.isNaN(headingRad) ? 0.0 : SensedState.wrap(s.psiRad - headingRad);
        smooth(0, speedErr, dtS);
        smooth(1, (s.hpM - hpCmd) / tolHpM, dtS);
        smooth(2, s.climbMps, dtS);
        smooth(3, vDotNow, dtS);
        smooth(4, s.nz - 1.0 / Math.cos(s.phiRad), dtS);
        smooth(5, s.pRadS, dtS);
        smooth(6, phiErr, dtS);
        smooth(7, psiErr, dtS);
        boolean within = Math.abs(f[0]) < 1.0 && Math.abs(f[1]) < 1.0 && Math.abs(f[2]) < 0.25
                && Math.abs(f[3]) < 0.03 && Math.abs(f[4]) < 0.05 && Math.abs(f[5]) < 3.0 * DEG
                && Math.abs(f[6]) < (turning ? 1.5 : 3.0) * DEG && Math.abs(f[7]) < 3 * DEG;
        if (!within) {
            withinSinceS = Double.NaN;
        } else if (Double.isNaN(withinSinceS)) {
            withinSinceS = s.timeS;
        }
        return (!Double.isNaN(withinSinceS) && s.timeS - withinSinceS >= STABLE_S)
                || s.timeS - holdingSinceS > STABILISE_TIMEOUT_S;
    }

    /**
     * Energy-managed flight toward an altitude, speed and heading (or a fixed bank when heading is NaN), in the
     * manner of a total-energy control: the throttle serves the total energy rate the two errors ask for, the
     * flight path their balance ({@code gamma - Vdot/g} toward {@code hdot/V - Vdot_wanted/g}), so that with the
     * throttle at a stop the two errors share what the engine gives and no mode ever switches.
     */
    private void level(SensedState s, double hpCmd, double tasCmd, double heading, double bank, double dtS) {
        double v = Math.max(s.tasMps, 20.0);
        double climb = loops.climbForAltitude(s, hpCmd, climbMaxMps, 30.0);
        double vDot = loops.accelForSpeed(s, tasCmd, 2.0);
        double vDotNow = s.alongMps2 - SensedState.G * Math.sin(s.gammaRad);
        double balance = climb / v - vDot / SensedState.G;
        double gamma = Math.asin(Loops.clamp(balance + vDotNow / SensedState.G, -0.35, 0.26));
        loops.pitchNz(s, Loops.clamp(loops.nzForGamma(s, gamma), 0.2, 2.5), dtS);
        loops.throttleEnergy(s, vDot, climb, dtS);
        double bankCmd = Double.isNaN(heading) ? bank : loops.bankForHeading(s, heading, 45 * DEG);
        loops.rollToBank(s, bankCmd, 15 * DEG, dtS);
        loops.yawBeta(s, 0.0, dtS);
    }
}
