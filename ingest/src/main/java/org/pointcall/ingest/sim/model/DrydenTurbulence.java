package org.pointcall.ingest.sim.model;

import java.util.Objects;
import org.pointcall.shared.units.Units;

/**
 * Dryden turbulence of MIL-F-8785C (3.7.2) and MIL-HDBK-1797 as a frozen field flown through (Taylor's hypothesis):
 * the gusts are functions of the distance flown through the air, so the filters advance by distance and their
 * spectra in spatial frequency Omega (rad/m) are the standard's:
 * <pre>
 *   Phi_u(Omega) = sigma_u^2 (2 L_u / pi) / (1 + (L_u Omega)^2)
 *   Phi_v(Omega) = sigma_v^2 (L_v / pi) (1 + 3 (L_v Omega)^2) / (1 + (L_v Omega)^2)^2      (and w with L_w)
 *   Phi_p(Omega) = (sigma_w^2 / L_w) 0.8 (pi L_w / 4b)^(1/3) / (1 + (4b Omega / pi)^2)       [memory]
 * </pre>
 * (one-sided: each integrates over 0 to infinity to the variance). The forming filters are discretised exactly for
 * the distance of each step: u and p as first-order Gauss-Markov sequences, v and w as the sampled state of
 * {@code (1 + sqrt(3) L s) / (1 + L s)^2} written as two cascaded lags, with the step's exact noise covariance. So a
 * sampled gust has exactly the Dryden correlation, whatever the step, and its variance is exactly sigma^2; the
 * filters start in their stationary distribution, so there is no warm-up.
 *
 * <p>Intensities and scale lengths in {@link TurbulenceSettings.Mode#STANDARD} follow the standard by height h above
 * ground in feet: below 1000 ft {@code L_w = h}, {@code L_u = L_v = h / (0.177 + 0.000823 h)^1.2},
 * {@code sigma_w = 0.1 W20}, {@code sigma_u = sigma_v = sigma_w / (0.177 + 0.000823 h)^0.4}; above 2000 ft all three
 * lengths are 1750 ft and all three intensities come from the probability-of-exceedance figure; linear in between;
 * h is held at 10 ft or more. Gusts are given in body axes (the standard defines the low-altitude ones along the
 * mean wind; the difference is a rotation of the same statistics, ignored here). Allocation-free.
 */
public final class DrydenTurbulence {
    private static final double SQRT3 = Math.sqrt(3.0);
    /** Below this x = 2 ds/L the closed forms of the covariance lose digits to cancellation; series instead. */
    private static final double SERIES_BELOW = 0.05;

    private final TurbulenceSettings settings;
    private final double spanM;
    private final GaussianSource noise;

    // unit-variance first-order states, and the second-order states normalised to stationary covariance
    // [[1/2, 1/4], [1/4, 1/4]] so that sigma (sqrt 3 z1 + (1 - sqrt 3) z2) has variance sigma^2
    private double zu;
    private double zp;
    private double v1;
    private double v2;
    private double w1;
    private double w2;

    private double sigmaU;
    private double sigmaV;
    private double sigmaW;
    private double sigmaP;
    private double lengthU;
    private double lengthV;
    private double lengthW;
    private double lengthP;

    private double uMps;
    private double vMps;
    private double wMps;
    private double pRadS;

    /**
     * @param settings  intensities and scale lengths ({@link TurbulenceSettings#NONE} gives zero gusts)
     * @param wingSpanM span b for the roll gust
     * @param seed      seed of the white noise
     */
    public DrydenTurbulence(TurbulenceSettings settings, double wingSpanM, long seed) {
        this.settings = Objects.requireNonNull(settings, "settings");
        if (!(wingSpanM > 0.0)) {
            throw new IllegalArgumentException("wing span must be positive");
        }
        this.spanM = wingSpanM;
        this.noise = new GaussianSource(seed);
        zu = noise.next();
        zp = noise.next();
        double g1 = noise.next();
        double g2 = noise.next();
        v1 = Math.sqrt(0.5) * g1;
        v2 = Math.sqrt(0.125) * (g1 + g2);
        g1 = noise.next();
        g2 = noise.next();
        w1 = Math.sqrt(0.5) * g1;
        w2 = Math.sqrt(0.125) * (g1 + g2);
        parameters(1000.0);
        outputs();
    }

    /**
     * Moves through the field by {@code distanceM} (true airspeed times the step) at height {@code heightAboveGroundM}.
     */
    public void advance(double distanceM, double heightAboveGroundM) {
        if (settings.mode() == TurbulenceSettings.Mode.NONE) {
            return;
        }
        if (!(distanceM >= 0.0)) {
            throw new IllegalArgumentException("distance must be zero or positive");
        }
        parameters(heightAboveGroundM);
        zu = firstOrder(zu, distanceM / lengthU);
        zp = firstOrder(zp, distanceM / lengthP);
        // the two second-order channels, written out to stay allocation-free
        double a = distanceM / lengthV;
        double e = Math.exp(-a);
        double l11 = l11(a);
        double l21 = l21(a, l11);
        double l22 = l22(a, l21);
        double g1 = noise.next();
        double g2 = noise.next();
        double n1 = e * v1 + l11 * g1;
        v2 = e * (v2 + a * v1) + l21 * g1 + l22 * g2;
        v1 = n1;
        a = distanceM / lengthW;
        e = Math.exp(-a);
        l11 = l11(a);
        l21 = l21(a, l11);
        l22 = l22(a, l21);
        g1 = noise.next();
        g2 = noise.next();
        n1 = e * w1 + l11 * g1;
        w2 = e * (w2 + a * w1) + l21 * g1 + l22 * g2;
        w1 = n1;
        outputs();
    }

    private double firstOrder(double z, double a) {
        return Math.exp(-a) * z + Math.sqrt(-Math.expm1(-2.0 * a)) * noise.next();
    }

    /** Cholesky factors of the step covariance of the normalised cascade, a = ds / L, x = 2a. */
    private static double l11(double a) {
        return Math.sqrt(-Math.expm1(-2.0 * a) / 2.0);
    }

    private static double l21(double a, double l11) {
        return l11 == 0.0 ? 0.0 : q12(2.0 * a) / l11;
    }

    private static double l22(double a, double l21) {
        double d = q22(2.0 * a) - l21 * l21;
        return d > 0.0 ? Math.sqrt(d) : 0.0;
    }

    /** (1 - e^-x (1 + x)) / 4. */
    private static double q12(double x) {
        if (x < SERIES_BELOW) {
            // sum over k >= 2 of (-1)^k (k - 1) x^k / k!
            double term = x * x / 2.0;
            double sum = 0.0;
            for (int k = 2; k <= 12; k++) {
                sum += (k - 1) * term;
                term *= -x / (k + 1);
            }
            return sum / 4.0;
        }
        return (1.0 - Math.exp(-x) * (1.0 + x)) / 4.0;
    }

    /** (2 - e^-x (2 + 2x + x^2)) / 8. */
    private static double q22(double x) {
        if (x < SERIES_BELOW) {
            // sum over k >= 3 of -(-1)^k (k - 1)(k - 2) x^k / k!
            double term = x * x * x / 6.0;
            double sum = 0.0;
            for (int k = 3; k <= 13; k++) {
                sum += (k - 1) * (k - 2) * term;
                term *= -x / (k + 1);
            }
            return sum / 8.0;
        }
        return (2.0 - Math.exp(-x) * (2.0 + x * (2.0 + x))) / 8.0;
    }

    private void outputs() {
        uMps = sigmaU * zu;
        vMps = sigmaV * (SQRT3 * v1 + (1.0 - SQRT3) * v2);
        wMps = sigmaW * (SQRT3 * w1 + (1.0 - SQRT3) * w2);
        pRadS = sigmaP * zp;
    }

    private void parameters(double heightM) {
        switch (settings.mode()) {
            case NONE -> {
                sigmaU = sigmaV = sigmaW = 0.0;
                lengthU = lengthV = lengthW = 1.0;
            }
            case FIXED -> {
                sigmaU = settings.sigmaUMps();
                sigmaV = settings.sigmaVMps();
                sigmaW = settings.sigmaWMps();
                lengthU = settings.lengthUM();
                lengthV = settings.lengthVM();
                lengthW = settings.lengthWM();
            }
            case STANDARD -> standardParameters(heightM, settings.intensity());
            default -> throw new IllegalStateException();
        }
        lengthP = 4.0 * spanM / Math.PI;
        // sigma_p^2 (2 L_p / pi) equals the numerator of Phi_p above
        sigmaP = sigmaW * Math.sqrt(0.8 * Math.cbrt(Math.PI * lengthW / (4.0 * spanM)) * Math.PI
                / (2.0 * lengthP * lengthW));
    }

    private void standardParameters(double heightM, TurbulenceIntensity intensity) {
        double hFt = Math.max(heightM / Units.M_PER_FT, 10.0);
        if (hFt <= 1000.0) {
            lowAltitude(hFt, intensity);
            return;
        }
        double highSigma = intensity.highAltitudeSigmaMps(hFt);
        double highLength = 1750.0 * Units.M_PER_FT;
        if (hFt >= 2000.0) {
            sigmaU = sigmaV = sigmaW = highSigma;
            lengthU = lengthV = lengthW = highLength;
            return;
        }
        lowAltitude(1000.0, intensity);
        double f = (hFt - 1000.0) / 1000.0;
        double high2000 = intensity.highAltitudeSigmaMps(2000.0);
        sigmaU += f * (high2000 - sigmaU);
        sigmaV += f * (high2000 - sigmaV);
        sigmaW += f * (high2000 - sigmaW);
        lengthU += f * (highLength - lengthU);
        lengthV += f * (highLength - lengthV);
        lengthW += f * (highLength - lengthW);
    }

    private void lowAltitude(double hFt, TurbulenceIntensity intensity) {
        double k = 0.177 + 0.000823 * hFt;
        sigmaW = 0.1 * intensity.wind20ftMps();
        sigmaU = sigmaV = sigmaW / Math.pow(k, 0.4);
        lengthW = hFt * Units.M_PER_FT;
        lengthU = lengthV = hFt / Math.pow(k, 1.2) * Units.M_PER_FT;
    }

    /** Longitudinal gust (air-mass velocity along body x), m/s. */
    public double uMps() {
        return uMps;
    }

    /** Lateral gust, m/s. */
    public double vMps() {
        return vMps;
    }

    /** Vertical gust (positive down), m/s. */
    public double wMps() {
        return wMps;
    }

    /** Roll gust (air-mass rotation about body x), rad/s. */
    public double pRadS() {
        return pRadS;
    }

    /** Intensities and scale lengths at the last step. */
    public double sigmaUMps() {
        return sigmaU;
    }

    public double sigmaVMps() {
        return sigmaV;
    }

    public double sigmaWMps() {
        return sigmaW;
    }

    public double sigmaPRadS() {
        return sigmaP;
    }

    public double lengthUM() {
        return lengthU;
    }

    public double lengthVM() {
        return lengthV;
    }

    public double lengthWM() {
        return lengthW;
    }

    public double lengthPM() {
        return lengthP;
    }
}
