package org.pointcall.ingest.sim.pilot;

import org.pointcall.ingest.sim.airframe.Airframe;
import org.pointcall.ingest.sim.airframe.Geometry;
import org.pointcall.ingest.sim.airframe.LateralAero;
import org.pointcall.ingest.sim.airframe.LongitudinalAero;
import org.pointcall.ingest.sim.airframe.Surface;
import org.pointcall.ingest.sim.model.FlightModel;
import org.pointcall.shared.atmosphere.StandardAtmosphere;

/**
 * The pilot's hands and feet: inner loops from a wanted load factor, angle of attack, bank, roll rate, sideslip
 * or energy rate to the elevator, aileron, rudder and throttle, plus the guidance that turns altitude, speed and
 * heading targets into those wants. Gains are scheduled on dynamic pressure through the airframe's own
 * derivatives (what the pilot's feel for the aircraft amounts to), so one set flies all three airframes.
 *
 * <p>Each channel is either closed (a law runs) or held (a fixed deflection); when a closed law takes over from a
 * held surface its integrator takes what the surface holds beyond the steady law at the present state, so that
 * only the new command's proportional terms move it (bumpless transfer).
 */
final class Loops {
    private static final double G = SensedState.G;
    private static final double MIN_QBAR_PA = 150.0;

    // gains, in units of the airframe's own derivatives (1 doubles the natural stiffness or damping)
    private static final double K_ALPHA = 1.0;
    private static final double K_PITCH_DAMP = 2.5;
    /** Smoothing of the angle-of-attack command: a pilot does not step the stick, s. */
    private static final double ALPHA_CMD_LAG_S = 0.2;
    private static final double KI_ALPHA_PER_S = 0.7;
    private static final double KP_NZ = 0.0;
    private static final double KI_NZ_PER_S = 0.4;
    private static final double K_BANK_PER_S = 2.5;
    private static final double K_ROLL_DAMP = 1.0;
    private static final double KI_ROLL_PER_S = 2.0;
    private static final double K_BETA = 1.0;
    private static final double KI_BETA_PER_S = 0.2;
    private static final double K_YAW_DAMP = 6.0;
    private static final double KP_THROTTLE = 1.0;
    private static final double KI_THROTTLE_PER_S = 0.35;
    private static final double K_GAMMA_PER_S = 0.9;
    private static final double K_ALT_PER_S = 0.12;
    private static final double K_SPEED_PER_S = 0.12;
    private static final double K_HEADING_PER_S = 0.08;

    private Envelope envelope;
    private final Limits limits;
    final TrackingError error;

    private Airframe airframe;
    private LongitudinalAero lon;
    private LateralAero lat;
    private Geometry geo;
    private Surface elevatorSurface;
    private Surface aileronSurface;
    private Surface rudderSurface;

    private double elevator;
    private double aileron;
    private double rudder;
    private double throttle;
    private double elevatorI;
    private double alphaCmdSmooth = Double.NaN;
    private double nzI;
    private double aileronI;
    private double rudderI;
    private double throttleI;
    private boolean pitchHeld = true;
    private boolean rollHeld = true;
    private boolean yawHeld = true;
    private boolean throttleHeld = true;

    /** Highest angle of attack the pitch laws may ask for, rad (set by the technique). */
    double alphaCapRad;
    /** Lowest angle of attack the pitch laws may ask for, rad. */
    double alphaFloorRad;

    Loops(Envelope envelope, Limits limits, TrackingError error) {
        this.envelope = envelope;
        this.limits = limits;
        this.error = error;
        bind(envelope.airframe(), envelope);
        relaxAlphaLimits();
    }

    /**
     * Uses the derivatives of {@code a} (the configuration flown: gear and flaps change them) and the envelope of
     * the configuration the pilot is flying to.
     */
    void bind(Airframe a, Envelope e) {
        airframe = a;
        envelope = e;
        lon = a.longitudinal();
        lat = a.lateral();
        geo = a.geometry();
        elevatorSurface = a.controls().elevator();
        aileronSurface = a.controls().aileron();
        rudderSurface = a.controls().rudder();
    }

    Airframe airframe() {
        return airframe;
    }

    /** The manoeuvring limits on angle of attack: a degree short of the largest lift and of the card's limit. */
    void relaxAlphaLimits() {
        alphaCapRad = Math.min(envelope.alphaMaxLiftRad() - Math.toRadians(1.5),
                limits.alphaMaxRad - Math.toRadians(1.0));
        alphaFloorRad = Math.max(airframe.stall().alphaStallNegativeRad() + Math.toRadians(3.0),
                lon.alphaZeroLiftRad() - Math.toRadians(8.0));
    }

    /** Starts from the surfaces and throttle as they are (sortie start, after a configuration change). */
    void syncTo(double elevatorRad, double aileronRad, double rudderRad, double throttleLever) {
        elevator = elevatorRad;
        aileron = aileronRad;
        rudder = rudderRad;
        throttle = throttleLever;
        pitchHeld = rollHeld = yawHeld = throttleHeld = true;
        nzI = 0.0;
    }

    void apply(FlightModel m) {
        m.setControls(elevator, aileron, rudder, throttle);
    }

    double elevator() {
        return elevator;
    }

    double aileron() {
        return aileron;
    }

    double rudder() {
        return rudder;
    }

    double throttle() {
        return throttle;
    }

    // ------------------------------------------------------------------------------------------------ pitch

    private double qbar(SensedState s) {
        return Math.max(s.qbarPa, MIN_QBAR_PA);
    }

    private double liftSlope(SensedState s) {
        double cap = lon.prandtlGlauertMachCap();
        if (cap <= 0.0) {
            return lon.cLAlpha();
        }
        double m = Math.min(s.mach, cap);
        return lon.cLAlpha() / Math.sqrt(1.0 - m * m);
    }

    /** Angle of attack that gives load factor {@code nz} at the current dynamic pressure (attached flow). */
    double alphaForNz(SensedState s, double nz) {
        double cl = nz * s.weightN() / (qbar(s) * geo.wingAreaM2());
        return lon.alphaZeroLiftRad() + (cl - lon.cLElevator() * elevator) / liftSlope(s);
    }

    /** Load factor that angle of attack {@code alpha} gives at the current dynamic pressure (attached flow). */
    double nzForAlpha(SensedState s, double alpha) {
        double cl = liftSlope(s) * (alpha - lon.alphaZeroLiftRad()) + lon.cLElevator() * elevator;
        return cl * qbar(s) * geo.wingAreaM2() / s.weightN();
    }

    /** Closes the pitch loop on a load factor (the pilot's g), limited by the angle-of-attack cap. */
    void pitchNz(SensedState s, double nzCmd, double dtS) {
        double cmd = clamp(nzCmd, limits.nzMin + 0.3, limits.nzMax - 0.3) + error.nzG();
        double err = cmd - s.nz;
        double want = alphaForNz(s, cmd + KP_NZ * err + nzI);
        double alphaCmd = clamp(want, alphaFloorRad, alphaCapRad);
        boolean capped = alphaCmd != want;
        // the error integrated is bounded: the lag of a g onset is not a model error to learn quickly
        if (!capped || (want > alphaCapRad ? err < 0 : err > 0)) {
            nzI = clamp(nzI + KI_NZ_PER_S * clamp(err, -0.25, 0.25) * dtS, -1.5, 1.5);
        }
        // the pitch rate of the g that will be flown: the capped one when the AoA limit holds it back
        double nzFlown = capped ? nzForAlpha(s, alphaCmd) : cmd;
        double qRef = G * (nzFlown - Math.cos(s.thetaRad) * Math.cos(s.phiRad)) / Math.max(s.tasMps, 20.0);
        pitchLaw(s, alphaCmd, qRef, dtS);
    }

    /** Closes the pitch loop on an angle of attack (stall approach, the top of a loop). */
    void pitchAlpha(SensedState s, double alphaCmd, double dtS) {
        double a = clamp(alphaCmd, alphaFloorRad, alphaCapRad);
        double qRef = G * (s.nz - Math.cos(s.thetaRad) * Math.cos(s.phiRad)) / Math.max(s.tasMps, 20.0);
        nzI *= Math.exp(-dtS / 2.0);
        pitchLaw(s, a, qRef, dtS);
    }

    private void pitchLaw(SensedState s, double alphaWanted, double qRefRadS, double dtS) {
        if (Double.isNaN(alphaCmdSmooth) || pitchHeld) {
            alphaCmdSmooth = s.alphaRad;
        }
        alphaCmdSmooth += (alphaWanted - alphaCmdSmooth) * Math.min(1.0, dtS / ALPHA_CMD_LAG_S);
        double alphaCmd = alphaCmdSmooth;
        double v = Math.max(s.tasMps, 20.0);
        double halfChordOverV = geo.chordM() / (2.0 * v);
        double kAlpha = K_ALPHA * lon.cmAlpha() / lon.cmElevator();
        double kq = K_PITCH_DAMP * lon.cmQ() / lon.cmElevator() * halfChordOverV;
        double ff = -(lon.cm0() + lon.cmAlpha() * alphaCmd + lon.cmQ() * qRefRadS * halfChordOverV)
                / lon.cmElevator();
        double base = ff + kAlpha * (s.alphaRad - alphaCmd) + kq * (s.qRadS - qRefRadS);
        if (pitchHeld) {
            // bumpless: the integrator takes what the surface holds beyond the steady law at the present state,
            // not the proportional terms of a command that has just moved
            double ffNow = -(lon.cm0() + lon.cmAlpha() * s.alphaRad + lon.cmQ() * s.qRadS * halfChordOverV)
                    / lon.cmElevator();
            elevatorI = elevator - ffNow;
            pitchHeld = false;
        }
        double raw = base + elevatorI;
        double out = elevatorSurface.clamp(raw);
        double errA = s.alphaRad - alphaCmd;
        if (out == raw || (raw > out ? errA < 0 : errA > 0)) {
            double bounded = clamp(errA, -2.0 * Math.PI / 180.0, 2.0 * Math.PI / 180.0);
            elevatorI += KI_ALPHA_PER_S * kAlpha * bounded * dtS;
        }
        elevator = out;
    }

    /** Holds the elevator (hands off, a doublet input). */
    void pitchHold(double elevatorRad) {
        elevator = elevatorSurface.clamp(elevatorRad);
        pitchHeld = true;
    }

    // ---------------------------------------------------------------------------------------------- lateral

    /** Rolls toward bank {@code bankCmdRad} (Euler bank), at no more than {@code pMaxRadS}. */
    void rollToBank(SensedState s, double bankCmdRad, double pMaxRadS, double dtS) {
        rollBankError(s, SensedState.wrap(bankCmdRad - s.phiRad), pMaxRadS, dtS);
    }

    /** Rolls to null a bank error given by the technique (a loop measures bank against its own plane). */
    void rollBankError(SensedState s, double bankErrorRad, double pMaxRadS, double dtS) {
        double e = bankErrorRad + error.bankRad();
        rollRate(s, clamp(K_BANK_PER_S * e, -pMaxRadS, pMaxRadS), dtS);
    }

    /** Closes the roll loop on a body roll rate (positive right). */
    void rollRate(SensedState s, double pCmdRadS, double dtS) {
        double v = Math.max(s.tasMps, 20.0);
        double halfSpanOverV = geo.spanM() / (2.0 * v);
        double pHatCmd = pCmdRadS * halfSpanOverV;
        double pHat = s.pRadS * halfSpanOverV;
        double kp = K_ROLL_DAMP * lat.cRollP() / lat.cRollAileron();
        double ff = -(lat.cRollP() * pHatCmd + lat.cRollBeta() * s.betaRad + lat.cRollRudder() * rudder)
                / lat.cRollAileron();
        double base = ff + kp * (pHat - pHatCmd);
        if (rollHeld) {
            double ffNow = -(lat.cRollP() * pHat + lat.cRollBeta() * s.betaRad + lat.cRollRudder() * rudder)
                    / lat.cRollAileron();
            aileronI = aileron - ffNow;
            rollHeld = false;
        }
        double raw = base + aileronI;
        double out = aileronSurface.clamp(raw);
        double e = pHat - pHatCmd;
        if (out == raw || (raw > out ? e < 0 : e > 0)) {
            aileronI += KI_ROLL_PER_S * kp * e * dtS;
        }
        aileron = out;
    }

    /** Holds the aileron (full stick for a roll). */
    void rollHold(double aileronRad) {
        aileron = aileronSurface.clamp(aileronRad);
        rollHeld = true;
    }

    /** Closes the yaw loop on a sideslip (0: ball centred), with some yaw damping. */
    void yawBeta(SensedState s, double betaCmdRad, double dtS) {
        double v = Math.max(s.tasMps, 20.0);
        double halfSpanOverV = geo.spanM() / (2.0 * v);
        double b = betaCmdRad + error.betaRad();
        double kb = K_BETA * lat.cnBeta() / Math.abs(lat.cnRudder());
        double kr = K_YAW_DAMP * Math.abs(lat.cnR() / lat.cnRudder()) * halfSpanOverV;
        double rRef = G * Math.sin(s.phiRad) * Math.cos(s.thetaRad) / v + s.pRadS * Math.tan(s.alphaRad);
        double ff = -(lat.cnBeta() * b + lat.cnAileron() * aileron + lat.cnP() * s.pRadS * halfSpanOverV) / lat.cnRudder();
        double base = ff - kb * (s.betaRad - b) + kr * (s.rRadS - rRef);
        if (yawHeld) {
            double ffNow = -(lat.cnBeta() * s.betaRad + lat.cnAileron() * aileron
                    + lat.cnP() * s.pRadS * halfSpanOverV) / lat.cnRudder();
            rudderI = rudder - ffNow;
            yawHeld = false;
        }
        double raw = base + rudderI;
        double out = rudderSurface.clamp(raw);
        double e = s.betaRad - b;
        if (out == raw || (raw > out ? e > 0 : e < 0)) {
            rudderI -= KI_BETA_PER_S * kb * e * dtS;
        }
        rudder = out;
    }

    /**
     * Holds the rudder about a set position (the steps of a sideslip) with the feet still damping the yaw, as a
     * pilot does to keep the Dutch roll out of a steady sideslip.
     */
    void yawHoldDamped(SensedState s, double rudderRad) {
        double v = Math.max(s.tasMps, 20.0);
        double kr = K_YAW_DAMP * Math.abs(lat.cnR() / lat.cnRudder()) * geo.spanM() / (2.0 * v);
        double rRef = G * Math.sin(s.phiRad) * Math.cos(s.thetaRad) / v + s.pRadS * Math.tan(s.alphaRad);
        rudder = rudderSurface.clamp(rudderRad + kr * (s.rRadS - rRef));
        yawHeld = true;
    }

    /** Bank that holds a steady heading against the side force of a rudder position, from the airframe's data. */
    double bankForRudder(SensedState s, double rudderRad) {
        double beta = -lat.cnRudder() / lat.cnBeta() * rudderRad;
        double cy = lat.cYBeta() * beta + lat.cYRudder() * rudderRad;
        double side = s.qbarPa * geo.wingAreaM2() * cy;
        return Math.asin(clamp(-side / (s.weightN() * Math.max(Math.cos(s.thetaRad), 0.3)), -0.8, 0.8));
    }

    /** Holds the rudder (the steps of a sideslip). */
    void yawHold(double rudderRad) {
        rudder = rudderSurface.clamp(rudderRad);
        yawHeld = true;
    }

    // --------------------------------------------------------------------------------------------- throttle

    /**
     * Throttle for a wanted rate of change of true airspeed and climb rate: a proportional-integral loop on the
     * specific excess power (what the total-energy rate needs), in g.
     */
    void throttleEnergy(SensedState s, double vDotMps2, double hDotMps, double dtS) {
        double v = Math.max(s.tasMps, 20.0);
        double e = vDotMps2 / G + hDotMps / v - s.alongMps2 / G;
        double rho = s.staticPa / (StandardAtmosphere.GAS_CONSTANT_J_KG_K * s.staticK);
        double perLever = envelope.thrustGPerLever(rho, s.mach, s.massKg);
        double base = KP_THROTTLE * e / perLever;
        if (throttleHeld) {
            throttleI = throttle;
            throttleHeld = false;
        }
        double raw = base + throttleI;
        double out = clamp(raw, 0.0, 1.0);
        if (out == raw || (raw > out ? e < 0 : e > 0)) {
            throttleI += KI_THROTTLE_PER_S * e / perLever * dtS;
        }
        throttle = out;
    }

    void throttleHold(double lever) {
        throttle = clamp(lever, 0.0, 1.0);
        throttleHeld = true;
    }

    // --------------------------------------------------------------------------------------------- guidance

    /** Climb rate toward a pressure altitude, limited, m/s. */
    double climbForAltitude(SensedState s, double hpCmdM, double climbMaxMps, double descentMaxMps) {
        return clamp(K_ALT_PER_S * (hpCmdM + error.altitudeM() - s.hpM), -descentMaxMps, climbMaxMps);
    }

    /** Flight-path angle of a climb rate at the current speed. */
    static double gammaForClimb(SensedState s, double climbMps) {
        return Math.asin(clamp(climbMps / Math.max(s.tasMps, 20.0), -0.9, 0.9));
    }

    /** Load factor that turns the flight path toward {@code gammaCmdRad} in the current bank. */
    double nzForGamma(SensedState s, double gammaCmdRad) {
        double v = Math.max(s.tasMps, 20.0);
        double c = Math.max(Math.cos(s.phiRad), 0.3);
        return (Math.cos(s.gammaRad) + v / G * K_GAMMA_PER_S * (gammaCmdRad - s.gammaRad)) / c;
    }

    /** Rate of change of true airspeed toward a true airspeed, limited, m/s^2. */
    double accelForSpeed(SensedState s, double tasCmdMps, double accelMaxMps2) {
        return clamp(K_SPEED_PER_S * (tasCmdMps + error.speedMps() - s.tasMps), -accelMaxMps2, accelMaxMps2);
    }

    /** Bank for a coordinated turn toward a heading, limited. */
    double bankForHeading(SensedState s, double headingCmdRad, double bankMaxRad) {
        double e = SensedState.wrap(headingCmdRad + error.headingRad() - s.psiRad);
        double v = Math.max(s.tasMps, 20.0);
        return clamp(Math.atan(v * K_HEADING_PER_S * e / G), -bankMaxRad, bankMaxRad);
    }

    /**
     * Flight-path angle at which the speed changes at {@code vDotMps2} with the present thrust and drag (energy
     * shared between speed and height).
     */
    static double gammaForAccel(SensedState s, double vDotMps2) {
        return Math.asin(clamp((s.alongMps2 - vDotMps2) / G, -0.9, 0.9));
    }

    static double clamp(double v, double lo, double hi) {
        return v < lo ? lo : Math.min(v, hi);
    }
}
