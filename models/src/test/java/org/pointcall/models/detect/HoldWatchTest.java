package org.pointcall.models.detect;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;

import org.junit.jupiter.api.Test;
import org.pointcall.shared.units.Units;

/**
 * The hold signature on hand-built flight at 100 Hz with sensor noise (Hp 3 ft, CAS 0.3 kt, bank 0.2 deg, Nz
 * 0.02 g, P 0.5 deg/s, one sigma): level unaccelerated flight is steady, a 300 ft/min climb and a 0.2 kt/s
 * deceleration are not (the thresholds are 50 ft/min and 0.06 kt/s), a short bump is bridged, a turn ends the run.
 */
class HoldWatchTest {
    private static final long FRAME = 10_000_000L;

    /** Flight as functions of time: Hp ft, KCAS kt, bank deg, Nz g. */
    private interface Flight {
        double hpFt(double t);

        default double kcas(double t) {
            return 200;
        }

        default double bankDeg(double t) {
            return 0;
        }

        default double nz(double t) {
            return 1;
        }
    }

    /** Feeds {@code seconds} of the flight; returns the longest run held, s. */
    private static double longestHeld(HoldWatch w, Flight f, double seconds, boolean attitude, long seed) {
        Random r = new Random(seed);
        PhysicalState s = new PhysicalState();
        double longest = 0;
        for (long k = 0; k * 0.01 <= seconds; k++) {
            double t = k * 0.01;
            s.advance(k * FRAME);
            s.set(PhysicalQuantity.HP, Units.ftToM(f.hpFt(t) + 3 * r.nextGaussian()));
            s.set(PhysicalQuantity.CAS, (f.kcas(t) + 0.3 * r.nextGaussian()) * Units.MPS_PER_KT);
            if (attitude) {
                s.set(PhysicalQuantity.ROLL, Math.toRadians(f.bankDeg(t) + 0.2 * r.nextGaussian()));
                s.set(PhysicalQuantity.NZ, f.nz(t) + 0.02 * r.nextGaussian());
                s.set(PhysicalQuantity.P, Math.toRadians(0.5 * r.nextGaussian()));
            }
            w.onState(s);
            longest = Math.max(longest, w.heldNs() / 1e9);
        }
        return longest;
    }

    @Test
    void levelUnacceleratedFlightIsSteadyFromTheStart() {
        HoldWatch w = new HoldWatch();
        double held = longestHeld(w, t -> 12000, 60, true, 1);
        assertTrue(held > 54, "held " + held + " s of 60");
        assertTrue(w.holding());
        assertTrue(w.steadySinceNs() < 6_000_000_000L, "steady after the smoothing's warm-up: " + w.steadySinceNs());
    }

    @Test
    void aClimbOrASlowDecelerationIsNotAHold() {
        assertEquals(0, longestHeld(new HoldWatch(), t -> 12000 + 5 * t, 60, true, 2), 3.0, "300 ft/min climb");
        assertEquals(0, longestHeld(new HoldWatch(), new Flight() {
            public double hpFt(double t) {
                return 12000;
            }

            public double kcas(double t) {
                return 200 - 0.2 * t;
            }
        }, 60, true, 3), 3.0, "0.2 kt/s deceleration");
    }

    @Test
    void aBlipIsBridgedAndATurnEndsTheRun() {
        HoldWatch w = new HoldWatch();
        Flight f = new Flight() {
            public double hpFt(double t) {
                return 12000;
            }

            public double nz(double t) {
                return t > 20 && t < 20.4 ? 1.3 : 1; // a bump: 0.4 s at 1.3 g
            }

            public double bankDeg(double t) {
                return t > 40 ? 30 : 0; // rolled into a turn at 40 s
            }
        };
        double held = longestHeld(w, f, 60, true, 4);
        assertTrue(held > 34 && held < 41, "one run from the start to the turn, not broken by the bump: " + held);
        assertFalse(w.holding() && w.steadySinceNs() < 40_000_000_000L, "the turn ended the run");
        assertEquals(40.0, w.endedRunNs() / 1e9, 1.0, "the run ended where the bank came in");
    }

    @Test
    void withoutAttitudeTheAirDataAloneJudgesAndWithoutSpeedNothingIs() {
        assertTrue(longestHeld(new HoldWatch(), t -> 12000, 30, false, 5) > 27);
        HoldWatch w = new HoldWatch();
        PhysicalState s = new PhysicalState();
        for (long k = 0; k < 3000; k++) {
            s.advance(k * FRAME);
            s.set(PhysicalQuantity.HP, Units.ftToM(12000));
            w.onState(s);
        }
        assertFalse(w.holding(), "Hp alone cannot tell a hold from a level deceleration");
    }
}
