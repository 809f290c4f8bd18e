package org.pointcall.models.card;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;

import org.junit.jupiter.api.Test;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.card.TestPoint;
import org.pointcall.shared.kind.ManoeuvreKind;
import org.pointcall.shared.outcome.Verdict;

class CardMatcherTest {
    private static TestPoint p(String id, ManoeuvreKind k) {
        return new TestPoint(id, k, "point " + id, "", Double.NaN, List.of());
    }

    private static final TestCard CARD = new TestCard("S-1", "veskarn-02", "", "", List.of(), List.of(
            p("SL-1", ManoeuvreKind.STALL_LEVEL), p("LP-1", ManoeuvreKind.LOOP), p("SL-2", ManoeuvreKind.STALL_LEVEL),
            p("LP-2", ManoeuvreKind.LOOP)));

    private static String bind(CardMatcher m, ManoeuvreKind k) {
        return m.bind(k).map(TestPoint::id).orElse("unplanned");
    }

    @Test
    void detectionsTakeTheNextPendingPointOfTheirKindInCardOrder() {
        CardMatcher m = new CardMatcher(CARD);
        assertEquals("LP-1", bind(m, ManoeuvreKind.LOOP), "a loop flown first still takes the first loop");
        assertEquals(CardPointState.FLYING, m.state("LP-1"));
        m.settle("LP-1", Verdict.GOOD);
        assertEquals("SL-1", bind(m, ManoeuvreKind.STALL_LEVEL));
        m.settle("SL-1", Verdict.GOOD);
        assertEquals("LP-2", bind(m, ManoeuvreKind.LOOP));
        m.settle("LP-2", Verdict.GOOD);
        assertEquals("unplanned", bind(m, ManoeuvreKind.LOOP), "every loop done: an unplanned manoeuvre");
        assertEquals("unplanned", bind(m, ManoeuvreKind.PHUGOID), "no phugoid on the card");
        assertEquals(List.of("SL-2"), m.notFlown());
    }

    @Test
    void aDetectionBindsToTheFirstPendingPointItsConditionAccepts() {
        CardMatcher m = new CardMatcher(CARD);
        // the first loop is not accepted (its condition is not met): the second is taken, the first stays to fly
        assertEquals("LP-2", m.bind(ManoeuvreKind.LOOP, p -> !p.id().equals("LP-1")).map(TestPoint::id).orElse("-"));
        assertEquals(CardPointState.FLYING, m.state("LP-2"));
        assertEquals(CardPointState.PENDING, m.state("LP-1"));
        m.settle("LP-2", Verdict.REPEAT);
        // none accepted: nothing bound, nothing changed
        assertTrue(m.bind(ManoeuvreKind.LOOP, p -> false).isEmpty());
        assertEquals(CardPointState.PENDING, m.state("LP-1"));
        assertEquals(CardPointState.REPEAT, m.state("LP-2"));
        // a point to repeat is taken when it is the one accepted
        assertEquals("LP-2", m.bind(ManoeuvreKind.LOOP, p -> p.id().equals("LP-2")).map(TestPoint::id).orElse("-"));
        // the armed point is the engineer's choice, whatever the condition says
        m.settle("LP-2", Verdict.GOOD);
        m.arm("LP-1");
        assertEquals("LP-1", m.bind(ManoeuvreKind.LOOP, p -> false).map(TestPoint::id).orElse("-"));
    }

    @Test
    void anArmedPointTakesPrecedenceForItsKindOnly() {
        CardMatcher m = new CardMatcher(CARD);
        m.arm("SL-2");
        assertEquals(CardPointState.ARMED, m.state("SL-2"));
        assertEquals("LP-1", bind(m, ManoeuvreKind.LOOP), "a loop does not take the armed stall");
        m.settle("LP-1", Verdict.GOOD);
        assertEquals("SL-2", bind(m, ManoeuvreKind.STALL_LEVEL), "the armed stall before SL-1");
        m.settle("SL-2", Verdict.GOOD);
        assertTrue(m.armed().isEmpty(), "arming is used once");
        assertEquals("SL-1", bind(m, ManoeuvreKind.STALL_LEVEL));
    }

    @Test
    void abandonedPointsAreStillToFlyAndRepeatsAreFlownAgainWhenNothingElseIsPending() {
        CardMatcher m = new CardMatcher(CARD);
        assertEquals("SL-1", bind(m, ManoeuvreKind.STALL_LEVEL));
        m.settle("SL-1", Verdict.INCOMPLETE);
        assertEquals("SL-1", bind(m, ManoeuvreKind.STALL_LEVEL), "an abandoned point keeps its place");
        m.settle("SL-1", Verdict.REPEAT);
        assertEquals("SL-2", bind(m, ManoeuvreKind.STALL_LEVEL), "pending before repeat");
        m.settle("SL-2", Verdict.GOOD);
        assertEquals("SL-1", bind(m, ManoeuvreKind.STALL_LEVEL), "then the repeat is flown again");
        m.unbind("SL-1");
        assertEquals(CardPointState.REPEAT, m.state("SL-1"), "a detection that changed kind gives the point back");
    }

    @Test
    void theCardGoesOnAfterItsLatestCompletedFlight() {
        CardMatcher m = new CardMatcher(CARD);
        java.util.function.Supplier<String> next = () -> m.next().map(TestPoint::id).orElse("none");
        assertEquals("SL-1", next.get(), "the card's first point before anything is flown");
        bind(m, ManoeuvreKind.LOOP);
        m.settle("LP-1", Verdict.GOOD);
        assertEquals("SL-2", next.get(), "after LP-1, the next waiting point after it, not SL-1 left behind");
        bind(m, ManoeuvreKind.STALL_LEVEL);
        m.settle("SL-1", Verdict.INCOMPLETE);
        assertEquals("SL-2", next.get(), "an abandoned flight does not move the card on");
        bind(m, ManoeuvreKind.LOOP);
        m.settle("LP-2", Verdict.REPEAT);
        assertEquals("SL-1", next.get(), "past the card's end, the first still waiting");
        m.overrule("LP-1", Verdict.REPEAT);
        assertEquals("SL-1", next.get(), "the engineer's call on an earlier point does not move the card back");
        m.arm("SL-2");
        assertEquals("SL-2", next.get(), "the armed point");
        m.disarm();
        bind(m, ManoeuvreKind.STALL_LEVEL);
        m.settle("SL-1", Verdict.GOOD);
        bind(m, ManoeuvreKind.STALL_LEVEL);
        m.settle("SL-2", Verdict.GOOD);
        assertEquals("none", next.get(), "nothing waits: the points to repeat are the engineer's to arm");
    }

    @Test
    void unknownPointsAreRefused() {
        CardMatcher m = new CardMatcher(CARD);
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> m.arm("XX-9"));
        assertEquals("card S-1 has no point 'XX-9'", e.getMessage());
    }
}
