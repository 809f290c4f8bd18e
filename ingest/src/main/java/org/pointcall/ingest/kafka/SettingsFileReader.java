package org.pointcall.ingest.kafka;

import java.io.IOException;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

import org.pointcall.shared.error.InputRejectedException;
import org.pointcall.shared.error.PointcallException;
import org.pointcall.shared.error.Problem;

/**
 * Reads a Kafka settings file in Java properties syntax while keeping line and column of every key and value, which
 * {@link java.util.Properties} forgets.
 */
final class SettingsFileReader {
    private final String source;
    private final List<Problem> problems = new ArrayList<>();
    private final Map<String, Integer> lineOfKey = new HashMap<>();
    private final Map<String, String> client = new HashMap<>();
    private String bootstrap;
    private String prefix;
    private String group;

    private SettingsFileReader(String source) {
        this.source = source;
    }

    static KafkaSettings read(Path file) {
        String source = file.toString();
        List<String> lines;
        try {
            lines = Files.readAllLines(file, StandardCharsets.UTF_8);
        } catch (NoSuchFileException e) {
            throw new PointcallException(source + ": no such file");
        } catch (CharacterCodingException e) {
            throw new InputRejectedException(List.of(new Problem(source, 0, 0, "not UTF-8 text")));
        } catch (IOException e) {
            throw new PointcallException(source + ": cannot read (" + e.getMessage() + ")", e);
        }
        SettingsFileReader r = new SettingsFileReader(source);
        r.parse(lines);
        return r.finish();
    }

    private void parse(List<String> lines) {
        StringBuilder logical = new StringBuilder();
        int startLine = 0;
        int indent = 0;
        int firstLength = 0;
        boolean continuing = false;
        for (int i = 0; i < lines.size(); i++) {
            String raw = lines.get(i);
            int ws = leadingSpace(raw);
            if (!continuing) {
                if (ws == raw.length() || raw.charAt(ws) == '#' || raw.charAt(ws) == '!') {
                    continue;
                }
                logical.setLength(0);
                startLine = i + 1;
                indent = ws;
            }
            String part = raw.substring(ws);
            int slashes = 0;
            for (int j = part.length() - 1; j >= 0 && part.charAt(j) == '\\'; j--) {
                slashes++;
            }
            boolean more = (slashes & 1) == 1;
            logical.append(more ? part.substring(0, part.length() - 1) : part);
            if (!continuing) {
                firstLength = logical.length();
            }
            continuing = more;
            if (!more) {
                entry(logical.toString(), startLine, indent, firstLength);
            }
        }
        if (continuing) {
            entry(logical.toString(), startLine, indent, firstLength);
        }
    }

    private static int leadingSpace(String s) {
        int i = 0;
        while (i < s.length() && (s.charAt(i) == ' ' || s.charAt(i) == '\t' || s.charAt(i) == '\f')) {
            i++;
        }
        return i;
    }

    private void entry(String text, int line, int indent, int firstLength) {
        int k = 0;
        while (k < text.length()) {
            char c = text.charAt(k);
            if (c == '\\') {
                k += 2;
                continue;
            }
            if (c == '=' || c == ':' || c == ' ' || c == '\t' || c == '\f') {
                break;
            }
            k++;
        }
        int keyEnd = Math.min(k, text.length());
        int v = keyEnd;
        while (v < text.length() && isSpace(text.charAt(v))) {
            v++;
        }
        if (v < text.length() && (text.charAt(v) == '=' || text.charAt(v) == ':')) {
            v++;
            while (v < text.length() && isSpace(text.charAt(v))) {
                v++;
            }
        }
        int keyColumn = indent + 1;
        // a value that starts on a continuation line is located at its key
        int valueColumn = v <= firstLength ? indent + v + 1 : keyColumn;
        String key = unescape(text.substring(0, keyEnd), line, keyColumn);
        String value = unescape(text.substring(v), line, valueColumn);
        if (key == null || value == null) {
            return;
        }
        Integer first = lineOfKey.putIfAbsent(key, line);
        if (first != null) {
            problem(line, keyColumn, "'" + key + "' is set again (first on line " + first + "); keep one");
            return;
        }
        String p;
        switch (key) {
            case KafkaSettings.BOOTSTRAP_KEY:
                bootstrap = value;
                p = KafkaSettings.bootstrapProblem(value);
                break;
            case KafkaSettings.PREFIX_KEY:
                prefix = value;
                p = KafkaSettings.prefixProblem(value);
                break;
            case KafkaSettings.GROUP_KEY:
                group = value;
                p = value.isBlank() ? "'" + key + "' has no value" : null;
                break;
            default:
                p = KafkaSettings.keyProblem(key);
                if (p != null) {
                    problem(line, keyColumn, p);
                    return;
                }
                p = KafkaSettings.valueProblem(key, value);
                client.put(key, value);
        }
        if (p != null) {
            problem(line, valueColumn, p);
        }
    }

    private static boolean isSpace(char c) {
        return c == ' ' || c == '\t' || c == '\f';
    }

    /** Java properties escapes; null (with a problem recorded) on a malformed unicode escape. */
    private String unescape(String s, int line, int column) {
        if (s.indexOf('\\') < 0) {
            return s;
        }
        StringBuilder b = new StringBuilder(s.length());
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            if (c != '\\' || i == s.length() - 1) {
                b.append(c);
                continue;
            }
            char n = s.charAt(++i);
            switch (n) {
                case 't':
                    b.append('\t');
                    break;
                case 'n':
                    b.append('\n');
                    break;
                case 'r':
                    b.append('\r');
                    break;
                case 'f':
                    b.append('\f');
                    break;
                case 'u':
                    if (i + 4 >= s.length()) {
                        problem(line, column, "unfinished \\u escape: four hex digits needed");
                        return null;
                    }
                    try {
                        b.append((char) Integer.parseInt(s.substring(i + 1, i + 5), 16));
                    } catch (NumberFormatException e) {
                        problem(line, column, "bad \\u escape '\\u" + s.substring(i + 1, i + 5)
                                + "': four hex digits needed");
                        return null;
                    }
                    i += 4;
                    break;
                default:
                    b.append(n);
            }
        }
        return b.toString();
    }

    private void problem(int line, int column, String message) {
        problems.add(new Problem(source, line, column, message));
    }

    private KafkaSettings finish() {
        if (bootstrap == null) {
            problems.add(new Problem(source, 0, 0, KafkaSettings.BOOTSTRAP_KEY
                    + " is missing (host:port of at least one broker)"));
        }
        if (!problems.isEmpty()) {
            throw new InputRejectedException(problems);
        }
        return new KafkaSettings(bootstrap, prefix == null ? KafkaSettings.DEFAULT_PREFIX : prefix, group, client);
    }
}
