package org.pointcall.models.analysis.stall;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Map;

import org.junit.jupiter.api.Test;
import org.pointcall.models.analysis.Analysers;
import org.pointcall.models.analysis.Histories;
import org.pointcall.models.analysis.ManoeuvreResult;
import org.pointcall.models.analysis.PointHistory;
import org.pointcall.shared.kind.ManoeuvreKind;
import org.pointcall.shared.units.Unit;

class StallAnalyserTest {
    private static final long T0 = 5_000_000_000_000L;
    private static final double BREAK_S = 20.0;

    /**
     * Entry at 1.2 kt/s to a break at 20 s (AoA rising 0.3 deg/s to 16 deg, then falling 4 deg/s); altitude on a
     * parabola to 250 ft below the break at 26 s; bank dropping 12 deg and coming back by 26 s.
     */
    private static PointHistory stall(double bankDeg, double nzAtBreak, boolean noisy) {
        Histories h = new Histories()
                .with("KCAS", t -> t <= BREAK_S ? 134.0 - 1.2 * t : 110.0 + 3.0 * (t - BREAK_S))
                .with("AoA", t -> t <= BREAK_S ? 16.0 - 0.3 * (BREAK_S - t) : Math.max(4.0, 16.0 - 4.0 * (t - BREAK_S)))
                .with("Hp", t -> t <= BREAK_S ? 10000.0
                        : t <= 32.0 ? 10000.0 - 250.0 * (1 - (t - 26.0) * (t - 26.0) / 36.0) : 10000.0)
                .with("Nz", t -> t <= BREAK_S ? nzAtBreak : 1.0)
                .with("Roll", t -> bankDeg + (t > BREAK_S && t < 26.0 ? -12.0 * Math.sin(Math.PI * (t - BREAK_S) / 6.0) : 0.0));
        if (noisy) {
            h.noisy("KCAS", 0.15).noisy("AoA", 0.1).noisy("Hp", 2.0).noisy("Nz", 0.01).noisy("Roll", 0.02);
        }
        return h.sample(T0, -3.0, 40.0, 1.0 / 32, 7);
    }

    @Test
    void entryRateIsLeastSquaresSlopeOverTheBandIntervalBeforeTheBreak() {
        ManoeuvreResult r = Analysers.analyse(ManoeuvreKind.STALL_LEVEL, stall(0, 1.0, false), T0,
                T0 + 38_000_000_000L, Map.of(), Map.of("KCAS", 8.0));
        assertEquals(BREAK_S, (r.instantNs("break").getAsLong() - T0) * 1e-9, 0.05);
        assertEquals(1.2, Unit.KNOT_PER_SECOND.fromSi(r.metricSi("entry-rate").getAsDouble()), 1e-6);
        assertEquals(110.0, Unit.KNOT.fromSi(r.metricSi("stall-kcas").getAsDouble()), 0.07);
        // a 0.1 s local line rounds this cusp (0.3 and 4 deg/s either side) off by a few hundredths of a degree
        assertEquals(16.0, Unit.DEGREE.fromSi(r.metricSi("max-aoa").getAsDouble()), 0.05);
        assertTrue(r.methods().get("entry-rate").contains("8.0 s"), r.methods().toString());
    }

    @Test
    void altitudeLossRunsFromTheBreakToTheBottomOfTheRecovery() {
        ManoeuvreResult r = Analysers.analyse(ManoeuvreKind.STALL_LEVEL, stall(0, 1.0, true), T0,
                T0 + 38_000_000_000L, Map.of(), Map.of());
        assertEquals(250.0, Unit.FOOT.fromSi(r.metricSi("altitude-loss").getAsDouble()), 3.0);
        assertEquals(6.0, r.metricSi("recovery-time").getAsDouble(), 0.3);
        assertEquals(12.0, Unit.DEGREE.fromSi(r.metricSi("wing-drop").getAsDouble()), 0.1);
        assertEquals(110.0, Unit.KNOT.fromSi(r.metricSi("stall-kcas").getAsDouble()), 0.3);
    }

    @Test
    void turningStallReportsTheOneGEquivalentStallSpeed() {
        // level turn at 30 deg bank: n = 1 / cos(30 deg) = 1.1547 (check-values.md, turn worked values, computed)
        double n = 1.0 / Math.cos(Math.toRadians(30));
        ManoeuvreResult r = Analysers.analyse(ManoeuvreKind.STALL_TURN, stall(-30, n, false), T0,
                T0 + 38_000_000_000L, Map.of(), Map.of());
        assertEquals(-30.0, Unit.DEGREE.fromSi(r.metricSi("bank-at-break").getAsDouble()), 0.01);
        // Vs_n = Vs sqrt(n) (Anderson, Introduction to Flight; check-values.md): 110 kt at n 1.1547 is 102.37 kt at 1 g
        assertEquals(110.0 / Math.sqrt(n), Unit.KNOT.fromSi(r.metricSi("stall-kcas-1g").getAsDouble()), 0.07);
    }
}
