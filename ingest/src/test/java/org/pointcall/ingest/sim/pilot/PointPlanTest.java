package org.pointcall.ingest.sim.pilot;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;

import org.junit.jupiter.api.Test;
import org.pointcall.ingest.sim.airframe.Airframes;
import org.pointcall.shared.card.Band;
import org.pointcall.shared.card.BandPhase;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.card.TestPoint;
import org.pointcall.shared.demo.DemoFiles;
import org.pointcall.shared.kind.ManoeuvreKind;
import org.pointcall.shared.units.Unit;
import org.pointcall.shared.units.Units;

class PointPlanTest {
    private static final TestCard DEMO = DemoFiles.card();
    private static final Envelope TERVIK = new Envelope(Airframes.load("veskarn-02"));
    private static final double MASS_KG = 5200.0;
    private static final double KT = Units.MPS_PER_KT;
    private static final double FT = Units.M_PER_FT;

    private static PointPlan plan(String id, Flaw flaw) {
        Limits limits = new Limits(DEMO, TERVIK);
        return new PointPlan(DEMO.point(id).orElseThrow(), flaw,
                (g, f) -> new Envelope(Configuration.of(TERVIK.airframe(), g, f)), limits, MASS_KG);
    }

    @Test
    void aBandGivesItsTargetItsMiddleOrAPointJustInsideItsOneEdge() {
        Band target = Band.ofTarget("KCAS", null, BandPhase.ENTRY, null, Double.NaN, Unit.KNOT, 250, 5, 5);
        Band range = Band.ofRange(null, "nz-max", BandPhase.RESULT, null, Double.NaN, Unit.G, 4.8, 5.2);
        Band max = Band.ofRange(null, "mach-start", BandPhase.RESULT, null, Double.NaN, Unit.MACH,
                Double.NEGATIVE_INFINITY, 0.32);
        Band min = Band.ofRange(null, "mach-end", BandPhase.RESULT, null, Double.NaN, Unit.MACH, 0.68,
                Double.POSITIVE_INFINITY);
        assertEquals(250 * KT, PointPlan.target(target, 1.0), 1e-12);
        assertEquals(5.0, PointPlan.target(range, 1.0), 1e-12);
        assertEquals(0.30, PointPlan.target(max, 0.02), 1e-12);
        assertEquals(0.70, PointPlan.target(min, 0.02), 1e-12);
    }

    @Test
    void stallEntryIsTrimmedAtOnePointThreeTimesTheStallSpeedOfItsLoadFactor() {
        PointPlan level = plan("SL-1", Flaw.NONE);
        PointPlan turn = plan("ST-1", Flaw.NONE);
        double vs = TERVIK.stallCasMps(10000 * FT, MASS_KG);
        // 14 CFR 23.201 practice: trim at 1.3 Vs; in a turn the stall speed grows with the square root of n
        assertEquals(1.3 * vs, level.casMps, 1e-9);
        assertEquals(Math.toRadians(-30), turn.bankRad, 1e-12);
        assertEquals(1.3 * vs * Math.sqrt(1.0 / Math.cos(Math.toRadians(30))), turn.casMps, 1e-9);
        assertEquals(1.0 * KT, level.entryRateMps2, 1e-12);
        assertEquals(10000 * FT, level.hpM, 1e-9);
        assertEquals(0, level.gear);
        PointPlan landing = plan("SL-2", Flaw.NONE);
        assertEquals(1, landing.gear);
        assertEquals(2, landing.flap);
        assertTrue(landing.casMps < level.casMps, "flaps lower the stall speed and so the entry speed");
    }

    @Test
    void techniqueNumbersComeFromTheBands() {
        assertEquals(4.0, plan("LP-1", Flaw.NONE).nzTarget, 1e-12);
        assertEquals(320 * KT, plan("LP-1", Flaw.NONE).casMps, 1e-9);
        PointPlan wut = plan("WUT-1", Flaw.NONE);
        assertEquals(5.0, wut.nzTarget, 1e-12);
        assertTrue(wut.onMach);
        assertEquals(0.60, wut.mach, 1e-12);
        PointPlan la = plan("LA-1", Flaw.NONE);
        assertEquals(0.30, la.machFrom, 1e-12);
        assertEquals(0.70, la.machTo, 1e-12);
        assertEquals(0.85 * Math.toRadians(12), plan("SS-1", Flaw.NONE).betaMaxRad, 1e-12);
        assertEquals(30.0, plan("TP-1", Flaw.NONE).holdS, 1e-12);
        assertEquals(1, plan("AR-1", Flaw.NONE).rollDirection);
    }

    @Test
    void theFlawIsWhatThePilotBelieves() {
        assertEquals(plan("TP-1", Flaw.NONE).casMps + 8 * KT, plan("TP-1", Flaw.ENTRY_FAST).casMps, 1e-9);
        assertEquals(plan("TP-1", Flaw.NONE).casMps - 8 * KT, plan("TP-1", Flaw.ENTRY_SLOW).casMps, 1e-9);
        assertEquals(plan("TP-2", Flaw.NONE).mach + 0.015, plan("TP-2", Flaw.ENTRY_FAST).mach, 1e-12);
        assertEquals(plan("LP-1", Flaw.NONE).hpM + 400 * FT, plan("LP-1", Flaw.ENTRY_HIGH).hpM, 1e-9);
        assertEquals(plan("LP-1", Flaw.NONE).hpM - 400 * FT, plan("LP-1", Flaw.ENTRY_LOW).hpM, 1e-9);
        assertEquals(4.5, plan("LP-1", Flaw.OVER_PULL).nzTarget, 1e-12);
        assertEquals(2.5, plan("PD-1", Flaw.OVER_PULL).inputScale, 1e-12);
        assertEquals(2.0 * KT, plan("SL-1", Flaw.ENTRY_RATE_FAST).entryRateMps2, 1e-12);
        assertEquals(Math.toRadians(-38), plan("ST-1", Flaw.BANK_OFF).bankRad, 1e-12);
        assertEquals(Math.toRadians(12), plan("PH-1", Flaw.BANK_OFF).wingsLevelBankRad, 1e-12);
        assertEquals(18.0, plan("TP-1", Flaw.SHORT_HOLD).holdS, 1e-12);
        assertEquals(4.0, plan("SS-1", Flaw.LOOSE_TRACKING).looseness, 1e-12);
        assertEquals(1.0, plan("SS-1", Flaw.NONE).looseness, 1e-12);
    }

    @Test
    void whatTheAircraftCannotFlyIsClampedToWhatItCan() {
        Envelope sparrel = new Envelope(Airframes.load("sparrel-a1"));
        TestPoint fast = new TestPoint("F", ManoeuvreKind.STABILISED, "Too fast", "", 20.0, List.of(
                Band.ofTarget("KCAS", null, BandPhase.THROUGHOUT, null, Double.NaN, Unit.KNOT, 400, 2, 2),
                Band.ofTarget("Hp", null, BandPhase.THROUGHOUT, null, Double.NaN, Unit.FOOT, 8000, 100, 100)));
        TestCard card = new TestCard("S", "x", "", "", List.of(), List.of(fast));
        PointPlan p = new PointPlan(fast, Flaw.NONE, (g, f) -> sparrel, new Limits(card, sparrel), 762.0);
        double vmax = sparrel.maxLevelCasMps(8000 * FT, 762.0);
        assertEquals(0.97 * vmax, p.casMps, 1e-6);
        assertFalse(p.onMach);
    }
}
