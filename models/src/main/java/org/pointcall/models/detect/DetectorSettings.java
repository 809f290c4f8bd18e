package org.pointcall.models.detect;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Set;
import java.util.TreeSet;

import org.pointcall.shared.error.PointcallException;
import org.pointcall.shared.kind.ManoeuvreKind;

/**
 * Everything that tunes a {@link PointDetector}. Times in seconds, probabilities in [0, 1]. Validated as a whole:
 * every problem is listed in one message.
 *
 * @param smoothing          how probabilities are smoothed
 * @param smoothingS         its time constant (exponential) or window (moving average); ignored for none
 * @param enterProbability   p_on: a kind enters when its smoothed probability stays above this...
 * @param enterS             ...for t_on
 * @param leaveProbability   p_off: an open point leaves when its smoothed probability stays below this...
 * @param leaveS             ...for t_off
 * @param edgeProbability    the lower threshold on the raw probability that places begin and end: the begin goes
 *                           back to where it rose above this, the end to where it fell below
 * @param edgeDebounceS      crossings of the edge threshold shorter than this are noise
 * @param maxRefineS         begin and end move at most this far from the hysteresis crossings
 * @param mergeGapS          a point that left comes back as the same point if its kind re-enters within this of the
 *                           leave (measured from where the smoothed probability fell below p_off)
 * @param switchMargin       another kind takes over an open point once it has entered and its smoothed probability
 *                           exceeds the open kind's by this much
 * @param switches           takeovers that change the open point's kind instead of ending it
 * @param minDurationS       shortest point per kind, every kind present; shorter ones are discarded
 * @param maxTickGapS        a longer silence between ticks restarts smoothing and entry timing
 * @param disabledRules      guard and boundary rules switched off, by name ({@link GuardRules#NAMES},
 *                           {@link BoundaryRules#NAMES})
 * @param guards             the guard rules' thresholds
 * @param boundaries         the boundary rules' thresholds
 */
public record DetectorSettings(Smoothing smoothing, double smoothingS, double enterProbability, double enterS,
                               double leaveProbability, double leaveS, double edgeProbability, double edgeDebounceS,
                               double maxRefineS, double mergeGapS, double switchMargin, Set<KindSwitch> switches,
                               Map<ManoeuvreKind, Double> minDurationS, double maxTickGapS, Set<String> disabledRules,
                               GuardSettings guards, BoundarySettings boundaries) {

    public DetectorSettings {
        Objects.requireNonNull(smoothing, "smoothing");
        Objects.requireNonNull(guards, "guards");
        Objects.requireNonNull(boundaries, "boundaries");
        List<String> bad = new ArrayList<>();
        if (smoothing != Smoothing.NONE && (!(smoothingS > 0) || Double.isInfinite(smoothingS))) {
            bad.add("smoothingS must be a positive number of seconds for " + smoothing + ", got " + smoothingS);
        }
        probability(bad, "enterProbability", enterProbability);
        probability(bad, "leaveProbability", leaveProbability);
        probability(bad, "edgeProbability", edgeProbability);
        if (!(leaveProbability < enterProbability)) {
            bad.add("leaveProbability (" + leaveProbability + ") must be below enterProbability ("
                    + enterProbability + ")");
        }
        if (!(edgeProbability <= leaveProbability)) {
            bad.add("edgeProbability (" + edgeProbability + ") must not exceed leaveProbability ("
                    + leaveProbability + ")");
        }
        seconds(bad, "enterS", enterS);
        seconds(bad, "leaveS", leaveS);
        seconds(bad, "edgeDebounceS", edgeDebounceS);
        seconds(bad, "maxRefineS", maxRefineS);
        seconds(bad, "mergeGapS", mergeGapS);
        if (!(maxTickGapS > 0) || Double.isInfinite(maxTickGapS)) {
            bad.add("maxTickGapS must be a positive number of seconds, got " + maxTickGapS);
        }
        if (!(switchMargin >= 0 && switchMargin < 1)) {
            bad.add("switchMargin must be in [0, 1), got " + switchMargin);
        }
        switches = Set.copyOf(Objects.requireNonNull(switches, "switches"));
        Objects.requireNonNull(minDurationS, "minDurationS");
        Map<ManoeuvreKind, Double> md = new EnumMap<>(ManoeuvreKind.class);
        for (ManoeuvreKind k : ManoeuvreKind.values()) {
            Double v = minDurationS.get(k);
            if (v == null) {
                bad.add("minDurationS has no value for " + k.key());
            } else if (!(v >= 0) || v.isInfinite()) {
                bad.add("minDurationS of " + k.key() + " must be finite and >= 0 s, got " + v);
            } else {
                md.put(k, v);
            }
        }
        minDurationS = Map.copyOf(md);
        Objects.requireNonNull(disabledRules, "disabledRules");
        Set<String> unknown = new TreeSet<>(disabledRules);
        unknown.removeAll(GuardRules.NAMES);
        unknown.removeAll(BoundaryRules.NAMES);
        if (!unknown.isEmpty()) {
            bad.add("disabledRules names unknown rules " + unknown + "; known: " + GuardRules.NAMES + " and "
                    + BoundaryRules.NAMES);
        }
        disabledRules = Set.copyOf(disabledRules);
        if (!bad.isEmpty()) {
            throw new PointcallException("detector settings: " + String.join("; ", bad));
        }
    }

    private static void probability(List<String> bad, String name, double v) {
        if (!(v > 0 && v < 1)) {
            bad.add(name + " must be in (0, 1), got " + v);
        }
    }

    private static void seconds(List<String> bad, String name, double v) {
        if (!(v >= 0) || Double.isInfinite(v)) {
            bad.add(name + " must be a finite number of seconds >= 0, got " + v);
        }
    }

    /**
     * Exponential smoothing over 0.3 s; enter above 0.6 for 0.5 s, leave below 0.35 for 0.75 s; edges at 0.25 on the
     * raw probability, debounced 0.2 s, moved at most 5 s; gaps up to 2 s merged; takeover margin 0.1; the switches
     * of {@link #defaultSwitches()}; minimum durations of {@link #defaultMinDurationsS()}; ticks more than 1 s apart
     * restart the timing; every guard rule on with {@link GuardSettings#defaults()}; every boundary rule on with
     * {@link BoundarySettings#defaults()} but {@code accel-gain}, which is off: it holds only for an airframe with
     * the power to sweep its speed (a level acceleration of the held-out airframe gained 2 % of CAS).
     */
    public static DetectorSettings defaults() {
        return new DetectorSettings(Smoothing.EXPONENTIAL, 0.3, 0.6, 0.5, 0.35, 0.75, 0.25, 0.2, 5.0, 2.0, 0.1,
                defaultSwitches(), defaultMinDurationsS(), 1.0, Set.of(BoundaryRules.ACCEL_GAIN),
                GuardSettings.defaults(), BoundarySettings.defaults());
    }

    /**
     * Level acceleration to either stall (a slow level entry looks like one until the AoA builds), wings-level and
     * turning stall into each other (bank is a matter of degree), wind-up turn to turning stall (an accelerated stall
     * starts as a wind-up).
     */
    public static Set<KindSwitch> defaultSwitches() {
        return Set.of(new KindSwitch(ManoeuvreKind.LEVEL_ACCEL, ManoeuvreKind.STALL_LEVEL),
                new KindSwitch(ManoeuvreKind.LEVEL_ACCEL, ManoeuvreKind.STALL_TURN),
                new KindSwitch(ManoeuvreKind.STALL_LEVEL, ManoeuvreKind.STALL_TURN),
                new KindSwitch(ManoeuvreKind.STALL_TURN, ManoeuvreKind.STALL_LEVEL),
                new KindSwitch(ManoeuvreKind.WIND_UP_TURN, ManoeuvreKind.STALL_TURN));
    }

    /**
     * Shortest believable point per kind, s: a doublet or a roll is a few seconds, a phugoid at least one long-period
     * cycle (tens of seconds), a level acceleration or a stabilised hold well over ten [common practice].
     */
    public static Map<ManoeuvreKind, Double> defaultMinDurationsS() {
        Map<ManoeuvreKind, Double> m = new EnumMap<>(ManoeuvreKind.class);
        m.put(ManoeuvreKind.STALL_LEVEL, 10.0);
        m.put(ManoeuvreKind.STALL_TURN, 10.0);
        m.put(ManoeuvreKind.LOOP, 8.0);
        m.put(ManoeuvreKind.WIND_UP_TURN, 8.0);
        m.put(ManoeuvreKind.LEVEL_ACCEL, 15.0);
        m.put(ManoeuvreKind.PITCH_DOUBLET, 2.0);
        m.put(ManoeuvreKind.PHUGOID, 30.0);
        m.put(ManoeuvreKind.SIDESLIP, 8.0);
        m.put(ManoeuvreKind.AILERON_ROLL, 2.0);
        m.put(ManoeuvreKind.STABILISED, 15.0);
        return m;
    }

    /** Shortest point of a kind, s. */
    public double minDurationS(ManoeuvreKind kind) {
        return minDurationS.get(kind);
    }

    /** True unless the named rule is in {@link #disabledRules()}. */
    public boolean ruleEnabled(String name) {
        return !disabledRules.contains(name);
    }

    /** True when an open point of kind {@code from} may become {@code to}. */
    public boolean allowsSwitch(ManoeuvreKind from, ManoeuvreKind to) {
        return switches.contains(new KindSwitch(from, to));
    }

    /**
     * Upper bound on the live-begin delay, s, for a probability that steps from {@code from} to {@code to} and then
     * stays at or above {@code to}, with ticks {@code tickS} apart: the smoother's step delay to p_on, the hold t_on,
     * and one tick each for the step, the p_on crossing and the end of the hold falling between ticks.
     */
    public double beginDelayBoundS(double from, double to, double tickS) {
        return smoothing.create(smoothing == Smoothing.NONE ? 1.0 : smoothingS, 1)
                .stepDelayS(from, to, enterProbability) + enterS + 3 * tickS;
    }

    public DetectorSettings withSmoothing(Smoothing s, double timeS) {
        return new DetectorSettings(s, timeS, enterProbability, enterS, leaveProbability, leaveS, edgeProbability,
                edgeDebounceS, maxRefineS, mergeGapS, switchMargin, switches, minDurationS, maxTickGapS,
                disabledRules, guards, boundaries);
    }

    public DetectorSettings withEnter(double probability, double holdS) {
        return new DetectorSettings(smoothing, smoothingS, probability, holdS, leaveProbability, leaveS,
                edgeProbability, edgeDebounceS, maxRefineS, mergeGapS, switchMargin, switches, minDurationS,
                maxTickGapS, disabledRules, guards, boundaries);
    }

    public DetectorSettings withLeave(double probability, double holdS) {
        return new DetectorSettings(smoothing, smoothingS, enterProbability, enterS, probability, holdS,
                edgeProbability, edgeDebounceS, maxRefineS, mergeGapS, switchMargin, switches, minDurationS,
                maxTickGapS, disabledRules, guards, boundaries);
    }

    public DetectorSettings withEdge(double probability, double debounceS, double maxRefine) {
        return new DetectorSettings(smoothing, smoothingS, enterProbability, enterS, leaveProbability, leaveS,
                probability, debounceS, maxRefine, mergeGapS, switchMargin, switches, minDurationS, maxTickGapS,
                disabledRules, guards, boundaries);
    }

    public DetectorSettings withMergeGapS(double s) {
        return new DetectorSettings(smoothing, smoothingS, enterProbability, enterS, leaveProbability, leaveS,
                edgeProbability, edgeDebounceS, maxRefineS, s, switchMargin, switches, minDurationS, maxTickGapS,
                disabledRules, guards, boundaries);
    }

    public DetectorSettings withSwitchMargin(double margin) {
        return new DetectorSettings(smoothing, smoothingS, enterProbability, enterS, leaveProbability, leaveS,
                edgeProbability, edgeDebounceS, maxRefineS, mergeGapS, margin, switches, minDurationS, maxTickGapS,
                disabledRules, guards, boundaries);
    }

    public DetectorSettings withSwitches(Set<KindSwitch> s) {
        return new DetectorSettings(smoothing, smoothingS, enterProbability, enterS, leaveProbability, leaveS,
                edgeProbability, edgeDebounceS, maxRefineS, mergeGapS, switchMargin, s, minDurationS, maxTickGapS,
                disabledRules, guards, boundaries);
    }

    public DetectorSettings withMinDurationS(ManoeuvreKind kind, double s) {
        Map<ManoeuvreKind, Double> m = new EnumMap<>(minDurationS);
        m.put(kind, s);
        return withMinDurationsS(m);
    }

    public DetectorSettings withMinDurationsS(Map<ManoeuvreKind, Double> m) {
        return new DetectorSettings(smoothing, smoothingS, enterProbability, enterS, leaveProbability, leaveS,
                edgeProbability, edgeDebounceS, maxRefineS, mergeGapS, switchMargin, switches, m, maxTickGapS,
                disabledRules, guards, boundaries);
    }

    public DetectorSettings withMaxTickGapS(double s) {
        return new DetectorSettings(smoothing, smoothingS, enterProbability, enterS, leaveProbability, leaveS,
                edgeProbability, edgeDebounceS, maxRefineS, mergeGapS, switchMargin, switches, minDurationS, s,
                disabledRules, guards, boundaries);
    }

    /** These rules switched off as well as those already off (some are off by default, as {@code accel-gain}). */
    public DetectorSettings withRulesOff(java.util.Collection<String> names) {
        Set<String> off = new TreeSet<>(disabledRules);
        off.addAll(names);
        return withDisabledRules(off);
    }

    /** Exactly these rules switched off (a rule off by default is on unless named). */
    public DetectorSettings withDisabledRules(Set<String> names) {
        return new DetectorSettings(smoothing, smoothingS, enterProbability, enterS, leaveProbability, leaveS,
                edgeProbability, edgeDebounceS, maxRefineS, mergeGapS, switchMargin, switches, minDurationS,
                maxTickGapS, names, guards, boundaries);
    }

    public DetectorSettings withBoundaries(BoundarySettings b) {
        return new DetectorSettings(smoothing, smoothingS, enterProbability, enterS, leaveProbability, leaveS,
                edgeProbability, edgeDebounceS, maxRefineS, mergeGapS, switchMargin, switches, minDurationS,
                maxTickGapS, disabledRules, guards, b);
    }

    public DetectorSettings withGuards(GuardSettings g) {
        return new DetectorSettings(smoothing, smoothingS, enterProbability, enterS, leaveProbability, leaveS,
                edgeProbability, edgeDebounceS, maxRefineS, mergeGapS, switchMargin, switches, minDurationS,
                maxTickGapS, disabledRules, g, boundaries);
    }
}
