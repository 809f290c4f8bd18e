package org.pointcall.shared.airdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigDecimal;
import java.util.OptionalDouble;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.pointcall.shared.atmosphere.StandardAtmosphere;
import org.pointcall.shared.units.Units;

class AirDataSolverTest {

    private static void assertPrinted(String printed, double actual, String what) {
        BigDecimal p = new BigDecimal(printed);
        assertEquals(p.doubleValue(), actual, p.ulp().doubleValue() / 2.0, what + " should print as " + printed);
    }

    private static final OptionalDouble NO = OptionalDouble.empty();

    private static OptionalDouble of(double v) {
        return OptionalDouble.of(v);
    }

    @Test
    void solves300KcasAt30000FtInFull() {
        AirDataState s = AirDataSolver.solve(AirDataInput.ofCas(Units.ktToMps(300), Units.ftToM(30_000)));
        // check-values, [computed] from NASA RP-1046 (Gracey) formulas on the 1976 standard day, printed digits
        assertPrinted("15354.7", s.impactPressurePa(), "qc");
        assertPrinted("0.51030", s.impactPressureRatio(), "qc/p");
        assertPrinted("0.7906", s.mach(), "Mach");
        assertPrinted("465.9", Units.mpsToKt(s.tasMps()), "KTAS");
        assertPrinted("285.0", Units.mpsToKt(s.easMps()), "KEAS");
        // check-values, 1976 standard [computed]: 30,000 ft is 30089.6 Pa
        assertPrinted("30089.6", s.staticPressurePa(), "p");
        assertEquals(Units.ktToMps(300), s.casMps(), 1e-12);
        assertEquals(Units.ftToM(30_000), s.pressureAltitudeM(), 0.0);
        assertEquals(0.0, s.isaDeviationK(), 1e-12);
        assertEquals(s.pressureAltitudeM(), s.densityAltitudeM(), 1e-8, "standard day: density altitude = Hp");
        assertEquals(StandardAtmosphere.temperatureK(s.pressureAltitudeM()), s.staticTemperatureK(), 0.0);
        assertEquals(StandardAtmosphere.densityKgM3(s.pressureAltitudeM()), s.densityKgM3(), 1e-15);
        assertEquals(StandardAtmosphere.speedOfSoundMps(s.pressureAltitudeM()), s.speedOfSoundMps(), 1e-12);
    }

    @Test
    void solvesTheOtherWorkedValues() {
        AirDataState a = AirDataSolver.solve(AirDataInput.ofCas(Units.ktToMps(250), Units.ftToM(10_000)));
        // check-values, [computed] from NASA RP-1046 (Gracey) formulas on the 1976 standard day, printed digits
        assertPrinted("0.4523", a.mach(), "Mach");
        assertPrinted("288.7", Units.mpsToKt(a.tasMps()), "KTAS");
        assertPrinted("248.1", Units.mpsToKt(a.easMps()), "KEAS");
        AirDataState b = AirDataSolver.solve(AirDataInput.ofCas(Units.ktToMps(350), Units.ftToM(20_000)));
        // check-values, [computed] from NASA RP-1046 (Gracey) formulas on the 1976 standard day, printed digits
        assertPrinted("0.7535", b.mach(), "Mach");
        assertPrinted("462.9", Units.mpsToKt(b.tasMps()), "KTAS");
        assertPrinted("337.9", Units.mpsToKt(b.easMps()), "KEAS");
    }

    @Test
    void everySpeedInputLeadsToTheSameState() {
        Random rnd = new Random(12);
        for (int k = 0; k < 3000; k++) {
            double hp = -5000 + 76000 * rnd.nextDouble();
            double mach = 0.05 + 7.95 * rnd.nextDouble();
            double dt = -40 + 80 * rnd.nextDouble();
            AirDataState fromMach = AirDataSolver.solve(AirDataInput.ofMach(mach, hp).withIsaDeviationK(dt));
            double cas = fromMach.casMps();
            AirDataState fromCas = AirDataSolver.solve(AirDataInput.ofCas(cas, hp).withIsaDeviationK(dt));
            AirDataState fromTas = AirDataSolver.solve(
                    AirDataInput.ofTas(fromCas.tasMps(), hp).withStaticTemperatureK(fromCas.staticTemperatureK()));
            AirDataState fromP = AirDataSolver.solve(AirDataInput.ofCas(cas, hp)
                    .withStaticPressurePa(fromCas.staticPressurePa()).withIsaDeviationK(dt));
            // a chain of a few round trips, each good to about 1e-15: 1e-12 relative
            for (AirDataState s : new AirDataState[] {fromMach, fromTas, fromP}) {
                assertEquals(fromCas.casMps(), s.casMps(), 1e-12 * cas, "CAS");
                assertEquals(fromCas.mach(), s.mach(), 1e-12 * fromCas.mach(), "Mach");
                assertEquals(fromCas.tasMps(), s.tasMps(), 1e-12 * fromCas.tasMps(), "TAS");
                assertEquals(fromCas.easMps(), s.easMps(), 1e-12 * fromCas.easMps(), "EAS");
                assertEquals(fromCas.impactPressurePa(), s.impactPressurePa(), 1e-12 * fromCas.impactPressurePa());
                assertEquals(fromCas.pressureAltitudeM(), s.pressureAltitudeM(), 1e-9, "Hp");
                assertEquals(dt, s.isaDeviationK(), 1e-9, "ISA deviation");
            }
        }
    }

    @Test
    void aHotDayChangesTrueAirspeedButNotCasMachOrEas() {
        double hp = Units.ftToM(15_000);
        AirDataState std = AirDataSolver.solve(AirDataInput.ofCas(Units.ktToMps(250), hp));
        AirDataState hot = AirDataSolver.solve(AirDataInput.ofCas(Units.ktToMps(250), hp).withIsaDeviationK(15));
        // CAS fixes qc, altitude fixes p: Mach and EAS (= a0 M sqrt(p/p0)) follow from them alone
        assertEquals(std.mach(), hot.mach(), 1e-15);
        assertEquals(std.easMps(), hot.easMps(), 1e-12);
        // TAS = M a and a ~ sqrt(T)
        assertEquals(std.tasMps() * Math.sqrt(hot.staticTemperatureK() / std.staticTemperatureK()), hot.tasMps(),
                1e-10);
        assertEquals(15.0, hot.isaDeviationK(), 1e-12);
        assertTrue(hot.densityAltitudeM() > std.densityAltitudeM() + 400,
                "ISA+15 at 15,000 ft raises density altitude by well over 400 m");
        AirDataState oat = AirDataSolver.solve(AirDataInput.ofCas(Units.ktToMps(250), hp)
                .withStaticTemperatureK(std.staticTemperatureK() + 15));
        assertEquals(hot, oat);
    }

    @Test
    void densityAltitudeIsNaNWhenTheAirLiesOutsideTheModel() {
        // 30 K warmer 100 m below the model's top: the density is that of about 850 m higher, beyond the top
        AirDataState s = AirDataSolver.solve(AirDataInput.ofMach(0.8, 70_900).withIsaDeviationK(30));
        assertTrue(Double.isNaN(s.densityAltitudeM()));
        AirDataState justInside = AirDataSolver.solve(AirDataInput.ofMach(0.8, 69_000).withIsaDeviationK(30));
        assertTrue(justInside.densityAltitudeM() > 69_000 && justInside.densityAltitudeM() < 71_000);
        assertTrue(s.casMps() > 0);
    }

    @Test
    void badInputsAreRefusedInOnePlainLine() {
        assertMessage("CAS must be zero or positive, got -5 kt (-2.57222 m/s)",
                () -> AirDataInput.ofCas(Units.ktToMps(-5), 3000));
        assertMessage("TAS must be zero or positive, got -100 kt (-51.4444 m/s)",
                () -> AirDataInput.ofTas(Units.ktToMps(-100), 3000));
        assertMessage("Mach must be zero or positive, got -0.3", () -> AirDataInput.ofMach(-0.3, 3000));
        assertMessage("CAS must be a finite number, got NaN", () -> AirDataInput.ofCas(Double.NaN, 3000));
        assertMessage("pressure altitude must be a finite number, got NaN", () -> AirDataInput.ofCas(100, Double.NaN));
        assertMessage("give exactly one speed (CAS, Mach or TAS), got CAS and Mach",
                () -> new AirDataInput(of(3000), NO, of(100), of(0.3), NO, NO, NO));
        assertMessage("give exactly one speed (CAS, Mach or TAS), got CAS and Mach and TAS",
                () -> new AirDataInput(of(3000), NO, of(100), of(0.3), of(100), NO, NO));
        assertMessage("give exactly one speed (CAS, Mach or TAS), got none",
                () -> new AirDataInput(of(3000), NO, NO, NO, NO, NO, NO));
        assertMessage("give pressure altitude or static pressure, not both",
                () -> new AirDataInput(of(3000), of(70000), of(100), NO, NO, NO, NO));
        assertMessage("give pressure altitude or static pressure, got neither",
                () -> new AirDataInput(NO, NO, of(100), NO, NO, NO, NO));
        assertMessage("give pressure altitude or static pressure, got neither",
                () -> new AirDataInput(null, null, of(100), null, null, null, null));
        assertMessage("pressure altitude 80000 m (262467 ft) is outside the standard atmosphere model, -5000 to 71000 m"
                + " (-16404.2 to 232940 ft)", () -> AirDataInput.ofCas(100, 80_000));
        assertMessage("static pressure 200000 Pa is outside the standard atmosphere model, 3.95642 to 177687 Pa",
                () -> AirDataInput.ofCas(100, 0).withStaticPressurePa(200_000));
        assertMessage("give static air temperature or ISA deviation, not both",
                () -> new AirDataInput(of(3000), NO, of(100), NO, NO, of(280), of(5)));
        assertMessage("static air temperature must be above 0 K, got -10 K (-283.15 degC)",
                () -> AirDataInput.ofCas(100, 3000).withStaticTemperatureK(-10));
        assertMessage("ISA deviation -300 K gives a static air temperature of -83.35 K at pressure altitude 11000 m"
                + " (36089.2 ft); it must stay above 0 K",
                () -> AirDataInput.ofCas(100, 11_000).withIsaDeviationK(-300));
        assertMessage("ISA deviation must be a finite number, got Infinity",
                () -> AirDataInput.ofCas(100, 11_000).withIsaDeviationK(Double.POSITIVE_INFINITY));
    }

    @Test
    void conditionsBeyondMachTenAreRefused() {
        assertMessage("Mach 12 is beyond Mach 10, the limit of these ideal-gas air-data relations",
                () -> AirDataInput.ofMach(12, 3000));
        assertMessage("CAS 1000 kt (514.444 m/s) at pressure altitude 60000 m (196850 ft) is beyond Mach 10, the limit"
                + " of these ideal-gas air-data relations", () -> AirDataInput.ofCas(Units.ktToMps(1000), 60_000));
        assertMessage("CAS 1E+300 kt (5.14444E+299 m/s) at pressure altitude 0 m (0 ft) is beyond Mach 10, the limit"
                + " of these ideal-gas air-data relations", () -> AirDataInput.ofCas(Units.ktToMps(1e300), 0));
        assertMessage("TAS 2000 kt (1028.89 m/s) at 10 K is beyond Mach 10, the limit of these ideal-gas air-data"
                + " relations", () -> AirDataInput.ofTas(Units.ktToMps(2000), 0).withStaticTemperatureK(10));
        AirDataState ten = AirDataSolver.solve(AirDataInput.ofMach(10, 0));
        // at p0, qc/p0 = qc/p, so Vc/a0 = M in either regime
        assertEquals(10 * StandardAtmosphere.SEA_LEVEL_SPEED_OF_SOUND_MPS, ten.casMps(), 1e-10);
    }

    private static void assertMessage(String expected, org.junit.jupiter.api.function.Executable call) {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, call);
        assertEquals(expected, e.getMessage());
    }
}
