package org.pointcall.ingest.sim.sortie;

import java.util.Arrays;

import org.pointcall.ingest.sim.model.FlightModel;

/** Keeps what a test looks at from every frame it is given, SI and flight-model conventions. */
final class FrameRecorder implements FrameObserver {
    static final int TIME = 0;
    static final int ALPHA = 1;
    static final int CL = 2;
    static final int HP = 3;
    static final int CLIMB = 4;
    static final int THETA = 5;
    static final int PHI = 6;
    static final int PSI = 7;
    static final int Q = 8;
    static final int NZ = 9;
    static final int CAS = 10;
    static final int MACH = 11;
    static final int GEAR = 12;
    private static final int N = 13;

    private double[][] v = new double[N][1024];
    private int size;

    @Override
    public void onFrame(double timeS, FlightModel m, AircraftConfig c) {
        if (size == v[0].length) {
            for (int i = 0; i < N; i++) {
                v[i] = Arrays.copyOf(v[i], size * 2);
            }
        }
        v[TIME][size] = timeS;
        v[ALPHA][size] = m.alphaRad();
        v[CL][size] = m.liftCoefficient();
        v[HP][size] = m.pressureAltitudeM();
        v[CLIMB][size] = m.climbRateMps();
        v[THETA][size] = m.thetaRad();
        v[PHI][size] = m.phiRad();
        v[PSI][size] = m.psiRad();
        v[Q][size] = m.qRadS();
        v[NZ][size] = m.nz();
        v[CAS][size] = m.calibratedAirspeedMps();
        v[MACH][size] = m.mach();
        v[GEAR][size] = c.gearDown();
        size++;
    }

    int size() {
        return size;
    }

    double get(int channel, int i) {
        return v[channel][i];
    }

    /** Index of the frame nearest {@code timeS}. */
    int at(double timeS) {
        int best = 0;
        for (int i = 1; i < size; i++) {
            if (Math.abs(v[TIME][i] - timeS) < Math.abs(v[TIME][best] - timeS)) {
                best = i;
            }
        }
        return best;
    }
}
