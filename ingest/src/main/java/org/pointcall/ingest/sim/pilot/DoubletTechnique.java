package org.pointcall.ingest.sim.pilot;

/**
 * A pitch doublet from trim: two seconds hands off, then the elevator nose-up and nose-down about the trim for a
 * half-period each of 2.3 / omega_sp (the short-period frequency from the pilot's knowledge of the aircraft;
 * common practice), sized for about 0.8 g each way, then the elevator back at trim and held for eight seconds
 * while the response dies out. Wings kept level with the ailerons, throttle fixed.
 */
final class DoubletTechnique extends Technique {
    private static final double LEAD_S = 2.0;
    private static final double FREE_S = 8.0;

    private double trimElevator;
    private double throttle;
    private double halfS;
    private double amplitudeRad;
    private double psiHold;
    private boolean inputMarked;
    private boolean releaseMarked;

    DoubletTechnique(PointPlan plan, Loops loops, Envelope envelope, Limits limits, PilotListener listener) {
        super(plan, loops, envelope, limits, listener);
    }

    @Override
    void start(SensedState s) {
        trimElevator = loops.elevator();
        throttle = loops.throttle();
        psiHold = s.psiRad;
        double omega = envelope.shortPeriodRadS(s.casMps, s.hpM, s.massKg);
        halfS = Loops.clamp(2.3 / omega, 0.3, 2.0);
        var lon = loops.airframe().longitudinal();
        double perRad = s.qbarPa * loops.airframe().geometry().wingAreaM2() / s.weightN()
                * Math.abs(lon.cLElevator() - lon.cLAlpha() * lon.cmElevator() / lon.cmAlpha());
        amplitudeRad = Math.min(0.8 / Math.max(perRad, 1.0) * plan.inputScale, 10 * DEG);
    }

    @Override
    boolean tick(SensedState s, double dtS) {
        double t = s.timeS - beginS - LEAD_S;
        double elevator = trimElevator;
        if (t >= 0.0 && t < halfS) {
            elevator = trimElevator - amplitudeRad;
        } else if (t >= halfS && t < 2.0 * halfS) {
            elevator = trimElevator + amplitudeRad;
        }
        if (t >= 0.0 && !inputMarked) {
            inputMarked = true;
            mark("input", s);
        }
        if (t >= 2.0 * halfS && !releaseMarked) {
            releaseMarked = true;
            mark("release", s);
        }
        loops.pitchHold(elevator);
        loops.throttleHold(throttle);
        loops.rollToBank(s, loops.bankForHeading(s, psiHold, 5 * DEG), 10 * DEG, dtS);
        loops.yawBeta(s, 0.0, dtS);
        return t < 2.0 * halfS + FREE_S;
    }
}
