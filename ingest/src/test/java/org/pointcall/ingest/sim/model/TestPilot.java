package org.pointcall.ingest.sim.model;

import org.pointcall.ingest.sim.airframe.Airframe;

/**
 * A deliberately simple autopilot for the tests only (the real pilot is elsewhere): pitch attitude, bank and
 * sideslip loops with gains scaled by dynamic pressure from the airframe's own control power, and outer loops for
 * altitude, speed by pitch (throttle fixed) or speed by throttle. Runs at the 100 Hz of a telemetry frame.
 */
final class TestPilot {
    static final double DT_S = 0.01;

    private final FlightModel m;
    private final Airframe af;

    // modes
    private double thetaCmd;
    private boolean holdAltitude;
    private double altitudeCmd;
    private boolean speedByPitch;
    private double speedCmd;
    private double speedRate;
    private boolean speedByThrottle;
    private double throttle;
    private double bankCmd;
    private boolean holdBank = true;
    private boolean alphaMode;
    private double alphaCmd;
    private double alphaRate;
    private double alphaTop;

    // integrators
    private double elevatorTrim;
    private double thetaInt;
    private double throttleInt;
    private double aileronInt;
    private double rudderInt;

    TestPilot(FlightModel m, TrimPoint trim) {
        this.m = m;
        this.af = m.airframe();
        elevatorTrim = trim.elevatorRad();
        thetaCmd = trim.thetaRad();
        thetaInt = trim.thetaRad();
        throttle = trim.throttle();
        throttleInt = 0.0;
        aileronInt = trim.aileronRad();
        rudderInt = trim.rudderRad();
        altitudeCmd = trim.altitudeM();
    }

    /** Holds this geometric altitude with pitch. */
    TestPilot holdAltitude(double h) {
        holdAltitude = true;
        speedByPitch = false;
        altitudeCmd = h;
        return this;
    }

    /** Flies the true airspeed schedule v0 + rate t with pitch; throttle stays where it is set. */
    TestPilot speedByPitch(double v0, double rateMps2) {
        speedByPitch = true;
        holdAltitude = false;
        speedCmd = v0;
        speedRate = rateMps2;
        return this;
    }

    /** Holds a true airspeed with the throttle. */
    TestPilot speedByThrottle(double v) {
        speedByThrottle = true;
        speedCmd = v;
        return this;
    }

    TestPilot throttle(double t) {
        speedByThrottle = false;
        throttle = t;
        return this;
    }

    TestPilot bank(double phi) {
        bankCmd = phi;
        holdBank = true;
        return this;
    }

    /** Leaves the ailerons and rudder where they are (to see what the airframe does by itself). */
    TestPilot handsOffLaterally() {
        holdBank = false;
        return this;
    }

    /** Flies the angle of attack from a0 up at {@code rate} to {@code top}, then back down at the same rate. */
    TestPilot alphaSweep(double a0, double rateRadS, double top) {
        alphaMode = true;
        speedByPitch = false;
        holdAltitude = false;
        alphaCmd = a0;
        alphaRate = rateRadS;
        alphaTop = top;
        return this;
    }

    /** One 100 Hz frame: controls from the current state, then the model advanced by the frame. */
    void fly() {
        double q = m.dynamicPressurePa();
        double s = af.geometry().wingAreaM2();
        double v = m.trueAirspeedMps();

        if (speedByPitch) {
            speedCmd += speedRate * DT_S;
            // too fast: nose up; the integrator finds the attitude the schedule needs
            double e = (v - speedCmd) / v;
            thetaInt += 0.15 * e * DT_S;
            thetaCmd = thetaInt + 0.6 * e;
        } else if (holdAltitude) {
            double climbCmd = Math.max(-10.0, Math.min(10.0, (altitudeCmd - m.altitudeM()) / 4.0));
            double e = (climbCmd - m.climbRateMps()) / v;
            thetaInt += e * DT_S / 2.0;
            thetaCmd = thetaInt + 1.2 * e;
        }
        if (speedByThrottle) {
            // thrust to balance drag and the climb, plus an acceleration toward the target speed (10 s time
            // constant, small integral), turned into a lever position through the engine's current full thrust
            double e = speedCmd - v;
            throttleInt += 0.01 * e * DT_S;
            double accel = 0.1 * e + throttleInt;
            double needed = (m.dragN() + m.weightN() * Math.sin(m.flightPathRad()) + m.massKg() * accel)
                    / Math.cos(m.alphaRad());
            double idle = af.engine().idleThrustFraction();
            double full = m.thrustN() / (idle + (1.0 - idle) * m.powerLevel());
            throttle = (needed / full - idle) / (1.0 - idle);
        }

        // pitch attitude: a second-order response at 2.5 rad/s, damping 0.8, through the elevator's control power
        double mde = Math.abs(af.longitudinal().cmElevator()) * q * s * af.geometry().chordM()
                / af.mass().iyyKgM2();
        double wn = 2.5;
        double thetaErr = m.thetaRad() - thetaCmd;
        if (alphaMode) {
            alphaCmd += alphaRate * DT_S;
            if (alphaCmd >= alphaTop && alphaRate > 0) {
                alphaRate = -alphaRate;
            }
            thetaErr = m.alphaRad() - alphaCmd;
        }
        // thetaRad() is bounded by +-90 degrees; the tests' manoeuvres stay well inside
        double pitchAccel = wn * wn * thetaErr + 2.0 * 0.8 * wn * (m.qRadS() - bankPitchRate());
        elevatorTrim += 0.4 * pitchAccel / mde * DT_S;
        double de = elevatorTrim + pitchAccel / mde;

        // bank: 1.5 rad/s, damping 0.9, through the aileron's control power (positive aileron rolls left)
        double da = aileronInt;
        double dr = rudderInt;
        if (holdBank) {
            double[] lateral = lateral(q, s);
            da = lateral[0];
            dr = lateral[1];
        }
        m.setControls(de, da, dr, Math.max(0.0, Math.min(1.0, throttle)));
        m.advance(DT_S);
    }

    private double[] lateral(double q, double s) {
        double lda = Math.abs(af.lateral().cRollAileron()) * q * s * af.geometry().spanM() / af.mass().ixxKgM2();
        double wr = 1.5;
        // damp the roll rate beyond the steady turn's own, p = -omega sin(theta)
        double omega = 9.80665 * Math.tan(m.phiRad()) / m.trueAirspeedMps();
        double pTurn = -omega * Math.sin(m.thetaRad());
        double rollAccel = wr * wr * wrap(bankCmd - m.phiRad()) - 2.0 * 0.9 * wr * (m.pRadS() - pTurn);
        aileronInt -= 0.3 * rollAccel / lda * DT_S;
        double da = aileronInt - rollAccel / lda;

        // ball centred: a slow integral of the lateral load factor (positive rudder yaws nose left), and a yaw
        // damper on the yaw rate beyond the steady turn's, adding about 2/s of yaw damping
        double ndr = Math.abs(af.lateral().cnRudder()) * q * s * af.geometry().spanM() / af.mass().izzKgM2();
        double ny = m.ny();
        double v = m.trueAirspeedMps();
        double rTurn = 9.80665 * Math.sin(m.phiRad()) * Math.cos(m.thetaRad()) / v;
        rudderInt += 0.5 * ny * DT_S;
        double dr = rudderInt + 0.3 * ny + 2.0 / ndr * (m.rRadS() - rTurn);
        return new double[] {da, dr};
    }

    /** True once an alpha sweep has come back down to where it started. */
    boolean alphaSweepDone(double a0) {
        return alphaMode && alphaRate < 0 && alphaCmd <= a0;
    }

    /** Steady pitch rate of a level turn at the current bank, so the pitch loop does not fight the turn. */
    private double bankPitchRate() {
        double phi = m.phiRad();
        double v = m.trueAirspeedMps();
        return 9.80665 * Math.sin(phi) * Math.tan(phi) / v;
    }

    private static double wrap(double a) {
        return Math.atan2(Math.sin(a), Math.cos(a));
    }
}
