package org.pointcall.shared.airdata;

import org.pointcall.shared.error.Plain;
import java.util.OptionalDouble;
import org.pointcall.shared.atmosphere.StandardAtmosphere;
import org.pointcall.shared.units.Units;

/**
 * What an engineer knows about one flight condition, SI: the altitude as pressure altitude or static pressure;
 * exactly one speed (CAS, Mach or TAS); and optionally the static air temperature or the ISA deviation (neither
 * means a standard day). Absent values are empty, never NaN; a NaN given is rejected.
 *
 * <p>Every check is made here, including a cap of {@link #MAX_MACH}, so {@link AirDataSolver#solve(AirDataInput)}
 * cannot fail on a built input. Messages are one plain line, with speeds also in knots, altitudes also in feet and
 * temperatures also in degC, the units a user most likely typed.
 *
 * @param pressureAltitudeM  pressure altitude, m
 * @param staticPressurePa   static pressure, Pa
 * @param casMps             calibrated airspeed, m/s
 * @param mach               Mach number
 * @param tasMps             true airspeed, m/s
 * @param staticTemperatureK static (outside) air temperature, K
 * @param isaDeviationK      static temperature minus the standard temperature at the pressure altitude, K
 */
public record AirDataInput(OptionalDouble pressureAltitudeM, OptionalDouble staticPressurePa, OptionalDouble casMps,
                           OptionalDouble mach, OptionalDouble tasMps, OptionalDouble staticTemperatureK,
                           OptionalDouble isaDeviationK) {
    /**
     * Highest Mach accepted. The pitot relations treat air as a calorically perfect gas with gamma 1.4, which stops
     * describing air well somewhere past Mach 5 (common practice); the cap is generous for a flight-test tool and
     * keeps every result finite.
     */
    public static final double MAX_MACH = 10.0;

    private static final OptionalDouble NONE = OptionalDouble.empty();

    public AirDataInput {
        pressureAltitudeM = orEmpty(pressureAltitudeM);
        staticPressurePa = orEmpty(staticPressurePa);
        casMps = orEmpty(casMps);
        mach = orEmpty(mach);
        tasMps = orEmpty(tasMps);
        staticTemperatureK = orEmpty(staticTemperatureK);
        isaDeviationK = orEmpty(isaDeviationK);

        double hp;
        if (pressureAltitudeM.isPresent() == staticPressurePa.isPresent()) {
            throw new IllegalArgumentException(pressureAltitudeM.isPresent()
                    ? "give pressure altitude or static pressure, not both"
                    : "give pressure altitude or static pressure, got neither");
        }
        if (pressureAltitudeM.isPresent()) {
            hp = pressureAltitudeM.getAsDouble();
            requireNumber("pressure altitude", hp);
            if (!(hp >= StandardAtmosphere.MIN_GEOPOTENTIAL_M && hp <= StandardAtmosphere.MAX_GEOPOTENTIAL_M)) {
                double lo = StandardAtmosphere.MIN_GEOPOTENTIAL_M;
                double hi = StandardAtmosphere.MAX_GEOPOTENTIAL_M;
                throw new IllegalArgumentException("pressure altitude " + metresAndFeet(hp)
                        + " is outside the standard atmosphere model, " + Plain.of(lo) + " to " + Plain.of(hi)
                        + " m (" + Plain.of(Units.mToFt(lo)) + " to " + Plain.of(Units.mToFt(hi)) + " ft)");
            }
        } else {
            double p = staticPressurePa.getAsDouble();
            requireNumber("static pressure", p);
            if (!(p >= StandardAtmosphere.MIN_PRESSURE_PA && p <= StandardAtmosphere.MAX_PRESSURE_PA)) {
                throw new IllegalArgumentException("static pressure " + Plain.of(p)
                        + " Pa is outside the standard atmosphere model, "
                        + Plain.of(StandardAtmosphere.MIN_PRESSURE_PA) + " to "
                        + Plain.of(StandardAtmosphere.MAX_PRESSURE_PA) + " Pa");
            }
            hp = StandardAtmosphere.pressureAltitudeM(p);
        }

        int speeds = (casMps.isPresent() ? 1 : 0) + (mach.isPresent() ? 1 : 0) + (tasMps.isPresent() ? 1 : 0);
        if (speeds != 1) {
            throw new IllegalArgumentException("give exactly one speed (CAS, Mach or TAS), got "
                    + (speeds == 0 ? "none" : speedNames(casMps, mach, tasMps)));
        }
        if (casMps.isPresent()) {
            requireSpeed("CAS", casMps.getAsDouble());
        } else if (tasMps.isPresent()) {
            requireSpeed("TAS", tasMps.getAsDouble());
        } else {
            double m = mach.getAsDouble();
            requireNumber("Mach", m);
            if (m < 0.0) {
                throw new IllegalArgumentException("Mach must be zero or positive, got " + Plain.of(m));
            }
        }

        if (staticTemperatureK.isPresent() && isaDeviationK.isPresent()) {
            throw new IllegalArgumentException("give static air temperature or ISA deviation, not both");
        }
        if (staticTemperatureK.isPresent()) {
            double t = staticTemperatureK.getAsDouble();
            requireNumber("static air temperature", t);
            if (!(t > 0.0)) {
                throw new IllegalArgumentException("static air temperature must be above 0 K, got " + Plain.of(t)
                        + " K (" + Plain.of(Units.kToDegC(t)) + " degC)");
            }
        }
        if (isaDeviationK.isPresent()) {
            double dt = isaDeviationK.getAsDouble();
            requireNumber("ISA deviation", dt);
            double t = StandardAtmosphere.temperatureK(hp) + dt;
            if (!(t > 0.0)) {
                throw new IllegalArgumentException("ISA deviation " + Plain.of(dt)
                        + " K gives a static air temperature of " + Plain.of(t) + " K at pressure altitude "
                        + metresAndFeet(hp) + "; it must stay above 0 K");
            }
        }

        double t = staticTemperatureK.isPresent() ? staticTemperatureK.getAsDouble()
                : StandardAtmosphere.temperatureK(hp) + isaDeviationK.orElse(0.0);
        double m;
        String speed;
        if (casMps.isPresent()) {
            double cas = casMps.getAsDouble();
            // CAS above 20 a0 is beyond Mach 10 at any pressure of the model (p <= 1.76 p0); skipping the pitot
            // relations there keeps absurd values from overflowing them
            m = cas > 20.0 * StandardAtmosphere.SEA_LEVEL_SPEED_OF_SOUND_MPS ? Double.POSITIVE_INFINITY
                    : AirData.machFromImpactPressure(AirData.impactPressureFromCas(cas),
                            StandardAtmosphere.pressurePa(hp));
            speed = "CAS " + knotsAndMps(cas) + " at pressure altitude " + metresAndFeet(hp);
        } else if (tasMps.isPresent()) {
            double tas = tasMps.getAsDouble();
            m = tas / AirData.speedOfSoundMps(t);
            speed = "TAS " + knotsAndMps(tas) + " at " + Plain.of(t) + " K";
        } else {
            m = mach.getAsDouble();
            speed = "Mach " + Plain.of(m);
        }
        if (!(m <= MAX_MACH)) {
            throw new IllegalArgumentException(speed + " is beyond Mach " + Plain.of(MAX_MACH)
                    + ", the limit of these ideal-gas air-data relations");
        }
    }

    /** CAS at a pressure altitude, standard day. */
    public static AirDataInput ofCas(double casMps, double pressureAltitudeM) {
        return new AirDataInput(OptionalDouble.of(pressureAltitudeM), NONE, OptionalDouble.of(casMps), NONE, NONE,
                NONE, NONE);
    }

    /** Mach at a pressure altitude, standard day. */
    public static AirDataInput ofMach(double mach, double pressureAltitudeM) {
        return new AirDataInput(OptionalDouble.of(pressureAltitudeM), NONE, NONE, OptionalDouble.of(mach), NONE,
                NONE, NONE);
    }

    /** TAS at a pressure altitude, standard day. */
    public static AirDataInput ofTas(double tasMps, double pressureAltitudeM) {
        return new AirDataInput(OptionalDouble.of(pressureAltitudeM), NONE, NONE, NONE, OptionalDouble.of(tasMps),
                NONE, NONE);
    }

    /** The same condition with the altitude given as static pressure instead. */
    public AirDataInput withStaticPressurePa(double staticPa) {
        return new AirDataInput(NONE, OptionalDouble.of(staticPa), casMps, mach, tasMps, staticTemperatureK,
                isaDeviationK);
    }

    /** The same condition with the static air temperature given (replacing any ISA deviation). */
    public AirDataInput withStaticTemperatureK(double staticTempK) {
        return new AirDataInput(pressureAltitudeM, staticPressurePa, casMps, mach, tasMps,
                OptionalDouble.of(staticTempK), NONE);
    }

    /** The same condition on a day {@code isaDeviationK} warmer than standard (replacing any temperature). */
    public AirDataInput withIsaDeviationK(double isaDeviationK) {
        return new AirDataInput(pressureAltitudeM, staticPressurePa, casMps, mach, tasMps, NONE,
                OptionalDouble.of(isaDeviationK));
    }

    private static OptionalDouble orEmpty(OptionalDouble v) {
        return v == null ? NONE : v;
    }

    private static void requireNumber(String what, double v) {
        if (!Double.isFinite(v)) {
            throw new IllegalArgumentException(what + " must be a finite number, got " + v);
        }
    }

    private static void requireSpeed(String what, double mps) {
        requireNumber(what, mps);
        if (mps < 0.0) {
            throw new IllegalArgumentException(what + " must be zero or positive, got " + knotsAndMps(mps));
        }
    }

    private static String knotsAndMps(double mps) {
        return Plain.of(Units.mpsToKt(mps)) + " kt (" + Plain.of(mps) + " m/s)";
    }

    private static String metresAndFeet(double m) {
        return Plain.of(m) + " m (" + Plain.of(Units.mToFt(m)) + " ft)";
    }

    private static String speedNames(OptionalDouble cas, OptionalDouble mach, OptionalDouble tas) {
        StringBuilder sb = new StringBuilder();
        if (cas.isPresent()) {
            sb.append("CAS");
        }
        if (mach.isPresent()) {
            sb.append(sb.length() > 0 ? " and " : "").append("Mach");
        }
        if (tas.isPresent()) {
            sb.append(sb.length() > 0 ? " and " : "").append("TAS");
        }
        return sb.toString();
    }
}
