package org.pointcall.models.analysis.mode;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.pointcall.models.analysis.Series;

class PeakRatiosTest {
    /**
     * Damping ratio, full-cycle amplitude ratio and half-cycle transient peak ratio: the table of "Identifying a
     * second-order mode from a time history" (Yechout, Introduction to Aircraft Flight Mechanics, 7.6; USAF TPS
     * Flying Qualities Textbook Vol. II), printed to 4 digits, so the tolerance is half a unit in the 4th.
     */
    @ParameterizedTest
    @CsvSource({"0.04, 0.7776, 0.8818", "0.10, 0.5318, 0.7292", "0.20, 0.2773, 0.5266", "0.35, 0.0956, 0.3092"})
    void formulasGiveThePrintedRatiosAndBack(double zeta, double fullCycle, double tpr) {
        assertEquals(tpr, PeakRatios.transientPeakRatio(zeta), 0.5e-4);
        // full cycle = two half cycles
        assertEquals(fullCycle, Math.pow(PeakRatios.transientPeakRatio(zeta), 2), 0.5e-4);
        // inverses, from the same table's ratios; 4 printed digits give the damping ratio to about 1e-4
        assertEquals(zeta, PeakRatios.zetaFromTransientPeakRatio(tpr), 2e-4);
        assertEquals(zeta, PeakRatios.zetaFromLogDecrement(PeakRatios.logDecrement(1.0, fullCycle, 1)), 2e-4);
    }

    /**
     * An analytic free response x = c + exp(-zeta wn t) cos(wd t) at each tabulated damping ratio: the extremes'
     * logarithmic decrement and spacing give the damping ratio and natural frequency back (formulas as above).
     */
    @ParameterizedTest
    @CsvSource({"0.04", "0.10", "0.20", "0.35"})
    void logarithmicDecrementOnAnAnalyticResponse(double zeta) {
        double wn = 0.15;
        double wd = wn * Math.sqrt(1 - zeta * zeta);
        int n = 4000;
        double[] t = new double[n];
        double[] x = new double[n];
        for (int i = 0; i < n; i++) {
            t[i] = i * 0.05;
            x[i] = 120.0 + 8.0 * Math.exp(-zeta * wn * t[i]) * Math.cos(wd * t[i] + 0.3);
        }
        PeakRatios.Extremes e = PeakRatios.extremes(Series.of(t, x), 0.05);
        DampedMode m = PeakRatios.ofExtremes(e);
        // sampling at 0.05 s puts each extreme within 0.025 s of the true one: the ratio is exact to about 1e-4
        assertEquals(zeta, m.dampingRatio(), 1e-3);
        assertEquals(wn, m.naturalFrequencyRadS(), 1e-3 * wn);
    }

    /** The first two half-cycle peaks of an analytic response about its final value give the tabulated TPR. */
    @ParameterizedTest
    @CsvSource({"0.04, 0.8818", "0.10, 0.7292", "0.20, 0.5266", "0.35, 0.3092"})
    void transientPeakRatioOfAnAnalyticResponse(double zeta, double tpr) {
        double wn = 5.0;
        double wd = wn * Math.sqrt(1 - zeta * zeta);
        int n = 2000;
        double[] t = new double[n];
        double[] x = new double[n];
        for (int i = 0; i < n; i++) {
            t[i] = i / 256.0;
            // a sine start, so the first extreme is inside the record, not at its edge
            x[i] = 2.0 + Math.exp(-zeta * wn * t[i]) * Math.sin(wd * t[i]);
        }
        PeakRatios.Extremes e = PeakRatios.extremes(Series.of(t, x), 0.01);
        double ratio = Math.abs(e.values()[1] - 2.0) / Math.abs(e.values()[0] - 2.0);
        // table printed to 4 digits (Yechout 7.6); sampling at 1/256 s adds under 1e-4
        assertEquals(tpr, ratio, 2e-4);
    }
}
