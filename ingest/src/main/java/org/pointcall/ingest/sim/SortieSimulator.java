package org.pointcall.ingest.sim;

import java.util.List;
import java.util.concurrent.locks.LockSupport;
import java.util.function.LongSupplier;

import org.pointcall.ingest.frame.Frame;
import org.pointcall.ingest.frame.FrameSink;
import org.pointcall.ingest.sim.airframe.Airframe;
import org.pointcall.ingest.sim.pilot.PilotSettings;
import org.pointcall.ingest.sim.sensor.SensorSettings;
import org.pointcall.ingest.sim.sensor.SensorSuite;
import org.pointcall.ingest.sim.sortie.SortieFlight;
import org.pointcall.ingest.sim.truth.SortieTruth;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.dictionary.ParameterDictionary;

/**
 * A simulated aircraft as a telemetry source: the pilot flies the card on the flight model, the instrumentation
 * measures it, and every frame goes to the given sinks (a CSV file, a UDP stream, the in-process pipeline). The
 * truth of what was flown comes back at the end.
 */
public final class SortieSimulator {
    private final Airframe airframe;
    private final TestCard card;
    private final ParameterDictionary dictionary;
    private final long seed;
    private final double frameRateHz;
    private final SensorSettings sensors;
    private final PilotSettings pilot;

    public SortieSimulator(Airframe airframe, TestCard card, ParameterDictionary dictionary, long seed,
                           double frameRateHz, SensorSettings sensors, PilotSettings pilot) {
        if (!(frameRateHz >= 1 && frameRateHz <= 2000)) {
            throw new IllegalArgumentException("frame rate must be 1 to 2000 Hz, got " + frameRateHz);
        }
        this.airframe = airframe;
        this.card = card;
        this.dictionary = dictionary;
        this.seed = seed;
        this.frameRateHz = frameRateHz;
        this.sensors = sensors;
        this.pilot = pilot;
    }

    /** Flies the sortie, sending each frame that the link does not drop to every sink, in order. */
    public SortieTruth run(List<FrameSink> sinks) {
        SensorSuite suite = new SensorSuite(dictionary, sensors, seed * 31 + 7);
        SortieTelemetry telemetry = new SortieTelemetry(dictionary);
        double[] truth = new double[dictionary.size()];
        Frame frame = Frame.forDictionary(dictionary);
        FrameSink[] out = sinks.toArray(new FrameSink[0]);
        long[] seq = new long[1];
        SortieFlight flight = new SortieFlight(airframe, card, seed, pilot);
        SortieTruth t = flight.fly(frameRateHz, (timeS, model, config) -> {
            telemetry.fill(model, config.gearDown(), config.flap(), truth);
            long timeNs = Math.round(timeS * 1e9);
            if (suite.sample(timeNs, truth, frame)) {
                frame.sequence(seq[0]++);
                frame.addFlags(Frame.SYNTHETIC);
                for (FrameSink s : out) {
                    s.onFrame(frame);
                }
            }
        });
        return new SortieTruth(t.format(), t.airframe(), t.sortie(), t.seed(), t.frameRateHz(), t.durationS(),
                sensors.clean(), suite.framesDropped(), suite.dropouts(), suite.wildPoints(), t.points());
    }

    /**
     * Holds each frame until its data time, scaled by {@code speed}, has come on the wall clock, so a UDP stream
     * plays like a live aircraft ({@code speed} 1) or faster.
     */
    public static FrameSink paced(FrameSink next, double speed, LongSupplier nowNs) {
        if (!(speed > 0)) {
            throw new IllegalArgumentException("speed must be positive, got " + speed);
        }
        return new FrameSink() {
            private long startWallNs = Long.MIN_VALUE;
            private long startDataNs;

            @Override
            public void onFrame(Frame f) {
                if (startWallNs == Long.MIN_VALUE) {
                    startWallNs = nowNs.getAsLong();
                    startDataNs = f.timeNs();
                }
                long due = startWallNs + Math.round((f.timeNs() - startDataNs) / speed);
                long wait;
                while ((wait = due - nowNs.getAsLong()) > 0) {
                    LockSupport.parkNanos(Math.min(wait, 5_000_000L));
                }
                next.onFrame(f);
            }
        };
    }
}
