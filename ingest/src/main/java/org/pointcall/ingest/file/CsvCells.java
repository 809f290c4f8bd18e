package org.pointcall.ingest.file;

/**
 * Splits a CSV line into cells in place: bounds into the line, quotes (RFC 4180 style, {@code ""} for a quote)
 * removed from the bounds, blanks around unquoted cells trimmed. Keeps the first {@code capacity} cells and counts
 * the rest.
 */
final class CsvCells implements RowCells {
    static final int UNCLOSED_QUOTE = -1;

    private final char separator;
    private final int capacity;
    private final int[] start;
    private final int[] end;
    private final int[] position;
    private final byte[] kind;
    private final boolean[] escaped;
    private CharSequence line;
    private int count;

    CsvCells(char separator, int capacity) {
        this.separator = separator;
        this.capacity = capacity;
        this.start = new int[capacity];
        this.end = new int[capacity];
        this.position = new int[capacity];
        this.kind = new byte[capacity];
        this.escaped = new boolean[capacity];
    }

    /** @return the number of cells on the line, or {@link #UNCLOSED_QUOTE} */
    int split(CharSequence text) {
        this.line = text;
        int len = text.length();
        int n = 0;
        int i = 0;
        while (true) {
            int cellStart = i;
            int p = i;
            while (p < len && isPad(text.charAt(p))) {
                p++;
            }
            int a;
            int b;
            int next;
            boolean esc = false;
            if (p < len && text.charAt(p) == '"') {
                int q = p + 1;
                while (true) {
                    if (q >= len) {
                        return UNCLOSED_QUOTE;
                    }
                    char c = text.charAt(q);
                    if (c == '"') {
                        if (q + 1 < len && text.charAt(q + 1) == '"') {
                            esc = true;
                            q += 2;
                            continue;
                        }
                        break;
                    }
                    q++;
                }
                a = p + 1;
                b = q;
                next = q + 1;
                while (next < len && isPad(text.charAt(next))) {
                    next++;
                }
                if (next < len && text.charAt(next) != separator) {
                    // text after the closing quote: keep the cell as written, it will not parse as a number
                    a = p;
                    while (next < len && text.charAt(next) != separator) {
                        next++;
                    }
                    b = next;
                }
            } else {
                next = p;
                while (next < len && text.charAt(next) != separator) {
                    next++;
                }
                a = p;
                b = next;
                while (b > a && isPad(text.charAt(b - 1))) {
                    b--;
                }
            }
            if (n < capacity) {
                start[n] = a;
                end[n] = b;
                position[n] = cellStart + 1;
                kind[n] = a == b ? BLANK : TEXT;
                escaped[n] = esc;
            }
            n++;
            if (next >= len) {
                count = n;
                return n;
            }
            i = next + 1;
        }
    }

    /** True when every kept cell of the last split line is empty. */
    boolean allBlank() {
        for (int i = 0; i < Math.min(count, capacity); i++) {
            if (kind[i] != BLANK) {
                return false;
            }
        }
        return count <= capacity;
    }

    /** The cell's text with quotes undone, for headers. */
    String unescaped(int column) {
        String s = line.subSequence(start[column], end[column]).toString();
        return escaped[column] ? s.replace("\"\"", "\"") : s;
    }

    private boolean isPad(char c) {
        return c == ' ' || (c == '\t' && separator != '\t') || c == '\u00a0';
    }

    @Override
    public byte kind(int column) {
        return kind[column];
    }

    @Override
    public CharSequence text(int column) {
        return line;
    }

    @Override
    public int textStart(int column) {
        return start[column];
    }

    @Override
    public int textEnd(int column) {
        return end[column];
    }

    @Override
    public int position(int column) {
        return position[column];
    }

    @Override
    public String cellReference(int column) {
        return null;
    }

    /** The separator a header line uses: the most frequent of ';', tab and ',' outside quotes (',' when none). */
    static char detectSeparator(CharSequence header) {
        int semicolons = 0;
        int tabs = 0;
        int commas = 0;
        boolean quoted = false;
        for (int i = 0; i < header.length(); i++) {
            char c = header.charAt(i);
            if (c == '"') {
                quoted = !quoted;
            } else if (!quoted) {
                if (c == ';') {
                    semicolons++;
                } else if (c == '\t') {
                    tabs++;
                } else if (c == ',') {
                    commas++;
                }
            }
        }
        if (semicolons > 0 && semicolons >= commas && semicolons >= tabs) {
            return ';';
        }
        if (tabs > 0 && tabs >= commas) {
            return '\t';
        }
        return ',';
    }
}
