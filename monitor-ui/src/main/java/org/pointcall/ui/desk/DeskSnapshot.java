package org.pointcall.ui.desk;

import java.util.List;
import java.util.Objects;

/**
 * Everything the console shows except the traces, as one immutable value published by whoever runs the session.
 * The console takes the latest at its own pace; a snapshot it never draws is simply replaced.
 *
 * @param version   grows with every publication, so the screen can skip an unchanged one
 * @param sortie    sortie name from the card
 * @param dataTimeS data time of the newest frame, seconds
 * @param card      every point of the card, in card order
 * @param active    the point being flown, or {@code null}
 * @param verdict   the latest verdict, or {@code null}
 * @param alarms    safety alarms, newest last
 * @param log       the event log, newest last (the publisher keeps it bounded)
 * @param spans     point begin/end markers
 * @param health    stream health
 * @param transport replay transport state, or {@code null} when live
 */
public record DeskSnapshot(long version, String sortie, double dataTimeS, List<CardRow> card, ActivePoint active,
                           VerdictCard verdict, List<AlarmLine> alarms, List<LogEntry> log, List<PointSpan> spans,
                           StreamHealth health, TransportState transport) {
    public DeskSnapshot {
        sortie = sortie == null ? "" : sortie;
        card = List.copyOf(card);
        alarms = List.copyOf(alarms);
        log = List.copyOf(log);
        spans = List.copyOf(spans);
        Objects.requireNonNull(health, "health");
    }

    /** Shown before anything is published. */
    public static DeskSnapshot empty() {
        return new DeskSnapshot(0, "", 0, List.of(), null, null, List.of(), List.of(), List.of(), StreamHealth.NONE,
                null);
    }

    /** Alarms still waiting for the engineer. */
    public long unacknowledgedAlarms() {
        long n = 0;
        for (AlarmLine a : alarms) {
            if (!a.acknowledged()) {
                n++;
            }
        }
        return n;
    }
}
