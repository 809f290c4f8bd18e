package org.pointcall.models.analysis.phugoid;

import java.util.List;
import java.util.Locale;
import java.util.Map;

import org.pointcall.models.analysis.ControlRelease;
import org.pointcall.models.analysis.ManoeuvreAnalyser;
import org.pointcall.models.analysis.ManoeuvreResult;
import org.pointcall.models.analysis.PointHistory;
import org.pointcall.models.analysis.ResultBuilder;
import org.pointcall.models.analysis.Series;
import org.pointcall.models.analysis.handling.HandlingLevels;
import org.pointcall.models.analysis.mode.DampedMode;
import org.pointcall.models.analysis.mode.DampedResponseFit;
import org.pointcall.models.analysis.mode.PeakRatios;
import org.pointcall.shared.kind.ManoeuvreKind;
import org.pointcall.shared.units.Units;

/**
 * Phugoid: the long-period mode from the free airspeed response after the release.
 *
 * <ul>
 * <li>{@code release}: the detector's hint, else the first instant after the input (the largest elevator
 *     excursion in the first 30 s) that the elevator is back near where it rests over the point;</li>
 * <li>{@code period}, {@code damping}: logarithmic decrement on the airspeed peaks (true airspeed, calibrated when
 *     there is none) from 5 s after the release to the end: the airspeed smoothed by a local least-squares line
 *     (2 s each side), its alternating peaks and troughs found with hysteresis, the half-cycle ratio the
 *     least-squares slope of the log of successive peak-to-peak amplitudes, the period twice the least-squares
 *     spacing of the extremes ({@link PeakRatios});</li>
 * <li>with fewer than three extremes (under a cycle flown), the values of a least-squares fit of a second-order
 *     free response to the same airspeed ({@link DampedResponseFit}), named in the methods; that fit is always
 *     reported as {@code period-fit} and {@code damping-fit} for a cross-check;</li>
 * <li>{@code phugoid-level}: the MIL-F-8785C level (paragraph 3.2.1.2, {@link HandlingLevels}).</li>
 * </ul>
 */
public final class PhugoidAnalyser implements ManoeuvreAnalyser {
    /** The phugoid input and its release lie within this much of the begin. */
    private static final double RELEASE_SEARCH_S = 30.0;
    static final double SKIP_AFTER_RELEASE_S = 5.0;
    private static final double ELEVATOR_FLOOR_RAD = Math.toRadians(0.2);

    @Override
    public ManoeuvreKind kind() {
        return ManoeuvreKind.PHUGOID;
    }

    @Override
    public List<String> parameters() {
        return List.of("KTAS", "KCAS", "Elevator");
    }

    @Override
    public ManoeuvreResult analyse(PointHistory history, long beginNs, long endNs, Map<String, Long> hintedInstantsNs,
                                   Map<String, Double> bandIntervalsS) {
        ResultBuilder r = new ResultBuilder(kind());
        double endS = (endNs - beginNs) * 1e-9;
        Long h = hintedInstantsNs.get("release");
        double release = h == null ? Double.NaN : (h - beginNs) * 1e-9;
        if (Double.isNaN(release) && history.has("Elevator")) {
            // the input is at the start; the pilot's recovery at the end must not be taken for the release
            release = ControlRelease.firstSettle(Series.cleanOf(history, "Elevator", beginNs), 0.0, endS,
                    Math.min(RELEASE_SEARCH_S, endS), ELEVATOR_FLOOR_RAD);
        }
        if (Double.isNaN(release)) {
            release = 0.0;
            r.note("no release found: the free response is taken from the begin");
        }
        r.instant("release", beginNs, release);
        String channel = history.has("KTAS") ? "KTAS" : history.has("KCAS") ? "KCAS" : null;
        if (channel == null) {
            r.note("no airspeed in the history: the phugoid is not analysed");
            return r.build();
        }
        double t0 = release + SKIP_AFTER_RELEASE_S;
        Series v = Series.cleanOf(history, channel, beginNs).between(t0, endS).smoothed(2.0);
        if (v.size() < 8) {
            r.note("under 8 airspeed samples from 5 s after the release to the end: the phugoid is not analysed");
            return r.build();
        }
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < v.size(); i++) {
            lo = Math.min(lo, v.v(i));
            hi = Math.max(hi, v.v(i));
        }
        PeakRatios.Extremes e = PeakRatios.extremes(v, Math.max(0.25 * Units.MPS_PER_KT, 0.1 * (hi - lo)));
        DampedMode dec = PeakRatios.ofExtremes(e);
        Series coarse = v.resampled(v.firstT(), v.lastT(), 0.5);
        DampedResponseFit.Fit fit = DampedResponseFit.fit(coarse.times(), coarse.values(), 0.03, 1.5);
        String what = channel.equals("KTAS") ? "true airspeed" : "calibrated airspeed";
        String fitMethod = "least-squares fit of a second-order free response with an offset to the " + what
                + " from 5 s after the release (variable projection, Levenberg-Marquardt)";
        DampedMode mode;
        if (dec.isValid()) {
            mode = dec;
            String m = String.format(Locale.ROOT, "logarithmic decrement on %d %s peaks and troughs from 5 s after "
                    + "the release (peak-to-peak amplitudes, least squares)", e.size(), what);
            r.metric("period", dec.periodS(), m);
            r.metric("damping", dec.dampingRatio(), m);
        } else {
            mode = fit.mode();
            r.note("fewer than three airspeed peaks and troughs (" + e.size() + "): period and damping from the fit");
            r.metric("period", fit.mode().periodS(), fitMethod, "the fit did not converge");
            r.metric("damping", fit.mode().dampingRatio(), fitMethod, "the fit did not converge");
        }
        r.metric("period-fit", fit.mode().periodS(), fitMethod, "the fit did not converge");
        r.metric("damping-fit", fit.mode().dampingRatio(), fitMethod, "the fit did not converge");
        if (mode.isValid()) {
            int level = HandlingLevels.phugoid(mode.dampingRatio(), mode.naturalFrequencyRadS());
            r.metric("phugoid-level", level, "MIL-F-8785C 3.2.1.2 phugoid stability");
            r.note("phugoid damping " + String.format(Locale.ROOT, "%.3f", mode.dampingRatio())
                    + (level <= 3 ? ": Level " + level : ": worse than Level 3") + " of MIL-F-8785C");
        }
        return r.build();
    }
}
