package org.pointcall.models.card;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

import org.pointcall.shared.card.Band;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.card.TestPoint;
import org.pointcall.shared.outcome.BandStatus;
import org.pointcall.shared.outcome.LimitAlarm;
import org.pointcall.shared.outcome.PointOutcome;
import org.pointcall.shared.outcome.PointsFile;
import org.pointcall.shared.outcome.SessionEvent;
import org.pointcall.shared.outcome.Verdict;

/**
 * A card session seen from afar: rebuilt from the events another {@link CardSession} emitted (and, when given, the
 * live views of its active point), without frames, detector or analysers. It applies each event as the session
 * applied the change that caused it: arming, binding a detection to a card point (and undoing it when the detection
 * changed kind), settling a point with its verdict or the engineer's call, alarms raised and cleared. So its card
 * states, outcomes and alarms are the session's own, in the same order, for a console that only watches.
 *
 * <p>The active point's gauges come from the last live view when there is one; without views they carry what the
 * band-change events say (status and the value at the change) and wait for the rest. Nothing here decides
 * anything: a verdict is the one the session gave.
 *
 * <p>Threads: any; every method is synchronized (events come on a consumer's thread, snapshots are read by a
 * publisher's).
 */
public final class SessionMirror {
    private final TestCard card;
    private final CardPointState[] states;
    /** State of each point before it was armed or bound, to return to when that is undone. */
    private final CardPointState[] before;
    private int armed = -1;
    private final List<PointOutcome> outcomes = new ArrayList<>();
    private final List<LimitAlarm> alarms = new ArrayList<>();
    private final Map<String, String> broken = new LinkedHashMap<>();
    private Active active;
    private long lastEventNs = Long.MIN_VALUE;
    private long events;
    private int unplanned;

    /** The point being flown as the mirror knows it. */
    private static final class Active {
        final long detection;
        final String cardId;
        final String kind;
        final String title;
        final long beginNs;
        final TestPoint point;
        List<SessionSnapshot.Gauge> gauges;
        /** True once a live view of this point replaced the gauges built from events. */
        boolean viewed;
        /** The latest view's {@link SessionSnapshot.ActivePoint#awaiting}. */
        String awaiting;

        Active(SessionEvent.PointStarted p, TestPoint point) {
            this.detection = p.detection();
            this.cardId = p.cardId();
            this.kind = p.kind();
            this.title = p.title();
            this.beginNs = p.beginNs();
            this.point = point;
            List<SessionSnapshot.Gauge> g = new ArrayList<>();
            if (point != null) {
                for (int i = 0; i < point.bands().size(); i++) {
                    Band b = point.bands().get(i);
                    g.add(new SessionSnapshot.Gauge(i, b.subject(), b.phase().key(), b.unit().symbol(), b.describe(),
                            Double.NaN, Double.NaN, BandStatus.WAITING, 0));
                }
            }
            this.gauges = g;
        }
    }

    public SessionMirror(TestCard card) {
        this.card = Objects.requireNonNull(card, "card");
        this.states = new CardPointState[card.points().size()];
        this.before = new CardPointState[states.length];
        java.util.Arrays.fill(states, CardPointState.PENDING);
    }

    public TestCard card() {
        return card;
    }

    /**
     * Applies one event of the watched session, in the order it emitted them. An event that names a point this card
     * does not have is refused.
     *
     * @throws IllegalArgumentException when the event does not fit this card (the caller counts and names it)
     */
    public synchronized void onEvent(SessionEvent e) {
        Objects.requireNonNull(e, "event");
        if (e instanceof SessionEvent.PointArmed a) {
            arm(index(a.cardId()));
        } else if (e instanceof SessionEvent.PointStarted p) {
            start(p);
        } else if (e instanceof SessionEvent.BandChanged b) {
            band(b);
        } else if (e instanceof SessionEvent.PointFinished f) {
            finish(f.outcome());
        } else if (e instanceof SessionEvent.Unplanned u) {
            unplanned++;
            outcomes.add(u.outcome());
            if (active != null && active.detection == u.outcome().detection()) {
                active = null;
            }
        } else if (e instanceof SessionEvent.AlarmChanged a) {
            LimitAlarm al = a.alarm();
            alarms.add(al);
            String key = al.parameter() + " " + al.limit();
            if (al.raised()) {
                broken.put(key, key);
            } else {
                broken.remove(key);
            }
        } else if (e instanceof SessionEvent.CallTaken c) {
            call(c);
        } else if (e instanceof SessionEvent.PointWithdrawn w) {
            if (active != null && active.detection == w.detection()) {
                if (active.cardId != null) {
                    int i = index(active.cardId);
                    if (states[i] == CardPointState.FLYING) {
                        states[i] = before[i];
                    }
                }
                active = null;
            }
        }
        events++;
        lastEventNs = Math.max(lastEventNs, e.timeNs());
    }

    private void arm(int i) {
        if (armed >= 0 && states[armed] == CardPointState.ARMED) {
            states[armed] = before[armed];
        }
        armed = i;
        before[i] = states[i];
        states[i] = CardPointState.ARMED;
    }

    private void start(SessionEvent.PointStarted p) {
        if (active != null && active.detection == p.detection() && active.cardId != null
                && !active.cardId.equals(p.cardId())) {
            // the detection changed kind: the session unbound the point it had bound
            int old = index(active.cardId);
            if (states[old] == CardPointState.FLYING) {
                states[old] = before[old];
            }
        }
        TestPoint point = null;
        if (p.cardId() != null) {
            int i = index(p.cardId());
            point = card.points().get(i);
            if (armed == i) {
                states[i] = before[i];
                armed = -1;
            }
            before[i] = states[i];
            states[i] = CardPointState.FLYING;
        }
        active = new Active(p, point);
    }

    private void band(SessionEvent.BandChanged b) {
        if (active == null || active.viewed || active.point == null || !active.point.id().equals(b.cardId())
                || b.index() < 0 || b.index() >= active.gauges.size()) {
            return;
        }
        Band band = active.point.bands().get(b.index());
        double value = b.value() == null ? Double.NaN : b.value();
        double margin = Double.isNaN(value) ? Double.NaN : PhaseJudge.marginFraction(band, band.unit().toSi(value));
        SessionSnapshot.Gauge g = active.gauges.get(b.index());
        List<SessionSnapshot.Gauge> next = new ArrayList<>(active.gauges);
        next.set(b.index(), new SessionSnapshot.Gauge(g.index(), g.subject(), g.phase(), g.unit(), g.band(), value,
                margin, b.to(), g.outsideS()));
        active.gauges = next;
    }

    private void finish(PointOutcome o) {
        if (o.cardId() != null) {
            int i = index(o.cardId());
            int k = outcomes.size() - 1;
            PointOutcome prev = k < 0 ? null : outcomes.get(k);
            if (prev != null && o.cardId().equals(prev.cardId()) && prev.verdict() == Verdict.INCOMPLETE
                    && o.notes().stream().anyMatch(n -> n.startsWith(CardSession.JOINED_NOTE))) {
                // the session joined a discarded stretch with this flight: it replaced the abandoned record
                outcomes.remove(k);
            }
            states[i] = settled(o.verdict() == null ? Verdict.INCOMPLETE : o.verdict());
            if (armed == i) {
                armed = -1;
            }
        }
        outcomes.add(o);
        if (active != null && active.detection == o.detection()) {
            active = null;
        }
    }

    private void call(SessionEvent.CallTaken c) {
        String id = c.call().cardId();
        int i = index(id);
        for (int k = outcomes.size() - 1; k >= 0; k--) {
            if (id.equals(outcomes.get(k).cardId())) {
                outcomes.set(k, outcomes.get(k).withOperatorCall(c.call()));
                break;
            }
        }
        if (states[i] != CardPointState.FLYING) {
            states[i] = settled(c.call().call());
        }
    }

    private static CardPointState settled(Verdict v) {
        return switch (v) {
            case GOOD -> CardPointState.GOOD;
            case REPEAT -> CardPointState.REPEAT;
            case INCOMPLETE -> CardPointState.INCOMPLETE;
        };
    }

    /**
     * The watched session's live view of its active point (gauges with values, margins and time outside), newer
     * than every event applied so far. A view of another detection than the one the events began is ignored; a
     * view without an active point is ignored too (the events end points).
     */
    public synchronized void onView(SessionSnapshot.ActivePoint view) {
        if (view == null || active == null || view.detection() != active.detection
                || !Objects.equals(view.cardId(), active.cardId)) {
            return;
        }
        active.gauges = List.copyOf(view.gauges());
        active.awaiting = view.awaiting();
        active.viewed = true;
    }

    private int index(String cardId) {
        for (int i = 0; i < states.length; i++) {
            if (card.points().get(i).id().equals(cardId)) {
                return i;
            }
        }
        throw new IllegalArgumentException("card " + card.sortie() + " has no point '" + cardId + "'");
    }

    /**
     * The mirror as a session snapshot at data time {@code nowNs} (the watcher's newest frame, or the last event's
     * time when that is later).
     */
    public synchronized SessionSnapshot snapshot(long nowNs) {
        List<SessionSnapshot.CardPointView> views = new ArrayList<>();
        for (int i = 0; i < states.length; i++) {
            TestPoint p = card.points().get(i);
            PointOutcome o = lastOutcomeOf(p.id());
            views.add(new SessionSnapshot.CardPointView(p.id(), p.kind().key(), p.title(), states[i],
                    o == null ? null : o.verdict(), o == null || o.operatorCall() == null ? null
                    : o.operatorCall().call(), o == null ? List.of() : o.reasons()));
        }
        SessionSnapshot.ActivePoint ap = active == null ? null : new SessionSnapshot.ActivePoint(active.detection,
                active.cardId, active.kind, active.title, active.beginNs, active.gauges, active.awaiting);
        int from = Math.max(0, alarms.size() - CardSession.RECENT_ALARMS);
        return new SessionSnapshot(Math.max(nowNs, lastEventNs == Long.MIN_VALUE ? nowNs : lastEventNs),
                card.sortie(), views, ap, alarms.subList(from, alarms.size()), List.copyOf(broken.values()),
                List.of(), 0, 0, unplanned);
    }

    private PointOutcome lastOutcomeOf(String cardId) {
        for (int i = outcomes.size() - 1; i >= 0; i--) {
            if (cardId.equals(outcomes.get(i).cardId())) {
                return outcomes.get(i);
            }
        }
        return null;
    }

    /** Every finished point so far (planned, unplanned, abandoned), in the order the session ended them. */
    public synchronized List<PointOutcome> outcomes() {
        return List.copyOf(outcomes);
    }

    public synchronized List<LimitAlarm> alarms() {
        return List.copyOf(alarms);
    }

    /** Events applied so far. */
    public synchronized long events() {
        return events;
    }

    /** Card points with no completed flight, in card order, as the session counts them. */
    public synchronized List<String> notFlown() {
        List<String> out = new ArrayList<>();
        for (int i = 0; i < states.length; i++) {
            if (states[i].awaitsFlight() || states[i] == CardPointState.FLYING) {
                out.add(card.points().get(i).id());
            }
        }
        return out;
    }

    /** The points file of the watched session so far, as the session would write it. */
    public synchronized PointsFile pointsFile(String source) {
        return PointsFile.of(source, card.sortie(), card.airframe(), outcomes, alarms, notFlown());
    }
}
