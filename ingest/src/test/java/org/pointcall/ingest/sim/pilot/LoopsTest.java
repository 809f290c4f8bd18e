package org.pointcall.ingest.sim.pilot;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.pointcall.ingest.sim.airframe.Airframe;
import org.pointcall.ingest.sim.airframe.Airframes;
import org.pointcall.ingest.sim.model.FlightModel;
import org.pointcall.ingest.sim.model.SimulationSettings;
import org.pointcall.shared.demo.DemoFiles;

/** The inner loops on each airframe: a g step and a bank step, flown on the flight model at twice Vs. */
class LoopsTest {
    private static final double DT = 0.01;

    private static final class Rig {
        final FlightModel model;
        final Loops loops;
        final SensedState s = new SensedState();

        Rig(String name) {
            Airframe a = Airframes.load(name);
            Envelope env = new Envelope(a);
            loops = new Loops(env, new Limits(DemoFiles.card(), env), new TrackingError(1L, 0.0));
            model = new FlightModel(a, SimulationSettings.DEFAULT);
            double vs = model.oneGStallSpeedMps(3000.0);
            model.initialise(model.trim(2.0 * vs, 3000.0, 0.0), 0.0, 0.0, 0.0);
            loops.syncTo(model.elevatorRad(), model.aileronRad(), model.rudderRad(), model.throttleLever());
        }

        void read(double t) {
            s.read(model, t);
        }

        void step() {
            loops.apply(model);
            model.advance(DT);
        }
    }

    @ParameterizedTest
    @ValueSource(strings = {"veskarn-02", "quillon-tp3", "sparrel-a1"})
    void aLoadFactorStepSettlesWithoutMuchOvershoot(String airframe) {
        Rig r = new Rig(airframe);
        double peak = 0.0;
        double settled = 0.0;
        // a short pull, before the climb it starts has slowed the aircraft much
        for (int k = 0; k < 300; k++) {
            r.read(k * DT);
            r.loops.pitchNz(r.s, 2.0, DT);
            r.loops.rollToBank(r.s, 0.0, 0.2, DT);
            r.loops.yawBeta(r.s, 0.0, DT);
            r.loops.throttleHold(r.model.throttleLever());
            peak = Math.max(peak, r.s.nz);
            if (k * DT > 2.0) {
                settled = Math.max(settled, Math.abs(r.s.nz - 2.0));
            }
            r.step();
        }
        assertTrue(peak < 2.0 + 0.3, "overshoot to " + peak);
        assertTrue(settled < 0.1, "still " + settled + " g off after 2 s");
    }

    @ParameterizedTest
    @ValueSource(strings = {"veskarn-02", "quillon-tp3", "sparrel-a1"})
    void aBankStepIsCoordinated(String airframe) {
        Rig r = new Rig(airframe);
        double betaMax = 0.0;
        double bankErr = 0.0;
        for (int k = 0; k < 800; k++) {
            r.read(k * DT);
            r.loops.pitchNz(r.s, r.loops.nzForGamma(r.s, 0.0), DT);
            r.loops.rollToBank(r.s, Math.toRadians(30), Math.toRadians(20), DT);
            r.loops.yawBeta(r.s, 0.0, DT);
            r.loops.throttleHold(r.model.throttleLever());
            betaMax = Math.max(betaMax, Math.abs(r.s.betaRad));
            if (k * DT > 5.0) {
                bankErr = Math.max(bankErr, Math.abs(r.s.phiRad - Math.toRadians(30)));
            }
            r.step();
        }
        assertTrue(Math.toDegrees(betaMax) < 3.0, "sideslip reached " + Math.toDegrees(betaMax));
        assertEquals(0.0, Math.toDegrees(bankErr), 2.0);
    }
}
