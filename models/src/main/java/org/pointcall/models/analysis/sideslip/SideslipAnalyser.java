package org.pointcall.models.analysis.sideslip;

import java.util.List;
import java.util.Map;

import org.pointcall.models.analysis.LineFit;
import org.pointcall.models.analysis.ManoeuvreAnalyser;
import org.pointcall.models.analysis.ManoeuvreResult;
import org.pointcall.models.analysis.PointHistory;
import org.pointcall.models.analysis.ResultBuilder;
import org.pointcall.models.analysis.Series;
import org.pointcall.shared.kind.ManoeuvreKind;

/**
 * Steady-heading sideslip: the rudder and aileron gradients as least-squares slopes of each control position
 * against the sideslip angle over every sample of the point (both directions, so the slope is the static gradient
 * through trim); {@code max-beta} the largest magnitude of the 1 s running mean of the sideslip (held, not a
 * transient), at the centre of that second.
 */
public final class SideslipAnalyser implements ManoeuvreAnalyser {
    @Override
    public ManoeuvreKind kind() {
        return ManoeuvreKind.SIDESLIP;
    }

    @Override
    public List<String> parameters() {
        return List.of("AoS", "Rudder", "Aileron");
    }

    @Override
    public ManoeuvreResult analyse(PointHistory history, long beginNs, long endNs, Map<String, Long> hintedInstantsNs,
                                   Map<String, Double> bandIntervalsS) {
        ResultBuilder r = new ResultBuilder(kind());
        if (!history.has("AoS")) {
            r.note("no sideslip angle in the history: the sideslip is not analysed");
            return r.build();
        }
        double endS = (endNs - beginNs) * 1e-9;
        Series beta = Series.cleanOf(history, "AoS", beginNs).between(0.0, endS);
        Series held = beta.smoothed(0.5);
        double best = -1;
        double at = Double.NaN;
        for (int i = 0; i < beta.size(); i++) {
            double t = beta.t(i);
            if (t < 0.5 || t > endS - 0.5) {
                continue;
            }
            double m = Math.abs(beta.mean(t - 0.5, t + 0.5));
            if (m > best) {
                best = m;
                at = t;
            }
        }
        r.instant("max-beta", beginNs, at);
        r.metric("max-beta", best >= 0 ? best : Double.NaN, "largest magnitude of the 1 s running mean of sideslip");
        for (String control : List.of("Rudder", "Aileron")) {
            String metric = control.toLowerCase(java.util.Locale.ROOT) + "-per-beta";
            if (!history.has(control)) {
                r.note(metric + ": not computed (the history lacks " + control + ")");
                continue;
            }
            Series c = Series.cleanOf(history, control, beginNs).between(0.0, endS);
            double[] x = new double[c.size()];
            double[] y = new double[c.size()];
            for (int i = 0; i < x.length; i++) {
                x[i] = held.size() > 0 ? beta.at(c.t(i)) : Double.NaN;
                y[i] = c.v(i);
            }
            r.metric(metric, LineFit.of(x, y).slope(), "least-squares slope of " + control.toLowerCase(
                    java.util.Locale.ROOT) + " position against sideslip over the point, deg per deg");
        }
        return r.build();
    }
}
