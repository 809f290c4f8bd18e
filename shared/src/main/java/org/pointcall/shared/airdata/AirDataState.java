package org.pointcall.shared.airdata;

/**
 * One flight condition worked out in full, SI. Printing it in the trade's units is the caller's job
 * ({@code org.pointcall.shared.units.Units}).
 *
 * @param pressureAltitudeM   pressure altitude, m
 * @param staticPressurePa    static pressure, Pa
 * @param staticTemperatureK  static air temperature, K
 * @param densityKgM3         density, kg/m^3
 * @param speedOfSoundMps     speed of sound, m/s
 * @param impactPressurePa    impact pressure qc, Pa
 * @param impactPressureRatio qc/p
 * @param mach                Mach number
 * @param casMps              calibrated airspeed, m/s
 * @param easMps              equivalent airspeed, m/s
 * @param tasMps              true airspeed, m/s
 * @param densityAltitudeM    density altitude, m; NaN when the density lies outside the standard atmosphere model
 *                            (a hot day near the model's top, a cold one near its bottom)
 * @param isaDeviationK       static temperature minus the standard temperature at the pressure altitude, K
 */
public record AirDataState(double pressureAltitudeM, double staticPressurePa, double staticTemperatureK,
                           double densityKgM3, double speedOfSoundMps, double impactPressurePa,
                           double impactPressureRatio, double mach, double casMps, double easMps, double tasMps,
                           double densityAltitudeM, double isaDeviationK) {
    private static final String[] NAMES = {"pressure altitude", "static pressure", "static temperature", "density",
        "speed of sound", "impact pressure", "qc/p", "Mach", "CAS", "EAS", "TAS", "ISA deviation"};

    public AirDataState {
        double[] values = {pressureAltitudeM, staticPressurePa, staticTemperatureK, densityKgM3, speedOfSoundMps,
            impactPressurePa, impactPressureRatio, mach, casMps, easMps, tasMps, isaDeviationK};
        for (int i = 0; i < values.length; i++) {
            if (!Double.isFinite(values[i])) {
                throw new IllegalArgumentException("air data state: " + NAMES[i] + " must be finite, got " + values[i]);
            }
        }
    }
}
