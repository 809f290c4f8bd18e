package org.pointcall.models.analysis.windup;

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
 * Wind-up turn: {@code nz-max} the instant of the highest load factor (found on a local least-squares line, 0.25 s
 * each side, then read within 0.3 s of it on one of 0.03 s, since a wind-up often ends on a brief peak); from the begin to it, the Mach hold as the mean and the spread (highest minus lowest) of the
 * smoothed Mach number, the angle of attack at the highest load factor, and the least-squares slope of the load
 * factor against the angle of attack over every sample pair, in g per degree.
 */
public final class WindUpTurnAnalyser implements ManoeuvreAnalyser {
    @Override
    public ManoeuvreKind kind() {
        return ManoeuvreKind.WIND_UP_TURN;
    }

    @Override
    public List<String> parameters() {
        return List.of("Nz", "Mach", "AoA");
    }

    @Override
    public ManoeuvreResult analyse(PointHistory history, long beginNs, long endNs, Map<String, Long> hintedInstantsNs,
                                   Map<String, Double> bandIntervalsS) {
        ResultBuilder r = new ResultBuilder(kind());
        if (!history.has("Nz")) {
            r.note("no load factor in the history: the wind-up turn is not analysed");
            return r.build();
        }
        double endS = (endNs - beginNs) * 1e-9;
        Series nz = Series.cleanOf(history, "Nz", beginNs).smoothed(0.25);
        int top = nz.argMax(0.0, endS);
        if (top < 0) {
            r.note("no load factor between the begin and the end");
            return r.build();
        }
        // the wind-up may end on a brief peak that the 0.25 s line rounds off: the peak is read lightly smoothed
        Series fine = Series.cleanOf(history, "Nz", beginNs).smoothed(0.03);
        int peak = fine.argMax(nz.t(top) - 0.3, Math.min(endS, nz.t(top) + 0.3));
        double tTop = peak >= 0 ? fine.t(peak) : nz.t(top);
        r.instant("nz-max", beginNs, tTop);
        r.metric("nz-max", peak >= 0 ? fine.v(peak) : nz.v(top), "highest load factor, found on a local "
                + "least-squares line over 0.25 s each side and read within 0.3 s of it on one over 0.03 s");
        if (history.has("Mach")) {
            Series mach = Series.cleanOf(history, "Mach", beginNs).smoothed(0.25).between(0.0, tTop);
            double lo = Double.POSITIVE_INFINITY;
            double hi = Double.NEGATIVE_INFINITY;
            for (int i = 0; i < mach.size(); i++) {
                lo = Math.min(lo, mach.v(i));
                hi = Math.max(hi, mach.v(i));
            }
            r.metric("mach-mean", mach.mean(0.0, tTop), "mean Mach number from the begin to the highest load factor");
            r.metric("mach-spread", mach.size() > 0 ? hi - lo : Double.NaN,
                    "highest minus lowest Mach number (smoothed, 0.25 s) from the begin to the highest load factor");
        }
        if (history.has("AoA")) {
            Series aoa = Series.cleanOf(history, "AoA", beginNs);
            r.metric("aoa-at-nz-max", aoa.smoothed(0.05).at(tTop), "angle of attack at the highest load factor");
            Series rawNz = Series.cleanOf(history, "Nz", beginNs).between(0.0, tTop);
            double[] x = new double[rawNz.size()];
            double[] y = new double[rawNz.size()];
            for (int i = 0; i < x.length; i++) {
                x[i] = aoa.at(rawNz.t(i));
                y[i] = rawNz.v(i);
            }
            LineFit f = LineFit.of(x, y);
            r.metric("nz-per-aoa", f.slope() * Math.PI / 180.0,
                    "least-squares slope of load factor against angle of attack from the begin to the highest "
                            + "load factor, g per degree");
        }
        return r.build();
    }
}
