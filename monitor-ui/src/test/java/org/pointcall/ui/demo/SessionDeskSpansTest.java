package org.pointcall.ui.demo;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;

import java.util.List;
import java.util.Map;

import org.junit.jupiter.api.Test;
import org.pointcall.shared.demo.DemoFiles;
import org.pointcall.shared.outcome.PointOutcome;
import org.pointcall.shared.outcome.SessionEvent;
import org.pointcall.shared.outcome.Verdict;
import org.pointcall.ui.desk.PointSpan;

/** The chart's point spans as the session's events draw them. */
class SessionDeskSpansTest {
    private static final long S = 1_000_000_000L;

    @Test
    void aDetectionBoundAgainUnderAnotherKindKeepsOneSpan() {
        SessionDesk desk = new SessionDesk(DemoFiles.card(), DemoFiles.dictionary());
        // a stall begun as a turning one (ST-1), told wings-level while it was flown (SL-1), ended as that
        desk.onEvent(new SessionEvent.PointStarted(12 * S, 5, "stall-turn", "ST-1", "Turning stall", 10 * S));
        desk.onEvent(new SessionEvent.PointStarted(30 * S, 5, "stall-level", "SL-1", "Wings-level stall", 10 * S));
        desk.onEvent(new SessionEvent.PointFinished(60 * S, new PointOutcome(5, "SL-1", "stall-level",
                "Wings-level stall", 10 * S, 55 * S, 0.9, Verdict.GOOD, List.of(), List.of(), List.of(), Map.of(),
                List.of(), null)));
        List<PointSpan> spans = desk.spans();
        assertEquals(1, spans.size(), spans::toString);
        assertEquals(10.0, spans.get(0).beginS(), 1e-9);
        assertEquals(55.0, spans.get(0).endS(), 1e-9);
        assertFalse(spans.get(0).open());
        // another detection opens a span of its own
        desk.onEvent(new SessionEvent.PointStarted(70 * S, 6, "loop", "LP-1", "Loop", 65 * S));
        assertEquals(2, desk.spans().size());
    }

    @Test
    void aWithdrawnBeginLeavesNoSpanAndTheNextPointDrawsItsOwn() {
        SessionDesk desk = new SessionDesk(DemoFiles.card(), DemoFiles.dictionary());
        desk.onEvent(new SessionEvent.PointStarted(12 * S, 2_000_000_001L, "phugoid", "PH-1", "Phugoid", 11 * S));
        assertEquals(1, desk.spans().size());
        desk.onEvent(new SessionEvent.PointWithdrawn(40 * S, 2_000_000_001L, "PH-1", "a stall-level was found instead"));
        assertEquals(0, desk.spans().size(), desk.spans()::toString);
        assertEquals(true, desk.events().stream().anyMatch(e -> e.text().contains("begin withdrawn")),
                desk.events()::toString);
        desk.onEvent(new SessionEvent.PointStarted(40 * S, 7, "stall-level", "SL-1", "Wings-level stall", 11 * S));
        assertEquals(1, desk.spans().size());
        assertEquals(11.0, desk.spans().get(0).beginS(), 1e-9);
    }
}
