package org.pointcall.ingest.sim.pilot;

/**
 * The way one manoeuvre kind is flown, from the moment the pilot starts it (the entry condition has been
 * stabilised by the transit) to steady flight again. A technique drives the {@link Loops} every tick and reports
 * its own marks; it ends itself.
 */
abstract class Technique {
    static final double DEG = Math.PI / 180.0;

    final PointPlan plan;
    final Loops loops;
    final Envelope envelope;
    final Limits limits;
    private final PilotListener listener;
    double beginS;
    private double steadySinceS = Double.NaN;

    Technique(PointPlan plan, Loops loops, Envelope envelope, Limits limits, PilotListener listener) {
        this.plan = plan;
        this.loops = loops;
        this.envelope = envelope;
        this.limits = limits;
        this.listener = listener;
    }

    /** The technique starts now, from the stabilised entry. */
    final void begin(SensedState s) {
        beginS = s.timeS;
        start(s);
    }

    abstract void start(SensedState s);

    /** One control tick; false once the point has ended (the pilot has said so). */
    abstract boolean tick(SensedState s, double dtS);

    final void mark(String name, SensedState s) {
        listener.pointMark(name, s.timeS);
    }

    /** Entry speed as a true airspeed at the present altitude. */
    final double entryTas(SensedState s) {
        return plan.onMach ? s.tasForMach(plan.mach) : s.tasForCas(plan.casMps);
    }

    /**
     * Level flight at an altitude, speed and heading: altitude with pitch through the flight path, speed with the
     * throttle on the energy rate, heading with bank, ball centred.
     */
    final void flyLevel(SensedState s, double hpM, double tasMps, double headingRad, double bankMaxRad,
                        double dtS) {
        double climb = loops.climbForAltitude(s, hpM, 8.0, 8.0);
        loops.pitchNz(s, Loops.clamp(loops.nzForGamma(s, Loops.gammaForClimb(s, climb)), 0.3, 2.0), dtS);
        loops.throttleEnergy(s, loops.accelForSpeed(s, tasMps, 1.5), climb, dtS);
        double bank = Double.isNaN(headingRad) ? 0.0 : loops.bankForHeading(s, headingRad, bankMaxRad);
        loops.rollToBank(s, bank, 15 * DEG, dtS);
        loops.yawBeta(s, 0.0, dtS);
    }

    /**
     * True once the aircraft has been steady (flight path within 1.5 deg of level, wings within 4 deg, pitch and
     * roll rates small) for {@code forS} seconds in a row.
     */
    final boolean steadyFor(SensedState s, double forS) {
        boolean steady = Math.abs(s.gammaRad) < 1.5 * DEG && Math.abs(s.phiRad) < 4 * DEG
                && Math.abs(s.qRadS) < 1.5 * DEG && Math.abs(s.pRadS) < 3 * DEG;
        if (!steady) {
            steadySinceS = Double.NaN;
            return false;
        }
        if (Double.isNaN(steadySinceS)) {
            steadySinceS = s.timeS;
        }
        return s.timeS - steadySinceS >= forS;
    }
}
