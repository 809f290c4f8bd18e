package org.pointcall.ui.demo;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

import org.pointcall.models.card.CardPointState;
import org.pointcall.models.card.CardSession;
import org.pointcall.models.card.SessionListener;
import org.pointcall.models.card.SessionSnapshot;
import org.pointcall.shared.card.Band;
import org.pointcall.shared.card.BandPhase;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.card.TestPoint;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.outcome.LimitAlarm;
import org.pointcall.shared.outcome.PointOutcome;
import org.pointcall.shared.outcome.Reason;
import org.pointcall.shared.outcome.SessionEvent;
import org.pointcall.shared.outcome.Verdict;
import org.pointcall.ui.desk.ActivePoint;
import org.pointcall.ui.desk.AlarmLine;
import org.pointcall.ui.desk.BandGauge;
import org.pointcall.ui.desk.CardRow;
import org.pointcall.ui.desk.DeskCommand;
import org.pointcall.ui.desk.LogEntry;
import org.pointcall.ui.desk.Outcome;
import org.pointcall.ui.desk.PointMark;
import org.pointcall.ui.desk.PointSpan;
import org.pointcall.ui.desk.TraceBand;
import org.pointcall.ui.desk.TransportState;
import org.pointcall.ui.desk.VerdictCard;

/**
 * The console's view of a {@link CardSession}: a thin adapter. It translates the session's snapshot and events
 * into the console's terms (display units from the card, words and marks) and hands the engineer's arm and call
 * commands to the session. The acknowledgements of verdicts and alarms are the console's own record of what the
 * engineer has seen; they change nothing in the session and go to the log.
 *
 * <p>Threads: {@link #onEvent} on the session's (pipeline) thread; everything else on the publisher's thread.
 * Shared state is guarded by this object.
 */
public final class SessionDesk implements DeskModel, SessionListener {
    private static final int EVENTS_KEPT = 400;

    private final TestCard card;
    private final ParameterDictionary dictionary;
    private SessionSide session;
    private final List<LogEntry> events = new ArrayList<>();
    private final List<PointSpan> spans = new ArrayList<>();
    /** Index in {@link #spans} of the span each detection opened. */
    private final java.util.Map<Long, Integer> openSpans = new java.util.HashMap<>();
    private final List<AlarmLine> alarms = new ArrayList<>();
    private final Map<String, Long> openAlarmByLimit = new HashMap<>();
    private final Map<String, String> notes = new HashMap<>();
    private VerdictCard verdict;
    private long nextAlarmId = 1;
    private volatile TransportSide transport;

    /**
     * What the desk reads of a session and hands the engineer's commands to: a {@link CardSession} run here, or a
     * session watched from elsewhere (which refuses commands).
     */
    public interface SessionSide {
        SessionSnapshot snapshot();

        void arm(String cardId);

        void call(String cardId, Verdict call, String note);
    }

    /** What a replay adds: its transport, read and steered. */
    public interface TransportSide {
        TransportState state();

        void accept(DeskCommand command);
    }

    public SessionDesk(TestCard card, ParameterDictionary dictionary) {
        this.card = card;
        this.dictionary = dictionary;
    }

    /** Binds the session (created with this object as its listener). */
    public synchronized void bind(CardSession s) {
        this.session = s == null ? null : new SessionSide() {
            @Override
            public SessionSnapshot snapshot() {
                return s.snapshot();
            }

            @Override
            public void arm(String cardId) {
                s.arm(cardId);
            }

            @Override
            public void call(String cardId, Verdict call, String note) {
                s.call(cardId, call, note);
            }
        };
    }

    /** Binds a session this desk only reads (a watched one). */
    public synchronized void bind(SessionSide s) {
        this.session = s;
    }

    public void transport(TransportSide t) {
        this.transport = t;
    }

    private synchronized SessionSide session() {
        return session;
    }

    // ------------------------------------------------------------------------------- session thread

    @Override
    public synchronized void onEvent(SessionEvent e) {
        double t = e.timeNs() / 1e9;
        LogEntry.Kind kind = LogEntry.Kind.POINT;
        if (e instanceof SessionEvent.PointStarted p) {
            PointSpan span = new PointSpan(label(p.cardId(), p.kind()), p.beginNs() / 1e9, Double.NaN);
            Integer open = openSpans.get(p.detection());
            if (open != null && spans.get(open).open()) {
                // the same detection bound again (its kind told later): the span it opened is relabelled, not doubled
                spans.set(open, span);
            } else {
                openSpans.put(p.detection(), spans.size());
                spans.add(span);
            }
        } else if (e instanceof SessionEvent.PointFinished f) {
            close(f.outcome());
            verdict = new VerdictCard(label(f.outcome().cardId(), f.outcome().kind()), outcome(f.outcome().verdict()),
                    reasons(f.outcome().reasons()), false);
        } else if (e instanceof SessionEvent.Unplanned u) {
            close(u.outcome());
        } else if (e instanceof SessionEvent.BandChanged) {
            kind = LogEntry.Kind.BAND;
        } else if (e instanceof SessionEvent.AlarmChanged a) {
            kind = LogEntry.Kind.ALARM;
            onAlarm(a.alarm());
        } else if (e instanceof SessionEvent.CallTaken c) {
            kind = LogEntry.Kind.CALL;
            notes.put(c.call().cardId(), c.call().note());
        } else if (e instanceof SessionEvent.PointArmed) {
            kind = LogEntry.Kind.CALL;
        } else if (e instanceof SessionEvent.PointWithdrawn w) {
            Integer open = openSpans.remove(w.detection());
            if (open != null && open == spans.size() - 1 && spans.get(open).open()) {
                spans.remove((int) open);
            } else if (open != null && spans.get(open).open()) {
                PointSpan s = spans.get(open);
                spans.set(open, new PointSpan(s.pointId(), s.beginS(), s.beginS()));
            }
        }
        String line = stripStamp(e.line());
        // the log shows its own tag: drop the session line's first word where it only repeats it
        if (kind == LogEntry.Kind.BAND || kind == LogEntry.Kind.ALARM) {
            line = line.replaceFirst("^(band|LIMIT)\\s+", "");
        }
        log(new LogEntry(t, kind, line));
    }

    private void onAlarm(LimitAlarm a) {
        String key = a.parameter() + " " + a.limit();
        String text = String.format(Locale.ROOT, "%s %s %s %s%s", a.parameter(), near(a.value()), a.unit(),
                a.raised() ? "breaks" : "back inside", " " + a.limit()
                        + (a.cardId() == null ? "" : " (during " + a.cardId() + ")"));
        if (a.raised()) {
            long id = nextAlarmId++;
            openAlarmByLimit.put(key, id);
            alarms.add(new AlarmLine(id, text, a.timeNs() / 1e9, true, false));
        } else {
            Long id = openAlarmByLimit.remove(key);
            for (int i = 0; i < alarms.size(); i++) {
                AlarmLine l = alarms.get(i);
                if (id != null && l.alarmId() == id) {
                    alarms.set(i, new AlarmLine(l.alarmId(), l.text() + String.format(Locale.ROOT, ", peak %s %s",
                            near(a.peak()), a.unit()), l.timeS(), false, l.acknowledged()));
                }
            }
        }
        while (alarms.size() > 50 && alarms.get(0).acknowledged() && !alarms.get(0).active()) {
            alarms.remove(0);
        }
    }

    private void close(PointOutcome o) {
        String id = label(o.cardId(), o.kind());
        for (int i = spans.size() - 1; i >= 0; i--) {
            PointSpan s = spans.get(i);
            if (s.pointId().equals(id) && s.open()) {
                spans.set(i, new PointSpan(id, s.beginS(), o.endNs() / 1e9));
                return;
            }
        }
        spans.add(new PointSpan(id, o.beginNs() / 1e9, o.endNs() / 1e9));
    }

    private void log(LogEntry e) {
        events.add(e);
        if (events.size() > EVENTS_KEPT) {
            events.subList(0, events.size() - EVENTS_KEPT).clear();
        }
    }

    /** The session's lines begin with their own time stamp; the console shows its own. */
    private static String stripStamp(String line) {
        return STAMP.matcher(line).replaceFirst("");
    }

    private static final java.util.regex.Pattern STAMP = java.util.regex.Pattern.compile("^\\s*-?[0-9.]+ s\\s+");

    private static String label(String cardId, String kind) {
        return cardId != null ? cardId : "unplanned " + kind;
    }

    private static Outcome outcome(Verdict v) {
        return switch (v) {
            case GOOD -> Outcome.GOOD;
            case REPEAT -> Outcome.REPEAT;
            case INCOMPLETE -> Outcome.INCOMPLETE;
        };
    }

    private static List<String> reasons(List<Reason> rs) {
        List<String> out = new ArrayList<>();
        for (Reason r : rs) {
            out.add(r.text());
        }
        return out;
    }

    private static String near(double v) {
        return org.pointcall.shared.outcome.Numbers.near(v, 4);
    }

    // ------------------------------------------------------------------------------- publisher thread

    @Override
    public String sortie() {
        return card.sortie();
    }

    @Override
    public List<CardRow> card() {
        SessionSide s = session();
        List<CardRow> rows = new ArrayList<>();
        if (s == null) {
            for (TestPoint p : card.points()) {
                rows.add(new CardRow(p.id(), p.title(), p.kind().key(), PointMark.WAITING, ""));
            }
            return rows;
        }
        Map<String, String> n;
        synchronized (this) {
            n = new HashMap<>(notes);
        }
        for (SessionSnapshot.CardPointView v : s.snapshot().points()) {
            rows.add(new CardRow(v.id(), v.title(), v.kind(), mark(v.state()), n.getOrDefault(v.id(), "")));
        }
        return rows;
    }

    private static PointMark mark(CardPointState s) {
        return switch (s) {
            case PENDING -> PointMark.WAITING;
            case ARMED -> PointMark.PRIMED;
            case FLYING -> PointMark.FLYING;
            case GOOD -> PointMark.GOOD;
            case REPEAT -> PointMark.REPEAT;
            case INCOMPLETE -> PointMark.INCOMPLETE;
        };
    }

    @Override
    public ActivePoint active() {
        SessionSide s = session();
        if (s == null) {
            return null;
        }
        SessionSnapshot snap = s.snapshot();
        SessionSnapshot.ActivePoint a = snap.active();
        if (a == null) {
            return null;
        }
        TestPoint tp = a.cardId() == null ? null : card.point(a.cardId()).orElse(null);
        List<BandGauge> gauges = new ArrayList<>();
        List<TraceBand> traceBands = new ArrayList<>();
        double worstThroughoutOutS = 0;
        for (SessionSnapshot.Gauge g : a.gauges()) {
            Band b = tp != null && g.index() < tp.bands().size() ? tp.bands().get(g.index()) : null;
            double low = b == null ? Double.NEGATIVE_INFINITY : display(b, b.lowSi());
            double high = b == null ? Double.POSITIVE_INFINITY : display(b, b.highSi());
            if (!(low < high)) {
                low = -1;
                high = 1;
            }
            double target = b != null && b.isTarget() ? b.unit().fromSi(b.targetSi()) : Double.NaN;
            // to the nearer edge in the band's unit; a band open on one side has only the one edge
            double margin = Double.isFinite(high - low) ? g.marginFraction() * (high - low)
                    : Double.isNaN(g.value()) ? Double.NaN
                    : Double.isFinite(low) ? g.value() - low : Double.isFinite(high) ? high - g.value() : Double.NaN;
            gauges.add(new BandGauge(g.subject(), g.phase(), g.band(), g.unit(), low, high, target, g.value(),
                    margin, Math.max(0, g.outsideS()), standing(g.status())));
            if (b != null && b.parameter() != null && (b.phase() == BandPhase.ENTRY || b.phase() == BandPhase.THROUGHOUT)) {
                int slot = dictionary.indexOf(b.parameter());
                if (slot >= 0) {
                    var u = dictionary.parameters().get(slot).unit();
                    double lo = Double.isInfinite(b.lowSi()) ? b.lowSi() : u.fromSi(b.lowSi());
                    double hi = Double.isInfinite(b.highSi()) ? b.highSi() : u.fromSi(b.highSi());
                    if (lo < hi) {
                        traceBands.add(new TraceBand(b.parameter(), lo, hi, a.cardId() + " " + g.phase()));
                    }
                }
            }
            if (b != null && b.phase() == BandPhase.THROUGHOUT) {
                worstThroughoutOutS = Math.max(worstThroughoutOutS, Math.max(0, g.outsideS()));
            }
        }
        double elapsed = Math.max(0, (snap.timeNs() - a.beginNs()) / 1e9);
        double hold = tp != null && tp.hasHold() ? tp.holdS() : 0;
        String id = label(a.cardId(), a.kind());
        String config = tp == null ? "" : tp.config();
        if (a.awaiting() != null) {
            // a begin from the card, not yet the detector's: the panel says so where the card's configuration goes
            config = a.awaiting();
        }
        return new ActivePoint(id, a.title() == null ? a.kind() : a.title(), config, elapsed,
                Math.max(0, elapsed - worstThroughoutOutS), hold, gauges, traceBands);
    }

    private static BandGauge.Standing standing(org.pointcall.shared.outcome.BandStatus s) {
        return switch (s) {
            case WAITING -> BandGauge.Standing.WAITING;
            case CLEAR -> BandGauge.Standing.CLEAR;
            case MARGINAL -> BandGauge.Standing.MARGINAL;
            case OUT -> BandGauge.Standing.OUT;
        };
    }

    private static double display(Band b, double si) {
        return Double.isInfinite(si) ? si : b.unit().fromSi(si);
    }

    @Override
    public synchronized VerdictCard verdict() {
        return verdict;
    }

    @Override
    public synchronized List<AlarmLine> alarms() {
        return List.copyOf(alarms);
    }

    @Override
    public synchronized List<LogEntry> events() {
        return List.copyOf(events);
    }

    @Override
    public synchronized List<PointSpan> spans() {
        return List.copyOf(spans);
    }

    @Override
    public TransportState transport() {
        TransportSide t = transport;
        return t == null ? null : t.state();
    }

    @Override
    public void accept(DeskCommand c) {
        SessionSide s = session();
        try {
            if (c instanceof DeskCommand.Arm a) {
                requireSession(s).arm(a.pointId());
            } else if (c instanceof DeskCommand.Call call) {
                requireSession(s).call(call.pointId(), call.outcome() == Outcome.GOOD ? Verdict.GOOD : Verdict.REPEAT,
                        call.note());
            } else if (c instanceof DeskCommand.AcknowledgeVerdict v) {
                acknowledgeVerdict(v.pointId());
            } else if (c instanceof DeskCommand.AcknowledgeAlarm a) {
                acknowledgeAlarm(a.alarmId());
            } else {
                TransportSide t = transport;
                if (t == null) {
                    note("not a replay: " + c + " ignored");
                } else {
                    t.accept(c);
                }
            }
        } catch (IllegalArgumentException | IllegalStateException e) {
            note(e.getMessage());
        }
    }

    private static SessionSide requireSession(SessionSide s) {
        if (s == null) {
            throw new IllegalStateException("no stream yet: the card session starts with the first frames");
        }
        return s;
    }

    private synchronized void acknowledgeVerdict(String pointId) {
        if (verdict != null && verdict.pointId().equals(pointId) && !verdict.acknowledged()) {
            verdict = new VerdictCard(verdict.pointId(), verdict.outcome(), verdict.reasons(), true);
            log(new LogEntry(lastTimeS(), LogEntry.Kind.NOTE, "verdict on " + pointId + " acknowledged"));
        }
    }

    private synchronized void acknowledgeAlarm(long id) {
        for (int i = 0; i < alarms.size(); i++) {
            AlarmLine l = alarms.get(i);
            if (l.alarmId() == id && !l.acknowledged()) {
                alarms.set(i, new AlarmLine(id, l.text(), l.timeS(), l.active(), true));
                log(new LogEntry(lastTimeS(), LogEntry.Kind.ALARM, "acknowledged: " + l.text()));
            }
        }
    }

    private synchronized void note(String text) {
        log(new LogEntry(lastTimeS(), LogEntry.Kind.NOTE, text));
    }

    private double lastTimeS() {
        SessionSide s = session;
        return s == null ? (events.isEmpty() ? 0 : events.get(events.size() - 1).timeS()) : s.snapshot().timeNs() / 1e9;
    }
}
