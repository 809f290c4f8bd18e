package org.pointcall.ui.desk;

import java.util.Objects;

/**
 * A safety-limit alarm.
 *
 * @param alarmId      identity used to acknowledge it
 * @param text         what was exceeded, with value and limit
 * @param timeS        data time it was raised, seconds
 * @param active       the limit is still exceeded
 * @param acknowledged the engineer has acknowledged it
 */
public record AlarmLine(long alarmId, String text, double timeS, boolean active, boolean acknowledged) {
    public AlarmLine {
        Objects.requireNonNull(text, "text");
    }
}
