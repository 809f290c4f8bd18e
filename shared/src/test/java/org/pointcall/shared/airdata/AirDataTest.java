package org.pointcall.shared.airdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigDecimal;
import java.util.Random;
import org.apache.commons.math3.analysis.solvers.BrentSolver;
import org.junit.jupiter.api.Test;
import org.pointcall.shared.atmosphere.StandardAtmosphere;
import org.pointcall.shared.units.Units;

class AirDataTest {

    /** Within half a unit of the printed value's last digit: the precision the printed value carries. */
    static void assertPrinted(String printed, double actual, String what) {
        BigDecimal p = new BigDecimal(printed);
        assertEquals(p.doubleValue(), actual, p.ulp().doubleValue() / 2.0, what + " should print as " + printed);
    }

    private static final double P0 = StandardAtmosphere.SEA_LEVEL_PRESSURE_PA;
    private static final double A0 = StandardAtmosphere.SEA_LEVEL_SPEED_OF_SOUND_MPS;

    /** The worked chain of the check-values table for one KCAS at one pressure altitude in feet, ISA day. */
    private static double[] chain(double kcas, double feet) {
        double h = Units.ftToM(feet);
        double p = StandardAtmosphere.pressurePa(h);
        double qc = AirData.impactPressureFromCas(Units.ktToMps(kcas));
        double mach = AirData.machFromImpactPressure(qc, p);
        double tas = AirData.trueAirspeedMps(mach, StandardAtmosphere.temperatureK(h));
        double eas = AirData.equivalentAirspeedMps(tas, StandardAtmosphere.densityKgM3(h));
        return new double[] {qc, qc / p, mach, Units.mpsToKt(tas), Units.mpsToKt(eas)};
    }

    @Test
    void workedValue300KcasAt30000Ft() {
        double[] r = chain(300, 30_000);
        // check-values, [computed] from NASA RP-1046 (Gracey) formulas on the 1976 standard day, printed digits
        assertPrinted("15354.7", r[0], "qc");
        assertPrinted("0.51030", r[1], "qc/p");
        assertPrinted("0.7906", r[2], "Mach");
        assertPrinted("465.9", r[3], "KTAS");
        assertPrinted("285.0", r[4], "KEAS");
    }

    @Test
    void workedValue250KcasAt10000Ft() {
        double[] r = chain(250, 10_000);
        // check-values, [computed] from NASA RP-1046 (Gracey) formulas on the 1976 standard day, printed digits
        assertPrinted("0.4523", r[2], "Mach");
        assertPrinted("288.7", r[3], "KTAS");
        assertPrinted("248.1", r[4], "KEAS");
    }

    @Test
    void workedValue350KcasAt20000Ft() {
        double[] r = chain(350, 20_000);
        // check-values, [computed] from NASA RP-1046 (Gracey) formulas on the 1976 standard day, printed digits
        assertPrinted("0.7535", r[2], "Mach");
        assertPrinted("462.9", r[3], "KTAS");
        assertPrinted("337.9", r[4], "KEAS");
    }

    @Test
    void seaLevelImpactPressures() {
        // check-values, [computed] from NASA RP-1046 (Gracey) subsonic CAS formula, printed digits
        assertPrinted("1630.3", AirData.impactPressureFromCas(Units.ktToMps(100)), "qc at 100 KCAS");
        assertPrinted("6633.5", AirData.impactPressureFromCas(Units.ktToMps(200)), "qc at 200 KCAS");
        // at sea level on a standard day CAS = EAS = TAS, whatever the regime
        double[] r = chain(200, 0);
        assertEquals(200, r[3], 1e-9);
        assertEquals(200, r[4], 1e-9);
    }

    @Test
    void sonicPointValues() {
        // check-values, [computed] from NASA RP-1046 (Gracey): at Vc = a0, qc/p0 = 0.89293 (5 printed digits)
        assertPrinted("0.89293", AirData.impactPressureFromCas(A0) / P0, "qc/p0 at Vc = a0");
        // check-values: at M = 1 both forms give (qc + p)/p = 1.8929 (5 printed digits)
        assertPrinted("1.8929", AirData.impactPressureRatioFromMach(1.0) + 1.0, "(qc+p)/p at M = 1");
        assertPrinted("1.8929", AirData.impactPressureRatioFromMach(Math.nextUp(1.0)) + 1.0,
                "(qc+p)/p just above M = 1, Rayleigh form");
        // check-values (Rayleigh pitot, gamma 1.4): the constant printed as 166.9216 (7 digits)
        assertPrinted("166.9216", AirData.RAYLEIGH_CONSTANT, "Rayleigh constant");
    }

    @Test
    void rayleighFormMatchesThePrintedConstantAndTheGeneralGammaForm() {
        Random rnd = new Random(7);
        for (int k = 0; k < 2000; k++) {
            double m = 1.0 + 9.0 * rnd.nextDouble();
            double ratio = AirData.impactPressureRatioFromMach(m) + 1.0;
            // check-values / NASA RP-1046: 166.9216 M^7 / (7 M^2 - 1)^2.5; the constant has 7 digits, so
            // agreement is to half a unit of its 7th digit, 3.0e-7 relative
            double printed = 166.9216 * Math.pow(m, 7) / Math.pow(7 * m * m - 1, 2.5);
            assertEquals(printed, ratio, 0.00005 / 166.9216 * printed, "printed form at M " + m);
            // Rayleigh pitot formula for any gamma ([memory]: NACA TR-1135, eq. 100), gamma = 1.4:
            // ((g+1) M^2 / 2)^(g/(g-1)) ((g+1) / (2 g M^2 - (g-1)))^(1/(g-1)); equal in exact arithmetic
            double g = 1.4;
            double general = Math.pow((g + 1) * m * m / 2, g / (g - 1))
                    * Math.pow((g + 1) / (2 * g * m * m - (g - 1)), 1 / (g - 1));
            assertEquals(general, ratio, 1e-13 * general, "general gamma form at M " + m);
        }
    }

    @Test
    void bothFormsJoinWithoutAStepAtMachOne() {
        double below = AirData.impactPressureRatioFromMach(Math.nextDown(1.0));
        double at = AirData.impactPressureRatioFromMach(1.0);
        double above = AirData.impactPressureRatioFromMach(Math.nextUp(1.0));
        // one ulp of Mach moves qc/p by about 2.2 ulps; the two forms round differently, so allow 1e-14 relative
        assertEquals(at, below, 1e-14 * at);
        assertEquals(at, above, 1e-14 * at);
        // the slopes agree too (the Rayleigh form is tangent to the isentropic one at M = 1)
        double h = 1e-6;
        double slopeBelow = (at - AirData.impactPressureRatioFromMach(1 - h)) / h;
        double slopeAbove = (AirData.impactPressureRatioFromMach(1 + h) - at) / h;
        // one-sided differences carry an error of about h f'' ~ 1e-6; 1e-5 bounds it
        assertEquals(slopeBelow, slopeAbove, 1e-5);
        // and the inverse is continuous across qc/p of M = 1
        double r = AirData.SONIC_IMPACT_RATIO;
        assertEquals(1.0, AirData.machFromImpactPressureRatio(Math.nextDown(r)), 1e-14);
        assertEquals(1.0, AirData.machFromImpactPressureRatio(Math.nextUp(r)), 1e-14);
    }

    @Test
    void bothFormsJoinWithoutAStepAtVcEqualsA0() {
        double at = AirData.impactPressureFromCas(A0);
        assertEquals(at, AirData.impactPressureFromCas(Math.nextDown(A0)), 1e-14 * at);
        assertEquals(at, AirData.impactPressureFromCas(Math.nextUp(A0)), 1e-14 * at);
        assertEquals(A0, AirData.casFromImpactPressure(Math.nextDown(at)), 1e-12);
        assertEquals(A0, AirData.casFromImpactPressure(Math.nextUp(at)), 1e-12);
    }

    @Test
    void supersonicInverseAgreesWithBrent() {
        BrentSolver brent = new BrentSolver(1e-15, 1e-13);
        Random rnd = new Random(8);
        for (int k = 0; k < 500; k++) {
            double m = 1.0 + 5.0 * rnd.nextDouble();
            double ratio = AirData.impactPressureRatioFromMach(m);
            double brentM = brent.solve(200, x -> AirData.impactPressureRatioFromMach(x) - ratio, 1.0, 20.0);
            // Brent set to 1e-13 absolute above; 1e-12 allows for it, far inside the 1e-10 relative wanted
            assertEquals(brentM, AirData.machFromImpactPressureRatio(ratio), 1e-12, "Mach " + m);
        }
    }

    @Test
    void casRoundTripsFromZeroTo1000Knots() {
        Random rnd = new Random(9);
        double worst = 0;
        for (int k = 0; k < 20000; k++) {
            double cas = Units.ktToMps(1000.0 * rnd.nextDouble());
            double back = AirData.casFromImpactPressure(AirData.impactPressureFromCas(cas));
            worst = Math.max(worst, Math.abs(back - cas) / cas);
        }
        // forward and inverse each cost a few roundings (log1p, expm1, sqrt, pow; worst seen 1.6e-15) and the
        // supersonic Newton stops on a step of 1e-14 relative, after which its error is far smaller; 1e-13 relative
        // bounds that, three orders inside the 1e-10 wanted
        assertTrue(worst < 1e-13, "worst relative CAS error " + worst);
    }

    @Test
    void casRoundTripsAtVeryLowSpeed() {
        // the log1p/expm1 forms keep full precision where (1 + x)^3.5 - 1 would cancel
        for (double kt : new double[] {0.01, 0.1, 1, 5}) {
            double cas = Units.ktToMps(kt);
            assertEquals(cas, AirData.casFromImpactPressure(AirData.impactPressureFromCas(cas)), 1e-13 * cas);
        }
        assertEquals(0.0, AirData.casFromImpactPressure(0.0));
        assertEquals(0.0, AirData.impactPressureFromCas(0.0));
    }

    @Test
    void machRoundTripsFromZeroToMachFive() {
        Random rnd = new Random(10);
        double worst = 0;
        for (int k = 0; k < 20000; k++) {
            double m = 5.0 * rnd.nextDouble();
            double p = StandardAtmosphere.MIN_PRESSURE_PA
                    + (StandardAtmosphere.MAX_PRESSURE_PA - StandardAtmosphere.MIN_PRESSURE_PA) * rnd.nextDouble();
            double qc = AirData.impactPressureFromMach(m, p);
            worst = Math.max(worst, Math.abs(AirData.machFromImpactPressure(qc, p) - m) / m);
            worst = Math.max(worst, Math.abs(AirData.machFromImpactPressureRatio(qc / p) - m) / m);
        }
        // as for CAS: a few roundings each way, 1e-13 relative
        assertTrue(worst < 1e-13, "worst relative Mach error " + worst);
    }

    @Test
    void totalAndStaticTemperatureRoundTrip() {
        Random rnd = new Random(11);
        for (int k = 0; k < 20000; k++) {
            double t = 180 + 150 * rnd.nextDouble();
            double m = 3.0 * rnd.nextDouble();
            double r = 0.9 + 0.1 * rnd.nextDouble();
            double tt = AirData.totalTemperatureK(t, m, r);
            // one multiply and one divide by the same factor: 1e-15 relative (a few ulps)
            assertEquals(t, AirData.staticTemperatureK(tt, m, r), 1e-15 * t * 4);
        }
        // NASA TM-104316 (Haering) form T = Tt / (1 + 0.2 r M^2): at M 1, r 1 the rise is 20 %, by hand
        assertEquals(250.0, AirData.staticTemperatureK(300.0, 1.0, 1.0), 1e-12);
        // a probe recovering 98 % of the rise: 1 + 0.2 * 0.98 * 1.5^2 = 1.441, by hand
        assertEquals(300.0 / 1.441, AirData.staticTemperatureK(300.0, 1.5, 0.98), 1e-12);
        assertEquals(288.15 * 1.441, AirData.totalTemperatureK(288.15, 1.5, 0.98), 1e-12);
        // recovering nothing, the probe reads static temperature
        assertEquals(300.0, AirData.staticTemperatureK(300.0, 2.0, 0.0), 0.0);
    }

    @Test
    void densityAltitudeEqualsPressureAltitudeOnAStandardDay() {
        double h = Units.ftToM(8000);
        double hd = AirData.densityAltitudeM(StandardAtmosphere.pressurePa(h), StandardAtmosphere.temperatureK(h));
        assertEquals(h, hd, 1e-8);
        // hotter air at the same pressure is thinner: the density altitude rises
        double hot = AirData.densityAltitudeM(StandardAtmosphere.pressurePa(h),
                StandardAtmosphere.temperatureK(h) + 20);
        assertTrue(hot > h + 500, "ISA+20 raises density altitude by well over 500 m at 8000 ft, got " + (hot - h));
    }

    @Test
    void badValuesAreRefusedAndAbsentOnesPassThrough() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> AirData.impactPressureFromCas(-5));
        assertEquals("calibrated airspeed must be zero or positive, got -5 m/s", e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> AirData.casFromImpactPressure(-12.5));
        assertEquals("impact pressure must be zero or positive, got -12.5 Pa", e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> AirData.machFromImpactPressure(100, 0));
        assertEquals("static pressure must be positive, got 0 Pa", e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> AirData.impactPressureFromMach(-0.5, 1e5));
        assertEquals("Mach number must be zero or positive, got -0.5", e.getMessage());
        e = assertThrows(IllegalArgumentException.class,
                () -> AirData.impactPressureFromCas(Double.POSITIVE_INFINITY));
        assertEquals("calibrated airspeed must be finite, got Infinity m/s", e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> AirData.staticTemperatureK(300, 0.5, 1.2));
        assertEquals("recovery factor must be between 0 and 1, got 1.2", e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> AirData.trueAirspeedMps(0.5, -3));
        assertEquals("static temperature must be positive, got -3 K", e.getMessage());

        assertTrue(Double.isNaN(AirData.casFromImpactPressure(Double.NaN)));
        assertTrue(Double.isNaN(AirData.machFromImpactPressure(100, Double.NaN)));
        assertTrue(Double.isNaN(AirData.trueAirspeedMps(Double.NaN, 250)));
        assertTrue(Double.isNaN(AirData.staticTemperatureK(300, Double.NaN, 1)));
    }
}
