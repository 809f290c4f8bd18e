package org.pointcall.ingest.sim.pilot;

import org.pointcall.ingest.sim.airframe.Airframe;
import org.pointcall.ingest.sim.airframe.Engine;
import org.pointcall.ingest.sim.model.FlightModel;
import org.pointcall.ingest.sim.model.LongitudinalLinearModel;
import org.pointcall.ingest.sim.model.NoTrimException;
import org.pointcall.ingest.sim.model.SimulationSettings;
import org.pointcall.ingest.sim.model.TrimPoint;
import org.pointcall.shared.airdata.AirData;
import org.pointcall.shared.atmosphere.StandardAtmosphere;

/**
 * What the pilot knows of the aircraft, as a flight manual would tell it: stall and maximum level speeds, the
 * short-period frequency, thrust available. Taken from a second flight model of the same airframe that is only
 * trimmed and linearised, never flown. Not on the control path: it allocates.
 */
final class Envelope {
    private final Airframe airframe;
    private final FlightModel analysis;

    Envelope(Airframe airframe) {
        this.airframe = airframe;
        this.analysis = new FlightModel(airframe, SimulationSettings.DEFAULT);
    }

    Airframe airframe() {
        return airframe;
    }

    private void setMass(double massKg) {
        analysis.setFuelMassKg(Math.max(0.0, massKg - airframe.mass().zeroFuelMassKg()));
    }

    static double geometricM(double hpM) {
        return StandardAtmosphere.geometricFromGeopotentialM(hpM);
    }

    /** Calibrated airspeed of a true airspeed at a pressure altitude (standard day). */
    static double casOfTas(double tasMps, double hpM) {
        double a = StandardAtmosphere.speedOfSoundMps(hpM);
        double p = StandardAtmosphere.pressurePa(hpM);
        return AirData.casFromImpactPressure(AirData.impactPressureFromMach(tasMps / a, p));
    }

    /** True airspeed of a calibrated airspeed at a pressure altitude (standard day). */
    static double tasOfCas(double casMps, double hpM) {
        double p = StandardAtmosphere.pressurePa(hpM);
        double m = AirData.machFromImpactPressure(AirData.impactPressureFromCas(casMps), p);
        return m * StandardAtmosphere.speedOfSoundMps(hpM);
    }

    /** Calibrated airspeed of a Mach number at a pressure altitude. */
    static double casOfMach(double mach, double hpM) {
        return casOfTas(mach * StandardAtmosphere.speedOfSoundMps(hpM), hpM);
    }

    /** One-g stall speed, calibrated, at a pressure altitude and mass. */
    double stallCasMps(double hpM, double massKg) {
        setMass(massKg);
        return casOfTas(analysis.oneGStallSpeedMps(geometricM(hpM)), hpM);
    }

    /** Highest calibrated airspeed of steady level flight at full throttle, found by bisection on the trim. */
    double maxLevelCasMps(double hpM, double massKg) {
        setMass(massKg);
        double alt = geometricM(hpM);
        double lo = analysis.oneGStallSpeedMps(alt) * 1.15;
        double hi = 400.0;
        if (!trims(lo, alt)) {
            return casOfTas(lo, hpM);
        }
        for (int i = 0; i < 16; i++) {
            double mid = 0.5 * (lo + hi);
            if (trims(mid, alt)) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return casOfTas(lo, hpM);
    }

    private boolean trims(double tas, double alt) {
        try {
            analysis.trim(tas, alt, 0.0);
            return true;
        } catch (NoTrimException | IllegalArgumentException e) {
            return false;
        }
    }

    /** Wings-level trim at a calibrated airspeed and pressure altitude, or null where there is none. */
    TrimPoint levelTrim(double casMps, double hpM, double massKg) {
        setMass(massKg);
        try {
            return analysis.trim(tasOfCas(casMps, hpM), geometricM(hpM), 0.0);
        } catch (NoTrimException | IllegalArgumentException e) {
            return null;
        }
    }

    /**
     * Short-period undamped frequency at a condition from the short-period approximation of the linearised model
     * (w and q rows: {@code omega^2 = Zw Mq - U0 Mw}); 3 rad/s when the condition does not trim.
     */
    double shortPeriodRadS(double casMps, double hpM, double massKg) {
        TrimPoint t = levelTrim(casMps, hpM, massKg);
        if (t == null) {
            return 3.0;
        }
        LongitudinalLinearModel lm = LongitudinalLinearModel.about(analysis, t);
        int w = LongitudinalLinearModel.W;
        int q = LongitudinalLinearModel.Q;
        double w2 = lm.element(w, w) * lm.element(q, q) - lm.element(w, q) * lm.element(q, w);
        return w2 > 0.25 ? Math.sqrt(w2) : 3.0;
    }

    /** Longitudinal acceleration one unit of throttle lever adds, in g, at a density and Mach. */
    double thrustGPerLever(double densityKgM3, double mach, double massKg) {
        Engine e = airframe.engine();
        double lapse = Math.pow(densityKgM3 / StandardAtmosphere.SEA_LEVEL_DENSITY_KG_M3, e.densityExponent());
        double t = e.maxThrustSeaLevelN() * lapse * e.thrustMachFactor().valueAt(mach)
                * (1.0 - e.idleThrustFraction());
        return Math.max(0.02, t / (massKg * StandardAtmosphere.G0_MPS2));
    }

    /** Angle of attack of the largest trimmed lift at a low Mach, rad. */
    double alphaMaxLiftRad() {
        return analysis.alphaAtMaxLiftRad(0.2);
    }

    double alphaStallRad() {
        return airframe.stall().alphaStallRad();
    }

    double alphaReattachRad() {
        return airframe.stall().alphaReattachRad();
    }
}
