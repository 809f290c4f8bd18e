package org.pointcall.ui.desk;

import java.util.Objects;

/**
 * One line of the event log.
 *
 * @param timeS data time, seconds
 * @param kind  what it is about
 * @param text  the line
 */
public record LogEntry(double timeS, Kind kind, String text) {
    /** Sorts of events, each shown with its own tag. */
    public enum Kind { POINT, BAND, CALL, ALARM, STREAM, NOTE }

    public LogEntry {
        Objects.requireNonNull(kind, "kind");
        Objects.requireNonNull(text, "text");
    }
}
