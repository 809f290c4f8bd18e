package org.pointcall.models.analysis.roll;

import java.util.List;
import java.util.Map;

import org.pointcall.models.analysis.ManoeuvreAnalyser;
import org.pointcall.models.analysis.ManoeuvreResult;
import org.pointcall.models.analysis.PointHistory;
import org.pointcall.models.analysis.ResultBuilder;
import org.pointcall.models.analysis.Series;
import org.pointcall.shared.kind.ManoeuvreKind;

/**
 * Aileron roll: {@code input} the detector's hint, else where the aileron leaves its trim on the way to the roll's
 * deflection ({@link #aileronInput}); the bank angle change accumulated from the input (unwrapped, across telemetry gaps on the branch the roll rate
 * implies), {@code time-to-90} and
 * {@code time-to-360} the first instants it reaches 90 and 360 deg ({@code roll-end} the latter), interpolated
 * between samples; between the input and the roll's end, the peak roll rate (smoothed over 0.05 s each side), the
 * largest sideslip (0.1 s) and the pressure-altitude change (0.25 s).
 */
public final class AileronRollAnalyser implements ManoeuvreAnalyser {
    @Override
    public ManoeuvreKind kind() {
        return ManoeuvreKind.AILERON_ROLL;
    }

    @Override
    public List<String> parameters() {
        return List.of("Roll", "P", "AoS", "Hp", "Aileron");
    }

    @Override
    public ManoeuvreResult analyse(PointHistory history, long beginNs, long endNs, Map<String, Long> hintedInstantsNs,
                                   Map<String, Double> bandIntervalsS) {
        ResultBuilder r = new ResultBuilder(kind());
        double endS = (endNs - beginNs) * 1e-9;
        double input = Double.NaN;
        Long hint = hintedInstantsNs.get("input");
        if (hint != null) {
            input = (hint - beginNs) * 1e-9;
        } else if (history.has("Aileron")) {
            input = aileronInput(Series.cleanOf(history, "Aileron", beginNs).between(0.0, endS));
        }
        if (Double.isNaN(input)) {
            input = 0.0;
            r.note("no aileron input found: the roll is timed from the begin");
        }
        r.instant("input", beginNs, input);
        if (!history.has("Roll")) {
            r.note("no bank angle in the history: the roll is not timed");
            return r.build();
        }
        Series phi = unwrappedBank(history, beginNs);
        double phi0 = phi.at(input);
        double at90 = Double.NaN;
        double at360 = Double.NaN;
        for (int i = Math.max(1, phi.firstAtOrAfter(input)); i < phi.size() && phi.t(i) <= endS; i++) {
            double a = Math.abs(phi.v(i - 1) - phi0);
            double b = Math.abs(phi.v(i) - phi0);
            if (Double.isNaN(at90) && b >= Math.PI / 2) {
                at90 = cross(phi.t(i - 1), a, phi.t(i), b, Math.PI / 2);
            }
            if (b >= 2 * Math.PI) {
                at360 = cross(phi.t(i - 1), a, phi.t(i), b, 2 * Math.PI);
                break;
            }
        }
        r.instant("roll-end", beginNs, at360);
        r.metric("time-to-90", at90 - input, "time from the input to 90 deg of bank change", "bank never changed 90 deg");
        r.metric("time-to-360", at360 - input, "time from the input to 360 deg of bank change",
                "bank never changed 360 deg");
        double stop = Double.isFinite(at360) ? at360 : endS;
        if (history.has("P")) {
            Series p = Series.cleanOf(history, "P", beginNs).smoothed(0.05).between(input, stop);
            double peak = Double.NaN;
            for (int i = 0; i < p.size(); i++) {
                peak = Double.isNaN(peak) ? Math.abs(p.v(i)) : Math.max(peak, Math.abs(p.v(i)));
            }
            r.metric("peak-roll-rate", peak, "largest roll rate magnitude (smoothed, 0.05 s) from the input to the "
                    + "roll's end");
            Series rawP = Series.cleanOf(history, "P", beginNs).between(input, stop);
            double top = 0;
            int atTop = 0;
            for (int i = 0; i < rawP.size(); i++) {
                top = Math.max(top, Math.abs(rawP.v(i)));
            }
            for (int i = 0; i < rawP.size(); i++) {
                atTop += Math.abs(rawP.v(i)) >= top - 1e-9 ? 1 : 0;
            }
            if (atTop >= 3) {
                r.note(String.format(java.util.Locale.ROOT, "roll rate held at %.1f deg/s for %d samples: the "
                        + "transducer may be at its range limit, so the peak is a lower bound", Math.toDegrees(top),
                        atTop));
            }
        }
        if (history.has("AoS")) {
            Series beta = Series.cleanOf(history, "AoS", beginNs).smoothed(0.1).between(input, stop);
            double most = Double.NaN;
            for (int i = 0; i < beta.size(); i++) {
                most = Double.isNaN(most) ? Math.abs(beta.v(i)) : Math.max(most, Math.abs(beta.v(i)));
            }
            r.metric("max-beta", most, "largest sideslip magnitude (smoothed, 0.1 s) during the roll");
        }
        if (history.has("Hp") && Double.isFinite(at360)) {
            Series hp = Series.cleanOf(history, "Hp", beginNs).smoothed(0.25);
            r.metric("hp-change", hp.at(at360) - hp.at(input), "pressure altitude at the roll's end minus at the "
                    + "input (smoothed, 0.25 s)");
        }
        return r.build();
    }

    /**
     * Bank angle unwrapped through the roll. Across a telemetry gap the bank may have turned more than half a turn,
     * so the branch is the one nearest the roll rate's integral over the gap (the mean of the rates either side
     * times its length), not the nearest angle.
     */
    static Series unwrappedBank(PointHistory history, long beginNs) {
        Series raw = Series.of(history, "Roll", beginNs, history.firstNs(), history.lastNs());
        Series p = history.has("P") ? Series.cleanOf(history, "P", beginNs) : null;
        double[] t = raw.times();
        double[] v = raw.values();
        double[] u = new double[v.length];
        for (int i = 0; i < v.length; i++) {
            if (i == 0) {
                u[i] = v[i];
                continue;
            }
            double d = Math.IEEEremainder(v[i] - v[i - 1], 2 * Math.PI);
            if (p != null && p.size() > 0) {
                double expected = 0.5 * (p.at(t[i - 1]) + p.at(t[i])) * (t[i] - t[i - 1]);
                d += 2 * Math.PI * Math.round((expected - d) / (2 * Math.PI));
            }
            u[i] = u[i - 1] + d;
        }
        return Series.of(t, u).despiked(0.25, 0.0);
    }

    private static double cross(double t0, double a, double t1, double b, double level) {
        return b == a ? t1 : t0 + (t1 - t0) * (level - a) / (b - a);
    }

    /**
     * The input: the first instant the aileron is half-way to its largest deflection from the point's first sample
     * marks the roll's own input; its trim is the median before that (the first sample may sit in a correction
     * after the set-up); the input is the first sample of the unbroken run beyond 5 % of the deflection (at least
     * 0.5 deg) from that trim which leads to the half-way instant. NaN without a deflection of at least 1 deg.
     */
    static double aileronInput(Series ail) {
        if (ail.size() == 0) {
            return Double.NaN;
        }
        double first = ail.v(0);
        double most = 0;
        for (int i = 0; i < ail.size(); i++) {
            most = Math.max(most, Math.abs(ail.v(i) - first));
        }
        if (most <= Math.toRadians(1)) {
            return Double.NaN;
        }
        int half = 0;
        while (half < ail.size() && Math.abs(ail.v(half) - first) < 0.5 * most) {
            half++;
        }
        double[] before = new double[half];
        for (int i = 0; i < half; i++) {
            before[i] = ail.v(i);
        }
        java.util.Arrays.sort(before);
        double trim = half == 0 ? first : half % 2 == 1 ? before[half / 2]
                : 0.5 * (before[half / 2 - 1] + before[half / 2]);
        double threshold = Math.max(Math.toRadians(0.5), 0.05 * most);
        int i = half;
        while (i > 0 && Math.abs(ail.v(i - 1) - trim) > threshold) {
            i--;
        }
        return ail.t(i);
    }
}
