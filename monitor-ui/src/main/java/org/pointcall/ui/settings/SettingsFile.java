package org.pointcall.ui.settings;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;

import org.pointcall.shared.error.PointcallException;

/**
 * The console's settings file: plain {@code key = value} lines, {@code #} comments. Keys: {@code span-s},
 * {@code window}, {@code columns}, and one {@code group.N} per chart group ({@code name: P1, P2, ...}).
 *
 * <pre>
 * span-s = 30
 * window = 1500 x 940
 * columns = 0.2, 0.27
 * group.1 = energy: Hp, KCAS, Mach
 * group.2 = pitch: AoA, Pitch, Nz, Elevator
 * </pre>
 *
 * <p>Where: the path given on the command line, else the system property {@value #PROPERTY}, else
 * {@code $XDG_CONFIG_HOME/pointcall/console.conf}, else {@code ~/.config/pointcall/console.conf}. A bad line is
 * reported with file and line, and the defaults are used for that key.
 */
public final class SettingsFile {
    /** System property naming the settings file (tests point it into a temporary folder). */
    public static final String PROPERTY = "pointcall.console.settings";

    private SettingsFile() {
    }

    /** The default location, after the system property. */
    public static Path defaultPath() {
        String p = System.getProperty(PROPERTY);
        if (p != null && !p.isBlank()) {
            return Path.of(p);
        }
        String xdg = System.getenv("XDG_CONFIG_HOME");
        Path base = xdg != null && !xdg.isBlank() ? Path.of(xdg) : Path.of(System.getProperty("user.home"), ".config");
        return base.resolve("pointcall").resolve("console.conf");
    }

    /** Settings read from {@code file}; defaults when it does not exist. Problems go to {@code problems}. */
    public static ConsoleSettings load(Path file, List<String> problems) {
        List<String> lines;
        try {
            lines = Files.readAllLines(file, StandardCharsets.UTF_8);
        } catch (NoSuchFileException e) {
            return ConsoleSettings.defaults();
        } catch (IOException e) {
            problems.add(file + ": cannot read (" + e.getMessage() + "); using the default layout");
            return ConsoleSettings.defaults();
        }
        return parse(file.toString(), lines, problems);
    }

    static ConsoleSettings parse(String where, List<String> lines, List<String> problems) {
        ConsoleSettings s = ConsoleSettings.defaults();
        Map<Integer, TraceGroup> groups = new TreeMap<>();
        for (int i = 0; i < lines.size(); i++) {
            String line = lines.get(i).strip();
            if (line.isEmpty() || line.startsWith("#")) {
                continue;
            }
            String at = where + ":" + (i + 1) + ": ";
            int eq = line.indexOf('=');
            if (eq < 1) {
                problems.add(at + "expected 'key = value', got '" + line + "'");
                continue;
            }
            String key = line.substring(0, eq).strip().toLowerCase(Locale.ROOT);
            String value = line.substring(eq + 1).strip();
            try {
                if (key.equals("span-s")) {
                    s = s.withSpanS(range(Double.parseDouble(value), 10, 120, "span-s"));
                } else if (key.equals("window")) {
                    String[] wh = value.split("[xX]");
                    if (wh.length != 2) {
                        throw new IllegalArgumentException("window is 'WIDTH x HEIGHT'");
                    }
                    s = s.withWindow(Double.parseDouble(wh[0].strip()), Double.parseDouble(wh[1].strip()));
                } else if (key.equals("columns")) {
                    String[] c = value.split(",");
                    if (c.length != 2) {
                        throw new IllegalArgumentException("columns is 'CARD, POINT' (shares of the width)");
                    }
                    s = s.withSplits(Double.parseDouble(c[0].strip()), Double.parseDouble(c[1].strip()));
                } else if (key.startsWith("group.")) {
                    int n = Integer.parseInt(key.substring(6));
                    groups.put(n, TraceGroup.parse(value));
                } else {
                    problems.add(at + "unknown key '" + key + "' (known: span-s, window, columns, group.N)");
                }
            } catch (IllegalArgumentException e) {
                problems.add(at + key + ": " + e.getMessage() + "; default kept");
            }
        }
        if (!groups.isEmpty()) {
            s = s.withGroups(new ArrayList<>(groups.values()));
        }
        return s;
    }

    private static double range(double v, double lo, double hi, String key) {
        if (!(v >= lo && v <= hi)) {
            throw new IllegalArgumentException(key + " must be " + (int) lo + " to " + (int) hi + ", got " + v);
        }
        return v;
    }

    /** Writes {@code s} to {@code file}, creating its folder. */
    public static void save(Path file, ConsoleSettings s) {
        StringBuilder b = new StringBuilder("# pointcall console layout, rewritten when the console closes and when its chart groups change\n");
        b.append(String.format(Locale.ROOT, "span-s = %s%n", trim(s.spanS())));
        b.append(String.format(Locale.ROOT, "window = %d x %d%n", Math.round(s.widthPx()), Math.round(s.heightPx())));
        b.append(String.format(Locale.ROOT, "columns = %.3f, %.3f%n", s.cardSplit(), s.pointSplit()));
        int n = 1;
        for (TraceGroup g : s.groups()) {
            b.append("group.").append(n++).append(" = ").append(g.text()).append('\n');
        }
        try {
            Path parent = file.toAbsolutePath().getParent();
            if (parent != null) {
                Files.createDirectories(parent);
            }
            Files.writeString(file, b.toString(), StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new PointcallException("cannot write the console settings to " + file + ": " + e.getMessage(), e);
        }
    }

    private static String trim(double v) {
        return v == Math.rint(v) ? Long.toString((long) v) : Double.toString(v);
    }
}
