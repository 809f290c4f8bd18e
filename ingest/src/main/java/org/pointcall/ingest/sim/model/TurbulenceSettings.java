package org.pointcall.ingest.sim.model;

import java.util.Objects;
import org.pointcall.shared.error.Plain;

/**
 * What turbulence to fly through: none; the MIL-F-8785C intensities and scale lengths by height for a named
 * intensity; or fixed intensities and scale lengths (for checks against the spectra, and for scenarios that want
 * one known level).
 *
 * @param mode      which of the three
 * @param intensity the named intensity, for {@link Mode#STANDARD}
 * @param sigmaUMps RMS of the longitudinal gust, m/s, for {@link Mode#FIXED}
 * @param sigmaVMps RMS of the lateral gust, m/s
 * @param sigmaWMps RMS of the vertical gust, m/s
 * @param lengthUM  scale length of the longitudinal gust, m
 * @param lengthVM  scale length of the lateral gust, m
 * @param lengthWM  scale length of the vertical gust, m
 */
public record TurbulenceSettings(Mode mode, TurbulenceIntensity intensity, double sigmaUMps, double sigmaVMps,
        double sigmaWMps, double lengthUM, double lengthVM, double lengthWM) {

    /** How the intensities and scale lengths are chosen. */
    public enum Mode {
        NONE, STANDARD, FIXED
    }

    /** Still air. */
    public static final TurbulenceSettings NONE = new TurbulenceSettings(Mode.NONE, null, 0, 0, 0, 1, 1, 1);

    public TurbulenceSettings {
        Objects.requireNonNull(mode, "mode");
        if (mode == Mode.STANDARD) {
            Objects.requireNonNull(intensity, "intensity");
        }
        for (double s : new double[] {sigmaUMps, sigmaVMps, sigmaWMps}) {
            if (!(s >= 0.0 && s < 100.0)) {
                throw new IllegalArgumentException("turbulence intensity must be between 0 and 100 m/s, got "
                        + Plain.of(s));
            }
        }
        for (double l : new double[] {lengthUM, lengthVM, lengthWM}) {
            if (!(l > 0.0 && l < 1e5)) {
                throw new IllegalArgumentException("turbulence scale length must be between 0 and 100 km, got "
                        + Plain.of(l) + " m");
            }
        }
    }

    /** MIL-F-8785C intensities and scale lengths by height above ground, for a named intensity. */
    public static TurbulenceSettings standard(TurbulenceIntensity intensity) {
        return new TurbulenceSettings(Mode.STANDARD, intensity, 0, 0, 0, 1, 1, 1);
    }

    /** Fixed intensities and scale lengths, whatever the height. */
    public static TurbulenceSettings fixed(double sigmaUMps, double sigmaVMps, double sigmaWMps, double lengthUM,
            double lengthVM, double lengthWM) {
        return new TurbulenceSettings(Mode.FIXED, null, sigmaUMps, sigmaVMps, sigmaWMps, lengthUM, lengthVM,
                lengthWM);
    }
}
