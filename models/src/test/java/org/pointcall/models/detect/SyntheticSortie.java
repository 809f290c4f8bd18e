package org.pointcall.models.detect;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;

import org.pointcall.ingest.frame.Frame;
import org.pointcall.shared.dictionary.Parameter;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.kind.ManoeuvreKind;
import org.pointcall.shared.units.Unit;

/**
 * A synthetic stream for detector tests: frames at 100 Hz from a physics function, decision ticks at 20 Hz (after
 * the frame of the same instant, as the feature extractor fires them) from a probability schedule with seeded
 * noise. Collects every event.
 */
final class SyntheticSortie {
    static final long FRAME_NS = 10_000_000L;
    static final long TICK_NS = 50_000_000L;
    static final double TICK_S = TICK_NS / 1e9;
    static final ClassLayout CLASSES = ClassLayout.standard();

    /** Fills one frame at time tS (values in the dictionary's units, deg, kt, ft, g). */
    interface Physics {
        void fill(double tS, Frame f, Slots s);
    }

    /** Frame slots by parameter name. */
    static final class Slots {
        private final Map<String, Integer> slots = new HashMap<>();

        Slots(ParameterDictionary d) {
            for (int i = 0; i < d.size(); i++) {
                slots.put(d.parameter(i).name(), i);
            }
        }

        void set(Frame f, String name, double value) {
            Integer i = slots.get(name);
            if (i != null) {
                f.value(i, value);
            }
        }
    }

    /** A stretch where one kind's raw probability sits at {@code level}. */
    record Bump(ManoeuvreKind kind, double beginS, double endS, double level) {
    }

    /**
     * Class probabilities over time: every kind at a small random base (at most {@code base}), the kind of the bump
     * covering the instant at its level plus uniform noise of half-width {@code noise}, {@code none} takes the rest;
     * normalised to sum 1 only when the kinds alone exceed 1. Draws the same number of random values every tick, so
     * a seed fixes the whole sequence.
     */
    static final class Probabilities {
        private final SplittableRandom random;
        private final double noise;
        private final double base;
        private final Bump[] bumps;

        Probabilities(long seed, double noise, double base, Bump... bumps) {
            this.random = new SplittableRandom(seed);
            this.noise = noise;
            this.base = base;
            this.bumps = bumps;
        }

        void fill(double tS, double[] out) {
            Arrays.fill(out, 0.0);
            double sum = 0;
            for (int c = 0; c < out.length; c++) {
                double u = random.nextDouble();
                double w = random.nextDouble();
                ManoeuvreKind k = CLASSES.kind(c);
                if (k == null) {
                    continue;
                }
                double p = base * u;
                for (Bump b : bumps) {
                    if (b.kind() == k && tS >= b.beginS() && tS < b.endS()) {
                        p = Math.max(0.0, Math.min(1.0, b.level() + noise * (2 * w - 1)));
                    }
                }
                out[c] = p;
                sum += p;
            }
            int none = CLASSES.noneIndex();
            if (sum <= 1.0) {
                out[none] = 1.0 - sum;
            } else {
                for (int c = 0; c < out.length; c++) {
                    out[c] /= sum;
                }
            }
        }
    }

    final ParameterDictionary dictionary;
    final Slots slots;
    final List<PointEvent> events = new ArrayList<>();
    final PointDetector detector;
    private final Frame frame;
    private final double[] p = new double[CLASSES.size()];
    private long k;

    /**
     * A synthetic sortie with {@code hold-signature} switched off: these sorties pad each manoeuvre with perfectly
     * steady level flight, which that rule rightly takes for a stabilised point; tests of the other rules do not want
     * it. {@link #withHolds} keeps it.
     */
    SyntheticSortie(DetectorSettings settings) {
        this(settings, dictionary());
    }

    SyntheticSortie(DetectorSettings settings, ParameterDictionary d) {
        this(settings, d, false);
    }

    private SyntheticSortie(DetectorSettings settings, ParameterDictionary d, boolean holds) {
        this.dictionary = d;
        this.slots = new Slots(d);
        this.frame = Frame.forDictionary(d);
        DetectorSettings st = settings;
        if (!holds) {
            java.util.Set<String> off = new java.util.HashSet<>(settings.disabledRules());
            off.add(BoundaryRules.HOLD_SIGNATURE);
            st = settings.withDisabledRules(off);
        }
        this.detector = PointDetector.bind(d, CLASSES, st, events::add);
        detector.init(0L);
    }

    /** A synthetic sortie whose detector keeps {@code hold-signature} (as the settings say). */
    static SyntheticSortie withHolds(DetectorSettings settings) {
        return new SyntheticSortie(settings, dictionary(), true);
    }

    /** The test dictionary: the quantities the rules read, in the trade's units, minus {@code omit}. */
    static ParameterDictionary dictionary(String... omit) {
        List<String> skip = List.of(omit);
        List<Parameter> ps = new ArrayList<>();
        add(ps, skip, "AoA", Unit.DEGREE, -30, 60);
        add(ps, skip, "AoS", Unit.DEGREE, -30, 30);
        add(ps, skip, "Pitch", Unit.DEGREE, -90, 90);
        add(ps, skip, "Roll", Unit.DEGREE, -180, 180);
        add(ps, skip, "Heading", Unit.DEGREE, 0, 360);
        add(ps, skip, "P", Unit.DEGREE_PER_SECOND, -400, 400);
        add(ps, skip, "Q", Unit.DEGREE_PER_SECOND, -200, 200);
        add(ps, skip, "Nz", Unit.G, -5, 10);
        add(ps, skip, "KCAS", Unit.KNOT, 0, 700);
        add(ps, skip, "Mach", Unit.MACH, 0, 2);
        add(ps, skip, "Hp", Unit.FOOT, -2000, 60000);
        add(ps, skip, "Throttle", Unit.PERCENT, 0, 100);
        return new ParameterDictionary("detector test", ps);
    }

    private static void add(List<Parameter> ps, List<String> skip, String name, Unit unit, double min, double max) {
        if (!skip.contains(name)) {
            ps.add(new Parameter(name, unit, "", 100.0, min, max, null, null, null));
        }
    }

    /** Steady level flight: 250 kt, 10,000 ft, 1 g, wings level. */
    static void level(double tS, Frame f, Slots s) {
        s.set(f, "AoA", 4.0);
        s.set(f, "AoS", 0.0);
        s.set(f, "Pitch", 3.0);
        s.set(f, "Roll", 0.0);
        s.set(f, "Heading", 90.0);
        s.set(f, "P", 0.0);
        s.set(f, "Q", 0.0);
        s.set(f, "Nz", 1.0);
        s.set(f, "KCAS", 250.0);
        s.set(f, "Mach", 0.45);
        s.set(f, "Hp", 10000.0);
    }

    /** Runs until {@code toS} (exclusive); {@code physics} may be null (frames then hold only NaN). */
    SyntheticSortie run(double toS, Probabilities probs, Physics physics) {
        long endNs = Math.round(toS * 1e9);
        while (k * FRAME_NS < endNs) {
            long t = k * FRAME_NS;
            double tS = t / 1e9;
            frame.clear();
            frame.timeNs(t);
            frame.sequence(k);
            if (physics != null) {
                physics.fill(tS, frame, slots);
            }
            detector.onFrame(frame);
            if (t % TICK_NS == 0) {
                probs.fill(tS, p);
                detector.onTick(t, p);
            }
            k++;
        }
        return this;
    }

    SyntheticSortie finish() {
        detector.finish(k * FRAME_NS);
        return this;
    }

    List<PointEvent> ofType(PointEvent.Type type) {
        List<PointEvent> out = new ArrayList<>();
        for (PointEvent e : events) {
            if (e.type() == type) {
                out.add(e);
            }
        }
        return out;
    }

    List<PointEvent.Type> types() {
        List<PointEvent.Type> out = new ArrayList<>();
        for (PointEvent e : events) {
            out.add(e.type());
        }
        return out;
    }

    /** The one final event (ENDED or DISCARDED), failing when there is not exactly one. */
    PointEvent onlyFinal() {
        List<PointEvent> fin = new ArrayList<>();
        for (PointEvent e : events) {
            if (e.isFinal()) {
                fin.add(e);
            }
        }
        assertEquals(1, fin.size(), () -> "one final event expected, got " + events);
        return fin.get(0);
    }

    /**
     * Each point says BEGUN, then REFINED any number of times, then one final event; events are in data-time order;
     * at most one point is open at any time; kept points do not overlap.
     */
    static void assertWellFormed(List<PointEvent> events) {
        long open = 0;
        long lastReported = Long.MIN_VALUE;
        long lastKeptEnd = Long.MIN_VALUE;
        long lastId = 0;
        for (PointEvent e : events) {
            assertTrue(e.reportedAtNs() >= lastReported, () -> "events out of time order at " + e);
            lastReported = e.reportedAtNs();
            switch (e.type()) {
                case BEGUN:
                    if (open != 0) {
                        fail("point " + e.pointId() + " began while point " + open + " was open");
                    }
                    assertEquals(lastId + 1, e.pointId(), "point ids count up");
                    lastId = e.pointId();
                    open = e.pointId();
                    assertTrue(e.beginNs() >= lastKeptEnd, () -> "point " + e.pointId() + " overlaps the one before");
                    break;
                case REFINED:
                    assertEquals(open, e.pointId(), () -> "REFINED for a point not open: " + e);
                    break;
                default:
                    assertEquals(open, e.pointId(), () -> e.type() + " for a point not open: " + e);
                    open = 0;
                    if (e.type() == PointEvent.Type.ENDED) {
                        lastKeptEnd = e.endNs();
                    }
            }
        }
    }
}
