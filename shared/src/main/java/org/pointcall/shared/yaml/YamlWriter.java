package org.pointcall.shared.yaml;

import java.util.Set;
import java.util.regex.Pattern;

/**
 * Builds YAML text line by line, deterministically: the same value always gives the same bytes (a dictionary's text
 * travels in a telemetry packet, and writers diff their files). Scalars are written plain when that reads back as the
 * same text, and double-quoted otherwise.
 */
public final class YamlWriter {
    private static final Pattern PLAIN_BLOCK = Pattern.compile("[A-Za-z][A-Za-z0-9 _.,/()%^+=<>;!?&*'\\-]*");
    // SnakeYAML reads "?" and some other indicators inside flow scalars its own way: flow keeps to plain words
    private static final Pattern PLAIN_FLOW = Pattern.compile("[A-Za-z][A-Za-z0-9 _./()%^+=<>;\\-]*");
    /** Words a YAML 1.1 reader takes for booleans or null; quoted so that no reader mistakes them. */
    private static final Set<String> RESERVED = Set.of("y", "Y", "yes", "Yes", "YES", "n", "N", "no", "No", "NO",
            "true", "True", "TRUE", "false", "False", "FALSE", "on", "On", "ON", "off", "Off", "OFF",
            "null", "Null", "NULL");

    private final StringBuilder out = new StringBuilder();

    /** A {@code # } comment line at {@code indent} spaces (the text must be one line). */
    public YamlWriter comment(int indent, String text) {
        if (text.indexOf('\n') >= 0) {
            throw new IllegalArgumentException("a comment is one line");
        }
        out.append(" ".repeat(indent)).append("# ").append(text).append('\n');
        return this;
    }

    /** {@code key: value} with {@code value} already formatted (or {@code key:} alone when it is empty). */
    public YamlWriter entry(int indent, String prefix, String key, String formatted) {
        out.append(" ".repeat(indent)).append(prefix).append(key).append(':');
        if (!formatted.isEmpty()) {
            out.append(' ').append(formatted);
        }
        out.append('\n');
        return this;
    }

    public YamlWriter entry(int indent, String key, String formatted) {
        return entry(indent, "", key, formatted);
    }

    /**
     * {@code key: text}; several lines become a literal block (indented two more than the key) when that reads back
     * exactly, else a double-quoted scalar with escapes.
     */
    public YamlWriter text(int indent, String prefix, String key, String value) {
        if (value.indexOf('\n') >= 0 && literalSafe(value)) {
            String chomp = value.endsWith("\n") ? "|" : "|-";
            out.append(" ".repeat(indent)).append(prefix).append(key).append(": ").append(chomp).append('\n');
            String body = value.endsWith("\n") ? value.substring(0, value.length() - 1) : value;
            String pad = " ".repeat(indent + prefix.length() + 2);
            for (String line : body.split("\n", -1)) {
                if (!line.isEmpty()) {
                    out.append(pad).append(line);
                }
                out.append('\n');
            }
            return this;
        }
        return entry(indent, prefix, key, scalar(value));
    }

    public YamlWriter text(int indent, String key, String value) {
        return text(indent, "", key, value);
    }

    /** A raw line, for list items and flow collections built by the caller. */
    public YamlWriter line(int indent, String text) {
        out.append(" ".repeat(indent)).append(text).append('\n');
        return this;
    }

    @Override
    public String toString() {
        return out.toString();
    }

    /** A scalar for block context: plain when safe, else double-quoted. */
    public static String scalar(String s) {
        return plainSafe(s, PLAIN_BLOCK) ? s : quoted(s);
    }

    /** A scalar inside a flow collection ({@code [..]} or <code>{..}</code>), where commas end a scalar. */
    public static String flowScalar(String s) {
        return plainSafe(s, PLAIN_FLOW) ? s : quoted(s);
    }

    private static boolean plainSafe(String s, Pattern p) {
        return p.matcher(s).matches() && !s.endsWith(" ") && !s.contains("  ") && !RESERVED.contains(s);
    }

    /** Double-quoted with every non-printable character escaped; reads back as exactly {@code s}. */
    public static String quoted(String s) {
        StringBuilder b = new StringBuilder(s.length() + 2).append('"');
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            switch (c) {
                case '"': b.append("\\\""); break;
                case '\\': b.append("\\\\"); break;
                case '\n': b.append("\\n"); break;
                case '\t': b.append("\\t"); break;
                case '\r': b.append("\\r"); break;
                default:
                    if (printable(c)) {
                        b.append(c);
                    } else {
                        b.append(String.format("\\u%04x", (int) c));
                    }
            }
        }
        return b.append('"').toString();
    }

    /** A number that reads back as exactly {@code v}: integers without a decimal point, {@code .inf} for infinity. */
    public static String number(double v) {
        if (Double.isNaN(v)) {
            throw new IllegalArgumentException("NaN has no place in a file");
        }
        if (Double.isInfinite(v)) {
            return v > 0 ? ".inf" : "-.inf";
        }
        if (v == Math.rint(v) && Math.abs(v) < 1e15 && !(v == 0.0 && 1.0 / v < 0)) {
            return Long.toString((long) v);
        }
        return Double.toString(v);
    }

    /** {@code [a, b, c]}. */
    public static String numbers(double... vs) {
        StringBuilder b = new StringBuilder("[");
        for (int i = 0; i < vs.length; i++) {
            if (i > 0) {
                b.append(", ");
            }
            b.append(number(vs[i]));
        }
        return b.append(']').toString();
    }

    private static boolean printable(char c) {
        if (Character.isSurrogate(c)) {
            return false;
        }
        return c >= 0x20 && c != 0x7f && !(c >= 0x80 && c <= 0x9f) && c != 0x2028 && c != 0x2029 && c != 0xfeff
                && c != 0xfffe && c != 0xffff;
    }

    private static boolean literalSafe(String s) {
        if (s.startsWith(" ") || s.startsWith("\n") || s.endsWith("\n\n") || s.endsWith(" ")) {
            return false;
        }
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            if (c != '\n' && !printable(c)) {
                return false;
            }
        }
        // trailing spaces on an inner line would read back, but lines of spaces only confuse the indentation
        for (String line : s.split("\n", -1)) {
            if (!line.isEmpty() && line.isBlank()) {
                return false;
            }
        }
        return true;
    }
}
