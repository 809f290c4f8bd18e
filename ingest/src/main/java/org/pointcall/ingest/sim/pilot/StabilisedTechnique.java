package org.pointcall.ingest.sim.pilot;

/** A stabilised point: altitude, speed and heading held, trimmed, for the hold time. */
final class StabilisedTechnique extends Technique {
    private double psiHold;

    StabilisedTechnique(PointPlan plan, Loops loops, Envelope envelope, Limits limits, PilotListener listener) {
        super(plan, loops, envelope, limits, listener);
    }

    @Override
    void start(SensedState s) {
        psiHold = s.psiRad;
        mark("start", s);
    }

    @Override
    boolean tick(SensedState s, double dtS) {
        flyLevel(s, plan.hpM, entryTas(s), psiHold, 5 * DEG, dtS);
        if (s.timeS - beginS >= plan.holdS) {
            mark("end", s);
            return false;
        }
        return true;
    }
}
