package org.pointcall.ingest.sim.pilot;

/**
 * A wind-up turn: full power, roll in to about 1.6 g, then raise the g steadily (0.2 g/s, common practice) to the
 * target while the flight path (through the bank) holds the Mach number: the aircraft gives up height to keep its
 * speed. At the target, a second at it, then roll out, ease the g and pull out of the descent to level flight.
 */
final class WindUpTurnTechnique extends Technique {
    private enum Phase { WIND, HOLD, ROLL_OUT, PULL_OUT }

    private static final double RATE_G_PER_S = 0.2;

    private Phase phase;
    private double machCmd;
    private final int direction;
    private double holdS;
    private double hpLevel;
    private double psiLevel;
    private double recoverS;

    WindUpTurnTechnique(PointPlan plan, Loops loops, Envelope envelope, Limits limits, PilotListener listener,
                        int direction) {
        super(plan, loops, envelope, limits, listener);
        this.direction = direction;
    }

    @Override
    void start(SensedState s) {
        phase = Phase.WIND;
        machCmd = plan.onMach ? plan.mach : s.mach;
        loops.throttleHold(1.0);
    }

    @Override
    boolean tick(SensedState s, double dtS) {
        double t = s.timeS - beginS;
        switch (phase) {
            case WIND, HOLD -> {
                loops.throttleHold(1.0);
                double nzCmd = Math.min(plan.nzTarget, 1.0 + 0.6 * Math.min(1.0, t / 2.0)
                        + RATE_G_PER_S * Math.max(0.0, t - 2.0));
                loops.pitchNz(s, nzCmd, dtS);
                double vDot = Loops.clamp(0.25 * (s.tasForMach(machCmd) - s.tasMps), -3.0, 3.0);
                double gamma = Loops.clamp(Loops.gammaForAccel(s, vDot), -50 * DEG, 15 * DEG);
                double v = Math.max(s.tasMps, 20.0);
                double c = (Math.cos(s.gammaRad) + v / SensedState.G * 1.0 * (gamma - s.gammaRad))
                        / Math.max(s.nz, 1.0);
                double bank = direction * Math.acos(Loops.clamp(c, 0.05, 1.0));
                loops.rollToBank(s, bank, 30 * DEG, dtS);
                loops.yawBeta(s, 0.0, dtS);
                boolean atTarget = nzCmd >= plan.nzTarget && s.nz >= plan.nzTarget - 0.05;
                boolean capped = s.alphaRad >= loops.alphaCapRad - 0.2 * DEG;
                boolean low = Double.isFinite(limits.hpMinM) && s.hpM < limits.hpMinM + 2000 * 0.3048;
                if (phase == Phase.WIND && (atTarget || capped || low || t > 90.0)) {
                    phase = Phase.HOLD;
                    holdS = s.timeS;
                }
                if (phase == Phase.HOLD && (s.timeS - holdS >= 1.0 || low)) {
                    mark("wound-up", s);
                    phase = Phase.ROLL_OUT;
                    recoverS = s.timeS;
                }
            }
            case ROLL_OUT -> {
                loops.pitchNz(s, 1.5, dtS);
                loops.rollToBank(s, 0.0, 60 * DEG, dtS);
                loops.yawBeta(s, 0.0, dtS);
                loops.throttleEnergy(s, 0.0, 0.0, dtS);
                if (Math.abs(s.phiRad) < 10 * DEG) {
                    phase = Phase.PULL_OUT;
                }
            }
            case PULL_OUT -> {
                if (s.gammaRad < -1.0 * DEG) {
                    loops.pitchNz(s, Loops.clamp(loops.nzForGamma(s, 0.0), 0.5, 3.0), dtS);
                    loops.rollToBank(s, 0.0, 30 * DEG, dtS);
                    loops.yawBeta(s, 0.0, dtS);
                    loops.throttleEnergy(s, 0.0, 0.0, dtS);
                    hpLevel = s.hpM;
                    psiLevel = s.psiRad;
                } else {
                    flyLevel(s, hpLevel, s.tasForMach(machCmd), psiLevel, 20 * DEG, dtS);
                    if (steadyFor(s, 2.0)) {
                        return false;
                    }
                }
                if (s.timeS - recoverS > 60.0) {
                    return false;
                }
            }
        }
        return true;
    }
}
