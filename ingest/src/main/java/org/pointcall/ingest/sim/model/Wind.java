package org.pointcall.ingest.sim.model;

import org.pointcall.shared.error.Plain;

/**
 * Steady wind: the velocity of the air mass over the ground in NED axes (the way it blows, not where it comes
 * from: a westerly of 10 m/s is {@code east = 10}).
 */
public record Wind(double northMps, double eastMps, double downMps) {
    /** No wind. */
    public static final Wind CALM = new Wind(0, 0, 0);

    public Wind {
        if (!Double.isFinite(northMps) || !Double.isFinite(eastMps) || !Double.isFinite(downMps)) {
            throw new IllegalArgumentException("wind components must be finite, got " + Plain.of(northMps) + ", "
                    + Plain.of(eastMps) + ", " + Plain.of(downMps) + " m/s");
        }
    }

    /** Wind from a direction (meteorological: where it comes from, radians clockwise from north), horizontal. */
    public static Wind from(double fromDirectionRad, double speedMps) {
        return new Wind(-speedMps * Math.cos(fromDirectionRad), -speedMps * Math.sin(fromDirectionRad), 0.0);
    }
}
