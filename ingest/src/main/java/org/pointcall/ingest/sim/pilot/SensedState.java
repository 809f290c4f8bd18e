package org.pointcall.ingest.sim.pilot;

import org.pointcall.ingest.sim.model.FlightModel;
import org.pointcall.shared.airdata.AirData;
import org.pointcall.shared.units.Units;

/** The true state as the pilot reads it at one tick, read once from the model (flight-model conventions, SI). */
final class SensedState {
    static final double G = Units.G0_MPS2;

    double timeS;
    double hpM;
    double altitudeM;
    double climbMps;
    double tasMps;
    double casMps;
    double mach;
    double qbarPa;
    double staticPa;
    double staticK;
    double alphaRad;
    double betaRad;
    double pRadS;
    double qRadS;
    double rRadS;
    double thetaRad;
    double phiRad;
    double psiRad;
    double gammaRad;
    double nx;
    double ny;
    double nz;
    /** Specific force along the air-relative velocity, m/s^2 (thrust minus drag over mass). */
    double alongMps2;
    double elevatorRad;
    double aileronRad;
    double rudderRad;
    double throttle;
    double massKg;
    double velNorthMps;
    double velEastMps;
    double velDownMps;
    /** Body y axis in NED. */
    double yN;
    double yE;
    double yD;
    /** Body z axis in NED. */
    double zN;
    double zE;
    double zD;
    private final double[] quat = new double[4];

    void read(FlightModel m, double t) {
        timeS = t;
        hpM = m.pressureAltitudeM();
        altitudeM = m.altitudeM();
        climbMps = m.climbRateMps();
        tasMps = m.trueAirspeedMps();
        casMps = m.calibratedAirspeedMps();
        mach = m.mach();
        qbarPa = m.dynamicPressurePa();
        staticPa = m.staticPressurePa();
        staticK = m.staticTemperatureK();
        alphaRad = m.alphaRad();
        betaRad = m.betaRad();
        pRadS = m.pRadS();
        qRadS = m.qRadS();
        rRadS = m.rRadS();
        thetaRad = m.thetaRad();
        phiRad = m.phiRad();
        psiRad = m.psiRad();
        gammaRad = m.flightPathRad();
        nx = m.nx();
        ny = m.ny();
        nz = m.nz();
        double ca = Math.cos(alphaRad);
        double sa = Math.sin(alphaRad);
        double cb = Math.cos(betaRad);
        double sb = Math.sin(betaRad);
        alongMps2 = G * (nx * ca * cb + ny * sb - nz * sa * cb);
        elevatorRad = m.elevatorRad();
        aileronRad = m.aileronRad();
        rudderRad = m.rudderRad();
        throttle = m.throttleLever();
        massKg = m.massKg();
        velNorthMps = m.velocityNorthMps();
        velEastMps = m.velocityEastMps();
        velDownMps = m.velocityDownMps();
        m.quaternion(quat);
        double e0 = quat[0];
        double e1 = quat[1];
        double e2 = quat[2];
        double e3 = quat[3];
        yN = 2.0 * (e1 * e2 - e0 * e3);
        yE = e0 * e0 - e1 * e1 + e2 * e2 - e3 * e3;
        yD = 2.0 * (e2 * e3 + e0 * e1);
        zN = 2.0 * (e1 * e3 + e0 * e2);
        zE = 2.0 * (e2 * e3 - e0 * e1);
        zD = e0 * e0 - e1 * e1 - e2 * e2 + e3 * e3;
    }

    double weightN() {
        return massKg * G;
    }

    /** True airspeed of a calibrated airspeed at the current static pressure and temperature. */
    double tasForCas(double casMps) {
        double qc = AirData.impactPressureFromCas(casMps);
        return AirData.trueAirspeedMps(AirData.machFromImpactPressure(qc, staticPa), staticK);
    }

    /** True airspeed of a Mach number at the current static temperature. */
    double tasForMach(double machNumber) {
        return AirData.trueAirspeedMps(machNumber, staticK);
    }

    /** Smallest difference a - b of two angles, -pi to pi. */
    static double wrap(double rad) {
        double a = Math.IEEEremainder(rad, 2.0 * Math.PI);
        return a == Math.PI ? -Math.PI : a;
    }
}
