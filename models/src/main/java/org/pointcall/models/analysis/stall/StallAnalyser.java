package org.pointcall.models.analysis.stall;

import java.util.List;
import java.util.Map;

import org.pointcall.models.analysis.LineFit;
import org.pointcall.models.analysis.ManoeuvreAnalyser;
import org.pointcall.models.analysis.ManoeuvreResult;
import org.pointcall.models.analysis.PointHistory;
import org.pointcall.models.analysis.ResultBuilder;
import org.pointcall.models.analysis.Series;
import org.pointcall.shared.kind.ManoeuvreKind;
import org.pointcall.shared.units.Units;

/**
 * Stall, wings level or turning.
 *
 * <ul>
 * <li>{@code break}: the highest angle of attack (smoothed by a local least-squares line over 0.1 s each side,
 *     then the highest raw sample within 0.1 s of that) between the begin and the end, searched within 3 s of the
 *     detector's hint when there is one;</li>
 * <li>{@code entry-rate}: least-squares slope of KCAS over the band's interval before the break (10 s by default,
 *     not before the begin), sign turned so that slowing is positive;</li>
 * <li>{@code stall-kcas}: KCAS at the break, read on that same least-squares line (the entry is a steady
 *     deceleration, so the line averages the noise without lag);</li>
 * <li>{@code altitude-loss}: pressure altitude at the break (least-squares line over the 1 s before it) minus the
 *     lowest smoothed one at the bottom of the recovery, the
 *     first point after a real descent (at least 1 m/s, or 3 m below the break) where the smoothed climb rate is
 *     back to zero; {@code recovery} is that instant and {@code recovery-time} its distance from the break;</li>
 * <li>{@code wing-drop}: largest bank change from the break to the recovery; {@code max-aoa} from the smoothed AoA,
 *     {@code nz-at-break} on a least-squares line over the 0.25 s before the break;</li>
 * <li>turning only, {@code bank-at-break}, and {@code stall-kcas-1g}: the 1-g equivalent stall speed
 *     {@code Vs / sqrt(n)} at the break's load factor ({@code Vs_n = Vs sqrt(n)}, Anderson, Introduction to Flight),
 *     so a turning stall's speed can be set against the wings-level one's.</li>
 * </ul>
 */
public final class StallAnalyser implements ManoeuvreAnalyser {
    static final double DEFAULT_ENTRY_RATE_S = 10.0;
    private static final double HINT_SEARCH_S = 3.0;
    private static final double DESCENT_MPS = 1.0;
    private static final double DESCENT_M = 3.0;
    /** Values at the break are read on the approach side: the break is where they start to change. */
    private static final double APPROACH_S = 0.25;

    private final ManoeuvreKind kind;

    public StallAnalyser(ManoeuvreKind kind) {
        if (kind != ManoeuvreKind.STALL_LEVEL && kind != ManoeuvreKind.STALL_TURN) {
            throw new IllegalArgumentException("a stall analyser serves stalls, not " + kind.key());
        }
        this.kind = kind;
    }

    @Override
    public ManoeuvreKind kind() {
        return kind;
    }

    @Override
    public List<String> parameters() {
        return List.of("AoA", "KCAS", "Hp", "Nz", "Roll");
    }

    @Override
    public ManoeuvreResult analyse(PointHistory history, long beginNs, long endNs, Map<String, Long> hintedInstantsNs,
                                   Map<String, Double> bandIntervalsS) {
        ResultBuilder r = new ResultBuilder(kind);
        for (String p : parameters()) {
            if (!history.has(p)) {
                r.note("the history lacks " + p + "; metrics that need it are not computed");
            }
        }
        if (!history.has("AoA") || history.isEmpty()) {
            r.note("no angle of attack: the break cannot be found");
            return r.build();
        }
        double endS = (endNs - beginNs) * 1e-9;
        Series aoa = Series.cleanOf(history, "AoA", beginNs).smoothed(0.1);
        double from = 0.0;
        double to = endS;
        Long hint = hintedInstantsNs.get("break");
        if (hint != null) {
            double h = (hint - beginNs) * 1e-9;
            from = Math.max(0.0, h - HINT_SEARCH_S);
            to = Math.min(endS, h + HINT_SEARCH_S);
        }
        int brk = aoa.argMax(from, to);
        if (brk < 0) {
            r.note("no angle of attack between the begin and the end: the break cannot be found");
            return r.build();
        }
        // a local line rounds a sharp peak off towards its gentler side: the raw maximum near it is the break
        Series raw = Series.cleanOf(history, "AoA", beginNs);
        int peak = raw.argMax(aoa.t(brk) - 0.1, aoa.t(brk) + 0.1);
        double tBreak = peak >= 0 ? raw.t(peak) : aoa.t(brk);
        r.instant("break", beginNs, tBreak);
        int top = aoa.argMax(0.0, endS);
        r.metric("max-aoa", aoa.v(top), "highest angle of attack, smoothed by a local least-squares line (0.1 s)");

        double over = interval(bandIntervalsS);
        if (history.has("KCAS")) {
            Series kcas = Series.cleanOf(history, "KCAS", beginNs);
            LineFit entry = kcas.line(Math.max(0.0, tBreak - over), tBreak);
            r.metric("entry-rate", -entry.slope(), String.format(java.util.Locale.ROOT,
                    "least-squares slope of KCAS over the %.1f s before the break, slowing positive", over));
            r.metric("stall-kcas", entry.at(tBreak),
                    "KCAS at the break on the least-squares line of the entry");
        }
        if (history.has("Nz")) {
            Series nz = Series.cleanOf(history, "Nz", beginNs);
            double n = nz.line(tBreak - APPROACH_S, tBreak).at(tBreak);
            r.metric("nz-at-break", n, "normal load factor at the break, on a least-squares line over the "
                    + APPROACH_S + " s before it");
            if (kind == ManoeuvreKind.STALL_TURN && r.hasMetric("stall-kcas")) {
                double vs = r.metricSi("stall-kcas");
                r.metric("stall-kcas-1g", n > 0 ? vs / Math.sqrt(n) : Double.NaN,
                        "1-g equivalent stall speed Vs / sqrt(n), n the load factor at the break",
                        "load factor at the break not positive");
            }
        }
        double tRecovery = Double.NaN;
        if (history.has("Hp")) {
            Series hp = Series.cleanOf(history, "Hp", beginNs);
            Series climb = hp.slopes(0.5);
            Series hpSmooth = hp.smoothed(0.5);
            double hBreak = hp.line(tBreak - 1.0, tBreak).at(tBreak);
            int i = hp.firstAtOrAfter(tBreak);
            boolean down = false;
            int bottom = -1;
            for (; i < hp.size() && hp.t(i) <= endS; i++) {
                double c = climb.v(i);
                down |= c < -DESCENT_MPS || hpSmooth.v(i) < hBreak - DESCENT_M;
                if (down && c >= 0.0) {
                    bottom = i;
                    break;
                }
            }
            if (bottom < 0) {
                bottom = hpSmooth.argMin(tBreak, endS);
                if (bottom >= 0) {
                    r.note("the climb rate was not back to zero before the end: recovery taken at the lowest point");
                }
            }
            if (bottom >= 0) {
                // the lowest smoothed altitude near the turn-round (the zero crossing of the slope is its minimum)
                int low = hpSmooth.argMin(hp.t(bottom) - 0.5, hp.t(bottom) + 0.5);
                tRecovery = hp.t(bottom);
                r.instant("recovery", beginNs, tRecovery);
                r.metric("altitude-loss", hBreak - hpSmooth.v(low),
                        "pressure altitude at the break (least-squares line over the 1 s before it) minus the "
                                + "lowest in the recovery (local least-squares line, 0.5 s each side)");
                r.metric("recovery-time", tRecovery - tBreak,
                        "time from the break to the bottom of the recovery (smoothed climb rate back to zero)");
            }
        }
        if (history.has("Roll")) {
            Series roll = Series.angleOf(history, "Roll", beginNs);
            double phiBreak = roll.at(tBreak);
            if (Double.isFinite(tRecovery)) {
                double drop = 0.0;
                for (int i = roll.firstAtOrAfter(tBreak); i < roll.size() && roll.t(i) <= tRecovery; i++) {
                    drop = Math.max(drop, Math.abs(roll.v(i) - phiBreak));
                }
                r.metric("wing-drop", drop, "largest change of bank angle from the break to the recovery");
            }
            if (kind == ManoeuvreKind.STALL_TURN) {
                r.metric("bank-at-break", Math.IEEEremainder(phiBreak, 2 * Math.PI), "bank angle at the break");
            }
        }
        return r.build();
    }

    private static double interval(Map<String, Double> bandIntervalsS) {
        Double v = bandIntervalsS.get("KCAS");
        if (v == null) {
            v = bandIntervalsS.get("entry-rate");
        }
        return v != null && v > 0 ? v : DEFAULT_ENTRY_RATE_S;
    }

    /** Seconds to nanoseconds, for callers building hints. */
    static long ns(double s) {
        return Math.round(s * Units.NS_PER_S);
    }
}
