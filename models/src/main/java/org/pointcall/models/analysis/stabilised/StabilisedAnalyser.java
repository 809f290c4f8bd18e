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
 * <li>the steady window: pressure altitude and KCAS, sampled every 0.25 s (so their sensor noise is independent
 *     from sample to sample: the test judges a drift against that noise), each through the filtered variance-ratio
 *     test of Cao and Rhinehart ({@link VarianceRatioTest}, recommended factors); the longest run of samples steady
 *     in both (unsteady stretches under 1 s inside it bridged: the ratio has false alarms), within the point,
 *     stretched back by the filters' memory (10 samples: a ratio turns steady only once the filtered deviation has
 *     forgotten the transient) but not before the begin; {@code start} and {@code end} its edges and
 *     {@code steady-time} its length. When the filters could not warm up within the point's pre-roll or no block is
 *     steady, the whole point is taken, with a note;</li>
 * <li>{@code hold-time}: the point's own length, begin to end. A card point flown from its condition begins when
 *     every throughout band is inside and ends when one breaks, so this is the time the condition was held (the
 *     steady window is usually shorter: the test calls the settling still inside the bands unsteady, which is right
 *     for choosing what to average and wrong for timing the hold);</li>
 * <li>drift rates: least-squares slopes over the window of pressure altitude, KCAS and (unwrapped) heading;</li>
 * <li>time-averaged conditions: mean and standard deviation over the window of Hp, KCAS, Mach, Nz, AoA and AoS
 *     ({@code <name>-mean}, {@code <name>-std}).</li>
 * </ul>
 */
public final class StabilisedAnalyser implements ManoeuvreAnalyser {
    /** Sampling interval of the test: sensor noise stays independent from sample to sample at this spacing. */
    private static final double BLOCK_S = 0.25;
    /** Unsteady stretches shorter than this (1 s) inside a steady run are bridged. */
    private static final int BRIDGE_SAMPLES = 4;
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
                + "variance ratio on Hp and KCAS every 0.25 s)", a, b);
        r.metric("hold-time", endS, "time from the point's begin to its end (on a card point flown from its condition:"
                + " the time every throughout band was inside)");
        r.metric("steady-time", b - a, "length of the steady window (Cao-Rhinehart filtered variance-ratio test)");
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
        // test instants laid from the begin backwards into the pre-roll, so that one falls on the begin
        int before = (int) Math.floor(-first / BLOCK_S);
        int count = before + (int) Math.floor(endS / BLOCK_S);
        double origin = -before * BLOCK_S;
        double[] hp = blocks(Series.cleanOf(history, "Hp", beginNs), origin, count);
        double[] kcas = blocks(Series.cleanOf(history, "KCAS", beginNs), origin, count);
        boolean[] sh = test.steady(hp);
        boolean[] sk = test.steady(kcas);
        boolean[] ok = new boolean[count];
        for (int i = 0; i < count; i++) {
            ok[i] = sh[i] && sk[i] && Double.isFinite(hp[i]) && Double.isFinite(kcas[i]);
        }
        // the ratio itself is noisy: a few unsteady samples inside a steady run are its false alarms, not a change
        for (int i = 0; i < count; i++) {
            if (!ok[i]) {
                int j = i;
                while (j < count && !ok[j]) {
                    j++;
                }
                if (i > 0 && j < count && j - i < BRIDGE_SAMPLES) {
                    for (int k = i; k < j; k++) {
                        ok[k] = true;
                    }
                }
                i = j;
            }
        }
        int bestStart = -1;
        int bestLen = 0;
        int runStart = -1;
        for (int i = 0; i <= count; i++) {
            boolean steady = i < count && ok[i];
            if (steady && runStart < 0) {
                runStart = i;
            } else if (!steady && runStart >= 0) {
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

    /** The sample nearest each test instant (not averaged: averaging would shrink the noise the test scales by). */
    private static double[] blocks(Series s, double origin, int count) {
        double[] out = new double[count];
        for (int i = 0; i < count; i++) {
            int k = s.nearest(origin + i * BLOCK_S);
            out[i] = k >= 0 && Math.abs(s.t(k) - (origin + i * BLOCK_S)) <= BLOCK_S ? s.v(k) : Double.NaN;
        }
        return out;
    }
}
