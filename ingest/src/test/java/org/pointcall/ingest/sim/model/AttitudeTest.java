package org.pointcall.ingest.sim.model;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.pointcall.ingest.sim.airframe.Airframe;
import org.pointcall.ingest.sim.airframe.Airframes;

/** Quaternion attitude through every attitude: loops and rolls, no gimbal lock, Euler angles recovered. */
class AttitudeTest {

    @Test
    void eulerAnglesRoundTripThroughTheQuaternion() {
        SplittableRandom r = new SplittableRandom(11);
        double[] q = new double[4];
        for (int i = 0; i < 10000; i++) {
            double phi = (2 * r.nextDouble() - 1) * Math.PI * 0.999;
            double theta = (2 * r.nextDouble() - 1) * Math.PI / 2 * 0.999;
            double psi = (2 * r.nextDouble() - 1) * Math.PI * 0.999;
            Attitude.fromEuler(phi, theta, psi, q, 0);
            assertEquals(1.0, q[0] * q[0] + q[1] * q[1] + q[2] * q[2] + q[3] * q[3], 1e-14);
            // away from theta = +-90 degrees the round trip is exact to rounding, amplified by 1/cos(theta)
            double tol = 1e-12 / Math.cos(theta);
            assertEquals(theta, Attitude.theta(q, 0), tol);
            assertEquals(phi, Attitude.phi(q, 0), tol);
            assertEquals(psi, Attitude.psi(q, 0), tol);
        }
    }

    @Test
    void aFullLoopPassesThroughTheVerticalAndInvertedWithTheAttitudeOfAPureRotation() {
        Airframe af = Airframes.load("sparrel-a1");
        FlightModel m = new FlightModel(af, SimulationSettings.DEFAULT);
        TrimPoint t = m.trim(95.0, 2000.0, 0.0);
        m.initialise(t, 0, 0, 0);
        double[] q = new double[4];
        double integrated = t.thetaRad();
        double prevQ = m.qRadS();
        double pitchInt = t.elevatorRad();
        boolean sawVerticalUp = false;
        boolean sawInverted = false;
        boolean sawVerticalDown = false;
        int steps = 0;
        while (integrated < t.thetaRad() + 2 * Math.PI) {
            if (steps % 5 == 0) {
                // pitch rate held at 0.3 rad/s with the elevator (a test-local loop), full power
                double mde = Math.abs(af.longitudinal().cmElevator()) * m.dynamicPressurePa()
                        * af.geometry().wingAreaM2() * af.geometry().chordM() / af.mass().iyyKgM2();
                double err = m.qRadS() - 0.3;
                pitchInt += 8.0 / mde * err * 0.01;
                m.setControls(pitchInt + 4.0 / mde * err, 0.0, 0.0, 1.0);
            }
            m.step();
            steps++;
            // the pitch angle turned is the integral of q (trapezoid over 2 ms steps: error ~1e-7 rad)
            integrated += 0.5 * (prevQ + m.qRadS()) * m.stepS();
            prevQ = m.qRadS();
            m.quaternion(q);
            assertEquals(1.0, q[0] * q[0] + q[1] * q[1] + q[2] * q[2] + q[3] * q[3], 1e-12, "unit quaternion");
            // a symmetric airframe with the ailerons and rudder centred turns about body y only
            assertEquals(0.0, q[1], 1e-12);
            assertEquals(0.0, q[3], 1e-12);
            assertTrue(m.flowAttachment() > 0.99, "the loop stays below the stall");
            // rotation by Theta about y from level heading north: theta = asin(sin Theta); while the nose is past
            // the vertical (cos Theta < 0) bank and heading read 180 degrees
            double turned = 2 * Math.atan2(q[2], q[0]);
            assertEquals(0.0, Math.IEEEremainder(turned - integrated, 2 * Math.PI), 1e-5, "rotation = integral of q");
            double c = Math.cos(turned);
            assertEquals(Math.asin(Math.sin(turned)), m.thetaRad(), 1e-9);
            if (Math.abs(c) > 1e-3) {
                double flip = c > 0 ? 0.0 : Math.PI;
                assertEquals(0.0, Math.IEEEremainder(m.phiRad() - flip, 2 * Math.PI), 1e-9, "bank");
                assertEquals(0.0, Math.IEEEremainder(m.psiRad() - flip, 2 * Math.PI), 1e-9, "heading");
            }
            sawVerticalUp |= m.thetaRad() > Math.toRadians(89.5);
            sawInverted |= Math.abs(m.phiRad()) > Math.toRadians(179) && Math.abs(m.thetaRad()) < 0.05;
            sawVerticalDown |= m.thetaRad() < Math.toRadians(-89.5);
            assertTrue(steps < 500 * 40, "the loop takes under 40 s");
        }
        assertTrue(sawVerticalUp && sawInverted && sawVerticalDown, "went through the whole loop");
        assertEquals(t.thetaRad(), m.thetaRad(), 1e-3, "level again at the bottom");
    }

    @Test
    void aFullAileronRollTurnsThroughInvertedAndMatchesTheEulerRateEquations() {
        Airframe af = Airframes.load("sparrel-a1");
        FlightModel m = new FlightModel(af, SimulationSettings.DEFAULT);
        TrimPoint t = m.trim(80.0, 2000.0, 0.0);
        m.initialise(t, 0, 0, 0);
        // full right roll: negative aileron (positive aileron rolls left); elevator and rudder stay at trim
        m.setControls(t.elevatorRad(), af.controls().aileron().minRad(), t.rudderRad(), t.throttle());
        double[] q = new double[4];
        double[] back = new double[4];
        // the 3-2-1 Euler-rate equations integrated alongside (Heun's method on the body rates of each step),
        // an independent route to the attitude for as long as theta stays away from +-90 degrees
        double phi = 0;
        double theta = m.thetaRad();
        double psi = 0;
        double p0 = m.pRadS();
        double q0 = m.qRadS();
        double r0 = m.rRadS();
        double unwrapped = 0;
        double prevPhi = m.phiRad();
        boolean sawInverted = false;
        int steps = 0;
        while (unwrapped < 2 * Math.PI) {
            m.step();
            steps++;
            double p1 = m.pRadS();
            double q1 = m.qRadS();
            double r1 = m.rRadS();
            double h = m.stepS();
            double[] d0 = eulerRates(phi, theta, p0, q0, r0);
            double[] d1 = eulerRates(phi + h * d0[0], theta + h * d0[1], p1, q1, r1);
            phi += 0.5 * h * (d0[0] + d1[0]);
            theta += 0.5 * h * (d0[1] + d1[1]);
            psi += 0.5 * h * (d0[2] + d1[2]);
            p0 = p1;
            q0 = q1;
            r0 = r1;
            m.quaternion(q);
            assertEquals(1.0, q[0] * q[0] + q[1] * q[1] + q[2] * q[2] + q[3] * q[3], 1e-12, "unit quaternion");
            // the Euler angles the model reports rebuild its quaternion (up to sign)
            Attitude.fromEuler(m.phiRad(), m.thetaRad(), m.psiRad(), back, 0);
            double dot = q[0] * back[0] + q[1] * back[1] + q[2] * back[2] + q[3] * back[3];
            assertEquals(1.0, Math.abs(dot), 1e-12, "Euler angles describe the same attitude");
            // Heun on rates sampled every 2 ms: a few 1e-5 rad over the roll; 1e-3 leaves margin
            assertEquals(0.0, Math.IEEEremainder(m.phiRad() - phi, 2 * Math.PI), 1e-3, "bank");
            assertEquals(theta, m.thetaRad(), 1e-3, "pitch");
            assertEquals(0.0, Math.IEEEremainder(m.psiRad() - psi, 2 * Math.PI), 1e-3, "heading");
            double d = m.phiRad() - prevPhi;
            unwrapped += Math.atan2(Math.sin(d), Math.cos(d));
            prevPhi = m.phiRad();
            sawInverted |= Math.abs(m.phiRad()) > Math.toRadians(179.5);
            assertTrue(Math.abs(m.thetaRad()) < Math.toRadians(30), "nose stays near the horizon");
            assertTrue(steps < 500 * 5, "a full-aileron roll of this airframe takes under 5 s");
        }
        assertTrue(sawInverted, "rolled through inverted");
    }

    /** d/dt (phi, theta, psi) of body rates (p, q, r): the 3-2-1 Euler kinematic equations. */
    private static double[] eulerRates(double phi, double theta, double p, double q, double r) {
        double sp = Math.sin(phi);
        double cp = Math.cos(phi);
        double tt = Math.tan(theta);
        return new double[] {p + tt * (q * sp + r * cp), q * cp - r * sp, (q * sp + r * cp) / Math.cos(theta)};
    }
}
