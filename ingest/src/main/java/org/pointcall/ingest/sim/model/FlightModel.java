package org.pointcall.ingest.sim.model;

import java.util.Objects;
import org.pointcall.ingest.sim.airframe.Airframe;
import org.pointcall.ingest.sim.airframe.Curve;
import org.pointcall.ingest.sim.airframe.Engine;
import org.pointcall.ingest.sim.airframe.LateralAero;
import org.pointcall.ingest.sim.airframe.LongitudinalAero;
import org.pointcall.ingest.sim.airframe.MassProperties;
import org.pointcall.ingest.sim.airframe.StallCharacteristics;
import org.pointcall.ingest.sim.airframe.Surface;
import org.pointcall.shared.airdata.AirData;
import org.pointcall.shared.airdata.PositionErrorCorrection;
import org.pointcall.shared.atmosphere.StandardAtmosphere;
import org.pointcall.shared.error.Plain;
import org.pointcall.shared.error.PointcallException;

/**
 * Six-degree-of-freedom flight model of one airframe: rigid body over a flat earth in NED axes, quaternion
 * attitude (normalised each step, so loops and rolls pass through every attitude), body rates, velocity in body
 * axes, integrated with fixed-step fourth-order Runge-Kutta over the 1976 standard atmosphere, with steady wind and
 * Dryden turbulence.
 *
 * <h2>Use</h2>
 * <pre>
 *   FlightModel m = new FlightModel(Airframes.load("veskarn-02"), SimulationSettings.DEFAULT);
 *   m.initialise(m.trim(150.0, 3000.0, 0.0), 0.0, 0.0, headingRad);
 *   loop: m.setControls(elevatorRad, aileronRad, rudderRad, throttle); m.advance(0.01); read m.nz(), m.alphaRad()...
 * </pre>
 *
 * <h2>Controls</h2>
 * Surface commands are deflections in radians, clamped to the profile's travel (see {@link #elevator()} and the
 * others for the limits); the surfaces follow through a first-order actuator with a rate limit. Sign convention of
 * the stability-derivative textbooks: a positive deflection gives a negative moment about its own axis, so positive
 * elevator (trailing edge down) pitches nose down, positive aileron rolls left, positive rudder (trailing edge
 * left) yaws nose left. The throttle lever is 0 (idle) to 1 (full), and the engine's power follows it with a lag.
 *
 * <h2>What is measured</h2>
 * Everything a sensor would see is an accessor, evaluated at the current state: air data (alpha, beta, TAS, Mach,
 * CAS, pressures true and as the static source reads them, temperatures), body rates, load factors, attitude,
 * position and velocity, engine, surfaces. The model keeps no history: sensor noise, lags and sampling belong to the
 * sensor models.
 *
 * <h2>Aerodynamics</h2>
 * From the profile's derivatives, with a Goman-Khrabrov flow-separation lag for the stall (see
 * {@link StallCharacteristics}): {@code tau1 dx/dt = x0(alpha - tau2 alphadot) - x}, where the static separation
 * curve {@code x0} is the attached one (break at the stall angle) while the flow is mostly attached ({@code x > 1/2})
 * and the separated one (break at the lower reattachment angle) otherwise, which gives the hysteresis of a real
 * stall. Lift slope scaled by Prandtl-Glauert to the profile's Mach cap; alpha-dot from the current accelerations
 * (exact, as the forces do not depend on it); drag along the relative wind, lift normal to it in the plane of
 * symmetry, side force along body y. No ground: the model is for flight in a test area.
 *
 * <p>Single-threaded: one thread drives a model. {@link #step()} and {@link #advance(double)} allocate nothing.
 */
public final class FlightModel {

    /** Default physics rate, Hz. */
    public static final double DEFAULT_STEP_RATE_HZ = 500.0;

    // state vector layout
    static final int U = 0;
    static final int V = 1;
    static final int W = 2;
    static final int P = 3;
    static final int Q = 4;
    static final int R = 5;
    static final int Q0 = 6;
    static final int Q1 = 7;
    static final int Q2 = 8;
    static final int Q3 = 9;
    static final int NORTH = 10;
    static final int EAST = 11;
    static final int DOWN = 12;
    static final int SEPARATION = 13;
    static final int POWER = 14;
    static final int ELEVATOR = 15;
    static final int AILERON = 16;
    static final int RUDDER = 17;
    static final int FUEL = 18;
    /** Side of the current wing drop: -1 left, +1 right, 0 none (discrete, changed between steps). */
    static final int DROP_SIDE = 19;
    /** 1 while the flow is attached and a new wing drop may start (discrete). */
    static final int DROP_ARMED = 20;
    /** Length of the state vector ({@link #copyState(double[])}). */
    public static final int STATE_SIZE = 21;

    /** Below this airspeed the nondimensional rates and time constants use it instead, m/s. */
    private static final double MIN_AIRSPEED_MPS = 1.0;
    /** Shortest separation lag, s: keeps the separation state well inside RK4's stability at low step rates. */
    private static final double MIN_SEPARATION_LAG_S = 0.02;
    private static final double G0 = StandardAtmosphere.G0_MPS2;
    private static final double RHO0 = StandardAtmosphere.SEA_LEVEL_DENSITY_KG_M3;
    private static final double R_AIR = StandardAtmosphere.GAS_CONSTANT_J_KG_K;
    /** A wing drop starts when the flow has begun to separate, and re-arms when it is attached again. */
    private static final double DROP_START_BELOW = 0.99;
    private static final double DROP_REARM_ABOVE = 0.995;

    private final Airframe airframe;
    private final SimulationSettings settings;
    private final double dtS;

    // airframe constants, resolved once
    private final double zeroFuelMassKg;
    private final double c1;
    private final double c2;
    private final double c3;
    private final double c4;
    private final double c5;
    private final double c6;
    private final double c7;
    private final double c8;
    private final double c9;
    private final double areaM2;
    private final double spanM;
    private final double chordM;
    private final LongitudinalAero lon;
    private final LateralAero lat;
    private final StallCharacteristics stall;
    private final Curve separatedLift;
    private final Engine engine;
    private final Curve thrustMach;
    private final Surface elevator;
    private final Surface aileron;
    private final Surface rudder;
    private final PositionErrorCorrection.Table staticSource;

    // the steady wind; zero while trimming and linearising, which are relative to the air mass
    private double windN;
    private double windE;
    private double windD;
    private final DrydenTurbulence turbulence;
    private final GaussianSource dropSide;

    private final double[] x = new double[STATE_SIZE];
    private final double[] k1 = new double[STATE_SIZE];
    private final double[] k2 = new double[STATE_SIZE];
    private final double[] k3 = new double[STATE_SIZE];
    private final double[] k4 = new double[STATE_SIZE];
    private final double[] xt = new double[STATE_SIZE];
    private final double[] scratch = new double[STATE_SIZE];

    private double elevatorCmd;
    private double aileronCmd;
    private double rudderCmd;
    private double throttleCmd;

    // gusts, held over a step
    private double gustU;
    private double gustV;
    private double gustW;
    private double gustP;

    private long steps;
    private double requestedS;
    private boolean initialised;
    private boolean outputsStale = true;

    // outputs of the last evaluation of the derivatives
    private double alpha;
    private double beta;
    private double alphaDot;
    private double tas;
    private double mach;
    private double qbar;
    private double rho;
    private double pStatic;
    private double tStatic;
    private double cL;
    private double cD;
    private double cY;
    private double liftN;
    private double dragN;
    private double sideN;
    private double thrustN;
    private double fuelFlowKgS;
    private double massKg;
    private double specificX;
    private double specificY;
    private double specificZ;
    private double pDot;
    private double qDot;
    private double rDot;
    private boolean running;

    // scratch of the trim, kept here so the static lift search does not allocate per call
    private final Trimmer trimmer;

    /**
     * A model of {@code airframe}, not yet flying: call {@link #initialise} with a trim point first.
     */
    public FlightModel(Airframe airframe, SimulationSettings settings) {
        this.airframe = Objects.requireNonNull(airframe, "airframe");
        this.settings = Objects.requireNonNull(settings, "settings");
        this.dtS = 1.0 / settings.stepRateHz();
        MassProperties mp = airframe.mass();
        zeroFuelMassKg = mp.zeroFuelMassKg();
        double ixx = mp.ixxKgM2();
        double iyy = mp.iyyKgM2();
        double izz = mp.izzKgM2();
        double ixz = mp.ixzKgM2();
        // rotational equations with the Ixz product (Stevens and Lewis, Aircraft Control and Simulation, 1.7)
        double gamma = ixx * izz - ixz * ixz;
        c1 = ((iyy - izz) * izz - ixz * ixz) / gamma;
        c2 = (ixx - iyy + izz) * ixz / gamma;
        c3 = izz / gamma;
        c4 = ixz / gamma;
        c5 = (izz - ixx) / iyy;
        c6 = ixz / iyy;
        c7 = 1.0 / iyy;
        c8 = (ixx * (ixx - iyy) + ixz * ixz) / gamma;
        c9 = ixx / gamma;
        areaM2 = airframe.geometry().wingAreaM2();
        spanM = airframe.geometry().spanM();
        chordM = airframe.geometry().chordM();
        lon = airframe.longitudinal();
        lat = airframe.lateral();
        stall = airframe.stall();
        separatedLift = stall.separatedLift();
        engine = airframe.engine();
        thrustMach = engine.thrustMachFactor();
        elevator = airframe.controls().elevator();
        aileron = airframe.controls().aileron();
        rudder = airframe.controls().rudder();
        staticSource = airframe.staticSourceError();
        windN = settings.wind().northMps();
        windE = settings.wind().eastMps();
        windD = settings.wind().downMps();
        long seed = settings.seed();
        turbulence = settings.turbulence().mode() == TurbulenceSettings.Mode.NONE ? null
                : new DrydenTurbulence(settings.turbulence(), spanM, mix(seed, 1));
        dropSide = new GaussianSource(mix(seed, 2));
        x[Q0] = 1.0;
        x[FUEL] = mp.fuelMassKg();
        x[SEPARATION] = 1.0;
        x[DROP_ARMED] = 1.0;
        trimmer = new Trimmer(this);
    }

    /** Independent streams from one seed (SplitMix64 finaliser of seed and stream number). */
    private static long mix(long seed, long stream) {
        long z = seed + stream * 0x9E3779B97F4A7C15L;
        z = (z ^ (z >>> 30)) * 0xBF58476D1CE4E5B9L;
        z = (z ^ (z >>> 27)) * 0x94D049BB133111EBL;
        return z ^ (z >>> 31);
    }

    // ---------------------------------------------------------------------------------------------- driving

    /**
     * Surface commands (radians, clamped to each surface's travel) and throttle lever (0 to 1, clamped). They hold
     * until the next call.
     */
    public void setControls(double elevatorCmdRad, double aileronCmdRad, double rudderCmdRad, double throttleLever) {
        if (!Double.isFinite(elevatorCmdRad) || !Double.isFinite(aileronCmdRad) || !Double.isFinite(rudderCmdRad)
                || !Double.isFinite(throttleLever)) {
            throw new IllegalArgumentException("control commands must be finite, got elevator "
                    + Plain.of(elevatorCmdRad) + ", aileron " + Plain.of(aileronCmdRad) + ", rudder "
                    + Plain.of(rudderCmdRad) + ", throttle " + Plain.of(throttleLever));
        }
        elevatorCmd = elevator.clamp(elevatorCmdRad);
        aileronCmd = aileron.clamp(aileronCmdRad);
        rudderCmd = rudder.clamp(rudderCmdRad);
        throttleCmd = Math.max(0.0, Math.min(1.0, throttleLever));
        outputsStale = true;
    }

    /**
     * Places the aircraft in a trimmed condition: attitude, air-relative velocity (plus the wind), body rates,
     * surfaces, engine power and flow state from {@code trim}, at the given position and heading; the controls are
     * set to the trim's. Time restarts at zero; the fuel is as it was when the trim was computed.
     */
    public void initialise(TrimPoint trim, double northM, double eastM, double headingRad) {
        Objects.requireNonNull(trim, "trim");
        trimState(trim, headingRad, x);
        x[NORTH] = northM;
        x[EAST] = eastM;
        addWind(x);
        x[DROP_SIDE] = 0.0;
        x[DROP_ARMED] = x[SEPARATION] > DROP_REARM_ABOVE ? 1.0 : 0.0;
        elevatorCmd = trim.elevatorRad();
        aileronCmd = trim.aileronRad();
        rudderCmd = trim.rudderRad();
        throttleCmd = trim.throttle();
        steps = 0;
        requestedS = 0.0;
        initialised = true;
        outputsStale = true;
    }

    /** One fixed step of 1 / stepRate seconds. */
    public void step() {
        if (!initialised) {
            throw new IllegalStateException("initialise the flight model with a trim point before stepping it");
        }
        updateGusts();
        double h = dtS;
        evaluate(x, k1);
        for (int i = 0; i < STATE_SIZE; i++) {
            xt[i] = x[i] + 0.5 * h * k1[i];
        }
        evaluate(xt, k2);
        for (int i = 0; i < STATE_SIZE; i++) {
            xt[i] = x[i] + 0.5 * h * k2[i];
        }
        evaluate(xt, k3);
        for (int i = 0; i < STATE_SIZE; i++) {
            xt[i] = x[i] + h * k3[i];
        }
        evaluate(xt, k4);
        double h6 = h / 6.0;
        for (int i = 0; i < STATE_SIZE; i++) {
            x[i] += h6 * (k1[i] + 2.0 * (k2[i] + k3[i]) + k4[i]);
        }
        afterStep();
        steps++;
        outputsStale = true;
    }

    /**
     * Runs as many whole steps as fit in the time asked for so far: the remainder carries to the next call, so a
     * 100 Hz caller on a 500 Hz model gets exactly five steps per call.
     */
    public void advance(double dtS) {
        if (!(dtS >= 0.0 && dtS < Double.POSITIVE_INFINITY)) {
            throw new IllegalArgumentException("time to advance must be zero or positive, got " + Plain.of(dtS));
        }
        requestedS = Math.max(requestedS, steps * this.dtS) + dtS;
        long target = (long) Math.floor(requestedS / this.dtS + 1e-6);
        while (steps < target) {
            step();
        }
    }

    private void updateGusts() {
        if (turbulence == null) {
            return;
        }
        double[] s = x;
        double vn = s[U] * dcm(0, s) + s[V] * dcm(3, s) + s[W] * dcm(6, s);
        double ve = s[U] * dcm(1, s) + s[V] * dcm(4, s) + s[W] * dcm(7, s);
        double vd = s[U] * dcm(2, s) + s[V] * dcm(5, s) + s[W] * dcm(8, s);
        double an = vn - windN;
        double ae = ve - windE;
        double ad = vd - windD;
        double airspeed = Math.sqrt(an * an + ae * ae + ad * ad);
        turbulence.advance(airspeed * dtS, -s[DOWN]);
        gustU = turbulence.uMps();
        gustV = turbulence.vMps();
        gustW = turbulence.wMps();
        gustP = turbulence.pRadS();
    }

    private void afterStep() {
        double n = Math.sqrt(x[Q0] * x[Q0] + x[Q1] * x[Q1] + x[Q2] * x[Q2] + x[Q3] * x[Q3]);
        x[Q0] /= n;
        x[Q1] /= n;
        x[Q2] /= n;
        x[Q3] /= n;
        x[SEPARATION] = clamp01(x[SEPARATION]);
        x[POWER] = clamp01(x[POWER]);
        x[ELEVATOR] = elevator.clamp(x[ELEVATOR]);
        x[AILERON] = aileron.clamp(x[AILERON]);
        x[RUDDER] = rudder.clamp(x[RUDDER]);
        x[FUEL] = Math.max(0.0, x[FUEL]);
        if (x[DROP_ARMED] == 1.0 && x[SEPARATION] < DROP_START_BELOW) {
            x[DROP_SIDE] = dropSide.nextBoolean() ? 1.0 : -1.0;
            x[DROP_ARMED] = 0.0;
        } else if (x[DROP_ARMED] == 0.0 && x[SEPARATION] > DROP_REARM_ABOVE) {
            x[DROP_SIDE] = 0.0;
            x[DROP_ARMED] = 1.0;
        }
        double h = -x[DOWN];
        if (!(h > -4000.0 && h < 60000.0)) {
            // a scenario's pilot flew it out of the model (there is no ground): one line for the user
            throw new PointcallException("the aircraft left the simulated airspace at " + Plain.of(h)
                    + " m altitude (t = " + Plain.of(timeS()) + " s); the model spans -4000 to 60000 m");
        }
    }

    private static double clamp01(double v) {
        return v < 0.0 ? 0.0 : Math.min(v, 1.0);
    }

    // ----------------------------------------------------------------------------------------------- physics

    /** Element k (row-major) of the NED-to-body direction cosine matrix of the state's (unit) quaternion. */
    private static double dcm(int k, double[] s) {
        double e0 = s[Q0];
        double e1 = s[Q1];
        double e2 = s[Q2];
        double e3 = s[Q3];
        return switch (k) {
            case 0 -> e0 * e0 + e1 * e1 - e2 * e2 - e3 * e3;
            case 1 -> 2.0 * (e1 * e2 + e0 * e3);
            case 2 -> 2.0 * (e1 * e3 - e0 * e2);
            case 3 -> 2.0 * (e1 * e2 - e0 * e3);
            case 4 -> e0 * e0 - e1 * e1 + e2 * e2 - e3 * e3;
            case 5 -> 2.0 * (e2 * e3 + e0 * e1);
            case 6 -> 2.0 * (e1 * e3 + e0 * e2);
            case 7 -> 2.0 * (e2 * e3 - e0 * e1);
            default -> e0 * e0 - e1 * e1 - e2 * e2 + e3 * e3;
        };
    }

    /**
     * The state derivative {@code ds} of state {@code s} under the current commands and gusts; also leaves every
     * output quantity of that state in the model's fields.
     */
    void evaluate(double[] s, double[] ds) {
        double u = s[U];
        double v = s[V];
        double w = s[W];
        double p = s[P];
        double q = s[Q];
        double r = s[R];
        double e0 = s[Q0];
        double e1 = s[Q1];
        double e2 = s[Q2];
        double e3 = s[Q3];
        // the Runge-Kutta stages leave the quaternion slightly off unit length: normalise the matrix, not the state
        double inv = 1.0 / (e0 * e0 + e1 * e1 + e2 * e2 + e3 * e3);
        double m11 = (e0 * e0 + e1 * e1 - e2 * e2 - e3 * e3) * inv;
        double m12 = 2.0 * (e1 * e2 + e0 * e3) * inv;
        double m13 = 2.0 * (e1 * e3 - e0 * e2) * inv;
        double m21 = 2.0 * (e1 * e2 - e0 * e3) * inv;
        double m22 = (e0 * e0 - e1 * e1 + e2 * e2 - e3 * e3) * inv;
        double m23 = 2.0 * (e2 * e3 + e0 * e1) * inv;
        double m31 = 2.0 * (e1 * e3 + e0 * e2) * inv;
        double m32 = 2.0 * (e2 * e3 - e0 * e1) * inv;
        double m33 = (e0 * e0 - e1 * e1 - e2 * e2 + e3 * e3) * inv;

        // atmosphere at the geometric altitude
        double hGeo = StandardAtmosphere.geopotentialFromGeometricM(-s[DOWN]);
        double temp = StandardAtmosphere.temperatureK(hGeo);
        double press = StandardAtmosphere.pressurePa(hGeo);
        double dens = press / (R_AIR * temp);
        double sound = StandardAtmosphere.speedOfSoundAtMps(temp);

        // air-relative velocity in body axes
        double wbx = m11 * windN + m12 * windE + m13 * windD;
        double wby = m21 * windN + m22 * windE + m23 * windD;
        double wbz = m31 * windN + m32 * windE + m33 * windD;
        double ua = u - wbx - gustU;
        double va = v - wby - gustV;
        double wa = w - wbz - gustW;
        double speed = Math.sqrt(ua * ua + va * va + wa * wa);
        double vs = Math.max(speed, MIN_AIRSPEED_MPS);
        double a = Math.atan2(wa, ua);
        double b = Math.asin(Math.max(-1.0, Math.min(1.0, va / vs)));
        double sinA = Math.sin(a);
        double cosA = Math.cos(a);
        double m = speed / sound;
        double dyn = 0.5 * dens * speed * speed;

        // actuators: first-order lag toward the clamped command, rate-limited
        double de = s[ELEVATOR];
        double da = s[AILERON];
        double dr = s[RUDDER];
        ds[ELEVATOR] = actuatorRate(elevator, elevatorCmd, de);
        ds[AILERON] = actuatorRate(aileron, aileronCmd, da);
        ds[RUDDER] = actuatorRate(rudder, rudderCmd, dr);

        // engine
        double power = s[POWER];
        double fuel = s[FUEL];
        boolean on = fuel > 0.0;
        double lapse = Math.pow(dens / RHO0, engine.densityExponent());
        double thrust = on ? engine.maxThrustSeaLevelN() * lapse * thrustMach.valueAt(m)
                * (engine.idleThrustFraction() + (1.0 - engine.idleThrustFraction()) * power) : 0.0;
        double ff = on ? (engine.idleFuelFlowKgS() + (engine.maxFuelFlowSeaLevelKgS() - engine.idleFuelFlowKgS())
                * power) * lapse : 0.0;
        double spool = engine.spoolTimeHighPowerS()
                + (engine.spoolTimeLowPowerS() - engine.spoolTimeHighPowerS()) * (1.0 - clamp01(power));
        ds[POWER] = ((on ? throttleCmd : 0.0) - power) / spool;
        ds[FUEL] = -ff;
        double mass = zeroFuelMassKg + Math.max(fuel, 0.0);

        // aerodynamic coefficients
        double sep = clamp01(s[SEPARATION]);
        double phat = (p - gustP) * spanM / (2.0 * vs);
        double qhat = q * chordM / (2.0 * vs);
        double rhat = r * spanM / (2.0 * vs);
        double clStatic = staticLift(a, sep, m);
        double lift = clStatic + lon.cLQ() * qhat + lon.cLElevator() * de;
        double drag = lon.cD0() + lon.inducedDragFactor() * clStatic * clStatic
                + (1.0 - sep) * (stall.separatedNormalForce() * sinA * sinA + stall.separatedDragIncrement())
                + waveDrag(m);
        double side = lat.cYBeta() * b + lat.cYP() * phat + lat.cYR() * rhat + lat.cYRudder() * dr;
        double rollDamping = lat.cRollP() * (sep + (1.0 - sep) * stall.rollDampingSeparatedRatio());
        double roll = lat.cRollBeta() * b + rollDamping * phat + lat.cRollR() * rhat + lat.cRollAileron() * da
                + lat.cRollRudder() * dr + s[DROP_SIDE] * stall.wingDropCl() * 4.0 * sep * (1.0 - sep);
        double yaw = lat.cnBeta() * b + lat.cnP() * phat + lat.cnR() * rhat + lat.cnAileron() * da
                + lat.cnRudder() * dr;

        // forces: drag against the relative wind, lift normal to it in the plane of symmetry, side force along y
        double qs = dyn * areaM2;
        double ex = speed > 0.0 ? ua / speed : 1.0;
        double ey = speed > 0.0 ? va / speed : 0.0;
        double ez = speed > 0.0 ? wa / speed : 0.0;
        double fx = qs * (-drag * ex + lift * sinA) + thrust;
        double fy = qs * (-drag * ey + side);
        double fz = qs * (-drag * ez - lift * cosA);
        double udot = fx / mass + G0 * m13 + r * v - q * w;
        double vdot = fy / mass + G0 * m23 + p * w - r * u;
        double wdot = fz / mass + G0 * m33 + q * u - p * v;
        ds[U] = udot;
        ds[V] = vdot;
        ds[W] = wdot;

        // alpha-dot of the air-relative velocity: the body-axis wind turns with the body (d/dt wb = -omega x wb)
        double uaDot = udot + (q * wbz - r * wby);
        double waDot = wdot + (p * wby - q * wbx);
        double den = ua * ua + wa * wa;
        double ad = den > MIN_AIRSPEED_MPS * MIN_AIRSPEED_MPS ? (ua * waDot - wa * uaDot) / den : 0.0;
        double adhat = ad * chordM / (2.0 * vs);
        double pitch = lon.cm0() + lon.cmAlpha() * a + lon.cmQ() * qhat + lon.cmAlphaDot() * adhat
                + lon.cmElevator() * de + (1.0 - sep) * stall.pitchBreakCm();
        double lMoment = qs * spanM * roll;
        double mMoment = qs * chordM * pitch + thrust * engine.thrustLineOffsetM();
        double nMoment = qs * spanM * yaw;
        double pd = (c1 * r + c2 * p) * q + c3 * lMoment + c4 * nMoment;
        double qd = c5 * p * r - c6 * (p * p - r * r) + c7 * mMoment;
        double rd = (c8 * p - c2 * r) * q + c4 * lMoment + c9 * nMoment;
        ds[P] = pd;
        ds[Q] = qd;
        ds[R] = rd;

        // quaternion kinematics, qdot = 1/2 q (x) (0, p, q, r)
        ds[Q0] = -0.5 * (e1 * p + e2 * q + e3 * r);
        ds[Q1] = 0.5 * (e0 * p + e2 * r - e3 * q);
        ds[Q2] = 0.5 * (e0 * q + e3 * p - e1 * r);
        ds[Q3] = 0.5 * (e0 * r + e1 * q - e2 * p);
        ds[NORTH] = m11 * u + m21 * v + m31 * w;
        ds[EAST] = m12 * u + m22 * v + m32 * w;
        ds[DOWN] = m13 * u + m23 * v + m33 * w;

        // Goman-Khrabrov separation lag, time constants in chord transit times
        double transit = chordM / vs;
        double tau1 = Math.max(stall.separationLagChords() * transit, MIN_SEPARATION_LAG_S);
        double target = staticAttachment(a - stall.hysteresisLagChords() * transit * ad, sep > 0.5);
        ds[SEPARATION] = (target - sep) / tau1;
        ds[DROP_SIDE] = 0.0;
        ds[DROP_ARMED] = 0.0;

        alpha = a;
        beta = b;
        alphaDot = ad;
        tas = speed;
        mach = m;
        qbar = dyn;
        rho = dens;
        pStatic = press;
        tStatic = temp;
        cL = lift;
        cD = drag;
        cY = side;
        liftN = qs * lift;
        dragN = qs * drag;
        sideN = qs * side;
        thrustN = thrust;
        fuelFlowKgS = ff;
        massKg = mass;
        specificX = fx / mass;
        specificY = fy / mass;
        specificZ = fz / mass;
        pDot = pd;
        qDot = qd;
        rDot = rd;
        running = on;
    }

    private static double actuatorRate(Surface s, double cmd, double pos) {
        double rate = (cmd - pos) / s.timeConstantS();
        double lim = s.rateRadS();
        return rate > lim ? lim : Math.max(rate, -lim);
    }

    /** CL of the wing-body without rate and control terms, blending attached and separated flow. */
    double staticLift(double a, double sep, double m) {
        double pg = 1.0;
        double cap = lon.prandtlGlauertMachCap();
        if (cap > 0.0) {
            double mc = Math.min(m, cap);
            pg = 1.0 / Math.sqrt(1.0 - mc * mc);
        }
        double attached = lon.cLAlpha() * pg * (a - lon.alphaZeroLiftRad());
        return sep * attached + (1.0 - sep) * separatedLift(a);
    }

    /** CL of the separated flow: the profile's table, odd in alpha and mirrored beyond 90 degrees (flat plate). */
    private double separatedLift(double a) {
        double mag = Math.abs(a);
        double sign = a < 0.0 ? -1.0 : 1.0;
        if (mag > 0.5 * Math.PI) {
            mag = Math.PI - mag;
            sign = -sign;
        }
        return sign * separatedLift.valueAt(mag);
    }

    private double waveDrag(double m) {
        double mdr = lon.dragRiseMach();
        if (mdr <= 0.0 || m <= mdr) {
            return 0.0;
        }
        double d = m - mdr;
        return 20.0 * d * d * d * d;
    }

    /**
     * Static separation curve x0: the attached branch breaks at the stall angles, the separated branch at the
     * reattachment angles.
     */
    double staticAttachment(double a, boolean attachedBranch) {
        double up = attachedBranch ? stall.alphaStallRad() : stall.alphaReattachRad();
        double down = attachedBranch ? stall.alphaStallNegativeRad() : stall.alphaReattachNegativeRad();
        double wdt = stall.breakWidthRad();
        return 0.25 * (1.0 - Math.tanh((a - up) / wdt)) * (1.0 + Math.tanh((a - down) / wdt));
    }

    // -------------------------------------------------------------------------------------------------- trim

    /**
     * Trims wings-level steady flight at a true airspeed, geometric altitude and flight-path angle: angle of attack,
     * elevator and throttle by Newton on the axial, normal and pitching equations (flow attached, controls and
     * engine settled). The mass is the current one.
     *
     * @throws NoTrimException when no such flight exists (below the stall speed, not enough thrust, throttle below
     *                         idle, elevator beyond its travel), saying which
     */
    public TrimPoint trim(double speedMps, double altitudeM, double flightPathRad) {
        return trimmer.level(speedMps, altitudeM, flightPathRad);
    }

    /**
     * Trims a steady coordinated level turn (no side force, ball centred) at a true airspeed, geometric altitude and
     * bank angle (positive right): angle of attack, sideslip, pitch attitude, the three surfaces, throttle and turn
     * rate from the six equations of motion, zero climb and zero side force.
     *
     * @throws NoTrimException as {@link #trim}
     */
    public TrimPoint trimTurn(double speedMps, double altitudeM, double bankRad) {
        return trimmer.turn(speedMps, altitudeM, bankRad);
    }

    /**
     * Largest trimmed lift coefficient of the attached flow at a Mach number: the peak over angle of attack of the
     * static CL with the elevator that trims the pitching moment (no pitch rate, no thrust moment).
     */
    public double maxLiftCoefficient(double machNumber) {
        return trimmer.maxLift(machNumber)[0];
    }

    /** Angle of attack of {@link #maxLiftCoefficient}, rad. */
    public double alphaAtMaxLiftRad(double machNumber) {
        return trimmer.maxLift(machNumber)[1];
    }

    /**
     * 1 g stall speed (true airspeed) at the current mass and a geometric altitude, from
     * {@code Vs = sqrt(2 W / (rho S CLmax))} with CLmax at the stall Mach (a few fixed-point passes).
     */
    public double oneGStallSpeedMps(double altitudeM) {
        double h = StandardAtmosphere.geopotentialFromGeometricM(altitudeM);
        double dens = StandardAtmosphere.densityKgM3(h);
        double a = StandardAtmosphere.speedOfSoundMps(h);
        double weight = currentMassKg() * G0;
        double vs = Math.sqrt(2.0 * weight / (dens * areaM2 * maxLiftCoefficient(0.0)));
        for (int i = 0; i < 4; i++) {
            vs = Math.sqrt(2.0 * weight / (dens * areaM2 * maxLiftCoefficient(vs / a)));
        }
        return vs;
    }

    /** Fills {@code s} with the state of a trim point at heading {@code psi} (air-relative, no wind, at origin). */
    void trimState(TrimPoint t, double psi, double[] s) {
        double va = t.airspeedMps();
        double ca = Math.cos(t.alphaRad());
        double sa = Math.sin(t.alphaRad());
        double cb = Math.cos(t.betaRad());
        double sb = Math.sin(t.betaRad());
        s[U] = va * ca * cb;
        s[V] = va * sb;
        s[W] = va * sa * cb;
        s[P] = t.pRadS();
        s[Q] = t.qRadS();
        s[R] = t.rRadS();
        Attitude.fromEuler(t.bankRad(), t.thetaRad(), psi, s, Q0);
        s[NORTH] = 0.0;
        s[EAST] = 0.0;
        s[DOWN] = -t.altitudeM();
        s[SEPARATION] = t.attachment();
        s[POWER] = t.throttle();
        s[ELEVATOR] = t.elevatorRad();
        s[AILERON] = t.aileronRad();
        s[RUDDER] = t.rudderRad();
        s[FUEL] = x[FUEL];
        s[DROP_SIDE] = 0.0;
        s[DROP_ARMED] = 1.0;
    }

    private void addWind(double[] s) {
        s[U] += dcm(0, s) * windN + dcm(1, s) * windE + dcm(2, s) * windD;
        s[V] += dcm(3, s) * windN + dcm(4, s) * windE + dcm(5, s) * windD;
        s[W] += dcm(6, s) * windN + dcm(7, s) * windE + dcm(8, s) * windD;
    }

    /**
     * Sets the commands and clears the gusts and the wind for a steady evaluation (trim, linearisation): a steady
     * uniform wind changes nothing relative to the air, and the states of an analysis are air-relative.
     */
    void holdForAnalysis(double de, double da, double dr, double throttle) {
        elevatorCmd = de;
        aileronCmd = da;
        rudderCmd = dr;
        throttleCmd = throttle;
        gustU = gustV = gustW = gustP = 0.0;
        windN = windE = windD = 0.0;
        outputsStale = true;
    }

    /** Commands, gusts and wind as they were before an analysis. */
    double[] saveCommands() {
        return new double[] {elevatorCmd, aileronCmd, rudderCmd, throttleCmd, gustU, gustV, gustW, gustP, windN,
            windE, windD};
    }

    void restoreCommands(double[] saved) {
        elevatorCmd = saved[0];
        aileronCmd = saved[1];
        rudderCmd = saved[2];
        throttleCmd = saved[3];
        gustU = saved[4];
        gustV = saved[5];
        gustW = saved[6];
        gustP = saved[7];
        windN = saved[8];
        windE = saved[9];
        windD = saved[10];
        outputsStale = true;
    }

    /** Side force over mass of the last {@link #evaluate} call, m/s^2 (no refresh). */
    double evaluatedSpecificY() {
        return specificY;
    }

    /** Zero-fuel mass plus the fuel of the state, kg (no evaluation). */
    double currentMassKg() {
        return zeroFuelMassKg + x[FUEL];
    }

    // ----------------------------------------------------------------------------------------------- outputs

    private void ensureOutputs() {
        if (outputsStale) {
            evaluate(x, scratch);
            outputsStale = false;
        }
    }

    /** The airframe flown. */
    public Airframe airframe() {
        return airframe;
    }

    /** The settings it runs with. */
    public SimulationSettings settings() {
        return settings;
    }

    /** Physics step, s. */
    public double stepS() {
        return dtS;
    }

    /** Simulated time since {@link #initialise}, s (a whole number of steps). */
    public double timeS() {
        return steps * dtS;
    }

    /** Steps since {@link #initialise}. */
    public long stepCount() {
        return steps;
    }

    /** Copies the state vector ({@link #STATE_SIZE} values) into {@code out}, for snapshots and comparisons. */
    public void copyState(double[] out) {
        System.arraycopy(x, 0, out, 0, STATE_SIZE);
    }

    /** Sets the usable fuel, kg (before a trim, for a scenario's fuel state). */
    public void setFuelMassKg(double fuelKg) {
        if (!(fuelKg >= 0.0 && fuelKg < Double.POSITIVE_INFINITY)) {
            throw new IllegalArgumentException("fuel must be zero or positive, got " + Plain.of(fuelKg));
        }
        x[FUEL] = fuelKg;
        outputsStale = true;
    }

    // position and motion over the ground

    /** North of the origin, m. */
    public double northM() {
        return x[NORTH];
    }

    /** East of the origin, m. */
    public double eastM() {
        return x[EAST];
    }

    /** Geometric altitude above mean sea level, m. */
    public double altitudeM() {
        return -x[DOWN];
    }

    /** Velocity over the ground, north, m/s. */
    public double velocityNorthMps() {
        return x[U] * dcm(0, x) + x[V] * dcm(3, x) + x[W] * dcm(6, x);
    }

    /** Velocity over the ground, east, m/s. */
    public double velocityEastMps() {
        return x[U] * dcm(1, x) + x[V] * dcm(4, x) + x[W] * dcm(7, x);
    }

    /** Velocity over the ground, down, m/s. */
    public double velocityDownMps() {
        return x[U] * dcm(2, x) + x[V] * dcm(5, x) + x[W] * dcm(8, x);
    }

    /** Rate of climb, m/s. */
    public double climbRateMps() {
        return -velocityDownMps();
    }

    /** Ground speed (horizontal), m/s. */
    public double groundSpeedMps() {
        return Math.hypot(velocityNorthMps(), velocityEastMps());
    }

    /** Ground track, rad clockwise from north, -pi to pi. */
    public double trackRad() {
        return Math.atan2(velocityEastMps(), velocityNorthMps());
    }

    /** Flight-path angle over the ground, rad. */
    public double flightPathRad() {
        return Math.atan2(-velocityDownMps(), groundSpeedMps());
    }

    /** Body-axis velocity over the ground, m/s. */
    public double uMps() {
        return x[U];
    }

    public double vMps() {
        return x[V];
    }

    public double wMps() {
        return x[W];
    }

    // attitude and rates

    /** Roll rate, rad/s. */
    public double pRadS() {
        return x[P];
    }

    /** Pitch rate, rad/s. */
    public double qRadS() {
        return x[Q];
    }

    /** Yaw rate, rad/s. */
    public double rRadS() {
        return x[R];
    }

    /** Roll acceleration, rad/s^2. */
    public double pDotRadS2() {
        ensureOutputs();
        return pDot;
    }

    /** Pitch acceleration, rad/s^2. */
    public double qDotRadS2() {
        ensureOutputs();
        return qDot;
    }

    /** Yaw acceleration, rad/s^2. */
    public double rDotRadS2() {
        ensureOutputs();
        return rDot;
    }

    /** The attitude quaternion (scalar first, NED to body, unit length) into {@code out[0..3]}. */
    public void quaternion(double[] out) {
        System.arraycopy(x, Q0, out, 0, 4);
    }

    /** Pitch attitude theta, -pi/2 to pi/2. */
    public double thetaRad() {
        return Attitude.theta(x, Q0);
    }

    /** Bank angle phi, -pi to pi. */
    public double phiRad() {
        return Attitude.phi(x, Q0);
    }

    /** Heading psi, -pi to pi clockwise from north. */
    public double psiRad() {
        return Attitude.psi(x, Q0);
    }

    // air data

    /** Angle of attack of the air-relative velocity, rad. */
    public double alphaRad() {
        ensureOutputs();
        return alpha;
    }

    /** Sideslip, rad (positive with the relative wind from the right). */
    public double betaRad() {
        ensureOutputs();
        return beta;
    }

    /** Rate of change of the angle of attack, rad/s. */
    public double alphaDotRadS() {
        ensureOutputs();
        return alphaDot;
    }

    /** True airspeed, m/s. */
    public double trueAirspeedMps() {
        ensureOutputs();
        return tas;
    }

    /** Mach number. */
    public double mach() {
        ensureOutputs();
        return mach;
    }

    /** Dynamic pressure 1/2 rho V^2, Pa. */
    public double dynamicPressurePa() {
        ensureOutputs();
        return qbar;
    }

    /** Ambient static pressure, Pa. */
    public double staticPressurePa() {
        ensureOutputs();
        return pStatic;
    }

    /** Ambient (outside air) static temperature, K. */
    public double staticTemperatureK() {
        ensureOutputs();
        return tStatic;
    }

    /** Total temperature of a perfect stagnation probe (recovery factor 1), K; sensor models apply their own. */
    public double totalTemperatureK() {
        ensureOutputs();
        return AirData.totalTemperatureK(tStatic, mach, 1.0);
    }

    /** Ambient density, kg/m^3. */
    public double densityKgM3() {
        ensureOutputs();
        return rho;
    }

    /** True impact pressure qc (pitot minus ambient static), Pa. */
    public double impactPressurePa() {
        ensureOutputs();
        return AirData.impactPressureFromMach(mach, pStatic);
    }

    /** Calibrated airspeed from the true impact pressure, m/s. */
    public double calibratedAirspeedMps() {
        return AirData.casFromImpactPressure(impactPressurePa());
    }

    /** Equivalent airspeed, m/s. */
    public double equivalentAirspeedMps() {
        ensureOutputs();
        return AirData.equivalentAirspeedMps(tas, rho);
    }

    /** Pressure altitude of the ambient pressure (geopotential, by the standard's definition), m. */
    public double pressureAltitudeM() {
        ensureOutputs();
        return StandardAtmosphere.pressureAltitudeM(pStatic);
    }

    /**
     * Static pressure as the airframe's static source reads it, Pa: ambient plus the position error
     * {@code dPp = (dPp/qc)(M_ic) qc_ic} of the profile's calibration, solved for the indicated Mach it is defined
     * against (the total pressure is taken as free of error).
     */
    public double indicatedStaticPressurePa() {
        ensureOutputs();
        double qc = AirData.impactPressureFromMach(mach, pStatic);
        return pStatic + indicatedDeltaPp(qc);
    }

    /** Impact pressure as the pitot-static system reads it (total pressure minus indicated static), Pa. */
    public double indicatedImpactPressurePa() {
        ensureOutputs();
        double qc = AirData.impactPressureFromMach(mach, pStatic);
        return qc - indicatedDeltaPp(qc);
    }

    /** dPp of the static source at the current condition: a few fixed-point passes on the indicated Mach. */
    private double indicatedDeltaPp(double qc) {
        double mic = mach;
        double d = 0.0;
        for (int i = 0; i < 5; i++) {
            double k = staticSource.deltaPpOverQc(mic);
            double qcIc = qc / (1.0 + k);
            d = k * qcIc;
            mic = AirData.machFromImpactPressure(qcIc, pStatic + d);
        }
        return d;
    }

    // loads

    /** Longitudinal load factor: specific force along body x over g0 (positive forward). */
    public double nx() {
        ensureOutputs();
        return specificX / G0;
    }

    /** Lateral load factor: specific force along body y over g0 (positive right). */
    public double ny() {
        ensureOutputs();
        return specificY / G0;
    }

    /** Normal load factor: specific force along body -z over g0 (positive up: 1 in level flight). */
    public double nz() {
        ensureOutputs();
        return -specificZ / G0;
    }

    // forces, for checks

    /** Lift, N (normal to the relative wind in the plane of symmetry). */
    public double liftN() {
        ensureOutputs();
        return liftN;
    }

    /** Drag, N (against the relative wind). */
    public double dragN() {
        ensureOutputs();
        return dragN;
    }

    /** Side force along body y, N. */
    public double sideForceN() {
        ensureOutputs();
        return sideN;
    }

    /** Thrust along body x, N. */
    public double thrustN() {
        ensureOutputs();
        return thrustN;
    }

    /** Lift coefficient of the last evaluation (with rate and control terms). */
    public double liftCoefficient() {
        ensureOutputs();
        return cL;
    }

    /** Drag coefficient. */
    public double dragCoefficient() {
        ensureOutputs();
        return cD;
    }

    /** Side-force coefficient. */
    public double sideForceCoefficient() {
        ensureOutputs();
        return cY;
    }

    /** Current mass, kg (zero-fuel plus fuel). */
    public double massKg() {
        ensureOutputs();
        return massKg;
    }

    /** Current weight m g0, N. */
    public double weightN() {
        return massKg() * G0;
    }

    // engine

    /** Engine power state, 0 (idle) to 1 (full); lags the throttle lever. */
    public double powerLevel() {
        return x[POWER];
    }

    /** Throttle lever as commanded, 0 to 1. */
    public double throttleLever() {
        return throttleCmd;
    }

    /** Fuel flow, kg/s. */
    public double fuelFlowKgS() {
        ensureOutputs();
        return fuelFlowKgS;
    }

    /** Usable fuel left, kg. */
    public double fuelMassKg() {
        return x[FUEL];
    }

    /** False once the tanks are empty. */
    public boolean engineRunning() {
        ensureOutputs();
        return running;
    }

    // surfaces and commands

    /** Elevator position, rad (positive trailing edge down). */
    public double elevatorRad() {
        return x[ELEVATOR];
    }

    /** Aileron position, rad (positive rolls left). */
    public double aileronRad() {
        return x[AILERON];
    }

    /** Rudder position, rad (positive trailing edge left). */
    public double rudderRad() {
        return x[RUDDER];
    }

    /** Elevator travel and rates. */
    public Surface elevator() {
        return elevator;
    }

    /** Aileron travel and rates. */
    public Surface aileron() {
        return aileron;
    }

    /** Rudder travel and rates. */
    public Surface rudder() {
        return rudder;
    }

    // stall and turbulence

    /** Flow-separation state: 1 attached, 0 fully separated. */
    public double flowAttachment() {
        return x[SEPARATION];
    }

    /** Side of the current wing drop: -1 left wing down, +1 right wing down, 0 none. */
    public int wingDropSide() {
        return (int) x[DROP_SIDE];
    }

    /** Gusts of the current step in body axes (air-mass velocity, m/s; roll gust, rad/s). */
    public double gustUMps() {
        return gustU;
    }

    public double gustVMps() {
        return gustV;
    }

    public double gustWMps() {
        return gustW;
    }

    public double gustPRadS() {
        return gustP;
    }
}
