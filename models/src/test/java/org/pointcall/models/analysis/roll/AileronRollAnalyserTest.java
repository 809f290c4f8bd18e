package org.pointcall.models.analysis.roll;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Map;

import org.apache.commons.math3.analysis.solvers.BrentSolver;
import org.junit.jupiter.api.Test;
import org.pointcall.models.analysis.Analysers;
import org.pointcall.models.analysis.Histories;
import org.pointcall.models.analysis.ManoeuvreResult;
import org.pointcall.shared.kind.ManoeuvreKind;

class AileronRollAnalyserTest {
    private static final long T0 = 3_000_000_000_000L;
    private static final double INPUT_S = 3.0;
    private static final double P_SS = 180.0;
    private static final double TAU = 0.3;

    /** Bank angle of a first-order roll mode after an aileron step at {@link #INPUT_S}, deg. */
    private static double bank(double t) {
        double s = t - INPUT_S;
        return s <= 0 ? 0.0 : P_SS * (s - TAU * (1 - Math.exp(-s / TAU)));
    }

    /**
     * The point begins inside the stick correction after the set-up (aileron 1.5 deg easing back to trim, then a
     * 1.2 deg dip the other way), then a 20 deg step: the roll is timed from the step, not from the correction.
     * The first-order roll response to a step, p = Pss (1 - exp(-t / tau)), is the textbook single-degree-of-freedom
     * roll mode (for example Cook, Flight Dynamics Principles, the roll subsidence mode); its time to 90 and 360 deg
     * is solved here by Apache Commons Math's Brent solver, not by our code.
     */
    @Test
    void theRollIsTimedFromTheStepNotFromACorrectionBeforeIt() {
        var h = new Histories()
                .with("Aileron", t -> t >= INPUT_S ? 20.0
                        : t < 1.0 ? 1.5 * (1 - t) : t > 1.8 && t < 2.4 ? -1.2 : 0.0)
                .with("Roll", AileronRollAnalyserTest::bank)
                .with("P", t -> t <= INPUT_S ? 0.0 : P_SS * (1 - Math.exp(-(t - INPUT_S) / TAU)))
                .with("AoS", t -> 0.0)
                .with("Hp", t -> 12000.0)
                .sample(T0, -2, 8, 1.0 / 64, 3);
        ManoeuvreResult r = Analysers.analyse(ManoeuvreKind.AILERON_ROLL, h, T0, T0 + 8_000_000_000L, Map.of(),
                Map.of());
        double input = (r.instantNs("input").getAsLong() - T0) * 1e-9;
        assertEquals(INPUT_S, input, 1.0 / 64 + 1e-6, r.notes().toString());
        BrentSolver brent = new BrentSolver(1e-9);
        double t90 = brent.solve(100, t -> bank(INPUT_S + t) - 90.0, 0.01, 3.0);
        double t360 = brent.solve(100, t -> bank(INPUT_S + t) - 360.0, 0.01, 5.0);
        assertEquals(t90, r.metricSi("time-to-90").getAsDouble(), 0.02);
        assertEquals(t360, r.metricSi("time-to-360").getAsDouble(), 0.02);
    }
}
