package org.pointcall.models.analysis.stabilised;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Map;

import org.junit.jupiter.api.Test;
import org.pointcall.models.analysis.Analysers;
import org.pointcall.models.analysis.Histories;
import org.pointcall.models.analysis.ManoeuvreResult;
import org.pointcall.shared.kind.ManoeuvreKind;
import org.pointcall.shared.units.Unit;

class StabilisedAnalyserTest {
    private static final long T0 = 2_000_000_000_000L;

    /**
     * 20 s settling (KCAS running down 0.5 kt/s), then 40 s held at 250 KCAS with a 30 ft/min altitude drift, all
     * with sensor noise: the Cao-Rhinehart window starts near the end of the settling and the drifts are the held
     * part's.
     */
    @Test
    void steadyWindowLeavesTheSettlingOut() {
        var h = new Histories()
                .with("KCAS", t -> t < 20 ? 260 - 0.5 * t : 250)
                .with("Hp", t -> 10000 + 0.5 * t)
                .with("Heading", t -> 90.0)
                .noisy("KCAS", 0.15).noisy("Hp", 2.0).noisy("Heading", 0.02)
                .sample(T0, -15, 60, 1.0 / 32, 5);
        ManoeuvreResult r = Analysers.analyse(ManoeuvreKind.STABILISED, h, T0, T0 + 60_000_000_000L, Map.of(),
                Map.of());
        double start = (r.instantNs("start").getAsLong() - T0) * 1e-9;
        // the window opens once the ratio has forgotten the ramp, stretched back by the filter's 10 s memory
        assertEquals(20.0, start, 6.0, r.notes().toString());
        assertEquals(30.0, Unit.FOOT_PER_MINUTE.fromSi(r.metricSi("hp-drift").getAsDouble()), 3.0);
        assertEquals(0.0, Unit.KNOT_PER_MINUTE.fromSi(r.metricSi("kcas-drift").getAsDouble()), 0.3);
        assertEquals(60.0 - start, r.metricSi("steady-time").getAsDouble(), 1e-6);
        // the hold is the whole point, settling included: the steady test chooses what to average, not the hold
        assertEquals(60.0, r.metricSi("hold-time").getAsDouble(), 1e-6);
        assertEquals(250.0, Unit.KNOT.fromSi(r.metricSi("kcas-mean").getAsDouble()), 0.3);
    }
}
