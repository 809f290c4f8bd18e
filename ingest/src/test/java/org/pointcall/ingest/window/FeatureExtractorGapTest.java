package org.pointcall.ingest.window;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.pointcall.ingest.window.ScenarioRun.dictionary;
import static org.pointcall.ingest.window.ScenarioRun.parameter;

import java.util.List;

import org.junit.jupiter.api.Test;
import org.pointcall.ingest.frame.Frame;
import org.pointcall.shared.dictionary.ParameterDictionary;

/** Validity and coverage of windows around gaps, flagged gaps, stale data, short history and sparse samples. */
class FeatureExtractorGapTest {
    private static final long MS = 1_000_000L;

    private static long ms(double seconds) {
        return Math.round(seconds * 1000);
    }

    @Test
    void anIntervalLongerThanThreeNominalIntervalsIsAGapUntilItLeavesTheWindow() {
        // 100 Hz: gap threshold 30 ms. Samples at 10.00 to 10.04 s are missing: 9.99 -> 10.05 is a 60 ms gap.
        ParameterDictionary d = dictionary(parameter("P", 100));
        TickLog log = new TickLog();
        FeatureExtractor fx = FeatureExtractor.bind(d, List.of(WindowSpec.of("P", 0.5, 2.0)),
                ExtractorSettings.defaults(), log);
        Frame f = Frame.forDictionary(d);
        for (int k = 0; k <= 2000; k++) {
            f.clear();
            f.timeNs(k * 10 * MS);
            if (k < 1000 || k > 1004) {
                f.value(0, Math.sin(k * 0.01));
            }
            fx.onFrame(f);
        }
        assertFalse(log.at(1.95).valid()[1], "2 s window before 2 s of history");
        assertTrue(log.at(2.0).valid()[1], "history from 0 s fills [0, 2] exactly");
        assertTrue(log.at(10.0).valid()[1], "10 ms since the last sample is not yet a gap");
        assertFalse(log.at(10.05).valid()[1]);
        assertEquals(1.0 - 0.060 / 2.0, log.at(10.05).coverage()[1], 1e-12, "the 60 ms gap is uncovered");
        assertTrue(Double.isNaN(log.at(10.05).features()[FeatureLayout.featureIndex(1, Stat.MEAN)]));
        assertEquals(1.0 - 0.050 / 2.0, log.at(12.0).coverage()[1], 1e-12, "the gap's last 50 ms are inside");
        assertTrue(log.at(12.05).valid()[1], "valid once the sample after the gap starts the window");
        assertFalse(log.at(10.5).valid()[0]);
        assertEquals(1.0 - 0.050 / 0.5, log.at(10.5).coverage()[0], 1e-12);
        assertTrue(log.at(10.55).valid()[0]);
        for (TickLog.Tick t : log.ticks) {
            boolean expected = t.timeNs() >= 2_000 * MS && (t.timeNs() <= 10_000 * MS || t.timeNs() >= 12_050 * MS);
            assertEquals(expected, t.valid()[1], "2 s window at " + t.timeNs() + " ns");
        }
    }

    @Test
    void exactlyThreeNominalIntervalsIsStillContinuousAndOneMillisecondMoreIsNot() {
        ParameterDictionary d = dictionary(parameter("Q", 100), parameter("R", 100));
        TickLog log = new TickLog();
        FeatureExtractor fx = FeatureExtractor.bind(d, List.of(WindowSpec.of("Q", 2.0), WindowSpec.of("R", 2.0)),
                ExtractorSettings.defaults(), log);
        Frame f = Frame.forDictionary(d);
        for (int k = 0; k <= 20_000; k++) {
            f.clear();
            f.timeNs(k * MS);
            boolean onGrid = k % 10 == 0;
            boolean inHole = k > 14_990 && k < 15_030;
            if (onGrid && !inHole || k == 15_020) {
                f.value(0, 1.0 + k);
            }
            if (onGrid && !inHole || k == 15_021) {
                f.value(1, 1.0 + k);
            }
            fx.onFrame(f);
        }
        assertTrue(log.at(15.05).valid()[0], "14.990 -> 15.020 s is 30 ms: continuous");
        assertFalse(log.at(15.05).valid()[1], "14.990 -> 15.021 s is 31 ms: a gap");
        assertEquals(1.0 - 0.031 / 2.0, log.at(15.05).coverage()[1], 1e-12);
    }

    @Test
    void aFrameFlaggedGapBeforeBreaksTheIntervalItFallsIn() {
        // 100 Hz parameter in 1000 Hz frames; the flagged frame at 10.003 s carries no sample of it
        ParameterDictionary d = dictionary(parameter("P", 100), parameter("S", 10));
        TickLog log = new TickLog();
        FeatureExtractor fx = FeatureExtractor.bind(d, List.of(WindowSpec.of("P", 2.0), WindowSpec.of("S", 2.0)),
                ExtractorSettings.defaults(), log);
        Frame f = Frame.forDictionary(d);
        for (int k = 0; k <= 30_000; k++) {
            f.clear();
            f.timeNs(k * MS);
            if (k == 10_003 || k == 20_020) {
                f.addFlags(Frame.GAP_BEFORE);
            }
            if (k % 10 == 0) {
                f.value(0, k);
            }
            if (k % 100 == 0) {
                f.value(1, -k);
            }
            fx.onFrame(f);
        }
        assertTrue(log.at(10.0).valid()[0]);
        assertFalse(log.at(10.05).valid()[0], "10.000 -> 10.010 s spans the flagged frame");
        assertEquals(1.0 - 0.010 / 2.0, log.at(10.05).coverage()[0], 1e-12);
        assertFalse(log.at(12.0).valid()[0]);
        assertTrue(log.at(12.05).valid()[0]);
        // the 10 Hz parameter: flagged at 20.020 s, after its sample at 20.0 s and before the next at 20.1 s
        assertTrue(log.at(20.0).valid()[1]);
        assertFalse(log.at(20.05).valid()[1], "a flagged gap since the newest sample leaves the rest uncovered");
        assertEquals(1.0 - 0.050 / 2.0, log.at(20.05).coverage()[1], 1e-12);
        assertFalse(log.at(22.05).valid()[1]);
        assertTrue(log.at(22.1).valid()[1], "valid once the sample after the flag starts the window");
    }

    @Test
    void aParameterThatFallsSilentGoesStaleAtTheFirstTickBeyondTheThreshold() {
        ParameterDictionary d = dictionary(parameter("P", 100), parameter("Other", 100));
        TickLog log = new TickLog();
        FeatureExtractor fx = FeatureExtractor.bind(d, List.of(WindowSpec.of("P", 2.0)),
                ExtractorSettings.defaults(), log);
        Frame f = Frame.forDictionary(d);
        for (int k = 0; k <= 3000; k++) {
            f.clear();
            f.timeNs(k * 10 * MS);
            f.value(1, 0.0);
            if (k < 2000) {
                f.value(0, k);
            }
            fx.onFrame(f);
        }
        assertTrue(log.at(20.0).valid()[0], "last sample at 19.99 s, 10 ms ago");
        assertFalse(log.at(20.05).valid()[0]);
        assertEquals(1.0 - 0.060 / 2.0, log.at(20.05).coverage()[0], 1e-12);
        assertEquals(1.0 - 0.110 / 2.0, log.at(20.1).coverage()[0], 1e-12);
        assertEquals(0.0, log.at(22.0).coverage()[0], 0.0, "no sample left in the window");
        assertEquals(0, fx.ticksSkipped(), "other parameters keep the stream alive");
    }

    @Test
    void tooFewSamplesMakeAWindowInvalidEvenWhenCovered() {
        // 1 Hz: a 2 s window holds 2 or 3 samples, gap threshold 3 s
        ParameterDictionary d = dictionary(parameter("Slow", 1));
        TickLog three = new TickLog();
        TickLog four = new TickLog();
        FeatureExtractor fx3 = FeatureExtractor.bind(d, List.of(WindowSpec.of("Slow", 2.0)),
                ExtractorSettings.defaults().withMinSamples(3), three);
        FeatureExtractor fx4 = FeatureExtractor.bind(d, List.of(WindowSpec.of("Slow", 2.0)),
                ExtractorSettings.defaults().withMinSamples(4), four);
        Frame f = Frame.forDictionary(d);
        for (int k = 0; k <= 100; k++) {
            f.clear();
            f.timeNs(k * 100 * MS);
            if (k % 10 == 0) {
                f.value(0, k);
            }
            fx3.onFrame(f);
            fx4.onFrame(f);
        }
        assertTrue(three.at(6.0).valid()[0], "samples at 4, 5 and 6 s");
        assertFalse(three.at(6.5).valid()[0], "samples at 5 and 6 s only");
        assertEquals(1.0, three.at(6.5).coverage()[0], 0.0);
        for (TickLog.Tick t : four.ticks) {
            assertFalse(t.valid()[0]);
        }
    }

    @Test
    void ticksAreNotEmittedWhileEveryWindowIsEmpty() {
        ParameterDictionary d = dictionary(parameter("P", 1000));
        TickLog log = new TickLog();
        FeatureExtractor fx = FeatureExtractor.bind(d, List.of(WindowSpec.of("P", 0.5, 2.0, 8.0)),
                ExtractorSettings.defaults(), log);
        Frame f = Frame.forDictionary(d);
        for (long k = 0; k <= 101_000; k++) {
            if (k > 10_000 && k < 100_000) {
                continue;
            }
            f.clear();
            f.timeNs(k * MS);
            f.value(0, 1.0);
            fx.onFrame(f);
        }
        // 0 .. 18 s: 361 ticks (the 8 s window drains until 18 s); 18.05 .. 99.95 s skipped; 100 .. 101 s: 21
        assertEquals(361 + 21, fx.ticksEmitted());
        assertEquals(1639, fx.ticksSkipped());
        assertEquals(ms(18.0), log.ticks.get(360).timeNs() / MS);
        assertEquals(0.0, log.at(18.0).coverage()[2], 0.0, "one sample left, 8 s stale");
        assertEquals(ms(100.0), log.ticks.get(361).timeNs() / MS);
    }
}
