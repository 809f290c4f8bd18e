package org.pointcall.models.card;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import org.pointcall.shared.card.Band;
import org.pointcall.shared.card.BandPhase;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.card.TestPoint;
import org.pointcall.shared.error.PointcallException;
import org.pointcall.shared.outcome.BandResult;
import org.pointcall.shared.outcome.Numbers;
import org.pointcall.shared.outcome.PointOutcome;
import org.pointcall.shared.outcome.PointsFile;
import org.pointcall.shared.outcome.Reason;
import org.pointcall.shared.outcome.Verdict;
import org.pointcall.shared.units.Dimension;
import org.pointcall.shared.units.Unit;

/**
 * The next sortie's card from a sortie's results: the points never completed and the points whose standing call
 * (the engineer's, else the tool's) is repeat, each repeat with what to correct, computed from its band results
 * ("enter 8 kt slower"). Ordered to save fuel and time: by altitude band ({@link #ALTITUDE_BAND_FT} of the point's
 * pressure-altitude band), then by kind, then as on the old card. Limits, airframe and area are kept.
 */
public final class NextCard {
    /** Width of the altitude bands points are grouped by, ft. */
    public static final double ALTITUDE_BAND_FT = 5000;

    private NextCard() {
    }

    /**
     * @throws PointcallException when every point was called good (no card to fly), or the results are of
     *                            another card
     */
    public static TestCard from(TestCard card, PointsFile results) {
        if (!results.sortie().isEmpty() && !results.sortie().equals(card.sortie())) {
            throw new PointcallException("the results are of sortie " + results.sortie() + ", the card is "
                    + card.sortie());
        }
        record Entry(TestPoint point, int order, double altitudeFt) {
        }
        List<Entry> keep = new ArrayList<>();
        Map<String, List<String>> corrections = new LinkedHashMap<>();
        for (int i = 0; i < card.points().size(); i++) {
            TestPoint p = card.points().get(i);
            PointOutcome last = null;
            for (PointOutcome o : results.points()) {
                if (p.id().equals(o.cardId()) && o.finalCall() != null && o.finalCall() != Verdict.INCOMPLETE) {
                    last = o;
                }
            }
            if (last != null && last.finalCall() == Verdict.GOOD) {
                continue;
            }
            TestPoint next = p;
            if (last != null) {
                List<String> fix = corrections(p, last);
                corrections.put(p.id(), fix);
                next = new TestPoint(p.id(), p.kind(), oneLine(p.title() + " (repeat: " + String.join("; ", fix)
                        + ")"), p.config(), p.holdS(), p.bands());
            } else {
                corrections.put(p.id(), List.of("not flown"));
            }
            keep.add(new Entry(next, i, altitudeFt(p)));
        }
        if (keep.isEmpty()) {
            throw new PointcallException("every point of card " + card.sortie() + " was called good: no next card");
        }
        keep.sort(Comparator.comparingDouble((Entry e) -> Math.floor(e.altitudeFt() / ALTITUDE_BAND_FT))
                .thenComparingInt(e -> e.point().kind().ordinal()).thenComparingInt(Entry::order));
        StringBuilder notes = new StringBuilder("Next card after sortie " + card.sortie() + ": "
                + keep.size() + " of " + card.points().size() + " points, grouped by altitude band, then kind.\n");
        for (Entry e : keep) {
            notes.append(e.point().id()).append(": ").append(String.join("; ", corrections.get(e.point().id())))
                    .append('\n');
        }
        if (!card.notes().isEmpty()) {
            notes.append(card.notes());
        }
        return new TestCard(card.sortie() + "-next", card.airframe(), card.area(), notes.toString().strip(),
                card.limits(), keep.stream().map(Entry::point).toList());
    }

    /** What to correct on a repeat: one item per band that did not hold, and per other reason. */
    static List<String> corrections(TestPoint p, PointOutcome o) {
        List<String> out = new ArrayList<>();
        for (BandResult r : o.bands()) {
            if (r.held() || r.index() >= p.bands().size()) {
                continue;
            }
            out.add(correction(p.bands().get(r.index()), r));
        }
        for (Reason reason : o.reasons()) {
            if (reason.subject().startsWith("limit:")) {
                out.add("stay inside the limits (" + reason.text() + ")");
            }
        }
        if (o.operatorCall() != null && o.operatorCall().call() == Verdict.REPEAT) {
            if (!o.operatorCall().note().isEmpty()) {
                out.add("engineer: " + o.operatorCall().note());
            } else if (out.isEmpty()) {
                out.add("repeat called by the engineer");
            }
        }
        if (out.isEmpty()) {
            for (Reason reason : o.reasons()) {
                out.add(reason.text());
            }
        }
        return out;
    }

    /** {@code enter 8 kt slower}, {@code hold Roll inside 0 +/- 5 deg (reached 12 deg)}... */
    static String correction(Band b, BandResult r) {
        if (r.value() == null) {
            return PhaseJudge.label(b) + ": no value last time, band " + b.describe();
        }
        Unit u = b.unit();
        double value = r.value();
        if (b.phase() == BandPhase.THROUGHOUT) {
            return "hold " + b.parameter() + " inside " + b.describe() + " (reached " + inUnit(b, value) + ")";
        }
        double aim = aim(b);
        double d = aim - value;
        String amount = Numbers.scaled(Math.abs(d), PhaseJudge.widthInUnit(b)) + (u.symbol().equals("1") ? ""
                : " " + u.symbol());
        if (b.phase() == BandPhase.ENTRY) {
            return "enter " + amount + " " + words(b, d) + " (was " + inUnit(b, value) + ", band " + b.describe()
                    + ")";
        }
        return PhaseJudge.label(b) + " " + amount + " " + words(b, d) + " (was " + inUnit(b, value) + ", band "
                + b.describe() + ")";
    }

    /** The value to aim at, in the band's unit: the target, the middle of a closed range, or an open range's edge. */
    static double aim(Band b) {
        Unit u = b.unit();
        if (b.isTarget()) {
            return u.fromSi(b.targetSi());
        }
        if (Double.isFinite(b.lowSi()) && Double.isFinite(b.highSi())) {
            return u.fromSi((b.lowSi() + b.highSi()) / 2);
        }
        return u.fromSi(Double.isFinite(b.lowSi()) ? b.lowSi() : b.highSi());
    }

    private static String words(Band b, double d) {
        boolean up = d > 0;
        Dimension dim = b.unit().dimension();
        if (b.phase() == BandPhase.ENTRY && (dim == Dimension.SPEED || b.unit() == Unit.MACH)) {
            return up ? "faster" : "slower";
        }
        if (dim == Dimension.LENGTH) {
            return up ? "higher" : "lower";
        }
        return up ? "more" : "less";
    }

    private static String inUnit(Band b, double value) {
        return Numbers.scaled(value, PhaseJudge.widthInUnit(b)) + (b.unit().symbol().equals("1") ? ""
                : " " + b.unit().symbol());
    }

    /** The middle of the point's pressure-altitude band, ft; points without one go last. */
    static double altitudeFt(TestPoint p) {
        for (Band b : p.bands()) {
            if ("Hp".equals(b.parameter()) && b.phase() != BandPhase.RATE) {
                double lo = b.lowSi();
                double hi = b.highSi();
                double mid = Double.isFinite(lo) && Double.isFinite(hi) ? (lo + hi) / 2 : Double.isFinite(lo) ? lo : hi;
                return Unit.FOOT.fromSi(mid);
            }
        }
        return Double.MAX_VALUE;
    }

    private static String oneLine(String s) {
        return s.replaceAll("\\s+", " ").strip();
    }
}
