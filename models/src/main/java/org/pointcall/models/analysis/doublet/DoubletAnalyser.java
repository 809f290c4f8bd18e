package org.pointcall.models.analysis.doublet;

import java.util.List;
import java.util.Locale;
import java.util.Map;

import org.pointcall.models.analysis.ControlRelease;
import org.pointcall.models.analysis.ManoeuvreAnalyser;
import org.pointcall.models.analysis.ManoeuvreResult;
import org.pointcall.models.analysis.PointHistory;
import org.pointcall.models.analysis.ResultBuilder;
import org.pointcall.models.analysis.Series;
import org.pointcall.models.analysis.handling.FlightPhaseCategory;
import org.pointcall.models.analysis.handling.HandlingLevels;
import org.pointcall.models.analysis.mode.DampedMode;
import org.pointcall.models.analysis.mode.DampedResponseFit;
import org.pointcall.models.analysis.mode.PeakRatios;
import org.pointcall.shared.kind.ManoeuvreKind;

/**
 * Pitch doublet: the short-period mode from the controls-fixed response after the release.
 *
 * <ul>
 * <li>{@code release}: the detector's hint, else the last instant the elevator stood away from where it then stayed
 *     ({@link ControlRelease}), within {@link #RELEASE_SEARCH_S} of the input when that is hinted;
 *     {@code input}: the hint, else the first instant it left its trim;</li>
 * <li>{@code sp-frequency}, {@code sp-damping}: least-squares fit of a second-order free response with an offset,
 *     one mode shared by the pitch rate, the angle of attack and the load factor (those present; each with its own
 *     offset and amplitudes, weighted by its inverse noise variance), over the 4 s from 0.05 s after the release
 *     ({@link DampedResponseFit#fitJoint}, variable projection and Levenberg-Marquardt);</li>
 * <li>{@code sp-damping-tpr}: the cross-check, the damping ratio from the transient peak ratio of the first two
 *     half-cycle peaks of the same response about the fitted offset ({@link PeakRatios}); a note when the two
 *     differ by more than 0.1;</li>
 * <li>{@code sp-level}: the MIL-F-8785C level of the fitted damping ratio (paragraph 3.2.2.1.2,
 *     {@link HandlingLevels}), in Category C with gear or flaps down, else B.</li>
 * </ul>
 */
public final class DoubletAnalyser implements ManoeuvreAnalyser {
    static final double FIT_DELAY_S = 0.05;
    static final double FIT_LENGTH_S = 4.0;
    /**
     * With a known input, its release is looked for up to this long after it: a doublet's two halves take a few
     * seconds at most (common practice), and the 2 s the control must then stay put fit in too.
     */
    static final double RELEASE_SEARCH_S = 6.0;
    private static final double ELEVATOR_FLOOR_RAD = Math.toRadians(0.2);
    /** The responses fitted together: the short period shows in all three. */
    static final List<String> RESPONSES = List.of("Q", "AoA", "Nz");

    @Override
    public ManoeuvreKind kind() {
        return ManoeuvreKind.PITCH_DOUBLET;
    }

    @Override
    public List<String> parameters() {
        return List.of("Q", "AoA", "Nz", "Elevator", "Gear", "Flap");
    }

    @Override
    public ManoeuvreResult analyse(PointHistory history, long beginNs, long endNs, Map<String, Long> hintedInstantsNs,
                                   Map<String, Double> bandIntervalsS) {
        ResultBuilder r = new ResultBuilder(kind());
        double endS = (endNs - beginNs) * 1e-9;
        Series elevator = history.has("Elevator") ? Series.cleanOf(history, "Elevator", beginNs) : null;
        double release = hint(hintedInstantsNs, "release", beginNs);
        double input = hint(hintedInstantsNs, "input", beginNs);
        if (Double.isNaN(release) && elevator != null) {
            // with the input known, the release is looked for only in the seconds after it: the pilot's next input,
            // at the end of the free response, is not the doublet's release
            double to = Double.isFinite(input) ? Math.min(endS, input + RELEASE_SEARCH_S) : endS;
            release = ControlRelease.lastMove(elevator, 0.0, to, 2.0, ELEVATOR_FLOOR_RAD);
        }
        if (Double.isNaN(input) && elevator != null && Double.isFinite(release)) {
            input = firstDeparture(elevator.between(0.0, release));
        }
        r.instant("input", beginNs, input);
        r.instant("release", beginNs, release);
        if (Double.isNaN(release)) {
            r.note("no release found (no hint and no elevator input in the point): the short period is not fitted");
            return r.build();
        }
        List<String> channels = new java.util.ArrayList<>();
        for (String c : RESPONSES) {
            if (history.has(c)) {
                channels.add(c);
            }
        }
        if (channels.isEmpty()) {
            r.note("no pitch rate, angle of attack or load factor in the history: the short period is not fitted");
            return r.build();
        }
        double t0 = release + FIT_DELAY_S;
        double t1 = Math.min(t0 + FIT_LENGTH_S, endS);
        double[][] ts = new double[channels.size()][];
        double[][] ys = new double[channels.size()][];
        double[] w = new double[channels.size()];
        Series first = null;
        for (int k = 0; k < channels.size(); k++) {
            Series y = Series.cleanOf(history, channels.get(k), beginNs).between(t0, t1);
            first = k == 0 ? y : first;
            ts[k] = y.times();
            ys[k] = y.values();
            double sd = noiseStd(ys[k]);
            w[k] = 1.0 / (sd * sd);
        }
        DampedResponseFit.JointFit joint = DampedResponseFit.fitJoint(ts, ys, w, t0, 0.5, 20.0);
        DampedMode mode = joint.mode();
        String method = String.format(Locale.ROOT, "weighted least-squares fit of a second-order free response with "
                + "an offset, one mode shared by %s, %.2f to %.2f s after the release (variable projection, "
                + "Levenberg-Marquardt; weights the inverse noise variance from second differences)",
                String.join(", ", channels), FIT_DELAY_S, t1 - release);
        r.metric("sp-frequency", mode.naturalFrequencyRadS(), method, "the fit did not converge");
        r.metric("sp-damping", mode.dampingRatio(), method, "the fit did not converge");
        if (mode.isValid()) {
            String what = channels.get(0);
            double tpr = transientPeakRatio(first, joint.channels().get(0));
            double zTpr = tpr > 0 && tpr < 1 ? PeakRatios.zetaFromTransientPeakRatio(tpr) : Double.NaN;
            r.metric("sp-damping-tpr", zTpr, "damping ratio from the transient peak ratio of the first two half-cycle "
                    + "peaks of " + what + " about its fitted offset", "fewer than two clear peaks");
            if (Double.isFinite(zTpr) && Math.abs(zTpr - mode.dampingRatio()) > 0.1) {
                r.note(String.format(Locale.ROOT, "short-period damping: the fit gives %.3f, the transient peak "
                        + "ratio %.3f; the response may not be a clean second-order one", mode.dampingRatio(), zTpr));
            }
            FlightPhaseCategory cat = category(history, beginNs, endS);
            int level = HandlingLevels.shortPeriodDamping(mode.dampingRatio(), cat);
            r.metric("sp-level", level, "MIL-F-8785C 3.2.2.1.2 short-period damping, Category " + cat);
            r.note("short-period damping " + String.format(Locale.ROOT, "%.3f", mode.dampingRatio())
                    + (level <= 3 ? ": Level " + level : ": worse than Level 3") + " of MIL-F-8785C, Category " + cat);
        }
        return r.build();
    }

    /** Half-cycle ratio of the first two peaks about the fitted offset; NaN with fewer than two. */
    static double transientPeakRatio(Series y, DampedResponseFit.Fit fit) {
        Series s = y.smoothed(0.05);
        double most = 0;
        for (int i = 0; i < s.size(); i++) {
            most = Math.max(most, Math.abs(s.v(i) - fit.offset()));
        }
        PeakRatios.Extremes e = PeakRatios.extremes(s, 0.1 * most);
        if (e.size() < 2) {
            // the response may start at its first peak, right at the window's edge
            return Double.NaN;
        }
        return Math.abs(e.values()[1] - fit.offset()) / Math.abs(e.values()[0] - fit.offset());
    }

    /**
     * Noise standard deviation from second differences (which cancel a smooth response's trend and leave
     * {@code 6 sigma^2} of white noise), robustly by their median absolute value; floored at a thousandth of the
     * signal's range so a clean channel does not get an unbounded weight.
     */
    static double noiseStd(double[] y) {
        if (y.length < 5) {
            return 1.0;
        }
        double[] d = new double[y.length - 2];
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < y.length; i++) {
            lo = Math.min(lo, y[i]);
            hi = Math.max(hi, y[i]);
            if (i >= 2) {
                d[i - 2] = Math.abs(y[i] - 2 * y[i - 1] + y[i - 2]);
            }
        }
        java.util.Arrays.sort(d);
        double sd = 1.4826 * d[d.length / 2] / Math.sqrt(6.0);
        return Math.max(sd, Math.max(1e-3 * (hi - lo), 1e-12));
    }

    private static double firstDeparture(Series s) {
        if (s.size() < 4) {
            return Double.NaN;
        }
        double trim = s.v(0);
        double most = 0;
        for (int i = 0; i < s.size(); i++) {
            most = Math.max(most, Math.abs(s.v(i) - trim));
        }
        double away = Math.max(ELEVATOR_FLOOR_RAD, 0.25 * most);
        for (int i = 0; i < s.size(); i++) {
            if (Math.abs(s.v(i) - trim) > away) {
                return s.t(i);
            }
        }
        return Double.NaN;
    }

    static FlightPhaseCategory category(PointHistory h, long beginNs, double endS) {
        boolean gear = h.has("Gear") && Series.cleanOf(h, "Gear", beginNs).mean(0, endS) >= 0.5;
        boolean flap = h.has("Flap") && Series.cleanOf(h, "Flap", beginNs).mean(0, endS) >= 0.5;
        return FlightPhaseCategory.ofConfiguration(gear, flap);
    }

    private static double hint(Map<String, Long> hints, String name, long beginNs) {
        Long v = hints.get(name);
        return v == null ? Double.NaN : (v - beginNs) * 1e-9;
    }
}
