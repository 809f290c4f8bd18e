package org.pointcall.shared.error;

import java.util.Objects;

/**
 * One problem found in a user's input, located by source name, line and column (1-based; 0 when unknown).
 *
 * @param source  file name (or other source description) as the user gave it
 * @param line    1-based line, 0 when the problem concerns the whole source
 * @param column  1-based column, 0 when unknown
 * @param message plain-words reason, with the fix where one is obvious
 */
public record Problem(String source, int line, int column, String message) implements Comparable<Problem> {
    public Problem {
        Objects.requireNonNull(source, "source");
        Objects.requireNonNull(message, "message");
        if (line < 0 || column < 0) {
            throw new IllegalArgumentException("line and column must be >= 0");
        }
    }

    /**
     * {@code source:line:column: message}, the form compilers use, so editors can jump to it; the column is left out
     * when unknown ({@code source:line: message}) and the line too when it is unknown.
     */
    @Override
    public String toString() {
        if (line == 0) {
            return source + ": " + message;
        }
        if (column == 0) {
            return source + ":" + line + ": " + message;
        }
        return source + ":" + line + ":" + column + ": " + message;
    }

    @Override
    public int compareTo(Problem o) {
        int c = source.compareTo(o.source);
        if (c != 0) {
            return c;
        }
        c = Integer.compare(line, o.line);
        if (c != 0) {
            return c;
        }
        return Integer.compare(column, o.column);
    }
}
