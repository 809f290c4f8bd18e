package org.pointcall.ingest.sim.model;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.lang.management.ManagementFactory;
import java.util.Arrays;
import org.junit.jupiter.api.Test;
import org.pointcall.ingest.sim.airframe.Airframes;

/** Seeded runs repeat to the bit, and a step allocates nothing. */
class DeterminismTest {

    private static final SimulationSettings TURBULENT = SimulationSettings.DEFAULT
            .withTurbulence(TurbulenceSettings.standard(TurbulenceIntensity.MODERATE))
            .withWind(Wind.from(Math.toRadians(250), 12.0));

    /** A 60 s run through turbulence, with a stall in it (so the wing-drop draw is exercised too). */
    private static long[] run(long seed) {
        FlightModel m = new FlightModel(Airframes.load("veskarn-02"), TURBULENT.withSeed(seed));
        TrimPoint t = m.trim(90.0, 400.0, 0.0);
        m.initialise(t, 0, 0, 0);
        for (int i = 0; i < 6000; i++) {
            // a fixed, state-independent input sequence: a slow pull through the stall and back
            double de = t.elevatorRad() - Math.toRadians(8) * Math.sin(Math.PI * Math.min(i, 3000) / 3000.0);
            m.setControls(de, 0.0, 0.0, 0.6);
            m.advance(0.01);
        }
        double[] s = new double[FlightModel.STATE_SIZE];
        m.copyState(s);
        long[] bits = new long[s.length];
        for (int i = 0; i < s.length; i++) {
            bits[i] = Double.doubleToRawLongBits(s[i]);
        }
        return bits;
    }

    @Test
    void theSameSeedGivesTheSameBytesOfStateAndAnotherSeedDoesNot() {
        long[] a = run(2024L);
        long[] b = run(2024L);
        long[] c = run(2025L);
        assertArrayEquals(a, b);
        assertFalse(Arrays.equals(a, c), "turbulence and the wing drop follow the seed");
    }

    @Test
    void advanceRunsWholeStepsAndCarriesTheRemainder() {
        FlightModel m = new FlightModel(Airframes.load("quillon-tp3"), SimulationSettings.DEFAULT);
        m.initialise(m.trim(70.0, 1000.0, 0.0), 0, 0, 0);
        for (int i = 0; i < 1000; i++) {
            m.advance(0.01);
        }
        // 1000 frames of 10 ms on a 500 Hz model: exactly 5000 steps, whatever the rounding of 0.01
        assertEquals(5000, m.stepCount());
        assertEquals(10.0, m.timeS(), 1e-12);
        m.advance(0.003);
        assertEquals(5001, m.stepCount());
        m.advance(0.001);
        assertEquals(5002, m.stepCount());
        FlightModel fast = new FlightModel(Airframes.load("quillon-tp3"), SimulationSettings.DEFAULT
                .withStepRateHz(2000));
        fast.initialise(fast.trim(70.0, 1000.0, 0.0), 0, 0, 0);
        fast.advance(1.0);
        assertEquals(2000, fast.stepCount());
    }

    @Test
    void aStepThroughTurbulenceAllocatesNothing() {
        java.lang.management.ThreadMXBean mx = ManagementFactory.getThreadMXBean();
        assumeTrue(mx instanceof com.sun.management.ThreadMXBean, "JVM without per-thread allocation counts");
        com.sun.management.ThreadMXBean threads = (com.sun.management.ThreadMXBean) mx;
        assumeTrue(threads.isThreadAllocatedMemorySupported() && threads.isThreadAllocatedMemoryEnabled());
        FlightModel m = new FlightModel(Airframes.load("veskarn-02"), TURBULENT);
        TrimPoint t = m.trim(150.0, 500.0, 0.0);
        m.initialise(t, 0, 0, 0);
        // warm up past the compiler's tiers: the counter would otherwise see the interpreter's transitions
        double sink = fly(m, t, 150_000);
        long tid = Thread.currentThread().getId();
        long before = threads.getThreadAllocatedBytes(tid);
        sink += fly(m, t, 100_000);
        long allocated = threads.getThreadAllocatedBytes(tid) - before;
        // 100,000 steps allocating even one small object each would be megabytes; the counter itself may cost a
        // few bytes
        assertTrue(allocated < 1024, "allocated " + allocated + " bytes over 100,000 steps");
        assertTrue(Double.isFinite(sink));
    }

    /** Steps with controls and every sensor-facing accessor read each 5 steps, as a 100 Hz sortie would. */
    private static double fly(FlightModel m, TrimPoint t, int steps) {
        double sum = 0;
        for (int i = 0; i < steps; i++) {
            if (i % 5 == 0) {
                m.setControls(t.elevatorRad() + 0.002 * Math.sin(i * 1e-3), 0.001 * Math.sin(i * 7e-4), 0.0,
                        t.throttle());
                sum += m.alphaRad() + m.betaRad() + m.pRadS() + m.qRadS() + m.rRadS() + m.nx() + m.ny() + m.nz()
                        + m.thetaRad() + m.phiRad() + m.psiRad() + m.trueAirspeedMps() + m.mach()
                        + m.calibratedAirspeedMps() + m.pressureAltitudeM() + m.staticPressurePa()
                        + m.impactPressurePa() + m.indicatedStaticPressurePa() + m.indicatedImpactPressurePa()
                        + m.staticTemperatureK() + m.totalTemperatureK() + m.thrustN() + m.fuelFlowKgS()
                        + m.elevatorRad() + m.liftN() + m.dragN() + m.altitudeM() + m.groundSpeedMps();
            }
            m.step();
        }
        return sum;
    }
}
