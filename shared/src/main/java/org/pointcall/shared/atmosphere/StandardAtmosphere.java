package org.pointcall.shared.atmosphere;

import org.pointcall.shared.error.Plain;
import org.pointcall.shared.units.Units;

/**
 * The 1976 U.S. Standard Atmosphere (identical to the ICAO standard atmosphere below 32 km) in its geopotential
 * form, from {@value #MIN_GEOPOTENTIAL_M} m to {@value #MAX_GEOPOTENTIAL_M} m geopotential altitude: six layers
 * with constant lapse rate (bases 0, 11, 20, 32, 47 and 51 km, top 71 km), hydrostatic, ideal gas, constant molecular
 * weight. Above 71 km the standard's next layer is valid only to 80 km geometric before the kinetic and
 * molecular-scale temperatures part; nothing an aircraft does needs it, so the model stops at 71 km.
 *
 * <p>All methods are static, SI and allocation-free, so a derivation stage may call them per sample. A NaN input
 * gives NaN (a frame carries NaN for an absent value, and absence must flow through, not throw per sample); a
 * finite or infinite input outside the model throws {@link IllegalArgumentException} whose message names the valid
 * range, for the caller to turn into a user message.
 *
 * <p>Base temperatures and pressures are chained from the sea-level values with the standard's own equations, as
 * the standard's tables were; they agree with its printed layer-base values to all printed digits.
 */
public final class StandardAtmosphere {
    private StandardAtmosphere() {
    }

    /** Lowest geopotential altitude of the model, m. */
    public static final double MIN_GEOPOTENTIAL_M = -5000.0;
    /** Highest geopotential altitude of the model, m (base of the 71 km layer). */
    public static final double MAX_GEOPOTENTIAL_M = 71000.0;

    /** Sea-level pressure p0, Pa (1976 U.S. Standard Atmosphere). */
    public static final double SEA_LEVEL_PRESSURE_PA = 101325.0;
    /** Sea-level temperature T0, K (1976 U.S. Standard Atmosphere). */
    public static final double SEA_LEVEL_TEMPERATURE_K = 288.15;
    /** Universal gas constant R*, J/(kmol K), the value the 1976 standard adopted (not the later CODATA one). */
    public static final double UNIVERSAL_GAS_CONSTANT_J_KMOL_K = 8314.32;
    /** Sea-level mean molecular weight M0, kg/kmol (1976 U.S. Standard Atmosphere). */
    public static final double MOLECULAR_WEIGHT_KG_KMOL = 28.9644;
    /** Specific gas constant of air R = R* / M0, J/(kg K) (287.053 in the standard). */
    public static final double GAS_CONSTANT_J_KG_K = UNIVERSAL_GAS_CONSTANT_J_KMOL_K / MOLECULAR_WEIGHT_KG_KMOL;
    /** Ratio of specific heats of air (1976 U.S. Standard Atmosphere). */
    public static final double GAMMA = 1.4;
    /** Standard gravity g0, m/s^2. */
    public static final double G0_MPS2 = Units.G0_MPS2;
    /** Effective Earth radius r0 of the geopotential relation, m (1976 U.S. Standard Atmosphere). */
    public static final double EARTH_RADIUS_M = 6356766.0;
    /** Sutherland's constant beta, kg/(s m K^0.5) (1976 U.S. Standard Atmosphere). */
    public static final double SUTHERLAND_BETA = 1.458e-6;
    /** Sutherland's constant S, K (1976 U.S. Standard Atmosphere). */
    public static final double SUTHERLAND_S_K = 110.4;
    /** Sea-level density rho0 = p0 / (R T0), kg/m^3 (1.225 in the standard). */
    public static final double SEA_LEVEL_DENSITY_KG_M3 =
            SEA_LEVEL_PRESSURE_PA / (GAS_CONSTANT_J_KG_K * SEA_LEVEL_TEMPERATURE_K);
    /** Sea-level speed of sound a0, m/s (340.294 in the standard). */
    public static final double SEA_LEVEL_SPEED_OF_SOUND_MPS =
            Math.sqrt(GAMMA * GAS_CONSTANT_J_KG_K * SEA_LEVEL_TEMPERATURE_K);

    /** Layer bases (and the model top as the last entry), geopotential m. */
    private static final double[] BASE_H_M = {0.0, 11000.0, 20000.0, 32000.0, 47000.0, 51000.0, MAX_GEOPOTENTIAL_M};
    /** Lapse rate of each layer, K per geopotential m. */
    private static final double[] LAPSE_K_PER_M = {-0.0065, 0.0, 0.001, 0.0028, 0.0, -0.0028};
    private static final int LAYERS = LAPSE_K_PER_M.length;
    private static final double[] BASE_T_K = new double[LAYERS + 1];
    private static final double[] BASE_P_PA = new double[LAYERS + 1];
    private static final double[] BASE_RHO_KG_M3 = new double[LAYERS + 1];
    /** g0 / (R L) per layer, the pressure exponent; unused for isothermal layers. */
    private static final double[] EXPONENT = new double[LAYERS];

    static {
        BASE_T_K[0] = SEA_LEVEL_TEMPERATURE_K;
        BASE_P_PA[0] = SEA_LEVEL_PRESSURE_PA;
        for (int i = 0; i < LAYERS; i++) {
            EXPONENT[i] = LAPSE_K_PER_M[i] == 0.0 ? 0.0 : G0_MPS2 / (GAS_CONSTANT_J_KG_K * LAPSE_K_PER_M[i]);
            double top = BASE_H_M[i + 1];
            BASE_T_K[i + 1] = temperatureInLayer(i, top);
            BASE_P_PA[i + 1] = pressureInLayer(i, top);
        }
        for (int i = 0; i <= LAYERS; i++) {
            BASE_RHO_KG_M3[i] = BASE_P_PA[i] / (GAS_CONSTANT_J_KG_K * BASE_T_K[i]);
        }
    }

    /** Pressure at the model's bottom, Pa (the highest pressure accepted). */
    public static final double MAX_PRESSURE_PA = pressureInLayer(0, MIN_GEOPOTENTIAL_M);
    /** Pressure at the model's top, Pa (the lowest pressure accepted). */
    public static final double MIN_PRESSURE_PA = BASE_P_PA[LAYERS];
    /** Density at the model's bottom, kg/m^3. */
    public static final double MAX_DENSITY_KG_M3 =
            MAX_PRESSURE_PA / (GAS_CONSTANT_J_KG_K * temperatureInLayer(0, MIN_GEOPOTENTIAL_M));
    /** Density at the model's top, kg/m^3. */
    public static final double MIN_DENSITY_KG_M3 = BASE_RHO_KG_M3[LAYERS];

    /** Temperature, K, at a geopotential altitude. */
    public static double temperatureK(double hGeopotM) {
        if (Double.isNaN(hGeopotM)) {
            return Double.NaN;
        }
        return temperatureInLayer(layerOf(hGeopotM), hGeopotM);
    }

    /** Pressure, Pa, at a geopotential altitude. */
    public static double pressurePa(double hGeopotM) {
        if (Double.isNaN(hGeopotM)) {
            return Double.NaN;
        }
        return pressureInLayer(layerOf(hGeopotM), hGeopotM);
    }

    /** Density, kg/m^3, at a geopotential altitude. */
    public static double densityKgM3(double hGeopotM) {
        if (Double.isNaN(hGeopotM)) {
            return Double.NaN;
        }
        int i = layerOf(hGeopotM);
        return pressureInLayer(i, hGeopotM) / (GAS_CONSTANT_J_KG_K * temperatureInLayer(i, hGeopotM));
    }

    /** Speed of sound, m/s, at a geopotential altitude. */
    public static double speedOfSoundMps(double hGeopotM) {
        return speedOfSoundAtMps(temperatureK(hGeopotM));
    }

    /** Dynamic viscosity, Pa s, at a geopotential altitude (Sutherland's law with the standard's constants). */
    public static double dynamicViscosityPaS(double hGeopotM) {
        return viscosityAtPaS(temperatureK(hGeopotM));
    }

    /** Speed of sound sqrt(gamma R T), m/s, of air at any temperature (no altitude check). */
    public static double speedOfSoundAtMps(double temperatureK) {
        return Math.sqrt(GAMMA * GAS_CONSTANT_J_KG_K * temperatureK);
    }

    /** Sutherland viscosity beta T^1.5 / (T + S), Pa s, of air at any temperature (no altitude check). */
    public static double viscosityAtPaS(double temperatureK) {
        return SUTHERLAND_BETA * temperatureK * Math.sqrt(temperatureK) / (temperatureK + SUTHERLAND_S_K);
    }

    /** Geopotential altitude H = r0 Z / (r0 + Z), m, of a geometric altitude Z, m. */
    public static double geopotentialFromGeometricM(double zGeometricM) {
        if (!(zGeometricM > -EARTH_RADIUS_M)) {
            if (Double.isNaN(zGeometricM)) {
                return Double.NaN;
            }
            throw new IllegalArgumentException("geometric altitude " + Plain.of(zGeometricM)
                    + " m is below the centre of the Earth");
        }
        return EARTH_RADIUS_M * zGeometricM / (EARTH_RADIUS_M + zGeometricM);
    }

    /** Geometric altitude Z = r0 H / (r0 - H), m, of a geopotential altitude H, m. */
    public static double geometricFromGeopotentialM(double hGeopotM) {
        if (!(hGeopotM < EARTH_RADIUS_M)) {
            if (Double.isNaN(hGeopotM)) {
                return Double.NaN;
            }
            throw new IllegalArgumentException("geopotential altitude " + Plain.of(hGeopotM)
                    + " m is beyond the reach of the geopotential relation (below " + Plain.of(EARTH_RADIUS_M)
                    + " m)");
        }
        return EARTH_RADIUS_M * hGeopotM / (EARTH_RADIUS_M - hGeopotM);
    }

    /**
     * Pressure altitude, m: the geopotential altitude at which the standard atmosphere has this static pressure.
     * Exact closed-form inverse of {@link #pressurePa(double)} in each layer.
     */
    public static double pressureAltitudeM(double staticPressurePa) {
        if (!(staticPressurePa >= MIN_PRESSURE_PA && staticPressurePa <= MAX_PRESSURE_PA)) {
            if (Double.isNaN(staticPressurePa)) {
                return Double.NaN;
            }
            throw new IllegalArgumentException("static pressure " + Plain.of(staticPressurePa)
                    + " Pa is outside the standard atmosphere model, " + Plain.of(MIN_PRESSURE_PA) + " to "
                    + Plain.of(MAX_PRESSURE_PA) + " Pa");
        }
        int i = 0;
        while (i < LAYERS - 1 && staticPressurePa <= BASE_P_PA[i + 1]) {
            i++;
        }
        double ratio = staticPressurePa / BASE_P_PA[i];
        if (LAPSE_K_PER_M[i] == 0.0) {
            return BASE_H_M[i] - GAS_CONSTANT_J_KG_K * BASE_T_K[i] / G0_MPS2 * Math.log(ratio);
        }
        // p/pb = (T/Tb)^(-g0/(R L))  =>  T = Tb (p/pb)^(-R L/g0)
        double t = BASE_T_K[i] * Math.pow(ratio, -1.0 / EXPONENT[i]);
        return BASE_H_M[i] + (t - BASE_T_K[i]) / LAPSE_K_PER_M[i];
    }

    /**
     * Density altitude, m: the geopotential altitude at which the standard atmosphere has this density. Closed form
     * in each layer (density falls monotonically with height in every layer, as every lapse rate is far below the
     * autoconvective g0/R), so no iteration.
     */
    public static double densityAltitudeM(double densityKgM3) {
        if (!(densityKgM3 >= MIN_DENSITY_KG_M3 && densityKgM3 <= MAX_DENSITY_KG_M3)) {
            if (Double.isNaN(densityKgM3)) {
                return Double.NaN;
            }
            throw new IllegalArgumentException("density " + Plain.of(densityKgM3)
                    + " kg/m^3 is outside the standard atmosphere model, " + Plain.of(MIN_DENSITY_KG_M3) + " to "
                    + Plain.of(MAX_DENSITY_KG_M3) + " kg/m^3");
        }
        int i = 0;
        while (i < LAYERS - 1 && densityKgM3 <= BASE_RHO_KG_M3[i + 1]) {
            i++;
        }
        double ratio = densityKgM3 / BASE_RHO_KG_M3[i];
        if (LAPSE_K_PER_M[i] == 0.0) {
            return BASE_H_M[i] - GAS_CONSTANT_J_KG_K * BASE_T_K[i] / G0_MPS2 * Math.log(ratio);
        }
        // rho/rhob = (T/Tb)^(-(g0/(R L) + 1))
        double t = BASE_T_K[i] * Math.pow(ratio, -1.0 / (EXPONENT[i] + 1.0));
        return BASE_H_M[i] + (t - BASE_T_K[i]) / LAPSE_K_PER_M[i];
    }

    /** Index of the layer holding {@code h}; throws outside the model. */
    private static int layerOf(double hGeopotM) {
        if (!(hGeopotM >= MIN_GEOPOTENTIAL_M && hGeopotM <= MAX_GEOPOTENTIAL_M)) {
            throw new IllegalArgumentException(outOfModel(hGeopotM));
        }
        int i = LAYERS - 1;
        while (i > 0 && hGeopotM < BASE_H_M[i]) {
            i--;
        }
        return i;
    }

    static String outOfModel(double hGeopotM) {
        return "geopotential altitude " + Plain.of(hGeopotM) + " m is outside the standard atmosphere model, "
                + Plain.of(MIN_GEOPOTENTIAL_M) + " to " + Plain.of(MAX_GEOPOTENTIAL_M) + " m";
    }

    private static double temperatureInLayer(int i, double h) {
        return BASE_T_K[i] + LAPSE_K_PER_M[i] * (h - BASE_H_M[i]);
    }

    private static double pressureInLayer(int i, double h) {
        if (LAPSE_K_PER_M[i] == 0.0) {
            return BASE_P_PA[i] * Math.exp(-G0_MPS2 * (h - BASE_H_M[i]) / (GAS_CONSTANT_J_KG_K * BASE_T_K[i]));
        }
        return BASE_P_PA[i] * Math.pow(temperatureInLayer(i, h) / BASE_T_K[i], -EXPONENT[i]);
    }
}
