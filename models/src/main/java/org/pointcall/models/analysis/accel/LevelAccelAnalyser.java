package org.pointcall.models.analysis.accel;

import java.util.List;
import java.util.Locale;
import java.util.Map;

import org.pointcall.models.analysis.ManoeuvreAnalyser;
import org.pointcall.models.analysis.ManoeuvreResult;
import org.pointcall.models.analysis.PointHistory;
import org.pointcall.models.analysis.ResultBuilder;
import org.pointcall.models.analysis.Series;
import org.pointcall.shared.kind.ManoeuvreKind;
import org.pointcall.shared.units.Unit;

/**
 * Level acceleration: {@code start} the begin (or the hint), {@code end} the hint or the end; the altitude hold as
 * the spread of the smoothed pressure altitude (local least-squares line, 0.5 s each side), Mach at the start and
 * at the end on least-squares lines over the 1 s inside the run, the time taken, and specific excess power against
 * Mach ({@link ExcessPower}): its highest bin value ({@code ps-max}), the Mach number there
 * ({@code mach-at-ps-max}) and its mean over the run ({@code ps-mean}); the curve itself is in the notes and from
 * {@link #excessPower}.
 */
public final class LevelAccelAnalyser implements ManoeuvreAnalyser {
    @Override
    public ManoeuvreKind kind() {
        return ManoeuvreKind.LEVEL_ACCEL;
    }

    @Override
    public List<String> parameters() {
        return List.of("Hp", "Mach", "KTAS");
    }

    @Override
    public ManoeuvreResult analyse(PointHistory history, long beginNs, long endNs, Map<String, Long> hintedInstantsNs,
                                   Map<String, Double> bandIntervalsS) {
        ResultBuilder r = new ResultBuilder(kind());
        double[] span = span(beginNs, endNs, hintedInstantsNs);
        double start = span[0];
        double end = span[1];
        r.instant("start", beginNs, start);
        r.instant("end", beginNs, end);
        r.metric("duration", end - start, "time from the start to the end of the run");
        if (history.has("Hp")) {
            Series hp = Series.cleanOf(history, "Hp", beginNs).smoothed(0.5).between(start, end);
            int lo = hp.argMin(start, end);
            int hi = hp.argMax(start, end);
            r.metric("hp-spread", lo >= 0 ? hp.v(hi) - hp.v(lo) : Double.NaN,
                    "highest minus lowest pressure altitude (smoothed, 0.5 s) over the run");
        } else {
            r.note("the history lacks Hp");
        }
        if (history.has("Mach")) {
            Series mach = Series.cleanOf(history, "Mach", beginNs);
            r.metric("mach-start", mach.line(start, start + 1.0).at(start), "Mach at the start (least-squares line "
                    + "over the first 1 s)");
            r.metric("mach-end", mach.line(end - 1.0, end).at(end), "Mach at the end (least-squares line over the "
                    + "last 1 s)");
        } else {
            r.note("the history lacks Mach");
        }
        ExcessPower ps = excessPower(history, beginNs, endNs, hintedInstantsNs);
        if (ps.size() > 0) {
            double[] m = ps.mach();
            double[] p = ps.psMps();
            int best = 0;
            double sum = 0;
            for (int i = 0; i < p.length; i++) {
                best = p[i] > p[best] ? i : best;
                sum += p[i];
            }
            String method = "specific excess power dh/dt + (V/g) dV/dt, rates on local least-squares lines (1 s), "
                    + "in Mach bins of " + ExcessPower.BIN_MACH;
            r.metric("ps-max", p[best], method);
            r.metric("mach-at-ps-max", m[best], "Mach bin of the highest specific excess power");
            r.metric("ps-mean", sum / p.length, method + ", mean over the bins");
            StringBuilder b = new StringBuilder("specific excess power against Mach (ft/s):");
            for (int i = 0; i < m.length; i++) {
                b.append(String.format(Locale.ROOT, " M%.2f %.0f", m[i], Unit.FOOT_PER_SECOND.fromSi(p[i])));
            }
            r.note(b.toString());
        } else {
            r.note("specific excess power not computed (needs Hp, KTAS and Mach over the run)");
        }
        return r.build();
    }

    /** The Ps-against-Mach curve of the run, empty when the history lacks Hp, KTAS or Mach. */
    public ExcessPower excessPower(PointHistory history, long beginNs, long endNs, Map<String, Long> hints) {
        if (!history.has("Hp") || !history.has("KTAS") || !history.has("Mach")) {
            return new ExcessPower(new double[0], new double[0]);
        }
        double[] span = span(beginNs, endNs, hints);
        return ExcessPower.of(Series.cleanOf(history, "Hp", beginNs), Series.cleanOf(history, "KTAS", beginNs),
                Series.cleanOf(history, "Mach", beginNs).smoothed(0.5), span[0], span[1]);
    }

    private static double[] span(long beginNs, long endNs, Map<String, Long> hints) {
        Long s = hints.get("start");
        Long e = hints.get("end");
        double start = s == null ? 0.0 : (s - beginNs) * 1e-9;
        double end = e == null ? (endNs - beginNs) * 1e-9 : (e - beginNs) * 1e-9;
        return new double[] {start, end};
    }
}
