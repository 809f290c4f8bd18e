package org.pointcall.ui.demo;

import java.util.ArrayList;
import java.util.List;

import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.card.TestPoint;
import org.pointcall.ui.desk.ActivePoint;
import org.pointcall.ui.desk.AlarmLine;
import org.pointcall.ui.desk.CardRow;
import org.pointcall.ui.desk.DeskCommand;
import org.pointcall.ui.desk.LogEntry;
import org.pointcall.ui.desk.PointMark;
import org.pointcall.ui.desk.PointSpan;
import org.pointcall.ui.desk.TransportState;
import org.pointcall.ui.desk.VerdictCard;

/**
 * The card as it is written, with no point session behind it: every point waiting, no verdicts, no alarms. Used
 * when the console watches a stream without a card session; commands are logged as not handled.
 */
public final class CardListing implements DeskModel {
    private final TestCard card;
    private final List<CardRow> rows;
    private final List<LogEntry> events = new ArrayList<>();

    public CardListing(TestCard card) {
        this.card = card;
        List<CardRow> r = new ArrayList<>();
        for (TestPoint p : card.points()) {
            r.add(new CardRow(p.id(), p.title(), p.kind().key(), PointMark.WAITING, ""));
        }
        this.rows = List.copyOf(r);
    }

    @Override
    public String sortie() {
        return card.sortie();
    }

    @Override
    public List<CardRow> card() {
        return rows;
    }

    @Override
    public ActivePoint active() {
        return null;
    }

    @Override
    public VerdictCard verdict() {
        return null;
    }

    @Override
    public List<AlarmLine> alarms() {
        return List.of();
    }

    @Override
    public synchronized List<LogEntry> events() {
        return List.copyOf(events);
    }

    @Override
    public List<PointSpan> spans() {
        return List.of();
    }

    @Override
    public TransportState transport() {
        return null;
    }

    @Override
    public synchronized void accept(DeskCommand command) {
        events.add(new LogEntry(events.isEmpty() ? 0 : events.get(events.size() - 1).timeS(), LogEntry.Kind.NOTE,
                "no card session is running: " + command + " not handled"));
    }
}
