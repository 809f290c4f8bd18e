package org.pointcall.ingest.sim.pilot;

/**
 * An aileron roll: nose raised to about 8 deg of pitch, then full lateral stick with the elevator back at its
 * level-flight trim and the ball centred with the feet, until the bank has turned through 360 deg less the
 * stopping lead; then wings level and back to level flight.
 */
final class AileronRollTechnique extends Technique {
    private enum Phase { PITCH_UP, ROLL, STOP, LEVEL }

    private Phase phase;
    private double trimElevator;
    private double lastPhi;
    private double turned;
    private double psiHold;
    private double stopS;

    AileronRollTechnique(PointPlan plan, Loops loops, Envelope envelope, Limits limits, PilotListener listener) {
        super(plan, loops, envelope, limits, listener);
    }

    @Override
    void start(SensedState s) {
        phase = Phase.PITCH_UP;
        trimElevator = loops.elevator();
        psiHold = s.psiRad;
    }

    @Override
    boolean tick(SensedState s, double dtS) {
        switch (phase) {
            case PITCH_UP -> {
                loops.pitchNz(s, Loops.clamp(loops.nzForGamma(s, 10 * DEG), 1.0, 1.8), dtS);
                loops.rollToBank(s, 0.0, 10 * DEG, dtS);
                loops.yawBeta(s, 0.0, dtS);
                if (s.thetaRad >= 8 * DEG || s.timeS - beginS > 5.0) {
                    phase = Phase.ROLL;
                    lastPhi = s.phiRad;
                    turned = 0.0;
                    mark("input", s);
                }
            }
            case ROLL -> {
                turned += SensedState.wrap(s.phiRad - lastPhi);
                lastPhi = s.phiRad;
                var a = loops.airframe().controls().aileron();
                loops.rollHold(plan.rollDirection > 0 ? a.minRad() : a.maxRad());
                loops.pitchHold(trimElevator);
                loops.yawBeta(s, 0.0, dtS);
                double lead = Math.abs(s.pRadS) * 0.12;
                if (Math.abs(turned) >= 2.0 * Math.PI - lead) {
                    phase = Phase.STOP;
                    stopS = s.timeS;
                }
            }
            case STOP -> {
                loops.rollToBank(s, 0.0, 400 * DEG, dtS);
                loops.pitchHold(trimElevator);
                loops.yawBeta(s, 0.0, dtS);
                if (Math.abs(s.phiRad) < 5 * DEG && Math.abs(s.pRadS) < 10 * DEG || s.timeS - stopS > 3.0) {
                    phase = Phase.LEVEL;
                    psiHold = s.psiRad;
                }
            }
            case LEVEL -> {
                flyLevel(s, plan.hpM, entryTas(s), psiHold, 20 * DEG, dtS);
                return !(steadyFor(s, 2.0) || s.timeS - stopS > 40.0);
            }
        }
        return true;
    }
}
