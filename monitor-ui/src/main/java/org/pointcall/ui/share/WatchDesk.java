package org.pointcall.ui.share;

import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.List;
import java.util.function.LongSupplier;

import org.pointcall.models.card.SessionMirror;
import org.pointcall.models.card.SessionSnapshot;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.outcome.SessionEvent;
import org.pointcall.shared.outcome.Verdict;
import org.pointcall.ui.demo.DeskModel;
import org.pointcall.ui.demo.SessionDesk;
import org.pointcall.ui.desk.ActivePoint;
import org.pointcall.ui.desk.AlarmLine;
import org.pointcall.ui.desk.CardRow;
import org.pointcall.ui.desk.DeskCommand;
import org.pointcall.ui.desk.LogEntry;
import org.pointcall.ui.desk.PointSpan;
import org.pointcall.ui.desk.TransportState;
import org.pointcall.ui.desk.VerdictCard;

/**
 * The desk of a watching console: a session shared by another console, rebuilt from its records
 * ({@link SessionMirror}) and shown through the same {@link SessionDesk} a live console uses, so both screens
 * read alike. It is read-only: arming and calls are the first console's; here they are refused with a line in the
 * log. Acknowledging a verdict or an alarm is this screen's own record of what its viewer has seen, as on any
 * console. The sortie in the header carries the word {@value #MARK}, the window title and the log say read-only.
 *
 * <p>Threads: the {@link WatchFeed.Listener} methods on the feed's thread, the {@link DeskModel} ones on the
 * publisher's.
 */
public final class WatchDesk implements DeskModel, WatchFeed.Listener {
    /** What the header says after the sortie. */
    public static final String MARK = "WATCHING";
    /** What an arm or a call gets at a watching console. */
    public static final String REFUSED = "watching: arming and calls are made at the first console";
    private static final int NOTES_KEPT = 100;

    private final String where;
    private final LongSupplier dataTimeNs;
    private volatile Current current;
    private final ArrayDeque<LogEntry> notes = new ArrayDeque<>();

    /** The session followed: its start, its mirror and its desk. */
    private record Current(ShareRecords.SessionStart start, SessionMirror mirror, SessionDesk desk) {
    }

    /**
     * @param where      what is watched ({@code kafka://...}), for the header before a session is found
     * @param dataTimeNs data time of the newest watched frame (the watcher's own clock of the stream)
     */
    public WatchDesk(String where, LongSupplier dataTimeNs) {
        this.where = where;
        this.dataTimeNs = dataTimeNs;
    }

    // ------------------------------------------------------------------------------------ feed thread

    @Override
    public void onStart(ShareRecords.SessionStart start, TestCard card, ParameterDictionary dictionary) {
        SessionMirror mirror = new SessionMirror(card);
        SessionDesk desk = new SessionDesk(card, dictionary);
        desk.bind(new Watched(mirror, dataTimeNs));
        current = new Current(start, mirror, desk);
        note("watching " + start.source() + " (session " + start.session() + "), read-only: " + REFUSED.substring(
                REFUSED.indexOf(':') + 2));
    }

    @Override
    public void onEvent(SessionEvent event) {
        Current c = current;
        if (c == null) {
            return;
        }
        c.mirror().onEvent(event);
        c.desk().onEvent(event);
    }

    @Override
    public void onView(ShareRecords.ActiveView view) {
        Current c = current;
        if (c != null) {
            c.mirror().onView(view.active());
        }
    }

    @Override
    public void onFault(String line) {
        note(line);
    }

    private synchronized void note(String text) {
        notes.addLast(new LogEntry(dataTimeNs.getAsLong() / 1e9, LogEntry.Kind.STREAM, text));
        while (notes.size() > NOTES_KEPT) {
            notes.removeFirst();
        }
    }

    /** The mirror of the session followed, or null before one is found. */
    public SessionMirror mirror() {
        Current c = current;
        return c == null ? null : c.mirror();
    }

    public ShareRecords.SessionStart start() {
        Current c = current;
        return c == null ? null : c.start();
    }

    // ------------------------------------------------------------------------------------ publisher thread

    @Override
    public String sortie() {
        Current c = current;
        return c == null ? "waiting for a shared session on " + where + " \u00b7 " + MARK
                : c.desk().sortie() + " \u00b7 " + MARK;
    }

    @Override
    public List<CardRow> card() {
        Current c = current;
        return c == null ? List.of() : c.desk().card();
    }

    @Override
    public ActivePoint active() {
        Current c = current;
        return c == null ? null : c.desk().active();
    }

    @Override
    public VerdictCard verdict() {
        Current c = current;
        return c == null ? null : c.desk().verdict();
    }

    @Override
    public List<AlarmLine> alarms() {
        Current c = current;
        return c == null ? List.of() : c.desk().alarms();
    }

    @Override
    public List<LogEntry> events() {
        Current c = current;
        List<LogEntry> a = c == null ? List.of() : c.desk().events();
        List<LogEntry> b;
        synchronized (this) {
            b = new ArrayList<>(notes);
        }
        if (b.isEmpty()) {
            return a;
        }
        List<LogEntry> out = new ArrayList<>(a.size() + b.size());
        int i = 0;
        int j = 0;
        while (i < a.size() || j < b.size()) {
            if (j >= b.size() || (i < a.size() && a.get(i).timeS() <= b.get(j).timeS())) {
                out.add(a.get(i++));
            } else {
                out.add(b.get(j++));
            }
        }
        return out;
    }

    @Override
    public List<PointSpan> spans() {
        Current c = current;
        return c == null ? List.of() : c.desk().spans();
    }

    @Override
    public TransportState transport() {
        return null;
    }

    @Override
    public void accept(DeskCommand command) {
        Current c = current;
        if (c == null) {
            note(REFUSED);
            return;
        }
        c.desk().accept(command);
    }

    /** The watched session as the desk reads it: the mirror at the watcher's data time; commands refused. */
    private record Watched(SessionMirror mirror, LongSupplier dataTimeNs) implements SessionDesk.SessionSide {
        @Override
        public SessionSnapshot snapshot() {
            return mirror.snapshot(dataTimeNs.getAsLong());
        }

        @Override
        public void arm(String cardId) {
            throw new IllegalStateException(REFUSED);
        }

        @Override
        public void call(String cardId, Verdict call, String note) {
            throw new IllegalStateException(REFUSED);
        }
    }
}
