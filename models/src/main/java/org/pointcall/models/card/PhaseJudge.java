package org.pointcall.models.card;

import java.util.Map;

import org.pointcall.models.analysis.PointHistory;
import org.pointcall.models.analysis.SlopeSums;
import org.pointcall.shared.card.Band;
import org.pointcall.shared.card.TestPoint;
import org.pointcall.shared.kind.ManoeuvreKind;
import org.pointcall.shared.outcome.BandResult;
import org.pointcall.shared.outcome.BandStatus;
import org.pointcall.shared.outcome.Numbers;
import org.pointcall.shared.outcome.Reason;

/**
 * Judges one band of a flown point on its recorded history, by phase: {@code entry} the mean over
 * {@link #ENTRY_SPAN_S} up to the begin; {@code throughout} every sample from the begin to where the kind's
 * technique ends (the stall break, the wind-up's highest g, else the end), less a lead-in before the value first
 * comes inside ({@link #LEAD_IN_S}): held when the time outside is at most {@link #TRANSIENT_S} (and, where the span
 * ends at a key instant, the value is not outside there for longer than {@link #HOLD_BRIDGE_S}) or, for a point
 * with a hold time, when one stretch inside (excursions up to {@link #HOLD_BRIDGE_S} bridged) lasts the hold;
 * {@code rate} the least-squares slope over the
 * band's interval before its key instant; {@code instant} read at the instant on the least-squares line over the
 * {@link #INSTANT_SPAN_S} up to it (a key instant is where the motion changes: a centred mean would mix in what
 * follows, the lift break's drop in Nz after a stall break);
 * {@code result} the analysis metric. No value is never held.
 */
public final class PhaseJudge {
    /**
     * Entry conditions are the mean over this span up to the begin, s: a few samples against noise, taken before
     * the technique has moved them (a live begin tends to come a little late).
     */
    public static final double ENTRY_SPAN_S = 1.0;
    /** Values at a key instant are read on a least-squares line over this span up to it, s. */
    public static final double INSTANT_SPAN_S = 0.25;
    /**
     * Time outside a throughout band that is let pass, s: transient spikes are ignored (as EASA AMC 25.103(b) does
     * for load factor in a stall entry), and a detected begin may lie a fraction of a second off the true one.
     */
    public static final double TRANSIENT_S = 1.0;
    /**
     * Outside time at the start of a throughout span, before the value first comes inside, that is not counted when
     * it ends within this of the begin, s: a detected begin can lie a few seconds before the technique is set up
     * (the gear still travelling, the bank still being rolled in).
     */
    public static final double LEAD_IN_S = 10.0;
    /**
     * A hold is one stretch inside, but an excursion no longer than this does not break it, s: a wild point or a
     * sample of sensor noise beyond a tight band (Nz +/- 0.05 g) is not the pilot losing the condition.
     */
    public static final double HOLD_BRIDGE_S = 0.25;
    /** Gaps between samples longer than this count only this much towards time outside or inside, s. */
    private static final double MAX_STEP_S = 0.5;

    private PhaseJudge() {
    }

    /** A band's result and, when it did not hold, the reason. */
    public record Judged(BandResult result, Reason reason) {
    }

    /** Where the throughout bands of a kind stop applying. */
    public static long throughoutEndNs(ManoeuvreKind kind, Map<String, Long> instantsNs, long endNs) {
        String name = keyInstantName(kind);
        Long at = name == null ? null : instantsNs.get(name);
        return at == null ? endNs : Math.min(endNs, at);
    }

    /** The key instant where a kind's throughout bands stop applying, or null when they apply to its end. */
    private static String keyInstantName(ManoeuvreKind kind) {
        return switch (kind) {
            case STALL_LEVEL, STALL_TURN -> "break";
            case WIND_UP_TURN -> "nz-max";
            default -> null;
        };
    }

    /**
     * @param metricsSi  the analysis metrics, SI
     * @param instantsNs key instants (the analysis's, else the detector's)
     */
    public static Judged judge(TestPoint point, int index, PointHistory history, long beginNs, long endNs,
                               Map<String, Long> instantsNs, Map<String, Double> metricsSi) {
        Band b = point.bands().get(index);
        double valueSi = Double.NaN;
        double outsideS = 0;
        boolean held;
        String missing = null;
        String name = b.subject();
        if (b.metric() != null) {
            Double v = metricsSi.get(b.metric());
            valueSi = v == null ? Double.NaN : v;
            held = b.contains(valueSi);
            missing = v == null ? "could not be computed" : null;
        } else if (!history.has(b.parameter())) {
            held = false;
            missing = "is not in the recording";
        } else {
            switch (b.phase()) {
                case ENTRY -> {
                    valueSi = entryValue(history, name, beginNs);
                    held = b.contains(valueSi);
                }
                case INSTANT -> {
                    Long t = instantsNs.get(b.instant());
                    if (t == null) {
                        missing = "has no value: no " + b.instant() + " was found";
                    } else {
                        valueSi = lineEnd(history, name, t - Math.round(INSTANT_SPAN_S * 1e9), t);
                    }
                    held = b.contains(valueSi);
                }
                case RATE -> {
                    Long t = instantsNs.get(b.instant());
                    if (t == null) {
                        missing = "has no value: no " + b.instant() + " was found";
                    } else {
                        valueSi = slope(history, name, t - Math.round(b.overS() * 1e9), t);
                    }
                    held = b.contains(valueSi);
                }
                case THROUGHOUT -> {
                    long toNs = throughoutEndNs(point.kind(), instantsNs, endNs);
                    Span s = span(history, name, b, beginNs, toNs);
                    valueSi = s.worstSi;
                    outsideS = s.outsideS;
                    // outside when the technique ends at its key instant (a bank growing into the stall break) is
                    // not a transient that came back: only a sample or two of noise there is let pass
                    boolean outAtInstant = toNs < endNs && s.trailingOutsideS > HOLD_BRIDGE_S;
                    held = s.samples > 0 && (point.hasHold() ? s.longestInsideS >= point.holdS() - 1e-9
                            : s.outsideS <= TRANSIENT_S && !outAtInstant);
                    if (s.samples == 0) {
                        missing = "has no samples in the point";
                    } else if (!held) {
                        missing = point.hasHold() ? holdText(b, s, point.holdS()) : outsideText(b, s)
                                + (outAtInstant ? ", still outside at the " + keyInstantName(point.kind()) : "");
                    }
                }
                default -> throw new IllegalStateException("a parameter band has no phase " + b.phase());
            }
            if (Double.isNaN(valueSi) && missing == null) {
                missing = "has no value (no valid samples)";
            }
        }
        double margin = marginFraction(b, valueSi);
        BandStatus status = BandStatus.ofMargin(margin);
        if (b.phase() == org.pointcall.shared.card.BandPhase.THROUGHOUT && !held && !Double.isNaN(margin)) {
            status = BandStatus.OUT;
        }
        Double value = Double.isNaN(valueSi) ? null : b.unit().fromSi(valueSi);
        BandResult r = new BandResult(index, name, b.phase().key(), b.unit().symbol(), b.describe(), value,
                Double.isNaN(margin) ? null : margin, status, held, outsideS);
        if (held) {
            return new Judged(r, null);
        }
        String what = label(b);
        String text = missing != null && (b.phase() != org.pointcall.shared.card.BandPhase.THROUGHOUT
                || value == null) ? what + " " + missing + ", band " + b.describe()
                : missing != null ? missing
                : what + " " + inUnit(b, valueSi) + ", band " + b.describe();
        return new Judged(r, new Reason(name, text));
    }

    /** {@code entry KCAS}, {@code Nz at break}, {@code KCAS rate before break}, {@code stall-kcas}. */
    static String label(Band b) {
        return switch (b.phase()) {
            case ENTRY -> "entry " + b.parameter();
            case THROUGHOUT -> b.parameter();
            case RATE -> b.parameter() + " rate before " + b.instant();
            case INSTANT -> b.parameter() + " at " + b.instant();
            case RESULT -> b.metric();
        };
    }

    /** A value in the band's unit, to the band's own scale, with its symbol. */
    static String inUnit(Band b, double si) {
        String u = b.unit().symbol().equals("1") ? "" : " " + b.unit().symbol();
        return Numbers.scaled(b.unit().fromSi(si), widthInUnit(b)) + u;
    }

    private static String outsideText(Band b, Span s) {
        return b.parameter() + " outside " + b.describe() + " for " + Numbers.scaled(s.outsideS, 1) + " s, reached "
                + inUnit(b, s.worstSi);
    }

    private static String holdText(Band b, Span s, double holdS) {
        return b.parameter() + " held inside " + b.describe() + " for " + Numbers.scaled(s.longestInsideS, 1)
                + " s at most, needs " + Numbers.near(holdS, 3) + " s (reached " + inUnit(b, s.worstSi) + ")";
    }

    /** The band's width in its unit; for a band open on one side, the size of its edge (1 when the edge is 0). */
    static double widthInUnit(Band b) {
        double lo = b.lowSi();
        double hi = b.highSi();
        if (Double.isFinite(lo) && Double.isFinite(hi)) {
            return b.unit().deltaFromSi(hi - lo);
        }
        double edge = Math.abs(b.unit().fromSi(Double.isFinite(lo) ? lo : hi));
        return edge > 0 ? edge : 1.0;
    }

    /**
     * Signed distance of {@code valueSi} to the band's nearer edge as a fraction of {@link #widthInUnit}: positive
     * inside, negative outside; NaN for NaN.
     */
    public static double marginFraction(Band b, double valueSi) {
        if (Double.isNaN(valueSi)) {
            return Double.NaN;
        }
        double lo = b.lowSi();
        double hi = b.highSi();
        double d = Math.min(valueSi - lo, hi - valueSi); // an open side is infinitely far
        return b.unit().deltaFromSi(d) / widthInUnit(b);
    }

    /** The entry value: the mean over {@link #ENTRY_SPAN_S} up to the begin, the condition the point starts from. */
    static double entryValue(PointHistory h, String name, long beginNs) {
        return mean(h, name, beginNs - Math.round(ENTRY_SPAN_S * 1e9), beginNs);
    }

    /** Mean of the finite samples from {@code fromNs} to {@code toNs}; NaN when there is none. */
    static double mean(PointHistory h, String name, long fromNs, long toNs) {
        double sum = 0;
        int n = 0;
        for (int i = h.firstAtOrAfter(fromNs); i < h.size() && h.timeNs(i) <= toNs; i++) {
            double v = h.valueSi(name, i);
            if (Double.isFinite(v)) {
                sum += v;
                n++;
            }
        }
        return n == 0 ? Double.NaN : sum / n;
    }

    /** Least-squares slope, per second, of the finite samples from {@code fromNs} to {@code toNs}; NaN under 3. */
    static double slope(PointHistory h, String name, long fromNs, long toNs) {
        return fit(h, name, fromNs, toNs).slope();
    }

    /**
     * The least-squares line of the finite samples from {@code fromNs} to {@code toNs}, read at {@code toNs}; their
     * mean under 3 samples.
     */
    static double lineEnd(PointHistory h, String name, long fromNs, long toNs) {
        double v = fit(h, name, fromNs, toNs).at((toNs - fromNs) * 1e-9);
        return Double.isNaN(v) ? mean(h, name, fromNs, toNs) : v;
    }

    /** Least-squares sums of the finite samples from {@code fromNs} to {@code toNs}, time in s from {@code fromNs}. */
    private static SlopeSums fit(PointHistory h, String name, long fromNs, long toNs) {
        SlopeSums fit = new SlopeSums();
        for (int i = h.firstAtOrAfter(fromNs); i < h.size() && h.timeNs(i) <= toNs; i++) {
            double v = h.valueSi(name, i);
            if (Double.isFinite(v)) {
                fit.add((h.timeNs(i) - fromNs) * 1e-9, v);
            }
        }
        return fit;
    }

    /** A throughout band on a parameter {@code h} records: one that says what the point's condition is. */
    static boolean onCondition(Band b, PointHistory h) {
        return b.phase() == org.pointcall.shared.card.BandPhase.THROUGHOUT && b.parameter() != null
                && h.has(b.parameter());
    }

    /**
     * For a point with a hold time: the earliest time, no earlier than {@code floorNs} nor the hold time before
     * {@code beginNs}, from which every throughout band with a recorded parameter stayed inside up to
     * {@code beginNs} (samples without a value tell nothing); {@code beginNs} itself when one was outside at the
     * begin. A stabilised point is on condition before the classifier has seen enough of the hold to call it, and the
     * hold counts from when it was.
     */
    public static long onConditionSince(TestPoint point, PointHistory h, long beginNs, long floorNs) {
        long from = Math.max(floorNs, beginNs - Math.round(point.holdS() * 1e9));
        long since = from;
        boolean any = false;
        for (Band b : point.bands()) {
            if (!onCondition(b, h)) {
                continue;
            }
            any = true;
            long earliest = beginNs;
            int i = h.firstAtOrAfter(beginNs);
            if (i >= h.size()) {
                i = h.size() - 1;
            }
            for (; i >= 0 && h.timeNs(i) >= from; i--) {
                double v = h.valueSi(b.parameter(), i);
                if (!Double.isFinite(v)) {
                    continue;
                }
                if (!b.contains(v)) {
                    break;
                }
                earliest = Math.min(earliest, h.timeNs(i));
            }
            since = Math.max(since, earliest);
        }
        return any ? Math.min(since, beginNs) : beginNs;
    }

    private static final class Span {
        int samples;
        double outsideS;
        double longestInsideS;
        double worstSi = Double.NaN;
        boolean entered;
        /** The time outside since the last sample inside, at the span's end, s (0 when it ends inside). */
        double trailingOutsideS;
    }

    private static Span span(PointHistory h, String name, Band b, long fromNs, long toNs) {
        Span s = new Span();
        double worstMargin = Double.POSITIVE_INFINITY;
        double run = 0;
        double out = 0;
        long prevNs = Long.MIN_VALUE;
        long leadInNs = Math.round(LEAD_IN_S * 1e9);
        for (int i = h.firstAtOrAfter(fromNs); i < h.size() && h.timeNs(i) <= toNs; i++) {
            double v = h.valueSi(name, i);
            if (!Double.isFinite(v)) {
                continue; // not sampled in this frame, a dropout or a rejected wild point: tells nothing
            }
            long t = h.timeNs(i);
            // the time since the previous sample goes to this sample's side of the edge
            double stepS = prevNs == Long.MIN_VALUE ? 0 : Math.min(MAX_STEP_S, (t - prevNs) * 1e-9);
            prevNs = t;
            s.samples++;
            double m = Math.min(v - b.lowSi(), b.highSi() - v);
            if (m < worstMargin) {
                worstMargin = m;
                s.worstSi = v;
            }
            if (b.contains(v)) {
                if (!s.entered) {
                    s.entered = true;
                    if (t - fromNs <= leadInNs) {
                        s.outsideS = 0; // still setting up: the detected begin came early
                        worstMargin = m;
                        s.worstSi = v;
                    }
                }
                if (out > 0 && out <= HOLD_BRIDGE_S) {
                    run += out; // a wild point or a noise sample does not break a hold
                }
                out = 0;
                run += stepS;
                s.longestInsideS = Math.max(s.longestInsideS, run);
            } else {
                s.outsideS += stepS;
                out += stepS;
                if (out > HOLD_BRIDGE_S) {
                    run = 0;
                }
            }
        }
        s.trailingOutsideS = out;
        return s;
    }
}
