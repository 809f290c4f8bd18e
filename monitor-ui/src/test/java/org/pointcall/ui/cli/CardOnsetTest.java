package org.pointcall.ui.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.pointcall.ingest.frame.Frame;
import org.pointcall.ingest.sim.SortieSimulator;
import org.pointcall.ingest.sim.airframe.Airframes;
import org.pointcall.ingest.sim.pilot.PilotSettings;
import org.pointcall.ingest.sim.sensor.SensorSettings;
import org.pointcall.ingest.sim.truth.PointTruth;
import org.pointcall.ingest.sim.truth.SortieTruth;
import org.pointcall.models.card.CardAnalysers;
import org.pointcall.models.card.CardPointState;
import org.pointcall.models.card.CardSession;
import org.pointcall.models.card.LiveBegins;
import org.pointcall.models.card.SessionMirror;
import org.pointcall.models.card.SessionSetup;
import org.pointcall.models.detect.BoundaryRules;
import org.pointcall.models.detect.DetectorSettings;
import org.pointcall.models.modelfile.LoadedModel;
import org.pointcall.models.train.Classifier;
import org.pointcall.shared.card.CardFiles;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.demo.DemoFiles;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.outcome.PointOutcome;
import org.pointcall.shared.outcome.SessionEvent;

/**
 * The card's next point shown begun from its first move off its steady entry ({@link BoundaryRules#CARD_ONSET}):
 * the simulated pilot flies a wings-level stall and a loop on the Sparrel (an airframe the shipped model never saw)
 * with sensor noise; the console sees each begun within a second of the pilot's start, seconds before the detector
 * can tell the kind, and the flights (begin, end, verdict) are the same as without the rule. A departure that is not
 * the card's next point (a stall entry while the card waits for a phugoid) is withdrawn, and the card point waits
 * again.
 */
class CardOnsetTest {
    static final ParameterDictionary DICT = DemoFiles.dictionary();
    private static final String STALL = String.join("\n",
            "  - id: SL-1", "    kind: stall-level", "    title: Wings-level stall", "    bands:",
            "      - {parameter: Hp, phase: entry, target: 10000, tol: 500, unit: ft}",
            "      - {parameter: Roll, phase: throughout, target: 0, tol: 5, unit: deg}",
            "      - {parameter: KCAS, phase: rate, before: break, over: 10, target: -1.0, tol: 0.25, unit: kt/s}", "");
    private static final String LOOP = String.join("\n",
            "  - id: LP-1", "    kind: loop", "    title: Loop from 165 KCAS", "    bands:",
            "      - {parameter: KCAS, phase: entry, target: 165, tol: 10, unit: kt}",
            "      - {parameter: Hp, phase: entry, target: 8000, tol: 300, unit: ft}", "");
    private static final String PHUGOID = String.join("\n",
            "  - id: PH-1", "    kind: phugoid", "    title: Phugoid at 10,000 ft", "    bands:",
            "      - {parameter: Hp, phase: entry, target: 10000, tol: 500, unit: ft}", "");
    private static final String HOLD = String.join("\n",
            "  - id: TP-1", "    kind: stabilised", "    title: Stabilised point, 140 KCAS at 10,000 ft", "    hold: 30",
            "    bands:",
            "      - {parameter: KCAS, phase: throughout, target: 140, tol: 2, unit: kt}",
            "      - {parameter: Hp, phase: throughout, target: 10000, tol: 100, unit: ft}",
            "      - {parameter: Nz, phase: throughout, target: 1.0, tol: 0.05, unit: g}", "");
    static final TestCard FLOWN = CardFiles.parse(String.join("\n",
            "sortie: T-11", "airframe: sparrel-a1", "points:", STALL, LOOP, HOLD), "flown.yaml", DICT);

    static final List<Frame> FRAMES = new ArrayList<>();
    static SortieTruth truth;
    static LoadedModel<Classifier> model;

    @BeforeAll
    static void fly() {
        model = DetectorModel.load(null);
        truth = new SortieSimulator(Airframes.load("sparrel-a1"), FLOWN, DICT, 31, 64, SensorSettings.DEFAULT,
                PilotSettings.NO_FLAWS).run(List.of(f -> FRAMES.add(f.copy())));
    }

    private static CardSession play(TestCard card, DetectorSettings settings, List<SessionEvent> events) {
        CardSession s = new CardSession(new SessionSetup(DICT, card, model.model(), model.metadata().description(),
                settings, CardAnalysers.standard(), SessionSetup.DEFAULT_SNAPSHOT_INTERVAL_S), events::add);
        for (Frame f : FRAMES) {
            s.onFrame(f);
        }
        s.finish();
        return s;
    }

    /** Data time of the first begin shown for {@code cardId}, s. */
    private static double shownBegunS(List<SessionEvent> events, String cardId) {
        return events.stream().filter(e -> e instanceof SessionEvent.PointStarted p && cardId.equals(p.cardId()))
                .mapToDouble(e -> e.timeNs() / 1e9).findFirst().orElse(Double.NaN);
    }

    @Test
    void theCardsNextPointIsShownBegunWithinASecondOfItsStart() {
        List<SessionEvent> on = new ArrayList<>();
        List<SessionEvent> off = new ArrayList<>();
        CardSession withRule = play(FLOWN, DetectorSettings.defaults(), on);
        CardSession without = play(FLOWN, DetectorSettings.defaults().withRulesOff(List.of(BoundaryRules.CARD_ONSET)),
                off);
        assertEquals(3, truth.points().size());
        for (PointTruth p : truth.points()) {
            double shown = shownBegunS(on, p.cardId());
            double detector = shownBegunS(off, p.cardId());
            // the hold: shown once stabilised on its condition, with or without the rule
            assertTrue(Math.abs(shown - p.beginS()) <= LiveBegins.ON_TIME_S, p.cardId() + " began at " + p.beginS()
                    + " s, shown begun at " + shown + " s");
            if (!"TP-1".equals(p.cardId())) {
                assertTrue(detector - p.beginS() > 1.5, p.cardId() + ": without the rule the detector shows it at "
                        + detector + " s, more than 1.5 s late");
            }
        }
        LiveBegins live = new LiveBegins();
        live.add(truth, on);
        assertEquals(1.0, live.onTimeFraction(), 1e-9, live.lines()::toString);
        // the flights themselves are the detector's, as before: same begin, end and verdict
        assertEquals(without.outcomes().size(), withRule.outcomes().size());
        for (int i = 0; i < without.outcomes().size(); i++) {
            PointOutcome a = without.outcomes().get(i);
            PointOutcome b = withRule.outcomes().get(i);
            assertEquals(a.cardId(), b.cardId());
            assertEquals(a.beginNs(), b.beginNs());
            assertEquals(a.endNs(), b.endNs());
            assertEquals(a.verdict(), b.verdict());
        }
        assertTrue(on.stream().noneMatch(e -> e instanceof SessionEvent.PointWithdrawn), on::toString);
        // the stall's entry-rate gauge waits for 3 s of the entry: the trimmed flight before it is no entry rate
        SessionEvent.BandChanged rate = (SessionEvent.BandChanged) on.stream()
                .filter(e -> e instanceof SessionEvent.BandChanged b && "SL-1".equals(b.cardId())
                        && "rate".equals(b.phase())).findFirst().orElseThrow();
        assertTrue(rate.timeNs() / 1e9 >= truth.points().get(0).beginS() + 2.5, rate.line());
    }

    @Test
    void aBeginFromTheCardSaysSoUntilTheDetectorHasIt() {
        CardSession s = new CardSession(SessionSetup.of(DICT, FLOWN, model.model(), model.metadata().description(),
                CardAnalysers.standard()), e -> { });
        int awaiting = 0;
        int confirmed = 0;
        for (Frame f : FRAMES) {
            s.onFrame(f);
            var a = s.snapshot().active();
            if (a != null && "SL-1".equals(a.cardId())) {
                if (a.awaiting() != null) {
                    assertEquals(0, confirmed, "once the detector has it, it stays the detector's");
                    assertTrue(a.awaiting().startsWith("not yet confirmed by the detector"), a.awaiting());
                    awaiting++;
                } else {
                    confirmed++;
                }
            }
        }
        s.finish();
        assertTrue(awaiting > 0 && confirmed > 0, awaiting + " snapshots awaiting, " + confirmed + " confirmed");
    }

    @Test
    void aDepartureThatIsNotTheCardsNextPointIsWithdrawn() {
        // the card waits for a phugoid at the stall's altitude: the stall's slowing down is a phugoid's first move
        TestCard card = CardFiles.parse(String.join("\n", "sortie: T-11", "airframe: sparrel-a1", "points:",
                PHUGOID, STALL, LOOP), "session.yaml", DICT);
        List<SessionEvent> events = new ArrayList<>();
        CardSession s = play(card, DetectorSettings.defaults(), events);
        SessionMirror mirror = new SessionMirror(card);
        events.forEach(mirror::onEvent);
        SessionEvent.PointStarted ph = (SessionEvent.PointStarted) events.stream()
                .filter(e -> e instanceof SessionEvent.PointStarted p && "PH-1".equals(p.cardId()))
                .findFirst().orElseThrow(() -> new AssertionError("PH-1 shown begun: " + events));
        SessionEvent.PointWithdrawn w = (SessionEvent.PointWithdrawn) events.stream()
                .filter(e -> e instanceof SessionEvent.PointWithdrawn).findFirst()
                .orElseThrow(() -> new AssertionError("no withdrawal: " + events));
        assertEquals(ph.detection(), w.detection());
        assertEquals("PH-1", w.cardId());
        assertTrue(w.why().contains("stall"), w.why());
        PointTruth stall = truth.points().get(0);
        assertTrue(Math.abs(ph.timeNs() / 1e9 - stall.beginS()) <= 1.0, "PH-1 taken from the stall's start");
        // the stall is flown as SL-1; the phugoid still waits, in the session and in a console's mirror
        assertEquals(CardPointState.PENDING, s.snapshot().points().get(0).state(), s.snapshot().points()::toString);
        assertEquals(CardPointState.PENDING, mirror.snapshot(s.snapshot().timeNs()).points().get(0).state());
        assertTrue(s.outcomes().stream().noneMatch(o -> "PH-1".equals(o.cardId())), s.outcomes()::toString);
        assertTrue(s.outcomes().stream().anyMatch(o -> "SL-1".equals(o.cardId()) && o.verdict() != null
                && o.verdict() != org.pointcall.shared.outcome.Verdict.INCOMPLETE), s.outcomes()::toString);
    }
}
