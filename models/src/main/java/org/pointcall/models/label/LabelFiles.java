package org.pointcall.models.label;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

import org.pointcall.ingest.file.TimeForm;
import org.pointcall.shared.error.InputRejectedException;
import org.pointcall.shared.error.Problem;
import org.pointcall.shared.kind.ManoeuvreKind;

/**
 * Reads label files: the CSV a user writes to say which test points a recording holds.
 *
 * <pre>
 * # sortie 12, labelled from the test card and the crew's notes
 * kind,begin,end,card_id,note
 * stall-level,1203.5,1241.0,S-01,clean configuration
 * loop,00:41:12.250,00:42:03.000,L-02,"entry a little fast, 5 kt"
 * </pre>
 *
 * <p>A header row names the columns, in any order and any case: {@code kind}, {@code begin} and {@code end} are
 * required, {@code card_id} and {@code note} optional. Blank lines and lines starting with {@code #} are skipped.
 * Cells are separated by commas; a cell in double quotes may hold commas, and {@code ""} inside it is one quote.
 * {@code kind} is a manoeuvre kind key ({@link ManoeuvreKind#keys()}); time outside every interval is {@code none}
 * and is not written. {@code begin} and {@code end} are in the recording's time: seconds of its time column
 * ({@code 1203.5}), a time of day {@code HH:MM:SS.sss} or a day-of-year time {@code DDD:HH:MM:SS.sss}, one form
 * throughout the file; a time of day that falls by more than half a day from the one before it (in file order) has
 * passed midnight. Each interval is {@code [begin, end)}: end after begin; intervals may touch but not overlap; a
 * card id labels one interval only.
 *
 * <p>Every problem is found before anything is refused, each as {@code file:line:column: what}, so a user fixes
 * them all at once.
 */
public final class LabelFiles {
    /** Required columns, in the order the documentation lists them. */
    public static final List<String> REQUIRED = List.of("kind", "begin", "end");
    /** Optional columns. */
    public static final List<String> OPTIONAL = List.of("card_id", "note");

    private LabelFiles() {
    }

    /**
     * Reads {@code file}; problems name it as given.
     *
     * @throws InputRejectedException with every problem found, sorted by line and column; nothing is returned from
     *                                a file with a problem
     */
    public static Labels load(Path file) {
        String source = file.toString();
        byte[] bytes;
        try {
            bytes = Files.readAllBytes(file);
        } catch (java.nio.file.NoSuchFileException e) {
            throw new InputRejectedException(List.of(new Problem(source, 0, 0, "no such label file")));
        } catch (IOException e) {
            throw new InputRejectedException(List.of(new Problem(source, 0, 0, "cannot read the label file: "
                    + e.getMessage())));
        }
        String text;
        try {
            text = StandardCharsets.UTF_8.newDecoder().onMalformedInput(CodingErrorAction.REPORT)
                    .onUnmappableCharacter(CodingErrorAction.REPORT).decode(ByteBuffer.wrap(bytes)).toString();
        } catch (CharacterCodingException e) {
            throw new InputRejectedException(List.of(new Problem(source, 0, 0,
                    "not UTF-8 text; save the label file as UTF-8 CSV")));
        }
        return parse(text, source);
    }

    /** Parses label-file text; {@code sourceName} names it in problems. */
    public static Labels parse(String text, String sourceName) {
        return new Parser(sourceName).run(text);
    }

    private record Cell(String text, int column) {
    }

    private static final class Parser {
        private final String source;
        private final List<Problem> problems = new ArrayList<>();
        private final Map<String, Integer> cardLines = new HashMap<>();
        private final Map<Integer, Integer> beginColumns = new HashMap<>();
        private final List<LabelInterval> intervals = new ArrayList<>();
        private TimeForm form;
        private int formLine;
        private boolean havePrevious;
        private long previousNs;
        private long rolloverNs;

        Parser(String source) {
            this.source = source;
        }

        Labels run(String text) {
            if (!text.isEmpty() && text.charAt(0) == '\uFEFF') {
                text = text.substring(1);
            }
            String[] lines = text.split("\n", -1);
            int[] columnOf = null;
            for (int i = 0; i < lines.length; i++) {
                String line = lines[i].endsWith("\r") ? lines[i].substring(0, lines[i].length() - 1) : lines[i];
                String stripped = line.strip();
                if (stripped.isEmpty() || stripped.startsWith("#")) {
                    continue;
                }
                int lineNo = i + 1;
                List<Cell> cells = split(line, lineNo);
                if (cells == null) {
                    if (columnOf == null) {
                        break;
                    }
                    continue;
                }
                if (columnOf == null) {
                    columnOf = header(cells, lineNo);
                    if (columnOf == null) {
                        break;
                    }
                    continue;
                }
                row(cells, columnOf, lineNo);
            }
            if (columnOf == null && problems.isEmpty()) {
                problems.add(new Problem(source, 0, 0, "empty label file: it needs a header row (" + headerText()
                        + ") and one row per labelled point"));
            }
            if (columnOf != null) {
                List<LabelInterval> sorted = Labels.sortedByBegin(intervals);
                Labels.overlapProblems(source, sorted, beginColumns, form == null ? TimeForm.SECONDS : form,
                        problems);
            }
            if (!problems.isEmpty()) {
                throw new InputRejectedException(problems);
            }
            return Labels.of(source, form == null ? TimeForm.SECONDS : form, intervals);
        }

        private static String headerText() {
            return String.join(",", REQUIRED) + " and optionally " + String.join(",", OPTIONAL);
        }

        /** Column index of each known name (kind, begin, end, card_id, note), -1 when absent; null when fatal. */
        private int[] header(List<Cell> cells, int line) {
            List<String> known = new ArrayList<>(REQUIRED);
            known.addAll(OPTIONAL);
            int[] columnOf = new int[known.size()];
            java.util.Arrays.fill(columnOf, -1);
            boolean fatal = false;
            for (int c = 0; c < cells.size(); c++) {
                String name = cells.get(c).text().strip().toLowerCase(Locale.ROOT);
                int k = known.indexOf(name);
                if (k < 0) {
                    problems.add(new Problem(source, line, cells.get(c).column(), "unknown column '"
                            + cells.get(c).text().strip() + "'; a label file has columns " + headerText()));
                    fatal = true;
                } else if (columnOf[k] >= 0) {
                    problems.add(new Problem(source, line, cells.get(c).column(), "column '" + name
                            + "' is given twice"));
                    fatal = true;
                } else {
                    columnOf[k] = c;
                }
            }
            for (int k = 0; k < REQUIRED.size(); k++) {
                if (columnOf[k] < 0) {
                    problems.add(new Problem(source, line, 0, "missing column '" + REQUIRED.get(k)
                            + "'; a label file has columns " + headerText()));
                    fatal = true;
                }
            }
            return fatal ? null : columnOf;
        }

        private void row(List<Cell> cells, int[] columnOf, int line) {
            int width = 0;
            for (int c : columnOf) {
                width = Math.max(width, c + 1);
            }
            if (cells.size() > width) {
                problems.add(new Problem(source, line, cells.get(width).column(), "row has " + cells.size()
                        + " cells but the header names " + width + " columns"));
                return;
            }
            Cell kindCell = cell(cells, columnOf[0], line);
            Cell beginCell = cell(cells, columnOf[1], line);
            Cell endCell = cell(cells, columnOf[2], line);
            String cardId = columnOf[3] < 0 ? "" : cell(cells, columnOf[3], line).text().strip();
            String note = columnOf[4] < 0 ? "" : cell(cells, columnOf[4], line).text().strip();
            ManoeuvreKind kind = kind(kindCell, line);
            long begin = time(beginCell, "begin", line);
            long end = time(endCell, "end", line);
            boolean ok = kind != null && begin != Long.MIN_VALUE && end != Long.MIN_VALUE;
            if (begin != Long.MIN_VALUE && end != Long.MIN_VALUE && end <= begin) {
                problems.add(new Problem(source, line, endCell.column(), "end " + LabelTimeText.format(end, form)
                        + " is not after begin " + LabelTimeText.format(begin, form)));
                ok = false;
            }
            if (!cardId.isEmpty()) {
                Integer first = cardLines.putIfAbsent(cardId, line);
                if (first != null) {
                    problems.add(new Problem(source, line, cell(cells, columnOf[3], line).column(), "card id '"
                            + cardId + "' already labels line " + first + "; a card point is flown once per "
                            + "interval (give a repeat its own id, for example " + cardId + "-R1)"));
                    ok = false;
                }
            }
            if (ok) {
                intervals.add(new LabelInterval(kind, begin, end, cardId, note, line));
                beginColumns.put(line, beginCell.column());
            }
        }

        /** The cell at {@code index}, or an empty one positioned at the line's end when the row is short. */
        private static Cell cell(List<Cell> cells, int index, int line) {
            if (index < cells.size()) {
                return cells.get(index);
            }
            Cell last = cells.get(cells.size() - 1);
            return new Cell("", last.column() + last.text().length());
        }

        private ManoeuvreKind kind(Cell c, int line) {
            String key = c.text().strip();
            if (key.isEmpty()) {
                problems.add(new Problem(source, line, c.column(), "kind is empty; kinds are "
                        + ManoeuvreKind.keys()));
                return null;
            }
            ManoeuvreKind k = ManoeuvreKind.byKey(key).or(() -> ManoeuvreKind.byKey(key.toLowerCase(Locale.ROOT)))
                    .orElse(null);
            if (k == null) {
                problems.add(new Problem(source, line, c.column(), "unknown kind '" + key + "'; kinds are "
                        + ManoeuvreKind.keys() + (key.equalsIgnoreCase("none") || key.equalsIgnoreCase("transit")
                        ? " (time outside every interval is none: leave it out)" : "")));
            }
            return k;
        }

        /** Nanoseconds on the file's time line, or {@link Long#MIN_VALUE} after adding a problem. */
        private long time(Cell c, String what, int line) {
            String[] why = new String[1];
            LabelTimeText.Parsed p = LabelTimeText.parse(c.text(), why);
            if (p == null) {
                problems.add(new Problem(source, line, c.column(), what + " " + why[0]));
                return Long.MIN_VALUE;
            }
            if (form == null) {
                form = p.form();
                formLine = line;
            } else if (p.form() != form) {
                problems.add(new Problem(source, line, c.column(), what + " is written as " + p.form().label()
                        + " but line " + formLine + " gives " + form.label() + "; use one form throughout"));
                return Long.MIN_VALUE;
            }
            long t = p.ns();
            if (form == TimeForm.TIME_OF_DAY) {
                // the instant nearest the previous time, as the recorded-file reader crosses midnight
                t += rolloverNs;
                if (havePrevious) {
                    long half = LabelTimeText.NS_PER_DAY / 2;
                    if (t < previousNs - half) {
                        rolloverNs += LabelTimeText.NS_PER_DAY;
                        t += LabelTimeText.NS_PER_DAY;
                    } else if (t > previousNs + half) {
                        t -= LabelTimeText.NS_PER_DAY;
                    }
                }
                havePrevious = true;
                previousNs = t;
            }
            return t;
        }

        /** Splits one line at commas outside double quotes; null after a problem (an unclosed quote). */
        private List<Cell> split(String line, int lineNo) {
            List<Cell> cells = new ArrayList<>();
            StringBuilder b = new StringBuilder();
            int i = 0;
            int n = line.length();
            while (true) {
                int start = i;
                b.setLength(0);
                int j = i;
                while (j < n && (line.charAt(j) == ' ' || line.charAt(j) == '\t')) {
                    j++;
                }
                if (j < n && line.charAt(j) == '"') {
                    int k = j + 1;
                    boolean closed = false;
                    while (k < n) {
                        char ch = line.charAt(k);
                        if (ch == '"') {
                            if (k + 1 < n && line.charAt(k + 1) == '"') {
                                b.append('"');
                                k += 2;
                                continue;
                            }
                            closed = true;
                            k++;
                            break;
                        }
                        b.append(ch);
                        k++;
                    }
                    if (!closed) {
                        problems.add(new Problem(source, lineNo, j + 1, "quote opened here is not closed on this "
                                + "line"));
                        return null;
                    }
                    while (k < n && line.charAt(k) != ',') {
                        if (line.charAt(k) != ' ' && line.charAt(k) != '\t') {
                            problems.add(new Problem(source, lineNo, k + 1, "text after a closing quote; put the "
                                    + "whole cell in quotes"));
                            return null;
                        }
                        k++;
                    }
                    cells.add(new Cell(b.toString(), j + 1));
                    i = k;
                } else {
                    int k = start;
                    while (k < n && line.charAt(k) != ',') {
                        k++;
                    }
                    cells.add(new Cell(line.substring(start, k), start + 1));
                    i = k;
                }
                if (i >= n) {
                    return cells;
                }
                i++;
                if (i == n) {
                    cells.add(new Cell("", n + 1));
                    return cells;
                }
            }
        }
    }
}
