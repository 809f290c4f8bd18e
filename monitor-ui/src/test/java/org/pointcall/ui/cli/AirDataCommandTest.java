package org.pointcall.ui.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class AirDataCommandTest {

    @Test
    void printsEveryQuantityForAWorkedCase() {
        CommandRun r = CommandRun.of("airdata", "--hp-ft", "20000", "--kcas", "350");
        assertEquals(0, r.exitCode(), r.err());
        // check-values.md: 350 KCAS at 20,000 ft, ISA day, computed from NASA RP-1046 relations:
        // M 0.7535, KTAS 462.9, KEAS 337.9 (printed to 4 and 1 digits: tolerance half a unit of the last digit).
        assertEquals(0.7535, r.number("Mach"), 0.00005);
        assertEquals(462.9, r.number("KTAS"), 0.05);
        assertEquals(337.9, r.number("KEAS"), 0.05);
        // 1976 U.S. Standard Atmosphere at 20,000 ft: 46563.3 Pa, 248.526 K, 0.652694 kg/m^3 (6 digits).
        assertEquals(46563.3, r.number("static pressure"), 0.05);
        assertEquals(248.526 - 273.15, r.number("static temperature"), 0.005);
        assertEquals(0.652694, r.number("density"), 0.0000005);
        assertEquals(20000, r.number("density altitude"), 0.5);
        assertTrue(r.figures().keySet().containsAll(java.util.List.of("pressure altitude", "impact pressure", "qc/p",
                "speed of sound", "KCAS", "ISA deviation")));
    }

    @Test
    void staticPressureInInchesOfMercuryGivesThePressureAltitude() {
        // check-values.md: 30089.6 Pa is 30,000 ft pressure altitude [computed, 1976 standard]; 1 inHg = 3386.389 Pa.
        CommandRun r = CommandRun.of("airdata", "--ps-inhg", String.valueOf(30089.6 / 3386.389), "--mach", "0.8");
        assertEquals(0, r.exitCode(), r.err());
        assertEquals(30000.0, r.number("pressure altitude"), 0.1);
    }

    @Test
    void hotDayRaisesTrueAirspeedAndDensityAltitude() {
        CommandRun std = CommandRun.of("airdata", "--hp-ft", "10000", "--kcas", "250");
        CommandRun hot = CommandRun.of("airdata", "--hp-ft", "10000", "--kcas", "250", "--isa-dev-c", "20");
        assertEquals(0, hot.exitCode(), hot.err());
        assertEquals(20.0, hot.number("ISA deviation"), 1e-9);
        assertEquals(std.number("Mach"), hot.number("Mach"), 1e-9, "Mach depends on pressures only");
        assertTrue(hot.number("KTAS") > std.number("KTAS"));
        assertTrue(hot.number("density altitude") > std.number("density altitude") + 1000);
    }

    @Test
    void negativeSpeedIsOneLineAndExitCodeTwo() {
        CommandRun r = CommandRun.of("airdata", "--hp-ft", "20000", "--kcas", "-5");
        assertEquals(2, r.exitCode());
        assertEquals("pointcall airdata: CAS must be zero or positive, got -5 kt (-2.57222 m/s)", r.err().strip());
        assertFalse(r.err().contains("Exception"));
    }

    @Test
    void altitudeOutsideTheModelIsRefused() {
        CommandRun r = CommandRun.of("airdata", "--hp-ft", "300000", "--mach", "0.5");
        assertEquals(2, r.exitCode());
        assertEquals(1, r.err().strip().lines().count());
        assertTrue(r.err().contains("outside the standard atmosphere model"), r.err());
    }

    @Test
    void missingSpeedNamesTheChoices() {
        CommandRun r = CommandRun.of("airdata", "--hp-ft", "20000");
        assertEquals(2, r.exitCode());
        assertTrue(r.err().contains("--kcas") && r.err().contains("--mach") && r.err().contains("--ktas"), r.err());
    }

    @Test
    void twoSpeedsAreRefused() {
        CommandRun r = CommandRun.of("airdata", "--hp-ft", "20000", "--kcas", "250", "--mach", "0.5");
        assertEquals(2, r.exitCode());
        assertTrue(r.err().contains("mutually exclusive"), r.err());
    }
}
