package org.pointcall.ingest.sim.model;

import org.pointcall.ingest.sim.airframe.Airframe;
import org.pointcall.ingest.sim.airframe.ControlSurfaces;
import org.pointcall.ingest.sim.airframe.Curve;
import org.pointcall.ingest.sim.airframe.Engine;
import org.pointcall.ingest.sim.airframe.Geometry;
import org.pointcall.ingest.sim.airframe.LateralAero;
import org.pointcall.ingest.sim.airframe.LongitudinalAero;
import org.pointcall.ingest.sim.airframe.MassProperties;
import org.pointcall.ingest.sim.airframe.StallCharacteristics;
import org.pointcall.ingest.sim.airframe.Surface;
import org.pointcall.shared.airdata.PositionErrorCorrection;
import org.pointcall.shared.atmosphere.StandardAtmosphere;
import org.pointcall.shared.units.Units;

/**
 * The example light aircraft of Nelson, Flight Stability and Automatic Control, 2nd ed., ch. 4 (the book's Navion
 * data; check-values.md), as a profile of this
 * flight model: its published dimensional longitudinal derivatives at sea level and 176 ft/s are turned back into
 * the nondimensional coefficients the model takes, so that the model, trimmed at that condition and linearised
 * numerically, should reproduce them. Test data only, not a shipped airframe.
 *
 * <p>The mass and geometry (W 2750 lb, S 184 ft^2, c 5.7 ft, b 33.4 ft, Iyy 3000 slug ft^2, Ixx 1048, Izz 3530) are
 * [memory] of the same book; they cancel out, since every derivative is converted back with them, so other values
 * would reproduce the same dimensional model.
 */
final class TextbookLightAircraft {
    private TextbookLightAircraft() {
    }

    // Nelson's dimensional derivatives (per second, ft units), [table] of check-values.md
    static final double XU = -0.045;
    static final double XW = 0.036;
    static final double ZU = -0.369;
    static final double ZW = -2.02;
    static final double MW_PER_FT = -0.05;
    static final double MWDOT_PER_FT = -0.0051;
    static final double MQ = -2.05;
    static final double U0_MPS = Units.ftToM(176.0);

    static final double WEIGHT_N = 2750.0 * Units.N_PER_LBF;
    static final double MASS_KG = WEIGHT_N / StandardAtmosphere.G0_MPS2;
    static final double AREA_M2 = 184.0 * Units.M_PER_FT * Units.M_PER_FT;
    static final double CHORD_M = Units.ftToM(5.7);
    static final double SPAN_M = Units.ftToM(33.4);
    private static final double SLUG_FT2 = Units.N_PER_LBF * Units.M_PER_FT; // kg m^2 per slug ft^2
    static final double IYY = 3000.0 * SLUG_FT2;

    /** SI versions of the derivatives quoted per ft. */
    static final double MW = MW_PER_FT / Units.M_PER_FT;
    static final double MWDOT = MWDOT_PER_FT / Units.M_PER_FT;

    static Airframe airframe() {
        double qs = 0.5 * StandardAtmosphere.SEA_LEVEL_DENSITY_KG_M3 * U0_MPS * U0_MPS * AREA_M2;
        double mu = MASS_KG * U0_MPS;
        double cl = WEIGHT_N / qs;
        // Xu = -(CDu + 2 CD) qS / (m u0) with CDu = 0 and thrust independent of speed
        double cd = -XU * mu / (2.0 * qs);
        // Zw = -(CLalpha + CD) qS / (m u0)
        double cla = -ZW * mu / qs - cd;
        // Xw = -(CDalpha - CL) qS / (m u0), and CDalpha = 2 k CL CLalpha for the polar
        double cda = cl - XW * mu / qs;
        double k = cda / (2.0 * cl * cla);
        double cd0 = cd - k * cl * cl;
        double qsc = qs * CHORD_M;
        double cma = MW * IYY * U0_MPS / qsc;
        double hat = CHORD_M / (2.0 * U0_MPS);
        double cmad = MWDOT * IYY * U0_MPS / (qsc * hat);
        double cmq = MQ * IYY / (qsc * hat);
        // zero-lift angle chosen so the trim angle of attack is zero: body and stability axes coincide
        double alpha0 = -cl / cla;
        LongitudinalAero lon = new LongitudinalAero(alpha0, cla, 0.0, 0.0, cd0, k, 0.0, cma, cmq, cmad, -1.0, 0.0,
                0.0);
        // lateral [memory] of the same book; the longitudinal check does not touch them
        LateralAero lat = new LateralAero(-0.564, 0.0, 0.0, 0.157, -0.074, -0.410, 0.107, -0.134, 0.0107, 0.071,
                -0.0575, -0.125, -0.0035, -0.072);
        StallCharacteristics stall = new StallCharacteristics(Math.toRadians(20), Math.toRadians(16),
                Math.toRadians(-16), Math.toRadians(-12), Math.toRadians(1.5),
                new Curve(new double[] {0, Math.PI / 4, Math.PI / 2}, new double[] {0, 0.9, 0}), 1.2, 0.05, 8, 3,
                -0.05, 0.0, 0.3);
        // thrust independent of speed, and no fuel burnt, so the mass stays the book's
        Engine engine = new Engine(2.0 * cd * qs, 0.0, 0.8, new Curve(new double[] {0, 1}, new double[] {1, 1}),
                1.0, 1.0, 0.0, 0.0, 0.0);
        Surface s = new Surface(Math.toRadians(-25), Math.toRadians(25), Math.toRadians(60), 0.05);
        return new Airframe("textbook-light-aircraft", "Nelson's example light aircraft (test data)",
                new MassProperties(MASS_KG - 100.0, 100.0, 1048.0 * SLUG_FT2, IYY, 3530.0 * SLUG_FT2, 0.0),
                new Geometry(AREA_M2, SPAN_M, CHORD_M), lon, lat, stall, engine, new ControlSurfaces(s, s, s),
                new PositionErrorCorrection.Table(new double[] {0, 1}, new double[] {0, 0}));
    }
}
