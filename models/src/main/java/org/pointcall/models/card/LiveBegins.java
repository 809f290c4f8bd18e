package org.pointcall.models.card;

import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Set;

import org.pointcall.ingest.sim.truth.PointTruth;
import org.pointcall.ingest.sim.truth.SortieTruth;
import org.pointcall.models.metrics.TimingSummary;
import org.pointcall.shared.outcome.SessionEvent;

/**
 * How soon a card session showed each true point as begun: for every point of a sortie's truth, the first begin the
 * session reported naming its card point (a {@link SessionEvent.PointStarted} that was not withdrawn later), after
 * the previous true point's end and before its own end; the latency is that begin's data time minus the true begin.
 * What the engineer sees live, with the card. Single-threaded; one instance per evaluation.
 */
public final class LiveBegins {
    /** A flag this close to the true begin, either side, counts as on time, s (the detector's live target). */
    public static final double ON_TIME_S = 1.0;
    private final List<Double> latency = new ArrayList<>();
    private final java.util.Map<String, List<Double>> byKind = new java.util.TreeMap<>();
    private final java.util.Map<String, Integer> pointsByKind = new java.util.TreeMap<>();
    private int points;
    private int flagged;
    private int onTime;
    private int withdrawn;
    private final List<String> details = new ArrayList<>();

    /** The events one session emitted, in order, and the sortie's truth. */
    public void add(SortieTruth truth, List<SessionEvent> events) {
        Set<Long> gone = new HashSet<>();
        for (SessionEvent e : events) {
            if (e instanceof SessionEvent.PointWithdrawn w) {
                gone.add(w.detection());
                withdrawn++;
            }
        }
        double previousEndS = Double.NEGATIVE_INFINITY;
        for (PointTruth p : truth.points()) {
            points++;
            pointsByKind.merge(p.kind(), 1, Integer::sum);
            double first = Double.NaN;
            for (SessionEvent e : events) {
                if (e instanceof SessionEvent.PointStarted s && p.cardId() != null && p.cardId().equals(s.cardId())
                        && !gone.contains(s.detection())) {
                    double t = s.timeNs() / 1e9;
                    if (t > previousEndS && t < p.endS()) {
                        first = t;
                        break;
                    }
                }
            }
            previousEndS = p.endS();
            details.add(String.format(Locale.ROOT, "live.point: %s %s %s true begin %.2f s, shown %s", truth.sortie(),
                    p.cardId(), p.kind(), p.beginS(), Double.isNaN(first) ? "never"
                    : String.format(Locale.ROOT, "at %.2f s (%+.2f s)", first, first - p.beginS())));
            if (Double.isNaN(first)) {
                continue;
            }
            flagged++;
            double l = first - p.beginS();
            latency.add(l);
            byKind.computeIfAbsent(p.kind(), k -> new ArrayList<>()).add(l);
            if (Math.abs(l) <= ON_TIME_S) {
                onTime++;
            }
        }
    }

    public int points() {
        return points;
    }

    public int flagged() {
        return flagged;
    }

    /** Fraction of all true points flagged within {@link #ON_TIME_S} of their begin. */
    public double onTimeFraction() {
        return points == 0 ? Double.NaN : (double) onTime / points;
    }

    public TimingSummary summary() {
        double[] l = new double[latency.size()];
        for (int i = 0; i < l.length; i++) {
            l[i] = latency.get(i);
        }
        return TimingSummary.of(l);
    }

    /** One {@code live.point:} line per true point: when it began and when the session showed it begun. */
    public List<String> details() {
        return List.copyOf(details);
    }

    /** {@code name: value} lines. */
    public List<String> lines() {
        TimingSummary s = summary();
        List<String> out = new ArrayList<>();
        out.add("live.points: " + points);
        out.add("live.flagged: " + flagged);
        out.add("live.withdrawn: " + withdrawn);
        out.add(String.format(Locale.ROOT, "live.begin-latency.median-s: %.2f", s.medianS()));
        out.add(String.format(Locale.ROOT, "live.begin-latency.p95-s: %.2f", s.p95S()));
        out.add(String.format(Locale.ROOT, "live.begin-latency.abs-p95-s: %.2f", s.absP95S()));
        out.add(String.format(Locale.ROOT, "live.within-1s: %.4f", onTimeFraction()));
        for (java.util.Map.Entry<String, Integer> k : pointsByKind.entrySet()) {
            List<Double> l = byKind.getOrDefault(k.getKey(), List.of());
            double[] v = l.stream().mapToDouble(Double::doubleValue).toArray();
            long on = l.stream().filter(x -> Math.abs(x) <= ON_TIME_S).count();
            out.add(String.format(Locale.ROOT, "live.%s.median-s: %.2f", k.getKey(), TimingSummary.of(v).medianS()));
            out.add(String.format(Locale.ROOT, "live.%s.within-1s: %.4f", k.getKey(), (double) on / k.getValue()));
        }
        return out;
    }
}
