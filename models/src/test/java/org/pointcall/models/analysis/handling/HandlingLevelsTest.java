package org.pointcall.models.analysis.handling;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class HandlingLevelsTest {
    /**
     * MIL-F-8785C 3.2.2.1.2, short-period damping ratio bounds as published (check-values.md "Handling qualities",
     * confirmed against two public encodings): A and C Level 1 0.35-1.30, Level 2 0.25-2.00; B Level 1 0.30-2.00,
     * Level 2 0.20-2.00; Level 3 at least 0.15. Each edge and just beyond it.
     */
    @ParameterizedTest
    @CsvSource({
        "A, 0.35, 1", "A, 0.349, 2", "A, 1.30, 1", "A, 1.301, 2", "A, 0.25, 2", "A, 0.249, 3", "A, 2.00, 2",
        "A, 2.01, 3", "A, 0.15, 3", "A, 0.149, 4",
        "C, 0.35, 1", "C, 0.349, 2", "C, 1.30, 1", "C, 1.301, 2",
        "B, 0.30, 1", "B, 0.299, 2", "B, 2.00, 1", "B, 2.001, 3", "B, 0.20, 2", "B, 0.199, 3", "B, 0.15, 3",
        "B, 0.149, 4"})
    void shortPeriodDampingLevelsAsPublished(FlightPhaseCategory c, double zeta, int level) {
        assertEquals(level, HandlingLevels.shortPeriodDamping(zeta, c));
    }

    /**
     * MIL-F-8785C 3.2.1.2, phugoid: Level 1 zeta >= 0.04, Level 2 zeta >= 0, Level 3 time to double amplitude at
     * least 55 s (check-values.md). At wn 0.2 rad/s, T2 = ln 2 / (-zeta wn) is 55 s at zeta = -0.063013.
     */
    @ParameterizedTest
    @CsvSource({"0.04, 0.2, 1", "0.0399, 0.2, 2", "0.0, 0.2, 2", "-0.001, 0.2, 3", "-0.0630, 0.2, 3",
        "-0.0631, 0.2, 4"})
    void phugoidLevelsAsPublished(double zeta, double wn, int level) {
        assertEquals(level, HandlingLevels.phugoid(zeta, wn));
    }
}
