package org.pointcall.ingest.sim.sortie;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.TreeMap;

import org.pointcall.ingest.sim.airframe.Airframe;
import org.pointcall.ingest.sim.model.FlightModel;
import org.pointcall.ingest.sim.model.NoTrimException;
import org.pointcall.ingest.sim.model.SimulationSettings;
import org.pointcall.ingest.sim.model.TrimPoint;
import org.pointcall.ingest.sim.pilot.CardPilot;
import org.pointcall.ingest.sim.pilot.Configuration;
import org.pointcall.ingest.sim.pilot.Flaw;
import org.pointcall.ingest.sim.pilot.PilotListener;
import org.pointcall.ingest.sim.pilot.PilotSettings;
import org.pointcall.ingest.sim.truth.BandTruth;
import org.pointcall.ingest.sim.truth.PointTruth;
import org.pointcall.ingest.sim.truth.SortieTruth;
import org.pointcall.shared.card.Band;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.card.TestPoint;
import org.pointcall.shared.units.Units;

/**
 * One simulated sortie: the pilot flies the card on a flight model of the airframe, the physics at the model's
 * step rate, the pilot at 100 Hz (or every step when the model steps slower), the observer called at every
 * output frame; the truth of every point is computed from the exact state as it ends.
 *
 * <p>Deterministic: the same airframe, card, seed, settings and frame rate give the same truth and the same
 * observer calls. {@link #fly} may be called again and flies the sortie afresh.
 *
 * <p>Gear and flaps: the flight model has none, so a configuration change is flown as increments on the clean
 * airframe ({@code Configuration}), applied in six stages one second apart, each a new model trimmed at the same
 * speed, altitude, heading, position and fuel, while the pilot holds steady level flight. The state jumps a
 * little at each stage (the new trim's angle of attack, elevator and power); a model with its own high-lift
 * devices would make this unnecessary.
 */
public final class SortieFlight {
    private static final double CONTROL_RATE_HZ = 100.0;
    /** Longest sortie flown before giving up, s of sortie time. */
    private static final double MAX_SORTIE_S = 4.0 * 3600.0;
    private static final double PRE_ROLL_S = 30.0;
    private static final int CONFIG_STAGES = 6;
    private static final double CONFIG_STAGE_S = 1.0;

    private final Airframe airframe;
    private final TestCard card;
    private final long seed;
    private final PilotSettings settings;
    private final SimulationSettings simulation;

    /** A sortie in calm air, the physics at the model's default step rate. */
    public SortieFlight(Airframe airframe, TestCard card, long seed, PilotSettings settings) {
        this(airframe, card, seed, settings,
                SimulationSettings.DEFAULT.withSeed(seed * 0x9E3779B97F4A7C15L + 0x632BE59BD9B4E019L));
    }

    /** A sortie with the model's settings given (step rate, wind, turbulence, the model's own seed). */
    public SortieFlight(Airframe airframe, TestCard card, long seed, PilotSettings settings,
                        SimulationSettings simulation) {
        this.airframe = Objects.requireNonNull(airframe, "airframe");
        this.card = Objects.requireNonNull(card, "card");
        this.seed = seed;
        this.settings = Objects.requireNonNull(settings, "settings");
        this.simulation = Objects.requireNonNull(simulation, "simulation");
    }

    /**
     * Flies the sortie.
     *
     * @param frameRateHz output frames per second, positive and no faster than the physics
     * @param observer    called at every frame, from time 0 to the end of the sortie
     * @return the truth: one point per card point flown, in card order
     */
    public SortieTruth fly(double frameRateHz, FrameObserver observer) {
        Objects.requireNonNull(observer, "observer");
        if (!(frameRateHz > 0.0 && frameRateHz <= simulation.stepRateHz())) {
            throw new IllegalArgumentException("frame rate must be positive and at most the physics rate "
                    + simulation.stepRateHz() + " Hz, got " + frameRateHz);
        }
        return new Run(frameRateHz, observer).fly();
    }

    /** The state of one flight. */
    private final class Run implements PilotListener {
        private final double frameRateHz;
        private final FrameObserver observer;
        private final AircraftConfig config = new AircraftConfig();
        private final Trajectory trajectory = new Trajectory();
        private final List<PointTruth> points = new ArrayList<>();
        private FlightModel model;
        private CardPilot pilot;
        private double stepS;

        // the point in flight
        private TestPoint point;
        private Flaw flaw;
        private double beginS = Double.NaN;
        private double endS = Double.NaN;
        private final Map<String, Double> marks = new LinkedHashMap<>();

        // configuration change in progress
        private int stage = -1;
        private double nextStageS;
        private double gearFrom;
        private double flapFrom;
        private double gearTo;
        private double flapTo;
        private double gearNow;
        private double flapNow;

        Run(double frameRateHz, FrameObserver observer) {
            this.frameRateHz = frameRateHz;
            this.observer = observer;
        }

        SortieTruth fly() {
            model = new FlightModel(airframe, simulation);
            pilot = new CardPilot(airframe, card, settings, seed, this);
            TrimPoint start = pilot.initialTrim(model);
            model.initialise(start, 0.0, 0.0, 0.0);
            stepS = model.stepS();
            // times as step / rate: correctly rounded, so that 40.87 s is written 40.87
            double stepRate = simulation.stepRateHz();
            long controlEvery = Math.max(1L, Math.round(stepRate / CONTROL_RATE_HZ));
            pilot.start(model, 0.0);
            config.activity(pilot.activity());
            long step = 0;
            long frame = 0;
            long maxSteps = (long) (MAX_SORTIE_S / stepS);
            double framesPerStep = frameRateHz / stepRate;
            while (true) {
                double t = step / stepRate;
                if (step % controlEvery == 0) {
                    configure(t);
                    pilot.tick(model, t);
                    config.activity(pilot.activity());
                    record(t);
                    if (pilot.finished()) {
                        break;
                    }
                }
                // frame k belongs to the physics step nearest its instant k / frameRate
                while (Math.round(frame / framesPerStep) == step) {
                    observer.onFrame(frame / frameRateHz, model, config);
                    frame++;
                }
                model.step();
                step++;
                if (step > maxSteps) {
                    throw new IllegalStateException("sortie " + card.sortie() + " did not finish within "
                            + MAX_SORTIE_S + " s (pilot: " + pilot.activity() + ")");
                }
            }
            double duration = step / stepRate;
            return new SortieTruth(SortieTruth.FORMAT, airframe.name(), card.sortie(), seed, frameRateHz, duration,
                    false, 0, 0, 0, points);
        }

        private void record(double t) {
            trajectory.add(t, model, config);
            if (point == null && trajectory.size() > 8192) {
                trajectory.dropBefore(t - PRE_ROLL_S);
            }
            if (point != null && !Double.isNaN(endS)) {
                finishPoint();
            }
        }

        // ---------------------------------------------------------------------------------- configuration

        private void configure(double t) {
            if (stage < 0) {
                int g = pilot.wantedGear();
                int f = pilot.wantedFlap();
                if ((g != (int) gearNow || f != (int) flapNow) && pilot.configurationWindow()) {
                    stage = 0;
                    gearFrom = gearNow;
                    flapFrom = flapNow;
                    gearTo = g;
                    flapTo = f;
                    nextStageS = t;
                    // the selector moves at once; the gear is locked down only at the end
                    config.set(0, f);
                }
                return;
            }
            if (t < nextStageS) {
                return;
            }
            stage++;
            double x = (double) stage / CONFIG_STAGES;
            gearNow = gearFrom + (gearTo - gearFrom) * x;
            flapNow = flapFrom + (flapTo - flapFrom) * x;
            boolean complete = stage == CONFIG_STAGES;
            reinitialise(Configuration.of(airframe, gearNow, flapNow));
            if (complete) {
                config.set((int) gearTo, (int) flapTo);
                stage = -1;
            }
            pilot.configurationChanged(model, (int) Math.round(gearNow), (int) Math.round(flapNow), complete);
            nextStageS = t + CONFIG_STAGE_S;
        }

        private void reinitialise(Airframe a) {
            FlightModel m = new FlightModel(a, simulation);
            m.setFuelMassKg(model.fuelMassKg());
            try {
                TrimPoint trim = m.trim(model.trueAirspeedMps(), model.altitudeM(), 0.0);
                m.initialise(trim, model.northM(), model.eastM(), model.psiRad());
                model = m;
            } catch (NoTrimException e) {
                // no steady flight in the new configuration at this speed: keep flying the old one
            }
        }

        // ------------------------------------------------------------------------------------ pilot events

        @Override
        public void pointBegun(int index, TestPoint p, Flaw f, double timeS) {
            point = p;
            flaw = f;
            beginS = timeS;
            endS = Double.NaN;
            marks.clear();
        }

        @Override
        public void pointMark(String name, double timeS) {
            marks.putIfAbsent(name, timeS);
        }

        @Override
        public void pointEnded(double timeS) {
            endS = timeS;
        }

        private void finishPoint() {
            double end = Math.max(endS, beginS + stepS);
            PointAnalysis.Result r = PointAnalysis.analyse(trajectory, point, beginS, end, marks);
            List<BandTruth> bands = new ArrayList<>();
            boolean all = true;
            for (Band b : point.bands()) {
                BandTruth bt = BandJudge.judge(b, trajectory, beginS, r.throughoutEndS(), r.instants(),
                        r.metricsSi());
                bands.add(bt);
                all &= bt.inside();
            }
            int i = trajectory.indexAt(beginS);
            Map<String, Double> entry = new TreeMap<>();
            entry.put("Hp", Units.mToFt(trajectory.get(Trajectory.HP, i)));
            entry.put("KCAS", Units.mpsToKt(trajectory.get(Trajectory.KCAS, i)));
            entry.put("Mach", trajectory.get(Trajectory.MACH, i));
            entry.put("Nz", trajectory.get(Trajectory.NZ, i));
            entry.put("Heading", Math.toDegrees(trajectory.get(Trajectory.HEADING, i)));
            entry.put("Roll", Math.toDegrees(trajectory.get(Trajectory.ROLL, i)));
            points.add(new PointTruth(point.id(), point.kind().key(), beginS, end, r.instants(), entry,
                    BandJudge.inRegistryUnits(point.kind(), r.metricsSi()), bands, all, flaw.key()));
            point = null;
            beginS = Double.NaN;
            endS = Double.NaN;
        }
    }
}
