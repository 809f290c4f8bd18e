package org.pointcall.models.metrics;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;

import org.pointcall.shared.error.Plain;
import org.pointcall.shared.kind.ManoeuvreKind;

/**
 * The result of {@link EventScoring#score}: matches, counts and scores per kind and overall, timing errors of the
 * matched points, the live-begin latency and the rate of false points. Immutable.
 */
public final class EventScore {
    private final List<TruePoint> truth;
    private final List<DetectedPoint> detected;
    private final List<EventMatch> matches;
    private final double minIou;
    private final double spanS;
    private final double nonPointS;
    private final Map<ManoeuvreKind, KindScore> perKind;
    private final KindScore overall;
    private final TimingSummary beginError;
    private final TimingSummary endError;
    private final TimingSummary liveBeginLatency;

    EventScore(List<TruePoint> truth, List<DetectedPoint> detected, List<EventMatch> matches, double minIou,
               double spanBeginS, double spanEndS) {
        this.truth = truth;
        this.detected = detected;
        this.matches = List.copyOf(matches);
        this.minIou = minIou;
        this.spanS = spanEndS - spanBeginS;
        this.nonPointS = spanS - coveredS(truth, spanBeginS, spanEndS);

        int kinds = ManoeuvreKind.values().length;
        int[] nt = new int[kinds];
        int[] nd = new int[kinds];
        int[] nm = new int[kinds];
        for (TruePoint p : truth) {
            nt[p.kind().ordinal()]++;
        }
        for (DetectedPoint p : detected) {
            nd[p.kind().ordinal()]++;
        }
        double[] begin = new double[matches.size()];
        double[] end = new double[matches.size()];
        List<Double> latency = new ArrayList<>();
        for (int i = 0; i < matches.size(); i++) {
            EventMatch m = matches.get(i);
            TruePoint tp = truth.get(m.truth());
            DetectedPoint dp = detected.get(m.detected());
            nm[tp.kind().ordinal()]++;
            begin[i] = dp.beginS() - tp.beginS();
            end[i] = dp.endS() - tp.endS();
            if (!Double.isNaN(dp.reportedAtS())) {
                latency.add(dp.reportedAtS() - tp.beginS());
            }
        }
        Map<ManoeuvreKind, KindScore> pk = new EnumMap<>(ManoeuvreKind.class);
        for (ManoeuvreKind k : ManoeuvreKind.values()) {
            int o = k.ordinal();
            if (nt[o] + nd[o] > 0) {
                pk.put(k, new KindScore(nt[o], nd[o], nm[o]));
            }
        }
        this.perKind = java.util.Collections.unmodifiableMap(pk);
        this.overall = new KindScore(truth.size(), detected.size(), matches.size());
        this.beginError = TimingSummary.of(begin);
        this.endError = TimingSummary.of(end);
        double[] lat = new double[latency.size()];
        for (int i = 0; i < lat.length; i++) {
            lat[i] = latency.get(i);
        }
        this.liveBeginLatency = TimingSummary.of(lat);
    }

    /** Length of the union of the true intervals inside the span, s. */
    private static double coveredS(List<TruePoint> truth, double b, double e) {
        List<TruePoint> sorted = new ArrayList<>(truth);
        sorted.sort(Comparator.comparingDouble(TruePoint::beginS));
        double covered = 0;
        double reach = b;
        for (TruePoint p : sorted) {
            double from = Math.max(p.beginS(), reach);
            double to = Math.min(p.endS(), e);
            if (to > from) {
                covered += to - from;
                reach = to;
            }
        }
        return covered;
    }

    public List<TruePoint> truth() {
        return truth;
    }

    public List<DetectedPoint> detected() {
        return detected;
    }

    /** Matches in true-point order. */
    public List<EventMatch> matches() {
        return matches;
    }

    public double minIou() {
        return minIou;
    }

    /** Kinds with at least one true or detected point. */
    public Map<ManoeuvreKind, KindScore> perKind() {
        return perKind;
    }

    public KindScore overall() {
        return overall;
    }

    /** Detected minus true begin of the matched points. */
    public TimingSummary beginError() {
        return beginError;
    }

    /** Detected minus true end of the matched points. */
    public TimingSummary endError() {
        return endError;
    }

    /**
     * First live report of the begin minus the true begin, over the matched points reported live: how long after
     * a point began the room knew of it ({@code medianS} and {@code p95S}; negative when a begin was reported
     * before the labelled begin).
     */
    public TimingSummary liveBeginLatency() {
        return liveBeginLatency;
    }

    /** Scored time outside every true point (transit and the rest), s. */
    public double nonPointS() {
        return nonPointS;
    }

    /** Unmatched detections per hour of non-point time; NaN when there is no non-point time. */
    public double falsePointsPerHour() {
        return nonPointS > 0 ? overall.falsePoints() / (nonPointS / 3600.0) : Double.NaN;
    }

    /** {@code name: value} lines, overall first, then per kind, timings and false points. */
    public List<String> lines() {
        List<String> out = new ArrayList<>();
        out.add("events.min-iou: " + Plain.of(minIou));
        add(out, "events.", overall);
        for (Map.Entry<ManoeuvreKind, KindScore> e : perKind.entrySet()) {
            add(out, "events." + e.getKey().key() + ".", e.getValue());
        }
        add(out, "events.begin-error", beginError);
        add(out, "events.end-error", endError);
        out.add("events.live-begin-latency.count: " + liveBeginLatency.count());
        out.add("events.live-begin-latency.median-s: " + Plain.of(liveBeginLatency.medianS()));
        out.add("events.live-begin-latency.p95-s: " + Plain.of(liveBeginLatency.p95S()));
        out.add("events.false-points: " + overall.falsePoints());
        out.add("events.non-point-hours: " + Plain.of(nonPointS / 3600.0));
        out.add("events.false-points-per-hour: " + Plain.of(falsePointsPerHour()));
        return out;
    }

    private static void add(List<String> out, String prefix, KindScore s) {
        out.add(prefix + "true: " + s.truePoints());
        out.add(prefix + "detected: " + s.detected());
        out.add(prefix + "matched: " + s.matched());
        out.add(prefix + "precision: " + Plain.of(s.precision()));
        out.add(prefix + "recall: " + Plain.of(s.recall()));
        out.add(prefix + "f1: " + Plain.of(s.f1()));
    }

    private static void add(List<String> out, String prefix, TimingSummary t) {
        out.add(prefix + ".median-s: " + Plain.of(t.medianS()));
        out.add(prefix + ".abs-median-s: " + Plain.of(t.absMedianS()));
        out.add(prefix + ".abs-p95-s: " + Plain.of(t.absP95S()));
    }
}
