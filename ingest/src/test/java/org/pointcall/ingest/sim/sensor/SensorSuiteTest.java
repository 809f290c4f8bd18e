package org.pointcall.ingest.sim.sensor;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

import org.apache.commons.math3.stat.descriptive.SummaryStatistics;
import org.junit.jupiter.api.Test;
import org.pointcall.ingest.frame.Frame;
import org.pointcall.shared.demo.DemoFiles;
import org.pointcall.shared.dictionary.ParameterDictionary;

class SensorSuiteTest {
    private final ParameterDictionary dict = DemoFiles.dictionary();
    private final int aoa = dict.indexOf("AoA");
    private final int ps = dict.indexOf("Ps");
    private final int fuel = dict.indexOf("FuelQty");
    private final int hp = dict.indexOf("Hp");

    private double[] truth() {
        double[] t = new double[dict.size()];
        for (int i = 0; i < t.length; i++) {
            t[i] = (dict.parameter(i).validMin() + dict.parameter(i).validMax()) / 2;
        }
        return t;
    }

    private List<Frame> run(SensorSettings s, long seed, int frames, double rateHz) {
        SensorSuite suite = new SensorSuite(dict, s, seed);
        double[] t = truth();
        List<Frame> out = new ArrayList<>();
        Frame f = Frame.forDictionary(dict);
        for (int i = 0; i < frames; i++) {
            if (suite.sample(Math.round(i * 1e9 / rateHz), t, f)) {
                out.add(f.copy());
            }
        }
        return out;
    }

    @Test
    void cleanSensorsSampleEachParameterAtItsOwnRateAndTellTheTruth() {
        List<Frame> frames = run(SensorSettings.CLEAN, 1, 100 * 10, 100.0);
        assertEquals(1000, frames.size(), "no dropouts when clean");
        long aoaSamples = frames.stream().filter(f -> !Double.isNaN(f.value(aoa))).count();
        long fuelSamples = frames.stream().filter(f -> !Double.isNaN(f.value(fuel))).count();
        assertEquals(640, aoaSamples, 1, "AoA at 64 Hz for 10 s");
        assertEquals(20, fuelSamples, 1, "fuel quantity at 2 Hz for 10 s");
        double[] t = truth();
        for (Frame f : frames) {
            if (!Double.isNaN(f.value(aoa))) {
                assertEquals(t[aoa], f.value(aoa), 0.0);
            }
            assertTrue(Double.isNaN(f.value(hp)), "derived parameters are left to the ground");
        }
    }

    @Test
    void noiseHasItsStandardDeviationAndQuantisationItsStep() {
        SensorSettings noDrop = new SensorSettings(false, 0, 0.4, 0, 1.0);
        List<Frame> frames = run(noDrop, 7, 64 * 300, 64.0);
        SensorSpec spec = SensorSuite.defaultSpec(dict.parameter(aoa));
        SummaryStatistics st = new SummaryStatistics();
        double q = spec.quantum();
        for (Frame f : frames) {
            double v = f.value(aoa);
            if (!Double.isNaN(v) && v < dict.parameter(aoa).validMax()) {
                st.addValue(v);
                assertEquals(0.0, Math.abs(v / q - Math.round(v / q)), 1e-6, "on the quantisation grid");
            }
        }
        // ~19,200 samples: the sample std is within a few percent of the spec (its standard error is ~0.5 %),
        // plus the uniform quantisation noise q^2/12 added in quadrature.
        double expected = Math.sqrt(spec.noiseStd() * spec.noiseStd() + q * q / 12);
        assertEquals(expected, st.getStandardDeviation(), 0.03 * expected);
        assertEquals(truth()[aoa] + spec.bias(), st.getMean(), 4 * expected / Math.sqrt(st.getN()));
    }

    @Test
    void dropoutsRemoveRunsOfFramesAndAreCounted() {
        SensorSettings many = new SensorSettings(false, 600, 0.5, 0.0005, 1.0); // one every 6 s on average
        SensorSuite suite = new SensorSuite(dict, many, 3);
        double[] t = truth();
        Frame f = Frame.forDictionary(dict);
        int sent = 0;
        long last = Long.MIN_VALUE;
        for (int i = 0; i < 100 * 600; i++) {
            if (suite.sample(i * 10_000_000L, t, f)) {
                sent++;
                assertTrue(f.timeNs() > last, "jittered stamps stay monotonic");
                last = f.timeNs();
            }
        }
        assertEquals(60000, sent + suite.framesDropped());
        assertTrue(suite.dropouts() > 50 && suite.dropouts() < 160, "about 100 dropouts in 10 min: " + suite.dropouts());
        // mean run 0.5 s at 100 Hz: about 50 frames a dropout
        double perDropout = suite.framesDropped() / (double) suite.dropouts();
        assertTrue(perDropout > 30 && perDropout < 75, "frames per dropout " + perDropout);
    }

    @Test
    void theSameSeedGivesTheSameFrames() {
        List<Frame> a = run(SensorSettings.DEFAULT, 42, 5000, 100.0);
        List<Frame> b = run(SensorSettings.DEFAULT, 42, 5000, 100.0);
        assertEquals(a.size(), b.size());
        for (int i = 0; i < a.size(); i++) {
            assertEquals(a.get(i).timeNs(), b.get(i).timeNs());
            assertArrayEquals(a.get(i).values(), b.get(i).values());
        }
        List<Frame> c = run(SensorSettings.DEFAULT, 43, 5000, 100.0);
        assertTrue(!Arrays.equals(a.get(10).values(), c.get(10).values()), "another seed, other noise");
    }

    @Test
    void lagDelaysAStepAsAFirstOrderSystem() {
        SensorSettings s = new SensorSettings(false, 0, 0.4, 0, 0.0); // noise scaled to zero, lag kept
        SensorSuite suite = new SensorSuite(dict, s, 5);
        double[] t = truth();
        Frame f = Frame.forDictionary(dict);
        double lagS = suite.spec(ps).lagS();
        assertTrue(lagS > 0);
        double before = t[ps];
        suite.sample(0, t, f);
        t[ps] = before + 100;
        int checked = 0;
        for (int i = 1; i <= 640; i++) {
            double timeS = i / 6400.0;
            suite.sample(Math.round(timeS * 1e9), t, f);
            if (!Double.isNaN(f.value(ps))) {
                // First-order lag response to a step: 1 - exp(-t/tau); the discrete update is exact for a held step.
                double expected = before + 100 * (1 - Math.exp(-timeS / lagS));
                assertEquals(expected, f.value(ps), suite.spec(ps).quantum() / 2 + 1e-9, "at " + timeS + " s");
                checked++;
            }
        }
        assertEquals(3, checked, "Ps at 32 Hz over 0.1 s after the step");
    }
}
