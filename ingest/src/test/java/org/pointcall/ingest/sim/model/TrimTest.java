package org.pointcall.ingest.sim.model;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.pointcall.ingest.sim.airframe.AirframeSummary;
import org.pointcall.ingest.sim.airframe.Airframes;
import org.pointcall.shared.atmosphere.StandardAtmosphere;

/** Trimmed flight balances its forces the way the textbooks write steady flight. */
class TrimTest {
    private static final double G0 = StandardAtmosphere.G0_MPS2;

    @Test
    void levelTrimBalancesLiftAgainstWeightAndThrustAgainstDragAtSeveralSpeeds() {
        for (AirframeSummary a : Airframes.list()) {
            FlightModel m = new FlightModel(Airframes.load(a.name()), SimulationSettings.DEFAULT);
            double vs = m.oneGStallSpeedMps(3000.0);
            for (double f : new double[] {1.15, 1.5, 2.0, 2.4}) {
                TrimPoint t = m.trim(f * vs, 3000.0, 0.0);
                m.initialise(t, 0, 0, 0);
                double w = m.weightN();
                double alpha = m.alphaRad();
                String at = a.name() + " at " + f + " Vs";
                // steady level flight with the thrust inclined at alpha to the path (Anderson, Introduction to
                // Flight, ch. 6): L + T sin(alpha) = W and T cos(alpha) = D. Newton leaves residual accelerations
                // of 1e-10 m/s^2; forces to 1e-6 of the weight is the asked-for bound, with a wide margin.
                assertEquals(w, m.liftN() + m.thrustN() * Math.sin(alpha), 1e-6 * w, "lift, " + at);
                assertEquals(m.dragN(), m.thrustN() * Math.cos(alpha), 1e-6 * w, "thrust, " + at);
                assertEquals(0.0, m.sideForceN(), 1e-9 * w);
                assertEquals(0.0, m.qDotRadS2(), 1e-9);
                assertTrue(t.residual() < 1e-8, "residual " + t.residual());
                // unaccelerated flight: the accelerometers read minus gravity in body axes, nz = cos(theta)
                assertEquals(Math.cos(m.thetaRad()), m.nz(), 1e-9);
                assertEquals(Math.sin(m.thetaRad()), m.nx(), 1e-9);
                // and it stays put: two seconds of free flight (fuel burning) move it by millimetres
                double v0 = m.trueAirspeedMps();
                m.advance(2.0);
                assertEquals(v0, m.trueAirspeedMps(), 0.01, "speed after 2 s, " + at);
                assertEquals(3000.0, m.altitudeM(), 0.01, "altitude after 2 s, " + at);
            }
        }
    }

    @Test
    void climbingAndDescendingTrimsBalanceAlongAndAcrossTheFlightPath() {
        FlightModel m = new FlightModel(Airframes.load("veskarn-02"), SimulationSettings.DEFAULT);
        for (double gammaDeg : new double[] {-2.5, 3.0, 8.0}) {
            double gamma = Math.toRadians(gammaDeg);
            TrimPoint t = m.trim(130.0, 2000.0, gamma);
            m.initialise(t, 0, 0, 0);
            double w = m.weightN();
            double a = m.alphaRad();
            // Anderson, ch. 6, climbing flight: T cos(alpha) - D - W sin(gamma) = 0, L + T sin(alpha) - W cos(gamma) = 0
            assertEquals(0.0, m.thrustN() * Math.cos(a) - m.dragN() - w * Math.sin(gamma), 1e-6 * w);
            assertEquals(0.0, m.liftN() + m.thrustN() * Math.sin(a) - w * Math.cos(gamma), 1e-6 * w);
            assertEquals(130.0 * Math.sin(gamma), m.climbRateMps(), 1e-9);
            assertEquals(gamma, m.flightPathRad(), 1e-12);
        }
    }

    @Test
    void coordinatedTurnTrimHasNoSideForceAndTheLoadFactorOfItsLiftBank() {
        FlightModel m = new FlightModel(Airframes.load("veskarn-02"), SimulationSettings.DEFAULT);
        for (double phiDeg : new double[] {30.0, 45.0, 60.0}) {
            double phi = Math.toRadians(phiDeg);
            TrimPoint t = m.trimTurn(130.0, 3000.0, phi);
            m.initialise(t, 0, 0, 0);
            assertEquals(0.0, m.ny(), 1e-9, "ball centred");
            assertEquals(0.0, m.climbRateMps(), 1e-9);
            // a steady level turn accelerates omega V toward the centre, so the specific force is
            // sqrt((omega V)^2 + g^2) (kinematics)
            double n = Math.hypot(t.turnRateRadS() * 130.0, G0) / G0;
            double measured = Math.sqrt(m.nx() * m.nx() + m.ny() * m.ny() + m.nz() * m.nz());
            assertEquals(n, measured, 1e-9);
            // the textbook's n = 1/cos(bank) and omega = g tan(bank)/V take the bank of the lift vector about the
            // flight path, mu; with zero sideslip the body's Euler bank phi relates to it by
            // tan(mu) = tan(phi) cos(alpha) [computed from the body-axis geometry]
            double mu = Math.atan(Math.tan(phi) * Math.cos(t.alphaRad()));
            double slip = Math.abs(t.betaRad());
            assertTrue(slip < Math.toRadians(0.1), "sideslip " + Math.toDegrees(slip) + " deg");
            assertEquals(1.0 / Math.cos(mu), n, 1e-3, "load factor at " + phiDeg + " deg");
            assertEquals(G0 * Math.tan(mu) / 130.0, t.turnRateRadS(), 1e-3 * t.turnRateRadS());
            // and the Euler-bank form is off by the cos(alpha) factor only
            assertEquals(1.0 / Math.cos(phi), n, (1.0 / Math.cos(phi) - 1.0 / Math.cos(mu)) + 1e-3);
        }
    }

    @Test
    void belowTheStallSpeedThereIsNoTrimAndTheMessageSaysWhy() {
        FlightModel m = new FlightModel(Airframes.load("veskarn-02"), SimulationSettings.DEFAULT);
        double vs = m.oneGStallSpeedMps(3000.0);
        NoTrimException e = assertThrows(NoTrimException.class, () -> m.trim(0.9 * vs, 3000.0, 0.0));
        assertTrue(e.getMessage().contains("CLmax"), e.getMessage());
        assertTrue(e.getMessage().contains("stall speed"), e.getMessage());
        assertTrue(e.getMessage().startsWith("no trim of wings-level flight at "), e.getMessage());
        // just above it there is one
        assertTrue(m.trim(1.01 * vs, 3000.0, 0.0).alphaRad() <= m.alphaAtMaxLiftRad(vs / 328.6) + 1e-9);
        NoTrimException turn = assertThrows(NoTrimException.class,
                () -> m.trimTurn(1.1 * vs, 3000.0, Math.toRadians(60)));
        assertTrue(turn.getMessage().contains("60 degree banked turn"), turn.getMessage());
    }

    @Test
    void beyondFullThrustOrBelowIdleThereIsNoTrimAndTheMessageSaysWhich() {
        FlightModel m = new FlightModel(Airframes.load("quillon-tp3"), SimulationSettings.DEFAULT);
        NoTrimException fast = assertThrows(NoTrimException.class, () -> m.trim(170.0, 3000.0, 0.0));
        assertTrue(fast.getMessage().contains("not enough thrust"), fast.getMessage());
        NoTrimException steep = assertThrows(NoTrimException.class,
                () -> m.trim(120.0, 3000.0, Math.toRadians(-15)));
        assertTrue(steep.getMessage().contains("idle"), steep.getMessage());
    }

    @Test
    void trimIsRelativeToTheAirSoASteadyWindOnlyAddsToTheGroundSpeed() {
        SimulationSettings windy = SimulationSettings.DEFAULT.withWind(Wind.from(0.0, 15.0));
        FlightModel m = new FlightModel(Airframes.load("veskarn-02"), windy);
        TrimPoint t = m.trim(120.0, 3000.0, 0.0);
        m.initialise(t, 0, 0, 0.0);
        assertEquals(120.0, m.trueAirspeedMps(), 1e-9);
        assertEquals(t.alphaRad(), m.alphaRad(), 1e-12);
        // heading north into a 15 m/s northerly: ground speed 105 m/s
        assertEquals(105.0, m.groundSpeedMps(), 1e-6);
        m.advance(5.0);
        assertEquals(120.0, m.trueAirspeedMps(), 0.01);
        assertEquals(5.0 * 105.0, m.northM(), 0.1);
    }
}
