package org.pointcall.models.card;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Random;
import java.util.function.DoubleUnaryOperator;

import org.junit.jupiter.api.Test;
import org.pointcall.ingest.frame.Frame;
import org.pointcall.models.analysis.PointHistory;
import org.pointcall.shared.card.Band;
import org.pointcall.shared.card.BandPhase;
import org.pointcall.shared.card.TestPoint;
import org.pointcall.shared.demo.DemoFiles;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.kind.ManoeuvreKind;
import org.pointcall.shared.units.Unit;

/**
 * The condition watch and its near variant on a 140 +/- 2 KCAS hold of 20 s, fed frame by frame at 64 Hz with
 * 0.5 kt of Gaussian sensor noise: a hold flown off condition is steady near it; a deceleration through the widened
 * band in transit (1 kt/s, the rate of a stall entry, 20 s inside the widened band) is not steady.
 */
class ConditionWatchTest {
    private static final ParameterDictionary DICT = DemoFiles.dictionary();
    private static final long S = 1_000_000_000L;
    private static final TestPoint HOLD = new TestPoint("TP-1", ManoeuvreKind.STABILISED, "hold", "", 20,
            List.of(Band.ofTarget("KCAS", null, BandPhase.THROUGHOUT, null, Double.NaN, Unit.KNOT, 140, 2, 2)));

    /** The longest time each watch was on over {@code seconds} of the signal, s: {real, near}. */
    private static double[] longestOn(double seconds, DoubleUnaryOperator kcasAtS, long seed) {
        PointHistory h = PointHistory.of(DICT, List.of("KCAS"), 1024);
        Frame f = Frame.forDictionary(DICT);
        int slot = DICT.indexOf("KCAS");
        Random noise = new Random(seed);
        ConditionWatch real = new ConditionWatch();
        ConditionWatch near = ConditionWatch.near(CardSession.NEAR_BAND_WIDTHS);
        double[] longest = new double[2];
        for (int i = 0; i <= seconds * 64; i++) {
            long t = Math.round(i * S / 64.0);
            f.clear();
            f.timeNs(t);
            f.value(slot, kcasAtS.applyAsDouble(i / 64.0) + 0.5 * noise.nextGaussian());
            h.append(f);
            real.update(HOLD, h, t);
            near.update(HOLD, h, t);
            longest[0] = Math.max(longest[0], real.onForNs(t) / 1e9);
            longest[1] = Math.max(longest[1], near.onForNs(t) / 1e9);
        }
        return longest;
    }

    @Test
    void aHoldFlownSteadyOffItsConditionIsNearButNotOn() {
        double[] on = longestOn(40, t -> 134.0, 1);
        assertEquals(0.0, on[0], 1e-9, "134 kt is never inside 140 +/- 2");
        assertTrue(on[1] >= 39.0, "held steady 1.5 band widths off: near throughout, " + on[1] + " s");
        // 4 band widths off is not near at all
        assertEquals(0.0, longestOn(40, t -> 122.0, 2)[1], 1e-9);
    }

    @Test
    void aHoldOnItsConditionIsBothOnAndNear() {
        double[] on = longestOn(40, t -> 140.0, 3);
        assertTrue(on[0] >= 39.0, on[0] + " s");
        assertTrue(on[1] >= 39.0, on[1] + " s");
    }

    @Test
    void aDecelerationThroughTheWidenedBandIsNotSteady() {
        // 160 kt down to 120 kt at 1 kt/s: inside the widened band (130 to 150 kt) for 20 s, the hold's length
        double[] on = longestOn(40, t -> 160.0 - t, 4);
        assertTrue(on[1] < 10.0, "near for " + on[1] + " s of a 1 kt/s deceleration");
        assertTrue(on[0] < HOLD.holdS(), "on condition for " + on[0] + " s, less than the hold");
        // and a slow drift of 0.25 kt/s (a band width in 16 s) is not held steady for the hold either
        assertFalse(longestOn(40, t -> 134.0 + 0.25 * t, 5)[1] >= 20.0);
    }

    @Test
    void onlyATwoSidedBandIsWidened() {
        TestPoint open = new TestPoint("TP-2", ManoeuvreKind.STABILISED, "hold", "", 20,
                List.of(Band.ofRange("KCAS", null, BandPhase.THROUGHOUT, null, Double.NaN, Unit.KNOT, 150,
                        Double.POSITIVE_INFINITY)));
        PointHistory h = PointHistory.of(DICT, List.of("KCAS"), 1024);
        Frame f = Frame.forDictionary(DICT);
        ConditionWatch near = ConditionWatch.near(CardSession.NEAR_BAND_WIDTHS);
        for (int i = 0; i <= 30 * 64; i++) {
            long t = Math.round(i * S / 64.0);
            f.clear();
            f.timeNs(t);
            f.value(DICT.indexOf("KCAS"), 149.0);
            h.append(f);
            near.update(open, h, t);
        }
        assertEquals(0, near.onForNs(30 * S), "at least 150 kt has no width to widen by: 149 kt is outside");
    }
}
