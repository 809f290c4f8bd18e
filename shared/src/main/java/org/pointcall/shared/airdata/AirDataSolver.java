package org.pointcall.shared.airdata;

import org.pointcall.shared.atmosphere.StandardAtmosphere;

/**
 * Works out a whole flight condition ({@link AirDataState}) from what is known of it ({@link AirDataInput}):
 * pressure altitude and static pressure from each other through the standard atmosphere; static temperature from
 * the input or the standard day plus the deviation; then the speeds through the pitot relations of {@link AirData}.
 */
public final class AirDataSolver {
    private AirDataSolver() {
    }

    /** The full state of a validated input; cannot fail, as the input's constructor checked everything. */
    public static AirDataState solve(AirDataInput in) {
        double hp;
        double p;
        if (in.pressureAltitudeM().isPresent()) {
            hp = in.pressureAltitudeM().getAsDouble();
            p = StandardAtmosphere.pressurePa(hp);
        } else {
            p = in.staticPressurePa().getAsDouble();
            hp = StandardAtmosphere.pressureAltitudeM(p);
        }
        double tStd = StandardAtmosphere.temperatureK(hp);
        double t = in.staticTemperatureK().isPresent() ? in.staticTemperatureK().getAsDouble()
                : tStd + in.isaDeviationK().orElse(0.0);
        double rho = AirData.densityKgM3(p, t);
        double a = AirData.speedOfSoundMps(t);

        double qc;
        double mach;
        double cas;
        double tas;
        if (in.casMps().isPresent()) {
            cas = in.casMps().getAsDouble();
            qc = AirData.impactPressureFromCas(cas);
            mach = AirData.machFromImpactPressure(qc, p);
            tas = mach * a;
        } else if (in.mach().isPresent()) {
            mach = in.mach().getAsDouble();
            qc = AirData.impactPressureFromMach(mach, p);
            cas = AirData.casFromImpactPressure(qc);
            tas = mach * a;
        } else {
            tas = in.tasMps().getAsDouble();
            mach = tas / a;
            qc = AirData.impactPressureFromMach(mach, p);
            cas = AirData.casFromImpactPressure(qc);
        }
        double eas = AirData.equivalentAirspeedMps(tas, rho);
        double densityAltitude = rho >= StandardAtmosphere.MIN_DENSITY_KG_M3
                && rho <= StandardAtmosphere.MAX_DENSITY_KG_M3 ? StandardAtmosphere.densityAltitudeM(rho) : Double.NaN;
        return new AirDataState(hp, p, t, rho, a, qc, qc / p, mach, cas, eas, tas, densityAltitude, t - tStd);
    }
}
