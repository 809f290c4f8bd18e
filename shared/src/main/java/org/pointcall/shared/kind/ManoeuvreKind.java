package org.pointcall.shared.kind;

import java.util.HashSet;
import java.util.List;
import java.util.Optional;
import java.util.Set;

import org.pointcall.shared.units.Unit;

/**
 * The manoeuvre kinds pointcall knows: the one place a kind is added. Each has the key written in card files, its
 * display name, the key instants its detector marks (which {@code instant} and {@code rate} bands refer to) and the
 * metrics its analysis reports (which {@code result} bands refer to). The time between points ("transit") is not a
 * kind: it is the absence of a point.
 */
public enum ManoeuvreKind {
    STALL_LEVEL("stall-level", "Wings-level stall",
            "Slow, wings level, at a steady entry rate until the stall break, then recover.",
            List.of("break", "recovery"), stallMetrics(false)),
    STALL_TURN("stall-turn", "Turning stall",
            "Slow at a steady entry rate in a banked turn (typically 30 deg) until the break, then recover.",
            List.of("break", "recovery"), stallMetrics(true)),
    LOOP("loop", "Loop",
            "Wings-level pull through the vertical, over the top and back to level flight on the entry heading.",
            List.of("pull", "apex", "exit"), List.of(
                    m("entry-hp", Unit.FOOT, "pressure altitude at the start of the pull"),
                    m("entry-kcas", Unit.KNOT, "calibrated airspeed at the start of the pull"),
                    m("pull-nz", Unit.G, "mean normal load factor over the first 2 s of the pull"),
                    m("max-nz", Unit.G, "highest normal load factor in the loop"),
                    m("apex-hp", Unit.FOOT, "pressure altitude at the apex (inverted, pitch attitude crossing 0)"),
                    m("apex-kcas", Unit.KNOT, "calibrated airspeed at the apex"),
                    m("exit-hp-change", Unit.FOOT, "pressure altitude at exit minus at entry"),
                    m("exit-heading-change", Unit.DEGREE, "heading at exit minus at entry, -180 to 180"),
                    m("duration", Unit.SECOND, "time from the pull to the exit"))),
    WIND_UP_TURN("wind-up-turn", "Wind-up turn",
            "Constant-Mach descending turn with load factor raised slowly and steadily.",
            List.of("nz-max"), List.of(
                    m("mach-mean", Unit.MACH, "mean Mach number during the wind-up"),
                    m("mach-spread", Unit.MACH, "highest minus lowest Mach number during the wind-up"),
                    m("nz-max", Unit.G, "highest normal load factor reached"),
                    m("aoa-at-nz-max", Unit.DEGREE, "angle of attack at the highest load factor"),
                    m("nz-per-aoa", Unit.NONE, "least-squares slope of Nz against AoA, in g per degree"))),
    LEVEL_ACCEL("level-accel", "Level acceleration",
            "Maximum-thrust acceleration at constant altitude and 1 g over a Mach range.",
            List.of("start", "end"), List.of(
                    m("hp-spread", Unit.FOOT, "highest minus lowest pressure altitude during the run"),
                    m("mach-start", Unit.MACH, "Mach number at the start of the run"),
                    m("mach-end", Unit.MACH, "Mach number at the end of the run"),
                    m("duration", Unit.SECOND, "time from start to end"))),
    PITCH_DOUBLET("pitch-doublet", "Pitch doublet",
            "Elevator doublet from trim near the short-period frequency, then controls fixed.",
            List.of("input", "release"), List.of(
                    m("sp-frequency", Unit.RADIAN_PER_SECOND, "short-period undamped natural frequency"),
                    m("sp-damping", Unit.NONE, "short-period damping ratio"))),
    PHUGOID("phugoid", "Phugoid",
            "Speed displaced from trim, controls returned to trim and held; at least one to two cycles.",
            List.of("release"), List.of(
                    m("period", Unit.SECOND, "phugoid period"),
                    m("damping", Unit.NONE, "phugoid damping ratio (negative when divergent)"))),
    SIDESLIP("sideslip", "Steady-heading sideslip",
            "Rudder in steps with opposite bank to hold heading, both directions.",
            List.of("max-beta"), List.of(
                    m("rudder-per-beta", Unit.NONE, "slope of rudder position against sideslip, deg per deg"),
                    m("aileron-per-beta", Unit.NONE, "slope of aileron position against sideslip, deg per deg"),
                    m("max-beta", Unit.DEGREE, "largest sideslip angle held, magnitude"))),
    AILERON_ROLL("aileron-roll", "Aileron roll",
            "Full lateral stick roll through 360 deg from wings level.",
            List.of("input", "roll-end"), List.of(
                    m("peak-roll-rate", Unit.DEGREE_PER_SECOND, "largest roll rate, magnitude"),
                    m("time-to-90", Unit.SECOND, "time from the input to 90 deg of bank change"),
                    m("time-to-360", Unit.SECOND, "time from the input to 360 deg of bank change"),
                    m("hp-change", Unit.FOOT, "pressure altitude at the end minus at the input"),
                    m("max-beta", Unit.DEGREE, "largest sideslip angle during the roll, magnitude"))),
    STABILISED("stabilised", "Stabilised point",
            "Trimmed, steady flight held at one condition.",
            List.of("start", "end"), List.of(
                    m("hp-drift", Unit.FOOT_PER_MINUTE, "least-squares slope of pressure altitude over the hold"),
                    m("kcas-drift", Unit.KNOT_PER_MINUTE, "least-squares slope of calibrated airspeed over the hold"),
                    m("heading-drift", Unit.DEGREE_PER_MINUTE, "least-squares slope of heading over the hold"),
                    m("hold-time", Unit.SECOND, "time the condition was held, from the point's begin to its end"),
                    m("steady-time", Unit.SECOND, "length of the steady window the averages and drifts are taken over")));

    private final String key;
    private final String displayName;
    private final String description;
    private final List<String> keyInstants;
    private final List<MetricSpec> metrics;

    ManoeuvreKind(String key, String displayName, String description, List<String> keyInstants,
                  List<MetricSpec> metrics) {
        this.key = key;
        this.displayName = displayName;
        this.description = description;
        this.keyInstants = List.copyOf(keyInstants);
        this.metrics = List.copyOf(metrics);
        Set<String> seen = new HashSet<>();
        for (MetricSpec ms : metrics) {
            if (!seen.add(ms.name())) {
                throw new IllegalStateException(key + " lists metric " + ms.name() + " twice");
            }
        }
    }

    private static MetricSpec m(String name, Unit unit, String description) {
        return new MetricSpec(name, unit, description);
    }

    private static List<MetricSpec> stallMetrics(boolean turning) {
        List<MetricSpec> common = List.of(
                m("entry-rate", Unit.KNOT_PER_SECOND,
                        "deceleration in calibrated airspeed over the 10 s before the break, positive when slowing"),
                m("stall-kcas", Unit.KNOT, "calibrated airspeed at the break"),
                m("max-aoa", Unit.DEGREE, "highest angle of attack"),
                m("nz-at-break", Unit.G, "normal load factor at the break"),
                m("altitude-loss", Unit.FOOT, "pressure altitude at the break minus the lowest in the recovery"),
                m("wing-drop", Unit.DEGREE, "largest change of bank angle from the break into the recovery"),
                m("recovery-time", Unit.SECOND, "time from the break to recovery"));
        if (!turning) {
            return common;
        }
        List<MetricSpec> all = new java.util.ArrayList<>(common);
        all.add(m("bank-at-break", Unit.DEGREE, "bank angle at the break"));
        all.add(m("stall-kcas-1g", Unit.KNOT,
                "1-g equivalent stall speed: KCAS at the break over the square root of the load factor there"));
        return all;
    }

    /** The word used in files ({@code stall-level}). */
    public String key() {
        return key;
    }

    public String displayName() {
        return displayName;
    }

    public String description() {
        return description;
    }

    /** Named instants of this kind's technique, in the order they occur. */
    public List<String> keyInstants() {
        return keyInstants;
    }

    public boolean hasInstant(String name) {
        return keyInstants.contains(name);
    }

    /** Metrics the analysis of this kind reports, in report order. */
    public List<MetricSpec> metrics() {
        return metrics;
    }

    public Optional<MetricSpec> metric(String name) {
        for (MetricSpec ms : metrics) {
            if (ms.name().equals(name)) {
                return Optional.of(ms);
            }
        }
        return Optional.empty();
    }

    public static Optional<ManoeuvreKind> byKey(String key) {
        for (ManoeuvreKind k : values()) {
            if (k.key.equals(key)) {
                return Optional.of(k);
            }
        }
        return Optional.empty();
    }

    /** Every key, comma-separated, for messages that list what is accepted. */
    public static String keys() {
        StringBuilder b = new StringBuilder();
        for (ManoeuvreKind k : values()) {
            b.append(b.length() == 0 ? "" : ", ").append(k.key);
        }
        return b.toString();
    }
}
