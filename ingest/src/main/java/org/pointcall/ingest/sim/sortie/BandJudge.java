package org.pointcall.ingest.sim.sortie;

import java.util.Map;

import org.pointcall.ingest.sim.truth.BandTruth;
import org.pointcall.shared.card.Band;
import org.pointcall.shared.kind.ManoeuvreKind;
import org.pointcall.shared.kind.MetricSpec;

/**
 * Judges one band of a flown point on the exact trajectory, by its phase: {@code entry} the value at the begin;
 * {@code throughout} every sample from the begin to where the kind's technique ends (the stall break, the
 * wind-up's highest g, otherwise the end), reporting the sample furthest outside, or the one nearest an edge when
 * all are inside; {@code rate} the least-squares slope over {@code overS} before the named instant;
 * {@code instant} the value at the instant; {@code result} the metric. A parameter the simulator does not produce,
 * a missing instant or an uncomputable metric gives a NaN value, judged outside.
 */
final class BandJudge {
    private BandJudge() {
    }

    static BandTruth judge(Band band, Trajectory tr, double beginS, double throughoutEndS,
                           Map<String, Double> instants, Map<String, Double> metricsSi) {
        double si = valueSi(band, tr, beginS, throughoutEndS, instants, metricsSi);
        double value = Double.isNaN(si) ? Double.NaN : band.unit().fromSi(si);
        // a rate band is in the unit of a rate: its fromSi is linear, as is any delta
        return new BandTruth(band.subject(), band.phase().key(), value, band.unit().symbol(), band.describe(),
                band.contains(si));
    }

    private static double valueSi(Band band, Trajectory tr, double beginS,
                                  double throughoutEndS, Map<String, Double> instants,
                                  Map<String, Double> metricsSi) {
        if (band.metric() != null) {
            Double v = metricsSi.get(band.metric());
            return v == null ? Double.NaN : v;
        }
        int ch = Trajectory.channelOf(band.parameter());
        if (ch < 0 || tr.size() == 0) {
            return Double.NaN;
        }
        switch (band.phase()) {
            case ENTRY:
                return tr.get(ch, tr.indexAt(beginS));
            case THROUGHOUT: {
                int i0 = tr.indexAt(beginS);
                int i1 = tr.indexAt(throughoutEndS);
                double worst = Double.POSITIVE_INFINITY;
                double at = Double.NaN;
                for (int i = i0; i <= i1; i++) {
                    double v = tr.get(ch, i);
                    double margin = Math.min(v - band.lowSi(), band.highSi() - v);
                    if (Double.isNaN(v)) {
                        return Double.NaN;
                    }
                    if (margin < worst || Double.isNaN(at)) {
                        worst = margin;
                        at = v;
                    }
                }
                return at;
            }
            case RATE: {
                Double t = instants.get(band.instant());
                if (t == null) {
                    return Double.NaN;
                }
                int i1 = tr.indexAt(t);
                int i0 = tr.indexAt(t - band.overS());
                return Fits.rate(tr, ch, i0, i1);
            }
            case INSTANT: {
                Double t = instants.get(band.instant());
                return t == null ? Double.NaN : tr.get(ch, tr.indexAt(t));
            }
            default:
                return Double.NaN;
        }
    }

    /** Metrics in the registry's units, from SI. */
    static Map<String, Double> inRegistryUnits(ManoeuvreKind kind, Map<String, Double> metricsSi) {
        Map<String, Double> out = new java.util.TreeMap<>();
        for (MetricSpec ms : kind.metrics()) {
            Double v = metricsSi.get(ms.name());
            if (v != null) {
                out.put(ms.name(), ms.unit().fromSi(v));
            }
        }
        return out;
    }
}
