package org.pointcall.shared.atmosphere;

import org.pointcall.shared.error.Plain;

/**
 * The air at one altitude, SI. Built by {@link #at(double)} for the standard day or by
 * {@link #atPressureAltitude(double, double)} for a day warmer or colder than standard.
 *
 * @param geopotentialAltitudeM geopotential altitude in the standard atmosphere at which this pressure is found,
 *                              that is the pressure altitude; on a non-standard day it is not the true height
 * @param temperatureK          static temperature
 * @param pressurePa            static pressure
 * @param densityKgM3           density
 * @param speedOfSoundMps       speed of sound
 * @param dynamicViscosityPaS   dynamic viscosity (Sutherland)
 */
public record AtmosphereState(double geopotentialAltitudeM, double temperatureK, double pressurePa,
                              double densityKgM3, double speedOfSoundMps, double dynamicViscosityPaS) {
    public AtmosphereState {
        if (!(geopotentialAltitudeM >= StandardAtmosphere.MIN_GEOPOTENTIAL_M
                && geopotentialAltitudeM <= StandardAtmosphere.MAX_GEOPOTENTIAL_M)) {
            throw new IllegalArgumentException(StandardAtmosphere.outOfModel(geopotentialAltitudeM));
        }
        requirePositive("temperature", temperatureK, "K");
        requirePositive("pressure", pressurePa, "Pa");
        requirePositive("density", densityKgM3, "kg/m^3");
        requirePositive("speed of sound", speedOfSoundMps, "m/s");
        requirePositive("dynamic viscosity", dynamicViscosityPaS, "Pa s");
    }

    /** The standard day at a geopotential altitude. */
    public static AtmosphereState at(double hGeopotM) {
        return atPressureAltitude(hGeopotM, 0.0);
    }

    /**
     * A non-standard day: the standard pressure at this pressure altitude, the temperature offset by
     * {@code isaDeviationK}, and density, speed of sound and viscosity from that temperature.
     */
    public static AtmosphereState atPressureAltitude(double pressureAltitudeM, double isaDeviationK) {
        if (!Double.isFinite(isaDeviationK)) {
            throw new IllegalArgumentException("ISA deviation must be a finite number of K, got "
                    + Plain.of(isaDeviationK));
        }
        if (Double.isNaN(pressureAltitudeM)) {
            throw new IllegalArgumentException(StandardAtmosphere.outOfModel(pressureAltitudeM));
        }
        double t = StandardAtmosphere.temperatureK(pressureAltitudeM) + isaDeviationK;
        if (!(t > 0.0)) {
            throw new IllegalArgumentException("ISA deviation " + Plain.of(isaDeviationK) + " K gives "
                    + Plain.of(t) + " K at pressure altitude " + Plain.of(pressureAltitudeM)
                    + " m; the temperature must stay above 0 K");
        }
        double p = StandardAtmosphere.pressurePa(pressureAltitudeM);
        return new AtmosphereState(pressureAltitudeM, t, p, p / (StandardAtmosphere.GAS_CONSTANT_J_KG_K * t),
                StandardAtmosphere.speedOfSoundAtMps(t), StandardAtmosphere.viscosityAtPaS(t));
    }

    private static void requirePositive(String what, double v, String unit) {
        if (!(v > 0.0 && v < Double.POSITIVE_INFINITY)) {
            throw new IllegalArgumentException(what + " must be positive and finite, got " + Plain.of(v) + " " + unit);
        }
    }
}
