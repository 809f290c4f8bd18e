package org.pointcall.ui.demo;

import java.util.List;

import org.pointcall.ui.desk.ActivePoint;
import org.pointcall.ui.desk.AlarmLine;
import org.pointcall.ui.desk.CardRow;
import org.pointcall.ui.desk.DeskCommand;
import org.pointcall.ui.desk.LogEntry;
import org.pointcall.ui.desk.PointSpan;
import org.pointcall.ui.desk.TransportState;
import org.pointcall.ui.desk.VerdictCard;

/**
 * What the console's publisher asks of the thing that runs the points (the card session, live or replayed):
 * its state in the console's terms, and the engineer's commands handed on. An implementation is a thin adapter
 * over the session's own snapshot and command queue; it decides nothing itself.
 */
public interface DeskModel {
    String sortie();

    List<CardRow> card();

    /** The point being flown, or null. */
    ActivePoint active();

    /** The latest verdict, or null. */
    VerdictCard verdict();

    List<AlarmLine> alarms();

    /** Session events (points, bands, calls, alarms), oldest first. */
    List<LogEntry> events();

    List<PointSpan> spans();

    /** Replay position, or null when live. */
    TransportState transport();

    /** Hands a command on to the session; called on the publisher's thread. */
    void accept(DeskCommand command);
}
