package org.pointcall.models.analysis.stabilised;

import java.util.List;
import java.util.Locale;
import java.util.Map;

import org.pointcall.models.analysis.ManoeuvreAnalyser;
import org.pointcall.models.analysis.ManoeuvreResult;
import org.pointcall.models.analysis.PointHistory;
import org.pointcall.models.analysis.ResultBuilder;
import org.pointcall.models.analysis.Series;
import org.pointcall.models.analysis.steady.VarianceRatioTest;
import org.pointcall.shared.kind.ManoeuvreKind;

/**
 * Stabilised point.
 *
 * <ul>
 * <li>the steady window: pressure altitude and KCAS, averaged over 1 s blocks (so the noise the test sees is
 *     independent from sample to sample), each through the filtered variance-ratio test of Cao and Rhinehart
 *     ({@link VarianceRatioTest}, recommended factors); the longest run of blocks steady in both, within the point,
 *     stretched back by the filters' memory (10 blocks: a ratio turns steady only once the filtered deviation has
 *     forgotten the transient) but not before the begin; {@code start} and {@code end} its edges and
 *     {@code hold-time} its length. When the filters could not warm up within the point's pre-roll or no block is
 *     steady, the whole point is taken, with a note;</li>
 * <li>drift rates: least-squares slopes over the window of pressure altitude, KCAS and (unwrapped) heading;</li>
 * <li>time-averaged conditions: mean and standard deviation over the window of Hp, KCAS, Mach, Nz, AoA and AoS
 *     ({@code <name>-mean}, {@code <name>-std}).</li>
 * </ul>
 */
public final class StabilisedAnalyser implements ManoeuvreAnalyser {
    private static final double BLOCK_S = 1.0;
    private static final List<String> AVERAGED = List.of("Hp", "KCAS", "Mach", "Nz", "AoA", "AoS");

    private final VarianceRatioTest test;

    public StabilisedAnalyser() {
        this(VarianceRatioTest.RECOMMENDED);
    }

    public StabilisedAnalyser(VarianceRatioTest test) {
        this.test = test;
    }

    @Override
    public ManoeuvreKind kind() {
        return ManoeuvreKind.STABILISED;
    }

    @Override
    public List<String> parameters() {
        return List.of("Hp", "KCAS", "Heading", "Mach", "Nz", "AoA", "AoS");
    }

    @Override
    public ManoeuvreResult analyse(PointHistory history, long beginNs, long endNs, Map<String, Long> hintedInstantsNs,
                                   Map<String, Double> bandIntervalsS) {
        ResultBuilder r = new ResultBuilder(kind());
        double endS = (endNs - beginNs) * 1e-9;
        double[] window = steadyWindow(history, beginNs, endS, r);
        double a = window[0];
        double b = window[1];
        r.instant("start", beginNs, a);
        r.instant("end", beginNs, b);
        String how = String.format(Locale.ROOT, "over the steady window %.1f to %.1f s (Cao-Rhinehart filtered "
                + "variance ratio on 1 s blocks of Hp and KCAS)", a, b);
        r.metric("hold-time", b - a, "length of the steady window (Cao-Rhinehart filtered variance-ratio test)");
        for (String[] d : new String[][] {{"Hp", "hp-drift"}, {"KCAS", "kcas-drift"}}) {
            if (history.has(d[0])) {
                r.metric(d[1], Series.cleanOf(history, d[0], beginNs).line(a, b).slope(),
                        "least-squares slope of " + d[0] + " " + how);
            }
        }
        if (history.has("Heading")) {
            r.metric("heading-drift", Series.angleOf(history, "Heading", beginNs).line(a, b).slope(),
                    "least-squares slope of the unwrapped heading " + how);
        }
        for (String p : AVERAGED) {
            if (!history.has(p)) {
                continue;
            }
            Series s = Series.cleanOf(history, p, beginNs);
            String key = p.toLowerCase(Locale.ROOT);
            r.metric(key + "-mean", s.mean(a, b), "time average of " + p + " " + how);
            r.metric(key + "-std", s.std(a, b), "standard deviation of " + p + " " + how);
        }
        return r.build();
    }

    /** {start, end} of the steady window, s from the begin. */
    double[] steadyWindow(PointHistory history, long beginNs, double endS, ResultBuilder r) {
        if (!history.has("Hp") || !history.has("KCAS") || history.isEmpty()) {
            r.note("no Hp or KCAS: the whole point is taken as the steady window");
            return new double[] {0.0, endS};
        }
        double first = (history.firstNs() - beginNs) * 1e-9;
        // blocks laid from the begin backwards into the pre-roll, so that one edge falls on the begin
        int before = (int) Math.floor(-first / BLOCK_S);
        int count = before + (int) Math.floor(endS / BLOCK_S);
        double origin = -before * BLOCK_S;
        double[] hp = blocks(Series.cleanOf(history, "Hp", beginNs), origin, count);
        double[] kcas = blocks(Series.cleanOf(history, "KCAS", beginNs), origin, count);
        boolean[] sh = test.steady(hp);
        boolean[] sk = test.steady(kcas);
        int bestStart = -1;
        int bestLen = 0;
        int runStart = -1;
        for (int i = 0; i <= count; i++) {
            boolean ok = i < count && sh[i] && sk[i] && Double.isFinite(hp[i]) && Double.isFinite(kcas[i]);
            if (ok && runStart < 0) {
                runStart = i;
            } else if (!ok && runStart >= 0) {
                int len = i - runStart;
                if (len > bestLen) {
                    bestLen = len;
                    bestStart = runStart;
                }
                runStart = -1;
            }
        }
        if (bestStart < 0) {
            r.note("no steady stretch found by the Cao-Rhinehart test: the whole point is taken");
            return new double[] {0.0, endS};
        }
        int memory = (int) Math.round(1.0 / test.l2());
        double a = Math.max(0.0, origin + (bestStart - memory) * BLOCK_S);
        double b = Math.min(endS, origin + (bestStart + bestLen) * BLOCK_S);
        if (b - a < BLOCK_S) {
            r.note("the steady stretch lies outside the point: the whole point is taken");
            return new double[] {0.0, endS};
        }
        return new double[] {a, b};
    }

    private static double[] blocks(Series s, double origin, int count) {
        double[] out = new double[count];
        for (int i = 0; i < count; i++) {
            out[i] = s.mean(origin + i * BLOCK_S, origin + (i + 1) * BLOCK_S - 1e-9);
        }
        return out;
    }
}
