package org.pointcall.ingest.sim.sortie;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Map;

import org.junit.jupiter.api.Test;
import org.pointcall.ingest.sim.truth.BandTruth;
import org.pointcall.shared.card.Band;
import org.pointcall.shared.card.BandPhase;
import org.pointcall.shared.units.Unit;
import org.pointcall.shared.units.Units;

/**
 * Bands judged on a hand-built trajectory whose every value is known: 0 to 20 s at 10 Hz, KCAS falling at exactly
 * 0.5 m/s^2 from 60 m/s, Hp climbing 2 m/s from 3000 m, Nz = 1 + 0.01 t, bank 0 but for one 6 deg sample at 5 s
 * and one 7 deg sample at 13 s. The point begins at 2 s; "throughout" bands stop at 12 s; the break is at 15 s.
 */
class BandJudgeTest {
    private static final double BEGIN_S = 2.0;
    private static final double THROUGH_S = 12.0;
    private static final Map<String, Double> INSTANTS = Map.of("break", 15.0);

    private static Trajectory trajectory() {
        Trajectory tr = new Trajectory();
        for (int k = 0; k <= 200; k++) {
            double t = k / 10.0;
            double[] row = new double[Trajectory.CHANNELS];
            row[Trajectory.TIME] = t;
            row[Trajectory.KCAS] = 60.0 - 0.5 * t;
            row[Trajectory.HP] = 3000.0 + 2.0 * t;
            row[Trajectory.NZ] = 1.0 + 0.01 * t;
            row[Trajectory.ROLL] = k == 50 ? Math.toRadians(6.0) : k == 130 ? Math.toRadians(7.0) : 0.0;
            tr.add(row);
        }
        return tr;
    }

    private static BandTruth judge(Band b, Map<String, Double> metricsSi) {
        return BandJudge.judge(b, trajectory(), BEGIN_S, THROUGH_S, INSTANTS, metricsSi);
    }

    @Test
    void entryBandIsTheValueAtTheBeginInTheBandsUnit() {
        Band b = Band.ofTarget("Hp", null, BandPhase.ENTRY, null, Double.NaN, Unit.FOOT, 9850, 50, 50);
        BandTruth t = judge(b, Map.of());
        // 3000 m + 2 m/s x 2 s = 3004 m
        assertEquals(Units.mToFt(3004.0), t.value(), 1e-9);
        assertEquals("ft", t.unit());
        assertEquals("entry", t.phase());
        assertTrue(t.inside());
    }

    @Test
    void throughoutBandReportsTheSampleFurthestOutsideBetweenBeginAndItsEnd() {
        Band b = Band.ofTarget("Roll", null, BandPhase.THROUGHOUT, null, Double.NaN, Unit.DEGREE, 0, 5, 5);
        BandTruth t = judge(b, Map.of());
        // the 6 deg sample at 5 s is inside the window, the 7 deg one at 13 s is not
        assertEquals(6.0, t.value(), 1e-9);
        assertFalse(t.inside());
    }

    @Test
    void throughoutBandAllInsideReportsTheSampleNearestAnEdge() {
        Band b = Band.ofRange("Nz", null, BandPhase.THROUGHOUT, null, Double.NaN, Unit.G, 0.9, 1.2);
        BandTruth t = judge(b, Map.of());
        // Nz runs 1.02 to 1.12 over 2..12 s; the nearest to an edge is 1.12 (0.08 from 1.2; 1.02 is 0.12 from 0.9)
        assertEquals(1.12, t.value(), 1e-9);
        assertTrue(t.inside());
    }

    @Test
    void rateBandIsTheLeastSquaresSlopeOverTheIntervalBeforeTheInstant() {
        Band b = Band.ofTarget("KCAS", null, BandPhase.RATE, "break", 10.0, Unit.KNOT_PER_SECOND, -1.0, 0.25, 0.25);
        BandTruth t = judge(b, Map.of());
        // -0.5 m/s^2 exactly, in kt/s: -0.5 / (1852 / 3600)
        assertEquals(-0.5 / (1852.0 / 3600.0), t.value(), 1e-9);
        assertTrue(t.inside());
    }

    @Test
    void instantBandIsTheValueAtTheNamedInstant() {
        Band b = Band.ofTarget("Nz", null, BandPhase.INSTANT, "break", Double.NaN, Unit.G, 1.0, 0.1, 0.1);
        BandTruth t = judge(b, Map.of());
        assertEquals(1.15, t.value(), 1e-9);
        assertFalse(t.inside());
    }

    @Test
    void resultBandJudgesTheMetricInTheBandsOwnUnit() {
        Band b = Band.ofRange(null, "stall-kcas", BandPhase.RESULT, null, Double.NaN, Unit.KNOT, 88, 102);
        BandTruth t = judge(b, Map.of("stall-kcas", 50.0));
        assertEquals(50.0 / (1852.0 / 3600.0), t.value(), 1e-9);
        assertTrue(t.inside());
        assertEquals("88 to 102 kt", t.band());
    }

    @Test
    void whatCannotBeJudgedIsNaNAndOutside() {
        Band metric = Band.ofRange(null, "max-aoa", BandPhase.RESULT, null, Double.NaN, Unit.DEGREE, 10, 20);
        Band unknown = Band.ofRange("EGT", null, BandPhase.THROUGHOUT, null, Double.NaN, Unit.DEGREE_CELSIUS,
                Double.NEGATIVE_INFINITY, 760);
        Band noInstant = Band.ofTarget("Nz", null, BandPhase.INSTANT, "apex", Double.NaN, Unit.G, 1.0, 0.1, 0.1);
        for (Band b : new Band[] {metric, unknown, noInstant}) {
            BandTruth t = judge(b, Map.of());
            assertTrue(Double.isNaN(t.value()), b.subject());
            assertFalse(t.inside(), b.subject());
        }
    }
}
