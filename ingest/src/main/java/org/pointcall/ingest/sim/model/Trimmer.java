package org.pointcall.ingest.sim.model;

import org.pointcall.ingest.sim.airframe.Airframe;
import org.pointcall.ingest.sim.airframe.LongitudinalAero;
import org.pointcall.ingest.sim.airframe.Surface;
import org.pointcall.shared.atmosphere.StandardAtmosphere;
import org.pointcall.shared.error.Plain;
import org.pointcall.shared.units.Units;

/**
 * Trim of a {@link FlightModel} by Newton's method on its own state derivatives (numerical Jacobian by central
 * differences, step halving when a step would not reduce the residual). Not on any hot path: it allocates freely.
 */
final class Trimmer {
    /** Residual accelerations below which a trim is converged, m/s^2 and rad/s^2 (1e-11 g). */
    private static final double TOLERANCE = 1e-10;
    private static final int MAX_ITERATIONS = 60;
    private static final double PRECHECK_MARGIN = 1.3;
    private static final double G0 = StandardAtmosphere.G0_MPS2;

    private final FlightModel model;
    private final Airframe airframe;
    private final double[] state = new double[FlightModel.STATE_SIZE];
    private final double[] deriv = new double[FlightModel.STATE_SIZE];
    private double cachedMach = Double.NaN;
    private double[] cachedMaxLift;

    Trimmer(FlightModel model) {
        this.model = model;
        this.airframe = model.airframe();
    }

    private interface Residual {
        void eval(double[] z, double[] res);
    }

    TrimPoint level(double speedMps, double altitudeM, double gammaRad) {
        checkCondition(speedMps, altitudeM);
        if (!(Math.abs(gammaRad) < 0.5 * Math.PI)) {
            throw new IllegalArgumentException("flight-path angle must be between -90 and 90 degrees, got "
                    + Plain.of(Math.toDegrees(gammaRad)));
        }
        double mass = model.currentMassKg();
        double weight = mass * G0;
        double[] lift = maxLift(machAt(speedMps, altitudeM));
        double qs = 0.5 * densityAt(altitudeM) * speedMps * speedMps * airframe.geometry().wingAreaM2();
        double clNeeded = weight * Math.cos(gammaRad) / qs;
        // only the clearly impossible is refused here (thrust can carry several percent of the weight near the
        // stall); Newton, held on the front of the lift curve, decides the rest
        if (clNeeded > PRECHECK_MARGIN * lift[0]) {
            throw belowStall("wings-level flight", speedMps, altitudeM, clNeeded, lift[0]);
        }
        double[] z = {guessAlpha(clNeeded, speedMps, altitudeM), 0.0, 0.0};
        z[1] = guessElevator(z[0]);
        z[2] = guessThrottle(qs, clNeeded, weight * Math.sin(gammaRad), speedMps, altitudeM);
        LongitudinalAero lon = airframe.longitudinal();
        double[] lo = {lon.alphaZeroLiftRad() - 0.35, -1.0, -5.0};
        // alpha stays on the front of the lift curve: beyond its peak the same CL comes back on the stalling side
        double[] hi = {lift[1], 1.0, 5.0};
        double[] saved = model.saveCommands();
        try {
            Residual f = (zz, res) -> {
                TrimPoint t = candidate(speedMps, altitudeM, gammaRad, 0.0, zz[0], 0.0, zz[0] + gammaRad, zz[1],
                        0.0, 0.0, zz[2], 0.0, mass, 0.0);
                evaluate(t);
                res[0] = deriv[FlightModel.U];
                res[1] = deriv[FlightModel.W];
                res[2] = deriv[FlightModel.Q];
            };
            double residual = solve(f, z, lo, hi, "wings-level flight", speedMps, altitudeM, clNeeded, lift[0]);
            TrimPoint t = candidate(speedMps, altitudeM, gammaRad, 0.0, z[0], 0.0, z[0] + gammaRad, z[1], 0.0, 0.0,
                    z[2], 0.0, mass, residual);
            checkLimits(t, "wings-level flight", lift, clNeeded);
            return t;
        } finally {
            model.restoreCommands(saved);
        }
    }

    TrimPoint turn(double speedMps, double altitudeM, double bankRad) {
        checkCondition(speedMps, altitudeM);
        if (!(Math.abs(bankRad) < Math.toRadians(85.0))) {
            throw new IllegalArgumentException("bank angle must be within 85 degrees of level, got "
                    + Plain.of(Math.toDegrees(bankRad)));
        }
        double mass = model.currentMassKg();
        double weight = mass * G0;
        double n = 1.0 / Math.cos(bankRad);
        double[] lift = maxLift(machAt(speedMps, altitudeM));
        double qs = 0.5 * densityAt(altitudeM) * speedMps * speedMps * airframe.geometry().wingAreaM2();
        double clNeeded = n * weight / qs;
        if (clNeeded > PRECHECK_MARGIN * lift[0]) {
            throw belowStall(Plain.of(Math.toDegrees(bankRad)) + " degree banked turn", speedMps, altitudeM,
                    clNeeded, lift[0]);
        }
        double alpha0 = guessAlpha(clNeeded, speedMps, altitudeM);
        double[] z = {alpha0, 0.0, alpha0 * Math.cos(bankRad), guessElevator(alpha0), 0.0, 0.0,
            guessThrottle(qs, clNeeded, 0.0, speedMps, altitudeM), G0 * Math.tan(bankRad) / speedMps};
        LongitudinalAero lon = airframe.longitudinal();
        double[] lo = {lon.alphaZeroLiftRad() - 0.35, -0.5, -1.4, -1.0, -1.0, -1.0, -5.0, -5.0};
        double[] hi = {lift[1], 0.5, 1.4, 1.0, 1.0, 1.0, 5.0, 5.0};
        double[] saved = model.saveCommands();
        String what = Plain.of(Math.toDegrees(bankRad)) + " degree banked turn";
        try {
            Residual f = (zz, res) -> {
                TrimPoint t = candidate(speedMps, altitudeM, 0.0, bankRad, zz[0], zz[1], zz[2], zz[3], zz[4], zz[5],
                        zz[6], zz[7], mass, 0.0);
                evaluate(t);
                res[0] = deriv[FlightModel.U];
                res[1] = deriv[FlightModel.V];
                res[2] = deriv[FlightModel.W];
                res[3] = deriv[FlightModel.P];
                res[4] = deriv[FlightModel.Q];
                res[5] = deriv[FlightModel.R];
                res[6] = deriv[FlightModel.DOWN];
                res[7] = model.evaluatedSpecificY();
            };
            double residual = solve(f, z, lo, hi, what, speedMps, altitudeM, clNeeded, lift[0]);
            TrimPoint t = candidate(speedMps, altitudeM, 0.0, bankRad, z[0], z[1], z[2], z[3], z[4], z[5], z[6],
                    z[7], mass, residual);
            checkLimits(t, what, lift, clNeeded);
            return t;
        } finally {
            model.restoreCommands(saved);
        }
    }

    private void checkCondition(double speedMps, double altitudeM) {
        if (!(speedMps > 1.0 && speedMps < 1000.0)) {
            throw new IllegalArgumentException("trim speed must be between 1 and 1000 m/s, got "
                    + Plain.of(speedMps));
        }
        if (!(altitudeM > -2000.0 && altitudeM < 50000.0)) {
            throw new IllegalArgumentException("trim altitude must be between -2000 and 50000 m, got "
                    + Plain.of(altitudeM));
        }
    }

    private TrimPoint candidate(double v, double h, double gamma, double phi, double alpha, double beta,
            double theta, double de, double da, double dr, double thr, double omega, double mass, double residual) {
        double attachment = model.staticAttachment(alpha, true);
        return new TrimPoint(v, h, gamma, phi, alpha, beta, theta, de, da, dr, thr, omega, attachment, mass,
                residual);
    }

    private void evaluate(TrimPoint t) {
        model.trimState(t, 0.0, state);
        model.holdForAnalysis(t.elevatorRad(), t.aileronRad(), t.rudderRad(), t.throttle());
        model.evaluate(state, deriv);
    }

    /** Newton with numerical Jacobian; returns the final largest residual. */
    private double solve(Residual f, double[] z, double[] lo, double[] hi, String what, double v, double h,
            double clNeeded, double clMax) {
        int n = z.length;
        double[] res = new double[n];
        double[] trial = new double[n];
        double[] resTrial = new double[n];
        double[][] jac = new double[n][n];
        double[] plus = new double[n];
        double[] minus = new double[n];
        double[] step = new double[n];
        f.eval(z, res);
        double norm = maxAbs(res);
        for (int it = 0; it < MAX_ITERATIONS && norm > TOLERANCE; it++) {
            for (int j = 0; j < n; j++) {
                double hj = 1e-6 * Math.max(1.0, Math.abs(z[j]));
                double keep = z[j];
                z[j] = keep + hj;
                f.eval(z, plus);
                z[j] = keep - hj;
                f.eval(z, minus);
                z[j] = keep;
                for (int i = 0; i < n; i++) {
                    jac[i][j] = (plus[i] - minus[i]) / (2.0 * hj);
                }
            }
            if (!solveLinear(jac, res, step)) {
                break;
            }
            double lambda = 1.0;
            boolean improved = false;
            for (int k = 0; k < 30; k++) {
                for (int j = 0; j < n; j++) {
                    trial[j] = Math.max(lo[j], Math.min(hi[j], z[j] - lambda * step[j]));
                }
                f.eval(trial, resTrial);
                double tn = maxAbs(resTrial);
                if (tn < norm) {
                    System.arraycopy(trial, 0, z, 0, n);
                    System.arraycopy(resTrial, 0, res, 0, n);
                    norm = tn;
                    improved = true;
                    break;
                }
                lambda *= 0.5;
            }
            if (!improved) {
                break;
            }
        }
        if (!(norm <= TOLERANCE * 100.0)) {
            if (z[0] >= hi[0] - 1e-6) {
                // pinned at the lift peak: the wing cannot give the lift
                throw belowStall(what, v, h, clNeeded, clMax);
            }
            throw new NoTrimException("no trim of " + what + " at " + describe(v, h) + " for " + airframe.name()
                    + ": the equations of motion could not be balanced (largest acceleration left "
                    + Plain.of(norm) + "); the condition is probably beyond the stall or the engine");
        }
        return norm;
    }

    /** Gaussian elimination with partial pivoting; false when singular. */
    private static boolean solveLinear(double[][] a0, double[] b0, double[] out) {
        int n = b0.length;
        double[][] a = new double[n][];
        for (int i = 0; i < n; i++) {
            a[i] = a0[i].clone();
        }
        double[] b = b0.clone();
        for (int c = 0; c < n; c++) {
            int piv = c;
            for (int r = c + 1; r < n; r++) {
                if (Math.abs(a[r][c]) > Math.abs(a[piv][c])) {
                    piv = r;
                }
            }
            if (Math.abs(a[piv][c]) < 1e-300) {
                return false;
            }
            double[] tr = a[c];
            a[c] = a[piv];
            a[piv] = tr;
            double tb = b[c];
            b[c] = b[piv];
            b[piv] = tb;
            for (int r = c + 1; r < n; r++) {
                double fct = a[r][c] / a[c][c];
                for (int k = c; k < n; k++) {
                    a[r][k] -= fct * a[c][k];
                }
                b[r] -= fct * b[c];
            }
        }
        for (int r = n - 1; r >= 0; r--) {
            double s = b[r];
            for (int k = r + 1; k < n; k++) {
                s -= a[r][k] * out[k];
            }
            out[r] = s / a[r][r];
        }
        return true;
    }

    private static double maxAbs(double[] v) {
        double m = 0.0;
        for (double d : v) {
            m = Math.max(m, Math.abs(d));
        }
        return Double.isNaN(m) ? Double.POSITIVE_INFINITY : m;
    }

    private void checkLimits(TrimPoint t, String what, double[] lift, double clNeeded) {
        String at = " at " + describe(t.airspeedMps(), t.altitudeM()) + " for " + airframe.name();
        if (t.alphaRad() > lift[1] + 1e-9) {
            throw belowStall(what, t.airspeedMps(), t.altitudeM(), clNeeded, lift[0]);
        }
        if (t.throttle() > 1.0 + 1e-9) {
            throw new NoTrimException("no trim of " + what + at + ": it needs throttle " + Plain.of(t.throttle())
                    + " but full is 1 (not enough thrust)");
        }
        if (t.throttle() < -1e-9) {
            throw new NoTrimException("no trim of " + what + at + ": even idle gives too much thrust (it needs"
                    + " throttle " + Plain.of(t.throttle()) + "); descend more steeply or fly slower");
        }
        surface("elevator", t.elevatorRad(), airframe.controls().elevator(), what, at);
        surface("aileron", t.aileronRad(), airframe.controls().aileron(), what, at);
        surface("rudder", t.rudderRad(), airframe.controls().rudder(), what, at);
    }

    private static void surface(String name, double pos, Surface s, String what, String at) {
        if (pos < s.minRad() - 1e-12 || pos > s.maxRad() + 1e-12) {
            throw new NoTrimException("no trim of " + what + at + ": it needs " + name + " "
                    + Plain.of(Math.toDegrees(pos)) + " degrees, beyond its travel " + Plain.of(Math.toDegrees(
                            s.minRad())) + " to " + Plain.of(Math.toDegrees(s.maxRad())) + " degrees");
        }
    }

    private NoTrimException belowStall(String what, double v, double h, double clNeeded, double clMax) {
        double vs = v * Math.sqrt(clNeeded / clMax);
        return new NoTrimException("no trim of " + what + " at " + describe(v, h) + " for " + airframe.name()
                + ": it needs CL " + Plain.of(clNeeded) + " from the wing but CLmax is " + Plain.of(clMax)
                + " (stall speed about " + Plain.of(vs) + " m/s, " + Plain.of(Units.mpsToKt(vs)) + " KTAS)");
    }

    private static String describe(double v, double h) {
        return Plain.of(v) + " m/s (" + Plain.of(Units.mpsToKt(v)) + " KTAS), " + Plain.of(h) + " m";
    }

    private static double densityAt(double altitudeM) {
        return StandardAtmosphere.densityKgM3(StandardAtmosphere.geopotentialFromGeometricM(altitudeM));
    }

    private static double machAt(double speedMps, double altitudeM) {
        return speedMps / StandardAtmosphere.speedOfSoundMps(StandardAtmosphere.geopotentialFromGeometricM(
                altitudeM));
    }

    private double guessAlpha(double cl, double speedMps, double altitudeM) {
        LongitudinalAero lon = airframe.longitudinal();
        double slope = model.staticLift(1.0 + lon.alphaZeroLiftRad(), 1.0, machAt(speedMps, altitudeM));
        return lon.alphaZeroLiftRad() + cl / slope;
    }

    private double guessElevator(double alpha) {
        LongitudinalAero lon = airframe.longitudinal();
        return -(lon.cm0() + lon.cmAlpha() * alpha) / lon.cmElevator();
    }

    private double guessThrottle(double qs, double cl, double weightAlongPath, double speedMps, double altitudeM) {
        LongitudinalAero lon = airframe.longitudinal();
        double drag = qs * (lon.cD0() + lon.inducedDragFactor() * cl * cl) + weightAlongPath;
        double rho = densityAt(altitudeM);
        var e = airframe.engine();
        double full = e.maxThrustSeaLevelN() * Math.pow(rho / StandardAtmosphere.SEA_LEVEL_DENSITY_KG_M3,
                e.densityExponent()) * e.thrustMachFactor().valueAt(machAt(speedMps, altitudeM));
        return (drag / full - e.idleThrustFraction()) / (1.0 - e.idleThrustFraction());
    }

    /**
     * {CLmax, alpha at CLmax} of the trimmed attached flow at a Mach number: a scan in steps of 0.05 degrees up to
     * the stall angle, then golden-section refinement around the best point.
     */
    double[] maxLift(double machNumber) {
        if (machNumber == cachedMach) {
            return cachedMaxLift;
        }
        double lo = airframe.longitudinal().alphaZeroLiftRad();
        double hi = airframe.stall().alphaStallRad();
        double stepRad = Math.toRadians(0.05);
        double bestA = lo;
        double best = Double.NEGATIVE_INFINITY;
        for (double a = lo; a <= hi; a += stepRad) {
            double c = trimmedLift(a, machNumber);
            if (c > best) {
                best = c;
                bestA = a;
            }
        }
        double left = Math.max(lo, bestA - stepRad);
        double right = Math.min(hi, bestA + stepRad);
        double ratio = (Math.sqrt(5.0) - 1.0) / 2.0;
        double c1 = right - ratio * (right - left);
        double c2 = left + ratio * (right - left);
        double f1 = trimmedLift(c1, machNumber);
        double f2 = trimmedLift(c2, machNumber);
        for (int i = 0; i < 60; i++) {
            if (f1 > f2) {
                right = c2;
                c2 = c1;
                f2 = f1;
                c1 = right - ratio * (right - left);
                f1 = trimmedLift(c1, machNumber);
            } else {
                left = c1;
                c1 = c2;
                f1 = f2;
                c2 = left + ratio * (right - left);
                f2 = trimmedLift(c2, machNumber);
            }
        }
        double a = 0.5 * (left + right);
        double c = trimmedLift(a, machNumber);
        if (best > c) {
            c = best;
            a = bestA;
        }
        cachedMach = machNumber;
        cachedMaxLift = new double[] {c, a};
        return cachedMaxLift;
    }

    /** Static CL at alpha on the attached branch, with the elevator that zeroes the pitching moment. */
    private double trimmedLift(double a, double machNumber) {
        LongitudinalAero lon = airframe.longitudinal();
        double sep = model.staticAttachment(a, true);
        double de = -(lon.cm0() + lon.cmAlpha() * a + (1.0 - sep) * airframe.stall().pitchBreakCm())
                / lon.cmElevator();
        return model.staticLift(a, sep, machNumber) + lon.cLElevator() * de;
    }
}
