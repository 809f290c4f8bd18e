package org.pointcall.models.card;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;

import org.junit.jupiter.api.Test;
import org.pointcall.ingest.sim.truth.PointTruth;
import org.pointcall.ingest.sim.truth.SortieTruth;
import org.pointcall.shared.outcome.PointOutcome;
import org.pointcall.shared.outcome.Reason;
import org.pointcall.shared.outcome.Verdict;

/** How the card verdicts of a played sortie are scored against its truth. */
class VerdictAgreementTest {
    private static final long S = 1_000_000_000L;

    private static PointTruth truth(String id, String kind, double b, double e, boolean inside) {
        return new PointTruth(id, kind, b, e, Map.of(), Map.of(), Map.of(), List.of(), inside, "none");
    }

    private static PointOutcome flown(long id, String cardId, String kind, double b, double e, Verdict v) {
        List<Reason> why = v == Verdict.GOOD ? List.of()
                : List.of(new Reason("KCAS", "entry KCAS 158 kt, band 150 +/- 5 kt"));
        return new PointOutcome(id, cardId, kind, cardId == null ? kind : cardId, Math.round(b * S),
                Math.round(e * S), 0.9, v, why, List.of(), List.of(), Map.of(), List.of(), null);
    }

    @Test
    void agreementIsCountedOnTheDetectedPointsAndOnAllAndEveryMissIsNamed() {
        SortieTruth t = new SortieTruth(SortieTruth.FORMAT, "veskarn-02", "T-1", 1, 64, 600, false, 0, 0, 0, List.of(
                truth("LP-1", "loop", 100, 120, true),
                truth("LP-2", "loop", 200, 220, true),
                truth("TP-1", "stabilised", 300, 330, true),
                truth("SL-1", "stall-level", 400, 440, false)));
        List<PointOutcome> outcomes = List.of(
                flown(1, "LP-1", "loop", 101, 121, Verdict.GOOD),
                flown(2, "LP-2", "loop", 199, 219, Verdict.REPEAT),
                // a stall flown, but bound to no card point: unplanned, and SL-1 is not detected as itself
                flown(3, null, "stall-level", 401, 439, Verdict.GOOD));
        VerdictAgreement a = new VerdictAgreement();
        a.add("s1", t, outcomes);
        assertEquals(4, a.points());
        assertEquals(2, a.detected());
        assertEquals(1, a.agree());
        List<String> lines = a.lines();
        assertTrue(lines.contains("verdicts.agreement: 0.5000"), lines::toString);
        assertTrue(lines.contains("verdicts.agreement-of-all: 0.2500"), lines::toString);
        assertTrue(lines.contains("verdicts.unplanned: 1"), lines::toString);
        assertTrue(lines.contains("verdicts.disagree: s1 LP-2: truth inside; tool repeat "
                + "(entry KCAS 158 kt, band 150 +/- 5 kt)"), lines::toString);
        assertEquals(List.of("s1 TP-1 stabilised 300.0 to 330.0 s: not detected",
                "s1 SL-1 stall-level 400.0 to 440.0 s: flown as an unplanned stall-level"), a.missed());
    }
}
