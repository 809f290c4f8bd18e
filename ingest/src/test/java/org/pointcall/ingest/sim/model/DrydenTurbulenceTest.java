package org.pointcall.ingest.sim.model;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.pointcall.shared.units.Units;

/**
 * The turbulence generator against the spectra that define it (MIL-F-8785C 3.7.2, Dryden form): the power spectral
 * density of a long seeded record, estimated by Welch's method, and the variances.
 */
class DrydenTurbulenceTest {
    private static final double SPEED_MPS = 100.0;
    private static final double FS_HZ = 10.0;
    private static final int SEGMENT = 2048;
    private static final int SEGMENTS = 2000;
    private static final double SPAN_M = 9.6;

    private static final double SU = 2.0;
    private static final double SV = 1.5;
    private static final double SW = 1.2;
    private static final double LU = 300.0;
    private static final double LV = 200.0;
    private static final double LW = 120.0;

    @Test
    void gustSpectraMatchTheDrydenFormsAndTheirVariancesAreSigmaSquared() {
        DrydenTurbulence t = new DrydenTurbulence(TurbulenceSettings.fixed(SU, SV, SW, LU, LV, LW), SPAN_M, 42L);
        Welch[] w = {new Welch(), new Welch(), new Welch(), new Welch()};
        double ds = SPEED_MPS / FS_HZ;
        int n = SEGMENT * (SEGMENTS + 1) / 2;
        for (int i = 0; i < n; i++) {
            t.advance(ds, 3000.0);
            w[0].add(t.uMps());
            w[1].add(t.vMps());
            w[2].add(t.wMps());
            w[3].add(t.pRadS());
        }
        double[][] psd = new double[4][];
        for (int c = 0; c < 4; c++) {
            psd[c] = w[c].psd();
            assertEquals(SEGMENTS, w[c].segments);
        }

        // Welch with 2000 Hann segments at 50% overlap: about 1900 independent averages, so 2.3% relative
        // standard deviation per bin; each check averages the bins within 30% of its frequency (4 bins at the
        // lowest, tens higher up), so 1.2% or less. 6% is over 4 standard deviations; the window's bias where the
        // spectrum bends is below 0.5% with the corner 10 bins or more from zero. The expected value is the
        // standard's spectrum summed over its aliases at the 10 Hz sampling, exact for a sampled continuous process.
        for (double k : new double[] {0.7, 1.0, 2.0, 5.0, 10.0, 30.0}) {
            check(psd[0], k * SPEED_MPS / (2 * Math.PI * LU), DrydenTurbulenceTest::longitudinal, "u");
            check(psd[1], k * SPEED_MPS / (2 * Math.PI * LV), om -> transverse(om, SV, LV), "v");
            check(psd[2], k * SPEED_MPS / (2 * Math.PI * LW), om -> transverse(om, SW, LW), "w");
            check(psd[3], k * SPEED_MPS / (2 * Math.PI * (4 * SPAN_M / Math.PI)), DrydenTurbulenceTest::roll, "p");
        }

        // variances: the relative standard deviation of a sample variance over T seconds of a process with
        // correlation time L/V is about sqrt(2 (L/V) / T), 0.5% for u here; 3% is over 5 of them for every channel
        double[] sigmas = {SU, SV, SW, Math.sqrt(rollVariance())};
        String[] names = {"u", "v", "w", "p"};
        for (int c = 0; c < 4; c++) {
            double var = w[c].variance();
            assertEquals(sigmas[c] * sigmas[c], var, 0.03 * sigmas[c] * sigmas[c], names[c] + " variance");
        }
        // the roll gust's closed-form intensity is the integral of its spectrum (MIL-F-8785C form, [memory])
        assertEquals(rollVariance(), t.sigmaPRadS() * t.sigmaPRadS(), 1e-6 * rollVariance());
    }

    @Test
    void standardIntensitiesAndScaleLengthsFollowTheLowAndHighAltitudeRules() {
        DrydenTurbulence t = new DrydenTurbulence(TurbulenceSettings.standard(TurbulenceIntensity.MODERATE), 9.6,
                1L);
        // MIL-F-8785C low-altitude rules at 500 ft [computed from the standard's formulas]: L_w = h,
        // L_u = L_v = h/(0.177 + 0.000823 h)^1.2, sigma_w = 0.1 W20 with W20 = 30 kt for moderate,
        // sigma_u = sigma_v = sigma_w / (0.177 + 0.000823 h)^0.4
        t.advance(1.0, Units.ftToM(500));
        double k = 0.177 + 0.000823 * 500;
        assertEquals(Units.ftToM(500), t.lengthWM(), 1e-9);
        assertEquals(Units.ftToM(500 / Math.pow(k, 1.2)), t.lengthUM(), 1e-9);
        assertEquals(t.lengthUM(), t.lengthVM(), 0.0);
        assertEquals(0.1 * Units.ktToMps(30), t.sigmaWMps(), 1e-12);
        assertEquals(0.1 * Units.ktToMps(30) / Math.pow(k, 0.4), t.sigmaUMps(), 1e-12);
        // medium/high altitude at 10,000 ft: all lengths 1750 ft; intensity from the 1e-3 row of the exceedance
        // figure, 10.1 ft/s at 7500 ft and 8.0 at 15,000 ft, linear between ([memory], MIL-F-8785C figure 7)
        t.advance(1.0, Units.ftToM(10000));
        assertEquals(Units.ftToM(1750), t.lengthUM(), 1e-9);
        assertEquals(Units.ftToM(1750), t.lengthWM(), 1e-9);
        assertEquals(Units.ftToM(10.1 + (2500.0 / 7500.0) * (8.0 - 10.1)), t.sigmaWMps(), 1e-12);
        assertEquals(t.sigmaWMps(), t.sigmaUMps(), 0.0);
        // between 1000 and 2000 ft the standard interpolates: halfway, half of each
        t.advance(1.0, Units.ftToM(1500));
        double low = Units.ftToM(1000);
        double high = Units.ftToM(1750);
        assertEquals(0.5 * (low + high), t.lengthWM(), 1e-9);
    }

    @Test
    void theSameSeedGivesTheSameGustsAndAnotherSeedOthers() {
        TurbulenceSettings s = TurbulenceSettings.fixed(1, 1, 1, 100, 100, 100);
        DrydenTurbulence a = new DrydenTurbulence(s, 10, 7L);
        DrydenTurbulence b = new DrydenTurbulence(s, 10, 7L);
        DrydenTurbulence c = new DrydenTurbulence(s, 10, 8L);
        for (int i = 0; i < 1000; i++) {
            a.advance(0.2, 500);
            b.advance(0.2, 500);
            c.advance(0.2, 500);
            assertEquals(Double.doubleToRawLongBits(a.wMps()), Double.doubleToRawLongBits(b.wMps()));
        }
        assertNotEquals(a.wMps(), c.wMps());
    }

    // ---------------------------------------------------------------------------- spectra of the standard

    /** One-sided temporal PSD per Hz from a spatial one: P(f) = (2 pi / V) Phi(2 pi f / V). */
    private interface Spatial {
        double phi(double omegaRadPerM);
    }

    private static double temporal(Spatial s, double fHz) {
        return 2 * Math.PI / SPEED_MPS * s.phi(2 * Math.PI * Math.abs(fHz) / SPEED_MPS);
    }

    /** The sampled record's one-sided PSD: the continuous one folded over its aliases. */
    private static double aliased(Spatial s, double fHz) {
        double sum = 0;
        for (int k = -200; k <= 200; k++) {
            sum += temporal(s, fHz + k * FS_HZ);
        }
        return sum;
    }

    private static double longitudinal(double omega) {
        return SU * SU * (2 * LU / Math.PI) / (1 + Math.pow(LU * omega, 2));
    }

    private static double transverse(double omega, double sigma, double l) {
        double x = Math.pow(l * omega, 2);
        return sigma * sigma * (l / Math.PI) * (1 + 3 * x) / Math.pow(1 + x, 2);
    }

    private static double roll(double omega) {
        return SW * SW / LW * 0.8 * Math.cbrt(Math.PI * LW / (4 * SPAN_M))
                / (1 + Math.pow(4 * SPAN_M * omega / Math.PI, 2));
    }

    /**
     * Integral of the roll spectrum A / (1 + (b Omega)^2) over 0 to infinity by Simpson's rule after Omega = tan t
     * (the integrand becomes A / (cos^2 t + b^2 sin^2 t), smooth on [0, pi/2]).
     */
    private static double rollVariance() {
        double a = roll(0.0);
        double b = 4 * SPAN_M / Math.PI;
        int n = 20000;
        double h = (Math.PI / 2) / n;
        double sum = 0;
        for (int i = 0; i <= n; i++) {
            double t = i * h;
            double c = Math.cos(t);
            double s = Math.sin(t);
            double w = i == 0 || i == n ? 1 : (i % 2 == 1 ? 4 : 2);
            sum += w * a / (c * c + b * b * s * s);
        }
        return sum * h / 3;
    }

    private static void check(double[] psd, double fHz, Spatial spectrum, String name) {
        if (fHz * 1.3 > 0.45 * FS_HZ) {
            return;
        }
        double df = FS_HZ / SEGMENT;
        int lo = (int) Math.ceil(fHz / 1.3 / df);
        int hi = (int) Math.floor(fHz * 1.3 / df);
        double est = 0;
        double exp = 0;
        for (int k = lo; k <= hi; k++) {
            est += psd[k];
            exp += aliased(spectrum, k * df);
        }
        assertTrue(hi - lo >= 3, "band too narrow at " + fHz);
        assertEquals(1.0, est / exp, 0.06, name + " PSD at " + fHz + " Hz");
    }

    // ------------------------------------------------------------------------------------------ estimation

    /** Welch one-sided PSD per Hz (Hann window, 50% overlap), fed one sample at a time; also the variance. */
    private static final class Welch {
        private final double[] ring = new double[SEGMENT];
        private final double[] win = new double[SEGMENT];
        private final double[] acc = new double[SEGMENT / 2 + 1];
        private final double[] re = new double[SEGMENT];
        private final double[] im = new double[SEGMENT];
        private double wss;
        private long count;
        private int segments;
        private double sum;
        private double sumSq;

        Welch() {
            for (int i = 0; i < SEGMENT; i++) {
                win[i] = 0.5 - 0.5 * Math.cos(2 * Math.PI * i / SEGMENT);
                wss += win[i] * win[i];
            }
        }

        void add(double v) {
            ring[(int) (count % SEGMENT)] = v;
            count++;
            sum += v;
            sumSq += v * v;
            if (count >= SEGMENT && (count - SEGMENT) % (SEGMENT / 2) == 0) {
                for (int i = 0; i < SEGMENT; i++) {
                    re[i] = ring[(int) ((count + i) % SEGMENT)] * win[i];
                    im[i] = 0;
                }
                fft(re, im);
                for (int k = 0; k < acc.length; k++) {
                    acc[k] += re[k] * re[k] + im[k] * im[k];
                }
                segments++;
            }
        }

        double[] psd() {
            double[] p = new double[acc.length];
            for (int k = 0; k < p.length; k++) {
                p[k] = acc[k] * (k == 0 || k == p.length - 1 ? 1.0 : 2.0) / (FS_HZ * wss * segments);
            }
            return p;
        }

        double variance() {
            double mean = sum / count;
            return (sumSq - count * mean * mean) / (count - 1);
        }
    }

    /** In-place iterative radix-2 FFT. */
    private static void fft(double[] re, double[] im) {
        int n = re.length;
        for (int i = 1, j = 0; i < n; i++) {
            int bit = n >> 1;
            for (; (j & bit) != 0; bit >>= 1) {
                j ^= bit;
            }
            j ^= bit;
            if (i < j) {
                double t = re[i];
                re[i] = re[j];
                re[j] = t;
                t = im[i];
                im[i] = im[j];
                im[j] = t;
            }
        }
        for (int len = 2; len <= n; len <<= 1) {
            double ang = -2 * Math.PI / len;
            double wr = Math.cos(ang);
            double wi = Math.sin(ang);
            for (int i = 0; i < n; i += len) {
                double cr = 1;
                double ci = 0;
                for (int k = 0; k < len / 2; k++) {
                    int a = i + k;
                    int b = a + len / 2;
                    double tr = re[b] * cr - im[b] * ci;
                    double ti = re[b] * ci + im[b] * cr;
                    re[b] = re[a] - tr;
                    im[b] = im[a] - ti;
                    re[a] += tr;
                    im[a] += ti;
                    double nr = cr * wr - ci * wi;
                    ci = cr * wi + ci * wr;
                    cr = nr;
                }
            }
        }
    }
}
