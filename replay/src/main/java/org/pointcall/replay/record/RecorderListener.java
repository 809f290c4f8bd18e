package org.pointcall.replay.record;

/** Receives recorder alarms, on the recorder's thread: hand them on, do not block. */
@FunctionalInterface
public interface RecorderListener {
    void onAlarm(RecorderAlarm alarm);
}
