package org.pointcall.models.analysis.handling;

/**
 * Flying-qualities levels of MIL-F-8785C (Military Specification, Flying Qualities of Piloted Airplanes, 1980) for
 * the longitudinal modes, from the published bounds:
 *
 * <ul>
 * <li>short-period damping ratio, paragraph 3.2.2.1.2: Categories A and C, Level 1 0.35 to 1.30, Level 2 0.25 to
 *     2.00; Category B, Level 1 0.30 to 2.00, Level 2 0.20 to 2.00; Level 3 at least 0.15 in every category;</li>
 * <li>phugoid, paragraph 3.2.1.2: Level 1 damping ratio at least 0.04, Level 2 at least 0, Level 3 a time to double
 *     amplitude of at least 55 s.</li>
 * </ul>
 *
 * Paragraph numbers are recalled [memory]; the bounds were checked against two independent public encodings of the
 * specification. A value outside every level's bounds is reported as level 4 ("worse than Level 3"). Bounds are
 * inclusive.
 */
public final class HandlingLevels {
    /** Worse than Level 3. */
    public static final int BEYOND_LEVEL_3 = 4;

    private HandlingLevels() {
    }

    /** Level (1 to 3, or {@link #BEYOND_LEVEL_3}) of a short-period damping ratio in a flight phase category. */
    public static int shortPeriodDamping(double zeta, FlightPhaseCategory category) {
        if (!Double.isFinite(zeta)) {
            throw new IllegalArgumentException("damping ratio must be finite, got " + zeta);
        }
        boolean b = category == FlightPhaseCategory.B;
        if (zeta >= (b ? 0.30 : 0.35) && zeta <= (b ? 2.00 : 1.30)) {
            return 1;
        }
        if (zeta >= (b ? 0.20 : 0.25) && zeta <= 2.00) {
            return 2;
        }
        return zeta >= 0.15 ? 3 : BEYOND_LEVEL_3;
    }

    /**
     * Level of a phugoid of damping ratio {@code zeta} and natural frequency {@code wnRadS} (the frequency only
     * matters when divergent: the time to double amplitude is {@code ln 2 / (-zeta wn)}).
     */
    public static int phugoid(double zeta, double wnRadS) {
        if (!Double.isFinite(zeta)) {
            throw new IllegalArgumentException("damping ratio must be finite, got " + zeta);
        }
        if (zeta >= 0.04) {
            return 1;
        }
        if (zeta >= 0.0) {
            return 2;
        }
        return timeToDoubleS(zeta, wnRadS) >= 55.0 ? 3 : BEYOND_LEVEL_3;
    }

    /** Time to double amplitude of a divergent mode, s (infinite when not divergent). */
    public static double timeToDoubleS(double zeta, double wnRadS) {
        double growth = -zeta * wnRadS;
        return growth > 0 ? Math.log(2.0) / growth : Double.POSITIVE_INFINITY;
    }
}
