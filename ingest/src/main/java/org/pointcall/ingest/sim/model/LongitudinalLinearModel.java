package org.pointcall.ingest.sim.model;

import java.util.Arrays;
import java.util.Objects;

/**
 * The longitudinal small-perturbation model {@code d/dt [u w q theta] = A [u w q theta]} of a flight model about a
 * wings-level trim, in stability axes (x along the trimmed relative wind), by central differences on the model's own
 * equations of motion: the other states (lateral, altitude, flow separation, engine power, surfaces) are held at
 * their trim values, so this is the classical four-state model of the textbooks (Nelson, Flight Stability and
 * Automatic Control, 2nd ed., ch. 4), with every derivative the nonlinear model implies (alpha-dot terms included).
 *
 * @param a        4 x 4 matrix, rows and columns u (m/s), w (m/s), q (rad/s), theta (rad); copied in and out
 * @param u0Mps    trim true airspeed, m/s
 * @param alpha0Rad trim angle of attack (body to stability axes), rad
 */
public record LongitudinalLinearModel(double[][] a, double u0Mps, double alpha0Rad) {
    /** Index of each state in {@link #a()}. */
    public static final int U = 0;
    public static final int W = 1;
    public static final int Q = 2;
    public static final int THETA = 3;

    public LongitudinalLinearModel {
        Objects.requireNonNull(a, "a");
        if (a.length != 4) {
            throw new IllegalArgumentException("the longitudinal model has 4 states");
        }
        double[][] c = new double[4][];
        for (int i = 0; i < 4; i++) {
            if (a[i].length != 4) {
                throw new IllegalArgumentException("the longitudinal model has 4 states");
            }
            c[i] = a[i].clone();
        }
        a = c;
    }

    @Override
    public double[][] a() {
        double[][] c = new double[4][];
        for (int i = 0; i < 4; i++) {
            c[i] = a[i].clone();
        }
        return c;
    }

    /** One element of A. */
    public double element(int row, int column) {
        return a[row][column];
    }

    /**
     * Linearises {@code model} about a wings-level {@code trim} (from {@link FlightModel#trim}); the model's own
     * state is not touched.
     */
    public static LongitudinalLinearModel about(FlightModel model, TrimPoint trim) {
        Objects.requireNonNull(model, "model");
        Objects.requireNonNull(trim, "trim");
        if (trim.bankRad() != 0.0 || trim.turnRateRadS() != 0.0) {
            throw new IllegalArgumentException("the longitudinal model is taken about wings-level flight");
        }
        double[] saved = model.saveCommands();
        try {
            model.holdForAnalysis(trim.elevatorRad(), trim.aileronRad(), trim.rudderRad(), trim.throttle());
            double[] base = new double[FlightModel.STATE_SIZE];
            model.trimState(trim, 0.0, base);
            double[] s = new double[FlightModel.STATE_SIZE];
            double[] d = new double[FlightModel.STATE_SIZE];
            double[] plus = new double[4];
            double[] minus = new double[4];
            double[] steps = {1e-4 * trim.airspeedMps(), 1e-4 * trim.airspeedMps(), 1e-5, 1e-5};
            double[][] a = new double[4][4];
            for (int j = 0; j < 4; j++) {
                double[] dz = new double[4];
                dz[j] = steps[j];
                rates(model, trim, base, dz, s, d, plus);
                dz[j] = -steps[j];
                rates(model, trim, base, dz, s, d, minus);
                for (int i = 0; i < 4; i++) {
                    a[i][j] = (plus[i] - minus[i]) / (2.0 * steps[j]);
                }
            }
            return new LongitudinalLinearModel(a, trim.airspeedMps(), trim.alphaRad());
        } finally {
            model.restoreCommands(saved);
        }
    }

    /** Stability-axis rates of the perturbed state {@code dz} = (du, dw, dq, dtheta). */
    private static void rates(FlightModel model, TrimPoint trim, double[] base, double[] dz, double[] s,
            double[] d, double[] out) {
        System.arraycopy(base, 0, s, 0, s.length);
        double ca = Math.cos(trim.alphaRad());
        double sa = Math.sin(trim.alphaRad());
        double us = trim.airspeedMps() + dz[0];
        double ws = dz[1];
        s[FlightModel.U] = us * ca - ws * sa;
        s[FlightModel.W] = us * sa + ws * ca;
        s[FlightModel.Q] = dz[2];
        Attitude.fromEuler(0.0, trim.thetaRad() + dz[3], 0.0, s, FlightModel.Q0);
        model.evaluate(s, d);
        out[0] = d[FlightModel.U] * ca + d[FlightModel.W] * sa;
        out[1] = -d[FlightModel.U] * sa + d[FlightModel.W] * ca;
        out[2] = d[FlightModel.Q];
        // wings level, no yaw rate: theta-dot is q exactly
        out[3] = s[FlightModel.Q];
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof LongitudinalLinearModel l && Arrays.deepEquals(a, l.a) && u0Mps == l.u0Mps
                && alpha0Rad == l.alpha0Rad;
    }

    @Override
    public int hashCode() {
        return Arrays.deepHashCode(a) * 31 + Double.hashCode(u0Mps);
    }

    @Override
    public String toString() {
        return "longitudinal model about " + u0Mps + " m/s: " + Arrays.deepToString(a);
    }
}
