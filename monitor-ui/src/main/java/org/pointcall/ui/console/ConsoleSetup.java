package org.pointcall.ui.console;

import java.nio.file.Path;
import java.util.Objects;

import org.pointcall.ui.desk.DeskLink;
import org.pointcall.ui.settings.ConsoleSettings;
import org.pointcall.ui.trace.TraceFeed;

/**
 * What a console window is given.
 *
 * @param title        window title
 * @param link         snapshots in, commands out
 * @param traces       the charted samples, or {@code null} for none yet
 * @param settings     layout and chart groups
 * @param settingsFile where to save the layout on close, or {@code null} to not save
 * @param replay       show the replay transport
 * @param maxRedrawHz  charts are redrawn at most this often (never more than once a pulse)
 * @param drawing      how charts are fed
 * @param watching     a watching console (read-only): arming and the engineer's calls are made at the first one
 */
public record ConsoleSetup(String title, DeskLink link, TraceFeed traces, ConsoleSettings settings, Path settingsFile,
                           boolean replay, double maxRedrawHz, TraceDrawing drawing, boolean watching) {
    public static final double DEFAULT_REDRAW_HZ = 25;

    public ConsoleSetup {
        Objects.requireNonNull(link, "link");
        Objects.requireNonNull(settings, "settings");
        Objects.requireNonNull(drawing, "drawing");
        title = title == null ? "pointcall console" : title;
        if (!(maxRedrawHz > 0)) {
            throw new IllegalArgumentException("redraw rate must be > 0 Hz");
        }
    }

    /** A console that makes calls (not a watching one). */
    public ConsoleSetup(String title, DeskLink link, TraceFeed traces, ConsoleSettings settings, Path settingsFile,
                        boolean replay, double maxRedrawHz, TraceDrawing drawing) {
        this(title, link, traces, settings, settingsFile, replay, maxRedrawHz, drawing, false);
    }

    public ConsoleSetup withSettings(ConsoleSettings s) {
        return new ConsoleSetup(title, link, traces, s, settingsFile, replay, maxRedrawHz, drawing, watching);
    }
}
