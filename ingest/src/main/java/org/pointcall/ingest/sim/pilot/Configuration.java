package org.pointcall.ingest.sim.pilot;

import org.pointcall.ingest.sim.airframe.Airframe;
import org.pointcall.ingest.sim.airframe.LongitudinalAero;
import org.pointcall.ingest.sim.airframe.StallCharacteristics;

/**
 * Gear and flaps as increments on the clean airframe, for a flight model that has none (the pilot plans with them,
 * the flight flies them): the minimum that makes a
 * landing-configuration point fly differently. Landing flap: +0.55 in CL at a given angle of attack (the
 * zero-lift angle moves), +0.045 in CD0, -0.06 in Cm0, stall and reattachment 2 deg earlier; take-off flap half
 * of that; gear +0.02 in CD0. Values are of the order usual for a plain or single-slotted trailing-edge flap on a
 * trainer [memory], invented for the simulator.
 */
public final class Configuration {
    private static final double FLAP_LANDING_CL = 0.55;
    private static final double FLAP_LANDING_CD0 = 0.045;
    private static final double FLAP_LANDING_CM0 = -0.06;
    private static final double FLAP_LANDING_STALL_RAD = Math.toRadians(2.0);
    private static final double GEAR_CD0 = 0.02;

    private Configuration() {
    }

    /**
     * The clean airframe with gear {@code gear} (0 up to 1 down, fractions while it moves) and flap {@code flap}
     * (0 up to 2 landing, fractions while it moves).
     */
    public static Airframe of(Airframe clean, double gear, double flap) {
        if (gear == 0.0 && flap == 0.0) {
            return clean;
        }
        double f = flap / 2.0;
        LongitudinalAero l = clean.longitudinal();
        LongitudinalAero lon = new LongitudinalAero(l.alphaZeroLiftRad() - f * FLAP_LANDING_CL / l.cLAlpha(),
                l.cLAlpha(), l.cLQ(), l.cLElevator(), l.cD0() + f * FLAP_LANDING_CD0 + gear * GEAR_CD0,
                l.inducedDragFactor(), l.cm0() + f * FLAP_LANDING_CM0, l.cmAlpha(), l.cmQ(), l.cmAlphaDot(),
                l.cmElevator(), l.prandtlGlauertMachCap(), l.dragRiseMach());
        StallCharacteristics s = clean.stall();
        double d = f * FLAP_LANDING_STALL_RAD;
        StallCharacteristics st = new StallCharacteristics(s.alphaStallRad() - d,
                Math.max(0.0, s.alphaReattachRad() - d), s.alphaStallNegativeRad(), s.alphaReattachNegativeRad(),
                s.breakWidthRad(), s.separatedLift(), s.separatedNormalForce(), s.separatedDragIncrement(),
                s.separationLagChords(), s.hysteresisLagChords(), s.pitchBreakCm(), s.wingDropCl(),
                s.rollDampingSeparatedRatio());
        return new Airframe(clean.name(), clean.description(), clean.mass(), clean.geometry(), lon,
                clean.lateral(), st, clean.engine(), clean.controls(), clean.staticSourceError());
    }
}
