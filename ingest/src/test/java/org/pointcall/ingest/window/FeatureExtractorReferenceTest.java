package org.pointcall.ingest.window;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.pointcall.ingest.window.ScenarioRun.dictionary;
import static org.pointcall.ingest.window.ScenarioRun.parameter;

import java.util.List;
import java.util.SplittableRandom;

import org.junit.jupiter.api.Test;
import org.pointcall.ingest.frame.Frame;
import org.pointcall.shared.dictionary.ParameterDictionary;

/**
 * Window statistics against a from-scratch recompute at every tick and against Apache Commons Math 3.6.1
 * (DescriptiveStatistics for mean, sample standard deviation, min and max; SimpleRegression for the slope), on long
 * seeded random streams and on adversarial ones. Tolerances and their justification: {@link ScenarioRun}.
 */
class FeatureExtractorReferenceTest {
    private static final long MS = 1_000_000L;
    private static final double[] WINDOWS = {0.5, 2.0, 8.0};

    @Test
    void aMillionFramesOfMixedRatesAndLargeOffsetsMatchTheReferenceAndCommonsMath() {
        // RNG: 1000 Hz, offset 1e6 m with 1 cm noise; KCAS: 10 Hz random walk (NaN in 99 of 100 frames);
        // AoA: nominally 300 Hz but present in a random 30 % of frames, so some intervals exceed 3 x 3.3 ms
        ParameterDictionary d = dictionary(parameter("RNG", 1000), parameter("KCAS", 10), parameter("AoA", 300));
        List<WindowSpec> specs = List.of(WindowSpec.of("RNG", WINDOWS), WindowSpec.of("KCAS", WINDOWS),
                WindowSpec.of("AoA", WINDOWS));
        SplittableRandom rnd = new SplittableRandom(1L);
        double[] kcas = {250.0};
        ScenarioRun.Summary s = ScenarioRun.run(d, specs, ExtractorSettings.defaults(), 1_000_000, 10, (k, f) -> {
            double t = k * 1e-3;
            f.timeNs(k * MS);
            f.value(0, 1e6 + 30 * Math.sin(2 * Math.PI * 0.05 * t) + 0.01 * rnd.nextGaussian());
            if (k % 100 == 0) {
                kcas[0] += rnd.nextGaussian();
                f.value(1, kcas[0]);
            }
            if (rnd.nextDouble() < 0.3) {
                f.value(2, 5 + 3 * Math.sin(2 * Math.PI * 0.3 * t) + 0.2 * rnd.nextGaussian());
            }
        });
        assertEquals(20_000, s.ticks(), "1000 s of data at 20 Hz, first tick at time 0");
        assertTrue(s.validWindows() > 100_000, "most windows are valid: " + s.validWindows());
        assertTrue(s.invalidWindows() > 1000, "AoA's random gaps invalidate some windows: " + s.invalidWindows());
        assertTrue(s.commonsChecks() > 10_000, "Commons Math compared on many windows: " + s.commonsChecks());
        assertTrue(s.recomputes() > 1000, "sums were re-anchored many times: " + s.recomputes());
        assertEquals(0, s.extractor().bufferGrowths(), "buffers sized at bind were enough");
    }

    @Test
    void irregularFrameTimesGapFlagsAndDropoutsMatchTheReference() {
        ParameterDictionary d = dictionary(parameter("Nz", 1000), parameter("Pitch", 100), parameter("Alt", 50));
        List<WindowSpec> specs = List.of(WindowSpec.of("Nz", WINDOWS), WindowSpec.of("Pitch", 0.5, 2.0),
                WindowSpec.of("Alt", 2.0, 8.0).withMaxGapS(0.1));
        SplittableRandom rnd = new SplittableRandom(2L);
        long[] t = {0};
        int[] dropout = {0};
        ScenarioRun.Summary s = ScenarioRun.run(d, specs, ExtractorSettings.defaults(), 150_000, 7, (k, f) -> {
            t[0] += rnd.nextLong(200_000, 1_800_000);
            f.timeNs(t[0]);
            if (rnd.nextInt(5000) == 0) {
                f.addFlags(Frame.GAP_BEFORE);
            }
            if (dropout[0] > 0) {
                dropout[0]--;
            } else if (rnd.nextInt(20_000) == 0) {
                dropout[0] = rnd.nextInt(1, 400);
            }
            double ts = t[0] * 1e-9;
            if (dropout[0] == 0) {
                f.value(0, 1 + 0.5 * Math.sin(3 * ts) + 0.05 * rnd.nextGaussian());
            }
            if (k % 10 == 0) {
                f.value(1, 2 * Math.sin(0.7 * ts) + 0.01 * rnd.nextGaussian());
            }
            if (k % 20 == 0) {
                f.value(2, 3048.0 + 10 * ts + rnd.nextGaussian());
            }
        });
        assertTrue(s.validWindows() > 10_000, "valid windows checked: " + s.validWindows());
        assertTrue(s.invalidWindows() > 500, "gaps, flags and dropouts invalidated windows: " + s.invalidWindows());
    }

    @Test
    void aMillionPlusMillimetreNoiseKeepsItsDigits() {
        ParameterDictionary d = dictionary(parameter("Alt", 1000));
        SplittableRandom rnd = new SplittableRandom(3L);
        ScenarioRun.Summary s = ScenarioRun.run(d, List.of(WindowSpec.of("Alt", WINDOWS)),
                ExtractorSettings.defaults(), 60_000, 1, (k, f) -> {
                    f.timeNs(k * MS);
                    f.value(0, 1e6 + 1e-3 * rnd.nextGaussian());
                });
        assertTrue(s.validWindows() > 3000);

        // The tolerance above is tight enough to reject the textbook one-pass variance on the same data:
        // (sum x^2 - (sum x)^2 / n) / (n - 1) cancels ~1e16 against ~1e16 and keeps almost no digit of 1e-6.
        SplittableRandom again = new SplittableRandom(3L);
        int n = 8001;
        double sx = 0;
        double sxx = 0;
        double[] xs = new double[n];
        for (int i = 0; i < n; i++) {
            xs[i] = 1e6 + 1e-3 * again.nextGaussian();
            sx += xs[i];
            sxx += xs[i] * xs[i];
        }
        double onePass = (sxx - sx * sx / n) / (n - 1);
        double mean = sx / n;
        double ss = 0;
        double min = Double.POSITIVE_INFINITY;
        double max = Double.NEGATIVE_INFINITY;
        for (double x : xs) {
            ss += (x - mean) * (x - mean);
            min = Math.min(min, x);
            max = Math.max(max, x);
        }
        double twoPass = ss / (n - 1);
        double r = max - min;
        double tolerance = 4 * 16 * n * ScenarioRun.EPS * r * r;
        assertTrue(Math.abs(onePass - twoPass) > tolerance, "one-pass error " + Math.abs(onePass - twoPass)
                + " should exceed the tolerance " + tolerance);
    }

    @Test
    void constantSignalsGiveExactlyZeroStdAndSlopeAndTheirOwnValueAsMean() {
        double[] constants = {0.1, 1e6 + 0.1, -3.7e7, 0.0, 1e-300};
        ParameterDictionary d = dictionary(parameter("C0", 1000), parameter("C1", 1000), parameter("C2", 200),
                parameter("C3", 10), parameter("C4", 1000));
        List<WindowSpec> specs = List.of(WindowSpec.of("C0", WINDOWS), WindowSpec.of("C1", WINDOWS),
                WindowSpec.of("C2", WINDOWS), WindowSpec.of("C3", WINDOWS), WindowSpec.of("C4", WINDOWS));
        long[] checked = {0};
        FeatureExtractor fx = FeatureExtractor.bind(d, specs, ExtractorSettings.defaults(),
                (timeNs, features, valid, coverage) -> {
                    for (int w = 0; w < valid.length; w++) {
                        if (!valid[w]) {
                            continue;
                        }
                        double c = constants[w / WINDOWS.length];
                        int o = FeatureLayout.featureIndex(w, Stat.MEAN);
                        assertEquals(c, features[o + Stat.MEAN.ordinal()], 0.0, "mean");
                        assertEquals(0.0, features[o + Stat.STD.ordinal()], 0.0, "std");
                        assertEquals(c, features[o + Stat.MIN.ordinal()], 0.0, "min");
                        assertEquals(c, features[o + Stat.MAX.ordinal()], 0.0, "max");
                        assertEquals(0.0, features[o + Stat.SLOPE.ordinal()], 0.0, "slope");
                        assertEquals(0.0, features[o + Stat.CHANGE.ordinal()], 0.0, "change");
                        checked[0]++;
                    }
                });
        Frame f = Frame.forDictionary(d);
        for (int k = 0; k < 100_000; k++) {
            f.clear();
            f.timeNs(k * MS);
            f.value(0, constants[0]);
            f.value(1, constants[1]);
            if (k % 5 == 0) {
                f.value(2, constants[2]);
            }
            if (k % 100 == 0) {
                f.value(3, constants[3]);
            }
            f.value(4, constants[4]);
            fx.onFrame(f);
        }
        assertTrue(checked[0] > 25_000, "valid constant windows checked: " + checked[0]);
        assertTrue(fx.recomputes() > 100);
    }

    @Test
    void aStepOfAMillionThenQuietNoiseIsTrackedAfterTheStepLeaves() {
        // Without re-anchoring, sums still carrying the 1e12-sized squares of the step would swamp the 1e-6
        // variance of the quiet part once the step has left the window.
        ParameterDictionary d = dictionary(parameter("X", 1000));
        SplittableRandom rnd = new SplittableRandom(4L);
        ScenarioRun.Summary s = ScenarioRun.run(d, List.of(WindowSpec.of("X", WINDOWS)),
                ExtractorSettings.defaults(), 60_000, 3, (k, f) -> {
                    f.timeNs(k * MS);
                    double level = k >= 20_000 && k < 40_000 ? 1e6 : 0.0;
                    f.value(0, level + 1e-3 * rnd.nextGaussian());
                });
        assertTrue(s.validWindows() > 3000);
    }

    @Test
    void monotonicRampsKeepMinAndMaxExactAndTheSlopeOfTheRamp() {
        // a rising ramp fills the min deque with the whole window (its worst case), a falling one the max deque
        ParameterDictionary d = dictionary(parameter("Up", 1000), parameter("Down", 1000));
        List<WindowSpec> specs = List.of(WindowSpec.of("Up", WINDOWS), WindowSpec.of("Down", WINDOWS));
        ScenarioRun.Summary s = ScenarioRun.run(d, specs, ExtractorSettings.defaults(), 40_000, 2, (k, f) -> {
            f.timeNs(k * MS);
            f.value(0, 1e5 + 3.5 * k * 1e-3);
            f.value(1, -2.25 * k * 1e-3);
        });
        FeatureExtractor fx = s.extractor();
        FeatureLayout l = fx.layout();
        // exact ramps: least squares returns the ramp rate itself (to rounding of the sampled values)
        assertEquals(3.5, fx.feature(l.index("Up", Stat.SLOPE, 8.0)), 1e-9);
        assertEquals(-2.25, fx.feature(l.index("Down", Stat.SLOPE, 8.0)), 1e-9);
        assertEquals(0, fx.bufferGrowths());
    }

    @Test
    void windowsNeverFullAreInvalidWithCoverageOfTheElapsedShare() {
        ParameterDictionary d = dictionary(parameter("Nz", 100));
        SplittableRandom rnd = new SplittableRandom(5L);
        ScenarioRun.Summary s = ScenarioRun.run(d, List.of(WindowSpec.of("Nz", 8.0, 30.0)),
                ExtractorSettings.defaults(), 500, 1, (k, f) -> {
                    f.timeNs(1_000 * MS + k * 10 * MS);
                    f.value(0, 1 + 0.1 * rnd.nextGaussian());
                });
        assertEquals(0, s.validWindows(), "5 s of data never fill 8 s or 30 s windows");
        FeatureExtractor fx = s.extractor();
        // last tick at 1004.95 s, data since 1000 s
        assertEquals(1.0 - 3.05 / 8.0, fx.coverage(0), 1e-12);
        assertEquals(1.0 - 25.05 / 30.0, fx.coverage(1), 1e-12);
        assertTrue(Double.isNaN(fx.feature(0)), "invalid window features are NaN by default");
    }

    @Test
    void partialWindowsKeepTheirStatisticsWhenAskedTo() {
        ParameterDictionary d = dictionary(parameter("Nz", 100));
        SplittableRandom rnd = new SplittableRandom(6L);
        ExtractorSettings keep = ExtractorSettings.defaults().withInvalidWindow(InvalidWindowPolicy.KEEP);
        ScenarioRun.Summary s = ScenarioRun.run(d, List.of(WindowSpec.of("Nz", 8.0)), keep, 3000, 1, (k, f) -> {
            f.timeNs(k * 10 * MS);
            if (k < 500 || k > 700) {
                f.value(0, 1 + 0.1 * rnd.nextGaussian());
            }
        });
        assertTrue(s.invalidWindows() > 300, "filling and the 2 s hole make invalid windows, checked as kept");
        assertTrue(s.validWindows() > 100);
    }

    @Test
    void aSlowParameterInFastFramesIgnoresTheFramesWithoutIt() {
        ParameterDictionary d = dictionary(parameter("Fast", 1000), parameter("Slow", 10));
        List<WindowSpec> specs = List.of(WindowSpec.of("Slow", 2.0));
        double[] mins = {Double.POSITIVE_INFINITY};
        FeatureExtractor fx = FeatureExtractor.bind(d, specs, ExtractorSettings.defaults(),
                (timeNs, features, valid, coverage) -> {
                    if (valid[0]) {
                        mins[0] = Math.min(mins[0], features[Stat.MIN.ordinal()]);
                        assertEquals(5.0, features[Stat.MEAN.ordinal()], 0.0, "NaN frames are not zeros");
                    }
                });
        Frame f = Frame.forDictionary(d);
        for (int k = 0; k < 10_000; k++) {
            f.clear();
            f.timeNs(k * MS);
            f.value(0, k);
            if (k % 100 == 0) {
                f.value(1, 5.0);
            }
            fx.onFrame(f);
        }
        assertEquals(5.0, mins[0], 0.0);
        assertTrue(fx.valid(0));
    }

    @Test
    void aParameterFasterThanItsNominalRateGrowsItsBufferAndStaysCorrect() {
        ParameterDictionary d = dictionary(parameter("Liar", 10));
        SplittableRandom rnd = new SplittableRandom(7L);
        ScenarioRun.Summary s = ScenarioRun.run(d, List.of(WindowSpec.of("Liar", 0.5, 2.0)),
                ExtractorSettings.defaults(), 20_000, 5, (k, f) -> {
                    f.timeNs(k * MS);
                    f.value(0, Math.sin(k * 1e-3) + 0.01 * rnd.nextGaussian());
                });
        assertTrue(s.extractor().bufferGrowths() > 0);
        assertTrue(s.validWindows() > 300);
    }
}
