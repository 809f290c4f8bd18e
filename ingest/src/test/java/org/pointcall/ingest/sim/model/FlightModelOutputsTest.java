package org.pointcall.ingest.sim.model;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.pointcall.ingest.sim.airframe.Airframe;
import org.pointcall.ingest.sim.airframe.Airframes;
import org.pointcall.shared.airdata.AirData;
import org.pointcall.shared.atmosphere.StandardAtmosphere;
import org.pointcall.shared.units.Units;

/** What the sensor models will read: air data, temperatures, the static source's error, surfaces. */
class FlightModelOutputsTest {

    /** Geometric altitude whose geopotential altitude is {@code h} (inverse of H = r0 Z / (r0 + Z)). */
    private static double geometricOf(double hGeopotM) {
        double r0 = StandardAtmosphere.EARTH_RADIUS_M;
        return r0 * hGeopotM / (r0 - hGeopotM);
    }

    @Test
    void airDataAtAKnownConditionMatchesThePublishedAirspeedRelations() {
        FlightModel m = new FlightModel(Airframes.load("veskarn-02"), SimulationSettings.DEFAULT);
        double h = geometricOf(Units.ftToM(10000));
        m.initialise(m.trim(Units.ktToMps(288.7), h, 0.0), 0, 0, 0);
        // check-values.md [computed], NASA RP-1046 relations: 250 KCAS at 10,000 ft is M 0.4523 and 288.7 KTAS
        // (4 printed digits: the 288.7 carries +-0.05 kt, so CAS within 0.05 kt and Mach within 0.0001)
        assertEquals(0.4523, m.mach(), 0.0001);
        assertEquals(250.0, Units.mpsToKt(m.calibratedAirspeedMps()), 0.05);
        // 1976 standard atmosphere at 10,000 ft geopotential [computed, 6 digits]: 268.338 K, 69681.7 Pa
        assertEquals(268.338, m.staticTemperatureK(), 0.0005);
        assertEquals(69681.7, m.staticPressurePa(), 0.05);
        assertEquals(Units.ftToM(10000), m.pressureAltitudeM(), 1e-6);
        // stagnation temperature rise, recovery 1: T (1 + 0.2 M^2)
        assertEquals(268.338 * (1 + 0.2 * 0.4523 * 0.4523), m.totalTemperatureK(), 0.01);
        assertEquals(AirData.impactPressureFromMach(m.mach(), m.staticPressurePa()), m.impactPressurePa(), 1e-9);
        assertEquals(AirData.equivalentAirspeedMps(m.trueAirspeedMps(), m.densityKgM3()),
                m.equivalentAirspeedMps(), 1e-12);
    }

    @Test
    void theStaticSourceReadsTheProfilesPositionErrorAtItsIndicatedMach() {
        Airframe af = Airframes.load("veskarn-02");
        FlightModel m = new FlightModel(af, SimulationSettings.DEFAULT);
        for (double v : new double[] {80.0, 140.0, 200.0}) {
            m.initialise(m.trim(v, 2000.0, 0.0), 0, 0, 0);
            double p = m.staticPressurePa();
            double qc = m.impactPressurePa();
            double pIc = m.indicatedStaticPressurePa();
            double qcIc = m.indicatedImpactPressurePa();
            // the pitot (total) pressure is free of error; dPp = p_ic - p = (dPp/qc)(M_ic) qc_ic (the convention of
            // shared's PositionErrorCorrection, NASA TM-104316 form)
            assertEquals(p + qc, pIc + qcIc, 1e-9 * p);
            double mic = AirData.machFromImpactPressure(qcIc, pIc);
            assertEquals(af.staticSourceError().deltaPpOverQc(mic) * qcIc, pIc - p, 1e-6);
            // and the correction the ground station applies gives the ambient pressure back
            assertEquals(p, af.staticSourceError().ambientStaticPressurePa(pIc, qcIc), 1e-6);
            assertTrue(Math.abs(pIc - p) > 1.0, "the error is there to be corrected");
        }
    }

    @Test
    void surfacesFollowTheirCommandsNoFasterThanTheRateLimitAndStopAtTheTravel() {
        Airframe af = Airframes.load("veskarn-02");
        FlightModel m = new FlightModel(af, SimulationSettings.DEFAULT);
        TrimPoint t = m.trim(150.0, 3000.0, 0.0);
        m.initialise(t, 0, 0, 0);
        // a full step of aileron: the rate limit (80 deg/s) governs until the lag takes over near the command
        m.setControls(t.elevatorRad(), Math.toRadians(30), 0.0, t.throttle());
        double prev = m.aileronRad();
        double maxRate = 0;
        for (int i = 0; i < 500; i++) {
            m.step();
            maxRate = Math.max(maxRate, (m.aileronRad() - prev) / m.stepS());
            prev = m.aileronRad();
        }
        double limit = af.controls().aileron().rateRadS();
        assertEquals(limit, maxRate, 1e-6 * limit, "rate-limited");
        // commanded 30 degrees, travel 20: it stops at 20 (the last of the lag, e^-15 of a degree, is left)
        assertEquals(af.controls().aileron().maxRad(), m.aileronRad(), 1e-6);
        assertTrue(m.aileronRad() <= af.controls().aileron().maxRad());
        assertThrows(IllegalArgumentException.class, () -> m.setControls(Double.NaN, 0, 0, 0.5));
    }

    @Test
    void theEngineLagsTheLeverSlowerFromIdleAndBurnsFuel() {
        FlightModel m = new FlightModel(Airframes.load("veskarn-02"), SimulationSettings.DEFAULT);
        TrimPoint t = m.trim(150.0, 3000.0, 0.0);
        m.initialise(t, 0, 0, 0);
        double fuel0 = m.fuelMassKg();
        m.setControls(t.elevatorRad(), 0, 0, 1.0);
        m.advance(1.0);
        double fromCruise = m.powerLevel() - t.throttle();
        m.initialise(m.trim(150.0, 3000.0, 0.0), 0, 0, 0);
        m.setControls(t.elevatorRad(), 0, 0, 0.0);
        m.advance(10.0);
        double low = m.powerLevel();
        m.setControls(t.elevatorRad(), 0, 0, low + (1.0 - t.throttle()));
        double start = m.powerLevel();
        m.advance(1.0);
        double fromIdle = m.powerLevel() - start;
        assertTrue(fromCruise > 1.3 * fromIdle, "spools up faster from cruise (" + fromCruise + ") than from idle ("
                + fromIdle + ")");
        assertTrue(m.fuelMassKg() < fuel0, "fuel burns");
        assertTrue(m.fuelFlowKgS() > 0);
    }
}
