package org.pointcall.models.detect;

import java.util.List;

import org.pointcall.shared.kind.ManoeuvreKind;

/**
 * The named boundary rules: once the classifier has found a point, these place its begin and end from the physics,
 * where the smoothed class probability is seconds off. Each is switched off by naming it in
 * {@link DetectorSettings#disabledRules()}, like a guard rule. See {@link BoundaryRefiner} for how each works.
 */
public final class BoundaryRules {
    /** The begin goes back (or forward) to where the aircraft left its steady entry: the first input's onset. */
    public static final String BEGIN_DEPARTURE = "begin-departure";
    /** The end goes to where the aircraft is back in steady level flight after the manoeuvre's core. */
    public static final String END_RECOVERY = "end-recovery";
    /** A level acceleration spans the whole stretch of gaining speed, up to the highest speed before it is lost. */
    public static final String ACCEL_EXTENT = "accel-extent";
    /** A stabilised point spans the whole hold of its Hp and CAS around the classifier's stretch. */
    public static final String STABILISED_EXTENT = "stabilised-extent";
    /** A stall's kind, wings-level or turning, is told by the bank it held on the way to its break. */
    public static final String STALL_BANK = "stall-bank";
    /**
     * A level acceleration starts from settled, wings-level flight without sideslip (common practice: stabilise at
     * the start speed, then full power), not out of another manoeuvre's recovery with the power already up.
     */
    public static final String ACCEL_SETTLED_ENTRY = "accel-settled-entry";
    /**
     * A level acceleration is flown level: its altitude drifts by at most 100 ft a minute (least squares over the
     * point), not a speed-up in a climb to the next point's altitude.
     */
    public static final String ACCEL_LEVEL = "accel-level";
    /** A level acceleration must gain a good share of its entry speed: the whole point is judged on it. */
    public static final String ACCEL_GAIN = "accel-gain";
    /**
     * A kind enters at a lower smoothed probability when every one of its rules that can judge live has already
     * passed (a doublet's two reversals, a roll's full turn): the physics vouches for a classifier that is unsure.
     */
    public static final String PHYSICS_ENTRY = "physics-entry";
    /**
     * A pitch doublet is found in the pitch rate alone, without the classifier: quiet, an input of two opposite
     * lobes whose areas nearly cancel, a settling free response with the speed held ({@link DoubletWatch}).
     */
    public static final String DOUBLET_SIGNATURE = "doublet-signature";
    /**
     * An aileron roll is found in the roll rate and bank alone, without the classifier: a full turn of bank while the
     * roll rate is up, from quiet ({@link RollWatch}).
     */
    public static final String ROLL_SIGNATURE = "roll-signature";
    /**
     * A stabilised point is found in the air data and attitude alone, without the classifier: steady, unaccelerated,
     * wings-level flight held for {@code HoldWatch}'s minimum ({@link HoldWatch}).
     */
    public static final String HOLD_SIGNATURE = "hold-signature";
    /** Long points (level acceleration, phugoid, stabilised) bridge longer gaps of their own kind. */
    public static final String FRAGMENT_MERGE = "fragment-merge";
    /**
     * With a test card, the card session shows the card's next point begun from its first move off its steady entry
     * ({@code OnsetWatch} in {@code models.card}), before the detector can tell the kind; off, a point is shown begun
     * when the detector begins it. The detector itself does not read it.
     */
    public static final String CARD_ONSET = "card-onset";

    /** Every boundary rule name, in documentation order. */
    public static final List<String> NAMES = List.of(BEGIN_DEPARTURE, END_RECOVERY, ACCEL_EXTENT, ACCEL_GAIN,
            ACCEL_LEVEL, ACCEL_SETTLED_ENTRY, CARD_ONSET, DOUBLET_SIGNATURE, FRAGMENT_MERGE, HOLD_SIGNATURE,
            PHYSICS_ENTRY, ROLL_SIGNATURE, STABILISED_EXTENT, STALL_BANK);

    private BoundaryRules() {
    }

    /** Names of the boundary rules that apply to {@code kind}. */
    public static List<String> namesFor(ManoeuvreKind kind) {
        switch (kind) {
            case STALL_LEVEL:
            case STALL_TURN:
                // an AoA peak with a fall is common outside stalls: too weak to vouch for an entry
                return List.of(BEGIN_DEPARTURE, END_RECOVERY, STALL_BANK);
            case AILERON_ROLL:
                return List.of(BEGIN_DEPARTURE, END_RECOVERY, PHYSICS_ENTRY, ROLL_SIGNATURE);
            case WIND_UP_TURN:
            case SIDESLIP:
                return List.of(BEGIN_DEPARTURE, END_RECOVERY, PHYSICS_ENTRY);
            case LOOP:
                return List.of(BEGIN_DEPARTURE, END_RECOVERY, PHYSICS_ENTRY);
            case PITCH_DOUBLET:
                return List.of(DOUBLET_SIGNATURE, PHYSICS_ENTRY);
            case PHUGOID:
                return List.of(BEGIN_DEPARTURE, FRAGMENT_MERGE);
            case LEVEL_ACCEL:
                return List.of(ACCEL_EXTENT, ACCEL_GAIN, ACCEL_LEVEL, ACCEL_SETTLED_ENTRY, FRAGMENT_MERGE);
            case STABILISED:
                return List.of(STABILISED_EXTENT, FRAGMENT_MERGE, HOLD_SIGNATURE);
            default:
                return List.of();
        }
    }

    /** True when {@code name} applies to {@code kind} and is not switched off in {@code settings}. */
    public static boolean applies(String name, ManoeuvreKind kind, DetectorSettings settings) {
        return settings.ruleEnabled(name) && namesFor(kind).contains(name);
    }
}
