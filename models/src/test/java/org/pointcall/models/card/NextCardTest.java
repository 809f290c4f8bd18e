package org.pointcall.models.card;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;

import org.junit.jupiter.api.Test;
import org.pointcall.models.analysis.PointHistory;
import org.pointcall.ingest.frame.Frame;
import org.pointcall.shared.card.CardFiles;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.card.TestPoint;
import org.pointcall.shared.demo.DemoFiles;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.PointcallException;
import org.pointcall.shared.outcome.BandResult;
import org.pointcall.shared.outcome.OperatorCall;
import org.pointcall.shared.outcome.PointOutcome;
import org.pointcall.shared.outcome.PointsFile;
import org.pointcall.shared.outcome.Reason;
import org.pointcall.shared.outcome.Verdict;

class NextCardTest {
    private static final ParameterDictionary DICT = DemoFiles.dictionary();
    private static final TestCard CARD = DemoFiles.card();

    /** An outcome of a demo card point whose bands are judged on a history where every parameter is constant. */
    private static PointOutcome flown(String id, Map<String, Double> values, Map<String, Double> metricsSi,
                                      OperatorCall call) {
        TestPoint p = CARD.point(id).orElseThrow();
        PointHistory h = PointHistory.ofAll(DICT, 128);
        Frame f = Frame.forDictionary(DICT);
        for (int i = 0; i < 64 * 4; i++) {
            f.clear();
            f.timeNs(i * 15_625_000L);
            values.forEach((k, v) -> f.value(DICT.indexOf(k), v));
            h.append(f);
        }
        List<BandResult> bands = new ArrayList<>();
        List<Reason> reasons = new ArrayList<>();
        for (int i = 0; i < p.bands().size(); i++) {
            PhaseJudge.Judged j = PhaseJudge.judge(p, i, h, 2_000_000_000L, 3_000_000_000L,
                    Map.of("pull", 2_500_000_000L, "apex", 2_600_000_000L), metricsSi);
            bands.add(j.result());
            if (j.reason() != null) {
                reasons.add(j.reason());
            }
        }
        Verdict v = reasons.isEmpty() ? Verdict.GOOD : Verdict.REPEAT;
        return new PointOutcome(1, id, p.kind().key(), p.title(), 2_000_000_000L, 3_000_000_000L, 0.9, v, reasons,
                bands, List.of(), Map.of(), List.of(), call);
    }

    private static PointsFile results(PointOutcome... o) {
        return PointsFile.of("test", CARD.sortie(), CARD.airframe(), List.of(o), List.of(), List.of());
    }

    @Test
    void repeatsCarryWhatToCorrectAndTheCardReadsBack() {
        // LP-1 entered 8 kt fast and 400 ft low: both entry bands broken
        PointOutcome loop = flown("LP-1", Map.of("KCAS", 328.0 + 10, "Hp", 7600.0 - 100, "Nz", 4.0),
                Map.of("pull-nz", 4.0, "exit-heading-change", 0.0, "exit-hp-change", 0.0), null);
        assertEquals(Verdict.REPEAT, loop.verdict());
        PointOutcome stab = flown("TP-2", Map.of("Mach", 0.70, "Hp", 20000.0, "Nz", 1.0),
                Map.of("hp-drift", 0.0, "hold-time", 25.0), new OperatorCall("TP-2", Verdict.REPEAT,
                        "buffet felt", 5));
        TestCard next = NextCard.from(CARD, results(loop, stab));
        TestPoint lp = next.point("LP-1").orElseThrow();
        assertTrue(lp.title().contains("enter 18 kt slower (was 338 kt, band 320 +/- 10 kt)"), lp.title());
        assertTrue(lp.title().contains("enter 500 ft higher (was 7500 ft, band 8000 +/- 300 ft)"), lp.title());
        assertTrue(next.point("TP-2").orElseThrow().title().contains("engineer: buffet felt"),
                "a repeat called by the engineer carries the engineer's words");
        assertEquals(CARD.points().size(), next.points().size(), "nothing was called good: every point stays");
        TestCard back = CardFiles.parse(CardFiles.toYaml(next), "next.yaml", DICT);
        assertEquals(next, back, "the loader accepts the card written");
        assertEquals(CARD.limits(), back.limits());
    }

    @Test
    void goodPointsLeaveAndTheRestIsOrderedByAltitudeBandThenKind() {
        PointOutcome loop = flown("LP-1", Map.of("KCAS", 320.0, "Hp", 8000.0, "Nz", 4.0),
                Map.of("pull-nz", 4.0, "exit-heading-change", 0.0, "exit-hp-change", 0.0), null);
        assertEquals(Verdict.GOOD, loop.verdict(), loop.reasons().toString());
        TestCard next = NextCard.from(CARD, results(loop));
        List<String> ids = next.points().stream().map(TestPoint::id).toList();
        assertTrue(!ids.contains("LP-1"));
        // 10,000 to 15,000 ft (stalls, sideslip and roll at 12,000 ft, the 10,000 ft stabilised point, in kind
        // order), then 15,000 to 20,000 (wind-up, level acceleration, doublet, phugoid), then 20,000 (TP-2)
        assertEquals(List.of("SL-1", "SL-2", "ST-1", "SS-1", "AR-1", "TP-1", "WUT-1", "LA-1", "PD-1", "PH-1", "TP-2"),
                ids);
        assertEquals("not flown", next.notes().lines().filter(l -> l.startsWith("SL-1:")).findFirst()
                .orElseThrow().substring(6));
    }

    @Test
    void aCardWithEveryPointGoodHasNoNextCard() {
        TestCard one = new TestCard("S-2", "veskarn-02", "", "", List.of(), List.of(CARD.point("LP-1").orElseThrow()));
        PointOutcome loop = flown("LP-1", Map.of("KCAS", 320.0, "Hp", 8000.0, "Nz", 4.0),
                Map.of("pull-nz", 4.0, "exit-heading-change", 0.0, "exit-hp-change", 0.0), null);
        PointsFile r = PointsFile.of("t", "S-2", "veskarn-02", List.of(loop), List.of(), List.of());
        PointcallException e = assertThrows(PointcallException.class, () -> NextCard.from(one, r));
        assertEquals("every point of card S-2 was called good: no next card", e.getMessage());
    }
}
