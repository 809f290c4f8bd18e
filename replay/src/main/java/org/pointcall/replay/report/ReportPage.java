package org.pointcall.replay.report;

import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.util.ArrayList;
import java.util.Base64;
import java.util.List;
import java.util.Locale;
import java.util.Map;

import org.pointcall.shared.card.Band;
import org.pointcall.shared.card.SafetyLimit;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.card.TestPoint;
import org.pointcall.shared.kind.ManoeuvreKind;
import org.pointcall.shared.kind.MetricSpec;
import org.pointcall.shared.outcome.BandResult;
import org.pointcall.shared.outcome.LimitAlarm;
import org.pointcall.shared.outcome.MetricValue;
import org.pointcall.shared.outcome.Numbers;
import org.pointcall.shared.outcome.OperatorCall;
import org.pointcall.shared.outcome.PointOutcome;
import org.pointcall.shared.outcome.PointsFile;
import org.pointcall.shared.outcome.Reason;
import org.pointcall.shared.outcome.Verdict;

/**
 * The report as one XHTML document, for a browser and for the PDF layout alike: style sheet and figures inside
 * (figures as {@code data:} URIs), so the file opens offline on its own. Text is ASCII-safe for the PDF's standard
 * fonts. Machine-readable attributes ({@code data-card-id}, {@code data-verdict}, {@code data-metric},
 * {@code data-value} with the full-precision value) let a check compare the report with the points file.
 */
final class ReportPage {
    /** The caution every report carries, at its top and on its last page. */
    static final String CAUTION = "This report is an aid to the test team. It does not replace the test conductor, "
            + "the test plan's limits or the flight manual. Every verdict in it is the tool's proposal; the calls "
            + "that stand are the test team's.";

    private static final DateTimeFormatter MADE = DateTimeFormatter.ofPattern("yyyy-MM-dd HH:mm 'UTC'", Locale.ROOT)
            .withZone(ZoneOffset.UTC);

    private final DebriefContent c;
    private final PointsFile f;
    private final NextCardResult next;
    private final Map<Long, byte[]> figures;
    private final Xhtml h = new Xhtml();

    private ReportPage(DebriefContent content, NextCardResult next, Map<Long, byte[]> figures) {
        this.c = content;
        this.f = content.points();
        this.next = next;
        this.figures = figures;
    }

    /**
     * @param figures PNG bytes by point detection number; a point without one says why
     */
    static String xhtml(DebriefContent content, NextCardResult next, Map<Long, byte[]> figures) {
        return new ReportPage(content, next, figures).build();
    }

    private String sortie() {
        return f.sortie().isEmpty() ? (c.card() != null ? c.card().sortie() : f.source()) : f.sortie();
    }

    private String build() {
        h.raw("<!DOCTYPE html>\n<html xmlns=\"http://www.w3.org/1999/xhtml\" lang=\"en\">");
        h.open("head").empty("meta", "http-equiv", "Content-Type", "content", "text/html; charset=UTF-8");
        h.el("title", "Debrief " + sortie());
        h.open("style", "type", "text/css").raw(ReportStyle.css(sortie())).close("style").close("head");
        h.open("body");
        header();
        summary();
        quality();
        pointTable();
        limits();
        calls();
        nextCard();
        details();
        closing();
        h.close("body").raw("</html>\n");
        return h.toString();
    }

    private void header() {
        h.el("h1", "Debrief of sortie " + sortie());
        List<String> sub = new ArrayList<>();
        if (!f.airframe().isEmpty()) {
            sub.add("airframe " + f.airframe());
        }
        sub.add("made " + MADE.format(c.madeAt()) + " by " + c.tool());
        h.el("p", String.join("  |  ", sub), "class", "sub");
        caution("caution-top");
    }

    private void caution(String id) {
        h.open("div", "class", "caution", "id", id).el("strong", "Caution. ").text(CAUTION).close("div");
    }

    // ------------------------------------------------------------------------------------ summary

    private void summary() {
        h.el("h2", "1. Sortie");
        h.open("table", "class", "facts");
        TestCard card = c.card();
        fact("Sortie", sortie());
        fact("Airframe", f.airframe().isEmpty() ? "not given" : f.airframe());
        if (card != null && !card.area().isEmpty()) {
            fact("Test area", card.area());
        }
        fact("Card", c.cardName() == null ? (card == null ? "none given: points are listed without verdicts"
                : card.sortie()) : c.cardName() + (card == null ? "" : " (" + card.points().size() + " points)"));
        fact("Recording", f.source().isEmpty() ? "not named" : f.source());
        DataQuality q = c.quality();
        if (q != null) {
            fact("Data span", seconds(q.firstNs()) + " to " + seconds(q.lastNs()) + " s of data time ("
                    + clock(q.durationS()) + ")");
        }
        fact("Detector model", c.model() == null ? "as recorded with the results" : c.model());
        fact("Points flown", flownLine());
        fact("Card points not flown", f.sortie().isEmpty() && card == null ? "-"
                : f.notFlown().isEmpty() ? "none" : String.join(", ", f.notFlown()));
        long raised = f.alarms().stream().filter(LimitAlarm::raised).count();
        fact("Safety limits broken", raised == 0 ? "none" : raised + " time" + (raised == 1 ? "" : "s")
                + " (section 4)");
        h.close("table");
        if (card != null && !card.notes().isBlank()) {
            h.el("h3", "Card notes");
            h.el("pre", card.notes().strip(), "class", "notes");
        }
    }

    private String flownLine() {
        int good = 0;
        int repeat = 0;
        int incomplete = 0;
        int unplanned = 0;
        int unjudged = 0;
        for (PointOutcome p : f.points()) {
            if (p.cardId() == null) {
                unplanned++;
                continue;
            }
            Verdict v = p.finalCall();
            if (v == null) {
                unjudged++;
            } else if (v == Verdict.GOOD) {
                good++;
            } else if (v == Verdict.REPEAT) {
                repeat++;
            } else {
                incomplete++;
            }
        }
        List<String> parts = new ArrayList<>();
        parts.add(f.points().size() + " in all");
        parts.add(good + " good");
        parts.add(repeat + " repeat");
        parts.add(incomplete + " incomplete");
        if (unjudged > 0) {
            parts.add(unjudged + " without a verdict");
        }
        parts.add(unplanned + (f.sortie().isEmpty() && c.card() == null ? " detected (no card)" : " unplanned"));
        return String.join(", ", parts) + " (standing calls: the engineer's where given, else the tool's)";
    }

    private void fact(String name, String value) {
        h.open("tr").el("th", name).el("td", value).close("tr");
    }

    // ------------------------------------------------------------------------------------ data quality

    private void quality() {
        h.el("h2", "2. Data quality");
        DataQuality q = c.quality();
        if (q == null) {
            h.el("p", "The recording was not read for this report (give --input with the results), so its data "
                    + "quality and the figures are left out.", "class", "missing");
            return;
        }
        h.open("table", "class", "facts", "id", "quality");
        fact("Recording", q.source());
        fact("Frames", q.frames() + (Double.isFinite(q.frameStepS()) ? ", usual step "
                + Numbers.near(q.frameStepS() * 1000, 3) + " ms (" + Numbers.near(1 / q.frameStepS(), 3) + " Hz)"
                : ""));
        qualityFact("Time gaps (dropouts)", q.gapCount() == 0 ? "none"
                : q.gapCount() + ", " + Numbers.near(q.missingS(), 3) + " s with no frame in all, longest "
                + Numbers.near(q.longestGapS(), 3) + " s", q.gapCount() > 0, "gaps", Long.toString(q.gapCount()));
        if (q.rowsRead() > 0) {
            qualityFact("Rows skipped", q.rowsSkippedTotal() == 0 ? "none of " + q.rowsRead()
                    : q.rowsSkippedTotal() + " of " + q.rowsRead() + ": " + joined(q.rowsSkipped()),
                    q.rowsSkippedTotal() > 0, "rows-skipped", Long.toString(q.rowsSkippedTotal()));
        } else if (!q.rowsSkipped().isEmpty()) {
            qualityFact("Packets or frames left aside", joined(q.rowsSkipped()), true, "rejected",
                    Long.toString(q.rowsSkippedTotal()));
        }
        qualityFact("Unreadable cells", q.unreadableTotal() == 0 ? "none"
                : q.unreadableTotal() + ": " + joined(q.unreadableCells()) + " (set to NaN)",
                q.unreadableTotal() > 0, "unreadable", Long.toString(q.unreadableTotal()));
        qualityFact("Wild points rejected", q.wildPointsTotal() == 0 ? "none"
                : q.wildPointsTotal() + ": " + joined(q.wildPoints()) + " (outside the valid range, set to NaN)",
                q.wildPointsTotal() > 0, "wild-points", Long.toString(q.wildPointsTotal()));
        if (!q.flaggedFrames().isEmpty() && q.rowsRead() == 0) { // a file's reader says it all above
            qualityFact("Frames flagged by the decoder", joined(q.flaggedFrames()), true, "flagged", null);
        }
        fact("Parameters not in the recording", q.missingParameters().isEmpty() ? "none"
                : String.join(", ", q.missingParameters()) + " (NaN throughout)");
        if (!q.ignoredColumns().isEmpty()) {
            fact("Columns not in the dictionary", String.join(", ", q.ignoredColumns()) + " (ignored)");
        }
        qualityFact("Read to the end", q.complete() ? "yes" : "NO: reading stopped before the end, or the end was "
                + "cut (see below)", !q.complete(),
                "complete", Boolean.toString(q.complete()));
        h.close("table");
        if (!q.problems().isEmpty()) {
            h.el("p", "First problems, as the reader gave them:");
            h.open("ul", "class", "problems");
            for (String p : q.problems()) {
                h.el("li", p);
            }
            h.close("ul");
        }
    }

    private void qualityFact(String name, String value, boolean flagged, String key, String count) {
        h.open("tr", "data-quality", key, "data-count", count).el("th", name)
                .el("td", value, "class", flagged ? "flag" : null).close("tr");
    }

    private static String joined(Map<String, Long> m) {
        List<String> parts = new ArrayList<>();
        for (Map.Entry<String, Long> e : m.entrySet()) {
            parts.add(e.getKey() + ": " + e.getValue());
        }
        return String.join(", ", parts);
    }

    // ------------------------------------------------------------------------------------ point table

    private void pointTable() {
        h.el("h2", "3. Test points");
        h.el("p", "One row per flown point in time order, then the card points not flown. Tool: the tool's "
                + "proposal; engineer: the call taken in the control room, which stands over the tool's.", "class",
                "lead");
        h.open("table", "class", "points", "id", "points");
        h.open("thead").open("tr");
        String[] widths = {"7%", "9%", "21%", "6%", "6%", "8%", "8%", "35%"};
        List<String> cols = List.of("Point", "Kind", "Title", "From s", "To s", "Tool", "Engineer", "Reasons");
        for (int i = 0; i < cols.size(); i++) {
            h.el("th", cols.get(i), "style", "width: " + widths[i]);
        }
        h.close("tr").close("thead").open("tbody");
        for (PointOutcome p : f.points()) {
            h.open("tr", "data-detection", Long.toString(p.detection()), "data-card-id", p.cardId(), "data-verdict",
                    p.verdict() == null ? "none" : p.verdict().key(), "data-call",
                    p.operatorCall() == null ? null : p.operatorCall().call().key());
            h.open("td").open("a", "href", "#point-" + p.detection()).text(p.cardId() == null
                    ? "(unplanned)" : p.cardId()).close("a").close("td");
            h.el("td", p.kind());
            h.el("td", p.title());
            h.el("td", seconds(p.beginNs()), "class", "num");
            h.el("td", seconds(p.endNs()), "class", "num");
            h.open("td");
            verdict(p.verdict());
            h.close("td").open("td");
            verdict(p.operatorCall() == null ? null : p.operatorCall().call());
            h.close("td").open("td");
            reasons(p);
            h.close("td").close("tr");
        }
        for (String id : f.notFlown()) {
            TestPoint tp = c.card() == null ? null : c.card().point(id).orElse(null);
            h.open("tr", "data-card-id", id, "data-verdict", "not-flown", "class", "not-flown");
            h.el("td", id).el("td", tp == null ? "" : tp.kind().key()).el("td", tp == null ? "" : tp.title());
            h.el("td", "").el("td", "").open("td", "colspan", "3").text("not flown").close("td").close("tr");
        }
        h.close("tbody").close("table");
    }

    private void reasons(PointOutcome p) {
        if (p.reasons().isEmpty()) {
            h.text(p.verdict() == Verdict.GOOD ? "every band held" : "");
            return;
        }
        h.open("ul", "class", "reasons");
        for (Reason r : p.reasons()) {
            h.el("li", r.text());
        }
        h.close("ul");
    }

    private void verdict(Verdict v) {
        if (v == null) {
            h.el("span", "-", "class", "v none");
            return;
        }
        h.el("span", v.key().toUpperCase(Locale.ROOT), "class", "v " + v.key());
    }

    // ------------------------------------------------------------------------------------ limits

    private void limits() {
        h.el("h2", "4. Safety limits");
        TestCard card = c.card();
        if (card != null && !card.limits().isEmpty()) {
            List<String> ls = new ArrayList<>();
            for (SafetyLimit l : card.limits()) {
                ls.add(describe(l));
            }
            h.el("p", "Watched on every frame: " + String.join("; ", ls) + ".", "class", "lead");
        }
        if (f.alarms().isEmpty()) {
            h.el("p", "No safety limit was broken.", "id", "no-alarms");
            return;
        }
        h.open("table", "class", "points", "id", "alarms");
        h.open("thead").open("tr");
        for (String col : List.of("Time s", "Parameter", "Event", "Value", "Limit", "Peak", "During")) {
            h.el("th", col);
        }
        h.close("tr").close("thead").open("tbody");
        for (LimitAlarm a : f.alarms()) {
            String u = unit(a.unit());
            h.open("tr", "class", a.raised() ? "alarm" : null);
            h.el("td", seconds(a.timeNs()), "class", "num").el("td", a.parameter());
            h.el("td", a.raised() ? "broken" : "back inside");
            h.el("td", Numbers.near(a.value(), 4) + u, "class", "num").el("td", a.limit());
            h.el("td", a.raised() ? "" : Numbers.near(a.peak(), 4) + u, "class", "num");
            h.el("td", a.cardId() == null ? "" : a.cardId()).close("tr");
        }
        h.close("tbody").close("table");
    }

    private static String describe(SafetyLimit l) {
        String u = unit(l.unit().symbol());
        if (l.hasMin() && l.hasMax()) {
            return l.parameter() + " " + Numbers.near(l.unit().fromSi(l.minSi()), 4) + " to "
                    + Numbers.near(l.unit().fromSi(l.maxSi()), 4) + u;
        }
        return l.parameter() + (l.hasMax() ? " at most " + Numbers.near(l.unit().fromSi(l.maxSi()), 4)
                : " at least " + Numbers.near(l.unit().fromSi(l.minSi()), 4)) + u;
    }

    // ------------------------------------------------------------------------------------ calls and notes

    private void calls() {
        h.el("h2", "5. Engineer's calls and notes");
        List<PointOutcome> called = f.points().stream().filter(p -> p.operatorCall() != null).toList();
        if (called.isEmpty()) {
            h.el("p", "No call was taken in the control room for these results: every verdict above is the tool's "
                    + "proposal, for the test team to confirm or overrule.", "id", "no-calls");
        } else {
            h.open("table", "class", "points", "id", "calls");
            h.open("thead").open("tr");
            for (String col : List.of("Time s", "Point", "Tool", "Engineer", "Engineer's note")) {
                h.el("th", col);
            }
            h.close("tr").close("thead").open("tbody");
            for (PointOutcome p : called) {
                OperatorCall oc = p.operatorCall();
                h.open("tr", "data-card-id", p.cardId());
                h.el("td", seconds(oc.atNs()), "class", "num").el("td", p.cardId()).open("td");
                verdict(p.verdict());
                h.close("td").open("td");
                verdict(oc.call());
                h.close("td").el("td", oc.note().isEmpty() ? "(no note)" : oc.note()).close("tr");
            }
            h.close("tbody").close("table");
        }
        h.el("p", "The tool's own notes on each analysis (what it could not compute, why a point ended) are "
                + "with each point in section 7.", "class", "lead");
    }

    // ------------------------------------------------------------------------------------ next card

    private void nextCard() {
        h.el("h2", "6. Next sortie's card");
        if (next.card() == null) {
            h.el("p", next.why(), "id", "no-next-card");
            return;
        }
        TestCard n = next.card();
        h.el("p", "Card " + n.sortie() + ": the points never completed and those to repeat, grouped by altitude "
                + "band, then kind; written beside this report as " + next.fileName() + ".", "class", "lead");
        h.open("table", "class", "points", "id", "next-card");
        h.open("thead").open("tr").el("th", "Point", "style", "width: 8%").el("th", "Kind", "style", "width: 13%")
                .el("th", "What to fly").close("tr")
                .close("thead").open("tbody");
        for (TestPoint p : n.points()) {
            h.open("tr", "data-card-id", p.id()).el("td", p.id()).el("td", p.kind().key()).el("td", p.title())
                    .close("tr");
        }
        h.close("tbody").close("table");
    }

    // ------------------------------------------------------------------------------------ per point

    private void details() {
        h.open("div", "class", "details");
        h.el("h2", "7. Points in detail");
        h.el("p", "Figures: the point's parameters over data time. Shaded: the card point's bands over the span "
                + "each is judged on (entry: the second before the begin; throughout: begin to the end of the "
                + "technique; rate: the fan of slopes allowed before the key instant; instant: around the "
                + "instant), green where the band held, red where it did not, grey without a value. Dashed: key "
                + "instants. Grey lines: begin and end. Grey strips: time with no frame. Margin: the distance to "
                + "the band's nearer edge as a share of its width, negative outside.", "class", "lead");
        h.close("div");
        for (PointOutcome p : f.points()) {
            point(p);
        }
    }

    private void point(PointOutcome p) {
        TestPoint tp = p.cardId() == null || c.card() == null ? null : c.card().point(p.cardId()).orElse(null);
        h.open("div", "class", "point", "id", "point-" + p.detection(), "data-detection",
                Long.toString(p.detection()));
        h.open("h3").text((p.cardId() == null ? "Unplanned " + p.kind() : p.cardId()) + "  " + p.title() + "  ");
        verdict(p.finalCall());
        h.close("h3");
        List<String> line = new ArrayList<>();
        line.add(p.kind());
        line.add(seconds(p.beginNs()) + " to " + seconds(p.endNs()) + " s (" + Numbers.near((p.endNs()
                - p.beginNs()) * 1e-9, 3) + " s)");
        line.add("detection " + p.detection() + ", confidence " + Numbers.near(p.confidence(), 2));
        if (p.operatorCall() != null) {
            line.add("tool " + (p.verdict() == null ? "-" : p.verdict().key()) + ", engineer "
                    + p.operatorCall().call().key());
        }
        h.el("p", String.join("  |  ", line), "class", "sub");
        if (tp != null && !tp.config().isEmpty()) {
            h.el("p", "Configuration: " + tp.config(), "class", "config");
        }
        byte[] png = figures.get(p.detection());
        if (png != null) {
            h.open("div", "class", "figure").empty("img", "src", "data:image/png;base64,"
                    + Base64.getEncoder().encodeToString(png), "alt", "figure of " + label(p), "class", "figure")
                    .close("div");
        } else {
            h.el("p", c.trace() == null ? "No figure: the recording was not read for this report."
                    : "No figure: the recording has none of this kind's parameters.", "class", "missing");
        }
        if (!p.reasons().isEmpty()) {
            h.open("div", "class", "why").el("strong", "Not good because: ");
            for (int i = 0; i < p.reasons().size(); i++) {
                h.text((i == 0 ? "" : "; ") + p.reasons().get(i).text());
            }
            h.close("div");
        }
        bands(p, tp);
        metrics(p);
        if (p.operatorCall() != null && !p.operatorCall().note().isEmpty()) {
            h.open("p", "class", "call").el("strong", "Engineer: ").text(p.operatorCall().note()).close("p");
        }
        if (!p.notes().isEmpty()) {
            h.open("ul", "class", "tool-notes");
            for (String n : p.notes()) {
                h.el("li", n);
            }
            h.close("ul");
        }
        h.close("div");
    }

    private void bands(PointOutcome p, TestPoint tp) {
        if (p.bands().isEmpty()) {
            return;
        }
        h.open("table", "class", "points bands");
        h.open("thead").open("tr");
        for (String col : List.of("Band on", "Phase", "Band", "Value", "Margin", "Status", "Held")) {
            h.el("th", col);
        }
        h.close("tr").close("thead").open("tbody");
        for (BandResult r : p.bands()) {
            Band b = tp != null && r.index() < tp.bands().size() ? tp.bands().get(r.index()) : null;
            String phase = r.phase() + (b != null && b.instant() != null ? " " + b.instant() : "");
            h.open("tr", "data-band", Integer.toString(r.index()), "data-held", Boolean.toString(r.held()), "class",
                    r.held() ? null : "out");
            h.el("td", r.subject()).el("td", phase).el("td", r.band());
            h.el("td", r.value() == null ? "no value" : Numbers.near(r.value(), 4) + unit(r.unit()), "class", "num");
            h.el("td", r.marginFraction() == null ? "" : String.format(Locale.ROOT, "%+.0f %%",
                    r.marginFraction() * 100), "class", "num");
            String status = r.held() && r.outsideS() > 0 ? "held, outside " + Numbers.near(r.outsideS(), 2)
                    + " s (let pass)" : r.status().key() + (r.outsideS() > 0 ? ", outside "
                    + Numbers.near(r.outsideS(), 2) + " s" : "");
            h.el("td", status);
            h.el("td", r.held() ? "yes" : "NO").close("tr");
        }
        h.close("tbody").close("table");
    }

    private void metrics(PointOutcome p) {
        if (p.metrics().isEmpty()) {
            return;
        }
        ManoeuvreKind kind = ManoeuvreKind.byKey(p.kind()).orElse(null);
        h.open("table", "class", "points metrics");
        h.open("thead").open("tr").el("th", "Result", "style", "width: 17%").el("th", "Value", "style", "width: 9%")
                .el("th", "Unit", "style", "width: 7%").el("th", "How").close("tr").close("thead").open("tbody");
        List<MetricValue> extras = new ArrayList<>();
        for (MetricValue m : p.metrics()) {
            if (m.unit().equals("SI")) {
                extras.add(m); // an analysis's own extra result, left in SI: listed apart, not as a kind's metric
                continue;
            }
            String how = m.method();
            if (how.isEmpty() && kind != null) {
                for (MetricSpec ms : kind.metrics()) {
                    if (ms.name().equals(m.name())) {
                        how = ms.description();
                    }
                }
            }
            h.open("tr", "data-point", Long.toString(p.detection()), "data-metric", m.name(), "data-value",
                    Double.toString(m.value()), "data-unit", m.unit());
            h.el("td", m.name()).el("td", Numbers.near(m.value(), 4), "class", "num")
                    .el("td", m.unit().equals("1") ? "-" : m.unit()).el("td", how, "class", "how").close("tr");
        }
        h.close("tbody").close("table");
        if (!extras.isEmpty()) {
            h.open("p", "class", "extras").text("Further results of the analysis, in SI units: ");
            for (int i = 0; i < extras.size(); i++) {
                MetricValue m = extras.get(i);
                h.text(i == 0 ? "" : ", ");
                h.el("span", m.name() + " " + Numbers.near(m.value(), 4), "data-point", Long.toString(p.detection()),
                        "data-metric", m.name(), "data-value", Double.toString(m.value()), "data-unit", m.unit());
            }
            h.text(".").close("p");
        }
    }

    private void closing() {
        h.open("div", "class", "closing");
        h.el("h2", "About this report");
        h.el("p", "Points were found by the detector model in the recorded data, bound to the card in order (or "
                + "as armed), analysed by their kind's method and judged band by band in each band's phase. GOOD: "
                + "every band held and the point was completed; REPEAT: at least one band or a safety limit was "
                + "broken; INCOMPLETE: the point was abandoned or the data stopped during it. Times are the "
                + "recording's own data time, in seconds.");
        caution("caution-end");
        h.close("div");
    }

    // ------------------------------------------------------------------------------------ formats

    private static String label(PointOutcome p) {
        return p.cardId() == null ? "unplanned " + p.kind() : p.cardId();
    }

    static String seconds(long ns) {
        String s = String.format(Locale.ROOT, "%.1f", ns / 1e9);
        return s.equals("-0.0") ? "0.0" : s;
    }

    /** {@code 1:02:05} or {@code 12:05} for a duration. */
    static String clock(double s) {
        long t = Math.round(s);
        return t >= 3600 ? String.format(Locale.ROOT, "%d:%02d:%02d", t / 3600, t / 60 % 60, t % 60)
                : String.format(Locale.ROOT, "%d:%02d", t / 60, t % 60);
    }

    private static String unit(String symbol) {
        return symbol.equals("1") ? "" : " " + symbol;
    }
}
