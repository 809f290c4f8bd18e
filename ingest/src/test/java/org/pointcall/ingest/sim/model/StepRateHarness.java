package org.pointcall.ingest.sim.model;

import org.pointcall.ingest.sim.airframe.Airframes;

/**
 * Measures the raw physics step rate on one thread (not a test: timings are never asserted). For each built-in
 * airframe, in still air and in moderate turbulence: steps per second of {@link FlightModel#step()} alone, and of
 * a 100 Hz sortie (controls set and 28 sensor-facing accessors read every frame, five steps per frame), as multiples
 * of real time at the default 500 Hz. Run from the repository root after {@code mvn -pl ingest -am test-compile}:
 * <pre>
 * java -cp ingest/target/test-classes:ingest/target/classes:shared/target/classes:$HOME/.m2/repository/org/yaml/snakeyaml/2.7/snakeyaml-2.7.jar \
 *     org.pointcall.ingest.sim.model.StepRateHarness
 * </pre>
 */
public final class StepRateHarness {
    private StepRateHarness() {
    }

    public static void main(String[] args) {
        double seconds = args.length > 0 ? Double.parseDouble(args[0]) : 3.0;
        SimulationSettings calm = SimulationSettings.DEFAULT;
        SimulationSettings rough = calm.withTurbulence(TurbulenceSettings.standard(TurbulenceIntensity.MODERATE));
        System.out.printf("%-12s %-10s %14s %10s %16s %10s%n", "airframe", "air", "steps/s", "x real", "sortie steps/s",
                "x real");
        for (String name : new String[] {"veskarn-02", "quillon-tp3", "sparrel-a1"}) {
            for (SimulationSettings s : new SimulationSettings[] {calm, rough}) {
                double raw = rate(name, s, seconds, false);
                double sortie = rate(name, s, seconds, true);
                double hz = s.stepRateHz();
                System.out.printf("%-12s %-10s %,14.0f %10.0f %,16.0f %10.0f%n", name,
                        s == calm ? "still" : "moderate", raw, raw / hz, sortie, sortie / hz);
            }
        }
    }

    private static double sink;

    private static double rate(String name, SimulationSettings s, double seconds, boolean sortie) {
        FlightModel m = new FlightModel(Airframes.load(name), s);
        TrimPoint t = m.trim(1.8 * m.oneGStallSpeedMps(3000.0), 3000.0, 0.0);
        m.initialise(t, 0, 0, 0);
        run(m, t, 200_000, sortie);
        m.initialise(t, 0, 0, 0);
        long steps = 0;
        long start = System.nanoTime();
        long end = start + (long) (seconds * 1e9);
        long now;
        do {
            run(m, t, 10_000, sortie);
            steps += 10_000;
            now = System.nanoTime();
            if (m.timeS() > 600.0) {
                m.initialise(t, 0, 0, 0);
            }
        } while (now < end);
        return steps / ((now - start) / 1e9);
    }

    private static void run(FlightModel m, TrimPoint t, int steps, boolean sortie) {
        double sum = 0;
        for (int i = 0; i < steps; i++) {
            if (sortie && i % 5 == 0) {
                m.setControls(t.elevatorRad() + 0.001 * Math.sin(i * 1e-3), 0.0, 0.0, t.throttle());
                sum += m.alphaRad() + m.betaRad() + m.pRadS() + m.qRadS() + m.rRadS() + m.nx() + m.ny() + m.nz()
                        + m.thetaRad() + m.phiRad() + m.psiRad() + m.trueAirspeedMps() + m.mach()
                        + m.calibratedAirspeedMps() + m.pressureAltitudeM() + m.staticPressurePa()
                        + m.impactPressurePa() + m.indicatedStaticPressurePa() + m.indicatedImpactPressurePa()
                        + m.staticTemperatureK() + m.totalTemperatureK() + m.thrustN() + m.fuelFlowKgS()
                        + m.elevatorRad() + m.liftN() + m.dragN() + m.altitudeM() + m.groundSpeedMps();
            }
            m.step();
        }
        sink += sum;
    }
}
