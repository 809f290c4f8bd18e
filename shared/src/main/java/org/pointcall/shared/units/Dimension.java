package org.pointcall.shared.units;

/** Physical dimension of a quantity; two units convert into each other only when their dimensions are equal. */
public enum Dimension {
    DIMENSIONLESS,
    LENGTH,
    SPEED,
    ACCELERATION,
    LOAD_FACTOR,
    ANGLE,
    ANGULAR_RATE,
    PRESSURE,
    TEMPERATURE,
    DENSITY,
    TIME,
    FORCE,
    MASS,
    FRACTION,
    RATE_OF_SPEED,
    MASS_FLOW
}
