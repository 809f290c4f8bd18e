package org.pointcall.shared.atmosphere;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigDecimal;
import java.util.Random;
import org.apache.commons.math3.analysis.solvers.BrentSolver;
import org.apache.commons.math3.ode.FirstOrderDifferentialEquations;
import org.apache.commons.math3.ode.nonstiff.DormandPrince853Integrator;
import org.junit.jupiter.api.Test;
import org.pointcall.shared.units.Units;

class StandardAtmosphereTest {

    /**
     * Asserts {@code actual} rounds to {@code printed}: within half a unit of the printed value's last digit, the
     * whole precision a printed table value carries.
     */
    static void assertPrinted(String printed, double actual, String what) {
        BigDecimal p = new BigDecimal(printed);
        double halfUnit = p.ulp().doubleValue() / 2.0;
        assertEquals(p.doubleValue(), actual, halfUnit, what + " should print as " + printed);
    }

    // Rows of the check-values table "by geopotential altitude": [computed] from the 1976 standard's defining
    // equations, agreeing with the standard's printed layer-base values to 6 digits. H (m), T (K), p (Pa),
    // rho (kg/m^3), a (m/s), each compared to its printed digits.
    private static final String[][] GEOPOTENTIAL_ROWS = {
        {"0", "288.15", "101325", "1.22500", "340.294"},
        {"1000", "281.65", "89874.6", "1.11164", "336.434"},
        {"2000", "275.15", "79495.2", "1.00649", "332.529"},
        {"5000", "255.65", "54019.9", "0.736115", "320.530"},
        {"11000", "216.65", "22632.1", "0.363918", "295.070"},
        {"15000", "216.65", "12044.6", "0.193674", "295.070"},
        {"20000", "216.65", "5474.89", "0.088035", "295.070"},
    };

    @Test
    void matchesComputedTableByGeopotentialAltitude() {
        for (String[] row : GEOPOTENTIAL_ROWS) {
            double h = Double.parseDouble(row[0]);
            // 1976 U.S. Standard Atmosphere, [computed] rows of the check-values table, printed digits
            assertPrinted(row[1], StandardAtmosphere.temperatureK(h), "T at " + h + " m");
            assertPrinted(row[2], StandardAtmosphere.pressurePa(h), "p at " + h + " m");
            assertPrinted(row[3], StandardAtmosphere.densityKgM3(h), "rho at " + h + " m");
            assertPrinted(row[4], StandardAtmosphere.speedOfSoundMps(h), "a at " + h + " m");
        }
    }

    @Test
    void matchesComputedTableAtRoundFeet() {
        double h10 = Units.ftToM(10_000);
        // 1976 U.S. Standard Atmosphere, [computed] row 10,000 ft of the check-values table, printed digits
        assertPrinted("268.338", StandardAtmosphere.temperatureK(h10), "T at 10,000 ft");
        assertPrinted("69681.7", StandardAtmosphere.pressurePa(h10), "p at 10,000 ft");
        assertPrinted("0.904637", StandardAtmosphere.densityKgM3(h10), "rho at 10,000 ft");
        assertPrinted("328.387", StandardAtmosphere.speedOfSoundMps(h10), "a at 10,000 ft");
        double h20 = Units.ftToM(20_000);
        // 1976 U.S. Standard Atmosphere, [computed] row 20,000 ft of the check-values table, printed digits
        assertPrinted("248.526", StandardAtmosphere.temperatureK(h20), "T at 20,000 ft");
        assertPrinted("46563.3", StandardAtmosphere.pressurePa(h20), "p at 20,000 ft");
        assertPrinted("0.652694", StandardAtmosphere.densityKgM3(h20), "rho at 20,000 ft");
        assertPrinted("316.032", StandardAtmosphere.speedOfSoundMps(h20), "a at 20,000 ft");
    }

    @Test
    void layerBasesMatchTheStandard() {
        // 1976 U.S. Standard Atmosphere, layer-base [table] values, 6 printed digits
        assertPrinted("216.65", StandardAtmosphere.temperatureK(11000), "T at 11 km");
        assertPrinted("22632.1", StandardAtmosphere.pressurePa(11000), "p at 11 km");
        assertPrinted("0.363918", StandardAtmosphere.densityKgM3(11000), "rho at 11 km");
        assertPrinted("216.65", StandardAtmosphere.temperatureK(20000), "T at 20 km");
        assertPrinted("5474.89", StandardAtmosphere.pressurePa(20000), "p at 20 km");
        assertPrinted("0.088035", StandardAtmosphere.densityKgM3(20000), "rho at 20 km");
        // 1976 U.S. Standard Atmosphere, 32 km and 47 km layer bases, [memory] per the check-values file
        assertPrinted("228.65", StandardAtmosphere.temperatureK(32000), "T at 32 km");
        assertPrinted("868.02", StandardAtmosphere.pressurePa(32000), "p at 32 km");
        assertPrinted("270.65", StandardAtmosphere.temperatureK(47000), "T at 47 km");
        assertPrinted("110.91", StandardAtmosphere.pressurePa(47000), "p at 47 km");
        // 1976 U.S. Standard Atmosphere, Table 4 (layer bases Hb, Tb, Pb), 51 km and 71 km, [memory]
        assertPrinted("270.65", StandardAtmosphere.temperatureK(51000), "T at 51 km");
        assertPrinted("66.9389", StandardAtmosphere.pressurePa(51000), "p at 51 km");
        assertPrinted("214.65", StandardAtmosphere.temperatureK(71000), "T at 71 km");
        assertPrinted("3.95642", StandardAtmosphere.pressurePa(71000), "p at 71 km");
    }

    @Test
    void seaLevelConstantsMatchTheStandard() {
        // 1976 U.S. Standard Atmosphere, sea-level [table] values, printed digits
        assertPrinted("287.053", StandardAtmosphere.GAS_CONSTANT_J_KG_K, "R");
        assertPrinted("1.225", StandardAtmosphere.SEA_LEVEL_DENSITY_KG_M3, "rho0");
        assertPrinted("340.294", StandardAtmosphere.SEA_LEVEL_SPEED_OF_SOUND_MPS, "a0 in m/s");
        assertPrinted("661.479", Units.mpsToKt(StandardAtmosphere.SEA_LEVEL_SPEED_OF_SOUND_MPS), "a0 in kt");
        assertPrinted("2116.22", StandardAtmosphere.SEA_LEVEL_PRESSURE_PA / Units.PA_PER_PSF, "p0 in lbf/ft^2");
        assertPrinted("29.9213", StandardAtmosphere.SEA_LEVEL_PRESSURE_PA / Units.PA_PER_INHG, "p0 in inHg");
        // slug/ft^3 = lbf s^2 / ft^4, so kg/m^3 per slug/ft^3 = N_PER_LBF / M_PER_FT^4
        double kgM3PerSlugFt3 = Units.N_PER_LBF / Math.pow(Units.M_PER_FT, 4);
        assertPrinted("0.0023769", StandardAtmosphere.SEA_LEVEL_DENSITY_KG_M3 / kgM3PerSlugFt3, "rho0 in slug/ft^3");
    }

    @Test
    void viscosityAtSeaLevelMatchesTheStandardTable() {
        // 1976 U.S. Standard Atmosphere, sea-level dynamic viscosity table value [memory], 5 printed digits
        assertPrinted("1.7894e-5", StandardAtmosphere.dynamicViscosityPaS(0.0), "mu at sea level");
        // Sutherland with the standard's beta and S, 11 km: the formula evaluated by hand, checked to 1e-15
        double t = 216.65;
        assertEquals(1.458e-6 * Math.pow(t, 1.5) / (t + 110.4), StandardAtmosphere.dynamicViscosityPaS(11000),
                1e-20);
    }

    @Test
    void matchesGeometricTableOfMechanicalEngineersHandbook() {
        // Mechanical Engineers' Handbook (Wiley), Vol. 4, standard atmosphere table by geometric altitude,
        // [table], 4 printed digits; Z converted to H first
        double h1 = StandardAtmosphere.geopotentialFromGeometricM(1000);
        assertPrinted("0.8988", StandardAtmosphere.pressurePa(h1) / 1e5, "p (bar) at Z = 1000 m");
        assertPrinted("1.1117", StandardAtmosphere.densityKgM3(h1), "rho at Z = 1000 m");
        double h5 = StandardAtmosphere.geopotentialFromGeometricM(5000);
        assertPrinted("0.5405", StandardAtmosphere.pressurePa(h5) / 1e5, "p (bar) at Z = 5000 m");
        assertPrinted("0.7364", StandardAtmosphere.densityKgM3(h5), "rho at Z = 5000 m");
    }

    @Test
    void pressureAltitudeOfTheComputedCheckValue() {
        double h = Units.ftToM(30_000);
        // 30089.6 Pa is printed to 0.1 Pa: half of that, over dp/dH = rho g0 there, is the altitude it pins down
        double tolM = 0.05 / (StandardAtmosphere.densityKgM3(h) * StandardAtmosphere.G0_MPS2);
        // check-values, pressure altitude [computed] from the 1976 standard: 30089.6 Pa gives 30,000 ft
        assertEquals(h, StandardAtmosphere.pressureAltitudeM(30089.6), tolM);
    }

    /** The standard's temperature profile, written from its layer table independently of the class under test. */
    private static final double[] HB = {0, 11000, 20000, 32000, 47000, 51000, 71000};
    private static final double[] LB = {-0.0065, 0, 0.001, 0.0028, 0, -0.0028};

    private static double profileT(double h) {
        double t = 288.15;
        for (int i = 0; i < LB.length; i++) {
            double top = i + 1 < HB.length ? HB[i + 1] : Double.POSITIVE_INFINITY;
            if (h <= top || i == LB.length - 1) {
                return t + LB[i] * (h - HB[i]);
            }
            t += LB[i] * (top - HB[i]);
        }
        throw new AssertionError();
    }

    @Test
    void pressureAgreesWithNumericalHydrostaticIntegration() {
        // Independent check of the closed forms and of the chaining of layer bases: integrate dp/dH = -g0 p/(R T)
        // numerically (Commons Math Dormand-Prince 8(5,3)), layer by layer so no step straddles a kink in T.
        double r = 8314.32 / 28.9644;
        FirstOrderDifferentialEquations hydrostatic = new FirstOrderDifferentialEquations() {
            @Override
            public int getDimension() {
                return 1;
            }

            @Override
            public void computeDerivatives(double h, double[] y, double[] dy) {
                dy[0] = -9.80665 * y[0] / (r * profileT(h));
            }
        };
        double[] stops = {-5000, 0, 1000, 5000, 11000, 15000, 20000, 32000, 47000, 51000, 60000, 71000};
        double[] y = {101325.0};
        double h = 0;
        // upwards from sea level
        for (double stop : stops) {
            if (stop <= 0) {
                continue;
            }
            DormandPrince853Integrator ode = new DormandPrince853Integrator(1e-6, 1000, 1e-14, 1e-14);
            ode.integrate(hydrostatic, h, y, stop, y);
            h = stop;
            // integrator tolerance 1e-14 per step, a few hundred steps: 1e-11 relative is ample and still tight
            assertEquals(y[0], StandardAtmosphere.pressurePa(stop), 1e-11 * y[0], "p at " + stop + " m");
        }
        // downwards to the model's bottom
        y[0] = 101325.0;
        new DormandPrince853Integrator(1e-6, 1000, 1e-14, 1e-14).integrate(hydrostatic, 0, y, -5000, y);
        assertEquals(y[0], StandardAtmosphere.pressurePa(-5000), 1e-11 * y[0], "p at -5000 m");
        // the bottom temperature follows from the first layer's lapse rate alone
        assertEquals(320.65, StandardAtmosphere.temperatureK(-5000), 1e-12);
    }

    @Test
    void temperatureFollowsTheLayerTableEverywhere() {
        Random rnd = new Random(11);
        for (int k = 0; k < 5000; k++) {
            double h = -5000 + 76000 * rnd.nextDouble();
            assertEquals(profileT(h), StandardAtmosphere.temperatureK(h), 1e-9, "T at " + h);
        }
    }

    @Test
    void pressureAndDensityAreContinuousAtEveryLayerBase() {
        for (double hb : new double[] {11000, 20000, 32000, 47000, 51000}) {
            double below = StandardAtmosphere.pressurePa(Math.nextDown(hb));
            double above = StandardAtmosphere.pressurePa(Math.nextUp(hb));
            // two ulps of altitude move p by about 1e-16 relative; 1e-14 leaves room for pow rounding
            assertEquals(below, above, 1e-14 * below, "p across " + hb);
            double rhoBelow = StandardAtmosphere.densityKgM3(Math.nextDown(hb));
            double rhoAbove = StandardAtmosphere.densityKgM3(Math.nextUp(hb));
            assertEquals(rhoBelow, rhoAbove, 1e-14 * rhoBelow, "rho across " + hb);
        }
    }

    @Test
    void pressureAltitudeAgreesWithBrentInverse() {
        BrentSolver brent = new BrentSolver(1e-12, 1e-9);
        Random rnd = new Random(1976);
        double lnMin = Math.log(StandardAtmosphere.MIN_PRESSURE_PA);
        double lnMax = Math.log(StandardAtmosphere.MAX_PRESSURE_PA);
        for (int k = 0; k < 2000; k++) {
            double p = Math.exp(lnMin + (lnMax - lnMin) * rnd.nextDouble());
            double brentH = brent.solve(200, h -> StandardAtmosphere.pressurePa(h) - p,
                    StandardAtmosphere.MIN_GEOPOTENTIAL_M, StandardAtmosphere.MAX_GEOPOTENTIAL_M);
            // Brent stops within 1e-9 m plus 1e-12 of h; 1e-6 m covers it with margin
            assertEquals(brentH, StandardAtmosphere.pressureAltitudeM(p), 1e-6, "Hp of " + p + " Pa");
        }
    }

    @Test
    void densityAltitudeAgreesWithBrentInverse() {
        BrentSolver brent = new BrentSolver(1e-12, 1e-9);
        Random rnd = new Random(1977);
        double lnMin = Math.log(StandardAtmosphere.MIN_DENSITY_KG_M3);
        double lnMax = Math.log(StandardAtmosphere.MAX_DENSITY_KG_M3);
        for (int k = 0; k < 2000; k++) {
            double rho = Math.exp(lnMin + (lnMax - lnMin) * rnd.nextDouble());
            double brentH = brent.solve(200, h -> StandardAtmosphere.densityKgM3(h) - rho,
                    StandardAtmosphere.MIN_GEOPOTENTIAL_M, StandardAtmosphere.MAX_GEOPOTENTIAL_M);
            assertEquals(brentH, StandardAtmosphere.densityAltitudeM(rho), 1e-6, "Hd of " + rho + " kg/m^3");
        }
    }

    private static double anyAltitude(Random rnd) {
        double lo = StandardAtmosphere.MIN_GEOPOTENTIAL_M;
        return lo + (StandardAtmosphere.MAX_GEOPOTENTIAL_M - lo) * rnd.nextDouble();
    }

    @Test
    void pressureAltitudeRoundTripsOverTheWholeModel() {
        Random rnd = new Random(42);
        double worst = 0;
        for (int k = 0; k < 20000; k++) {
            double h = anyAltitude(rnd);
            double back = StandardAtmosphere.pressureAltitudeM(StandardAtmosphere.pressurePa(h));
            worst = Math.max(worst, Math.abs(back - h));
        }
        // a rounding of 1e-16 relative in p is 1e-12 m through the 6 to 8 km scale height, and the altitude itself
        // (up to 7e4 m) rounds at 1.5e-11 m; pow and log add a few ulps each (worst seen 4e-11 m). 1e-9 m, about
        // 1e-14 of the model's span, bounds double-precision closed forms and catches any wrong exponent
        assertTrue(worst < 1e-9, "worst round-trip error " + worst + " m");
    }

    @Test
    void densityAltitudeRoundTripsOverTheWholeModel() {
        Random rnd = new Random(43);
        double worst = 0;
        for (int k = 0; k < 20000; k++) {
            double h = anyAltitude(rnd);
            double back = StandardAtmosphere.densityAltitudeM(StandardAtmosphere.densityKgM3(h));
            worst = Math.max(worst, Math.abs(back - h));
        }
        // same argument as for pressure altitude
        assertTrue(worst < 1e-9, "worst round-trip error " + worst + " m");
    }

    @Test
    void geometricAndGeopotentialRoundTrip() {
        Random rnd = new Random(44);
        for (int k = 0; k < 20000; k++) {
            double z = -5100 + 90000 * rnd.nextDouble();
            double h = StandardAtmosphere.geopotentialFromGeometricM(z);
            // a few roundings of quantities of 1e7 m: 1e-9 m absolute (1e-14 of 90 km) is their bound
            assertEquals(z, StandardAtmosphere.geometricFromGeopotentialM(h), 1e-9, "Z " + z);
            // dH/dZ = g/g0 = (r0/(r0 + Z))^2 is below 1 above sea level and above 1 below it: H <= Z either way
            assertTrue(h <= z, "geopotential altitude below geometric: " + z);
        }
        // 1976 standard: H = r0 Z / (r0 + Z) with r0 = 6356766 m, at Z = 1000 m by hand
        assertEquals(6356766.0 * 1000 / 6357766.0, StandardAtmosphere.geopotentialFromGeometricM(1000), 1e-12);
    }

    @Test
    void stateAtAltitudeMatchesTheFunctions() {
        AtmosphereState s = AtmosphereState.at(5000);
        assertEquals(5000, s.geopotentialAltitudeM());
        assertEquals(StandardAtmosphere.temperatureK(5000), s.temperatureK());
        assertEquals(StandardAtmosphere.pressurePa(5000), s.pressurePa());
        assertEquals(StandardAtmosphere.densityKgM3(5000), s.densityKgM3(), 1e-15);
        assertEquals(StandardAtmosphere.speedOfSoundMps(5000), s.speedOfSoundMps());
        assertEquals(StandardAtmosphere.dynamicViscosityPaS(5000), s.dynamicViscosityPaS());
    }

    @Test
    void isaDeviationKeepsPressureAndScalesDensityAndSpeedOfSound() {
        AtmosphereState std = AtmosphereState.at(3000);
        AtmosphereState hot = AtmosphereState.atPressureAltitude(3000, 20);
        assertEquals(std.pressurePa(), hot.pressurePa());
        assertEquals(std.temperatureK() + 20, hot.temperatureK(), 1e-12);
        // ideal gas at equal pressure: rho T constant; a proportional to sqrt(T)
        assertEquals(std.densityKgM3() * std.temperatureK(), hot.densityKgM3() * hot.temperatureK(), 1e-12);
        assertEquals(std.speedOfSoundMps() * Math.sqrt(hot.temperatureK() / std.temperatureK()),
                hot.speedOfSoundMps(), 1e-10);
        assertTrue(hot.dynamicViscosityPaS() > std.dynamicViscosityPaS(), "gas viscosity rises with temperature");
        AtmosphereState cold = AtmosphereState.atPressureAltitude(3000, -20);
        assertTrue(cold.densityKgM3() > std.densityKgM3());
    }

    @Test
    void outOfModelInputsAreRefusedWithTheValidRange() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> StandardAtmosphere.pressurePa(71000.5));
        assertEquals("geopotential altitude 71000.5 m is outside the standard atmosphere model, -5000 to 71000 m",
                e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> StandardAtmosphere.temperatureK(-5001));
        assertEquals("geopotential altitude -5001 m is outside the standard atmosphere model, -5000 to 71000 m",
                e.getMessage());
        e = assertThrows(IllegalArgumentException.class,
                () -> StandardAtmosphere.densityKgM3(Double.POSITIVE_INFINITY));
        assertEquals("geopotential altitude Infinity m is outside the standard atmosphere model, -5000 to 71000 m",
                e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> StandardAtmosphere.pressureAltitudeM(200000));
        assertEquals("static pressure 200000 Pa is outside the standard atmosphere model, 3.95642 to 177687 Pa",
                e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> StandardAtmosphere.pressureAltitudeM(0));
        assertEquals("static pressure 0 Pa is outside the standard atmosphere model, 3.95642 to 177687 Pa",
                e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> StandardAtmosphere.densityAltitudeM(2.5));
        assertEquals("density 2.5 kg/m^3 is outside the standard atmosphere model, 0.000064211 to 1.93047 kg/m^3",
                e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> AtmosphereState.atPressureAltitude(11000, -217));
        assertEquals("ISA deviation -217 K gives -0.35 K at pressure altitude 11000 m; the temperature must stay"
                + " above 0 K", e.getMessage());
        e = assertThrows(IllegalArgumentException.class,
                () -> StandardAtmosphere.geopotentialFromGeometricM(-7e6));
        assertEquals("geometric altitude -7000000 m is below the centre of the Earth", e.getMessage());
    }

    @Test
    void absentSamplesPassThroughAsNaN() {
        assertTrue(Double.isNaN(StandardAtmosphere.pressurePa(Double.NaN)));
        assertTrue(Double.isNaN(StandardAtmosphere.temperatureK(Double.NaN)));
        assertTrue(Double.isNaN(StandardAtmosphere.densityKgM3(Double.NaN)));
        assertTrue(Double.isNaN(StandardAtmosphere.speedOfSoundMps(Double.NaN)));
        assertTrue(Double.isNaN(StandardAtmosphere.pressureAltitudeM(Double.NaN)));
        assertTrue(Double.isNaN(StandardAtmosphere.densityAltitudeM(Double.NaN)));
        assertTrue(Double.isNaN(StandardAtmosphere.geopotentialFromGeometricM(Double.NaN)));
    }

    @Test
    void modelEndsAreInclusive() {
        assertEquals(StandardAtmosphere.MIN_GEOPOTENTIAL_M,
                StandardAtmosphere.pressureAltitudeM(StandardAtmosphere.MAX_PRESSURE_PA), 1e-9);
        assertEquals(StandardAtmosphere.MAX_GEOPOTENTIAL_M,
                StandardAtmosphere.pressureAltitudeM(StandardAtmosphere.MIN_PRESSURE_PA), 1e-9);
        assertEquals(StandardAtmosphere.MAX_GEOPOTENTIAL_M,
                StandardAtmosphere.densityAltitudeM(StandardAtmosphere.MIN_DENSITY_KG_M3), 1e-9);
        assertEquals(StandardAtmosphere.MIN_GEOPOTENTIAL_M,
                StandardAtmosphere.densityAltitudeM(StandardAtmosphere.MAX_DENSITY_KG_M3), 1e-9);
    }
}
