package org.pointcall.ingest.sim;

import org.pointcall.ingest.sim.model.FlightModel;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.units.Unit;
import org.pointcall.shared.units.Units;

/**
 * What the simulated aircraft's instrumentation measures, as the demo dictionary names it, filled from the flight
 * model's true state into one value per dictionary slot (in each parameter's own unit). Parameters the model does
 * not know stay NaN; derived ones are left to the ground. Slots are resolved once, by name.
 *
 * <p>Stick and pedal forces are not modelled by the flight model; they are made proportional to dynamic pressure
 * times surface deflection, which gives forces of the right sign and order for a reversible control system
 * (invented gains for the demo).
 */
public final class SortieTelemetry {
    /** Origin of the fictional test range's working area, on open sea (invented). */
    public static final double RANGE_LAT_DEG = 44.5;
    public static final double RANGE_LON_DEG = -31.25;
    private static final double EARTH_RADIUS_M = 6_371_000.0;

    private enum Quantity {
        PS, QC, TAT, OAT, AOA, AOS, PITCH, ROLL, HEADING, P, Q, R, NX, NY, NZ, ELEVATOR, AILERON, RUDDER,
        STICK_PITCH, STICK_ROLL, PEDAL, THROTTLE, N1, N2, EGT, FUEL_FLOW, FUEL_QTY, GEAR, FLAP, LAT, LON, GPS_ALT
    }

    private static final String[][] NAMES = {
        {"Ps"}, {"Qc"}, {"TAT"}, {"OAT"}, {"AoA"}, {"AoS"}, {"Pitch"}, {"Roll"}, {"Heading"}, {"P"}, {"Q"}, {"R"},
        {"Nx"}, {"Ny"}, {"Nz"}, {"Elevator"}, {"Aileron"}, {"Rudder"}, {"StickFp"}, {"StickFr"}, {"PedalF"},
        {"Throttle"}, {"N1"}, {"N2"}, {"EGT"}, {"FuelFlow"}, {"FuelQty"}, {"Gear"}, {"Flap"}, {"Lat"}, {"Lon"},
        {"GpsAlt"},
    };

    private final int[] slot = new int[Quantity.values().length];
    private final Unit[] unit = new Unit[Quantity.values().length];
    private final int size;

    public SortieTelemetry(ParameterDictionary dictionary) {
        this.size = dictionary.size();
        for (Quantity q : Quantity.values()) {
            int s = -1;
            for (String n : NAMES[q.ordinal()]) {
                s = dictionary.indexOf(n);
                if (s >= 0) {
                    break;
                }
            }
            slot[q.ordinal()] = s >= 0 && !dictionary.parameter(s).isDerived() ? s : -1;
            unit[q.ordinal()] = s >= 0 ? dictionary.parameter(s).unit() : null;
        }
    }

    private void put(double[] out, Quantity q, double si) {
        int s = slot[q.ordinal()];
        if (s >= 0) {
            out[s] = unit[q.ordinal()].fromSi(si);
        }
    }

    /** Fills {@code out} (one value per slot) from the model and the aircraft's configuration. */
    public void fill(FlightModel m, double gearDown, double flap, double[] out) {
        java.util.Arrays.fill(out, 0, size, Double.NaN);
        double qbar = m.dynamicPressurePa();
        double elevDeg = Math.toDegrees(m.elevatorRad());
        double ailDeg = -Math.toDegrees(m.aileronRad()); // model: positive rolls left; dictionary: right positive
        double rudDeg = Math.toDegrees(m.rudderRad());
        put(out, Quantity.PS, m.indicatedStaticPressurePa());
        put(out, Quantity.QC, m.indicatedImpactPressurePa());
        put(out, Quantity.TAT, m.totalTemperatureK());
        put(out, Quantity.OAT, m.staticTemperatureK());
        put(out, Quantity.AOA, m.alphaRad());
        put(out, Quantity.AOS, m.betaRad());
        put(out, Quantity.PITCH, m.thetaRad());
        put(out, Quantity.ROLL, m.phiRad());
        double psi = m.psiRad();
        put(out, Quantity.HEADING, psi < 0 ? psi + 2 * Math.PI : psi);
        put(out, Quantity.P, m.pRadS());
        put(out, Quantity.Q, m.qRadS());
        put(out, Quantity.R, m.rRadS());
        put(out, Quantity.NX, m.nx());
        put(out, Quantity.NY, m.ny());
        put(out, Quantity.NZ, m.nz());
        put(out, Quantity.ELEVATOR, Math.toRadians(elevDeg));
        put(out, Quantity.AILERON, Math.toRadians(ailDeg));
        put(out, Quantity.RUDDER, Math.toRadians(rudDeg));
        // Forces: invented gains, N per (Pa deg); pull and right positive.
        put(out, Quantity.STICK_PITCH, -0.0022 * qbar * elevDeg);
        put(out, Quantity.STICK_ROLL, 0.0005 * qbar * ailDeg);
        put(out, Quantity.PEDAL, 0.0060 * qbar * rudDeg);
        double power = m.powerLevel();
        put(out, Quantity.THROTTLE, m.throttleLever());
        put(out, Quantity.N1, (0.22 + 0.78 * power) * 1.0);
        put(out, Quantity.N2, (0.55 + 0.45 * power) * 1.0);
        put(out, Quantity.EGT, Units.degCToK(380 + 330 * power));
        put(out, Quantity.FUEL_FLOW, m.fuelFlowKgS());
        put(out, Quantity.FUEL_QTY, m.fuelMassKg());
        put(out, Quantity.GEAR, gearDown);
        put(out, Quantity.FLAP, flap);
        put(out, Quantity.LAT, Math.toRadians(RANGE_LAT_DEG) + m.northM() / EARTH_RADIUS_M);
        put(out, Quantity.LON, Math.toRadians(RANGE_LON_DEG)
                + m.eastM() / (EARTH_RADIUS_M * Math.cos(Math.toRadians(RANGE_LAT_DEG))));
        put(out, Quantity.GPS_ALT, m.altitudeM());
    }
}
