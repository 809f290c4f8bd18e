package org.pointcall.ingest.sim.sortie;

import static org.pointcall.ingest.sim.sortie.Trajectory.AILERON;
import static org.pointcall.ingest.sim.sortie.Trajectory.AOA;
import static org.pointcall.ingest.sim.sortie.Trajectory.AOS;
import static org.pointcall.ingest.sim.sortie.Trajectory.GAMMA;
import static org.pointcall.ingest.sim.sortie.Trajectory.HEADING;
import static org.pointcall.ingest.sim.sortie.Trajectory.HP;
import static org.pointcall.ingest.sim.sortie.Trajectory.KCAS;
import static org.pointcall.ingest.sim.sortie.Trajectory.MACH;
import static org.pointcall.ingest.sim.sortie.Trajectory.NZ;
import static org.pointcall.ingest.sim.sortie.Trajectory.P;
import static org.pointcall.ingest.sim.sortie.Trajectory.PITCH;
import static org.pointcall.ingest.sim.sortie.Trajectory.Q;
import static org.pointcall.ingest.sim.sortie.Trajectory.ROLL;
import static org.pointcall.ingest.sim.sortie.Trajectory.RUDDER;
import static org.pointcall.ingest.sim.sortie.Trajectory.TAS;

import java.util.LinkedHashMap;
import java.util.Map;

import org.pointcall.shared.card.Band;
import org.pointcall.shared.card.BandPhase;
import org.pointcall.shared.card.TestPoint;
import org.pointcall.shared.kind.ManoeuvreKind;

/**
 * The truth of one flown point from its exact trajectory: the kind's key instants and its metrics, by the
 * registry's definitions made exact here.
 *
 * <ul>
 * <li>stalls: {@code break} the highest AoA between the begin and the pilot's recovery (flight path back to
 *     level), {@code recovery} the bottom of the dive after the break (the climb rate back to zero); entry rate the least-squares KCAS slope over
 *     the rate band's interval (10 s when there is none) before the break, positive slowing; altitude loss from
 *     the break to the lowest point; wing drop the largest bank change from the break to the recovery</li>
 * <li>loop: {@code pull} the first instant the load factor is within 0.1 g of the pilot's pull target (end of the
 *     g onset; the begin is the start of the pull), {@code apex} the first instant, inverted (bank beyond 90 deg),
 *     that the pitch attitude crosses 0, {@code exit} the first instant after the apex, upright, that the flight
 *     path is back within 0.5 deg of level; pull-nz the mean load factor over the 2 s from the pull</li>
 * <li>wind-up turn: {@code nz-max} the highest load factor; Mach mean and spread and the Nz-AoA slope from the
 *     begin to it</li>
 * <li>level acceleration and stabilised: {@code start} the begin, {@code end} the pilot's end of the run</li>
 * <li>pitch doublet: {@code input} and {@code release} as flown; short-period frequency and damping from a
 *     second-order fit of the pitch rate over the 4 s from 0.15 s after the release, at 20 Hz</li>
 * <li>phugoid: {@code release} as flown; period (damped) and damping from a second-order fit of the true
 *     airspeed from 5 s after the release to the end, at 1 Hz</li>
 * <li>sideslip: {@code max-beta} the centre of the 1 s with the largest mean sideslip magnitude (held, not a
 *     transient); rudder and aileron slopes over the whole point</li>
 * <li>aileron roll: {@code input} as flown, {@code roll-end} the first instant the bank has turned through 360 deg
 *     from the input; the rest between the two</li>
 * </ul>
 */
final class PointAnalysis {
    private static final double DEG = Math.PI / 180.0;
    /** A loop has exited when its flight path is back within this of level. */
    private static final double EXIT_GAMMA_RAD = 0.5 * DEG;

    /** Key instants (s), metrics (SI), and where "throughout" bands stop applying (s). */
    record Result(Map<String, Double> instants, Map<String, Double> metricsSi, double throughoutEndS) {
    }

    private PointAnalysis() {
    }

    /**
     * @param marks      the pilot's own marks, s
     * @param pullTarget the load factor the pilot pulled for (loop), NaN otherwise
     */
    static Result analyse(Trajectory tr, TestPoint point, double beginS, double endS, Map<String, Double> marks) {
        int b = tr.indexAt(beginS);
        int e = tr.indexAt(endS);
        Map<String, Double> in = new LinkedHashMap<>();
        Map<String, Double> m = new LinkedHashMap<>();
        double through = endS;
        ManoeuvreKind kind = point.kind();
        switch (kind) {
            case STALL_LEVEL, STALL_TURN -> {
                int last = marks.containsKey("recovered") ? tr.indexAt(marks.get("recovered")) : e;
                int brk = argMax(tr, AOA, b, Math.max(b, last));
                int low = bottom(tr, brk, e);
                in.put("break", tr.time(brk));
                in.put("recovery", tr.time(low));
                double over = 10.0;
                for (Band band : point.bands()) {
                    if ("KCAS".equals(band.parameter()) && band.phase() == BandPhase.RATE
                            && "break".equals(band.instant())) {
                        over = band.overS();
                    }
                }
                m.put("entry-rate", -Fits.rate(tr, KCAS, Math.max(b, tr.indexAt(tr.time(brk) - over)), brk));
                m.put("stall-kcas", tr.get(KCAS, brk));
                m.put("max-aoa", tr.get(AOA, argMax(tr, AOA, b, e)));
                m.put("nz-at-break", tr.get(NZ, brk));
                m.put("altitude-loss", tr.get(HP, brk) - tr.get(HP, low));
                double drop = 0.0;
                for (int i = brk; i <= low; i++) {
                    drop = Math.max(drop, Math.abs(wrap(tr.get(ROLL, i) - tr.get(ROLL, brk))));
                }
                m.put("wing-drop", drop);
                m.put("recovery-time", tr.time(low) - tr.time(brk));
                if (kind == ManoeuvreKind.STALL_TURN) {
                    m.put("bank-at-break", tr.get(ROLL, brk));
                    double n = tr.get(NZ, brk);
                    m.put("stall-kcas-1g", n > 0.0 ? tr.get(KCAS, brk) / Math.sqrt(n) : Double.NaN);
                }
                through = tr.time(brk);
            }
            case LOOP -> {
                int pull = marks.containsKey("pull") ? tr.indexAt(marks.get("pull")) : b;
                int apex = -1;
                for (int i = pull + 1; i <= e; i++) {
                    if (Math.abs(tr.get(ROLL, i)) > 90 * DEG && tr.get(PITCH, i) <= 0.0
                            && tr.get(PITCH, i - 1) > 0.0) {
                        apex = i;
                        break;
                    }
                }
                int exit = -1;
                if (apex >= 0) {
                    boolean down = false;
                    for (int i = apex; i <= e; i++) {
                        down |= tr.get(GAMMA, i) < -EXIT_GAMMA_RAD;
                        if (down && tr.get(GAMMA, i) >= -EXIT_GAMMA_RAD && Math.abs(tr.get(ROLL, i)) < 90 * DEG) {
                            exit = i;
                            break;
                        }
                    }
                }
                in.put("pull", tr.time(pull));
                m.put("entry-hp", tr.get(HP, b));
                m.put("entry-kcas", tr.get(KCAS, b));
                m.put("pull-nz", mean(tr, NZ, pull, tr.last(tr.time(pull) + 2.0)));
                m.put("max-nz", tr.get(NZ, argMax(tr, NZ, b, exit >= 0 ? exit : e)));
                if (apex >= 0) {
                    in.put("apex", tr.time(apex));
                    m.put("apex-hp", tr.get(HP, apex));
                    m.put("apex-kcas", tr.get(KCAS, apex));
                }
                if (exit >= 0) {
                    in.put("exit", tr.time(exit));
                    m.put("exit-hp-change", tr.get(HP, exit) - tr.get(HP, b));
                    m.put("exit-heading-change", wrap(tr.get(HEADING, exit) - tr.get(HEADING, b)));
                    m.put("duration", tr.time(exit) - tr.time(pull));
                }
            }
            case WIND_UP_TURN -> {
                int top = argMax(tr, NZ, b, e);
                in.put("nz-max", tr.time(top));
                double lo = Double.POSITIVE_INFINITY;
                double hi = Double.NEGATIVE_INFINITY;
                for (int i = b; i <= top; i++) {
                    lo = Math.min(lo, tr.get(MACH, i));
                    hi = Math.max(hi, tr.get(MACH, i));
                }
                m.put("mach-mean", mean(tr, MACH, b, top));
                m.put("mach-spread", hi - lo);
                m.put("nz-max", tr.get(NZ, top));
                m.put("aoa-at-nz-max", tr.get(AOA, top));
                // g per degree, the registry's unit for this slope
                m.put("nz-per-aoa", Fits.slope(tr, AOA, NZ, b, top) * DEG);
                through = tr.time(top);
            }
            case LEVEL_ACCEL -> {
                int end = marks.containsKey("end") ? tr.indexAt(marks.get("end")) : e;
                in.put("start", tr.time(b));
                in.put("end", tr.time(end));
                double lo = Double.POSITIVE_INFINITY;
                double hi = Double.NEGATIVE_INFINITY;
                for (int i = b; i <= end; i++) {
                    lo = Math.min(lo, tr.get(HP, i));
                    hi = Math.max(hi, tr.get(HP, i));
                }
                m.put("hp-spread", hi - lo);
                m.put("mach-start", tr.get(MACH, b));
                m.put("mach-end", tr.get(MACH, end));
                m.put("duration", tr.time(end) - tr.time(b));
            }
            case PITCH_DOUBLET -> {
                double input = marks.getOrDefault("input", beginS);
                double release = marks.getOrDefault("release", beginS);
                in.put("input", input);
                in.put("release", release);
                double t0 = release + 0.15;
                double[] mode = Fits.mode(tr, Q, t0, Math.min(t0 + 4.0, endS), 0.05);
                m.put("sp-frequency", mode[0]);
                m.put("sp-damping", mode[1]);
            }
            case PHUGOID -> {
                double release = marks.getOrDefault("release", beginS);
                in.put("release", release);
                double[] mode = Fits.mode(tr, TAS, release + 5.0, endS, 1.0);
                m.put("period", mode[2] > 0.0 ? 2.0 * Math.PI / mode[2] : Double.NaN);
                m.put("damping", mode[1]);
            }
            case SIDESLIP -> {
                int half = Math.max(1, (int) Math.round(0.5 / sampleS(tr, b, e)));
                int best = b;
                double bestMean = -1.0;
                for (int i = b + half; i <= e - half; i++) {
                    double s = 0.0;
                    for (int k = i - half; k <= i + half; k++) {
                        s += tr.get(AOS, k);
                    }
                    double mm = Math.abs(s / (2 * half + 1));
                    if (mm > bestMean) {
                        bestMean = mm;
                        best = i;
                    }
                }
                in.put("max-beta", tr.time(best));
                m.put("rudder-per-beta", Fits.slope(tr, AOS, RUDDER, b, e));
                m.put("aileron-per-beta", Fits.slope(tr, AOS, AILERON, b, e));
                m.put("max-beta", Math.max(bestMean, 0.0));
            }
            case AILERON_ROLL -> {
                int input = marks.containsKey("input") ? tr.indexAt(marks.get("input")) : b;
                double turned = 0.0;
                int at90 = -1;
                int at360 = -1;
                for (int i = input + 1; i <= e && at360 < 0; i++) {
                    turned += wrap(tr.get(ROLL, i) - tr.get(ROLL, i - 1));
                    if (at90 < 0 && Math.abs(turned) >= 90 * DEG) {
                        at90 = i;
                    }
                    if (Math.abs(turned) >= 360 * DEG) {
                        at360 = i;
                    }
                }
                int stop = at360 >= 0 ? at360 : e;
                in.put("input", tr.time(input));
                double peak = 0.0;
                double beta = 0.0;
                for (int i = input; i <= stop; i++) {
                    peak = Math.max(peak, Math.abs(tr.get(P, i)));
                    beta = Math.max(beta, Math.abs(tr.get(AOS, i)));
                }
                m.put("peak-roll-rate", peak);
                m.put("max-beta", beta);
                if (at90 >= 0) {
                    m.put("time-to-90", tr.time(at90) - tr.time(input));
                }
                if (at360 >= 0) {
                    in.put("roll-end", tr.time(at360));
                    m.put("time-to-360", tr.time(at360) - tr.time(input));
                    m.put("hp-change", tr.get(HP, at360) - tr.get(HP, input));
                }
            }
            case STABILISED -> {
                int end = marks.containsKey("end") ? tr.indexAt(marks.get("end")) : e;
                in.put("start", tr.time(b));
                in.put("end", tr.time(end));
                m.put("hp-drift", Fits.rate(tr, HP, b, end));
                m.put("kcas-drift", Fits.rate(tr, KCAS, b, end));
                m.put("heading-drift", headingRate(tr, b, end));
                m.put("hold-time", tr.time(end) - tr.time(b));
                // the simulated pilot's hold is steady from its start: the steady window is the whole hold
                m.put("steady-time", tr.time(end) - tr.time(b));
            }
        }
        return new Result(in, m, through);
    }

    private static double sampleS(Trajectory tr, int b, int e) {
        return e > b ? (tr.time(e) - tr.time(b)) / (e - b) : 0.01;
    }

    /** Heading slope with the heading unwrapped from the first sample (a hold across north stays smooth). */
    private static double headingRate(Trajectory tr, int i0, int i1) {
        int n = i1 - i0 + 1;
        if (n < 2) {
            return Double.NaN;
        }
        double mt = 0.0;
        double mh = 0.0;
        double h = tr.get(HEADING, i0);
        for (int i = i0; i <= i1; i++) {
            if (i > i0) {
                h += wrap(tr.get(HEADING, i) - tr.get(HEADING, i - 1));
            }
            mt += tr.time(i);
            mh += h;
        }
        mt /= n;
        mh /= n;
        double stt = 0.0;
        double sth = 0.0;
        h = tr.get(HEADING, i0);
        for (int i = i0; i <= i1; i++) {
            if (i > i0) {
                h += wrap(tr.get(HEADING, i) - tr.get(HEADING, i - 1));
            }
            double dt = tr.time(i) - mt;
            stt += dt * dt;
            sth += dt * (h - mh);
        }
        return stt > 0.0 ? sth / stt : Double.NaN;
    }

    /** First instant after {@code i0} the climb rate is back to zero or above after a descent (else the lowest). */
    static int bottom(Trajectory tr, int i0, int i1) {
        boolean down = false;
        for (int i = i0; i <= i1; i++) {
            down |= tr.get(Trajectory.CLIMB, i) < 0.0;
            if (down && tr.get(Trajectory.CLIMB, i) >= 0.0) {
                return i;
            }
        }
        return argMin(tr, HP, i0, i1);
    }

    static int argMax(Trajectory tr, int ch, int i0, int i1) {
        int best = i0;
        for (int i = i0 + 1; i <= i1; i++) {
            if (tr.get(ch, i) > tr.get(ch, best)) {
                best = i;
            }
        }
        return best;
    }

    static int argMin(Trajectory tr, int ch, int i0, int i1) {
        int best = i0;
        for (int i = i0 + 1; i <= i1; i++) {
            if (tr.get(ch, i) < tr.get(ch, best)) {
                best = i;
            }
        }
        return best;
    }

    static double mean(Trajectory tr, int ch, int i0, int i1) {
        double s = 0.0;
        for (int i = i0; i <= i1; i++) {
            s += tr.get(ch, i);
        }
        return i1 >= i0 ? s / (i1 - i0 + 1) : Double.NaN;
    }

    static double wrap(double rad) {
        double a = Math.IEEEremainder(rad, 2.0 * Math.PI);
        return a == Math.PI ? -Math.PI : a;
    }
}
