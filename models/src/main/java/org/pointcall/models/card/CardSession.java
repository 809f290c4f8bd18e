package org.pointcall.models.card;

import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Deque;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.concurrent.ConcurrentLinkedQueue;

import org.pointcall.ingest.derive.DerivedParameters;
import org.pointcall.ingest.frame.Frame;
import org.pointcall.ingest.window.FeatureExtractor;
import org.pointcall.models.analysis.ManoeuvreAnalyser;
import org.pointcall.models.analysis.ManoeuvreResult;
import org.pointcall.models.analysis.PointHistory;
import org.pointcall.models.data.LabelledRows;
import org.pointcall.models.detect.ClassLayout;
import org.pointcall.models.detect.KeyInstant;
import org.pointcall.models.detect.PointDetector;
import org.pointcall.models.detect.PointEvent;
import org.pointcall.models.train.Classifier;
import org.pointcall.shared.card.Band;
import org.pointcall.shared.card.BandPhase;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.card.TestPoint;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.kind.ManoeuvreKind;
import org.pointcall.shared.kind.MetricSpec;
import org.pointcall.shared.outcome.BandResult;
import org.pointcall.shared.outcome.BandStatus;
import org.pointcall.shared.outcome.LimitAlarm;
import org.pointcall.shared.outcome.MetricValue;
import org.pointcall.shared.outcome.Numbers;
import org.pointcall.shared.outcome.OperatorCall;
import org.pointcall.shared.outcome.PointOutcome;
import org.pointcall.shared.outcome.PointsFile;
import org.pointcall.shared.outcome.Reason;
import org.pointcall.shared.outcome.SessionEvent;
import org.pointcall.shared.outcome.Verdict;

/**
 * A test card flown live: frames in, session events out. Per frame, in data-time order: derived parameters, the
 * point's history, the safety limits, the detector model's windows (a tick's probabilities go to the
 * {@link PointDetector}, as {@code StreamingScorer} plays a recording) and the detector's physics. Each detected
 * point is bound to a card point ({@link CardMatcher}); the bound point's bands are gauged live at every decision
 * tick; at its end the kind's analyser computes its metrics, every band is judged in its phase
 * ({@link PhaseJudge}) and a verdict is given with its reasons ({@link Verdicts}).
 *
 * <p>Threads: {@link #onFrame} and {@link #finish} on one thread (the stream's pipeline thread), where listener
 * calls happen too. {@link #arm}, {@link #call} and {@link #snapshot} may be called from any thread: commands are
 * queued and applied before the next frame, at its data time; the snapshot is an immutable value replaced at most
 * every {@link SessionSetup#snapshotIntervalS()} of data time and at every event. Time is the data's own: nothing
 * reads a clock.
 */
public final class CardSession {
    /** History kept before a point's begin and while idle, s: covers a begin reported late and rates before it. */
    public static final double PREROLL_S = 60.0;
    /**
     * The note of a point with a hold time whose begin was moved back to where its throughout bands were first all
     * held ({@link PhaseJudge#onConditionSince}): the detector sees a steady hold only some seconds into it.
     */
    public static final String ON_CONDITION_NOTE = "on condition from";
    /**
     * A completed flight of a card point that begins within this of the end of a discarded stretch of the same
     * point, with nothing between them, is one flight: the detector lost the point for a moment (seen on turning
     * stalls, whose entry it discarded and whose recovery it kept). It is analysed from the discarded stretch's
     * begin, and the abandoned record is replaced by it. s.
     */
    public static final double REJOIN_S = 15.0;
    private static final String DISCARDED = "abandoned: the detector discarded it";
    /** Start of the note of a flight joined with a discarded stretch before it (which it then replaces). */
    public static final String JOINED_NOTE = "joined with the stretch";
    /** Alarm changes kept in a snapshot. */
    public static final int RECENT_ALARMS = 10;
    private static final int NOTICES = 5;
    /** A gauge's status changes once the new one has held this many decision ticks (no chatter on noise). */
    private static final int STATUS_TICKS = 3;
    /**
     * A point ended by the stream's end within this of the last frame was still being flown, s (unless it had
     * already lasted its hold time: a held condition is complete once held).
     */
    private static final double STILL_FLYING_S = 2.0;

    private final SessionSetup setup;
    private final ParameterDictionary dictionary;
    private final TestCard card;
    private final CardMatcher matcher;
    private final Classifier classifier;
    private final DerivedParameters derived;
    private final FeatureExtractor extractor;
    private final PointDetector detector;
    private final double[] posterior = new double[LabelledRows.classCount()];
    private final LimitWatch limits;
    private final PointHistory history;
    private final SessionListener listener;
    private final ConcurrentLinkedQueue<Command> commands = new ConcurrentLinkedQueue<>();
    private final long prerollNs = Math.round(PREROLL_S * 1e9);
    private final long snapshotNs;

    private final List<PointOutcome> outcomes = new ArrayList<>();
    private final List<LimitAlarm> alarms = new ArrayList<>();
    private final Deque<String> notices = new ArrayDeque<>();
    private volatile SessionSnapshot snapshot;

    private Active active;
    private long frames;
    private long ticks;
    private long firstFrameNs = Long.MIN_VALUE;
    private long lastFrameNs = Long.MIN_VALUE;
    /**
     * An ended point is judged this much data time after its end, so that analysers see how it came out (a loop's
     * exit to level flight can lie just after the detector's end); a new point's begin or the stream's end judges it
     * at once.
     */
    static final long POST_ROLL_NS = 3_000_000_000L;
    /** An ENDED event waiting for its post-roll, or null. */
    private PointEvent heldEnd;
    /**
     * Flies a card point with a hold from its condition when the classifier does not call it: one watch per card point
     * a stabilised detection could bind to (the first pending one may never be flown on condition).
     */
    private final List<ConditionWatch> watches = new ArrayList<>();
    /**
     * Beside each watch, one of steady flight near its point's condition: held there for the point's hold time, never
     * on it, when the point is the one the card goes on with ({@link CardMatcher#next}), the point was flown off its
     * condition (a flight to repeat, with the band it missed as the reason).
     */
    private final List<ConditionWatch> nearWatches = new ArrayList<>();
    private final List<TestPoint> candidates = new ArrayList<>();
    /** The watch of the open point flown from its condition (while {@link #conditionPoint} is not 0). */
    private ConditionWatch condition = new ConditionWatch();
    /** Id of the open point flown from its condition, or 0. */
    private long conditionPoint;
    private long conditionPoints;
    /** The last such point's end: a stabilised detection beginning before it is the same flight. */
    private long conditionEndNs = Long.MIN_VALUE;
    /** Detections taken into a point flown from its condition: their events are not a flight of their own. */
    private final java.util.Set<Long> swallowed = new java.util.HashSet<>();
    /** Ids of points flown from their condition start here, far above the detector's own. */
    public static final long CONDITION_IDS = 1_000_000_000L;
    /** On condition this long, the point is begun (from when it came on condition), ns. */
    static final long ON_CONDITION_BEGIN_NS = 5_000_000_000L;
    private static final String ENDED_BY_FINISH = "ended by finish";
    /** The evidence line of a point flown from its condition. */
    public static final String CONDITION_EVIDENCE = "on condition:";
    /**
     * Ids of points begun from their departure from the card point's entry ({@link OnsetWatch}) start here, above
     * the condition points'. Such a point keeps its id when the detector's detection of it is taken in.
     */
    public static final long ONSET_IDS = 2_000_000_000L;
    /** The evidence line of a point begun from its departure. */
    public static final String ONSET_EVIDENCE = "departed from the entry:";
    /** A begin from the departure not confirmed by a detection within this is withdrawn, ns. */
    static final long CONFIRM_NS = 30_000_000_000L;
    /** ... or once the flight has been quiet again, back at the armed values, this long, ns (it was a set-up). */
    static final long SETTLED_NS = 3_000_000_000L;
    private final OnsetWatch onset = new OnsetWatch();
    private final boolean onsetOn;
    /** Id of the open point begun from its departure, or 0. */
    private long onsetPoint;
    private long onsets;
    /** The detector's id of the detection taken into the open onset point, or 0 while it waits for one. */
    private long adopted;
    /** A detection of another kind begun while the onset point waits: held until it is told (ended or discarded). */
    private PointEvent foreign;
    private long settledSinceNs = Long.MIN_VALUE;
    /** What the open onset point was begun from, for the console while it waits for the detector. */
    private String onsetNote;
    private long currentFrameNs;
    private boolean pending;
    private long pendingNs;
    private long lastTickNs = Long.MIN_VALUE;
    private long lastPublishNs = Long.MIN_VALUE;
    private long lastTrimNs = Long.MIN_VALUE;
    private boolean finishing;
    private boolean finished;
    private int unplanned;
    private int discardedUnbound;

    /** An engineer's command, applied on the session thread. */
    private sealed interface Command {
    }

    private record Arm(String cardId) implements Command {
    }

    private record Call(String cardId, Verdict call, String note) implements Command {
    }

    public CardSession(SessionSetup setup, SessionListener listener) {
        this.setup = Objects.requireNonNull(setup, "setup");
        this.listener = Objects.requireNonNull(listener, "listener");
        this.dictionary = setup.dictionary();
        this.card = setup.card();
        this.matcher = card == null ? null : new CardMatcher(card);
        this.onsetOn = setup.detectorSettings().ruleEnabled(org.pointcall.models.detect.BoundaryRules.CARD_ONSET);
        this.classifier = setup.classifier().copy();
        if (!classifier.featureNames().equals(setup.model().features())) {
            throw new IllegalArgumentException("the classifier's features are not the model description's");
        }
        this.derived = DerivedParameters.bind(dictionary);
        this.extractor = FeatureExtractor.bind(dictionary, setup.model().windows(), setup.model().extractor(),
                this::onFeatures);
        this.detector = PointDetector.bind(dictionary, ClassLayout.standard(), setup.detectorSettings(),
                this::onPointEvent);
        this.limits = new LimitWatch(card == null ? List.of() : card.limits(), dictionary, this::onAlarm);
        this.history = PointHistory.ofAll(dictionary, 64 * 120);
        this.snapshotNs = Math.round(setup.snapshotIntervalS() * 1e9);
        publish(0);
    }

    // ------------------------------------------------------------------------------------ commands (any thread)

    /**
     * Arms a card point: the next detection of its kind binds to it, before the card's order.
     *
     * @throws IllegalArgumentException when there is no card or no such point
     */
    public void arm(String cardId) {
        checkPoint(cardId);
        commands.add(new Arm(cardId));
    }

    /**
     * The engineer's call on a card point's latest flight; it overrides the tool's verdict, which is kept.
     *
     * @param call GOOD or REPEAT
     * @throws IllegalArgumentException when there is no card, no such point, or the call is not good or repeat
     */
    public void call(String cardId, Verdict call, String note) {
        checkPoint(cardId);
        if (call != Verdict.GOOD && call != Verdict.REPEAT) {
            throw new IllegalArgumentException("an engineer calls a point good or repeat, not " + call);
        }
        commands.add(new Call(cardId, call, note));
    }

    /** The latest published snapshot; never null. */
    public SessionSnapshot snapshot() {
        return snapshot;
    }

    private void checkPoint(String cardId) {
        if (card == null) {
            throw new IllegalArgumentException("this session has no test card");
        }
        if (card.point(cardId).isEmpty()) {
            throw new IllegalArgumentException("card " + card.sortie() + " has no point '" + cardId + "'");
        }
    }

    // ------------------------------------------------------------------------------------ the stream

    /** One frame as decoded, in the dictionary's units (derived parameters are computed into it here). */
    public void onFrame(Frame f) {
        if (finished) {
            throw new IllegalStateException("the session has finished");
        }
        long t = f.timeNs();
        if (frames == 0) {
            firstFrameNs = t;
            detector.init(t);
        }
        frames++;
        lastFrameNs = Math.max(lastFrameNs, t);
        currentFrameNs = t;
        if (!commands.isEmpty()) {
            applyCommands(t);
        }
        derived.apply(f);
        history.append(f);
        limits.onFrame(f, active == null || active.point == null ? null : active.point.id());
        extractor.onFrame(f);
        detector.onFrame(f);
        // a tick at this frame's own instant fired inside the extractor; the detector gets it after the frame
        if (pending) {
            pending = false;
            tick(pendingNs);
        }
        if (heldEnd != null && t >= heldEnd.endNs() + POST_ROLL_NS) {
            releaseHeldEnd();
        }
        watchCondition(t);
        watchOnset(t);
        if (lastTrimNs == Long.MIN_VALUE || t - lastTrimNs > 5_000_000_000L) {
            lastTrimNs = t;
            long keep = (active == null ? t : Math.min(t, active.beginNs)) - prerollNs;
            history.trimBefore(keep);
        }
    }

    /**
     * Ends the stream: a point still being flown is abandoned (INCOMPLETE), commands still queued are applied.
     * Nothing more may be fed.
     */
    public void finish() {
        if (finished) {
            return;
        }
        long t = frames == 0 ? 0 : lastFrameNs;
        applyCommands(t);
        if (frames > 0) {
            if (onsetPoint != 0 && adopted == 0) {
                withdrawOnset(lastFrameNs, "the stream ended before a detection confirmed it");
            }
            if (conditionPoint != 0) {
                endCondition(lastFrameNs, condition.lastOnNs(), ENDED_BY_FINISH);
            }
            finishing = true;
            releaseHeldEnd();
            detector.finish(lastFrameNs);
            finishing = false;
        }
        finished = true;
        publish(t);
    }

    private void onFeatures(long timeNs, double[] features, boolean[] valid, double[] coverage) {
        classifier.predict(features, posterior);
        if (timeNs >= currentFrameNs) {
            pending = true;
            pendingNs = timeNs;
        } else {
            tick(timeNs);
        }
    }

    private void tick(long timeNs) {
        ticks++;
        detector.onTick(timeNs, posterior);
        if (active != null) {
            double dtS = lastTickNs == Long.MIN_VALUE ? 0 : Math.min(0.5, (timeNs - lastTickNs) * 1e-9);
            for (LiveGauge g : active.gauges) {
                g.update(timeNs, dtS);
            }
        }
        lastTickNs = timeNs;
        if (lastPublishNs == Long.MIN_VALUE || timeNs - lastPublishNs >= snapshotNs) {
            publish(timeNs);
        }
    }

    // ------------------------------------------------------------------------------------ detector events

    /**
     * A stabilised card point the classifier does not call (it sees a hold only some way into it, on an airframe
     * not trained on, never): when no point is open, every card point a stabilised detection could bind to is
     * watched ({@link ConditionWatch}; a point flown off its condition must not keep the next one from being seen);
     * the first on condition for {@link #ON_CONDITION_BEGIN_NS} (when it is the point the card goes on with,
     * {@link CardMatcher#next}; for its whole hold when it is not) is begun, bound to that card point, from when it
     * came on condition, and it ends when the condition breaks. A stabilised detection meanwhile is the same flight;
     * any other kind ends it. The card's next point held steady near its condition but never on it, for its hold, is
     * flown off condition: begun the same way, and judged (REPEAT, with the band it missed).
     */
    private void watchCondition(long t) {
        if (matcher == null || finishing) {
            return;
        }
        if (conditionPoint != 0) {
            condition.update(condition.point(), history, t);
            if (condition.broken()) {
                endCondition(t, condition.lastOnNs(), (condition.isNear() ? "left the steady hold near its condition: "
                        : "left condition: ") + condition.offBand() + " outside");
            }
            return;
        }
        if (active != null || heldEnd != null) {
            resetWatches(0);
            return;
        }
        matcher.candidates(ManoeuvreKind.STABILISED, candidates);
        // off its condition, a steady hold is a flight only of the point the card goes on with: setting up in
        // transit for the next point is steady flight too, and often near a later hold's condition
        TestPoint next = matcher.next().orElse(null);
        ConditionWatch on = null;
        ConditionWatch off = null;
        for (int k = 0; k < candidates.size(); k++) {
            if (k == watches.size()) {
                watches.add(new ConditionWatch());
                nearWatches.add(ConditionWatch.near(NEAR_BAND_WIDTHS));
            }
            ConditionWatch w = watches.get(k);
            ConditionWatch n = nearWatches.get(k);
            TestPoint p = candidates.get(k);
            if (!ConditionWatch.watchable(p, history)) {
                w.reset();
                n.reset();
                continue;
            }
            w.update(p, history, t);
            n.update(p, history, t);
            long holdNs = Math.round(p.holdS() * 1e9);
            // a point out of the card's order is taken once held for its hold: on its condition for a few seconds
            // while setting up for the next point (a sideslip at the same speed and height) is not a flight of it
            if (on == null && (p == next ? stabilisedOn(w, t) || w.onForNs(t) >= holdNs
                    : w.onForNs(t) >= Math.max(ON_CONDITION_BEGIN_NS, holdNs))) {
                on = w;
            }
            if (off == null && p == next && n.onForNs(t) >= holdNs
                    && (w.lastOnNs() == ConditionWatch.NONE || w.lastOnNs() < n.onSinceNs())) {
                off = n;
            }
        }
        resetWatches(candidates.size());
        if (on == null && off != null) {
            on = off;
        }
        if (on != null) {
            condition = on;
            TestPoint p = on.point();
            conditionPoint = CONDITION_IDS + ++conditionPoints;
            String from = String.format(java.util.Locale.ROOT, "%.1f", condition.onSinceNs() / 1e9);
            onPointEvent(new PointEvent(PointEvent.Type.BEGUN, conditionPoint, ManoeuvreKind.STABILISED,
                    condition.onSinceNs(), PointEvent.UNKNOWN_NS, t, t, 1.0, List.of(),
                    List.of(CONDITION_EVIDENCE + (on.isNear()
                            ? " held steady near " + p.id() + "'s condition but not on it (every throughout band"
                            + " within " + NEAR_BAND_WIDTHS + " band widths) from " + from + " s"
                            : " every throughout band of " + p.id() + " inside from " + from + " s"))));
        }
    }

    /**
     * The card's next point begun live from its departure from its entry ({@link OnsetWatch}): when nothing is being
     * flown, the next point (not a stabilised one: {@link #watchCondition}) is watched; armed on its steady entry, its
     * first move of the kind begins it, bound to that card point, at once. The detector's detection of it (its first
     * begun of the same kind, stalls of either kind alike) is then taken in, keeping the point's id: the flight's
     * begin, end and analysis are the detector's as before, only known to have begun seconds sooner. A detection of
     * another kind meanwhile is held until it is told: discarded, it is dropped; ended, the begin is withdrawn and the
     * detection is flown as it would have been. Unconfirmed for {@link #CONFIRM_NS}, or quiet again at the armed
     * values for {@link #SETTLED_NS} (a set-up, not the point), the begin is withdrawn
     * ({@link SessionEvent.PointWithdrawn}) and the card point waits as before.
     */
    private void watchOnset(long t) {
        if (matcher == null || finishing || !onsetOn) {
            return;
        }
        if (onsetPoint != 0) {
            onset.update(onset.point(), detector.state(), history, t);
            if (adopted != 0 || foreign != null) {
                return;
            }
            if (onset.settledAgain(t)) {
                if (settledSinceNs == Long.MIN_VALUE) {
                    settledSinceNs = t;
                }
            } else {
                settledSinceNs = Long.MIN_VALUE;
            }
            if (settledSinceNs != Long.MIN_VALUE && t - settledSinceNs >= SETTLED_NS) {
                TestPoint p = onset.point();
                withdrawOnset(t, String.format(java.util.Locale.ROOT, "steady again at the entry for %.0f s, no %s"
                        + " found", SETTLED_NS / 1e9, active.kind.key()));
                // quiet at the entry: armed again at once for the same point
                onset.update(p, detector.state(), history, t);
                onset.rearm(t);
            } else if (t - onset.departedNs() >= CONFIRM_NS) {
                withdrawOnset(t, String.format(java.util.Locale.ROOT, "no %s found within %.0f s",
                        active.kind.key(), CONFIRM_NS / 1e9));
            }
            return;
        }
        // a point that has ended and waits for its post-roll is over: the next one may start meanwhile
        boolean over = active == null || heldEnd != null && active.detection == heldEnd.pointId();
        TestPoint next = !over || conditionPoint != 0 ? null
                : matcher.next().filter(p -> OnsetWatch.watches(p.kind())).orElse(null);
        onset.update(next, detector.state(), history, t);
        if (next == null || !onset.departed()) {
            return;
        }
        releaseHeldEnd();
        onsetPoint = ONSET_IDS + ++onsets;
        adopted = 0;
        foreign = null;
        settledSinceNs = Long.MIN_VALUE;
        PointEvent e = new PointEvent(PointEvent.Type.BEGUN, onsetPoint, next.kind(), onset.departureBeginNs(),
                PointEvent.UNKNOWN_NS, t, t, 1.0, List.of(), List.of(String.format(java.util.Locale.ROOT,
                "%s %s after %.1f s steady on %s's entry: %s", ONSET_EVIDENCE, next.kind().key(),
                (onset.departureBeginNs() - onset.armedNs()) / 1e9 + OnsetWatch.ARM_NS / 1e9, next.id(),
                onset.cue())));
        Optional<TestPoint> bound = matcher.bind(next.kind(), q -> q == next);
        onsetNote = String.format(java.util.Locale.ROOT, "not yet confirmed by the detector: begun from the card"
                + " at %.1f s, %s", onset.departureBeginNs() / 1e9, onset.cue());
        active = new Active(e, bound.orElse(null));
        emit(new SessionEvent.PointStarted(t, e.pointId(), e.kind().key(), active.cardId(), active.title(),
                e.beginNs()));
    }

    /** The open onset point was not the point after all: unbound, forgotten, told. */
    private void withdrawOnset(long t, String why) {
        Active a = active;
        active = null;
        forgetOnset();
        if (a == null) {
            return;
        }
        if (a.point != null) {
            matcher.unbind(a.point.id());
        }
        notice((a.point == null ? a.kind.key() : a.point.id()) + " begin withdrawn: " + why);
        emit(new SessionEvent.PointWithdrawn(t, a.detection, a.cardId(), why));
    }

    /** No onset point is open any more (told, withdrawn): the watch starts again on the card's next point. */
    private void forgetOnset() {
        onsetPoint = 0;
        adopted = 0;
        settledSinceNs = Long.MIN_VALUE;
        onset.reset();
    }

    /** Stalls level or turning are one family: the detector tells which only at the break. */
    private static boolean sameFamily(ManoeuvreKind a, ManoeuvreKind b) {
        return a == b || isStall(a) && isStall(b);
    }

    private static boolean isStall(ManoeuvreKind k) {
        return k == ManoeuvreKind.STALL_LEVEL || k == ManoeuvreKind.STALL_TURN;
    }

    private static PointEvent rekey(PointEvent e, long id) {
        return new PointEvent(e.type(), id, e.kind(), e.beginNs(), e.endNs(), e.reportedAtNs(), e.begunAtNs(),
                e.confidence(), e.keyInstants(), e.evidence());
    }

    /**
     * A detector event while an onset point is open: taken in, held, or let through (then re-keyed when it is the
     * detection taken in). Returns the event to handle as usual, or null when it was dealt with here.
     */
    private PointEvent throughOnset(PointEvent e) {
        if (adopted != 0) {
            return e.pointId() == adopted ? rekey(e, onsetPoint) : e;
        }
        if (foreign != null && e.pointId() == foreign.pointId()) {
            switch (e.type()) {
                case REFINED -> {
                    if (sameFamily(e.kind(), active.kind)) {
                        foreign = null;
                        adopted = e.pointId();
                        active.take(e);
                    } else {
                        foreign = new PointEvent(PointEvent.Type.BEGUN, e.pointId(), e.kind(), e.beginNs(), e.endNs(),
                                foreign.reportedAtNs(), foreign.begunAtNs(), e.confidence(), e.keyInstants(),
                                e.evidence());
                    }
                }
                case DISCARDED -> {
                    foreign = null;
                    discardedUnbound++;
                }
                case ENDED -> {
                    PointEvent b = foreign;
                    foreign = null;
                    withdrawOnset(e.reportedAtNs(), "a " + e.kind().key() + " was found instead");
                    onPointEvent(b);
                    return e;
                }
                case BEGUN -> {
                }
            }
            return null;
        }
        if (e.type() == PointEvent.Type.BEGUN && sameFamily(e.kind(), active.kind)) {
            adopted = e.pointId();
            active.take(e);
            return null;
        }
        if (e.type() == PointEvent.Type.BEGUN && foreign == null) {
            foreign = e;
            return null;
        }
        // the detector told something of a point the onset point cannot be: it was not the card's point
        withdrawOnset(e.reportedAtNs(), "a " + e.kind().key() + " was found instead");
        return e;
    }

    /**
     * The card's next hold is begun once the aircraft is stabilised on its condition: every band inside and the
     * flight steady ({@link PointDetector#steadySinceNs}, the steadiness {@code hold-signature} asks for) for
     * {@link PointDetector#STABILISE_NS}, and on condition for at least {@link #ON_CONDITION_MIN_NS} (a pass through the
     * condition in transit is neither). On condition but never that steady, it is begun once on condition for its
     * whole hold.
     */
    private boolean stabilisedOn(ConditionWatch w, long t) {
        long steady = detector.steadySinceNs();
        if (steady == PointEvent.UNKNOWN_NS || w.onSinceNs() == ConditionWatch.NONE) {
            return false;
        }
        return t - Math.max(steady, w.onSinceNs()) >= PointDetector.STABILISE_NS
                && w.onForNs(t) >= ON_CONDITION_MIN_NS;
    }

    /** A hold is begun once stabilised on its condition ({@link PointDetector#STABILISE_NS}) and on it this long, ns. */
    static final long ON_CONDITION_MIN_NS = 2_000_000_000L;

    /** Forgets the condition of every watch from index {@code from} on. */
    private void resetWatches(int from) {
        for (int k = from; k < watches.size(); k++) {
            watches.get(k).reset();
            nearWatches.get(k).reset();
        }
    }

    /**
     * A stabilised point is its condition: a stabilised detection binds only to a card point whose throughout bands
     * it is near now (each bound parameter's newest sample, at most 2 s old, within {@link #NEAR_BAND_WIDTHS} band
     * widths of the band), else it is an unplanned one. Steady flight at 300 KCAS and 12,000 ft is not the card's
     * 250 KCAS at 10,000 ft point flown badly; 254 KCAS for 250 +/- 2 is.
     */
    private boolean nearCondition(TestPoint p) {
        if (history.isEmpty()) {
            return true;
        }
        for (Band b : p.bands()) {
            if (!PhaseJudge.onCondition(b, history)) {
                continue;
            }
            double v = newestSi(b.parameter(), currentFrameNs);
            if (!Double.isFinite(v)) {
                continue;
            }
            double width = b.highSi() - b.lowSi();
            double off = Math.max(b.lowSi() - v, v - b.highSi());
            if (Double.isFinite(width) && off > NEAR_BAND_WIDTHS * width) {
                return false;
            }
        }
        return true;
    }

    /** How far outside its band, in band widths, a stabilised detection may be and still be that card point. */
    static final double NEAR_BAND_WIDTHS = 2.0;

    private void endCondition(long now, long endNs, String why) {
        long id = conditionPoint;
        conditionPoint = 0;
        long begin = active != null && active.detection == id ? active.beginNs : endNs;
        long end = Math.max(begin, endNs);
        conditionEndNs = end;
        TestPoint p = condition.point();
        condition.reset();
        double heldS = (end - begin) * 1e-9;
        if (p != null && heldS < p.holdS() && !why.equals(ENDED_BY_FINISH)) {
            // on condition for less than the hold: not a flight of the point, which stays to be flown (a pass through
            // its numbers in transit must not take it from the real one)
            onPointEvent(new PointEvent(PointEvent.Type.DISCARDED, id, ManoeuvreKind.STABILISED, begin, end, now,
                    begin, 1.0, List.of(), List.of(CONDITION_EVIDENCE + " " + why, String.format(java.util.Locale.ROOT,
                    "failed on condition: %.1f s of the %.0f s hold", heldS, p.holdS()))));
            return;
        }
        onPointEvent(new PointEvent(PointEvent.Type.ENDED, id, ManoeuvreKind.STABILISED, begin, end, now,
                begin, 1.0, List.of(), List.of(CONDITION_EVIDENCE + " " + why)));
    }

    private void onPointEvent(PointEvent e) {
        if (e.pointId() < CONDITION_IDS) {
            if (swallowed.contains(e.pointId())) {
                return;
            }
            if (onsetPoint != 0) {
                e = throughOnset(e);
                if (e == null) {
                    return;
                }
                if (e.pointId() == onsetPoint && (e.type() == PointEvent.Type.ENDED
                        || e.type() == PointEvent.Type.DISCARDED)) {
                    // the onset point's flight is told: the watch goes on to the point after it
                    forgetOnset();
                }
            }
            if (e.type() == PointEvent.Type.BEGUN && e.kind() == ManoeuvreKind.STABILISED
                    && (conditionPoint != 0 || e.beginNs() < conditionEndNs)) {
                // the classifier has seen the hold that is already being flown from its condition
                swallowed.add(e.pointId());
                return;
            }
            if (e.type() == PointEvent.Type.BEGUN && conditionPoint != 0) {
                endCondition(e.reportedAtNs(), Math.min(e.beginNs(), condition.lastOnNs()),
                        e.kind().key() + " began");
            }
        }
        switch (e.type()) {
            case BEGUN -> {
                releaseHeldEnd();
                begin(e);
            }
            case REFINED -> refine(e);
            case ENDED -> {
                releaseHeldEnd();
                if (finishing) {
                    close(e);
                } else {
                    heldEnd = e;
                }
            }
            case DISCARDED -> {
                releaseHeldEnd();
                close(e);
            }
        }
    }

    private void releaseHeldEnd() {
        if (heldEnd != null) {
            PointEvent e = heldEnd;
            heldEnd = null;
            close(e);
        }
    }

    private void begin(PointEvent e) {
        Optional<TestPoint> bound = matcher == null ? Optional.empty()
                : e.pointId() == conditionPoint ? matcher.bind(e.kind(), q -> q == condition.point())
                : e.kind() == ManoeuvreKind.STABILISED ? matcher.bind(e.kind(), this::nearCondition)
                : matcher.bind(e.kind());
        active = new Active(e, bound.orElse(null));
        emit(new SessionEvent.PointStarted(e.reportedAtNs(), e.pointId(), e.kind().key(), active.cardId(),
                active.title(), e.beginNs()));
    }

    /** The open point's detection is now of another kind: unbound from its card point, bound as that kind. */
    private Active rebound(Active a, PointEvent e) {
        if (a.point != null) {
            matcher.unbind(a.point.id());
        }
        Optional<TestPoint> bound = matcher == null ? Optional.empty() : matcher.bind(e.kind());
        Active next = new Active(e, bound.orElse(null));
        next.hints.putAll(a.hints);
        emit(new SessionEvent.PointStarted(e.reportedAtNs(), e.pointId(), e.kind().key(), next.cardId(),
                next.title(), e.beginNs()));
        return next;
    }

    private void refine(PointEvent e) {
        if (active == null || active.detection != e.pointId()) {
            return;
        }
        active.take(e);
        if (e.kind() != active.kind) {
            active = rebound(active, e);
        }
    }

    private void close(PointEvent e) {
        Active a = active;
        active = null;
        if (a == null || a.detection != e.pointId()) {
            a = new Active(e, matcher == null ? null : matcher.bind(e.kind()).orElse(null));
        } else if (a.kind != e.kind()) {
            // told at its end (a stall by its bank): bound again as the kind it ended as
            a = rebound(a, e);
        }
        a.take(e);
        boolean discarded = e.type() == PointEvent.Type.DISCARDED;
        boolean cutShort = finishing && e.hasEvidence("ended by finish")
                && e.endNs() >= lastFrameNs - Math.round(STILL_FLYING_S * 1e9)
                && !(a.point != null && a.point.hasHold() && (e.endNs() - e.beginNs()) * 1e-9 >= a.point.holdS());
        if (discarded && a.point == null) {
            discardedUnbound++;
            publish(e.reportedAtNs());
            return;
        }
        PointOutcome o;
        if (discarded || cutShort) {
            List<Reason> why = new ArrayList<>();
            List<String> notes = new ArrayList<>();
            if (!cutShort) {
                String failed = e.evidence().stream().filter(s -> s.startsWith("failed ")).findFirst()
                        .map(s -> s.substring("failed ".length())).orElse("its checks");
                why.add(new Reason("point", DISCARDED + " (" + failed + ")"));
            } else {
                why.add(new Reason("point", "abandoned: the stream ended while the point was being flown"));
            }
            notes.addAll(e.evidence());
            o = new PointOutcome(e.pointId(), a.cardId(), e.kind().key(), a.title(), e.beginNs(), e.endNs(),
                    e.confidence(), a.point == null ? null : Verdict.INCOMPLETE, a.point == null ? List.of() : why,
                    List.of(), List.of(), a.hints, notes, null);
        } else {
            long begin = e.beginNs();
            String joined = null;
            int k = outcomes.size() - 1;
            PointOutcome prev = k < 0 ? null : outcomes.get(k);
            if (a.point != null && prev != null && a.point.id().equals(prev.cardId())
                    && prev.verdict() == Verdict.INCOMPLETE && !prev.reasons().isEmpty()
                    && prev.reasons().get(0).text().startsWith(DISCARDED)
                    && prev.endNs() >= e.beginNs() - Math.round(REJOIN_S * 1e9)
                    && !history.isEmpty() && prev.beginNs() >= history.firstNs()) {
                begin = prev.beginNs();
                outcomes.remove(k);
                joined = String.format(java.util.Locale.ROOT, JOINED_NOTE + " from %.1f s to %.1f s that "
                        + "the detector had discarded: one flight of %s", prev.beginNs() / 1e9, prev.endNs() / 1e9,
                        a.point.id());
                // the detector's instants were found on the kept stretch alone: the analysis finds them again
                a.hints.clear();
            }
            if (a.point != null && a.point.hasHold() && joined == null && !history.isEmpty()) {
                long floor = Math.max(history.firstNs(), prev == null ? Long.MIN_VALUE : prev.endNs());
                long on = PhaseJudge.onConditionSince(a.point, history, begin, floor);
                if (on < begin) {
                    joined = String.format(java.util.Locale.ROOT, ON_CONDITION_NOTE + " %.1f s, the detector's"
                            + " begin %.1f s: every throughout band of %s was held from there", on / 1e9,
                            begin / 1e9, a.point.id());
                    begin = on;
                }
            }
            o = judge(a, e, begin, joined);
        }
        outcomes.add(o);
        if (a.point != null) {
            matcher.settle(a.point.id(), o.verdict());
            emit(new SessionEvent.PointFinished(e.reportedAtNs(), o));
        } else if (card != null) {
            unplanned++;
            emit(new SessionEvent.Unplanned(e.reportedAtNs(), o));
        } else {
            emit(new SessionEvent.PointFinished(e.reportedAtNs(), o));
        }
    }

    /** Analysis, bands, verdict of a completed point. */
    private PointOutcome judge(Active a, PointEvent e, long beginNs, String joined) {
        List<String> notes = new ArrayList<>();
        if (joined != null) {
            notes.add(joined);
        }
        Map<String, Double> intervals = new HashMap<>();
        if (a.point != null) {
            for (Band b : a.point.bands()) {
                if (b.phase() == BandPhase.RATE) {
                    intervals.put(b.subject(), b.overS());
                }
            }
        }
        ManoeuvreResult r = analyse(e.kind(), beginNs, e.endNs(), a.hints, intervals, notes);
        Map<String, Long> instants = new LinkedHashMap<>(a.hints);
        instants.putAll(r.instantsNs());
        List<MetricValue> metrics = new ArrayList<>();
        for (MetricSpec ms : e.kind().metrics()) {
            Double v = r.metricsSi().get(ms.name());
            if (v != null) {
                metrics.add(new MetricValue(ms.name(), ms.unit().fromSi(v), ms.unit().symbol(),
                        r.methods().getOrDefault(ms.name(), "")));
            }
        }
        for (Map.Entry<String, Double> m : new java.util.TreeMap<>(r.metricsSi()).entrySet()) {
            if (e.kind().metric(m.getKey()).isEmpty()) {
                metrics.add(new MetricValue(m.getKey(), m.getValue(), "SI", r.methods().getOrDefault(m.getKey(), "")));
            }
        }
        notes.addAll(r.notes());
        if (a.point == null) {
            return new PointOutcome(e.pointId(), null, e.kind().key(), a.title(), beginNs, e.endNs(),
                    e.confidence(), null, List.of(), List.of(), metrics, instants, notes, null);
        }
        List<BandResult> bands = new ArrayList<>();
        List<Reason> reasons = new ArrayList<>();
        for (int i = 0; i < a.point.bands().size(); i++) {
            PhaseJudge.Judged j = PhaseJudge.judge(a.point, i, history, beginNs, e.endNs(), instants,
                    r.metricsSi());
            bands.add(j.result());
            if (j.reason() != null) {
                reasons.add(j.reason());
            }
        }
        reasons.addAll(Verdicts.limitReasons(alarms, beginNs, e.endNs()));
        Verdict v = reasons.isEmpty() ? Verdict.GOOD : Verdict.REPEAT;
        return new PointOutcome(e.pointId(), a.point.id(), e.kind().key(), a.title(), beginNs, e.endNs(),
                e.confidence(), v, reasons, bands, metrics, instants, notes, null);
    }

    private ManoeuvreResult analyse(ManoeuvreKind kind, long beginNs, long endNs, Map<String, Long> hints,
                                    Map<String, Double> intervals, List<String> notes) {
        Optional<ManoeuvreAnalyser> an;
        try {
            an = setup.analysers().forKind(kind);
        } catch (RuntimeException ex) {
            an = Optional.empty();
        }
        if (an.isEmpty()) {
            notes.add("no analyser for " + kind.key() + " in this build: its metrics are not computed");
            return empty(kind);
        }
        if (history.isEmpty()) {
            return empty(kind);
        }
        try {
            PointHistory slice = history.slice(beginNs - prerollNs, lastFrameNs);
            return an.get().analyse(slice, beginNs, endNs, hints, intervals);
        } catch (RuntimeException ex) {
            // an analysis fault must not stop the session: the point is still judged on its parameter bands
            notes.add("the " + kind.key() + " analysis failed (" + ex.getClass().getSimpleName() + ": "
                    + ex.getMessage() + ")");
            return empty(kind);
        }
    }

    private static ManoeuvreResult empty(ManoeuvreKind kind) {
        return new ManoeuvreResult(kind, Map.of(), Map.of(), Map.of(), List.of());
    }

    private void onAlarm(LimitAlarm a) {
        alarms.add(a);
        emit(new SessionEvent.AlarmChanged(a));
    }

    // ------------------------------------------------------------------------------------ commands

    private void applyCommands(long nowNs) {
        Command c;
        while ((c = commands.poll()) != null) {
            if (c instanceof Arm arm) {
                try {
                    matcher.arm(arm.cardId());
                    emit(new SessionEvent.PointArmed(nowNs, arm.cardId()));
                } catch (IllegalArgumentException ex) {
                    notice(ex.getMessage());
                }
            } else if (c instanceof Call call) {
                int i = lastOutcomeOf(call.cardId());
                if (i < 0) {
                    notice("no flight of " + call.cardId() + " to call yet");
                    continue;
                }
                OperatorCall oc = new OperatorCall(call.cardId(), call.call(), call.note(), nowNs);
                PointOutcome o = outcomes.get(i).withOperatorCall(oc);
                outcomes.set(i, o);
                if (matcher.state(call.cardId()) != CardPointState.FLYING) {
                    matcher.overrule(call.cardId(), call.call());
                }
                emit(new SessionEvent.CallTaken(oc, o.verdict()));
            }
        }
    }

    private int lastOutcomeOf(String cardId) {
        for (int i = outcomes.size() - 1; i >= 0; i--) {
            if (cardId.equals(outcomes.get(i).cardId())) {
                return i;
            }
        }
        return -1;
    }

    private void notice(String text) {
        notices.addLast(text);
        while (notices.size() > NOTICES) {
            notices.removeFirst();
        }
    }

    private void emit(SessionEvent e) {
        try {
            listener.onEvent(e);
        } finally {
            publish(e.timeNs());
        }
    }

    // ------------------------------------------------------------------------------------ results

    /** Every flown point so far (planned, unplanned, abandoned), in the order they ended. Session thread. */
    public List<PointOutcome> outcomes() {
        return List.copyOf(outcomes);
    }

    /** Every alarm change so far. Session thread. */
    public List<LimitAlarm> alarms() {
        return List.copyOf(alarms);
    }

    /** Card point ids with no completed flight, in card order (empty without a card). Session thread. */
    public List<String> notFlown() {
        return matcher == null ? List.of() : matcher.notFlown();
    }

    /** The points file of the session so far. Session thread. */
    public PointsFile pointsFile(String source) {
        return PointsFile.of(source, card == null ? "" : card.sortie(), card == null ? "" : card.airframe(),
                outcomes, alarms, notFlown());
    }

    public long frames() {
        return frames;
    }

    public long ticks() {
        return ticks;
    }

    /** Detections that began and were discarded without being bound to a card point. */
    public int discardedUnbound() {
        return discardedUnbound;
    }

    /** Data time of the first frame, or {@link Long#MIN_VALUE} before any. */
    public long firstFrameNs() {
        return firstFrameNs;
    }

    public long lastFrameNs() {
        return lastFrameNs;
    }

    public PointDetector detector() {
        return detector;
    }

    public ParameterDictionary dictionary() {
        return dictionary;
    }

    /** Limits of the card on parameters the dictionary lacks (not watched). */
    public List<String> unwatchedLimits() {
        return limits.unwatched();
    }

    private void publish(long nowNs) {
        lastPublishNs = nowNs;
        List<SessionSnapshot.CardPointView> views = new ArrayList<>();
        if (card != null) {
            List<CardPointState> states = matcher.states();
            for (int i = 0; i < card.points().size(); i++) {
                TestPoint p = card.points().get(i);
                int k = lastOutcomeOf(p.id());
                PointOutcome o = k < 0 ? null : outcomes.get(k);
                views.add(new SessionSnapshot.CardPointView(p.id(), p.kind().key(), p.title(), states.get(i),
                        o == null ? null : o.verdict(), o == null || o.operatorCall() == null ? null
                        : o.operatorCall().call(), o == null ? List.of() : o.reasons()));
            }
        }
        SessionSnapshot.ActivePoint ap = null;
        if (active != null) {
            List<SessionSnapshot.Gauge> gs = new ArrayList<>();
            for (LiveGauge g : active.gauges) {
                gs.add(g.view());
            }
            ap = new SessionSnapshot.ActivePoint(active.detection, active.cardId(), active.kind.key(), active.title(),
                    active.beginNs, gs, onsetPoint != 0 && active.detection == onsetPoint && adopted == 0
                    ? onsetNote : null);
        }
        int from = Math.max(0, alarms.size() - RECENT_ALARMS);
        snapshot = new SessionSnapshot(nowNs, card == null ? "" : card.sortie(), views, ap,
                alarms.subList(from, alarms.size()), limits.raisedNow(), List.copyOf(notices), frames, ticks,
                unplanned);
    }

    // ------------------------------------------------------------------------------------ the active point

    /** The point being flown: its binding, hints and live gauges. */
    private final class Active {
        final long detection;
        final ManoeuvreKind kind;
        final TestPoint point;
        final long beginNs;
        final Map<String, Long> hints = new LinkedHashMap<>();
        final List<LiveGauge> gauges = new ArrayList<>();

        Active(PointEvent e, TestPoint point) {
            this.detection = e.pointId();
            this.kind = e.kind();
            this.point = point;
            this.beginNs = e.beginNs();
            take(e);
            if (point != null) {
                for (int i = 0; i < point.bands().size(); i++) {
                    gauges.add(new LiveGauge(point, i, beginNs));
                }
            }
        }

        void take(PointEvent e) {
            for (KeyInstant k : e.keyInstants()) {
                hints.put(k.name(), k.timeNs());
            }
        }

        String cardId() {
            return point == null ? null : point.id();
        }

        String title() {
            return point == null ? kind.displayName() : point.title();
        }
    }

    /** The newest finite sample of {@code parameter} at most {@link #LIVE_HOLD_NS} before {@code nowNs}, SI; or NaN. */
    private double newestSi(String parameter, long nowNs) {
        for (int i = history.size() - 1; i >= 0 && history.timeNs(i) >= nowNs - LIVE_HOLD_NS; i--) {
            double v = history.valueSi(parameter, i);
            if (Double.isFinite(v)) {
                return v;
            }
        }
        return Double.NaN;
    }

    /** A live rate gauge waits for this much of the point (or its whole interval, if shorter), ns. */
    static final long RATE_MIN_NS = 3_000_000_000L;

    /** A live gauge shows a parameter's newest sample up to this old (a parameter sampled at 0.5 Hz or more). */
    static final long LIVE_HOLD_NS = 2_000_000_000L;

    /** One band of the active point, gauged at every decision tick. */
    private final class LiveGauge {
        final TestPoint point;
        final int index;
        final Band band;
        final boolean onParameter;
        double valueSi = Double.NaN;
        double margin = Double.NaN;
        BandStatus status = BandStatus.WAITING;
        BandStatus candidate = BandStatus.WAITING;
        int candidateTicks;
        double outsideS;
        final long beginNs;

        LiveGauge(TestPoint point, int index, long beginNs) {
            this.beginNs = beginNs;
            this.point = point;
            this.index = index;
            this.band = point.bands().get(index);
            this.onParameter = band.parameter() != null && history.has(band.parameter());
            if (onParameter && band.phase() == BandPhase.ENTRY) {
                valueSi = PhaseJudge.entryValue(history, band.parameter(), beginNs);
                margin = PhaseJudge.marginFraction(band, valueSi);
                status = BandStatus.ofMargin(margin);
                candidate = status;
            }
        }

        void update(long nowNs, double dtS) {
            if (!onParameter || band.phase() == BandPhase.ENTRY || history.isEmpty()) {
                return;
            }
            String p = band.parameter();
            // A throughout band is gauged live to the point's end. Where it stops applying (a stall's break, a
            // wind-up turn's highest Nz) is only known for sure once the point is analysed, and the verdict
            // judges it there; the detector's live marks come too early (a stall is confirmed on the first small
            // AoA peak of its entry), and stopping on them froze the gauges for the rest of the entry.
            if (band.phase() == BandPhase.RATE) {
                // live: the rate over the last interval since the point began (the same early marks would freeze
                // it), once there are RATE_MIN_NS of it (the trimmed flight before the entry is not the entry);
                // judged at the end over the interval before the analysed instant
                long over = Math.round(band.overS() * 1e9);
                if (nowNs - beginNs < Math.min(over, RATE_MIN_NS)) {
                    return;
                }
                valueSi = PhaseJudge.slope(history, p, Math.max(beginNs, nowNs - over), nowNs);
            } else {
                // the newest sample of the parameter: a slow one (a discrete at 4 Hz) is NaN in most frames, and
                // the decision ticks may never fall on a frame that carries it
                double v = newestSi(p, nowNs);
                if (Double.isFinite(v)) {
                    valueSi = v;
                }
            }
            margin = PhaseJudge.marginFraction(band, valueSi);
            if (band.phase() == BandPhase.INSTANT) {
                return; // judged at its instant, once the point has ended
            }
            BandStatus now = BandStatus.ofMargin(margin);
            if (now == BandStatus.OUT && band.phase() == BandPhase.THROUGHOUT) {
                outsideS += dtS;
            }
            if (now == status) {
                candidateTicks = 0;
                return;
            }
            if (now != candidate) {
                candidate = now;
                candidateTicks = 0;
            }
            if (++candidateTicks >= STATUS_TICKS) {
                BandStatus was = status;
                status = now;
                candidateTicks = 0;
                emit(new SessionEvent.BandChanged(nowNs, point.id(), index, band.subject(), band.phase().key(), was,
                        now, Double.isNaN(valueSi) ? null : band.unit().fromSi(valueSi), band.unit().symbol(),
                        band.describe()));
            }
        }

        SessionSnapshot.Gauge view() {
            return new SessionSnapshot.Gauge(index, band.subject(), band.phase().key(), band.unit().symbol(),
                    band.describe(), Double.isNaN(valueSi) ? Double.NaN : band.unit().fromSi(valueSi), margin,
                    status, outsideS);
        }
    }

    /** {@code 158 kt} for messages. */
    static String describe(Band b, double si) {
        return Numbers.scaled(b.unit().fromSi(si), PhaseJudge.widthInUnit(b)) + " " + b.unit().symbol();
    }
}
