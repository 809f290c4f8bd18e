package org.pointcall.ingest.sim.pilot;

import java.util.EnumSet;
import java.util.Optional;
import java.util.Set;

import org.pointcall.shared.kind.ManoeuvreKind;

/**
 * An imperfection given to the pilot on purpose for one point, so that some points land outside their bands; the
 * truth names it. Sizes are typical slips of the trade (common practice), not measured statistics.
 */
public enum Flaw {
    /** A clean point. */
    NONE("none", "no flaw"),
    /** Entered 8 kt fast (Mach 0.015 high on a point flown on Mach). */
    ENTRY_FAST("entry-fast", "entered 8 kt (or Mach 0.015) fast"),
    /** Entered 8 kt slow (Mach 0.015 low on a point flown on Mach). */
    ENTRY_SLOW("entry-slow", "entered 8 kt (or Mach 0.015) slow"),
    /** Entered 400 ft high. */
    ENTRY_HIGH("entry-high", "entered 400 ft high"),
    /** Entered 400 ft low. */
    ENTRY_LOW("entry-low", "entered 400 ft low"),
    /** Pulled 0.5 g more than the set load factor (a doublet flown with 2.5 times the input). */
    OVER_PULL("over-pull", "pulled 0.5 g past the target (doublet: 2.5 times the input)"),
    /** Decelerated into the stall at twice the set entry rate. */
    ENTRY_RATE_FAST("entry-rate-fast", "decelerated at twice the set entry rate"),
    /** Flew 8 deg more bank than set (or 12 deg off wings level). */
    BANK_OFF("bank-off", "flew 8 deg more bank than set (12 deg off wings level)"),
    /** Held the condition for 60 % of the set time (a phugoid for less than a cycle). */
    SHORT_HOLD("short-hold", "held the condition for 60 % of the set time"),
    /** Tracked the targets loosely: four times the usual tracking error. */
    LOOSE_TRACKING("loose-tracking", "tracked the targets with four times the usual error");

    private final String key;
    private final String description;

    Flaw(String key, String description) {
        this.key = key;
        this.description = description;
    }

    /** The word written in the truth file. */
    public String key() {
        return key;
    }

    public String description() {
        return description;
    }

    public static Optional<Flaw> byKey(String key) {
        for (Flaw f : values()) {
            if (f.key.equals(key)) {
                return Optional.of(f);
            }
        }
        return Optional.empty();
    }

    /** The flaws that make sense for a kind (never {@link #NONE}), in declaration order. */
    public static Set<Flaw> applicableTo(ManoeuvreKind kind) {
        return switch (kind) {
            case STALL_LEVEL -> EnumSet.of(ENTRY_FAST, ENTRY_HIGH, ENTRY_LOW, ENTRY_RATE_FAST, LOOSE_TRACKING);
            case STALL_TURN -> EnumSet.of(ENTRY_FAST, ENTRY_HIGH, ENTRY_LOW, ENTRY_RATE_FAST, BANK_OFF);
            case LOOP -> EnumSet.of(ENTRY_FAST, ENTRY_SLOW, ENTRY_HIGH, ENTRY_LOW, OVER_PULL);
            case WIND_UP_TURN -> EnumSet.of(ENTRY_FAST, ENTRY_SLOW, ENTRY_HIGH, ENTRY_LOW, OVER_PULL);
            case LEVEL_ACCEL -> EnumSet.of(ENTRY_HIGH, ENTRY_LOW, LOOSE_TRACKING);
            case PITCH_DOUBLET -> EnumSet.of(ENTRY_FAST, ENTRY_SLOW, ENTRY_HIGH, ENTRY_LOW, OVER_PULL);
            case PHUGOID -> EnumSet.of(ENTRY_FAST, ENTRY_SLOW, ENTRY_HIGH, ENTRY_LOW, BANK_OFF, SHORT_HOLD);
            case SIDESLIP -> EnumSet.of(ENTRY_FAST, ENTRY_SLOW, ENTRY_HIGH, ENTRY_LOW, LOOSE_TRACKING);
            case AILERON_ROLL -> EnumSet.of(ENTRY_FAST, ENTRY_SLOW, ENTRY_HIGH, ENTRY_LOW);
            case STABILISED -> EnumSet.of(ENTRY_FAST, ENTRY_SLOW, ENTRY_HIGH, ENTRY_LOW, SHORT_HOLD,
                    LOOSE_TRACKING);
        };
    }
}
