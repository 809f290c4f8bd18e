package org.pointcall.ingest.sim.airframe;

import java.util.SplittableRandom;

/**
 * Seeded random variants of an airframe profile, for training sets that must not teach a model one airframe's own
 * numbers (domain randomisation). Each chosen quantity is multiplied by its own factor drawn uniformly from
 * {@code [1 - spread, 1 + spread]}: mass and inertias, size (span and chord by one factor, wing area by its square,
 * so the wing loading and hence every speed moves), static margin, pitch, roll and yaw control power and damping,
 * stall and reattachment angles (together, so the hysteresis keeps its shape), thrust, and the control surfaces'
 * travel and rate. The name and description stay the base's: a variant is the same type in another loading and
 * build standard, and hold-out by airframe name still keeps every variant of a held-out type out.
 *
 * @param spread largest relative change of a factor, in [0, 0.4]; 0 gives the base airframe unchanged
 */
public record AirframeVariation(double spread) {
    /** Largest spread accepted: beyond about 40 % the variants stop being the same class of aircraft. */
    public static final double MAX_SPREAD = 0.4;
    /** No variation. */
    public static final AirframeVariation NONE = new AirframeVariation(0.0);

    public AirframeVariation {
        if (!(spread >= 0.0 && spread <= MAX_SPREAD)) {
            throw new IllegalArgumentException("airframe spread must be between 0 and " + MAX_SPREAD + ", got "
                    + spread);
        }
    }

    /** Whether {@link #apply} changes anything. */
    public boolean varies() {
        return spread > 0.0;
    }

    /**
     * A variant of {@code base}, the same for the same seed.
     *
     * @throws IllegalArgumentException when a drawn factor takes a quantity out of its profile range (only possible
     *                                  at large spreads; the message names it)
     */
    public Airframe apply(Airframe base, long seed) {
        if (!varies()) {
            return base;
        }
        SplittableRandom r = new SplittableRandom(seed);
        MassProperties m = base.mass();
        double fm = factor(r);
        double fi = fm * factor(r);
        MassProperties mass = new MassProperties(m.zeroFuelMassKg() * fm, m.fuelMassKg() * fm, m.ixxKgM2() * fi,
                m.iyyKgM2() * fi, m.izzKgM2() * fi, m.ixzKgM2() * fi);
        Geometry g = base.geometry();
        double fs = factor(r);
        Geometry geometry = new Geometry(g.wingAreaM2() * fs * fs, g.spanM() * fs, g.chordM() * fs);
        LongitudinalAero a = base.longitudinal();
        double fe = factor(r);
        LongitudinalAero longitudinal = new LongitudinalAero(a.alphaZeroLiftRad(), a.cLAlpha() * factor(r), a.cLQ(),
                a.cLElevator() * fe, a.cD0() * factor(r), a.inducedDragFactor(), a.cm0(), a.cmAlpha() * factor(r),
                a.cmQ() * factor(r), a.cmAlphaDot(), a.cmElevator() * fe, a.prandtlGlauertMachCap(),
                a.dragRiseMach());
        LateralAero l = base.lateral();
        double fa = factor(r);
        double fr = factor(r);
        LateralAero lateral = new LateralAero(l.cYBeta(), l.cYP(), l.cYR(), l.cYRudder() * fr, l.cRollBeta(),
                l.cRollP() * factor(r), l.cRollR(), l.cRollAileron() * fa, l.cRollRudder() * fr,
                l.cnBeta() * factor(r), l.cnP(), l.cnR() * factor(r), l.cnAileron() * fa, l.cnRudder() * fr);
        StallCharacteristics s = base.stall();
        double fa1 = factor(r);
        StallCharacteristics stall = new StallCharacteristics(s.alphaStallRad() * fa1, s.alphaReattachRad() * fa1,
                s.alphaStallNegativeRad() * fa1, s.alphaReattachNegativeRad() * fa1, s.breakWidthRad(),
                s.separatedLift(), s.separatedNormalForce(), s.separatedDragIncrement(), s.separationLagChords(),
                s.hysteresisLagChords(), s.pitchBreakCm(), s.wingDropCl() * factor(r), s.rollDampingSeparatedRatio());
        Engine e = base.engine();
        Engine engine = new Engine(e.maxThrustSeaLevelN() * factor(r), e.idleThrustFraction(), e.densityExponent(),
                e.thrustMachFactor(), e.spoolTimeHighPowerS(), e.spoolTimeLowPowerS(), e.maxFuelFlowSeaLevelKgS(),
                e.idleFuelFlowKgS(), e.thrustLineOffsetM());
        ControlSurfaces c = base.controls();
        ControlSurfaces controls = new ControlSurfaces(surface(c.elevator(), r), surface(c.aileron(), r),
                surface(c.rudder(), r));
        return new Airframe(base.name(), base.description(), mass, geometry, longitudinal, lateral, stall, engine,
                controls, base.staticSourceError());
    }

    private Surface surface(Surface s, SplittableRandom r) {
        double travel = factor(r);
        return new Surface(s.minRad() * travel, s.maxRad() * travel, s.rateRadS() * factor(r), s.timeConstantS());
    }

    private double factor(SplittableRandom r) {
        return 1.0 + spread * (2.0 * r.nextDouble() - 1.0);
    }
}
