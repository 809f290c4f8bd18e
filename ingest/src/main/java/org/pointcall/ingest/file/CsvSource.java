package org.pointcall.ingest.file;

import java.io.BufferedInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.nio.charset.Charset;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.charset.UnsupportedCharsetException;
import java.nio.file.AccessDeniedException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

import org.pointcall.ingest.frame.FrameSink;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.InputRejectedException;
import org.pointcall.shared.error.Problem;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;

/**
 * A CSV time history, streamed line by line (one reused line buffer; the file is never held in memory). The
 * separator (comma, semicolon or tab) is taken from the header line; with a semicolon or tab a decimal comma is
 * accepted too ({@code 12,5}). Text is UTF-8 (a byte-order mark, also UTF-16, is honoured); a header that is not
 * valid UTF-8 is read as Windows-1252, the usual spreadsheet export.
 */
public final class CsvSource implements RecordedFileSource {
    /** Longest line read; a longer one is skipped and counted. */
    static final int MAX_LINE_CHARS = 1 << 20;
    private static final Logger LOG = LoggerFactory.getLogger(CsvSource.class);

    private final String source;
    private final LineReader reader;
    private final ColumnPlan plan;
    private final int slots;
    private final char separator;
    private final ReadOptions options;
    private int lineNo;
    private volatile boolean stopRequested;
    private boolean used;
    private boolean closed;

    private CsvSource(String source, LineReader reader, ColumnPlan plan, int slots, char separator, int lineNo,
                      ReadOptions options) {
        this.source = source;
        this.reader = reader;
        this.plan = plan;
        this.slots = slots;
        this.separator = separator;
        this.lineNo = lineNo;
        this.options = options;
    }

    /**
     * Opens {@code file} and binds its header to {@code dictionary}.
     *
     * @throws InputRejectedException with every problem found when the file cannot be read as a time history of
     *                                this dictionary (unreadable, empty, no time column, unit mismatch...)
     */
    public static CsvSource open(Path file, ParameterDictionary dictionary, ReadOptions options) {
        Objects.requireNonNull(file, "file");
        Objects.requireNonNull(dictionary, "dictionary");
        Objects.requireNonNull(options, "options");
        String source = options.sourceName() != null ? options.sourceName() : file.toString();
        Opened first = openText(file, source, null);
        Opened text = first;
        if (!first.bomFound && first.header != null && first.header.indexOf('\ufffd') >= 0) {
            first.close();
            text = openText(file, source, windows1252());
        }
        try {
            String header = text.header;
            if (header == null) {
                throw rejected(source, 0, "empty file: no header row");
            }
            if (header.indexOf('\u0000') >= 0) {
                throw rejected(source, text.lineNo, "binary data in the first line: not a CSV text file");
            }
            if (text.headerTooLong) {
                throw rejected(source, text.lineNo, "first line longer than " + MAX_LINE_CHARS
                        + " characters: not a CSV header");
            }
            char sep = CsvCells.detectSeparator(header);
            CsvCells cells = new CsvCells(sep, 4096);
            int n = cells.split(header);
            if (n == CsvCells.UNCLOSED_QUOTE) {
                throw rejected(source, text.lineNo, "unclosed quote in the header");
            }
            if (n > 4096) {
                throw rejected(source, text.lineNo, "more than 4096 columns in the header");
            }
            List<String> headers = new ArrayList<>(n);
            int[] positions = new int[n];
            for (int i = 0; i < n; i++) {
                headers.add(cells.unescaped(i).trim());
                positions[i] = cells.position(i);
            }
            ColumnPlan plan = HeaderBinder.bind(source, text.lineNo, headers, positions, null, dictionary, options);
            logBinding(plan.binding);
            return new CsvSource(source, text.reader, plan, dictionary.size(), sep, text.lineNo, options);
        } catch (RuntimeException e) {
            text.close();
            throw e;
        }
    }

    /** The separator found in the header. */
    public char separator() {
        return separator;
    }

    @Override
    public HeaderBinding binding() {
        return plan.binding;
    }

    @Override
    public ReadReport readAll(FrameSink sink) {
        Objects.requireNonNull(sink, "sink");
        if (used || closed) {
            throw new IllegalStateException(source + " was already read or closed");
        }
        used = true;
        RowDecoder decoder = new RowDecoder(source, plan, slots,
                new ProblemLog(source, options.problemLimit(), LOG), separator != ',');
        CsvCells cells = new CsvCells(separator, plan.width);
        int width = plan.width;
        try {
            while (!stopRequested && reader.next()) {
                lineNo++;
                CharSequence line = reader.line();
                if (reader.tooLong()) {
                    decoder.startDataRow();
                    decoder.skip(SkipReason.LINE_TOO_LONG, lineNo, 0, "line longer than " + MAX_LINE_CHARS
                            + " characters");
                    continue;
                }
                int n = cells.split(line);
                if (n == CsvCells.UNCLOSED_QUOTE) {
                    decoder.startDataRow();
                    decoder.skip(SkipReason.UNCLOSED_QUOTE, lineNo, 0, "unclosed quote");
                    continue;
                }
                if (cells.allBlank()) {
                    decoder.blankLines(1);
                    continue;
                }
                decoder.startDataRow();
                if (n < width) {
                    decoder.skip(SkipReason.TOO_FEW_CELLS, lineNo, 0, "truncated line: " + n + " of " + width
                            + " cells");
                } else if (n > width) {
                    decoder.skip(SkipReason.TOO_MANY_CELLS, lineNo, 0, "too many cells: " + n
                            + ", the header has " + width);
                } else {
                    decoder.decode(cells, lineNo, sink);
                }
            }
        } catch (IOException e) {
            decoder.failed(lineNo + 1, "cannot read on (" + describe(e) + "); the rest of the file is not read");
        }
        if (stopRequested) {
            decoder.stopped();
        }
        return decoder.report();
    }

    @Override
    public void stop() {
        stopRequested = true;
    }

    @Override
    public void close() {
        if (!closed) {
            closed = true;
            try {
                reader.close();
            } catch (IOException e) {
                LOG.debug("{}: closing: {}", source, e.toString());
            }
        }
    }

    /** The text reader at the first non-blank line, or a rejection when the file cannot be read as text. */
    private static Opened openText(Path file, String source, Charset forced) {
        if (Files.isDirectory(file)) {
            throw rejected(source, 0, "is a directory, not a file");
        }
        InputStream raw;
        try {
            raw = Files.newInputStream(file);
        } catch (NoSuchFileException e) {
            throw rejected(source, 0, "cannot read: no such file");
        } catch (AccessDeniedException e) {
            throw rejected(source, 0, "cannot read: permission denied");
        } catch (IOException e) {
            throw rejected(source, 0, "cannot read: " + describe(e));
        }
        Opened o = new Opened();
        try {
            BufferedInputStream in = new BufferedInputStream(raw, 1 << 16);
            in.mark(4);
            byte[] head = new byte[4];
            int got = in.readNBytes(head, 0, 4);
            in.reset();
            Charset cs = forced != null ? forced : StandardCharsets.UTF_8;
            int skip = 0;
            if (got >= 3 && (head[0] & 0xff) == 0xEF && (head[1] & 0xff) == 0xBB && (head[2] & 0xff) == 0xBF) {
                cs = StandardCharsets.UTF_8;
                skip = 3;
            } else if (got >= 2 && (head[0] & 0xff) == 0xFF && (head[1] & 0xff) == 0xFE) {
                cs = StandardCharsets.UTF_16LE;
                skip = 2;
            } else if (got >= 2 && (head[0] & 0xff) == 0xFE && (head[1] & 0xff) == 0xFF) {
                cs = StandardCharsets.UTF_16BE;
                skip = 2;
            } else if (got == 4 && head[0] == 'P' && head[1] == 'K' && head[2] == 3 && head[3] == 4) {
                in.close();
                throw rejected(source, 0, "this is a zip archive (an .xlsx workbook?), not CSV text; "
                        + "give a workbook the .xlsx extension");
            } else if (got == 4 && (head[0] & 0xff) == 0xD0 && (head[1] & 0xff) == 0xCF && head[2] == 0x11
                    && (head[3] & 0xff) == 0xE0) {
                in.close();
                throw rejected(source, 0, "this is an old binary Excel (.xls) file, not CSV text; save it as "
                        + ".xlsx or .csv");
            }
            in.skipNBytes(skip);
            o.bomFound = skip > 0;
            o.reader = new LineReader(new InputStreamReader(in, cs.newDecoder()
                    .onMalformedInput(CodingErrorAction.REPLACE)
                    .onUnmappableCharacter(CodingErrorAction.REPLACE)), MAX_LINE_CHARS);
            while (o.reader.next()) {
                o.lineNo++;
                String line = o.reader.line().toString();
                if (!line.isBlank()) {
                    o.header = line.startsWith("\ufeff") ? line.substring(1) : line;
                    o.headerTooLong = o.reader.tooLong();
                    break;
                }
            }
            return o;
        } catch (IOException e) {
            o.close();
            try {
                raw.close();
            } catch (IOException ignored) {
                // the read failure is what the user needs to see
            }
            throw rejected(source, 0, "cannot read: " + describe(e));
        }
    }

    private static Charset windows1252() {
        try {
            return Charset.forName("windows-1252");
        } catch (UnsupportedCharsetException e) {
            return StandardCharsets.ISO_8859_1;
        }
    }

    private static InputRejectedException rejected(String source, int line, String message) {
        return new InputRejectedException(List.of(new Problem(source, line, 0, message)));
    }

    static String describe(IOException e) {
        String m = e.getMessage();
        return e.getClass().getSimpleName() + (m == null || m.isBlank() ? "" : ": " + m);
    }

    static void logBinding(HeaderBinding b) {
        LOG.info("{}: time from column '{}', {} bound", b.source(), b.timeHeader(),
                count(b.columns().size(), "column", "columns"));
        if (!b.ignoredColumns().isEmpty()) {
            LOG.warn("{}: {} not in the dictionary, ignored: {}", b.source(),
                    count(b.ignoredColumns().size(), "column", "columns"), String.join(", ", b.ignoredColumns()));
        }
        if (!b.missingParameters().isEmpty()) {
            LOG.warn("{}: {} not in the file, NaN throughout: {}", b.source(),
                    count(b.missingParameters().size(), "dictionary parameter", "dictionary parameters"),
                    String.join(", ", b.missingParameters()));
        }
    }

    private static String count(int n, String one, String many) {
        return n + " " + (n == 1 ? one : many);
    }

    /** A text reader positioned after the header line. */
    private static final class Opened {
        LineReader reader;
        String header;
        boolean headerTooLong;
        boolean bomFound;
        int lineNo;

        void close() {
            if (reader != null) {
                try {
                    reader.close();
                } catch (IOException e) {
                    LOG.debug("closing: {}", e.toString());
                }
            }
        }
    }
}
