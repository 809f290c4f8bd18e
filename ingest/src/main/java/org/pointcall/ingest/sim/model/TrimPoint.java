package org.pointcall.ingest.sim.model;

/**
 * A trimmed steady flight condition: wings-level (bank 0, turn rate 0) or a steady coordinated level turn (ball
 * centred: no side force). Angles in radians; the body rates follow from the turn rate.
 *
 * @param airspeedMps    true airspeed, m/s
 * @param altitudeM      geometric altitude, m
 * @param flightPathRad  flight-path angle, rad (positive climbing)
 * @param bankRad        bank angle phi, rad
 * @param alphaRad       angle of attack, rad
 * @param betaRad        sideslip, rad
 * @param thetaRad       pitch attitude, rad
 * @param elevatorRad    elevator, rad
 * @param aileronRad     aileron, rad
 * @param rudderRad      rudder, rad
 * @param throttle       throttle lever, 0 idle to 1 full
 * @param turnRateRadS   rate of turn about the vertical, rad/s (positive to the right)
 * @param attachment     flow-separation state (1 fully attached)
 * @param massKg         mass at which the trim holds, kg
 * @param residual       largest state-derivative residual left, m/s^2 or rad/s^2
 */
public record TrimPoint(double airspeedMps, double altitudeM, double flightPathRad, double bankRad, double alphaRad,
        double betaRad, double thetaRad, double elevatorRad, double aileronRad, double rudderRad, double throttle,
        double turnRateRadS, double attachment, double massKg, double residual) {

    /** Body roll rate of the steady turn, rad/s. */
    public double pRadS() {
        return -turnRateRadS * Math.sin(thetaRad);
    }

    /** Body pitch rate of the steady turn, rad/s. */
    public double qRadS() {
        return turnRateRadS * Math.sin(bankRad) * Math.cos(thetaRad);
    }

    /** Body yaw rate of the steady turn, rad/s. */
    public double rRadS() {
        return turnRateRadS * Math.cos(bankRad) * Math.cos(thetaRad);
    }
}
