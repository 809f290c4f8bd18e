package org.pointcall.ui.console;

import java.util.Locale;

import org.pointcall.ui.desk.LogEntry;

/** One log entry as one line of text, the same on screen and in the headless output. */
public final class LogLines {
    private LogLines() {
    }

    public static String line(LogEntry e) {
        long t = (long) Math.floor(Math.max(0, e.timeS()));
        return String.format(Locale.ROOT, "T+%02d:%02d:%02d  %-6s %s", t / 3600, (t / 60) % 60, t % 60,
                e.kind().name(), e.text());
    }
}
