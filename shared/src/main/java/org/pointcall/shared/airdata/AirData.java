package org.pointcall.shared.airdata;

import org.pointcall.shared.error.Plain;
import org.pointcall.shared.atmosphere.StandardAtmosphere;

/**
 * Pitot-static air-data relations for air as an ideal gas with gamma 1.4, SI, static and allocation-free (NASA
 * RP-1046, Gracey 1980; NASA TM-104316, Haering 1995).
 *
 * <ul>
 * <li>Subsonic (isentropic): qc/p = (1 + 0.2 M^2)^3.5 - 1, and with p0, a0 for calibrated airspeed.</li>
 * <li>Supersonic (Rayleigh pitot, normal shock ahead of the probe): (qc + p)/p = 166.9216 M^7 / (7 M^2 - 1)^2.5.
 * The constant is written here as its exact origin 1.2^3.5 6^2.5, so both forms give the same value at M = 1 to the
 * last bit instead of to the seven digits of the rounded constant.</li>
 * </ul>
 *
 * <p>A NaN input gives NaN, so an absent sample flows through a derivation without an exception per sample. A
 * negative speed or impact pressure, a static pressure, temperature or density that is not positive, or any infinite
 * input throws {@link IllegalArgumentException}: a small negative impact pressure from a pitot at rest is common,
 * but clamping it is the caller's decision, made visibly.
 */
public final class AirData {
    private AirData() {
    }

    private static final double P0 = StandardAtmosphere.SEA_LEVEL_PRESSURE_PA;
    private static final double A0 = StandardAtmosphere.SEA_LEVEL_SPEED_OF_SOUND_MPS;
    private static final double RHO0 = StandardAtmosphere.SEA_LEVEL_DENSITY_KG_M3;
    private static final double R = StandardAtmosphere.GAS_CONSTANT_J_KG_K;

    /** qc/p at M = 1 (equally qc/p0 at Vc = a0), 1.2^3.5 - 1 = 0.89293: the boundary between the two forms. */
    public static final double SONIC_IMPACT_RATIO = Math.expm1(3.5 * Math.log1p(0.2));
    /** (qc + p)/p at M = 1, 1.2^3.5 = 1.8929 (both forms). */
    public static final double SONIC_PITOT_RATIO = 1.0 + SONIC_IMPACT_RATIO;
    /** Rayleigh pitot constant 1.2^3.5 6^2.5 = 166.9216 (rounded in the literature). */
    public static final double RAYLEIGH_CONSTANT = SONIC_PITOT_RATIO * Math.pow(6.0, 2.5);

    /** Relative step at which the supersonic inverse stops; well inside the 1e-10 the callers need. */
    private static final double SOLVE_RELATIVE_TOLERANCE = 1e-14;
    private static final int SOLVE_MAX_ITERATIONS = 100;

    /** Impact pressure qc, Pa, for a calibrated airspeed (subsonic form up to a0, Rayleigh form above). */
    public static double impactPressureFromCas(double casMps) {
        if (!isNonNegative(casMps)) {
            return reject(casMps, "calibrated airspeed", "m/s", NON_NEGATIVE);
        }
        return P0 * impactRatio(casMps / A0);
    }

    /** Calibrated airspeed, m/s, for an impact pressure (inverse of {@link #impactPressureFromCas}). */
    public static double casFromImpactPressure(double qcPa) {
        if (!isNonNegative(qcPa)) {
            return reject(qcPa, "impact pressure", "Pa", NON_NEGATIVE);
        }
        return A0 * machFromPitotRatio(qcPa / P0);
    }

    /** Mach number from impact and static pressure (both regimes). */
    public static double machFromImpactPressure(double qcPa, double staticPa) {
        if (!isNonNegative(qcPa)) {
            return reject(qcPa, "impact pressure", "Pa", NON_NEGATIVE);
        }
        if (!isPositive(staticPa)) {
            return reject(staticPa, "static pressure", "Pa", POSITIVE);
        }
        return machFromPitotRatio(qcPa / staticPa);
    }

    /** Impact pressure, Pa, of a Mach number at a static pressure (both regimes). */
    public static double impactPressureFromMach(double mach, double staticPa) {
        if (!isNonNegative(mach)) {
            return reject(mach, "Mach number", "", NON_NEGATIVE);
        }
        if (!isPositive(staticPa)) {
            return reject(staticPa, "static pressure", "Pa", POSITIVE);
        }
        return staticPa * impactRatio(mach);
    }

    /** qc/p of a Mach number (both regimes). */
    public static double impactPressureRatioFromMach(double mach) {
        if (!isNonNegative(mach)) {
            return reject(mach, "Mach number", "", NON_NEGATIVE);
        }
        return impactRatio(mach);
    }

    /** Mach number of a ratio qc/p (both regimes). */
    public static double machFromImpactPressureRatio(double qcOverP) {
        if (!isNonNegative(qcOverP)) {
            return reject(qcOverP, "impact pressure ratio qc/p", "", NON_NEGATIVE);
        }
        return machFromPitotRatio(qcOverP);
    }

    /** Speed of sound, m/s, at a static temperature. */
    public static double speedOfSoundMps(double staticTempK) {
        if (!isPositive(staticTempK)) {
            return reject(staticTempK, "static temperature", "K", POSITIVE);
        }
        return StandardAtmosphere.speedOfSoundAtMps(staticTempK);
    }

    /** Density p / (R T), kg/m^3. */
    public static double densityKgM3(double staticPa, double staticTempK) {
        if (!isPositive(staticPa)) {
            return reject(staticPa, "static pressure", "Pa", POSITIVE);
        }
        if (!isPositive(staticTempK)) {
            return reject(staticTempK, "static temperature", "K", POSITIVE);
        }
        return staticPa / (R * staticTempK);
    }

    /** True airspeed M a, m/s. */
    public static double trueAirspeedMps(double mach, double staticTempK) {
        if (!isNonNegative(mach)) {
            return reject(mach, "Mach number", "", NON_NEGATIVE);
        }
        return mach * speedOfSoundMps(staticTempK);
    }

    /** Equivalent airspeed TAS sqrt(rho / rho0), m/s. */
    public static double equivalentAirspeedMps(double tasMps, double densityKgM3) {
        if (!isNonNegative(tasMps)) {
            return reject(tasMps, "true airspeed", "m/s", NON_NEGATIVE);
        }
        if (!isPositive(densityKgM3)) {
            return reject(densityKgM3, "density", "kg/m^3", POSITIVE);
        }
        return tasMps * Math.sqrt(densityKgM3 / RHO0);
    }

    /**
     * Static (ambient) temperature T = Tt / (1 + 0.2 r M^2), K, from a total-temperature probe with recovery factor
     * r (1 for a perfect stagnation probe).
     */
    public static double staticTemperatureK(double totalTempK, double mach, double recoveryFactor) {
        if (!isPositive(totalTempK)) {
            return reject(totalTempK, "total temperature", "K", POSITIVE);
        }
        return totalTempK / heatRise(mach, recoveryFactor);
    }

    /** Indicated total temperature Tt = T (1 + 0.2 r M^2), K; inverse of {@link #staticTemperatureK}. */
    public static double totalTemperatureK(double staticTempK, double mach, double recoveryFactor) {
        if (!isPositive(staticTempK)) {
            return reject(staticTempK, "static temperature", "K", POSITIVE);
        }
        return staticTempK * heatRise(mach, recoveryFactor);
    }

    /** Density altitude, m, of the air at this static pressure and temperature (standard atmosphere inverse). */
    public static double densityAltitudeM(double staticPa, double staticTempK) {
        return StandardAtmosphere.densityAltitudeM(densityKgM3(staticPa, staticTempK));
    }

    private static double heatRise(double mach, double recoveryFactor) {
        if (!isNonNegative(mach)) {
            return reject(mach, "Mach number", "", NON_NEGATIVE);
        }
        if (!(recoveryFactor >= 0.0 && recoveryFactor <= 1.0)) {
            if (Double.isNaN(recoveryFactor)) {
                return Double.NaN;
            }
            throw new IllegalArgumentException("recovery factor must be between 0 and 1, got "
                    + Plain.of(recoveryFactor));
        }
        return 1.0 + 0.2 * recoveryFactor * mach * mach;
    }

    /**
     * qc/p of a Mach number (or qc/p0 of Vc/a0). The subsonic form goes through log1p/expm1 because
     * (1 + 0.2 M^2)^3.5 - 1 written directly loses digits to cancellation at low speed (six of them at 1 kt).
     */
    private static double impactRatio(double m) {
        double m2 = m * m;
        if (m <= 1.0) {
            return Math.expm1(3.5 * Math.log1p(0.2 * m2));
        }
        double d = 7.0 * m2 - 1.0;
        double m3 = m2 * m;
        return RAYLEIGH_CONSTANT * m3 * m3 * m / (d * d * Math.sqrt(d)) - 1.0;
    }

    /** Mach (or Vc/a0) of an impact-pressure ratio qc/p (or qc/p0). */
    private static double machFromPitotRatio(double qcOverP) {
        if (qcOverP <= SONIC_IMPACT_RATIO) {
            return Math.sqrt(5.0 * Math.expm1(Math.log1p(qcOverP) / 3.5));
        }
        return supersonicMach(qcOverP + 1.0);
    }

    /**
     * Solves K m^7 / (7 m^2 - 1)^2.5 = ratio for m > 1, in logs: g(m) = ln K + 7 ln m - 2.5 ln(7 m^2 - 1) - ln ratio
     * rises monotonically (g' = (14 m^2 - 7) / (m (7 m^2 - 1)) > 0). The root is bracketed by m = 1 (g < 0) and
     * m = sqrt(ratio 7^2.5 / K) (g > 0, since 7 m^2 - 1 < 7 m^2); Newton steps, with bisection whenever a step
     * would leave the bracket, converge in a handful of iterations.
     */
    private static double supersonicMach(double ratio) {
        double target = Math.log(ratio / RAYLEIGH_CONSTANT);
        double lo = 1.0;
        double hi = Math.sqrt(ratio * Math.pow(7.0, 2.5) / RAYLEIGH_CONSTANT);
        // first fixed-point step of the classic iteration m = 0.881285 sqrt(ratio (1 - 1/(7 m^2))^2.5) from m = 1
        double m = hi * Math.pow(6.0 / 7.0, 1.25);
        if (!(m > lo && m < hi)) {
            m = 0.5 * (lo + hi);
        }
        for (int k = 0; k < SOLVE_MAX_ITERATIONS; k++) {
            double d = 7.0 * m * m - 1.0;
            double g = 7.0 * Math.log(m) - 2.5 * Math.log(d) - target;
            if (g == 0.0) {
                return m;
            }
            if (g < 0.0) {
                lo = m;
            } else {
                hi = m;
            }
            double slope = (14.0 * m * m - 7.0) / (m * d);
            double next = m - g / slope;
            if (!(next > lo && next < hi)) {
                next = 0.5 * (lo + hi);
            }
            if (Math.abs(next - m) <= SOLVE_RELATIVE_TOLERANCE * m) {
                return next;
            }
            m = next;
        }
        // the bracket halves at worst each step, so 100 iterations cannot be exhausted for a finite ratio
        throw new IllegalStateException("supersonic pitot inverse did not converge for (qc + p)/p = " + ratio);
    }

    private static boolean isNonNegative(double v) {
        return v >= 0.0 && v < Double.POSITIVE_INFINITY;
    }

    private static boolean isPositive(double v) {
        return v > 0.0 && v < Double.POSITIVE_INFINITY;
    }

    private static final String NON_NEGATIVE = "zero or positive";
    private static final String POSITIVE = "positive";

    /** NaN for an absent sample; otherwise one plain line naming the quantity and the rule it broke. */
    private static double reject(double v, String what, String unit, String rule) {
        if (Double.isNaN(v)) {
            return Double.NaN;
        }
        String u = unit.isEmpty() ? "" : " " + unit;
        if (v == Double.POSITIVE_INFINITY) {
            throw new IllegalArgumentException(what + " must be finite, got " + v + u);
        }
        throw new IllegalArgumentException(what + " must be " + rule + ", got " + Plain.of(v) + u);
    }
}
