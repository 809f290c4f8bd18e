package org.pointcall.ingest.sim.airframe;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class AirframeVariationTest {
    static final Airframe BASE = Airframes.load("veskarn-02");

    private static void within(double spread, double base, double varied, String what) {
        double f = varied / base;
        assertTrue(f >= 1 - spread - 1e-12 && f <= 1 + spread + 1e-12, what + " scaled by " + f);
    }

    @Test
    void noSpreadIsTheProfileItself() {
        assertSame(BASE, AirframeVariation.NONE.apply(BASE, 7));
    }

    @Test
    void theSameSeedGivesTheSameVariantAndAnotherSeedAnother() {
        AirframeVariation v = new AirframeVariation(0.2);
        assertEquals(v.apply(BASE, 11), v.apply(BASE, 11));
        assertNotEquals(v.apply(BASE, 11), v.apply(BASE, 12));
        assertNotEquals(BASE, v.apply(BASE, 11));
    }

    @Test
    void everyFactorStaysInsideTheSpreadAndTheNameStays() {
        double spread = 0.25;
        AirframeVariation v = new AirframeVariation(spread);
        for (long seed = 1; seed <= 50; seed++) {
            Airframe a = v.apply(BASE, seed);
            assertEquals(BASE.name(), a.name());
            within(spread, BASE.mass().zeroFuelMassKg(), a.mass().zeroFuelMassKg(), "mass");
            within(spread, BASE.geometry().spanM(), a.geometry().spanM(), "span");
            // span and chord by one factor, so the wing area by its square and the aspect ratio not at all
            assertEquals(a.geometry().spanM() / BASE.geometry().spanM(),
                    a.geometry().chordM() / BASE.geometry().chordM(), 1e-12);
            assertEquals(Math.pow(a.geometry().spanM() / BASE.geometry().spanM(), 2),
                    a.geometry().wingAreaM2() / BASE.geometry().wingAreaM2(), 1e-12);
            within(spread, BASE.stall().alphaStallRad(), a.stall().alphaStallRad(), "stall angle");
            // stall and reattachment move together: the hysteresis keeps its shape
            assertEquals(a.stall().alphaStallRad() / BASE.stall().alphaStallRad(),
                    a.stall().alphaReattachRad() / BASE.stall().alphaReattachRad(), 1e-12);
            within(spread, BASE.longitudinal().cmElevator(), a.longitudinal().cmElevator(), "pitch control power");
            within(spread, BASE.lateral().cRollAileron(), a.lateral().cRollAileron(), "roll control power");
            within(spread, BASE.engine().maxThrustSeaLevelN(), a.engine().maxThrustSeaLevelN(), "thrust");
            within(spread, BASE.controls().elevator().rateRadS(), a.controls().elevator().rateRadS(),
                    "elevator rate");
            // mass times a factor of its own: the inertia scale lies within both spreads
            double fi = a.mass().iyyKgM2() / BASE.mass().iyyKgM2();
            assertTrue(fi >= (1 - spread) * (1 - spread) - 1e-12 && fi <= (1 + spread) * (1 + spread) + 1e-12);
        }
    }

    @Test
    void aSpreadOutOfRangeIsRefused() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> new AirframeVariation(0.5));
        assertEquals("airframe spread must be between 0 and 0.4, got 0.5", e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> new AirframeVariation(-0.1));
        assertThrows(IllegalArgumentException.class, () -> new AirframeVariation(Double.NaN));
    }
}
