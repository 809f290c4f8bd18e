package org.pointcall.ingest.sim.sortie;

import java.util.Arrays;

import org.pointcall.ingest.sim.model.FlightModel;

/**
 * The exact state sampled at the pilot's control rate while points are flown: one primitive column per channel,
 * SI, flight-model conventions. Grows as needed; {@link #dropBefore} forgets what no point needs any more.
 */
final class Trajectory {
    static final int TIME = 0;
    static final int HP = 1;
    static final int KCAS = 2;
    static final int MACH = 3;
    static final int TAS = 4;
    static final int NZ = 5;
    static final int NY = 6;
    static final int NX = 7;
    static final int AOA = 8;
    static final int AOS = 9;
    static final int ROLL = 10;
    static final int PITCH = 11;
    static final int HEADING = 12;
    static final int P = 13;
    static final int Q = 14;
    static final int R = 15;
    static final int CLIMB = 16;
    static final int GAMMA = 17;
    static final int ELEVATOR = 18;
    static final int AILERON = 19;
    static final int RUDDER = 20;
    static final int THROTTLE = 21;
    static final int GEAR = 22;
    static final int FLAP = 23;
    static final int CL = 24;
    static final int CHANNELS = 25;

    private double[][] data = new double[CHANNELS][4096];
    private int size;

    int size() {
        return size;
    }

    double get(int channel, int i) {
        return data[channel][i];
    }

    double time(int i) {
        return data[TIME][i];
    }

    /** Appends one sample (all channels, in channel order). */
    void add(double... row) {
        if (row.length != CHANNELS) {
            throw new IllegalArgumentException("a sample has " + CHANNELS + " channels, got " + row.length);
        }
        ensure();
        for (int c = 0; c < CHANNELS; c++) {
            data[c][size] = row[c];
        }
        size++;
    }

    /** Appends the model's state now. */
    void add(double timeS, FlightModel m, AircraftConfig config) {
        ensure();
        int i = size;
        data[TIME][i] = timeS;
        data[HP][i] = m.pressureAltitudeM();
        data[KCAS][i] = m.calibratedAirspeedMps();
        data[MACH][i] = m.mach();
        data[TAS][i] = m.trueAirspeedMps();
        data[NZ][i] = m.nz();
        data[NY][i] = m.ny();
        data[NX][i] = m.nx();
        data[AOA][i] = m.alphaRad();
        data[AOS][i] = m.betaRad();
        data[ROLL][i] = m.phiRad();
        data[PITCH][i] = m.thetaRad();
        double psi = m.psiRad();
        data[HEADING][i] = psi < 0.0 ? psi + 2.0 * Math.PI : psi;
        data[P][i] = m.pRadS();
        data[Q][i] = m.qRadS();
        data[R][i] = m.rRadS();
        data[CLIMB][i] = m.climbRateMps();
        data[GAMMA][i] = m.flightPathRad();
        data[ELEVATOR][i] = m.elevatorRad();
        // reported right-roll positive, as the dictionary defines the aileron (the model's rolls left)
        data[AILERON][i] = -m.aileronRad();
        data[RUDDER][i] = m.rudderRad();
        data[THROTTLE][i] = m.throttleLever();
        data[GEAR][i] = config.gearDown();
        data[FLAP][i] = config.flap();
        data[CL][i] = m.liftCoefficient();
        size++;
    }

    private void ensure() {
        if (size == data[0].length) {
            for (int c = 0; c < CHANNELS; c++) {
                data[c] = Arrays.copyOf(data[c], size * 2);
            }
        }
    }

    /** Forgets samples before {@code timeS}. */
    void dropBefore(double timeS) {
        int k = 0;
        while (k < size && data[TIME][k] < timeS) {
            k++;
        }
        if (k == 0) {
            return;
        }
        for (int c = 0; c < CHANNELS; c++) {
            System.arraycopy(data[c], k, data[c], 0, size - k);
        }
        size -= k;
    }

    /** Index of the sample nearest {@code timeS}; -1 when empty. */
    int indexAt(double timeS) {
        if (size == 0) {
            return -1;
        }
        int i = Arrays.binarySearch(data[TIME], 0, size, timeS);
        if (i >= 0) {
            return i;
        }
        int hi = -i - 1;
        if (hi == 0) {
            return 0;
        }
        if (hi >= size) {
            return size - 1;
        }
        return timeS - data[TIME][hi - 1] <= data[TIME][hi] - timeS ? hi - 1 : hi;
    }

    /** First index at or after {@code timeS}. */
    int first(double timeS) {
        int i = Arrays.binarySearch(data[TIME], 0, size, timeS);
        return i >= 0 ? i : Math.min(-i - 1, size - 1);
    }

    /** Last index at or before {@code timeS}. */
    int last(double timeS) {
        int i = Arrays.binarySearch(data[TIME], 0, size, timeS);
        return i >= 0 ? i : Math.max(-i - 2, 0);
    }

    /** Channel of a dictionary parameter the simulator knows, or -1. */
    static int channelOf(String parameter) {
        return switch (parameter) {
            case "Hp" -> HP;
            case "KCAS" -> KCAS;
            case "Mach" -> MACH;
            case "KTAS" -> TAS;
            case "Nz" -> NZ;
            case "Ny" -> NY;
            case "Nx" -> NX;
            case "AoA" -> AOA;
            case "AoS" -> AOS;
            case "Roll" -> ROLL;
            case "Pitch" -> PITCH;
            case "Heading" -> HEADING;
            case "P" -> P;
            case "Q" -> Q;
            case "R" -> R;
            case "dHdt" -> CLIMB;
            case "Elevator" -> ELEVATOR;
            case "Aileron" -> AILERON;
            case "Rudder" -> RUDDER;
            case "Throttle" -> THROTTLE;
            case "Gear" -> GEAR;
            case "Flap" -> FLAP;
            default -> -1;
        };
    }
}
