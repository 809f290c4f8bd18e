package org.pointcall.models.analysis;

/**
 * When the pilot let go of a control after an input: the last instant the control stood away from where it then
 * stayed. "Where it stayed" is the median of its last {@code settleS} seconds; "away" is more than a quarter of its
 * largest excursion from there, and more than {@code floor} (so sensor noise on a held control is not an input).
 */
public final class ControlRelease {
    private ControlRelease() {
    }

    /** The release time in the series' own seconds, NaN when the control never moved beyond the floor. */
    public static double lastMove(Series control, double from, double to, double settleS, double floor) {
        Series s = control.between(from, to);
        if (s.size() < 4) {
            return Double.NaN;
        }
        double[] tail = s.between(s.lastT() - settleS, s.lastT()).values();
        java.util.Arrays.sort(tail);
        double rest = tail[tail.length / 2];
        double most = 0;
        for (int i = 0; i < s.size(); i++) {
            most = Math.max(most, Math.abs(s.v(i) - rest));
        }
        double away = Math.max(floor, 0.25 * most);
        if (most <= floor) {
            return Double.NaN;
        }
        for (int i = s.size() - 1; i >= 0; i--) {
            if (Math.abs(s.v(i) - rest) > away) {
                return i + 1 < s.size() ? s.t(i + 1) : s.t(i);
            }
        }
        return Double.NaN;
    }
    /**
     * The release of an input made at the start of a long free response (a phugoid): the first instant after the
     * largest excursion found in the first {@code searchS} seconds that the control is back within a quarter of that
     * excursion of where it rests. "Where it rests" is the median over the whole stretch, so a recovery input at the
     * end (which {@link #lastMove} would take for the release) does not move it. NaN when the control never moved
     * beyond the floor within the search span.
     */
    public static double firstSettle(Series control, double from, double to, double searchS, double floor) {
        Series s = control.between(from, to);
        if (s.size() < 4) {
            return Double.NaN;
        }
        double[] all = s.values();
        java.util.Arrays.sort(all);
        double rest = all[all.length / 2];
        int peak = -1;
        double most = 0;
        for (int i = 0; i < s.size() && s.t(i) <= s.firstT() + searchS; i++) {
            double d = Math.abs(s.v(i) - rest);
            if (d > most) {
                most = d;
                peak = i;
            }
        }
        if (peak < 0 || most <= floor) {
            return Double.NaN;
        }
        double back = Math.max(floor, 0.25 * most);
        for (int i = peak + 1; i < s.size(); i++) {
            if (Math.abs(s.v(i) - rest) <= back) {
                return s.t(i);
            }
        }
        return Double.NaN;
    }
}
