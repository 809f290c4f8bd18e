package org.pointcall.models.analysis.mode;

import java.util.ArrayList;
import java.util.List;

import org.pointcall.models.analysis.Series;

/**
 * Damping from the peaks of a free response: the logarithmic decrement and the transient peak ratio (Yechout,
 * Introduction to Aircraft Flight Mechanics, AIAA, section 7.6; USAF Test Pilot School Flying Qualities Textbook
 * Vol. II):
 *
 * <ul>
 * <li>logarithmic decrement over n full cycles {@code delta = (1/n) ln(x(t) / x(t + nT))}, {@code zeta = delta /
 *     sqrt(4 pi^2 + delta^2)};</li>
 * <li>transient peak ratio of successive half-cycle peaks {@code TPR = exp(-pi zeta / sqrt(1 - zeta^2))}, so
 *     {@code zeta = -ln TPR / sqrt(pi^2 + ln^2 TPR)};</li>
 * <li>{@code wn = wd / sqrt(1 - zeta^2)}, {@code wd = pi / (half-cycle spacing)}.</li>
 * </ul>
 *
 * Successive peak-to-peak amplitudes (a peak minus the next trough) shrink by the same half-cycle ratio as the
 * peaks themselves, without needing the response's final value: that is what {@link #ofExtremes} uses.
 */
public final class PeakRatios {
    private PeakRatios() {
    }

    /** Damping ratio from a logarithmic decrement per full cycle. */
    public static double zetaFromLogDecrement(double delta) {
        return delta / Math.sqrt(4 * Math.PI * Math.PI + delta * delta);
    }

    /** Logarithmic decrement over {@code n} full cycles from amplitudes {@code x0} and {@code xn}. */
    public static double logDecrement(double x0, double xn, double n) {
        return Math.log(x0 / xn) / n;
    }

    /** Damping ratio from a half-cycle transient peak ratio (0 < TPR). */
    public static double zetaFromTransientPeakRatio(double tpr) {
        double l = Math.log(tpr);
        return -l / Math.sqrt(Math.PI * Math.PI + l * l);
    }

    /** Half-cycle transient peak ratio of damping ratio {@code zeta} (|zeta| < 1). */
    public static double transientPeakRatio(double zeta) {
        return Math.exp(-Math.PI * zeta / Math.sqrt(1 - zeta * zeta));
    }

    /** Times and values of alternating extremes. */
    public record Extremes(double[] timesS, double[] values) {
        public int size() {
            return timesS.length;
        }
    }

    /**
     * Alternating extremes of a (smoothed) response by a zig-zag with hysteresis: an extreme is confirmed once the
     * response has moved back from it by at least {@code minSwing}, so noise does not make extremes, and the first
     * and last samples (window edges) never count as one.
     */
    public static Extremes extremes(Series s, double minSwing) {
        int n = s.size();
        List<double[]> out = new ArrayList<>();
        int dir = 0;
        int cand = 0;
        int lo = 0;
        int hi = 0;
        for (int i = 1; i < n; i++) {
            double v = s.v(i);
            if (dir == 0) {
                if (v > s.v(hi)) {
                    hi = i;
                }
                if (v < s.v(lo)) {
                    lo = i;
                }
                if (s.v(hi) - s.v(lo) >= minSwing) {
                    dir = hi > lo ? 1 : -1;
                    cand = hi > lo ? hi : lo;
                    // the earlier of the two is a real extreme only if the response had come to it from the other side
                    int first = hi > lo ? lo : hi;
                    if (first > 0 && Math.abs(s.v(first) - s.v(0)) >= minSwing) {
                        out.add(new double[] {s.t(first), s.v(first)});
                    }
                }
            } else if (dir > 0) {
                if (v > s.v(cand)) {
                    cand = i;
                } else if (s.v(cand) - v >= minSwing) {
                    out.add(new double[] {s.t(cand), s.v(cand)});
                    dir = -1;
                    cand = i;
                }
            } else {
                if (v < s.v(cand)) {
                    cand = i;
                } else if (v - s.v(cand) >= minSwing) {
                    out.add(new double[] {s.t(cand), s.v(cand)});
                    dir = 1;
                    cand = i;
                }
            }
        }
        double[] t = new double[out.size()];
        double[] v = new double[out.size()];
        for (int i = 0; i < t.length; i++) {
            t[i] = out.get(i)[0];
            v[i] = out.get(i)[1];
        }
        return new Extremes(t, v);
    }

    /**
     * The mode from alternating extremes: the half-cycle ratio is the least-squares slope of the logarithm of
     * successive peak-to-peak amplitudes against their index (one extreme pair each), converted to a full-cycle
     * logarithmic decrement; the damped half period is the least-squares slope of the extremes' times against
     * their index. Needs at least three extremes (two amplitudes).
     */
    public static DampedMode ofExtremes(Extremes e) {
        int n = e.size();
        if (n < 3) {
            return DampedMode.NONE;
        }
        double[] k = new double[n - 1];
        double[] lnA = new double[n - 1];
        for (int i = 0; i + 1 < n; i++) {
            k[i] = i;
            double a = Math.abs(e.values()[i + 1] - e.values()[i]);
            if (!(a > 0)) {
                return DampedMode.NONE;
            }
            lnA[i] = Math.log(a);
        }
        double lnRatio = org.pointcall.models.analysis.LineFit.of(k, lnA).slope();
        double[] idx = new double[n];
        for (int i = 0; i < n; i++) {
            idx[i] = i;
        }
        double halfPeriod = org.pointcall.models.analysis.LineFit.of(idx, e.timesS()).slope();
        if (!(halfPeriod > 0)) {
            return DampedMode.NONE;
        }
        double delta = -2.0 * lnRatio;
        double zeta = zetaFromLogDecrement(delta);
        double wd = Math.PI / halfPeriod;
        return new DampedMode(wd / Math.sqrt(1 - zeta * zeta), zeta, wd);
    }
}
