package org.pointcall.ingest.file;

import java.io.IOException;
import java.io.Reader;

/**
 * Reads text line by line into one reused buffer, so a file of any size streams without a string per line, and a
 * line longer than {@code maxChars} (binary data, a missing line end) is cut and flagged instead of filling the heap.
 * Ends lines at LF, CR LF or CR.
 */
final class LineReader implements AutoCloseable {
    private final Reader in;
    private final int maxChars;
    private final char[] chunk = new char[1 << 16];
    private int pos;
    private int limit;
    private char[] buf = new char[512];
    private int length;
    private boolean tooLong;
    private boolean skipLf;
    private final Text text = new Text();

    LineReader(Reader in, int maxChars) {
        this.in = in;
        this.maxChars = maxChars;
    }

    /** Reads the next line; false at the end of the input. */
    boolean next() throws IOException {
        length = 0;
        tooLong = false;
        boolean any = false;
        while (true) {
            if (pos >= limit) {
                int n = in.read(chunk, 0, chunk.length);
                if (n < 0) {
                    return any;
                }
                pos = 0;
                limit = n;
                continue;
            }
            char c = chunk[pos++];
            if (skipLf) {
                skipLf = false;
                if (c == '\n') {
                    continue;
                }
            }
            any = true;
            if (c == '\n') {
                return true;
            }
            if (c == '\r') {
                skipLf = true;
                return true;
            }
            if (length == buf.length) {
                if (length >= maxChars) {
                    tooLong = true;
                    continue;
                }
                buf = java.util.Arrays.copyOf(buf, Math.min(maxChars, buf.length * 2));
            }
            buf[length++] = c;
        }
    }

    /** The current line, valid until the next call of {@link #next()}. */
    CharSequence line() {
        return text;
    }

    /** True when the current line was longer than the limit and was cut. */
    boolean tooLong() {
        return tooLong;
    }

    @Override
    public void close() throws IOException {
        in.close();
    }

    /** A view of the buffer; {@code toString} copies. */
    private final class Text implements CharSequence {
        @Override
        public int length() {
            return length;
        }

        @Override
        public char charAt(int index) {
            return buf[index];
        }

        @Override
        public CharSequence subSequence(int start, int end) {
            return new String(buf, start, end - start);
        }

        @Override
        public String toString() {
            return new String(buf, 0, length);
        }
    }
}
