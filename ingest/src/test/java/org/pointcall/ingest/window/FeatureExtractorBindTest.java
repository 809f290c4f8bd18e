package org.pointcall.ingest.window;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.pointcall.ingest.window.ScenarioRun.dictionary;
import static org.pointcall.ingest.window.ScenarioRun.parameter;

import java.util.List;

import org.junit.jupiter.api.Test;
import org.pointcall.ingest.frame.Frame;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.PointcallException;

/** Binding, the feature layout, the tick time line and the handling of frames out of order. */
class FeatureExtractorBindTest {
    private static final long MS = 1_000_000L;
    private static final ParameterDictionary DICT = dictionary(parameter("Nz", 100), parameter("KCAS", 50),
            parameter("AoA", 100));

    @Test
    void layoutNamesEveryFeatureAndResolvesSlotsAtBind() {
        FeatureExtractor fx = FeatureExtractor.bind(DICT, List.of(WindowSpec.of("KCAS", 2.0, 8.0),
                WindowSpec.of("AoA", 0.5)), ExtractorSettings.defaults(), (t, f, v, c) -> { });
        FeatureLayout l = fx.layout();
        assertEquals(18, l.size());
        assertEquals(3, l.windowCount());
        assertEquals(List.of("KCAS.mean.2s", "KCAS.std.2s", "KCAS.min.2s", "KCAS.max.2s", "KCAS.slope.2s",
                "KCAS.change.2s"), l.names().subList(0, 6));
        assertEquals("AoA.slope.0.5s", l.name(16));
        assertEquals(16, l.index("AoA", Stat.SLOPE, 0.5));
        assertEquals(16, l.indexOf("AoA.slope.0.5s"));
        assertEquals(-1, l.indexOf("AoA.slope.2s"));
        assertEquals(6, l.index("KCAS", Stat.MEAN, 8.0));
        assertEquals("KCAS.8s", l.windowName(1));
        assertEquals(1, l.windowSlot(0), "KCAS is slot 1 of the dictionary");
        assertEquals(2, l.windowSlot(2));
        PointcallException e = assertThrows(PointcallException.class, () -> l.windowIndex("AoA", 2.0));
        assertTrue(e.getMessage().contains("AoA"), e.getMessage());
    }

    @Test
    void anUnknownParameterIsRefusedByName() {
        PointcallException e = assertThrows(PointcallException.class, () -> FeatureExtractor.bind(DICT,
                List.of(WindowSpec.of("Nz", 2.0), WindowSpec.of("Beta", 2.0)), ExtractorSettings.defaults(),
                (t, f, v, c) -> { }));
        assertTrue(e.getMessage().contains("'Beta'") && e.getMessage().contains("test"), e.getMessage());
    }

    @Test
    void aParameterGivenTwiceIsRefused() {
        PointcallException e = assertThrows(PointcallException.class, () -> FeatureExtractor.bind(DICT,
                List.of(WindowSpec.of("Nz", 2.0), WindowSpec.of("Nz", 8.0)), ExtractorSettings.defaults(),
                (t, f, v, c) -> { }));
        assertTrue(e.getMessage().contains("'Nz'"), e.getMessage());
    }

    @Test
    void specsAndSettingsRefuseNonsense() {
        assertThrows(IllegalArgumentException.class, () -> WindowSpec.of("Nz"));
        assertThrows(IllegalArgumentException.class, () -> WindowSpec.of("Nz", 0.0));
        assertThrows(IllegalArgumentException.class, () -> WindowSpec.of("Nz", -1.0));
        assertThrows(IllegalArgumentException.class, () -> WindowSpec.of("Nz", Double.NaN));
        assertThrows(IllegalArgumentException.class, () -> WindowSpec.of("Nz", 2.0, 2.0));
        assertThrows(IllegalArgumentException.class, () -> WindowSpec.of("Nz", 7200.0));
        assertThrows(IllegalArgumentException.class, () -> WindowSpec.of("Nz", 2.0).withMaxGapS(0.0));
        assertThrows(IllegalArgumentException.class, () -> WindowSpec.of(" ", 2.0));
        assertThrows(IllegalArgumentException.class, () -> ExtractorSettings.defaults().withDecisionRateHz(0));
        assertThrows(IllegalArgumentException.class, () -> ExtractorSettings.defaults().withDecisionRateHz(5000));
        assertThrows(IllegalArgumentException.class, () -> ExtractorSettings.defaults().withGapFactor(0.5));
        assertThrows(IllegalArgumentException.class, () -> ExtractorSettings.defaults().withMinSamples(1));
    }

    @Test
    void ticksFallOnMultiplesOfThePeriodAndIncludeAFrameAtExactlyThatTime() {
        ParameterDictionary d = dictionary(parameter("P", 1000));
        TickLog log = new TickLog();
        FeatureExtractor fx = FeatureExtractor.bind(d, List.of(WindowSpec.of("P", 0.5)),
                ExtractorSettings.defaults().withMinSamples(2).withInvalidWindow(InvalidWindowPolicy.KEEP), log);
        Frame f = Frame.forDictionary(d);
        long[] times = {1_020 * MS, 1_049 * MS, 1_050 * MS, 1_050 * MS + 1, 1_100 * MS + 7, 1_160 * MS};
        double[] values = {1, 2, 3, 100, 5, 6};
        for (int i = 0; i < times.length; i++) {
            f.clear();
            f.timeNs(times[i]);
            f.value(0, values[i]);
            fx.onFrame(f);
        }
        assertEquals(3, log.ticks.size());
        assertEquals(1_050 * MS, log.ticks.get(0).timeNs(), "first tick: first multiple of 50 ms after 1.020 s");
        assertEquals(3.0, log.ticks.get(0).features()[Stat.MAX.ordinal()], 0.0,
                "the frame at exactly 1.050 s is in, the one 1 ns later is not");
        assertEquals(2.0, log.ticks.get(0).features()[Stat.MEAN.ordinal()], 0.0);
        assertEquals(1_100 * MS, log.ticks.get(1).timeNs());
        assertEquals(100.0, log.ticks.get(1).features()[Stat.MAX.ordinal()], 0.0);
        assertEquals(1_150 * MS, log.ticks.get(2).timeNs(), "fired by the frame at 1.160 s, before taking it");
        assertEquals(4.0, log.ticks.get(2).features()[Stat.CHANGE.ordinal()], 0.0, "last 5 minus first 1");
    }

    @Test
    void framesNotLaterThanThePreviousOneAreDroppedAndCounted() {
        ParameterDictionary d = dictionary(parameter("P", 1000));
        TickLog log = new TickLog();
        FeatureExtractor fx = FeatureExtractor.bind(d, List.of(WindowSpec.of("P", 0.5)),
                ExtractorSettings.defaults().withInvalidWindow(InvalidWindowPolicy.KEEP), log);
        Frame f = Frame.forDictionary(d);
        long[] times = {10 * MS, 20 * MS, 20 * MS, 15 * MS, 30 * MS, 60 * MS};
        for (int i = 0; i < times.length; i++) {
            f.clear();
            f.timeNs(times[i]);
            f.sequence(i);
            f.value(0, i == 2 || i == 3 ? 1e9 : i);
            fx.onFrame(f);
        }
        assertEquals(4, fx.framesAccepted());
        assertEquals(2, fx.framesRejected());
        assertEquals(3, fx.lastRejectedSequence());
        assertEquals(4.0, log.at(0.05).features()[Stat.MAX.ordinal()], 0.0, "the dropped 1e9 never entered");
    }

    @Test
    void advanceToFiresTicksOfASilentStreamAndClosesThePastToLateFrames() {
        ParameterDictionary d = dictionary(parameter("P", 100));
        TickLog log = new TickLog();
        FeatureExtractor fx = FeatureExtractor.bind(d, List.of(WindowSpec.of("P", 0.5)),
                ExtractorSettings.defaults(), log);
        assertEquals(0, fx.advanceTo(5 * MS), "no time line before the first frame");
        Frame f = Frame.forDictionary(d);
        for (int k = 0; k <= 100; k++) {
            f.clear();
            f.timeNs(k * 10 * MS);
            f.value(0, k);
            fx.onFrame(f);
        }
        assertEquals(21, fx.ticksEmitted());
        assertEquals(3, fx.advanceTo(1_150 * MS), "ticks at 1.05, 1.10 and 1.15 s");
        assertEquals(1_150 * MS, fx.lastTickNs());
        assertFalse(fx.valid(0), "stale after 150 ms without a sample");
        f.clear();
        f.timeNs(1_120 * MS);
        f.value(0, 1.0);
        fx.onFrame(f);
        assertEquals(1, fx.framesRejected(), "a frame inside the closed past is late");
    }

    @Test
    void infiniteValuesAreSkippedAndCounted() {
        ParameterDictionary d = dictionary(parameter("P", 100));
        TickLog log = new TickLog();
        FeatureExtractor fx = FeatureExtractor.bind(d, List.of(WindowSpec.of("P", 0.5)),
                ExtractorSettings.defaults(), log);
        Frame f = Frame.forDictionary(d);
        for (int k = 0; k <= 100; k++) {
            f.clear();
            f.timeNs(k * 10 * MS);
            f.value(0, k == 80 ? Double.POSITIVE_INFINITY : k == 81 ? Double.NEGATIVE_INFINITY : 2.0);
            fx.onFrame(f);
        }
        assertEquals(2, fx.valuesNonFinite());
        assertEquals(2.0, log.at(1.0).features()[Stat.MAX.ordinal()], 0.0);
        assertTrue(log.at(1.0).valid()[0], "a 30 ms hole is within the 3-interval threshold");
    }

    @Test
    void resetForgetsSamplesAndTheTimeLine() {
        ParameterDictionary d = dictionary(parameter("P", 100));
        TickLog log = new TickLog();
        FeatureExtractor fx = FeatureExtractor.bind(d, List.of(WindowSpec.of("P", 0.5)),
                ExtractorSettings.defaults(), log);
        Frame f = Frame.forDictionary(d);
        for (int pass = 0; pass < 2; pass++) {
            for (int k = 0; k <= 100; k++) {
                f.clear();
                f.timeNs(k * 10 * MS);
                f.value(0, pass * 10 + 1.0);
                fx.onFrame(f);
            }
            assertEquals(pass * 10 + 1.0, fx.feature(Stat.MEAN.ordinal()), 0.0);
            fx.reset();
            assertTrue(Double.isNaN(fx.feature(0)));
        }
        assertEquals(0, fx.framesRejected(), "time may start again after a reset");
        assertEquals(42, log.ticks.size());
        TickLog.Tick secondPass = log.ticks.get(21 + 9);
        assertEquals(450 * MS, secondPass.timeNs());
        assertFalse(secondPass.valid()[0], "the second pass started from an empty window");
        assertTrue(log.ticks.get(21 + 10).valid()[0]);
        assertEquals(11.0, log.ticks.get(21 + 10).features()[Stat.MEAN.ordinal()], 0.0);
    }

    @Test
    void aFrameOfAnotherLayoutIsAProgrammingError() {
        FeatureExtractor fx = FeatureExtractor.bind(DICT, List.of(WindowSpec.of("Nz", 0.5)),
                ExtractorSettings.defaults(), (t, f, v, c) -> { });
        assertThrows(IllegalArgumentException.class, () -> fx.onFrame(new Frame(7)));
    }
}
