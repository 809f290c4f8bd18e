package org.pointcall.shared.airdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.pointcall.shared.atmosphere.StandardAtmosphere;

class PositionErrorCorrectionTest {

    private final PositionErrorCorrection.Table table = new PositionErrorCorrection.Table(
            new double[] {0.2, 0.5, 0.8}, new double[] {0.01, 0.03, -0.02});

    @Test
    void interpolatesLinearlyAndHoldsFlatBeyondTheEnds() {
        assertEquals(0.01, table.deltaPpOverQc(0.2), 1e-15);
        assertEquals(0.02, table.deltaPpOverQc(0.35), 1e-15);
        assertEquals(0.005, table.deltaPpOverQc(0.65), 1e-15);
        assertEquals(-0.02, table.deltaPpOverQc(0.8), 1e-15);
        assertEquals(0.01, table.deltaPpOverQc(0.0), 0.0);
        assertEquals(-0.02, table.deltaPpOverQc(2.0), 0.0);
        assertTrue(Double.isNaN(table.deltaPpOverQc(Double.NaN)));
        assertEquals(0.0, PositionErrorCorrection.NONE.deltaPpOverQc(0.7));
    }

    @Test
    void positiveErrorMeansTheStaticPortReadsHigh() {
        // flight-test convention (NASA TM-104316): dPp = p_indicated - p_ambient, so with dPp/qc > 0 the ambient
        // pressure is lower than indicated, the true pressure altitude higher, and qc larger
        double pIc = StandardAtmosphere.pressurePa(3000);
        double qcIc = AirData.impactPressureFromMach(0.5, pIc);
        double p = table.ambientStaticPressurePa(pIc, qcIc);
        double qc = table.correctedImpactPressurePa(pIc, qcIc);
        assertEquals(pIc - 0.03 * qcIc, p, 1e-9);
        assertEquals(qcIc + 0.03 * qcIc, qc, 1e-9);
        // the pitot (total) pressure is taken as free of error
        assertEquals(pIc + qcIc, p + qc, 1e-9);
        assertTrue(StandardAtmosphere.pressureAltitudeM(p) > 3000);
        assertEquals(pIc, PositionErrorCorrection.NONE.ambientStaticPressurePa(pIc, qcIc));
    }

    @Test
    void arraysAreCopiedInAndOut() {
        double[] m = {0.1, 0.9};
        double[] d = {0.0, 0.01};
        PositionErrorCorrection.Table t = new PositionErrorCorrection.Table(m, d);
        m[1] = 5;
        d[1] = 5;
        t.mach()[0] = 7;
        assertEquals(0.01, t.deltaPpOverQc(0.9), 1e-15);
        assertEquals(0.1, t.mach()[0]);
        assertEquals(new PositionErrorCorrection.Table(new double[] {0.1, 0.9}, new double[] {0.0, 0.01}), t);
        assertNotEquals(table, t);
    }

    @Test
    void badTablesAreRefusedInOneLine() {
        assertEquals("position error table needs at least 2 points, got 1", assertThrows(
                IllegalArgumentException.class,
                () -> new PositionErrorCorrection.Table(new double[] {0.5}, new double[] {0.0})).getMessage());
        assertEquals("position error table has 2 Mach values but 3 dPp/qc values", assertThrows(
                IllegalArgumentException.class, () -> new PositionErrorCorrection.Table(new double[] {0.5, 0.6},
                        new double[] {0, 0, 0})).getMessage());
        assertEquals("position error table point 3: Mach 0.6 must be greater than the previous 0.6", assertThrows(
                IllegalArgumentException.class, () -> new PositionErrorCorrection.Table(
                        new double[] {0.5, 0.6, 0.6}, new double[] {0, 0, 0})).getMessage());
        assertEquals("position error table point 1: Mach must be a finite number >= 0, got -0.1", assertThrows(
                IllegalArgumentException.class, () -> new PositionErrorCorrection.Table(new double[] {-0.1, 0.6},
                        new double[] {0, 0})).getMessage());
        assertEquals("position error table point 2: dPp/qc must be a finite number, got NaN", assertThrows(
                IllegalArgumentException.class, () -> new PositionErrorCorrection.Table(new double[] {0.1, 0.6},
                        new double[] {0, Double.NaN})).getMessage());
    }
}
