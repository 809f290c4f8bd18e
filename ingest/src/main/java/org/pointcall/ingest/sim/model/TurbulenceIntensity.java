package org.pointcall.ingest.sim.model;

import org.pointcall.shared.units.Units;

/**
 * The three named turbulence intensities of MIL-F-8785C 3.7: the wind at 20 ft that sets the low-altitude
 * intensity (15, 30 and 45 kt), and the medium/high-altitude RMS intensity against altitude for the probability of
 * exceedance 1e-2 (light), 1e-3 (moderate) and 1e-5 (severe) ([memory], MIL-F-8785C figure 7; the numbers agree with
 * several independent public encodings of that figure).
 */
public enum TurbulenceIntensity {
    LIGHT(15.0, new double[] {6.6, 6.9, 7.4, 6.7, 4.6, 2.7, 0.4, 0.0, 0.0, 0.0, 0.0, 0.0}),
    MODERATE(30.0, new double[] {8.6, 9.6, 10.6, 10.1, 8.0, 6.6, 5.0, 4.2, 2.7, 0.0, 0.0, 0.0}),
    SEVERE(45.0, new double[] {15.6, 17.6, 23.0, 23.6, 22.1, 20.0, 16.0, 15.1, 12.1, 7.9, 6.2, 5.1});

    private static final double[] ALTITUDE_FT =
            {500, 1750, 3750, 7500, 15000, 25000, 35000, 45000, 55000, 65000, 75000, 80000};

    private final double wind20ftMps;
    private final double[] sigmaFtS;

    TurbulenceIntensity(double wind20ftKt, double[] sigmaFtS) {
        this.wind20ftMps = Units.ktToMps(wind20ftKt);
        this.sigmaFtS = sigmaFtS;
    }

    /** Wind speed at 20 ft of the low-altitude model, m/s. */
    public double wind20ftMps() {
        return wind20ftMps;
    }

    /** Medium/high-altitude RMS intensity, m/s, linear between the figure's altitudes and flat beyond them. */
    public double highAltitudeSigmaMps(double altitudeFt) {
        double[] h = ALTITUDE_FT;
        double s;
        if (altitudeFt <= h[0]) {
            s = sigmaFtS[0];
        } else if (altitudeFt >= h[h.length - 1]) {
            s = sigmaFtS[h.length - 1];
        } else {
            int i = 1;
            while (h[i] < altitudeFt) {
                i++;
            }
            double f = (altitudeFt - h[i - 1]) / (h[i] - h[i - 1]);
            s = sigmaFtS[i - 1] + f * (sigmaFtS[i] - sigmaFtS[i - 1]);
        }
        return s * Units.M_PER_FT;
    }
}
