package org.pointcall.models.card;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import org.pointcall.ingest.sim.truth.BandTruth;
import org.pointcall.ingest.sim.truth.PointTruth;
import org.pointcall.ingest.sim.truth.SortieTruth;
import org.pointcall.shared.outcome.PointOutcome;
import org.pointcall.shared.outcome.Verdict;

/**
 * The tool's verdicts against a simulated sortie's truth ("flown inside its bands or not"). A true point is
 * detected when a completed flight (good or repeat) bound to its card id overlaps its true interval; the last such
 * flight's verdict is compared: GOOD agrees with inside, REPEAT with outside. Points detected but bound to another
 * card point of the same kind are counted apart, as are abandoned ones.
 */
public final class VerdictAgreement {
    private final List<String> sorties = new ArrayList<>();
    private final List<String> disagreements = new ArrayList<>();
    private final List<String> missed = new ArrayList<>();
    private int points;
    private int detected;
    private int agree;
    private int misbound;
    private int abandoned;
    private int goodInside;
    private int goodOutside;
    private int repeatInside;
    private int repeatOutside;
    private int unplanned;

    /** Adds one sortie: its truth, and the outcomes of the session that played its recording. */
    public void add(String name, SortieTruth truth, List<PointOutcome> outcomes) {
        sorties.add(name);
        for (PointOutcome o : outcomes) {
            if (o.cardId() == null) {
                unplanned++;
            }
        }
        for (PointTruth t : truth.points()) {
            points++;
            long b = Math.round(t.beginS() * 1e9);
            long e = Math.round(t.endS() * 1e9);
            PointOutcome flown = null;
            boolean anyAbandoned = false;
            boolean other = false;
            String boundTo = null;
            for (PointOutcome o : outcomes) {
                if (o.endNs() < b || o.beginNs() > e || !o.kind().equals(t.kind())) {
                    continue;
                }
                if (t.cardId().equals(o.cardId())) {
                    if (o.verdict() == Verdict.INCOMPLETE) {
                        anyAbandoned = true;
                    } else if (o.verdict() != null) {
                        flown = o;
                    }
                } else {
                    other = true;
                    boundTo = o.cardId() == null ? "flown as an unplanned " + o.kind() : "bound to " + o.cardId();
                }
            }
            if (flown == null) {
                if (other) {
                    misbound++;
                } else if (anyAbandoned) {
                    abandoned++;
                }
                missed.add(name + " " + t.cardId() + " " + t.kind() + String.format(Locale.ROOT, " %.1f to %.1f s: ",
                        t.beginS(), t.endS()) + (other ? boundTo : anyAbandoned
                        ? "abandoned" : "not detected"));
                continue;
            }
            detected++;
            boolean good = flown.verdict() == Verdict.GOOD;
            if (good == t.inBands()) {
                agree++;
            } else {
                disagreements.add(name + " " + t.cardId() + ": truth " + (t.inBands() ? "inside" : "outside")
                        + truthWhy(t) + "; tool " + flown.verdict().key() + (flown.reasons().isEmpty() ? ""
                        : " (" + String.join("; ", flown.reasons().stream().map(r -> r.text()).toList()) + ")"));
            }
            if (good) {
                if (t.inBands()) {
                    goodInside++;
                } else {
                    goodOutside++;
                }
            } else if (t.inBands()) {
                repeatInside++;
            } else {
                repeatOutside++;
            }
        }
    }

    private static String truthWhy(PointTruth t) {
        List<String> out = new ArrayList<>();
        for (BandTruth bt : t.bands()) {
            if (!bt.inside()) {
                out.add(bt.phase() + " " + bt.subject() + " " + String.format(Locale.ROOT, "%.4g", bt.value()) + " "
                        + bt.unit() + " vs " + bt.band());
            }
        }
        return (out.isEmpty() ? "" : " (" + String.join("; ", out) + ")") + (t.flaw().equals("none") ? ""
                : " [flaw " + t.flaw() + "]");
    }

    public int points() {
        return points;
    }

    public int detected() {
        return detected;
    }

    public int agree() {
        return agree;
    }

    /** The true points with no completed flight of their own, one line each: why. */
    public List<String> missed() {
        return List.copyOf(missed);
    }

    /** Agreement on the detected points, 0 to 1 (NaN when none was detected). */
    public double agreement() {
        return detected == 0 ? Double.NaN : (double) agree / detected;
    }

    public List<String> disagreements() {
        return List.copyOf(disagreements);
    }

    /** {@code name: value} lines. */
    public List<String> lines() {
        List<String> l = new ArrayList<>();
        l.add("sorties: " + sorties.size());
        l.add("verdicts.points: " + points);
        l.add("verdicts.detected: " + detected);
        l.add("verdicts.misbound: " + misbound);
        l.add("verdicts.abandoned: " + abandoned);
        l.add("verdicts.unplanned: " + unplanned);
        l.add("verdicts.agree: " + agree);
        l.add(String.format(Locale.ROOT, "verdicts.agreement: %.4f", agreement()));
        l.add(String.format(Locale.ROOT, "verdicts.agreement-of-all: %.4f",
                points == 0 ? Double.NaN : (double) agree / points));
        l.add("verdicts.good-and-inside: " + goodInside);
        l.add("verdicts.repeat-and-outside: " + repeatOutside);
        l.add("verdicts.good-but-outside: " + goodOutside);
        l.add("verdicts.repeat-but-inside: " + repeatInside);
        for (String d : disagreements) {
            l.add("verdicts.disagree: " + d);
        }
        for (String m : missed) {
            l.add("verdicts.missed: " + m);
        }
        return l;
    }
}
