package org.pointcall.models.detect;

import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Objects;

import org.pointcall.shared.kind.ManoeuvreKind;

/**
 * A physical check of one kind of point where a classifier alone is weak. A rule accumulates what it needs from
 * every {@link PhysicalState} while a candidate point of its kind is tracked, from {@link #start}; the detector
 * {@link #mark marks} it at each tick that still belongs to the point, and the final {@link #outcome} is judged on
 * the state as last marked, so the frames between the point's end and the decision that it ended do not count.
 * {@link #liveOutcome} judges everything seen so far, for live confirmation.
 *
 * <p>Subclasses keep their whole state in the arrays they are given ({@code v} for values, {@code t} for times),
 * which lets the base class mark and judge without knowing them; per sample they allocate nothing.
 */
public abstract class GuardRule {
    private final String name;
    private final ManoeuvreKind kind;
    /** Working values, updated by {@link #onState}. */
    protected final double[] v;
    /** Working times, data time in ns. */
    protected final long[] t;
    private final double[] keptV;
    private final long[] keptT;
    private long startNs = PointEvent.UNKNOWN_NS;

    protected GuardRule(String name, ManoeuvreKind kind, int values, int times) {
        this.name = Objects.requireNonNull(name, "name");
        this.kind = Objects.requireNonNull(kind, "kind");
        this.v = new double[values];
        this.t = new long[times];
        this.keptV = new double[values];
        this.keptT = new long[times];
    }

    /** The rule's name, as used in {@link DetectorSettings#disabledRules()} and in evidence. */
    public final String name() {
        return name;
    }

    /** The kind this instance checks. */
    public final ManoeuvreKind kind() {
        return kind;
    }

    /** Data time the current candidate started, {@link PointEvent#UNKNOWN_NS} before any. */
    public final long startNs() {
        return startNs;
    }

    /** One line on what the rule requires. */
    public abstract String meaning();

    /** Forgets everything: a new candidate starts at {@code timeNs}. */
    public final void start(long timeNs) {
        startNs = timeNs;
        Arrays.fill(t, PointEvent.UNKNOWN_NS);
        clear(v, t);
        mark();
    }

    /**
     * Goes on from {@code other}'s state, a rule of the same check for another kind (a stall that turns out to be
     * a turning one keeps what its AoA-peak rule saw since the entry).
     *
     * @throws IllegalArgumentException when {@code other} is another check
     */
    public final void continueFrom(GuardRule other) {
        if (other.getClass() != getClass() || other.v.length != v.length || other.t.length != t.length) {
            throw new IllegalArgumentException(other.name + " cannot continue as " + name);
        }
        System.arraycopy(other.v, 0, v, 0, v.length);
        System.arraycopy(other.t, 0, t, 0, t.length);
        System.arraycopy(other.keptV, 0, keptV, 0, v.length);
        System.arraycopy(other.keptT, 0, keptT, 0, t.length);
        startNs = other.startNs;
    }

    /** Takes the state of one frame; reads only quantities {@link PhysicalState#fresh fresh} in it. */
    public abstract void onState(PhysicalState state);

    /** Everything seen so far belongs to the point. */
    public final void mark() {
        System.arraycopy(v, 0, keptV, 0, v.length);
        System.arraycopy(t, 0, keptT, 0, t.length);
    }

    /** The verdict on the point as last marked. */
    public final RuleOutcome outcome() {
        return judge(keptV, keptT);
    }

    /** The verdict on everything seen so far. */
    public final RuleOutcome liveOutcome() {
        return judge(v, t);
    }

    /**
     * How far before its candidate's start the rule wants to look, s: a rule whose evidence can precede the
     * classifier's rise (a doublet's first lobe) is given the recent frames again when a candidate starts, as far
     * back as this and the detector's frame history reach. 0 by default: from the start on.
     */
    public double leadS() {
        return 0.0;
    }

    /**
     * Where the point physically began by this rule, on the point as last marked (for example a doublet's first
     * input lobe); {@link PointEvent#UNKNOWN_NS} when the rule does not say. The detector moves an earlier begin
     * there when the rule passed.
     */
    public final long onsetNs() {
        return onset(keptV, keptT);
    }

    /** The onset of one copy of the state; none by default. */
    protected long onset(double[] values, long[] times) {
        return PointEvent.UNKNOWN_NS;
    }

    /** Whether a live {@code PASSED} may confirm an open point (false for rules that only a whole hold can judge). */
    public boolean confirmsLive() {
        return true;
    }

    /** The figures behind the verdict, in the units of the trade, for evidence lines (allocates). */
    public final String explain(boolean live) {
        return live ? describe(v, t) : describe(keptV, keptT);
    }

    /** Adds the key instants the rule found (allocates). */
    public final void keyInstants(boolean live, List<KeyInstant> out) {
        if (live) {
            instants(v, t, out);
        } else {
            instants(keptV, keptT, out);
        }
    }

    /** Resets the working arrays for a new candidate ({@code t} is already filled with UNKNOWN). */
    protected abstract void clear(double[] values, long[] times);

    /** The verdict on one copy of the state. */
    protected abstract RuleOutcome judge(double[] values, long[] times);

    /** Figures of one copy of the state. */
    protected abstract String describe(double[] values, long[] times);

    /** Key instants of one copy of the state; none by default. */
    protected void instants(double[] values, long[] times, List<KeyInstant> out) {
        // no key instants
    }

    /** Radians as degrees with one decimal. */
    protected static String deg(double rad) {
        return String.format(Locale.ROOT, "%.1f", Math.toDegrees(rad));
    }

    /** A number with {@code decimals} decimals. */
    protected static String num(double x, int decimals) {
        return String.format(Locale.ROOT, "%." + decimals + "f", x);
    }

    /** NaN-aware maximum: the first finite value wins over NaN. */
    protected static double max(double current, double x) {
        return Double.isNaN(current) || x > current ? x : current;
    }

    /** NaN-aware minimum. */
    protected static double min(double current, double x) {
        return Double.isNaN(current) || x < current ? x : current;
    }

    @Override
    public String toString() {
        return name + "[" + kind.key() + "]";
    }
}
