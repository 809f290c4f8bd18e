package org.pointcall.shared.units;

/**
 * Exact conversion constants, the only place they are written. SI is used everywhere inside pointcall; these
 * convert at the edges (files, command line, screen).
 */
public final class Units {
    private Units() {
    }

    /** International foot, exact by definition (NIST SP 811, 2008, Appendix B.8). */
    public static final double M_PER_FT = 0.3048;
    /** International nautical mile, exact (NIST SP 811, 2008, Appendix B.8). */
    public static final double M_PER_NMI = 1852.0;
    /** Knot = one nautical mile per hour, exact (NIST SP 811, 2008, Appendix B.8). */
    public static final double MPS_PER_KT = 1852.0 / 3600.0;
    /** Pound-force, exact from the avoirdupois pound and standard gravity (NIST SP 811, 2008, Appendix B.8). */
    public static final double N_PER_LBF = 4.4482216152605;
    /** Pound (avoirdupois) mass, exact (NIST SP 811, 2008, Appendix B.8). */
    public static final double KG_PER_LB = 0.45359237;
    /** Inch of mercury at 0 degC (NIST SP 811, 2008, Appendix B.8). */
    public static final double PA_PER_INHG = 3386.389;
    /** Hectopascal = 100 Pa, exact (SI prefix). */
    public static final double PA_PER_HPA = 100.0;
    /** Pound-force per square foot, derived from the exact lbf and ft. */
    public static final double PA_PER_PSF = N_PER_LBF / (M_PER_FT * M_PER_FT);
    /** Pound-force per square inch, derived from the exact lbf and inch (0.0254 m). */
    public static final double PA_PER_PSI = N_PER_LBF / (0.0254 * 0.0254);
    /** Degree of angle, exact (SI Brochure, 9th ed., Table 8). */
    public static final double RAD_PER_DEG = Math.PI / 180.0;
    /** Standard acceleration of gravity, exact (CGPM 1901; 1976 U.S. Standard Atmosphere g0). */
    public static final double G0_MPS2 = 9.80665;
    /** Kelvin offset of the Celsius scale, exact (SI Brochure, 9th ed.). */
    public static final double K_AT_0_DEGC = 273.15;
    /** Nanoseconds per second. */
    public static final long NS_PER_S = 1_000_000_000L;

    public static double ftToM(double ft) {
        return ft * M_PER_FT;
    }

    public static double mToFt(double m) {
        return m / M_PER_FT;
    }

    public static double ktToMps(double kt) {
        return kt * MPS_PER_KT;
    }

    public static double mpsToKt(double mps) {
        return mps / MPS_PER_KT;
    }

    public static double degToRad(double deg) {
        return deg * RAD_PER_DEG;
    }

    public static double radToDeg(double rad) {
        return rad / RAD_PER_DEG;
    }

    public static double degCToK(double degC) {
        return degC + K_AT_0_DEGC;
    }

    public static double kToDegC(double k) {
        return k - K_AT_0_DEGC;
    }

    public static long secondsToNs(double s) {
        return Math.round(s * NS_PER_S);
    }

    public static double nsToSeconds(long ns) {
        return ns / (double) NS_PER_S;
    }
}
