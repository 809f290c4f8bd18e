package org.pointcall.ingest.sim.airframe;

import java.util.Objects;
import org.pointcall.shared.airdata.PositionErrorCorrection;

/**
 * One airframe profile: everything the flight model needs to fly it and the static-source calibration the sensor
 * models need to make its air data look measured.
 *
 * @param name              file key, lower case, digits and dashes ({@code veskarn-02})
 * @param description       one line for listings
 * @param mass              mass and inertia
 * @param geometry          reference geometry
 * @param longitudinal      attached-flow longitudinal aerodynamics
 * @param lateral           lateral-directional derivatives
 * @param stall             separation, post-stall and wing drop
 * @param engine            thrust and fuel flow
 * @param controls          surfaces, travels and actuator rates
 * @param staticSourceError position error dPp/qc of the static source against indicated Mach
 */
public record Airframe(String name, String description, MassProperties mass, Geometry geometry,
        LongitudinalAero longitudinal, LateralAero lateral, StallCharacteristics stall, Engine engine,
        ControlSurfaces controls, PositionErrorCorrection.Table staticSourceError) {

    /** What a profile name may look like. */
    public static final String NAME_PATTERN = "[a-z0-9][a-z0-9-]{0,63}";

    public Airframe {
        Objects.requireNonNull(name, "name");
        if (!name.matches(NAME_PATTERN)) {
            throw new IllegalArgumentException("airframe name must be lower-case letters, digits and dashes, got '"
                    + name + "'");
        }
        Objects.requireNonNull(description, "description");
        Objects.requireNonNull(mass, "mass");
        Objects.requireNonNull(geometry, "geometry");
        Objects.requireNonNull(longitudinal, "longitudinal");
        Objects.requireNonNull(lateral, "lateral");
        Objects.requireNonNull(stall, "stall");
        Objects.requireNonNull(engine, "engine");
        Objects.requireNonNull(controls, "controls");
        Objects.requireNonNull(staticSourceError, "staticSourceError");
    }

    /** A copy with another mass and inertia (for scenarios and tests). */
    public Airframe withMass(MassProperties m) {
        return new Airframe(name, description, m, geometry, longitudinal, lateral, stall, engine, controls,
                staticSourceError);
    }

    /** A copy with other stall characteristics. */
    public Airframe withStall(StallCharacteristics s) {
        return new Airframe(name, description, mass, geometry, longitudinal, lateral, s, engine, controls,
                staticSourceError);
    }
}
