package org.pointcall.models.card;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.function.DoubleUnaryOperator;

import org.apache.commons.math3.stat.regression.SimpleRegression;
import org.junit.jupiter.api.Test;
import org.pointcall.ingest.frame.Frame;
import org.pointcall.models.analysis.PointHistory;
import org.pointcall.shared.card.Band;
import org.pointcall.shared.card.BandPhase;
import org.pointcall.shared.card.TestPoint;
import org.pointcall.shared.demo.DemoFiles;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.kind.ManoeuvreKind;
import org.pointcall.shared.outcome.BandStatus;
import org.pointcall.shared.units.Unit;
import org.pointcall.shared.units.Units;

class PhaseJudgeTest {
    private static final ParameterDictionary DICT = DemoFiles.dictionary();
    private static final long S = 1_000_000_000L;

    /** 64 Hz of one parameter (in its dictionary unit) from 0 to {@code seconds}. */
    private static PointHistory history(String name, double seconds, DoubleUnaryOperator valueAtS) {
        PointHistory h = PointHistory.of(DICT, List.of(name), 1024);
        Frame f = Frame.forDictionary(DICT);
        int slot = DICT.indexOf(name);
        for (int i = 0; i <= seconds * 64; i++) {
            f.clear();
            f.timeNs(Math.round(i * S / 64.0));
            f.value(slot, valueAtS.applyAsDouble(i / 64.0));
            h.append(f);
        }
        return h;
    }

    /** Gaussian noise of standard deviation {@code std} for each 64 Hz sample of 30 s. */
    private static double[] noise(long seed, double std) {
        Random r = new Random(seed);
        double[] noise = new double[64 * 30 + 1];
        for (int i = 0; i < noise.length; i++) {
            noise[i] = std * r.nextGaussian();
        }
        return noise;
    }

    private static TestPoint point(ManoeuvreKind kind, double holdS, Band... bands) {
        return new TestPoint("P-1", kind, "test point", "", holdS, List.of(bands));
    }

    @Test
    void anEntryOutsideItsBandGivesTheReasonInTheBandsOwnTermsAndANegativeMargin() {
        PointHistory h = history("KCAS", 20, t -> 158.0);
        Band kcas = Band.ofTarget("KCAS", null, BandPhase.ENTRY, null, Double.NaN, Unit.KNOT, 150, 5, 5);
        PhaseJudge.Judged j = PhaseJudge.judge(point(ManoeuvreKind.LOOP, Double.NaN, kcas), 0, h, 10 * S, 15 * S,
                Map.of(), Map.of());
        assertFalse(j.result().held());
        assertEquals(BandStatus.OUT, j.result().status());
        assertEquals(158.0, j.result().value(), 1e-9);
        // 3 kt beyond the upper edge of a 10 kt wide band
        assertEquals(-0.3, j.result().marginFraction(), 1e-9);
        assertEquals("entry KCAS 158 kt, band 150 +/- 5 kt", j.reason().text());
    }

    @Test
    void theEntryValueIsTakenBeforeTheBeginNotAfterIt() {
        // the technique moves the value from the begin on: the entry condition is the one before it
        PointHistory h = history("KCAS", 20, t -> t < 10 ? 150 : 150 + 10 * (t - 10));
        Band kcas = Band.ofTarget("KCAS", null, BandPhase.ENTRY, null, Double.NaN, Unit.KNOT, 150, 5, 5);
        PhaseJudge.Judged j = PhaseJudge.judge(point(ManoeuvreKind.LOOP, Double.NaN, kcas), 0, h, 10 * S, 15 * S,
                Map.of(), Map.of());
        assertTrue(j.result().held(), j.toString());
        assertEquals(150.0, j.result().value(), 0.2);
    }

    @Test
    void theRateBandIsTheLeastSquaresSlopeOverItsIntervalBeforeTheInstant() {
        double[] noise = noise(7, 0.3);
        PointHistory h = history("KCAS", 30, t -> 140 - 1.1 * t + noise[(int) Math.round(t * 64)]);
        Band rate = Band.ofTarget("KCAS", null, BandPhase.RATE, "break", 10, Unit.KNOT_PER_SECOND, -1.0, 0.25, 0.25);
        PhaseJudge.Judged j = PhaseJudge.judge(point(ManoeuvreKind.STALL_LEVEL, Double.NaN, rate), 0, h, 0,
                30 * S, Map.of("break", 25 * S), Map.of());
        SimpleRegression ref = new SimpleRegression();
        for (int i = 0; i < h.size(); i++) {
            long t = h.timeNs(i);
            if (t >= 15 * S && t <= 25 * S) {
                ref.addData((t - 15 * S) * 1e-9, h.valueSi("KCAS", i));
            }
        }
        // reference: Apache Commons Math SimpleRegression on the same samples; both are exact least squares, so
        // they agree to rounding
        assertEquals(Unit.KNOT_PER_SECOND.fromSi(ref.getSlope()), j.result().value(), 1e-9);
        assertEquals(-1.1, j.result().value(), 0.05, "the slope flown");
        assertTrue(j.result().held());
    }

    @Test
    void aValueAtAKeyInstantIsReadOnTheLineUpToItNotOnWhatFollows() {
        // Nz 0.92 g easing down 0.01 g/s into the break at 25 s, then the lift break drops it 1 g/s: a mean centred
        // on the break took in the drop; the value is the one the aircraft had at the break
        double[] noise = noise(11, 0.01);
        PointHistory h = history("Nz", 30, t -> (t <= 25 ? 0.92 - 0.01 * (t - 25) : 0.92 - (t - 25))
                + noise[(int) Math.round(t * 64)]);
        Band nz = Band.ofTarget("Nz", null, BandPhase.INSTANT, "break", Double.NaN, Unit.G, 1.0, 0.1, 0.1);
        PhaseJudge.Judged j = PhaseJudge.judge(point(ManoeuvreKind.STALL_LEVEL, Double.NaN, nz), 0, h, 0, 30 * S,
                Map.of("break", 25 * S), Map.of());
        SimpleRegression ref = new SimpleRegression();
        for (int i = 0; i < h.size(); i++) {
            long t = h.timeNs(i);
            if (t >= 25 * S - Math.round(PhaseJudge.INSTANT_SPAN_S * 1e9) && t <= 25 * S) {
                ref.addData((t - 25 * S) * 1e-9, h.valueSi("Nz", i));
            }
        }
        // reference: Apache Commons Math SimpleRegression on the same samples, read at the instant (its intercept)
        assertEquals(ref.getIntercept(), Unit.G.toSi(j.result().value()), 1e-9);
        assertEquals(0.92, j.result().value(), 0.02, "the Nz flown at the break");
        assertTrue(j.result().held(), j.toString());
    }

    @Test
    void aRateBandWithoutItsInstantIsNotHeldAndSaysWhy() {
        PointHistory h = history("KCAS", 30, t -> 140 - t);
        Band rate = Band.ofTarget("KCAS", null, BandPhase.RATE, "break", 10, Unit.KNOT_PER_SECOND, -1.0, 0.25, 0.25);
        PhaseJudge.Judged j = PhaseJudge.judge(point(ManoeuvreKind.STALL_LEVEL, Double.NaN, rate), 0, h, 0,
                30 * S, Map.of(), Map.of());
        assertFalse(j.result().held());
        assertNull(j.result().value());
        assertEquals(BandStatus.WAITING, j.result().status());
        assertTrue(j.reason().text().contains("no break was found"), j.reason().text());
    }

    @Test
    void throughoutCountsTimeOutsideForgivesALeadInAndAShortTransientButNotMore() {
        Band roll = Band.ofTarget("Roll", null, BandPhase.THROUGHOUT, null, Double.NaN, Unit.DEGREE, 0, 5, 5);
        TestPoint p = point(ManoeuvreKind.PHUGOID, Double.NaN, roll);
        // 3 s still rolling out at the begin, then wings level: the lead-in does not count
        PointHistory lead = history("Roll", 40, t -> t < 3 ? 20 : 0);
        assertTrue(PhaseJudge.judge(p, 0, lead, 0, 40 * S, Map.of(), Map.of()).result().held());
        // a 0.5 s excursion in the middle passes as a transient
        PointHistory spike = history("Roll", 40, t -> t > 20 && t < 20.5 ? 9 : 0);
        PhaseJudge.Judged s = PhaseJudge.judge(p, 0, spike, 0, 40 * S, Map.of(), Map.of());
        assertTrue(s.result().held());
        assertEquals(0.5, s.result().outsideS(), 0.05);
        // 4 s of 12 deg bank in the middle does not, and the reason gives time and value
        PointHistory off = history("Roll", 40, t -> t > 20 && t < 24 ? 12 : 0);
        PhaseJudge.Judged o = PhaseJudge.judge(p, 0, off, 0, 40 * S, Map.of(), Map.of());
        assertFalse(o.result().held());
        assertEquals(4.0, o.result().outsideS(), 0.05);
        assertEquals(12.0, o.result().value(), 1e-9, "the worst sample is reported");
        assertEquals("Roll outside 0 +/- 5 deg for 4.0 s, reached 12 deg", o.reason().text());
    }

    @Test
    void aStallsThroughoutBandsStopAtTheBreak() {
        Band roll = Band.ofTarget("Roll", null, BandPhase.THROUGHOUT, null, Double.NaN, Unit.DEGREE, 0, 5, 5);
        // the wing drops after the break: that is the wing-drop metric's business, not the bank band's
        PointHistory h = history("Roll", 40, t -> t < 30 ? 0 : 25);
        PhaseJudge.Judged j = PhaseJudge.judge(point(ManoeuvreKind.STALL_LEVEL, Double.NaN, roll), 0, h, 0,
                40 * S, Map.of("break", 30 * S - 1), Map.of());
        assertTrue(j.result().held());
        PhaseJudge.Judged noBreak = PhaseJudge.judge(point(ManoeuvreKind.STALL_LEVEL, Double.NaN, roll), 0, h, 0,
                40 * S, Map.of(), Map.of());
        assertFalse(noBreak.result().held());
    }

    @Test
    void aBankGrowingOutOfItsBandIntoTheBreakIsNotATransient() {
        Band roll = Band.ofTarget("Roll", null, BandPhase.THROUGHOUT, null, Double.NaN, Unit.DEGREE, 0, 5, 5);
        TestPoint p = point(ManoeuvreKind.STALL_LEVEL, Double.NaN, roll);
        // the wing goes down from 28 s, passes the band's edge at 29 s and is at 6.5 deg at the break at 30 s (a
        // simulated sortie's case): outside for just under the transient allowance, but outside when the technique
        // ends
        PointHistory drift = history("Roll", 40, t -> t < 28 ? 0 : t < 29 ? -5 * (t - 28) : -5 - 1.5 * (t - 29));
        PhaseJudge.Judged j = PhaseJudge.judge(p, 0, drift, 0, 40 * S, Map.of("break", 30 * S), Map.of());
        assertFalse(j.result().held(), j.toString());
        assertTrue(j.result().outsideS() <= PhaseJudge.TRANSIENT_S, j.toString());
        assertEquals("Roll outside 0 +/- 5 deg for 1.0 s, reached -6 deg, still outside at the break",
                j.reason().text());
        // the same excursion 3 s before the break, back inside by it, is a transient
        PointHistory back = history("Roll", 40, t -> t > 26.8 && t < 27.2 ? -6.5 : 0);
        assertTrue(PhaseJudge.judge(p, 0, back, 0, 40 * S, Map.of("break", 30 * S), Map.of()).result().held());
        // and a sample of noise just outside at the break is let pass
        PointHistory spike = history("Roll", 40, t -> t > 29.9 ? 5.2 : 0);
        assertTrue(PhaseJudge.judge(p, 0, spike, 0, 40 * S, Map.of("break", 30 * S), Map.of()).result().held());
    }

    @Test
    void aHoldPointNeedsOneUnbrokenStretchInsideAsLongAsItsHold() {
        Band kcas = Band.ofTarget("KCAS", null, BandPhase.THROUGHOUT, null, Double.NaN, Unit.KNOT, 250, 2, 2);
        // inside from 0 to 18 s, a 1 s excursion, inside again 19 to 40 s: 21 s at most in one stretch
        PointHistory h = history("KCAS", 40, t -> t >= 18 && t < 19 ? 254 : 250);
        assertTrue(PhaseJudge.judge(point(ManoeuvreKind.STABILISED, 20, kcas), 0, h, 0, 40 * S, Map.of(), Map.of())
                .result().held());
        PhaseJudge.Judged j = PhaseJudge.judge(point(ManoeuvreKind.STABILISED, 30, kcas), 0, h, 0, 40 * S, Map.of(),
                Map.of());
        assertFalse(j.result().held());
        assertTrue(j.reason().text().startsWith("KCAS held inside 250 +/- 2 kt for 21"), j.reason().text());
    }

    @Test
    void aHoldCountsFromWhenThePointWasOnConditionNotFromTheDetectedBegin() {
        Band kcas = Band.ofTarget("KCAS", null, BandPhase.THROUGHOUT, null, Double.NaN, Unit.KNOT, 250, 2, 2);
        // setting up at 260 kt until 8 s, on condition from 8 s; the detector began the point at 20 s
        PointHistory h = history("KCAS", 60, t -> t < 8 ? 260 : 250);
        TestPoint p = point(ManoeuvreKind.STABILISED, 30, kcas);
        long on = PhaseJudge.onConditionSince(p, h, 20 * S, 0);
        assertEquals(8.0, on / 1e9, 1.0 / 64);
        // never further back than the hold, nor than the floor (the previous point's end)
        assertEquals(10.0, PhaseJudge.onConditionSince(point(ManoeuvreKind.STABILISED, 10, kcas), h, 20 * S, 0) / 1e9,
                1.0 / 64);
        assertEquals(12.0, PhaseJudge.onConditionSince(p, h, 20 * S, 12 * S) / 1e9, 1.0 / 64);
        // outside at the begin: the begin stays
        PointHistory off = history("KCAS", 60, t -> t < 21 ? 260 : 250);
        assertEquals(20 * S, PhaseJudge.onConditionSince(p, off, 20 * S, 0));
        // from the detected begin the 30 s hold is not there (20 to 45 s), from on condition it is
        assertFalse(PhaseJudge.judge(p, 0, h, 20 * S, 45 * S, Map.of(), Map.of()).result().held());
        assertTrue(PhaseJudge.judge(p, 0, h, on, 45 * S, Map.of(), Map.of()).result().held());
    }

    @Test
    void resultBandsUseTheMetricAndOpenBandsHaveAMarginOnTheirEdge() {
        Band loss = Band.ofRange(null, "altitude-loss", BandPhase.RESULT, null, Double.NaN, Unit.FOOT,
                Double.NEGATIVE_INFINITY, 800);
        PointHistory h = history("Hp", 1, t -> 10000);
        TestPoint p = point(ManoeuvreKind.STALL_LEVEL, Double.NaN, loss);
        PhaseJudge.Judged in = PhaseJudge.judge(p, 0, h, 0, S, Map.of(), Map.of("altitude-loss", Units.ftToM(600)));
        assertTrue(in.result().held());
        assertEquals(0.25, in.result().marginFraction(), 1e-9, "200 ft below an 800 ft edge");
        assertEquals(BandStatus.CLEAR, in.result().status());
        PhaseJudge.Judged near = PhaseJudge.judge(p, 0, h, 0, S, Map.of(), Map.of("altitude-loss", Units.ftToM(790)));
        assertEquals(BandStatus.MARGINAL, near.result().status());
        PhaseJudge.Judged none = PhaseJudge.judge(p, 0, h, 0, S, Map.of(), Map.of());
        assertFalse(none.result().held());
        assertEquals("altitude-loss could not be computed, band at most 800 ft", none.reason().text());
    }
}
