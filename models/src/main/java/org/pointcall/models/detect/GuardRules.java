package org.pointcall.models.detect;

import java.util.ArrayList;
import java.util.List;

import org.pointcall.shared.error.PointcallException;
import org.pointcall.shared.kind.ManoeuvreKind;

/** The named guard rules, which kinds each checks, and how to make them. */
public final class GuardRules {
    /** A loop passes through the vertical (or inverted over the top). */
    public static final String LOOP_PITCH_90 = "loop-pitch-90";
    /** A stall shows an AoA peak with a lift break; its {@code break} is the AoA maximum. */
    public static final String STALL_AOA_PEAK = "stall-aoa-peak";
    /** An aileron roll accumulates a full turn of bank. */
    public static final String ROLL_360 = "roll-360";
    /** A wind-up turn reaches a load factor well above 1 g. */
    public static final String WINDUP_NZ = "windup-nz";
    /** A pitch doublet reverses its pitch rate. */
    public static final String DOUBLET_Q_REVERSAL = "doublet-q-reversal";
    /** A stabilised point holds altitude and speed. */
    public static final String STABILISED_STEADY = "stabilised-steady";
    /** A sideslip reaches a few degrees of sideslip angle. */
    public static final String SIDESLIP_BETA = "sideslip-beta";

    /** Every rule name, in documentation order. */
    public static final List<String> NAMES = List.of(LOOP_PITCH_90, STALL_AOA_PEAK, ROLL_360, WINDUP_NZ,
            DOUBLET_Q_REVERSAL, STABILISED_STEADY, SIDESLIP_BETA);

    private GuardRules() {
    }

    /** Names of the rules that check {@code kind} (none for level acceleration and phugoid). */
    public static List<String> namesFor(ManoeuvreKind kind) {
        switch (kind) {
            case LOOP:
                return List.of(LOOP_PITCH_90);
            case STALL_LEVEL:
            case STALL_TURN:
                return List.of(STALL_AOA_PEAK);
            case AILERON_ROLL:
                return List.of(ROLL_360);
            case WIND_UP_TURN:
                return List.of(WINDUP_NZ);
            case PITCH_DOUBLET:
                return List.of(DOUBLET_Q_REVERSAL);
            case STABILISED:
                return List.of(STABILISED_STEADY);
            case SIDESLIP:
                return List.of(SIDESLIP_BETA);
            default:
                return List.of();
        }
    }

    /**
     * A fresh instance of a rule checking {@code kind}, already started.
     *
     * @throws PointcallException when the name is unknown or the rule does not check that kind
     */
    public static GuardRule create(String name, ManoeuvreKind kind, GuardSettings g) {
        if (!namesFor(kind).contains(name)) {
            throw new PointcallException("no guard rule '" + name + "' for " + kind.key() + "; its rules: "
                    + namesFor(kind) + ", all rules: " + NAMES);
        }
        GuardRule r;
        switch (name) {
            case LOOP_PITCH_90:
                r = new LoopPitchRule(kind, g);
                break;
            case STALL_AOA_PEAK:
                r = new StallAoaPeakRule(kind, g);
                break;
            case ROLL_360:
                r = new RollRule(kind, g);
                break;
            case WINDUP_NZ:
                r = new WindupNzRule(kind, g);
                break;
            case DOUBLET_Q_REVERSAL:
                r = new DoubletQReversalRule(kind, g);
                break;
            case STABILISED_STEADY:
                r = new StabilisedSteadyRule(kind, g);
                break;
            default:
                r = new SideslipBetaRule(kind, g);
                break;
        }
        r.start(PointEvent.UNKNOWN_NS);
        return r;
    }

    /** The enabled rules for {@code kind}, fresh and started. */
    public static GuardRule[] forKind(ManoeuvreKind kind, DetectorSettings settings) {
        List<GuardRule> out = new ArrayList<>();
        for (String n : namesFor(kind)) {
            if (settings.ruleEnabled(n)) {
                out.add(create(n, kind, settings.guards()));
            }
        }
        return out.toArray(new GuardRule[0]);
    }
}
