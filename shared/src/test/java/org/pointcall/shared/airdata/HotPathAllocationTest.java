package org.pointcall.shared.airdata;

import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.lang.management.ManagementFactory;
import org.junit.jupiter.api.Test;
import org.pointcall.shared.atmosphere.StandardAtmosphere;

/**
 * The per-sample functions allocate nothing: counted with the JVM's per-thread allocation counter (bytes, not
 * time, so the shared machine's load does not matter).
 */
class HotPathAllocationTest {

    @Test
    void perSampleFunctionsAllocateNothing() {
        java.lang.management.ThreadMXBean mx = ManagementFactory.getThreadMXBean();
        assumeTrue(mx instanceof com.sun.management.ThreadMXBean, "JVM without per-thread allocation counts");
        com.sun.management.ThreadMXBean threads = (com.sun.management.ThreadMXBean) mx;
        assumeTrue(threads.isThreadAllocatedMemorySupported() && threads.isThreadAllocatedMemoryEnabled());
        PositionErrorCorrection pec = new PositionErrorCorrection.Table(new double[] {0.2, 0.6, 0.9, 1.2},
                new double[] {0.01, 0.02, -0.01, 0.0});
        double sink = run(pec, 20_000);
        long tid = Thread.currentThread().getId();
        long before = threads.getThreadAllocatedBytes(tid);
        sink += run(pec, 200_000);
        long allocated = threads.getThreadAllocatedBytes(tid) - before;
        // the counter call itself may cost a few bytes; 200,000 samples allocating even one object each would be
        // megabytes
        assertTrue(allocated < 1024, "allocated " + allocated + " bytes over 200,000 samples");
        assertTrue(Double.isFinite(sink));
    }

    private static double run(PositionErrorCorrection pec, int n) {
        double sum = 0;
        for (int i = 0; i < n; i++) {
            double h = -4000 + (i % 7500) * 10.0;
            double p = StandardAtmosphere.pressurePa(h);
            double t = StandardAtmosphere.temperatureK(h);
            double cas = (i % 1000) * 0.5;
            double qcIc = AirData.impactPressureFromCas(cas);
            double ps = pec.ambientStaticPressurePa(p, qcIc);
            double qc = pec.correctedImpactPressurePa(p, qcIc);
            double m = AirData.machFromImpactPressure(qc, ps);
            double tas = AirData.trueAirspeedMps(m, AirData.staticTemperatureK(t * 1.1, m, 0.98));
            sum += StandardAtmosphere.pressureAltitudeM(ps) + AirData.casFromImpactPressure(qc) + tas
                    + AirData.equivalentAirspeedMps(tas, StandardAtmosphere.densityKgM3(h))
                    + StandardAtmosphere.densityAltitudeM(StandardAtmosphere.densityKgM3(h))
                    + StandardAtmosphere.dynamicViscosityPaS(h) + StandardAtmosphere.speedOfSoundMps(h);
        }
        return sum;
    }
}
