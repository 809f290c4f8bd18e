package org.pointcall.shared.dictionary;

import java.util.List;
import java.util.Optional;

import org.pointcall.shared.units.Dimension;

/**
 * The derivations a dictionary may ask for. Inputs are named by role; their dimensions are checked when a dictionary
 * is loaded, so a wrong unit is caught in the file, not in flight.
 */
public enum DerivationMethod {
    /** Pressure altitude from static pressure (1976 U.S. Standard Atmosphere inverse). */
    PRESSURE_ALTITUDE("pressure-altitude", Dimension.LENGTH, List.of("static-pressure"), List.of(Dimension.PRESSURE)),
    /** Calibrated airspeed from impact pressure. */
    CALIBRATED_AIRSPEED("calibrated-airspeed", Dimension.SPEED, List.of("impact-pressure"), List.of(Dimension.PRESSURE)),
    /** Mach number from impact and static pressure. */
    MACH("mach", Dimension.DIMENSIONLESS, List.of("impact-pressure", "static-pressure"),
            List.of(Dimension.PRESSURE, Dimension.PRESSURE)),
    /** True airspeed from Mach and static (or total, with recovery factor 1) temperature. */
    TRUE_AIRSPEED("true-airspeed", Dimension.SPEED, List.of("mach", "static-temperature"),
            List.of(Dimension.DIMENSIONLESS, Dimension.TEMPERATURE)),
    /** Time derivative of one parameter (for example dH/dt from Hp, dV/dt from KTAS), by least squares. */
    RATE("rate", null, List.of("signal"), java.util.Collections.singletonList((Dimension) null)),
    /** Specific excess power Ps = dh/dt + (V/g) dV/dt from altitude and true airspeed. */
    SPECIFIC_EXCESS_POWER("specific-excess-power", Dimension.SPEED, List.of("altitude", "true-airspeed"),
            List.of(Dimension.LENGTH, Dimension.SPEED));

    private final String key;
    private final Dimension output;
    private final List<String> inputRoles;
    private final List<Dimension> inputDimensions;

    DerivationMethod(String key, Dimension output, List<String> inputRoles, List<Dimension> inputDimensions) {
        this.key = key;
        this.output = output;
        this.inputRoles = inputRoles;
        this.inputDimensions = inputDimensions;
    }

    /** The name written in a dictionary file. */
    public String key() {
        return key;
    }

    /** Dimension of the result, or {@code null} when it depends on the input (a rate). */
    public Dimension outputDimension() {
        return output;
    }

    public List<String> inputRoles() {
        return inputRoles;
    }

    /** Dimension each input must have, {@code null} for any. */
    public List<Dimension> inputDimensions() {
        return java.util.Collections.unmodifiableList(inputDimensions);
    }

    public static Optional<DerivationMethod> byKey(String key) {
        for (DerivationMethod m : values()) {
            if (m.key.equals(key)) {
                return Optional.of(m);
            }
        }
        return Optional.empty();
    }
}
