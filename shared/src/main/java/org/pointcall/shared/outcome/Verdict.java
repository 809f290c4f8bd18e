package org.pointcall.shared.outcome;

import java.util.Optional;

import com.fasterxml.jackson.annotation.JsonCreator;
import com.fasterxml.jackson.annotation.JsonValue;

/** The call on a flown test point: what the tool proposes, or what the engineer decided. */
public enum Verdict {
    /** Every band held in its phase and the point was completed. */
    GOOD("good"),
    /** Completed, but at least one band or a safety limit was broken: fly it again. */
    REPEAT("repeat"),
    /** Abandoned before its end (discarded by the detector, or the stream stopped mid-point). */
    INCOMPLETE("incomplete");

    private final String key;

    Verdict(String key) {
        this.key = key;
    }

    /** The word used in files and command lines. */
    @JsonValue
    public String key() {
        return key;
    }

    public static Optional<Verdict> byKey(String key) {
        for (Verdict v : values()) {
            if (v.key.equalsIgnoreCase(key)) {
                return Optional.of(v);
            }
        }
        return Optional.empty();
    }

    /** Reads a key as written in files. */
    @JsonCreator
    public static Verdict fromKey(String key) {
        for (Verdict v : values()) {
            if (v.key.equals(key)) {
                return v;
            }
        }
        throw new IllegalArgumentException("unknown verdict '" + key + "'");
    }
}
