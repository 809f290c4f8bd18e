package org.pointcall.ingest.sim.pilot;

/**
 * A phugoid: from trim, a gentle pull (1.25 g) until the speed has dropped by 8 % (5 to 10 % is usual practice),
 * the elevator back at its trim position and held there hands off, throttle fixed, for one and a half periods of
 * the pilot's estimate {@code pi sqrt(2) V / g} (Lanchester's approximation). Wings held level with the ailerons.
 */
final class PhugoidTechnique extends Technique {
    private static final double DISPLACEMENT = 0.08;

    private double trimElevator;
    private double throttle;
    private double casTrim;
    private double releaseS = Double.NaN;
    private double freeS;

    PhugoidTechnique(PointPlan plan, Loops loops, Envelope envelope, Limits limits, PilotListener listener) {
        super(plan, loops, envelope, limits, listener);
    }

    @Override
    void start(SensedState s) {
        trimElevator = loops.elevator();
        throttle = loops.throttle();
        casTrim = s.casMps;
        double period = Math.PI * Math.sqrt(2.0) * s.tasMps / SensedState.G;
        double cycles = plan.flaw == Flaw.SHORT_HOLD ? 0.9 : 1.5;
        freeS = Loops.clamp(cycles * period, 30.0, 200.0);
    }

    @Override
    boolean tick(SensedState s, double dtS) {
        loops.throttleHold(throttle);
        if (Double.isNaN(releaseS)) {
            loops.pitchNz(s, 1.25, dtS);
            if (s.casMps <= casTrim * (1.0 - DISPLACEMENT) || s.timeS - beginS > 40.0) {
                releaseS = s.timeS;
                mark("release", s);
            }
        } else {
            loops.pitchHold(trimElevator);
        }
        loops.rollToBank(s, plan.wingsLevelBankRad, 5 * DEG, dtS);
        loops.yawBeta(s, 0.0, dtS);
        return Double.isNaN(releaseS) || s.timeS - releaseS < freeS;
    }
}
