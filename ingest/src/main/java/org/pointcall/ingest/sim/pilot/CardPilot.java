package org.pointcall.ingest.sim.pilot;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.SplittableRandom;

import org.pointcall.ingest.sim.airframe.Airframe;
import org.pointcall.ingest.sim.model.FlightModel;
import org.pointcall.ingest.sim.model.TrimPoint;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.card.TestPoint;

/**
 * The simulated test pilot flying one card: the points in card order, each preceded by a transit to its entry
 * condition, then a short straight-and-level leg. Call {@link #start} once with the model initialised at
 * {@link #initialTrim}, then {@link #tick} at the control rate; the pilot sets the model's controls and reports
 * points to its {@link PilotListener}.
 *
 * <p>Gear and flaps are asked for, not set: when {@link #wantedGear()} or {@link #wantedFlap()} differ from the
 * configuration flown, the flight changes it (in steady level flight, while {@link #configurationWindow()} is
 * true) and says so through {@link #configurationChanged}.
 *
 * <p>Everything random (flaws, tracking error, transit headings) comes from the seed: the same seed and the same
 * model give the same commands.
 */
public final class CardPilot {
    private static final double FT = 0.3048;

    private final TestCard card;
    private final PilotListener listener;
    private final Airframe clean;
    private final Envelope envelope;
    private final Map<Integer, Envelope> envelopes = new HashMap<>();
    private final Limits limits;
    private final Loops loops;
    private final TrackingError error;
    private final SensedState state = new SensedState();
    private final List<Flaw> flaws;
    private final SplittableRandom headings;
    private final double climbMaxMps;

    private int index = -1;
    private PointPlan plan;
    private Transit transit;
    private Technique technique;
    private boolean finished;
    private double lastTickS = Double.NaN;
    private double finalLegEndS = Double.NaN;
    private double finalHpM;
    private double finalPsi;
    private int gear;
    private int flap;
    private int gearFlown;
    private int flapFlown;
    private double transitHeading;
    private Airframe flown;
    private String transitLabel;
    private PointPlan transitLabelFor;

    /**
     * @param airframe the airframe flown (clean configuration)
     * @param card     the test card
     * @param settings how imperfect the pilot is
     * @param seed     seed of the flaws, tracking error and transit headings
     * @param listener told about every point as it is flown
     */
    public CardPilot(Airframe airframe, TestCard card, PilotSettings settings, long seed, PilotListener listener) {
        this.card = Objects.requireNonNull(card, "card");
        this.listener = Objects.requireNonNull(listener, "listener");
        Objects.requireNonNull(settings, "settings");
        this.clean = Objects.requireNonNull(airframe, "airframe");
        this.envelope = new Envelope(airframe);
        envelopes.put(0, envelope);
        this.limits = new Limits(card, envelope);
        this.error = new TrackingError(seed ^ 0x3C6EF372FE94F82AL, settings.trackingErrorScale());
        this.loops = new Loops(envelope, limits, error);
        this.headings = new SplittableRandom(seed ^ 0x1F83D9ABFB41BD6BL);
        this.flown = airframe;
        SplittableRandom draws = new SplittableRandom(seed ^ 0x5BE0CD19137E2179L);
        List<Flaw> f = new ArrayList<>();
        for (TestPoint p : card.points()) {
            // two draws per point whatever happens, so one point's flaw never shifts another's
            double u = draws.nextDouble();
            List<Flaw> options = new ArrayList<>(Flaw.applicableTo(p.kind()));
            int pick = draws.nextInt(options.size());
            Flaw drawn = u < settings.flawProbability() ? options.get(pick) : Flaw.NONE;
            f.add(settings.forcedFlaws().getOrDefault(p.id(), drawn));
        }
        this.flaws = List.copyOf(f);
        // the climb rate a transit asks for scales with thrust-to-weight (some 20 m/s for the jet trainer); the
        // energy control gives way to the speed when the engine cannot keep it up
        double tw = airframe.engine().maxThrustSeaLevelN() / (airframe.mass().fullMassKg() * SensedState.G);
        this.climbMaxMps = Loops.clamp(60.0 * tw, 4.0, 25.0);
    }

    /** The flaw each card point will be flown with, in card order. */
    public List<Flaw> flaws() {
        return flaws;
    }

    /**
     * Where the sortie starts: wings level on heading north, 1,000 ft below the first point's entry and a little
     * faster than it, trimmed on {@code model} at its present mass.
     */
    public TrimPoint initialTrim(FlightModel model) {
        PointPlan first = planFor(0, model.massKg());
        double hp = first.hpM - 1000 * FT;
        double cas = Math.min(first.entryCasMps() * 1.15, 0.9 * envelope.maxLevelCasMps(hp, model.massKg()));
        return model.trim(Envelope.tasOfCas(cas, hp), Envelope.geometricM(hp), 0.0);
    }

    private PointPlan planFor(int i, double massKg) {
        return new PointPlan(card.points().get(i), flaws.get(i), this::envelope, limits, massKg);
    }

    /** The pilot's knowledge of a configuration, worked out once. */
    private Envelope envelope(int gearDown, int flapSetting) {
        return envelopes.computeIfAbsent(gearDown * 10 + flapSetting,
                k -> new Envelope(Configuration.of(clean, gearDown, flapSetting)));
    }

    /** Takes over the aircraft as it is (trimmed, its controls set to the trim). */
    public void start(FlightModel model, double timeS) {
        loops.bind(model.airframe(), envelope);
        flown = model.airframe();
        loops.syncTo(model.elevatorRad(), model.aileronRad(), model.rudderRad(), model.throttleLever());
        state.read(model, timeS);
        transitHeading = state.psiRad;
        lastTickS = timeS;
        nextPoint(model.massKg());
    }

    private void nextPoint(double massKg) {
        index++;
        technique = null;
        error.setLooseness(1.0);
        loops.relaxAlphaLimits();
        if (index >= card.points().size()) {
            plan = null;
            transit = null;
            finalLegEndS = state.timeS + 5.0;
            finalHpM = state.hpM;
            finalPsi = state.psiRad;
            gear = 0;
            flap = 0;
            return;
        }
        plan = planFor(index, massKg);
        gear = plan.gear;
        flap = plan.flap;
        // a seeded mix of straight legs, reversals and right-angle turns keeps the sortie in its working area; a
        // turn is flown only on a transit that takes its time anyway (a climb, a descent, a change of speed)
        double u = headings.nextDouble();
        boolean turn = headings.nextBoolean();
        boolean long_ = Math.abs(plan.hpM - state.hpM) > 2000 * FT
                || Math.abs(plan.entryCasMps() - state.casMps) > 40 * 1852.0 / 3600.0;
        if (long_ && u < 0.5) {
            transitHeading = SensedState.wrap(transitHeading + Math.PI);
        } else if (long_ && u < 0.8) {
            transitHeading = SensedState.wrap(transitHeading + (turn ? 0.5 : -0.5) * Math.PI);
        }
        transit = new Transit(plan, loops, limits, transitHeading, climbMaxMps,
                gear == gearFlown && flap == flapFlown);
    }

    /** One control tick at sortie time {@code timeS}: reads the model, decides, sets the model's controls. */
    public void tick(FlightModel model, double timeS) {
        if (model.airframe() != flown) {
            flown = model.airframe();
            loops.bind(flown, envelope(gearFlown, flapFlown));
        }
        double dt = Math.max(1e-6, timeS - lastTickS);
        lastTickS = timeS;
        error.advance(dt);
        state.read(model, timeS);
        if (finished) {
            holdLevel(dt);
        } else if (plan == null) {
            holdLevel(dt);
            finished = timeS >= finalLegEndS;
        } else if (technique == null) {
            if (transit.tick(state, dt)) {
                loops.bind(flown, plan.envelope);
                loops.relaxAlphaLimits();
                technique = techniqueFor(plan);
                error.setLooseness(plan.looseness);
                listener.pointBegun(index, plan.point, plan.flaw, timeS);
                technique.begin(state);
                runTechnique(dt);
            }
        } else {
            runTechnique(dt);
        }
        loops.apply(model);
    }

    private void runTechnique(double dt) {
        if (!technique.tick(state, dt)) {
            listener.pointEnded(state.timeS);
            transitHeading = state.psiRad;
            nextPoint(state.massKg);
        }
    }

    private void holdLevel(double dt) {
        double climb = loops.climbForAltitude(state, finalHpM, 5.0, 5.0);
        loops.pitchNz(state, loops.nzForGamma(state, Loops.gammaForClimb(state, climb)), dt);
        loops.throttleEnergy(state, 0.0, climb, dt);
        loops.rollToBank(state, loops.bankForHeading(state, finalPsi, 20 * Math.PI / 180), 0.2, dt);
        loops.yawBeta(state, 0.0, dt);
    }

    private Technique techniqueFor(PointPlan p) {
        return switch (p.kind) {
            case STALL_LEVEL, STALL_TURN -> new StallTechnique(p, loops, p.envelope, limits, listener);
            case LOOP -> new LoopTechnique(p, loops, p.envelope, limits, listener);
            case WIND_UP_TURN -> new WindUpTurnTechnique(p, loops, p.envelope, limits, listener,
                    p.point.title().toLowerCase(java.util.Locale.ROOT).contains("right") ? 1 : -1);
            case LEVEL_ACCEL -> new LevelAccelTechnique(p, loops, p.envelope, limits, listener);
            case PITCH_DOUBLET -> new DoubletTechnique(p, loops, p.envelope, limits, listener);
            case PHUGOID -> new PhugoidTechnique(p, loops, p.envelope, limits, listener);
            case SIDESLIP -> new SideslipTechnique(p, loops, p.envelope, limits, listener);
            case AILERON_ROLL -> new AileronRollTechnique(p, loops, p.envelope, limits, listener);
            case STABILISED -> new StabilisedTechnique(p, loops, p.envelope, limits, listener);
        };
    }

    /** True once the card is flown and the closing leg is over; the pilot goes on holding level if ticked. */
    public boolean finished() {
        return finished;
    }

    /** Gear the pilot wants: 1 down, 0 up. */
    public int wantedGear() {
        return gear;
    }

    /** Flap selector the pilot wants: 0 up, 1 take-off, 2 landing. */
    public int wantedFlap() {
        return flap;
    }

    /** True while the pilot is in steady level flight waiting for a configuration change. */
    public boolean configurationWindow() {
        return transit != null && technique == null && transit.wantsConfiguration(state);
    }

    /**
     * The flight has re-initialised the model in a new (intermediate or final) configuration at the same speed,
     * altitude and heading: the pilot takes the new trim's controls as its own.
     */
    public void configurationChanged(FlightModel model, int gearNow, int flapNow, boolean complete) {
        flown = model.airframe();
        loops.bind(flown, envelope(gearNow, flapNow));
        loops.syncTo(model.elevatorRad(), model.aileronRad(), model.rudderRad(), model.throttleLever());
        if (complete) {
            gearFlown = gearNow;
            flapFlown = flapNow;
            if (transit != null && gearFlown == gear && flapFlown == flap) {
                transit.configurationDone();
            }
        }
    }

    /**
     * What the pilot is doing: {@code transit to <id>}, the id of the point being flown, {@code closing leg} or
     * {@code done}. The same string object until the activity changes.
     */
    public String activity() {
        String now = plan == null ? (finished ? "done" : "closing leg")
                : technique == null ? null : plan.point.id();
        if (now == null) {
            if (transitLabelFor != plan) {
                transitLabel = "transit to " + plan.point.id();
                transitLabelFor = plan;
            }
            return transitLabel;
        }
        return now;
    }

}
