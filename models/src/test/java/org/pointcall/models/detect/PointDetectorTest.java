package org.pointcall.models.detect;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.pointcall.models.detect.PointEvent.Type.BEGUN;
import static org.pointcall.models.detect.PointEvent.Type.DISCARDED;
import static org.pointcall.models.detect.PointEvent.Type.ENDED;
import static org.pointcall.models.detect.PointEvent.Type.REFINED;
import static org.pointcall.models.detect.SyntheticSortie.TICK_NS;
import static org.pointcall.models.detect.SyntheticSortie.TICK_S;
import static org.pointcall.models.detect.SyntheticSortie.assertWellFormed;

import java.util.List;
import java.util.Set;

import org.junit.jupiter.api.Test;
import org.pointcall.models.detect.SyntheticSortie.Bump;
import org.pointcall.models.detect.SyntheticSortie.Probabilities;
import org.pointcall.shared.kind.ManoeuvreKind;

/** The detector on probability sequences alone (no physics, so guard rules cannot judge and stay out of it). */
class PointDetectorTest {
    private static final double NOISE = 0.05;
    private static final double BASE = 0.01;

    private static long ns(double s) {
        return Math.round(s * 1e9);
    }

    private static SyntheticSortie run(DetectorSettings s, double untilS, long seed, Bump... bumps) {
        return new SyntheticSortie(s).run(untilS, new Probabilities(seed, NOISE, BASE, bumps), null).finish();
    }

    @Test
    void aCleanPointGivesOneBegunThenOneEndedOnTheTicksAfterItsDesignedEdges() {
        double b = 10.013;
        double e = 40.027;
        SyntheticSortie s = run(DetectorSettings.defaults(), 60, 1L, new Bump(ManoeuvreKind.LEVEL_ACCEL, b, e, 0.9));
        assertEquals(List.of(BEGUN, ENDED), s.types());
        PointEvent begun = s.events.get(0);
        PointEvent ended = s.events.get(1);
        assertEquals(ManoeuvreKind.LEVEL_ACCEL, ended.kind());
        // the raw probability changes at the first tick after each designed edge, and the edges are placed there
        long firstTickAfterBegin = (ns(b) / TICK_NS + 1) * TICK_NS;
        long firstTickAfterEnd = (ns(e) / TICK_NS + 1) * TICK_NS;
        assertEquals(firstTickAfterBegin, begun.beginNs());
        assertEquals(firstTickAfterBegin, ended.beginNs());
        assertEquals(firstTickAfterEnd, ended.endNs());
        assertTrue(ended.confidence() > 0.8, "mean smoothed probability near the 0.9 level: " + ended.confidence());
        assertTrue(ended.hasEvidence("passed min-duration"), ended.evidence()::toString);
        assertEquals(List.of(new KeyInstant("start", ended.beginNs()), new KeyInstant("end", ended.endNs())),
                ended.keyInstants(), "level acceleration marks its start and end");
        assertWellFormed(s.events);
    }

    @Test
    void flickerShorterThanTheEnterHoldGivesNothing() {
        Bump[] flicker = new Bump[10];
        for (int i = 0; i < flicker.length; i++) {
            flicker[i] = new Bump(ManoeuvreKind.LOOP, 5 + 3 * i, 5.6 + 3 * i, 0.9);
        }
        SyntheticSortie s = run(DetectorSettings.defaults(), 40, 2L, flicker);
        assertEquals(List.of(), s.events);
        // the same flicker without the hold is entered: the hold is what suppresses it
        SyntheticSortie noHold = run(DetectorSettings.defaults().withEnter(0.6, 0.0), 40, 2L, flicker);
        assertEquals(10, noHold.ofType(BEGUN).size(), noHold.events::toString);
        assertEquals(10, noHold.ofType(DISCARDED).size(), "each flicker is far below the 8 s loop minimum");
        assertWellFormed(noHold.events);
    }

    @Test
    void aDipShorterThanTheMergeGapDoesNotSplitThePoint() {
        // the base merge gap alone: the longer fragment-merge gap of long kinds is tested apart
        DetectorSettings st = DetectorSettings.defaults().withMinDurationS(ManoeuvreKind.LEVEL_ACCEL, 5.0)
                .withDisabledRules(Set.of(BoundaryRules.FRAGMENT_MERGE));
        // 1.2 s at 0.05: long enough for the smoothed probability to stay under p_off past t_off (the point leaves),
        // short enough for the re-entry to begin within the 2 s merge gap
        SyntheticSortie s = run(st, 60, 3L, new Bump(ManoeuvreKind.LEVEL_ACCEL, 10, 25, 0.9),
                new Bump(ManoeuvreKind.LEVEL_ACCEL, 26.2, 40, 0.9));
        assertEquals(List.of(BEGUN, ENDED), s.types());
        PointEvent end = s.onlyFinal();
        assertEquals(ns(10), end.beginNs(), TICK_NS);
        assertEquals(ns(40), end.endNs(), TICK_NS);
        assertTrue(end.hasEvidence("merged across 1 gap"), end.evidence()::toString);

        // the same dip without merging splits it in two
        SyntheticSortie split = run(st.withMergeGapS(0.0), 60, 3L, new Bump(ManoeuvreKind.LEVEL_ACCEL, 10, 25, 0.9),
                new Bump(ManoeuvreKind.LEVEL_ACCEL, 26.2, 40, 0.9));
        assertEquals(List.of(BEGUN, ENDED, BEGUN, ENDED), split.types());
        assertEquals(ns(25), split.events.get(1).endNs(), TICK_NS);
        assertEquals(ns(26.2), split.events.get(3).beginNs(), TICK_NS);
        assertWellFormed(split.events);
    }

    @Test
    void aDipLongerThanTheMergeGapSplitsThePoint() {
        DetectorSettings st = DetectorSettings.defaults().withMinDurationS(ManoeuvreKind.LEVEL_ACCEL, 5.0)
                .withDisabledRules(Set.of(BoundaryRules.FRAGMENT_MERGE));
        SyntheticSortie s = run(st, 60, 4L, new Bump(ManoeuvreKind.LEVEL_ACCEL, 10, 25, 0.9),
                new Bump(ManoeuvreKind.LEVEL_ACCEL, 28, 40, 0.9));
        assertEquals(List.of(BEGUN, ENDED, BEGUN, ENDED), s.types());
        assertWellFormed(s.events);
    }

    @Test
    void aPointShorterThanItsKindsMinimumIsDiscardedNamingTheMinimum() {
        SyntheticSortie s = run(DetectorSettings.defaults(), 30, 5L, new Bump(ManoeuvreKind.STALL_LEVEL, 10, 13, 0.9));
        assertEquals(List.of(BEGUN, DISCARDED), s.types());
        PointEvent d = s.onlyFinal();
        assertTrue(d.hasEvidence("failed min-duration: 3.00 s (needs 10.00 s)"), d.evidence()::toString);
        assertTrue(d.hasEvidence("unchecked stall-aoa-peak"), "no physics, so the rule could not judge");
        // a shorter minimum keeps it
        SyntheticSortie kept = run(DetectorSettings.defaults().withMinDurationS(ManoeuvreKind.STALL_LEVEL, 2.5), 30, 5L,
                new Bump(ManoeuvreKind.STALL_LEVEL, 10, 13, 0.9));
        assertEquals(List.of(BEGUN, ENDED), kept.types());
    }

    @Test
    void hysteresisHoldsAPointBetweenTheLevelsButDoesNotStartOne() {
        // 0.5 lies between p_off 0.35 and p_on 0.6
        SyntheticSortie held = run(DetectorSettings.defaults(), 50, 6L,
                new Bump(ManoeuvreKind.PHUGOID, 5, 10, 0.9), new Bump(ManoeuvreKind.PHUGOID, 10, 40, 0.5));
        assertEquals(List.of(BEGUN, ENDED), held.types());
        assertEquals(ns(40), held.onlyFinal().endNs(), TICK_NS);

        SyntheticSortie never = run(DetectorSettings.defaults(), 50, 6L, new Bump(ManoeuvreKind.PHUGOID, 5, 40, 0.5));
        assertEquals(List.of(), never.events);
    }

    @Test
    void liveBeginIsReportedWithinTheSmoothingAndHoldDelay() {
        // worst levels the schedule can produce: before the bump at most BASE, inside at least 0.9 - NOISE
        double from = BASE;
        double to = 0.9 - NOISE;
        for (DetectorSettings st : List.of(DetectorSettings.defaults(),
                DetectorSettings.defaults().withSmoothing(Smoothing.MOVING_AVERAGE, 0.6),
                DetectorSettings.defaults().withSmoothing(Smoothing.NONE, 0.0),
                DetectorSettings.defaults().withSmoothing(Smoothing.EXPONENTIAL, 1.0).withEnter(0.7, 1.0))) {
            double boundS = st.beginDelayBoundS(from, to, TICK_S);
            for (long seed = 10; seed < 15; seed++) {
                double b = 10.0 + 0.007 * seed;
                SyntheticSortie s = run(st, 40, seed, new Bump(ManoeuvreKind.LEVEL_ACCEL, b, 30, 0.9));
                PointEvent begun = s.events.get(0);
                assertEquals(BEGUN, begun.type());
                double latencyS = (begun.reportedAtNs() - ns(b)) / 1e9;
                assertTrue(latencyS <= boundS, st.smoothing() + ": latency " + latencyS + " s over bound " + boundS);
                // and not below the hold itself, which every entry must sit out
                assertTrue(latencyS >= st.enterS(), "latency " + latencyS + " s shorter than t_on");
                // the begin itself is back-dated to the raw rise, not the report
                assertEquals(ns(b), begun.beginNs(), TICK_NS);
            }
        }
    }

    @Test
    void onlyOnePointIsOpenAtATimeAndTheNextBeginsWhereTheLastEnded() {
        SyntheticSortie s = run(DetectorSettings.defaults(), 45, 7L, new Bump(ManoeuvreKind.LOOP, 10, 20, 0.9),
                new Bump(ManoeuvreKind.AILERON_ROLL, 20, 24, 0.9), new Bump(ManoeuvreKind.SIDESLIP, 24.5, 40, 0.9));
        assertEquals(List.of(BEGUN, ENDED, BEGUN, ENDED, BEGUN, ENDED), s.types());
        assertEquals(List.of(ManoeuvreKind.LOOP, ManoeuvreKind.AILERON_ROLL, ManoeuvreKind.SIDESLIP),
                s.ofType(ENDED).stream().map(PointEvent::kind).toList());
        PointEvent loop = s.events.get(1);
        PointEvent roll = s.events.get(3);
        assertEquals(ns(20), loop.endNs(), TICK_NS);
        assertEquals(ns(20), roll.beginNs(), TICK_NS);
        assertTrue(roll.beginNs() >= loop.endNs());
        assertTrue(loop.hasEvidence("ended when aileron-roll took over"), loop.evidence()::toString);
        assertWellFormed(s.events);
    }

    @Test
    void aStallInsideWhatLookedLikeALevelAccelerationBecomesOneStallPoint() {
        Bump accel = new Bump(ManoeuvreKind.LEVEL_ACCEL, 10, 25, 0.9);
        Bump stall = new Bump(ManoeuvreKind.STALL_LEVEL, 25, 35, 0.9);
        SyntheticSortie s = run(DetectorSettings.defaults(), 50, 8L, accel, stall);
        assertEquals(List.of(BEGUN, REFINED, ENDED), s.types());
        assertEquals(ManoeuvreKind.LEVEL_ACCEL, s.events.get(0).kind());
        PointEvent refined = s.events.get(1);
        assertEquals(ManoeuvreKind.STALL_LEVEL, refined.kind());
        assertTrue(refined.hasEvidence("switched from level-accel to stall-level"), refined.evidence()::toString);
        PointEvent end = s.events.get(2);
        assertEquals(ManoeuvreKind.STALL_LEVEL, end.kind());
        assertEquals(ns(10), end.beginNs(), TICK_NS, "the stall keeps the begin of the entry");
        assertEquals(ns(35), end.endNs(), TICK_NS);

        // without the switch the two are separate points
        SyntheticSortie apart = run(DetectorSettings.defaults().withSwitches(Set.of()), 50, 8L, accel, stall);
        assertEquals(List.of(BEGUN, ENDED, BEGUN, ENDED), apart.types());
        assertWellFormed(apart.events);
    }

    @Test
    void theSameInputGivesTheSameEvents() {
        Bump[] bumps = {new Bump(ManoeuvreKind.LEVEL_ACCEL, 10, 30, 0.8), new Bump(ManoeuvreKind.STALL_LEVEL, 30, 37, 0.7),
                new Bump(ManoeuvreKind.LOOP, 50, 52, 0.9), new Bump(ManoeuvreKind.PITCH_DOUBLET, 60, 64, 0.75)};
        DetectorSettings st = DetectorSettings.defaults();
        List<PointEvent> first = new SyntheticSortie(st).run(80, new Probabilities(99L, 0.3, 0.05, bumps), null)
                .finish().events;
        List<PointEvent> second = new SyntheticSortie(st).run(80, new Probabilities(99L, 0.3, 0.05, bumps), null)
                .finish().events;
        assertFalse(first.isEmpty());
        assertEquals(first, second);
        assertWellFormed(first);
    }

    @Test
    void noisyProbabilitiesStillGiveWellFormedEvents() {
        for (long seed = 20; seed < 30; seed++) {
            SyntheticSortie s = new SyntheticSortie(DetectorSettings.defaults())
                    .run(120, new Probabilities(seed, 0.45, 0.08, new Bump(ManoeuvreKind.LOOP, 10, 25, 0.7),
                            new Bump(ManoeuvreKind.AILERON_ROLL, 24, 29, 0.6), new Bump(ManoeuvreKind.STALL_TURN, 40, 60,
                                    0.55), new Bump(ManoeuvreKind.STALL_LEVEL, 55, 70, 0.6)), null)
                    .finish();
            assertWellFormed(s.events);
            assertFalse(s.detector.pointOpen());
        }
    }

    @Test
    void finishEndsTheOpenPoint() {
        SyntheticSortie s = new SyntheticSortie(DetectorSettings.defaults())
                .run(30, new Probabilities(9L, NOISE, BASE, new Bump(ManoeuvreKind.SIDESLIP, 10, 100, 0.9)), null);
        assertTrue(s.detector.pointOpen());
        s.finish();
        PointEvent end = s.onlyFinal();
        assertEquals(ENDED, end.type());
        assertEquals(ns(30), end.endNs());
        assertTrue(end.hasEvidence("ended by finish"));
        assertFalse(s.detector.pointOpen());
    }

    @Test
    void theTopFeaturesGivenAtTheEnteringTickAreQuotedInTheEvidence() {
        List<PointEvent> events = new java.util.ArrayList<>();
        PointDetector d = PointDetector.bind(SyntheticSortie.dictionary(), SyntheticSortie.CLASSES,
                DetectorSettings.defaults().withSmoothing(Smoothing.NONE, 0).withEnter(0.6, 0.0), events::add);
        d.init(0);
        double[] p = new double[SyntheticSortie.CLASSES.size()];
        String[] top = {"Pitch.max.2s", "Nz.mean.2s", null, "ignored after the null"};
        p[SyntheticSortie.CLASSES.noneIndex()] = 1.0;
        d.onTick(ns(1), p, top);
        p[SyntheticSortie.CLASSES.noneIndex()] = 0.1;
        p[SyntheticSortie.CLASSES.indexOf(ManoeuvreKind.PHUGOID)] = 0.9;
        d.onTick(ns(2), p, top);
        // the caller reuses its array: what was given at the entry stays
        top[0] = "KCAS.slope.8s";
        top[1] = null;
        for (int i = 3; i < 1000; i++) {
            d.onTick(ns(i * 0.05 + 2), p, top);
        }
        d.finish(ns(60));
        assertEquals(List.of(BEGUN, ENDED), events.stream().map(PointEvent::type).toList());
        for (PointEvent e : events) {
            assertEquals(List.of("feature Pitch.max.2s", "feature Nz.mean.2s"),
                    e.evidence().stream().filter(x -> x.startsWith("feature ")).toList(), e.type().toString());
        }
    }

    @Test
    void badTicksAreDroppedAndCountedAndChangeNothing() {
        SyntheticSortie s = new SyntheticSortie(DetectorSettings.defaults());
        PointDetector d = s.detector;
        double[] p = new double[SyntheticSortie.CLASSES.size()];
        p[SyntheticSortie.CLASSES.noneIndex()] = 1.0;
        d.onTick(ns(1), p);
        d.onTick(ns(1), p);
        d.onTick(ns(0.5), p);
        double[] bad = p.clone();
        bad[3] = Double.NaN;
        d.onTick(ns(2), bad);
        assertEquals(1, d.ticksAccepted());
        assertEquals(3, d.ticksRejected());
        d.onTick(ns(2), p);
        assertEquals(2, d.ticksAccepted(), "the time of a dropped tick is still free");
        d.onTick(ns(10), p);
        assertEquals(1, d.tickGaps(), "8 s of silence is beyond the 1 s limit");
    }
}
