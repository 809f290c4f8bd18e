package org.pointcall.ingest.sim.model;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.pointcall.ingest.sim.airframe.Airframes;
import org.pointcall.shared.atmosphere.StandardAtmosphere;

/** A level acceleration at full power: specific excess power from the forces and from the flown trajectory. */
class SpecificExcessPowerTest {
    private static final double G0 = StandardAtmosphere.G0_MPS2;

    static double psFromForces(double vMps, double thrustN, double dragN, double weightN) {
        return vMps * (thrustN - dragN) / weightN;
    }

    static double psFromTrajectory(double climbMps, double vMps, double accelMps2) {
        return climbMps + vMps / G0 * accelMps2;
    }

    @Test
    void energyFormulasGiveTheWorkedValues() {
        // check-values.md [computed], USNTPS FTM-108 ch. 5 energy methods: V 200 m/s, T - D 10 kN, W 100 kN gives
        // Ps 20 m/s; dh/dt 10 m/s and dV/dt 1 m/s^2 at 200 m/s give 30.39 m/s (printed to 4 digits)
        assertEquals(20.0, psFromForces(200.0, 15000.0, 5000.0, 100000.0), 1e-12);
        assertEquals(30.39, psFromTrajectory(10.0, 200.0, 1.0), 0.005);
    }

    @Test
    void levelAccelerationExcessPowerFromTheForcesMatchesTheTrajectory() {
        FlightModel m = new FlightModel(Airframes.load("veskarn-02"), SimulationSettings.DEFAULT);
        TrimPoint t = m.trim(100.0, 3000.0, 0.0);
        m.initialise(t, 0, 0, 0);
        TestPilot pilot = new TestPilot(m, t).holdAltitude(3000.0).throttle(1.0);
        int frames = 6000;
        double[] h = new double[frames];
        double[] v = new double[frames];
        double[] psForces = new double[frames];
        double[] thrustInclination = new double[frames];
        for (int i = 0; i < frames; i++) {
            pilot.fly();
            h[i] = m.altitudeM();
            v[i] = m.trueAirspeedMps();
            psForces[i] = psFromForces(v[i], m.thrustN(), m.dragN(), m.weightN());
            // the textbook Ps puts all the thrust along the path; this airframe's thrust line is alpha off it
            thrustInclination[i] = v[i] * m.thrustN() * (1.0 - Math.cos(m.alphaRad()) * Math.cos(m.betaRad()))
                    / m.weightN();
        }
        assertTrue(v[frames - 1] - v[0] > 50.0, "it accelerates: " + v[0] + " to " + v[frames - 1] + " m/s");
        double dt = TestPilot.DT_S;
        for (int i = 1000; i < frames - 1; i += 500) {
            // central differences of the 100 Hz record; their error is dt^2/6 times the third derivative, far
            // below a millimetre per second here
            double climb = (h[i + 1] - h[i - 1]) / (2 * dt);
            double accel = (v[i + 1] - v[i - 1]) / (2 * dt);
            double trajectory = psFromTrajectory(climb, v[i], accel);
            // the two sides of Ps = V (T - D)/W = dh/dt + (V/g) dV/dt (USNTPS FTM-108 ch. 5) agree but for the
            // thrust that is not along the path, V T (1 - cos alpha cos beta)/W (0.01 to 0.4% of Ps here). With
            // it taken off, what is left is the side force's share (zero in symmetric flight) and the central
            // difference's error, dt^2/6 times the third derivative of h and V: 1e-4 of Ps covers both
            double expected = psForces[i] - thrustInclination[i];
            assertEquals(expected, trajectory, 1e-4 * Math.abs(expected) + 1e-3, "Ps at t = " + (i + 1) * dt);
            assertTrue(psForces[i] > 5.0, "positive excess power " + psForces[i]);
            assertEquals(psForces[i], trajectory, thrustInclination[i] + 1e-4 * psForces[i] + 1e-3);
        }
    }
}
