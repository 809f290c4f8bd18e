package org.pointcall.replay.record;

import java.util.Objects;

/**
 * An operator alarm from the recorder.
 *
 * @param kind    what it is about
 * @param timeNs  the recorder clock when raised
 * @param message one line for the operator: what happened, to which file, and what the recorder does about it
 */
public record RecorderAlarm(AlarmKind kind, long timeNs, String message) {
    public RecorderAlarm {
        Objects.requireNonNull(kind, "kind");
        Objects.requireNonNull(message, "message");
    }

    @Override
    public String toString() {
        return kind + ": " + message;
    }
}
