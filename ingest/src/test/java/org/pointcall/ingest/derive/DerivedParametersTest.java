package org.pointcall.ingest.derive;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;

import org.apache.commons.math3.stat.regression.SimpleRegression;
import org.junit.jupiter.api.Test;
import org.pointcall.ingest.frame.Frame;
import org.pointcall.shared.airdata.AirData;
import org.pointcall.shared.atmosphere.StandardAtmosphere;
import org.pointcall.shared.demo.DemoFiles;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.units.Units;

class DerivedParametersTest {
    private final ParameterDictionary dict = DemoFiles.dictionary();
    private final int ps = dict.indexOf("Ps");
    private final int qc = dict.indexOf("Qc");
    private final int oat = dict.indexOf("OAT");
    private final int hp = dict.indexOf("Hp");
    private final int kcas = dict.indexOf("KCAS");
    private final int mach = dict.indexOf("Mach");
    private final int ktas = dict.indexOf("KTAS");
    private final int dhdt = dict.indexOf("dHdt");
    private final int dvdt = dict.indexOf("dVdt");
    private final int sep = dict.indexOf("SEP");

    /** Fills the raw slots of {@code f} for a condition given by pressure altitude, CAS and ISA temperature. */
    private void raw(Frame f, long tNs, double hpM, double casMps) {
        f.clear();
        f.timeNs(tNs);
        double p = StandardAtmosphere.pressurePa(hpM);
        f.value(ps, p / Units.PA_PER_HPA);
        f.value(qc, AirData.impactPressureFromCas(casMps) / Units.PA_PER_HPA);
        f.value(oat, Units.kToDegC(StandardAtmosphere.temperatureK(hpM)));
    }

    @Test
    void airDataOfAWorkedCaseComeOutOfTheRawPressures() {
        DerivedParameters d = DerivedParameters.bind(dict);
        Frame f = Frame.forDictionary(dict);
        raw(f, 0, Units.ftToM(20000), Units.ktToMps(350));
        d.apply(f);
        // check-values.md, 350 KCAS at 20,000 ft, ISA day, computed from NASA RP-1046 relations:
        // M 0.7535, KTAS 462.9 (tolerance half a unit in the last printed digit).
        assertEquals(20000.0, f.value(hp), 1e-6);
        assertEquals(350.0, f.value(kcas), 1e-9);
        assertEquals(0.7535, f.value(mach), 0.00005);
        assertEquals(462.9, f.value(ktas), 0.05);
    }

    @Test
    void climbAndAccelerationGiveRatesAndSpecificExcessPower() {
        // check-values.md [computed]: dh/dt 10 m/s, dV/dt 1 m/s^2 at 200 m/s gives Ps = 10 + 200/9.80665 = 30.39 m/s.
        DerivedParameters d = DerivedParameters.bind(dict);
        Frame f = Frame.forDictionary(dict);
        double h0 = 3000;
        double rate = 32; // Hz, the demo dictionary's air-data rate
        double sepAtV200 = Double.NaN;
        double dhdtSeen = Double.NaN;
        double dvdtSeen = Double.NaN;
        for (int i = 0; i <= 10 * rate; i++) {
            double t = i / rate;
            double h = h0 + 10 * t;
            // Choose CAS so that TAS follows 190 + t m/s on an ISA day: TAS -> Mach -> qc -> CAS.
            double tas = 190 + t;
            double a = StandardAtmosphere.speedOfSoundMps(h);
            double qcPa = AirData.impactPressureFromMach(tas / a, StandardAtmosphere.pressurePa(h));
            raw(f, Math.round(t * 1e9), h, AirData.casFromImpactPressure(qcPa));
            d.apply(f);
            if (Math.abs(tas - 200) < 1e-9) {
                sepAtV200 = Units.ftToM(f.value(sep));
                dhdtSeen = Units.ftToM(f.value(dhdt)) / 60.0;
                dvdtSeen = Units.ktToMps(f.value(dvdt));
            }
        }
        // Least squares over 1 s of an exact ramp is exact up to rounding of the pressure round trip.
        assertEquals(10.0, dhdtSeen, 1e-6);
        assertEquals(1.0, dvdtSeen, 1e-6);
        assertEquals(30.39, sepAtV200, 0.005);
    }

    @Test
    void anInvalidInputMakesItsDerivedValuesInvalid() {
        DerivedParameters d = DerivedParameters.bind(dict);
        Frame f = Frame.forDictionary(dict);
        raw(f, 0, 3000, 120);
        f.value(ps, Double.NaN);
        d.apply(f);
        assertTrue(Double.isNaN(f.value(hp)));
        assertTrue(Double.isNaN(f.value(mach)), "Mach needs static pressure");
        assertTrue(Double.isNaN(f.value(ktas)), "KTAS needs Mach");
        assertEquals(Units.mpsToKt(120), f.value(kcas), 1e-9, "KCAS needs only impact pressure");
    }

    @Test
    void aSlowerInputIsHeldForTwoAndAHalfIntervalsThenGoesStale() {
        DerivedParameters d = DerivedParameters.bind(dict);
        Frame f = Frame.forDictionary(dict);
        double oatIntervalS = 1.0 / dict.parameter(oat).rateHz();
        raw(f, 0, 3000, 120);
        d.apply(f);
        assertTrue(f.value(ktas) > 0);
        long t = Math.round(2.0 * oatIntervalS * 1e9);
        raw(f, t, 3000, 120);
        f.value(oat, Double.NaN); // OAT not sampled at this instant: the held one is fresh
        d.apply(f);
        assertTrue(f.value(ktas) > 0);
        raw(f, Math.round(3.0 * oatIntervalS * 1e9), 3000, 120);
        f.value(oat, Double.NaN);
        d.apply(f);
        assertTrue(Double.isNaN(f.value(ktas)), "OAT older than 2.5 intervals is stale");
    }

    @Test
    void runningSlopeMatchesCommonsMathRegressionOnIrregularDataWithALargeOffset() {
        // Reference: Apache Commons Math SimpleRegression (a general-purpose library) over the same samples.
        Random rnd = new Random(20261201L);
        RunningSlope s = new RunningSlope(1.0, 512, 3);
        final long t0Ns = 1_700_000_000_000_000_000L; // epoch nanoseconds: the anchor must keep the digits
        long t = t0Ns;
        java.util.ArrayDeque<double[]> window = new java.util.ArrayDeque<>();
        double worst = 0;
        for (int i = 0; i < 200_000; i++) {
            t += 5_000_000 + rnd.nextInt(40_000_000);
            double v = 1.0e6 + 3.0 * (i * 0.01) + rnd.nextGaussian();
            s.add(t, v);
            window.addLast(new double[] {t - t0Ns, v}); // exact in a double, unlike t itself
            while (window.peekFirst()[0] < (t - t0Ns) - 1e9) {
                window.removeFirst();
            }
            if (i % 997 == 0 && window.size() >= 3) {
                SimpleRegression r = new SimpleRegression();
                double t0 = window.peekFirst()[0];
                for (double[] w : window) {
                    r.addData((w[0] - t0) * 1e-9, w[1]);
                }
                worst = Math.max(worst, Math.abs(r.getSlope() - s.slopePerS()) / Math.max(1, Math.abs(r.getSlope())));
            }
        }
        // Values near 1e6 with unit noise over ~1 s: relative agreement of 1e-8 leaves a wide margin for rounding.
        assertTrue(worst < 1e-8, "worst relative slope difference " + worst);
    }

    @Test
    void gapFlagForgetsHistory() {
        DerivedParameters d = DerivedParameters.bind(dict);
        Frame f = Frame.forDictionary(dict);
        for (int i = 0; i < 40; i++) {
            raw(f, i * 31_250_000L, 3000 + i, 120);
            d.apply(f);
        }
        assertTrue(!Double.isNaN(f.value(dhdt)));
        raw(f, 40 * 31_250_000L, 3100, 120);
        f.addFlags(Frame.GAP_BEFORE);
        d.apply(f);
        assertTrue(Double.isNaN(f.value(dhdt)), "a rate across a gap would mix two pieces of flight");
    }
}
