package org.pointcall.shared.card;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;

import org.junit.jupiter.api.Test;
import org.pointcall.shared.kind.ManoeuvreKind;
import org.pointcall.shared.units.Unit;

class BandTest {

    @Test
    void targetBandHasAsymmetricEndsInSi() {
        Band b = Band.ofTarget("KCAS", null, BandPhase.ENTRY, null, Double.NaN, Unit.KNOT, 250, 5, 10);
        assertEquals(Unit.KNOT.toSi(250), b.targetSi());
        assertEquals(Unit.KNOT.toSi(250) - Unit.KNOT.deltaToSi(5), b.lowSi());
        assertEquals(Unit.KNOT.toSi(250) + Unit.KNOT.deltaToSi(10), b.highSi());
        assertTrue(b.contains(Unit.KNOT.toSi(259)));
        assertFalse(b.contains(Unit.KNOT.toSi(244)));
        assertFalse(b.contains(Double.NaN));
    }

    @Test
    void temperatureTolerancesAreDifferencesWithoutTheOffset() {
        Band b = Band.ofTarget("EGT", null, BandPhase.THROUGHOUT, null, Double.NaN, Unit.DEGREE_CELSIUS, 700, 10, 10);
        // 700 degC = 973.15 K (SI Brochure, 9th ed.: T/K = t/degC + 273.15); a 10 degC span is 10 K
        assertEquals(963.15, b.lowSi(), 1e-9);
        assertEquals(983.15, b.highSi(), 1e-9);
    }

    @Test
    void rangeBandMayBeOpenAtOneEnd() {
        Band b = Band.ofRange("KCAS", null, BandPhase.INSTANT, "apex", Double.NaN, Unit.KNOT, 120,
                Double.POSITIVE_INFINITY);
        assertTrue(b.contains(1e9));
        assertFalse(b.contains(Unit.KNOT.toSi(119)));
        assertThrows(IllegalArgumentException.class, () -> Band.ofRange("KCAS", null, BandPhase.ENTRY, null,
                Double.NaN, Unit.KNOT, Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY));
    }

    @Test
    void aBandMustHaveWidth() {
        assertThrows(IllegalArgumentException.class, () -> Band.ofTarget("KCAS", null, BandPhase.ENTRY, null,
                Double.NaN, Unit.KNOT, 250, 0, 0));
        assertThrows(IllegalArgumentException.class, () -> Band.ofRange("KCAS", null, BandPhase.ENTRY, null,
                Double.NaN, Unit.KNOT, 250, 250));
        assertThrows(IllegalArgumentException.class, () -> Band.ofTarget("KCAS", null, BandPhase.ENTRY, null,
                Double.NaN, Unit.KNOT, 250, -1, 5));
        // one side may be zero when the other is not
        Band b = Band.ofTarget("AoS", null, BandPhase.ENTRY, null, Double.NaN, Unit.DEGREE, 0, 0, 2);
        assertEquals(0.0, b.lowSi());
    }

    @Test
    void phaseRulesHoldInTheModelToo() {
        assertThrows(IllegalArgumentException.class, () -> Band.ofRange(null, "stall-kcas", BandPhase.ENTRY, null,
                Double.NaN, Unit.KNOT, 80, 90), "a metric band is a result band");
        assertThrows(IllegalArgumentException.class, () -> Band.ofRange("KCAS", null, BandPhase.RESULT, null,
                Double.NaN, Unit.KNOT, 80, 90), "a parameter band is not");
        assertThrows(IllegalArgumentException.class, () -> Band.ofRange("KCAS", null, BandPhase.RATE, "break",
                Double.NaN, Unit.KNOT_PER_SECOND, -2, 0), "a rate band needs its interval");
        assertThrows(IllegalArgumentException.class, () -> Band.ofRange("KCAS", null, BandPhase.INSTANT, null,
                Double.NaN, Unit.KNOT, 80, 90), "an instant band needs its instant");
        assertThrows(IllegalArgumentException.class, () -> Band.ofRange("KCAS", "stall-kcas", BandPhase.RESULT, null,
                Double.NaN, Unit.KNOT, 80, 90), "not on both");
    }

    @Test
    void negativeZeroIsStoredAsZeroSoThatACardEqualsItselfReadBack() {
        Band a = Band.ofTarget("AoS", null, BandPhase.ENTRY, null, Double.NaN, Unit.DEGREE, 0, -0.0, 2);
        Band b = Band.ofTarget("AoS", null, BandPhase.ENTRY, null, Double.NaN, Unit.DEGREE, 0, 0.0, 2);
        assertEquals(b, a);
    }

    @Test
    void pointChecksItsBandsAgainstItsKind() {
        Band apex = Band.ofRange("KCAS", null, BandPhase.INSTANT, "apex", Double.NaN, Unit.KNOT, 120,
                Double.POSITIVE_INFINITY);
        new TestPoint("LP-1", ManoeuvreKind.LOOP, "Loop", "", Double.NaN, List.of(apex));
        assertThrows(IllegalArgumentException.class,
                () -> new TestPoint("SL-1", ManoeuvreKind.STALL_LEVEL, "Stall", "", Double.NaN, List.of(apex)));
        Band wrongUnit = Band.ofRange(null, "stall-kcas", BandPhase.RESULT, null, Double.NaN, Unit.FOOT, 1, 2);
        assertThrows(IllegalArgumentException.class,
                () -> new TestPoint("SL-1", ManoeuvreKind.STALL_LEVEL, "Stall", "", Double.NaN, List.of(wrongUnit)));
        assertThrows(IllegalArgumentException.class,
                () -> new TestPoint("SL 1", ManoeuvreKind.STALL_LEVEL, "Stall", "", Double.NaN, List.of()));
        assertThrows(IllegalArgumentException.class,
                () -> new TestPoint("SL-1", ManoeuvreKind.STALL_LEVEL, "Stall", "", 0, List.of()));
    }

    @Test
    void cardRefusesDuplicateIdsAndNoPoints() {
        TestPoint p = new TestPoint("TP-1", ManoeuvreKind.STABILISED, "Trim", "", 30, List.of());
        assertThrows(IllegalArgumentException.class,
                () -> new TestCard("S", "A", "", "", List.of(), List.of(p, p)));
        assertThrows(IllegalArgumentException.class, () -> new TestCard("S", "A", "", "", List.of(), List.of()));
        assertEquals(p, new TestCard("S", "A", null, null, List.of(), List.of(p)).point("TP-1").orElseThrow());
    }

    @Test
    void safetyLimitIsExceededOutsideItsEndsOnly() {
        SafetyLimit nz = SafetyLimit.of("Nz", Unit.G, Double.NEGATIVE_INFINITY, 6.0);
        assertTrue(nz.isExceededBy(6.01));
        assertFalse(nz.isExceededBy(6.0));
        assertFalse(nz.isExceededBy(-100));
        assertFalse(nz.isExceededBy(Double.NaN));
        assertThrows(IllegalArgumentException.class,
                () -> SafetyLimit.of("Nz", Unit.G, Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY));
        assertThrows(IllegalArgumentException.class, () -> SafetyLimit.of("Nz", Unit.G, 6, 6));
    }
}
