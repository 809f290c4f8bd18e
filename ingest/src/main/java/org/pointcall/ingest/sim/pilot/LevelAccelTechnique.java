package org.pointcall.ingest.sim.pilot;

/**
 * A level acceleration: full throttle from the stabilised low speed, altitude held with gentle pitch (the g kept
 * within a few hundredths of 1), wings level on the heading, until the Mach number reaches the end of the run or
 * stops growing.
 */
final class LevelAccelTechnique extends Technique {
    private double hpHold;
    private double psiHold;
    private double lastTas;
    private double slowSinceS = Double.NaN;

    LevelAccelTechnique(PointPlan plan, Loops loops, Envelope envelope, Limits limits, PilotListener listener) {
        super(plan, loops, envelope, limits, listener);
    }

    @Override
    void start(SensedState s) {
        hpHold = plan.hpM;
        psiHold = s.psiRad;
        lastTas = s.tasMps;
        loops.throttleHold(1.0);
        mark("start", s);
    }

    @Override
    boolean tick(SensedState s, double dtS) {
        loops.throttleHold(1.0);
        double climb = loops.climbForAltitude(s, hpHold, 2.0, 2.0);
        double nz = Loops.clamp(loops.nzForGamma(s, Loops.gammaForClimb(s, climb)), 0.95, 1.05);
        loops.pitchNz(s, nz, dtS);
        loops.rollToBank(s, loops.bankForHeading(s, psiHold, 5 * DEG), 5 * DEG, dtS);
        loops.yawBeta(s, 0.0, dtS);
        double accel = (s.tasMps - lastTas) / dtS;
        lastTas = s.tasMps;
        if (accel > 0.05) {
            slowSinceS = Double.NaN;
        } else if (Double.isNaN(slowSinceS)) {
            slowSinceS = s.timeS;
        }
        boolean stalled = !Double.isNaN(slowSinceS) && s.timeS - slowSinceS > 10.0;
        if (s.mach >= plan.machTo || stalled || s.timeS - beginS > 400.0) {
            mark("end", s);
            return false;
        }
        return true;
    }
}
