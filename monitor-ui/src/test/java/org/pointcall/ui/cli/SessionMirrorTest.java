package org.pointcall.ui.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;

import org.junit.jupiter.api.Test;
import org.pointcall.ingest.frame.Frame;
import org.pointcall.models.card.CardAnalysers;
import org.pointcall.models.card.CardSession;
import org.pointcall.models.card.SessionMirror;
import org.pointcall.models.card.SessionSetup;
import org.pointcall.models.card.SessionSnapshot;
import org.pointcall.shared.outcome.PointsFiles;
import org.pointcall.shared.outcome.SessionEvent;
import org.pointcall.shared.outcome.Verdict;

/**
 * The mirror a watching console keeps, against the card session it mirrors: the session flies a stall (no stall on
 * its card: unplanned) and a loop bound to the armed second loop point, breaks a limit, and the engineer calls the
 * loop good over the tool's repeat. After every frame the mirror, fed only the session's events as JSON (as they
 * travel on Kafka), must show the card as the session does.
 */
class SessionMirrorTest {
    /** What a card line shows: id, state, the tool's verdict, the engineer's call, the reasons. */
    private static List<String> card(SessionSnapshot s) {
        List<String> out = new ArrayList<>();
        for (SessionSnapshot.CardPointView v : s.points()) {
            out.add(v.id() + " " + v.state() + " " + v.toolVerdict() + " " + v.engineerCall() + " " + v.reasons());
        }
        return out;
    }

    private static String active(SessionSnapshot s) {
        SessionSnapshot.ActivePoint a = s.active();
        return a == null ? "none" : a.detection() + " " + a.cardId() + " " + a.kind() + " " + a.beginNs();
    }

    @Test
    void theMirrorShowsTheCardAsTheSessionDoesAfterEveryFrame() throws Exception {
        if (CardSessionLiveTest.FRAMES.isEmpty()) {
            CardSessionLiveTest.fly();
        }
        SessionMirror mirror = new SessionMirror(CardSessionLiveTest.SESSION);
        List<SessionEvent> events = new ArrayList<>();
        CardSession s = new CardSession(SessionSetup.of(CardSessionLiveTest.DICT, CardSessionLiveTest.SESSION,
                CardSessionLiveTest.model.model(), CardSessionLiveTest.model.metadata().description(),
                CardAnalysers.standard()), e -> {
                    events.add(e);
                    mirror.onEvent(PointsFiles.eventFromJson(PointsFiles.eventToJson(e)));
                });
        s.arm("LP-B");
        boolean called = false;
        int compared = 0;
        for (Frame f : CardSessionLiveTest.FRAMES) {
            s.onFrame(f.copy());
            SessionSnapshot live = s.snapshot();
            SessionSnapshot seen = mirror.snapshot(live.timeNs());
            assertEquals(card(live), card(seen), "card at " + live.timeNs() / 1e9 + " s");
            assertEquals(active(live), active(seen), "active point at " + live.timeNs() / 1e9 + " s");
            assertEquals(live.limitsBroken().size(), seen.limitsBroken().size(), "limits broken");
            compared++;
            if (!called && events.stream().anyMatch(e -> e instanceof SessionEvent.PointFinished)) {
                called = true;
                s.call("LP-B", Verdict.GOOD, "agreed on the net");
            }
        }
        s.finish();
        assertEquals(card(s.snapshot()), card(mirror.snapshot(0)));
        assertEquals(s.outcomes(), mirror.outcomes(), "outcomes, with the engineer's call");
        assertEquals(s.alarms(), mirror.alarms());
        assertEquals(s.notFlown(), mirror.notFlown());
        assertEquals(s.snapshot().unplanned(), mirror.snapshot(0).unplanned());
        assertTrue(compared > 1000 && events.stream().anyMatch(e -> e instanceof SessionEvent.CallTaken)
                && events.stream().anyMatch(e -> e instanceof SessionEvent.Unplanned)
                && events.stream().anyMatch(e -> e instanceof SessionEvent.PointArmed), events.toString());
    }
}
