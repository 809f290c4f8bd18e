package org.pointcall.models.analysis.loop;

import java.util.List;
import java.util.Map;

import org.pointcall.models.analysis.ManoeuvreAnalyser;
import org.pointcall.models.analysis.ManoeuvreResult;
import org.pointcall.models.analysis.PointHistory;
import org.pointcall.models.analysis.ResultBuilder;
import org.pointcall.models.analysis.Series;
import org.pointcall.shared.kind.ManoeuvreKind;

/**
 * Loop.
 *
 * <ul>
 * <li>entry ({@code entry-hp}, {@code entry-kcas}) at the begin, the start of the pull, each on a least-squares line
 *     over the 0.5 s from it;</li>
 * <li>{@code pull}: the detector's hint, else the end of the g onset, the first instant the smoothed load factor is
 *     within 0.1 g of the pull's plateau (the median of the load factor, over the first 6 s, where it stands above
 *     70 % of its rise); {@code pull-nz} the mean load factor over the 2 s from it;</li>
 * <li>{@code apex}: the first instant, inverted (bank beyond 90 deg), the pitch attitude crosses 0 going down;
 *     {@code apex-hp} and {@code apex-kcas} there;</li>
 * <li>{@code exit}: after the apex, upright, the first instant the flight path angle ({@code asin} of the
 *     smoothed climb rate of pressure altitude over true airspeed) is back within 0.5 deg of level after a
 *     descent, looked for up to 5 s past the detected end; exit altitude and heading against the entry's, and the
 *     duration from the pull.</li>
 * </ul>
 */
public final class LoopAnalyser implements ManoeuvreAnalyser {
    private static final double LEVEL_RAD = Math.toRadians(0.5);
    /**
     * The detector may end a loop a little before the flight path is back to level; the exit is looked for this far
     * past the detected end, where the history reaches (the card session keeps a post-roll for it).
     */
    static final double EXIT_GRACE_S = 5.0;

    @Override
    public ManoeuvreKind kind() {
        return ManoeuvreKind.LOOP;
    }

    @Override
    public List<String> parameters() {
        return List.of("Hp", "KCAS", "KTAS", "Nz", "Pitch", "Roll", "Heading");
    }

    @Override
    public ManoeuvreResult analyse(PointHistory history, long beginNs, long endNs, Map<String, Long> hintedInstantsNs,
                                   Map<String, Double> bandIntervalsS) {
        ResultBuilder r = new ResultBuilder(kind());
        for (String p : parameters()) {
            if (!history.has(p)) {
                r.note("the history lacks " + p + "; metrics that need it are not computed");
            }
        }
        double endS = (endNs - beginNs) * 1e-9;
        Series hp = history.has("Hp") ? Series.cleanOf(history, "Hp", beginNs) : null;
        Series kcas = history.has("KCAS") ? Series.cleanOf(history, "KCAS", beginNs) : null;
        if (hp != null) {
            r.metric("entry-hp", hp.line(0.0, 0.5).at(0.0), "pressure altitude at the start of the pull "
                    + "(least-squares line over 0.5 s)");
        }
        if (kcas != null) {
            r.metric("entry-kcas", kcas.line(0.0, 0.5).at(0.0), "KCAS at the start of the pull "
                    + "(least-squares line over 0.5 s)");
        }
        double pull = Double.NaN;
        Long hint = hintedInstantsNs.get("pull");
        if (history.has("Nz")) {
            Series nz = Series.cleanOf(history, "Nz", beginNs).smoothed(0.1);
            if (hint != null) {
                pull = (hint - beginNs) * 1e-9;
            } else {
                pull = endOfOnset(nz);
            }
            if (Double.isFinite(pull)) {
                r.metric("pull-nz", nz.mean(pull, pull + 2.0), "mean load factor over the 2 s from the end of "
                        + "the g onset");
            }
            int top = nz.argMax(0.0, endS);
            r.metric("max-nz", top >= 0 ? nz.v(top) : Double.NaN, "highest load factor (smoothed, 0.1 s)");
        }
        r.instant("pull", beginNs, pull);
        if (!history.has("Pitch") || !history.has("Roll")) {
            return r.build();
        }
        Series pitch = Series.cleanOf(history, "Pitch", beginNs).smoothed(0.1);
        Series roll = Series.angleOf(history, "Roll", beginNs);
        double apex = Double.NaN;
        double from = Double.isFinite(pull) ? pull : 0.0;
        for (int i = Math.max(1, pitch.firstAtOrAfter(from)); i < pitch.size() && pitch.t(i) <= endS; i++) {
            double phi = Math.abs(Math.IEEEremainder(roll.at(pitch.t(i)), 2 * Math.PI));
            if (phi > Math.PI / 2 && pitch.v(i) <= 0.0 && pitch.v(i - 1) > 0.0) {
                apex = pitch.t(i);
                break;
            }
        }
        r.instant("apex", beginNs, apex);
        if (Double.isNaN(apex)) {
            r.note("no apex found (never inverted with the pitch attitude crossing level)");
            return r.build();
        }
        if (hp != null) {
            r.metric("apex-hp", hp.smoothed(0.25).at(apex), "pressure altitude at the apex (smoothed, 0.25 s)");
        }
        if (kcas != null) {
            r.metric("apex-kcas", kcas.smoothed(0.25).at(apex), "KCAS at the apex (smoothed, 0.25 s)");
        }
        if (hp == null || !history.has("KTAS")) {
            return r.build();
        }
        Series climb = hp.slopes(0.25);
        Series tas = Series.cleanOf(history, "KTAS", beginNs);
        double exit = Double.NaN;
        boolean down = false;
        double exitSearchS = endS + EXIT_GRACE_S;
        for (int i = climb.firstAtOrAfter(apex); i < climb.size() && climb.t(i) <= exitSearchS; i++) {
            double t = climb.t(i);
            double v = tas.at(t);
            double gamma = v > 1 ? Math.asin(Math.max(-1, Math.min(1, climb.v(i) / v))) : Double.NaN;
            down |= gamma < -LEVEL_RAD;
            double phi = Math.abs(Math.IEEEremainder(roll.at(t), 2 * Math.PI));
            if (down && gamma >= -LEVEL_RAD && phi < Math.PI / 2) {
                exit = t;
                break;
            }
        }
        r.instant("exit", beginNs, exit);
        if (Double.isNaN(exit)) {
            r.note("no exit found (the flight path never came back to level, upright, before the end)");
            return r.build();
        }
        Series hps = hp.smoothed(0.25);
        r.metric("exit-hp-change", hps.at(exit) - hps.at(0.0), "pressure altitude at the exit minus at the entry");
        if (history.has("Heading")) {
            Series psi = Series.angleOf(history, "Heading", beginNs);
            r.metric("exit-heading-change", Math.IEEEremainder(psi.at(exit) - psi.at(0.0), 2 * Math.PI),
                    "heading at the exit minus at the entry, -180 to 180 deg");
        }
        if (Double.isFinite(pull)) {
            r.metric("duration", exit - pull, "time from the end of the g onset to the exit");
        }
        return r.build();
    }

    /** End of the g onset: first instant within 0.1 g of the pull's plateau; NaN when there is no pull. */
    static double endOfOnset(Series nz) {
        Series first = nz.between(0.0, 6.0);
        if (first.size() < 4) {
            return Double.NaN;
        }
        double start = first.v(0);
        int top = first.argMax(0.0, 6.0);
        double rise = first.v(top) - start;
        if (!(rise > 0.5)) {
            return Double.NaN;
        }
        double[] above = new double[first.size()];
        int n = 0;
        for (int i = 0; i < first.size(); i++) {
            if (first.v(i) >= start + 0.7 * rise) {
                above[n++] = first.v(i);
            }
        }
        java.util.Arrays.sort(above, 0, n);
        double plateau = above[n / 2];
        for (int i = 0; i < first.size(); i++) {
            if (first.v(i) >= plateau - 0.1) {
                return first.t(i);
            }
        }
        return Double.NaN;
    }
}
