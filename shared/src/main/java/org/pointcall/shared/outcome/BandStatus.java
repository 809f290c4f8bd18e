package org.pointcall.shared.outcome;

import com.fasterxml.jackson.annotation.JsonCreator;
import com.fasterxml.jackson.annotation.JsonValue;

/**
 * Where a band's value stands: {@link #WAITING} until the band's phase gives it a value, then {@link #CLEAR}
 * (inside, with room), {@link #MARGINAL} (inside, within {@link #MARGINAL_FRACTION} of the band's width of an edge)
 * or {@link #OUT} (outside).
 */
public enum BandStatus {
    WAITING("waiting"),
    CLEAR("clear"),
    MARGINAL("marginal"),
    OUT("out");

    /** Inside but closer than this fraction of the band's width to an edge counts as marginal. */
    public static final double MARGINAL_FRACTION = 0.1;

    private final String key;

    BandStatus(String key) {
        this.key = key;
    }

    @JsonValue
    public String key() {
        return key;
    }

    /** The status of a value whose margin to the nearer edge is {@code marginFraction} of the band (NaN: waiting). */
    public static BandStatus ofMargin(double marginFraction) {
        if (Double.isNaN(marginFraction)) {
            return WAITING;
        }
        if (marginFraction < 0) {
            return OUT;
        }
        return marginFraction < MARGINAL_FRACTION ? MARGINAL : CLEAR;
    }

    /** Reads a key as written in files. */
    @JsonCreator
    public static BandStatus fromKey(String key) {
        for (BandStatus v : values()) {
            if (v.key.equals(key)) {
                return v;
            }
        }
        throw new IllegalArgumentException("unknown bandstatus '" + key + "'");
    }
}
