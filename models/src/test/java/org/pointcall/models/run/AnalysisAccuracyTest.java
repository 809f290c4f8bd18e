package org.pointcall.models.run;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.stream.Collectors;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.pointcall.ingest.sim.pilot.PilotSettings;
import org.pointcall.ingest.sim.sensor.SensorSettings;
import org.pointcall.shared.demo.DemoFiles;

class AnalysisAccuracyTest {
    /**
     * Navion at sea level, u0 = 176 ft/s (Nelson, Flight Stability and Automatic Control, 2nd ed., ch. 4; the
     * eigenvalues in check-values.md are computed from these derivatives, printed to 4 significant digits):
     * short period -2.489 +/- 2.601i, phugoid -0.01705 +/- 0.2134i.
     */
    @Test
    void eigenvaluesOfTheNavionLongitudinalModel() {
        double xu = -0.045, xw = 0.036, zu = -0.369, zw = -2.02, mw = -0.05, mwd = -0.0051, mq = -2.05;
        double u0 = 176, g = 32.2;
        double[][] a = {
            {xu, xw, 0, -g},
            {zu, zw, u0, 0},
            {mwd * zu, mw + mwd * zw, mq + mwd * u0, 0},
            {0, 0, 1, 0}};
        double[][] z = AnalysisAccuracy.Eigen4.eigenvalues(a);
        Arrays.sort(z, (p, q) -> Double.compare(p[0], q[0]));
        assertEquals(-2.489, z[0][0], 0.0005);
        assertEquals(2.601, Math.abs(z[0][1]), 0.0005);
        assertEquals(-0.01705, z[2][0], 0.000005);
        assertEquals(0.2134, Math.abs(z[2][1]), 0.00005);
    }

    /**
     * The demo card flown once by the simulator with noisy sensors, analysed over the truth's intervals: the
     * stall and doublet targets of the analysis hold on it (truth: the simulator's exact trajectory).
     */
    @Test
    void demoSortieMeetsTheStallAndDoubletTargets(@TempDir Path dir) {
        List<Path> sorties = SortieSets.generate(List.of("veskarn-02"), 1, 901, DemoFiles.card(),
                DemoFiles.dictionary(), new SortieSets.Flying(64.0, SensorSettings.DEFAULT, PilotSettings.NO_FLAWS),
                dir, (d, t) -> { });
        AnalysisAccuracy a = AnalysisAccuracy.run(sorties, d -> DemoFiles.dictionary());
        Map<String, String> lines = a.lines().stream().filter(l -> !l.startsWith("analysis.not-computed"))
                .collect(Collectors.toMap(l -> l.substring(0, l.indexOf(": ")), l -> l.substring(l.indexOf(": ") + 2)));
        assertEquals("12", lines.get("analysis.points"));
        for (String k : List.of("stall-level.stall-kcas.within-1", "stall-level.altitude-loss.within-20",
                "stall-turn.stall-kcas.within-1", "pitch-doublet.sp-frequency.within-5%",
                "pitch-doublet.sp-damping.within-5%")) {
            assertEquals(1.0, Double.parseDouble(lines.get("analysis." + k)), 1e-9, k + " in " + a.lines());
        }
        assertTrue(a.details().size() > 40, "one line per point and metric");
    }
}
