package org.pointcall.ingest.sim.pilot;

/**
 * A steady-heading sideslip: rudder in steps of a quarter of its travel, each eased in over 1.5 s and held (5 s
 * by default, the card's hold otherwise), with the bank that holds the heading against the side force; one
 * direction, back to neutral, then the other. Before each step the pilot predicts its sideslip from the last one
 * and stops short of the most the card allows. Altitude held with pitch, speed with the throttle.
 */
final class SideslipTechnique extends Technique {
    private static final double RAMP_S = 1.5;
    private static final double NEUTRAL_S = 4.0;

    private double psiHold;
    private double headingI;
    private double hpHold;
    private double stepS;
    private double rudderNow;
    private double rudderFrom;
    private double rudderTo;
    private double stepStartS;
    private int direction;
    private int step;
    private boolean lastStep;
    private boolean neutral;
    private boolean done;

    SideslipTechnique(PointPlan plan, Loops loops, Envelope envelope, Limits limits, PilotListener listener) {
        super(plan, loops, envelope, limits, listener);
    }

    @Override
    void start(SensedState s) {
        psiHold = s.psiRad;
        hpHold = plan.hpM;
        stepS = plan.point.hasHold() ? plan.holdS : 5.0;
        rudderNow = loops.rudder();
        direction = 1;
        step = 0;
        nextStep(s, Double.NaN);
    }

    private double travel(int dir) {
        var r = loops.airframe().controls().rudder();
        return dir > 0 ? r.maxRad() : -r.minRad();
    }

    private void nextStep(SensedState s, double betaPerRudder) {
        rudderFrom = rudderNow;
        stepStartS = s.timeS;
        if (lastStep || step == 4) {
            neutral = true;
            rudderTo = 0.0;
            return;
        }
        step++;
        double want = direction * step * 0.25 * travel(direction);
        if (betaPerRudder > 0 && Math.abs(want) * betaPerRudder > plan.betaMaxRad) {
            want = direction * plan.betaMaxRad / betaPerRudder;
            lastStep = true;
        }
        rudderTo = want;
    }

    @Override
    boolean tick(SensedState s, double dtS) {
        double t = s.timeS - stepStartS;
        double f = Math.min(1.0, t / RAMP_S);
        rudderNow = rudderFrom + (rudderTo - rudderFrom) * (f * f * (3.0 - 2.0 * f));
        loops.yawHoldDamped(s, rudderNow);
        double climb = loops.climbForAltitude(s, hpHold, 4.0, 4.0);
        loops.pitchNz(s, Loops.clamp(loops.nzForGamma(s, Loops.gammaForClimb(s, climb)), 0.5, 1.5), dtS);
        loops.throttleEnergy(s, loops.accelForSpeed(s, entryTas(s), 1.0), climb, dtS);
        headingI = Loops.clamp(headingI + 0.15 * SensedState.wrap(psiHold - s.psiRad) * dtS, -10 * DEG, 10 * DEG);
        double bank = loops.bankForRudder(s, rudderNow) + loops.bankForHeading(s, psiHold, 10 * DEG) + headingI;
        loops.rollToBank(s, Loops.clamp(bank, -40 * DEG, 40 * DEG), 10 * DEG, dtS);
        if (neutral) {
            if (t >= NEUTRAL_S) {
                if (done || direction < 0) {
                    return false;
                }
                direction = -1;
                step = 0;
                lastStep = false;
                neutral = false;
                nextStep(s, Double.NaN);
            }
        } else if (t >= RAMP_S + stepS) {
            double ratio = Math.abs(s.betaRad) / Math.max(Math.abs(rudderNow), 1e-4);
            nextStep(s, ratio);
            if (neutral && direction < 0) {
                done = true;
            }
        }
        return true;
    }
}
