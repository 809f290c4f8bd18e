package org.pointcall.models.detect;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.Objects;

import org.pointcall.ingest.frame.Frame;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.kind.ManoeuvreKind;
import org.pointcall.shared.units.Units;

/**
 * The streaming point detector: {@link Smoother smoothing}, one {@link Hysteresis} per kind on the smoothed
 * probability (enter and leave), one debounced threshold per kind on the raw probability (where begin and end lie),
 * merging of short gaps, one open point at a time with takeover and {@link KindSwitch kind switches}, minimum
 * durations and {@link GuardRule guard rules}. See the package documentation for the sequence of decisions.
 *
 * <p>Per tick the work is O(classes) and per frame O(bound quantities + rules of tracked kinds); nothing is
 * allocated in either except when an event is emitted. Single-threaded.
 */
public final class PointDetector implements Detector {
    private static final long NONE = PointEvent.UNKNOWN_NS;
    private static final int IDLE = 0;
    private static final int ACTIVE = 1;
    private static final int CLOSING = 2;
    private static final int MAX_FEATURES = 8;

    private final ClassLayout classes;
    private final DetectorSettings settings;
    private final DetectorListener listener;
    private final StateBinder binder;
    private final PhysicalState state = new PhysicalState();
    private final Smoother smoother;

    private final int[] kindClasses;
    private final Hysteresis[] channel;
    private final Hysteresis[] edge;
    /** Per kind, the lower entry of {@code physics-entry}: enough when the kind's live rules have passed. */
    private final Hysteresis[] assist;
    private final boolean[] assisted;
    private boolean pointAssisted;
    private final GuardRule[][] rules;
    private final long[] candidateNs;
    private final double[] confSum;
    private final long[] confCount;
    private final double[] keptSum;
    private final long[] keptCount;
    private final double[] smoothed;
    private final String[] features = new String[MAX_FEATURES];
    /** Frames kept for rules that look back ({@link GuardRule#leadS()}): a ring of whole physical states. */
    static final int HISTORY_FRAMES = 1024;
    private final long[] historyNs = new long[HISTORY_FRAMES];
    private final double[] historyValues = new double[HISTORY_FRAMES * PhysicalQuantity.COUNT];
    private final long[] historySampledNs = new long[HISTORY_FRAMES * PhysicalQuantity.COUNT];
    private int historyNext;
    private int historySize;
    private final PhysicalState replay = new PhysicalState();
    /** The recent states at 20 Hz for the boundary rules, and their work. */
    private final PhysicsHistory physics = new PhysicsHistory();
    private final BoundaryRefiner refiner;
    private final boolean[] departs;
    private final boolean[] recovers;
    private final boolean[] accelerates;
    private final boolean[] gains;
    /** {@code accel-level} applies to the class. */
    private final boolean[] level;
    /**
     * {@code accel-level}: the largest altitude drift of a level acceleration, m/s (100 ft/min; common practice
     * flies it within about 100 ft of the test altitude over a run of a minute or more).
     */
    static final double LEVEL_DRIFT_MPS = 100 * Units.M_PER_FT / 60;
    /** {@code accel-settled-entry} applies to the class. */
    private final boolean[] settlesFirst;
    /** {@code accel-settled-entry}: the stretch before the begin that must be settled, ns... */
    static final long SETTLED_ENTRY_NS = 5_000_000_000L;
    /** ...for at least this share of its states. */
    static final double SETTLED_SHARE = 0.9;
    private final boolean[] holds;
    private final long[] gapNs;
    private final long recoveryWaitNs;
    private final long accelWaitNs;
    /** Checks for the physical end while a point waits for it, at most this often. */
    private static final long END_CHECK_NS = 250_000_000L;
    /** A manoeuvre's core (a stall's break) is looked for up to this long after the classifier's end, ns. */
    private static final long CORE_AFTER_END_NS = 10_000_000_000L;

    /** {@code doublet-signature}: doublets found in the pitch rate alone; -1 when off or not a class. */
    private final DoubletWatch doublets = new DoubletWatch();
    private final int doubletClass;
    /** The open point was opened by the doublet watch, not the classifier. */
    private boolean physicsPoint;
    /** Why the watch gave up on the open physics point; it is then discarded. */
    private String physicsFailure;
    /** {@code roll-signature}: rolls found in the roll rate and bank alone; -1 when off or not a class. */
    private final RollWatch rolls = new RollWatch();
    private final HoldWatch holdWatch = new HoldWatch();
    /** Class of the stabilised point when {@code hold-signature} applies, else -1. */
    private final int holdClass;
    /** The open point is a hold found by {@code hold-signature}. */
    private boolean physicsHold;
    /** Start of the steady run the open physics hold was begun on. */
    private long holdRunNs = NONE;
    /** A run of steady flight must last the stabilised point's minimum duration before it is one. */
    private final long holdMinNs;
    private final int rollClass;
    /** The open point was opened by the roll watch. */
    private boolean physicsRoll;
    /** Per class, entry refused until its smoothed probability has fallen below p_off (a point the physics took). */
    private final boolean[] muted;
    /** The muted class waits at least until then: its windows still hold the input the physics found. */
    private final long[] muteUntilNs;
    /** How long after a physics doublet's release the classifier's windows may still see its input (12 s). */
    static final long MUTE_AFTER_RELEASE_NS = 12_000_000_000L;
    /** Before the input a doublet point holds this much trimmed flight: the analysis takes its trim from it, ns. */
    static final long DOUBLET_LEAD_NS = 2_000_000_000L;
    /** A point found by the physics alone has no probability behind it: its confidence. */
    static final double PHYSICS_CONFIDENCE = 0.75;

    private final long maxRefineNs;
    private final long mergeGapNs;
    private final long maxTickGapNs;
    private final double edgeProbability;
    private final double switchMargin;

    private long floorNs = NONE;
    private long lastTickNs = NONE;
    private long lastFrameNs = NONE;
    private long lastEndNs = NONE;

    private int phase = IDLE;
    /** The open point has left and waits for its physical end (boundary rules). */
    private boolean waiting;
    private long lastEndCheckNs;
    private long physicalEndNs;
    /** The open point's begin as the classifier placed it, where the boundary rules look from. */
    private long classifierBeginNs;
    private int pointClass = -1;
    private long pointId;
    private long beginNs;
    private long begunAtNs;
    private long leaveNs;
    private long endEstimateNs;
    private boolean confirmed;
    private int merges;
    private int featureCount;
    private String switchNote;

    private long ticksAccepted;
    private long ticksRejected;
    private long framesRejected;
    private long tickGaps;
    private long eventsEmitted;
    private long refusals;

    /**
     * @param binder   fills the physical state from frames
     * @param classes  what each probability is
     * @param settings thresholds and times
     * @param listener receives the events
     */
    public PointDetector(StateBinder binder, ClassLayout classes, DetectorSettings settings,
                         DetectorListener listener) {
        this.binder = Objects.requireNonNull(binder, "binder");
        this.classes = Objects.requireNonNull(classes, "classes");
        this.settings = Objects.requireNonNull(settings, "settings");
        this.listener = Objects.requireNonNull(listener, "listener");
        int n = classes.size();
        this.smoother = settings.smoothing().create(settings.smoothingS(), n);
        this.smoothed = new double[n];
        this.channel = new Hysteresis[n];
        this.edge = new Hysteresis[n];
        this.assist = new Hysteresis[n];
        this.assisted = new boolean[n];
        this.rules = new GuardRule[n][];
        this.candidateNs = new long[n];
        this.confSum = new double[n];
        this.confCount = new long[n];
        this.keptSum = new double[n];
        this.keptCount = new long[n];
        int kinds = 0;
        for (int c = 0; c < n; c++) {
            if (classes.kind(c) != null) {
                kinds++;
            }
        }
        this.kindClasses = new int[kinds];
        int i = 0;
        for (int c = 0; c < n; c++) {
            ManoeuvreKind k = classes.kind(c);
            if (k == null) {
                rules[c] = new GuardRule[0];
                continue;
            }
            kindClasses[i++] = c;
            channel[c] = new Hysteresis(settings.enterProbability(), settings.enterS(), settings.leaveProbability(),
                    settings.leaveS());
            edge[c] = new Hysteresis(settings.edgeProbability(), settings.edgeDebounceS(),
                    settings.edgeProbability(), settings.edgeDebounceS());
            rules[c] = GuardRules.forKind(k, settings);
            BoundarySettings bs = settings.boundaries();
            assist[c] = new Hysteresis(bs.assistEnterProbability(), settings.enterS(), bs.assistLeaveProbability(),
                    settings.leaveS());
            assisted[c] = BoundaryRules.applies(BoundaryRules.PHYSICS_ENTRY, k, settings);
        }
        this.maxRefineNs = Math.round(settings.maxRefineS() * 1e9);
        this.mergeGapNs = Math.round(settings.mergeGapS() * 1e9);
        this.maxTickGapNs = Math.round(settings.maxTickGapS() * 1e9);
        this.edgeProbability = settings.edgeProbability();
        this.switchMargin = settings.switchMargin();
        this.refiner = new BoundaryRefiner(physics, settings.boundaries());
        this.departs = new boolean[n];
        this.recovers = new boolean[n];
        this.accelerates = new boolean[n];
        this.gains = new boolean[n];
        this.settlesFirst = new boolean[n];
        this.level = new boolean[n];
        this.holds = new boolean[n];
        this.gapNs = new long[n];
        long fragmentNs = Math.round(settings.boundaries().fragmentGapS() * 1e9);
        for (int c = 0; c < n; c++) {
            ManoeuvreKind k = classes.kind(c);
            gapNs[c] = mergeGapNs;
            if (k == null) {
                continue;
            }
            departs[c] = BoundaryRules.applies(BoundaryRules.BEGIN_DEPARTURE, k, settings);
            recovers[c] = BoundaryRules.applies(BoundaryRules.END_RECOVERY, k, settings);
            accelerates[c] = BoundaryRules.applies(BoundaryRules.ACCEL_EXTENT, k, settings);
            gains[c] = BoundaryRules.applies(BoundaryRules.ACCEL_GAIN, k, settings);
            settlesFirst[c] = BoundaryRules.applies(BoundaryRules.ACCEL_SETTLED_ENTRY, k, settings);
            level[c] = BoundaryRules.applies(BoundaryRules.ACCEL_LEVEL, k, settings);
            holds[c] = BoundaryRules.applies(BoundaryRules.STABILISED_EXTENT, k, settings);
            if (BoundaryRules.applies(BoundaryRules.FRAGMENT_MERGE, k, settings)) {
                gapNs[c] = Math.max(mergeGapNs, fragmentNs);
            }
        }
        int d = classes.indexOf(ManoeuvreKind.PITCH_DOUBLET);
        this.doubletClass = d >= 0 && BoundaryRules.applies(BoundaryRules.DOUBLET_SIGNATURE,
                ManoeuvreKind.PITCH_DOUBLET, settings) ? d : -1;
        int r = classes.indexOf(ManoeuvreKind.AILERON_ROLL);
        this.rollClass = r >= 0 && BoundaryRules.applies(BoundaryRules.ROLL_SIGNATURE, ManoeuvreKind.AILERON_ROLL,
                settings) ? r : -1;
        int h = classes.indexOf(ManoeuvreKind.STABILISED);
        this.holdClass = h >= 0 && BoundaryRules.applies(BoundaryRules.HOLD_SIGNATURE, ManoeuvreKind.STABILISED,
                settings) ? h : -1;
        this.holdMinNs = Math.round(settings.minDurationS(ManoeuvreKind.STABILISED) * 1e9);
        this.muted = new boolean[n];
        this.muteUntilNs = new long[n];
        this.recoveryWaitNs = Math.round(settings.boundaries().recoveryWaitS() * 1e9);
        this.accelWaitNs = Math.round(settings.boundaries().accelWaitS() * 1e9);
        resetRun(NONE);
    }

    /** Binds quantities to the dictionary's default names ({@link StateBinder#bind(ParameterDictionary)}). */
    public static PointDetector bind(ParameterDictionary dictionary, ClassLayout classes, DetectorSettings settings,
                                     DetectorListener listener) {
        return new PointDetector(StateBinder.bind(dictionary), classes, settings, listener);
    }

    @Override
    public void init(long timeNs) {
        resetRun(timeNs);
    }

    private void resetRun(long timeNs) {
        floorNs = timeNs;
        lastTickNs = NONE;
        lastFrameNs = NONE;
        lastEndNs = NONE;
        phase = IDLE;
        waiting = false;
        pointClass = -1;
        pointId = 0;
        physics.clear();
        doublets.clear();
        rolls.clear();
        physicsRoll = false;
        holdWatch.clear();
        physicsHold = false;
        physicsPoint = false;
        physicsFailure = null;
        java.util.Arrays.fill(muted, false);
        featureCount = 0;
        switchNote = null;
        smoother.reset();
        state.clear();
        historyNext = 0;
        historySize = 0;
        for (int c : kindClasses) {
            channel[c].reset();
            assist[c].reset();
            edge[c].reset();
            candidateNs[c] = NONE;
            restart(c, NONE);
        }
    }

    @Override
    public void onFrame(Frame frame) {
        long t = frame.timeNs();
        if (lastFrameNs != NONE && t <= lastFrameNs || floorNs != NONE && t < floorNs) {
            framesRejected++;
            return;
        }
        lastFrameNs = t;
        binder.fill(frame, state);
        physics.add(state);
        if (doubletClass >= 0) {
            doublets.onState(state);
        }
        if (rollClass >= 0) {
            rolls.onState(state);
        }
        if (holdClass >= 0) {
            holdWatch.onState(state);
        }
        historyNs[historyNext] = t;
        state.copyTo(historyValues, historySampledNs, historyNext * PhysicalQuantity.COUNT);
        historyNext = (historyNext + 1) % HISTORY_FRAMES;
        if (historySize < HISTORY_FRAMES) {
            historySize++;
        }
        for (int c : kindClasses) {
            if (tracking(c)) {
                GuardRule[] rs = rules[c];
                for (int r = 0; r < rs.length; r++) {
                    rs[r].onState(state);
                }
            }
        }
    }

    @Override
    public void onTick(long timeNs, double[] classProbabilities) {
        onTick(timeNs, classProbabilities, null);
    }

    @Override
    public void onTick(long timeNs, double[] p, String[] topFeatures) {
        if (p.length != smoothed.length) {
            throw new IllegalArgumentException("expected " + smoothed.length + " class probabilities "
                    + classes.names() + ", got " + p.length);
        }
        if (lastTickNs != NONE && timeNs <= lastTickNs || floorNs != NONE && timeNs < floorNs) {
            ticksRejected++;
            return;
        }
        for (int c = 0; c < p.length; c++) {
            if (!Double.isFinite(p[c])) {
                ticksRejected++;
                return;
            }
        }
        if (lastTickNs != NONE && timeNs - lastTickNs > maxTickGapNs) {
            tickGap();
        }
        lastTickNs = timeNs;
        ticksAccepted++;
        smoother.smooth(timeNs, p, smoothed);
        for (int c : kindClasses) {
            if (muted[c] && timeNs >= muteUntilNs[c] && smoothed[c] < settings.leaveProbability()) {
                muted[c] = false;
            }
            channel[c].update(timeNs, smoothed[c]);
            assist[c].update(timeNs, smoothed[c]);
            edge[c].update(timeNs, p[c]);
            boolean owned = phase != IDLE && c == pointClass;
            if (!owned) {
                long cand = edge[c].riseNs();
                if (cand != candidateNs[c]) {
                    candidateNs[c] = cand;
                    restart(c, cand);
                }
            }
            if (owned || candidateNs[c] != NONE) {
                confSum[c] += smoothed[c];
                confCount[c]++;
                if (p[c] > edgeProbability) {
                    keptSum[c] = confSum[c];
                    keptCount[c] = confCount[c];
                    GuardRule[] rs = rules[c];
                    for (int r = 0; r < rs.length; r++) {
                        rs[r].mark();
                    }
                }
            }
        }
        decide(timeNs, topFeatures);
    }

    private boolean tracking(int c) {
        return phase != IDLE && c == pointClass || candidateNs[c] != NONE;
    }

    private void restart(int c, long atNs) {
        GuardRule[] rs = rules[c];
        for (int r = 0; r < rs.length; r++) {
            rs[r].start(atNs);
            if (atNs != NONE && rs[r].leadS() > 0) {
                lookBack(rs[r], atNs - Math.round(rs[r].leadS() * 1e9));
            }
        }
        confSum[c] = 0;
        confCount[c] = 0;
        keptSum[c] = 0;
        keptCount[c] = 0;
    }

    /** Gives {@code rule} the kept frames from {@code fromNs} on, oldest first (what the frames so far showed). */
    private void lookBack(GuardRule rule, long fromNs) {
        int oldest = (historyNext - historySize + HISTORY_FRAMES) % HISTORY_FRAMES;
        for (int i = 0; i < historySize; i++) {
            int slot = (oldest + i) % HISTORY_FRAMES;
            if (historyNs[slot] < fromNs) {
                continue;
            }
            replay.loadFrom(historyNs[slot], historyValues, historySampledNs, slot * PhysicalQuantity.COUNT);
            rule.onState(replay);
        }
    }

    private void tickGap() {
        // after a silence, entry must be earned again from fresh data; the open point keeps its own timers
        tickGaps++;
        smoother.reset();
        for (int c : kindClasses) {
            if (phase == IDLE || c != pointClass) {
                channel[c].reset();
                assist[c].reset();
                edge[c].reset();
            }
        }
    }

    private void decide(long now, String[] top) {
        if (physicsRoll) {
            followPhysicsRoll(now, top);
            return;
        }
        if (rollClass >= 0 && rolls.found()) {
            if (phase != IDLE && !physicsPoint && pointClass != rollClass && rolls.startNs() > beginNs) {
                // a full roll is a manoeuvre of its own: the point still open (a speed-up waiting for its end) ends
                // where the roll began, and the roll is the next point
                long end = phase == CLOSING ? Math.min(endEstimateNs, rolls.startNs()) : rolls.startNs();
                close(now, end, "ended when " + BoundaryRules.ROLL_SIGNATURE + " found a roll", rolls.startNs());
            }
            if (phase == IDLE && (lastEndNs == NONE || rolls.startNs() >= lastEndNs)) {
                beginPhysicsRoll(now);
                followPhysicsRoll(now, top);
                return;
            }
            // seen inside another point: the classifier's own roll, or a manoeuvre with a roll in it
            rolls.reset();
        }
        if (physicsPoint) {
            followPhysicsPoint(now);
            return;
        }
        if (doubletClass >= 0 && doublets.status() != DoubletWatch.SEARCHING) {
            boolean fresh = doublets.status() != DoubletWatch.FAILED
                    && (lastEndNs == NONE || doublets.inputNs() > lastEndNs);
            if (phase == IDLE && fresh) {
                beginPhysicsDoublet(now);
                followPhysicsPoint(now);
                return;
            }
            if (phase != IDLE && pointClass == doubletClass && fresh
                    && doublets.inputNs() >= beginNs - DOUBLET_LEAD_NS - maxRefineNs) {
                adoptPhysicsDoublet(now);
                followPhysicsPoint(now);
                return;
            }
            // found while another point was open, or given up: not a point of its own
            doublets.reset();
        }
        if (physicsHold) {
            followPhysicsHold(now, top);
            return;
        }
        if (phase == IDLE) {
            int c = strongestOn(-1);
            if (c >= 0) {
                begin(c, now, top);
            } else if (holdClass >= 0 && holdWatch.holding()) {
                long b = holdWatch.steadySinceNs();
                if (lastEndNs != NONE) {
                    b = Math.max(b, lastEndNs);
                }
                // a hold begins once the flight is stabilised, STABILISE_NS into the steady run (as the card
                // session shows one begun), and lasts the stabilised minimum from there
                if (holdWatch.lastSteadyNs() - b >= holdMinNs + STABILISE_NS) {
                    beginPhysicsHold(now, b + STABILISE_NS);
                }
            }
            return;
        }
        int k = pointClass;
        if (phase == ACTIVE) {
            if (gate(k).isOn()) {
                int j = strongestOn(k);
                if (j >= 0 && smoothed[j] > smoothed[k] + switchMargin) {
                    takeOver(k, j, now, top);
                } else {
                    confirmIfReady(now);
                }
                return;
            }
            phase = CLOSING;
            leaveNs = gate(k).edgeNs();
            endEstimateNs = fallEstimate(k);
        }
        if (gate(k).isOn()) {
            if (gate(k).edgeNs() - leaveNs <= gapNs[k] || waiting) {
                // back within the gap, or while the point still waited for its physical end: the same point
                phase = ACTIVE;
                waiting = false;
                physicalEndNs = NONE;
                merges++;
            } else {
                close(now, endEstimateNs, null, NONE);
                begin(k, now, top);
            }
            return;
        }
        if (!edge[k].isOn() || edge[k].pendingNs() != NONE) {
            // once the raw probability is back above the edge for good, the fall found before stands
            endEstimateNs = fallEstimate(k);
        }
        int j = strongestOn(k);
        if (j >= 0 && recovers[k] && settings.allowsSwitch(classes.kind(k), classes.kind(j))) {
            // a kind the closing point may become, while it still waits for its physical end: the same manoeuvre
            // seen again (a turning stall lost before its break, its recovery called a stall)
            switchWhileClosing(k, j, now, top);
            return;
        }
        if (j >= 0) {
            close(now, endEstimateNs, null, riseEstimate(j));
            begin(j, now, top);
            return;
        }
        long rising = gate(k).pendingNs();
        boolean riseInGap = rising != NONE && rising - leaveNs <= gapNs[k];
        if (now - leaveNs > gapNs[k] && !riseInGap) {
            if (!physicalEndKnown(k, now)) {
                waiting = true;
                return;
            }
            close(now, endEstimateNs, null, NONE);
        }
    }

    /**
     * For a kind whose end a boundary rule places: true once that end has been seen (kept in physicalEndNs), or the
     * wait for it is over; true at once for other kinds. Checked at most every {@link #END_CHECK_NS}.
     */
    private boolean physicalEndKnown(int k, long now) {
        if (!recovers[k] && !accelerates[k] && !holds[k]) {
            return true;
        }
        long wait = recovers[k] ? recoveryWaitNs : accelWaitNs;
        if (now - endEstimateNs > wait || !refiner.canPlaceEnd(classes.kind(k))) {
            return true;
        }
        if (waiting && now - lastEndCheckNs < END_CHECK_NS) {
            return false;
        }
        lastEndCheckNs = now;
        physicalEndNs = physicalEnd(k, now);
        return physicalEndNs != NONE;
    }

    /** The end a boundary rule places for kind {@code k}'s open point, seen by {@code now}; NONE if none yet. */
    private long physicalEnd(int k, long now) {
        if (accelerates[k]) {
            return refiner.accelEnd(beginNs, now);
        }
        if (holds[k]) {
            return refiner.holdEnd(beginNs, endEstimateNs, now);
        }
        return refiner.recoveryEnd(classes.kind(k), beginNs, endEstimateNs + CORE_AFTER_END_NS, now);
    }

    /**
     * The begin-departure search's anchor: the classifier's begin, or for a stall the start of the steady slowing
     * that holds it (the classifier may rise late in a long entry).
     */
    private long departureAnchor(int c, long b) {
        ManoeuvreKind k = classes.kind(c);
        if (k == ManoeuvreKind.STALL_LEVEL || k == ManoeuvreKind.STALL_TURN) {
            long d = refiner.decelBegin(b, lastEndNs);
            if (d != NONE) {
                return d;
            }
        }
        return b;
    }

    /**
     * The departure anchor once the point is over: for a stall whose break is known, the start of the steady
     * slowing that runs into the break (a slow set-up before the entry, in the approach configuration, is its own
     * run of slowing, separate from the entry by a steady stretch); else as live.
     */
    private long finalAnchor(int c, ManoeuvreKind kind, long b, long end) {
        if (kind == ManoeuvreKind.STALL_LEVEL || kind == ManoeuvreKind.STALL_TURN) {
            long brk = refiner.stallBreak(kind, b, end);
            if (brk != NONE) {
                long d = refiner.decelBegin(brk - BREAK_LEAD_NS, lastEndNs);
                if (d != NONE) {
                    return d;
                }
            }
        }
        return departureAnchor(c, b);
    }

    /** The entry's slowing is looked for this long before the break (the break itself may be slowing no more). */
    private static final long BREAK_LEAD_NS = 1_000_000_000L;

    /** The switch that keeps the open point on: its channel, or the lower one it entered by with its rules. */
    private Hysteresis gate(int k) {
        return pointAssisted ? assist[k] : channel[k];
    }

    /** Kind {@code c} has entered: its channel is on, or its lower one with every live rule of it passed. */
    private boolean entered(int c) {
        if (muted[c]) {
            return false;
        }
        if (channel[c].isOn()) {
            return true;
        }
        if (!assisted[c] || !assist[c].isOn() || candidateNs[c] == NONE) {
            return false;
        }
        GuardRule[] rs = rules[c];
        boolean any = false;
        for (int r = 0; r < rs.length; r++) {
            if (rs[r].confirmsLive()) {
                if (rs[r].liveOutcome() != RuleOutcome.PASSED) {
                    return false;
                }
                any = true;
            }
        }
        return any;
    }

    /** The class with its channel on and the highest smoothed probability, other than {@code except}; or -1. */
    private int strongestOn(int except) {
        int best = -1;
        for (int c : kindClasses) {
            if (c != except && entered(c) && (best < 0 || smoothed[c] > smoothed[best])) {
                best = c;
            }
        }
        return best;
    }

    /** Where the raw probability of the open point's kind fell below the edge, near the leave. */
    private long fallEstimate(int k) {
        long f = edge[k].fallNs();
        if (f == NONE || f < beginNs) {
            f = leaveNs;
        }
        f = Math.max(leaveNs - maxRefineNs, Math.min(leaveNs + maxRefineNs, f));
        return Math.max(f, beginNs);
    }

    /** Where the raw probability of class {@code c} rose above the edge, within reach of its entry. */
    private long riseEstimate(int c) {
        long anchor = (channel[c].isOn() ? channel[c] : assist[c]).edgeNs();
        long rise = edge[c].riseNs();
        if (rise == NONE || rise > anchor) {
            rise = anchor;
        }
        return Math.max(rise, anchor - maxRefineNs);
    }

    private void begin(int c, long now, String[] top) {
        long b = riseEstimate(c);
        if (lastEndNs != NONE) {
            b = Math.max(b, lastEndNs);
        }
        classifierBeginNs = b;
        pointAssisted = !channel[c].isOn();
        String moved = null;
        long physical = departs[c] ? refiner.departureBegin(departureAnchor(c, b), lastEndNs, now)
                : accelerates[c] ? refiner.accelBegin(b, lastEndNs) : NONE;
        if (physical != NONE && physical <= now) {
            moved = "begin at " + (departs[c] ? BoundaryRules.BEGIN_DEPARTURE : BoundaryRules.ACCEL_EXTENT) + " "
                    + seconds(physical) + " s, the classifier's " + seconds(b) + " s";
            b = physical;
        }
        if (settlesFirst[c] && refiner.settledShare(b - SETTLED_ENTRY_NS, b) < SETTLED_SHARE) {
            // accel-settled-entry, live: a speed-up out of another manoeuvre is not begun at all, so it does not
            // hold the next point up while it waits for its end; refused until the classifier lets go of it
            muted[c] = true;
            muteUntilNs[c] = now;
            refusals++;
            return;
        }
        if (candidateNs[c] == NONE) {
            restart(c, b);
        }
        open(c, b, now);
        if (top != null) {
            for (int i = 0; i < top.length && featureCount < MAX_FEATURES && top[i] != null; i++) {
                features[featureCount++] = top[i];
            }
        }
        List<String> ev = new ArrayList<>();
        addFeatures(ev);
        ev.add("entered: smoothed p(" + classes.name(c) + ") above " + settings.enterProbability() + " for "
                + settings.enterS() + " s from " + seconds(channel[c].edgeNs()) + " s");
        if (pointAssisted) {
            ev.set(ev.size() - 1, "entered: smoothed p(" + classes.name(c) + ") above "
                    + settings.boundaries().assistEnterProbability() + " for " + settings.enterS() + " s from "
                    + seconds(assist[c].edgeNs()) + " s, with its rules passed (" + BoundaryRules.PHYSICS_ENTRY + ")");
        }
        if (moved != null) {
            ev.add(moved);
        }
        emit(PointEvent.Type.BEGUN, now, NONE, List.of(), ev, liveConfidence(c));
    }

    /**
     * Opens a point of class {@code c} that a physics signature found, from {@code b}, begun at {@code now}: its
     * begin is the classifier's as far as the rules go; with {@code seeAgain} its rules are given every kept frame
     * from {@code b} on (what the signature found is already behind us).
     */
    private void openPhysics(int c, long b, long now, boolean seeAgain) {
        classifierBeginNs = b;
        pointAssisted = false;
        restart(c, b);
        if (seeAgain) {
            for (GuardRule rule : rules[c]) {
                lookBack(rule, b);
            }
        }
        open(c, b, now);
    }

    /** A new open point of class {@code c} from {@code b}, begun at {@code now}: the per-point state reset. */
    private void open(int c, long b, long now) {
        pointId++;
        phase = ACTIVE;
        waiting = false;
        physicalEndNs = NONE;
        pointClass = c;
        beginNs = b;
        begunAtNs = now;
        confirmed = false;
        merges = 0;
        switchNote = null;
        featureCount = 0;
    }

    /**
     * {@code doublet-signature}: opens a doublet point found in the pitch rate ({@link DoubletWatch}), from its
     * trimmed lead before the input; the classifier waits until it is over.
     */
    private void beginPhysicsDoublet(long now) {
        int c = doubletClass;
        long b = doublets.inputNs() - DOUBLET_LEAD_NS;
        if (lastEndNs != NONE) {
            b = Math.max(b, lastEndNs);
        }
        openPhysics(c, b, now, false);
        physicsPoint = true;
        physicsFailure = null;
        List<String> ev = new ArrayList<>();
        ev.add("entered: " + BoundaryRules.DOUBLET_SIGNATURE + ": " + doublets.describe() + "; begin "
                + seconds(DOUBLET_LEAD_NS) + " s before the input");
        emit(PointEvent.Type.BEGUN, now, NONE, List.of(), ev, PHYSICS_CONFIDENCE);
    }

    /**
     * The classifier's open doublet is the one the watch found: from now on the watch places its begin (the trimmed
     * lead before the input) and its end (the pilot's next input, or the end of the free response).
     */
    private void adoptPhysicsDoublet(long now) {
        physicsPoint = true;
        physicsFailure = null;
        long b = doublets.inputNs() - DOUBLET_LEAD_NS;
        if (lastEndNs != NONE) {
            b = Math.max(b, lastEndNs);
        }
        String moved = "";
        if (b < beginNs) {
            moved = "; begin moved to " + seconds(b) + " s from " + seconds(beginNs) + " s";
            beginNs = b;
        }
        emit(PointEvent.Type.REFINED, now, NONE, List.of(), List.of(BoundaryRules.DOUBLET_SIGNATURE + ": "
                + doublets.describe() + moved), liveConfidence(pointClass));
    }

    /**
     * {@code roll-signature}: opens an aileron roll found in the roll rate and bank ({@link RollWatch}), begun where
     * the aircraft left its steady entry ({@code begin-departure}, else the roll's onset); it ends where
     * {@code end-recovery} finds it back in steady flight.
     */
    private void beginPhysicsRoll(long now) {
        int c = rollClass;
        long b = rolls.startNs();
        if (departs[c]) {
            long d = refiner.departureBegin(b, lastEndNs, now);
            if (d != NONE && d <= b) {
                b = d;
            }
        }
        if (lastEndNs != NONE) {
            b = Math.max(b, lastEndNs);
        }
        // the rules judge the roll itself, which is already behind us
        openPhysics(c, b, now, true);
        physicsRoll = true;
        lastEndCheckNs = NONE;
        endEstimateNs = rolls.endNs();
        emit(PointEvent.Type.BEGUN, now, NONE, List.of(), List.of("entered: " + BoundaryRules.ROLL_SIGNATURE + ": "
                + String.format(Locale.ROOT, "%.0f deg of bank turned from %.3f s to %.3f s", Math.toDegrees(
                rolls.turnedRad()), rolls.startNs() / 1e9, rolls.endNs() / 1e9)), PHYSICS_CONFIDENCE);
    }

    /** The open physics roll: ended once back in steady flight, or when another kind enters, or after the wait. */
    private void followPhysicsRoll(long now, String[] top) {
        int c = pointClass;
        int j = strongestOn(c);
        boolean waited = now - rolls.endNs() > recoveryWaitNs;
        if (j < 0 && !waited && lastEndCheckNs != NONE && now - lastEndCheckNs < END_CHECK_NS) {
            return; // the recovery is looked for at most every END_CHECK_NS, as for any point waiting for its end
        }
        lastEndCheckNs = now;
        long e = recovers[c] ? refiner.recoveryEnd(ManoeuvreKind.AILERON_ROLL, beginNs,
                rolls.endNs() + ROLL_CORE_AFTER_NS, now) : rolls.endNs();
        if (e == NONE && j < 0 && !waited) {
            return;
        }
        if (e == NONE && recovers[c]) {
            // the wait is over (or another kind entered): the roll ended where it came nearest to steady flight
            e = refiner.settledRecoveryEnd(ManoeuvreKind.AILERON_ROLL, beginNs, rolls.endNs() + ROLL_CORE_AFTER_NS,
                    j >= 0 ? Math.max(rolls.endNs(), riseEstimate(j)) : now);
        }
        physicalEndNs = e;
        for (GuardRule r : rules[c]) {
            r.mark();
        }
        long end = e != NONE ? e : rolls.endNs();
        close(now, end, e != NONE ? null : "ended by " + BoundaryRules.ROLL_SIGNATURE + ": no steady flight after"
                + " the roll", j >= 0 ? riseEstimate(j) : NONE);
        physicsRoll = false;
        rolls.reset();
        muted[c] = true;
        muteUntilNs[c] = now + MUTE_AFTER_RELEASE_NS;
        channel[c].reset();
        assist[c].reset();
        if (j >= 0 && j != c) {
            begin(j, now, top);
        }
    }

    /**
     * {@code hold-signature}: opens a stabilised point found in steady flight ({@link HoldWatch}) that the classifier
     * does not call, begun where the steady run began (not before the last point's end).
     */
    private void beginPhysicsHold(long now, long b) {
        int c = holdClass;
        openPhysics(c, b, now, true);
        physicsHold = true;
        holdRunNs = holdWatch.steadySinceNs();
        emit(PointEvent.Type.BEGUN, now, NONE, List.of(), List.of("entered: " + BoundaryRules.HOLD_SIGNATURE + ": "
                + holdWatch.describe()), PHYSICS_CONFIDENCE);
    }

    /** The open physics hold: ended where steady flight ended, or where another kind the classifier calls began. */
    private void followPhysicsHold(long now, String[] top) {
        int c = pointClass;
        int j = strongestOn(c);
        // the run the hold was begun on (a new one may have started since the last tick)
        boolean same = holdWatch.holding() && holdWatch.steadySinceNs() == holdRunNs;
        if (same && (j < 0 || j == c)) {
            return;
        }
        long end = same ? now : holdWatch.endedRunNs();
        String how = same ? classes.name(j) + " began" : "steady flight ended";
        if (j >= 0 && j != c) {
            end = Math.min(end, Math.max(beginNs, riseEstimate(j)));
        }
        physicalEndNs = end;
        for (GuardRule r : rules[c]) {
            r.mark();
        }
        close(now, end, "ended by " + BoundaryRules.HOLD_SIGNATURE + ": " + how, NONE);
        holdWatch.reset();
        if (j >= 0 && j != c) {
            begin(j, now, top);
        }
    }

    /**
     * {@code hold-signature}: a stabilised point begins this far into its steady run, once the flight has been steady
     * that long (common practice: stabilise, then mark; 2 s from memory), not at its first steady instant, ns.
     */
    public static final long STABILISE_NS = 2_000_000_000L;

    /** A roll's core (its highest rates) is looked for up to this long after the rate fell back. */
    private static final long ROLL_CORE_AFTER_NS = 500_000_000L;

    /** The open physics point: confirmed, ended or given up as the watch says. */
    private void followPhysicsPoint(long now) {
        int s = doublets.status();
        if (s == DoubletWatch.BEGUN && !confirmed) {
            int j = strongestOn(pointClass);
            if (j >= 0) {
                // the classifier sees another kind in what the watch has not yet confirmed: that kind has it
                physicsFailure = classes.name(j) + " entered before the response settled";
                closePhysicsPoint(now, now, null);
                begin(j, now, null);
                return;
            }
        }
        if (s == DoubletWatch.CONFIRMED && !confirmed) {
            confirmed = true;
            emit(PointEvent.Type.REFINED, now, NONE, List.of(new KeyInstant("input", doublets.inputNs())),
                    List.of("confirmed by " + BoundaryRules.DOUBLET_SIGNATURE + ": " + doublets.describe()
                            + ", CAS held"), PHYSICS_CONFIDENCE);
        } else if (s == DoubletWatch.ENDED || s == DoubletWatch.FAILED) {
            long end = s == DoubletWatch.ENDED ? doublets.endNs() : now;
            physicsFailure = s == DoubletWatch.FAILED ? doublets.failure() : null;
            closePhysicsPoint(now, end, s == DoubletWatch.ENDED ? "ended by " + BoundaryRules.DOUBLET_SIGNATURE
                    + ": the pilot's next input or the end of the free response" : null);
        }
    }

    private void closePhysicsPoint(long now, long end, String note) {
        int c = pointClass;
        for (GuardRule r : rules[c]) {
            r.mark();
        }
        close(now, end, note, NONE);
        physicsPoint = false;
        physicsFailure = null;
        // the classifier's own view of the same doublet is not a second point
        muted[c] = true;
        muteUntilNs[c] = doublets.releaseNs() + MUTE_AFTER_RELEASE_NS;
        doublets.reset();
        channel[c].reset();
        assist[c].reset();
    }

    private void takeOver(int k, int j, long now, String[] top) {
        ManoeuvreKind from = classes.kind(k);
        ManoeuvreKind to = classes.kind(j);
        channel[k].reset();
        assist[k].reset();
        candidateNs[k] = NONE;
        if (settings.allowsSwitch(from, to)) {
            String note = "switched from " + from.key() + " to " + to.key() + " at " + seconds(now) + " s";
            switchNote = switchNote == null ? note : switchNote + "; " + note;
            continueAs(j, now);
            return;
        }
        long jBegin = riseEstimate(j);
        long f = edge[k].fallNs();
        long end = f != NONE && f >= beginNs ? Math.min(f, jBegin) : jBegin;
        close(now, Math.max(end, beginNs), "ended when " + to.key() + " took over", jBegin);
        begin(j, now, top);
    }

    private void switchWhileClosing(int k, int j, long now, String[] top) {
        ManoeuvreKind from = classes.kind(k);
        ManoeuvreKind to = classes.kind(j);
        String note = "switched from " + from.key() + " to " + to.key() + " at " + seconds(now)
                + " s while waiting for its end";
        switchNote = switchNote == null ? note : switchNote + "; " + note;
        channel[k].reset();
        assist[k].reset();
        candidateNs[k] = NONE;
        phase = ACTIVE;
        waiting = false;
        physicalEndNs = NONE;
        merges++;
        pointAssisted = !channel[j].isOn();
        continueAs(j, now);
    }

    /** The open point goes on as class {@code j}, to be confirmed again, and says so with the switch note. */
    private void continueAs(int j, long now) {
        int was = pointClass;
        pointClass = j;
        confirmed = false;
        if (candidateNs[j] == NONE) {
            restart(j, now);
        }
        // a rule both kinds share goes on with what it saw of the point so far, when it saw more
        for (GuardRule r : rules[j]) {
            for (GuardRule o : was >= 0 ? rules[was] : new GuardRule[0]) {
                if (o.name().equals(r.name()) && o.startNs() != NONE
                        && (r.startNs() == NONE || o.startNs() < r.startNs())) {
                    r.continueFrom(o);
                }
            }
        }
        List<String> ev = new ArrayList<>();
        addFeatures(ev);
        ev.add(switchNote);
        emit(PointEvent.Type.REFINED, now, NONE, List.of(), ev, liveConfidence(j));
    }

    private void confirmIfReady(long now) {
        if (confirmed) {
            return;
        }
        GuardRule[] rs = rules[pointClass];
        boolean any = false;
        for (int r = 0; r < rs.length; r++) {
            if (rs[r].confirmsLive()) {
                if (rs[r].liveOutcome() != RuleOutcome.PASSED) {
                    return;
                }
                any = true;
            }
        }
        if (!any) {
            return;
        }
        confirmed = true;
        List<String> ev = new ArrayList<>();
        List<KeyInstant> keys = new ArrayList<>();
        for (GuardRule r : rs) {
            if (r.confirmsLive()) {
                ev.add("confirmed by " + r.name() + ": " + r.explain(true));
                r.keyInstants(true, keys);
            }
        }
        keys.sort(Comparator.comparingLong(KeyInstant::timeNs));
        emit(PointEvent.Type.REFINED, now, NONE, keys, ev, liveConfidence(pointClass));
    }

    /**
     * Ends the open point at {@code endNs} (or where a boundary rule places it, not after {@code capNs} unless that
     * is NONE), judges it and says ENDED or DISCARDED.
     */
    private void close(long now, long endNs, String note, long capNs) {
        int k = pointClass;
        ManoeuvreKind kind = classes.kind(k);
        long end = Math.max(endNs, beginNs);
        List<String> ev = new ArrayList<>();
        long classifierS = end - classifierBeginNs;
        refineBoundaries(k, kind, now, end, capNs, ev);
        end = Math.max(refinedEndNs, beginNs);
        addFeatures(ev);
        if (switchNote != null) {
            ev.add(switchNote);
        }
        if (merges > 0) {
            ev.add("merged across " + merges + (merges == 1 ? " gap" : " gaps") + " up to " + settings.mergeGapS()
                    + " s");
        }
        // a rule that found the manoeuvre's physical onset before the classifier's rise moves the begin there
        for (GuardRule r : rules[k]) {
            long onset = r.onsetNs();
            if (onset != PointEvent.UNKNOWN_NS && onset < beginNs && (lastEndNs == NONE || onset >= lastEndNs)
                    && r.outcome() == RuleOutcome.PASSED) {
                ev.add("begin moved to " + r.name() + " onset at " + seconds(onset) + " s from " + seconds(beginNs)
                        + " s");
                beginNs = onset;
            }
        }
        boolean ok = true;
        if (physicsFailure != null) {
            ok = false;
            ev.add("failed " + BoundaryRules.DOUBLET_SIGNATURE + ": " + physicsFailure);
        } else if (physicsPoint) {
            ev.add("passed " + BoundaryRules.DOUBLET_SIGNATURE + ": " + doublets.describe());
        } else if (physicsRoll) {
            ev.add("passed " + BoundaryRules.ROLL_SIGNATURE + String.format(Locale.ROOT, ": %.0f deg of bank turned"
                    + " from %.3f s", Math.toDegrees(rolls.turnedRad()), rolls.startNs() / 1e9));
        }
        if (settlesFirst[k]) {
            double share = refiner.settledShare(beginNs - SETTLED_ENTRY_NS, beginNs);
            ok &= judged(ev, BoundaryRules.ACCEL_SETTLED_ENTRY, share, share >= SETTLED_SHARE, String.format(
                    Locale.ROOT, "%.0f %% of the %.0f s before the begin in settled wings-level flight (needs %.0f %%)",
                    100 * share, SETTLED_ENTRY_NS / 1e9, 100 * SETTLED_SHARE), "no bank, AoS or P");
        }
        if (level[k]) {
            double rate = refiner.hpRate(beginNs, end);
            ok &= judged(ev, BoundaryRules.ACCEL_LEVEL, rate, Math.abs(rate) <= LEVEL_DRIFT_MPS, String.format(
                    Locale.ROOT, "Hp drifted %d ft/min (at most %d)", Math.round(rate / Units.M_PER_FT * 60),
                    Math.round(LEVEL_DRIFT_MPS / Units.M_PER_FT * 60)), "no Hp");
        }
        if (gains[k]) {
            double gain = refiner.speedGain(beginNs, end);
            double needs = settings.boundaries().accelGain();
            ok &= judged(ev, BoundaryRules.ACCEL_GAIN, gain, gain >= needs, String.format(Locale.ROOT,
                    "CAS gained %.1f %% (needs %.1f %%)", 100 * gain, 100 * needs), "no CAS");
        }
        double durationS = (end - beginNs) / 1e9;
        double minS = settings.minDurationS(kind);
        String duration = "min-duration: " + String.format(Locale.ROOT, "%.2f s (needs %.2f s)", durationS, minS);
        if (durationS < minS) {
            ok = false;
            ev.add("failed " + duration);
        } else {
            ev.add("passed " + duration);
        }
        boolean settledRun = settlesFirst[k]
                && refiner.settledShare(beginNs - SETTLED_ENTRY_NS, beginNs) >= SETTLED_SHARE;
        if ((accelerates[k] || holds[k]) && classifierS / 1e9 < minS && !settledRun) {
            // an extent rule spreads a point over the state it found; the classifier's own stretch must still have
            // lasted the minimum, or a short fragment in a long transit would become a point (a level acceleration
            // from settled flight is a point by its physics: accel-settled-entry vouches for it)
            ok = false;
            ev.add("failed min-duration: " + String.format(Locale.ROOT, "%.2f s (needs %.2f s)", classifierS / 1e9,
                    minS) + " as the classifier saw it");
        }
        List<KeyInstant> keys = new ArrayList<>();
        for (String name : GuardRules.namesFor(kind)) {
            if (!settings.ruleEnabled(name)) {
                ev.add("disabled " + name);
            }
        }
        for (GuardRule r : rules[k]) {
            RuleOutcome o = r.outcome();
            String line = r.name() + ": " + r.explain(false);
            if (o == RuleOutcome.PASSED) {
                ev.add("passed " + line);
            } else if (o == RuleOutcome.FAILED) {
                ok = false;
                ev.add("failed " + line);
            } else {
                ev.add("unchecked " + line);
            }
            r.keyInstants(false, keys);
        }
        if (kind.hasInstant("start")) {
            keys.add(new KeyInstant("start", beginNs));
        }
        if (kind.hasInstant("end")) {
            keys.add(new KeyInstant("end", end));
        }
        keys.sort(Comparator.comparingLong(KeyInstant::timeNs));
        if (note != null) {
            ev.add(note);
        }
        double conf = keptCount[k] > 0 ? keptSum[k] / keptCount[k] : liveConfidence(k);
        int told = stallByBank(k, kind, end, ev);
        pointClass = told;
        emit(ok ? PointEvent.Type.ENDED : PointEvent.Type.DISCARDED, now, end, keys, ev, conf);
        if (ok) {
            lastEndNs = end;
        }
        phase = IDLE;
        pointClass = -1;
        // whatever closed it (a roll found, the stream's end), a hold closed is no longer followed
        physicsHold = false;
        candidateNs[k] = edge[k].riseNs();
        restart(k, candidateNs[k]);
    }

    /**
     * One point-wide rule's evidence line: {@code unchecked} when {@code value} is NaN (the quantity is absent),
     * else {@code passed} or {@code failed}; false only when it failed.
     */
    private static boolean judged(List<String> ev, String rule, double value, boolean passes, String figures,
                                  String missing) {
        if (Double.isNaN(value)) {
            ev.add("unchecked " + rule + ": " + missing);
            return true;
        }
        ev.add((passes ? "passed " : "failed ") + rule + ": " + figures);
        return passes;
    }

    private long refinedEndNs;

    /**
     * {@code stall-bank}: a stall is a turning one when the bank held on its way to the break (median |bank| from
     * the begin to the AoA maximum) is beyond the settings' bank, else a wings-level one; the class to report.
     */
    private int stallByBank(int k, ManoeuvreKind kind, long end, List<String> ev) {
        if (!(kind == ManoeuvreKind.STALL_LEVEL || kind == ManoeuvreKind.STALL_TURN)
                || !BoundaryRules.applies(BoundaryRules.STALL_BANK, kind, settings)) {
            return k;
        }
        double bank = refiner.bankToBreak(beginNs, end);
        if (Double.isNaN(bank)) {
            return k;
        }
        ManoeuvreKind told = bank >= settings.boundaries().turnBankRad() ? ManoeuvreKind.STALL_TURN
                : ManoeuvreKind.STALL_LEVEL;
        int c = classes.indexOf(told);
        if (c < 0) {
            return k;
        }
        ev.add(BoundaryRules.STALL_BANK + ": median bank to the break " + GuardRule.deg(bank) + " deg (turning from "
                + GuardRule.deg(settings.boundaries().turnBankRad()) + "): " + told.key()
                + (told == kind ? "" : ", was " + kind.key()));
        return c;
    }

    /**
     * The boundary rules: the end where the physics says the point was over (found while waiting, or now), the begin
     * where the aircraft departed its steady entry; sets refinedEndNs and moves beginNs, with evidence.
     */
    private void refineBoundaries(int k, ManoeuvreKind kind, long now, long end, long capNs, List<String> ev) {
        refinedEndNs = end;
        if (recovers[k] || accelerates[k] || holds[k]) {
            String rule = accelerates[k] ? BoundaryRules.ACCEL_EXTENT
                    : holds[k] ? BoundaryRules.STABILISED_EXTENT : BoundaryRules.END_RECOVERY;
            long e = physicalEndNs;
            if (e == NONE) {
                long keep = endEstimateNs;
                endEstimateNs = end;
                e = physicalEnd(k, now);
                endEstimateNs = keep;
            }
            if (e == NONE && recovers[k] && !accelerates[k] && !holds[k]) {
                // no steady flight held for the whole dwell (the pilot went on to the next point first): the end
                // of the longest steady stretch after the core
                e = refiner.settledRecoveryEnd(kind, beginNs, end + CORE_AFTER_END_NS, now);
            }
            if (e != NONE && capNs != NONE) {
                e = Math.min(e, capNs);
            }
            if (e != NONE && e > beginNs) {
                ev.add("end moved to " + rule + " at " + seconds(e) + " s from " + seconds(end) + " s");
                if (e > end && recovers[k]) {
                    // the rules judge everything seen up to the recovery, not only the classifier's stretch (a
                    // turning stall the classifier lost before its break)
                    for (GuardRule r : rules[k]) {
                        r.mark();
                    }
                }
                refinedEndNs = e;
            } else {
                ev.add("kept end: " + rule + " found no physical end");
            }
        }
        if (departs[k] || accelerates[k]) {
            String rule = departs[k] ? BoundaryRules.BEGIN_DEPARTURE : BoundaryRules.ACCEL_EXTENT;
            long b = departs[k] ? refiner.departureBegin(finalAnchor(k, kind, classifierBeginNs, refinedEndNs),
                    lastEndNs, now)
                    : refiner.accelBegin(classifierBeginNs, lastEndNs);
            if (b != NONE && b != beginNs && b < refinedEndNs && (lastEndNs == NONE || b >= lastEndNs)) {
                ev.add("begin moved to " + rule + " at " + seconds(b) + " s from " + seconds(beginNs) + " s");
                beginNs = b;
            }
        }
        waiting = false;
    }

    @Override
    public void finish(long timeNs) {
        long now = lastTickNs == NONE ? timeNs : Math.max(timeNs, lastTickNs);
        if (physicsHold) {
            for (GuardRule r : rules[pointClass]) {
                r.mark();
            }
            long e = holdWatch.holding() && holdWatch.steadySinceNs() == holdRunNs ? holdWatch.lastSteadyNs()
                    : holdWatch.endedRunNs() != NONE ? holdWatch.endedRunNs() : now;
            physicalEndNs = e;
            close(now, e, "ended by finish", NONE);
        } else if (physicsRoll) {
            for (GuardRule r : rules[pointClass]) {
                r.mark();
            }
            close(now, rolls.endNs(), "ended by finish", NONE);
            physicsRoll = false;
        } else if (physicsPoint) {
            int s = doublets.status();
            if (s != DoubletWatch.CONFIRMED && s != DoubletWatch.ENDED) {
                physicsFailure = "the stream ended before the response settled";
            }
            closePhysicsPoint(now, s == DoubletWatch.ENDED ? doublets.endNs() : now, "ended by finish");
        } else if (phase == ACTIVE) {
            long f = edge[pointClass].fallNs();
            close(now, f != NONE && f >= beginNs ? f : now, "ended by finish", NONE);
        } else if (phase == CLOSING) {
            close(now, endEstimateNs, "ended by finish", NONE);
        }
        resetRun(NONE);
        floorNs = now;
        lastTickNs = now;
    }

    private double liveConfidence(int c) {
        return confCount[c] > 0 ? confSum[c] / confCount[c] : smoothed[c];
    }

    private void addFeatures(List<String> ev) {
        for (int i = 0; i < featureCount; i++) {
            ev.add("feature " + features[i]);
        }
    }

    private void emit(PointEvent.Type type, long now, long end, List<KeyInstant> keys, List<String> ev,
                      double confidence) {
        eventsEmitted++;
        double conf = Math.max(0.0, Math.min(1.0, confidence));
        listener.onPointEvent(new PointEvent(type, pointId, classes.kind(pointClass), beginNs, end, now, begunAtNs,
                conf, keys, ev));
    }

    private static String seconds(long ns) {
        return String.format(Locale.ROOT, "%.3f", ns / 1e9);
    }

    @Override
    public PhysicalState state() {
        return state;
    }

    public ClassLayout classes() {
        return classes;
    }

    public DetectorSettings settings() {
        return settings;
    }

    /**
     * Start of the current run of steady, unaccelerated, wings-level flight as {@code hold-signature} sees it
     * ({@link HoldWatch}), or {@link PointEvent#UNKNOWN_NS} when the flight is not steady now or that rule is off
     * (the watch is then not fed).
     */
    public long steadySinceNs() {
        return holdWatch.holding() ? holdWatch.steadySinceNs() : NONE;
    }

    /** True while a point is open (begun, not yet ended or discarded). */
    public boolean pointOpen() {
        return phase != IDLE;
    }

    /** Kind of the open point, or null. */
    public ManoeuvreKind openKind() {
        return phase == IDLE ? null : classes.kind(pointClass);
    }

    public long ticksAccepted() {
        return ticksAccepted;
    }

    /** Ticks dropped: not after the previous one, before {@link #init}'s time, or holding a non-finite value. */
    public long ticksRejected() {
        return ticksRejected;
    }

    /** Frames dropped because their time was not after the previous frame's. */
    public long framesRejected() {
        return framesRejected;
    }

    /** Silences longer than {@link DetectorSettings#maxTickGapS()} between ticks. */
    public long tickGaps() {
        return tickGaps;
    }

    public long eventsEmitted() {
        return eventsEmitted;
    }

    /** Entries refused before they began ({@code accel-settled-entry}: a speed-up out of another manoeuvre). */
    public long refusals() {
        return refusals;
    }
}
