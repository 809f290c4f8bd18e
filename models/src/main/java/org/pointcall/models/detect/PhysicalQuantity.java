package org.pointcall.models.detect;

import java.util.EnumSet;
import java.util.Set;

import org.pointcall.shared.units.Dimension;

/**
 * The flight quantities the guard rules read, each with the dictionary name it is found under by default and the
 * dimensions its parameter may have. Values are held in SI: angles in rad, rates in rad/s, speed in m/s, altitude in
 * m, load factor and Mach as plain numbers.
 */
public enum PhysicalQuantity {
    AOA("AoA", Dimension.ANGLE),
    AOS("AoS", Dimension.ANGLE),
    PITCH("Pitch", Dimension.ANGLE),
    ROLL("Roll", Dimension.ANGLE),
    HEADING("Heading", Dimension.ANGLE),
    /** Body roll rate. */
    P("P", Dimension.ANGULAR_RATE),
    /** Body pitch rate. */
    Q("Q", Dimension.ANGULAR_RATE),
    /** Normal load factor. */
    NZ("Nz", Dimension.LOAD_FACTOR, Dimension.DIMENSIONLESS),
    /** Calibrated airspeed. */
    CAS("KCAS", Dimension.SPEED),
    MACH("Mach", Dimension.DIMENSIONLESS),
    /** Pressure altitude. */
    HP("Hp", Dimension.LENGTH);

    /** Number of quantities, the length of the state arrays. */
    public static final int COUNT = values().length;

    private final String defaultName;
    private final Set<Dimension> dimensions;

    PhysicalQuantity(String defaultName, Dimension first, Dimension... more) {
        this.defaultName = defaultName;
        this.dimensions = EnumSet.of(first, more);
    }

    /** Dictionary parameter name looked up when no other is given. */
    public String defaultName() {
        return defaultName;
    }

    /** Dimensions a parameter bound to this quantity may have. */
    public Set<Dimension> dimensions() {
        return dimensions;
    }
}
