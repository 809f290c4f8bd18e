package org.pointcall.ingest.file;

import java.util.ArrayList;
import java.util.Collections;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;

import org.pointcall.shared.error.Problem;

/**
 * What reading a recorded file did, with exact counts: rows read, frames delivered, rows skipped by reason, cells
 * set to NaN per column, what the header left out. {@link #lines()} prints it for a user.
 */
public final class ReadReport {
    private final HeaderBinding binding;
    private final TimeForm timeForm;
    private final long rowsRead;
    private final long framesDelivered;
    private final Map<SkipReason, Long> skipped;
    private final long blankLines;
    private final List<ColumnCounts> columns;
    private final long cellsOutsideHeader;
    private final long rollovers;
    private final boolean anyTime;
    private final long firstTimeNs;
    private final long lastTimeNs;
    private final boolean complete;
    private final List<Problem> problems;
    private final long problemsNotKept;

    ReadReport(HeaderBinding binding, TimeForm timeForm, long rowsRead, long framesDelivered,
               Map<SkipReason, Long> skipped, long blankLines, List<ColumnCounts> columns, long cellsOutsideHeader,
               long rollovers, boolean anyTime, long firstTimeNs, long lastTimeNs, boolean complete,
               List<Problem> problems, long problemsNotKept) {
        this.binding = binding;
        this.timeForm = timeForm;
        this.rowsRead = rowsRead;
        this.framesDelivered = framesDelivered;
        this.skipped = Collections.unmodifiableMap(skipped.isEmpty() ? new EnumMap<>(SkipReason.class)
                : new EnumMap<>(skipped));
        this.blankLines = blankLines;
        this.columns = List.copyOf(columns);
        this.cellsOutsideHeader = cellsOutsideHeader;
        this.rollovers = rollovers;
        this.anyTime = anyTime;
        this.firstTimeNs = firstTimeNs;
        this.lastTimeNs = lastTimeNs;
        this.complete = complete;
        this.problems = List.copyOf(problems);
        this.problemsNotKept = problemsNotKept;
    }

    public String source() {
        return binding.source();
    }

    public HeaderBinding binding() {
        return binding;
    }

    /** Form of the time column, or {@code null} when no row had a readable time. */
    public TimeForm timeForm() {
        return timeForm;
    }

    /** Data rows seen after the header (blank lines not included); each is delivered or skipped. */
    public long rowsRead() {
        return rowsRead;
    }

    public long framesDelivered() {
        return framesDelivered;
    }

    public long rowsSkipped() {
        long n = 0;
        for (long v : skipped.values()) {
            n += v;
        }
        return n;
    }

    public long rowsSkipped(SkipReason reason) {
        return skipped.getOrDefault(reason, 0L);
    }

    /** Non-zero counts only. */
    public Map<SkipReason, Long> rowsSkippedByReason() {
        return skipped;
    }

    /** Lines (or spreadsheet rows) with no cell filled; they carry nothing and are not data rows. */
    public long blankLines() {
        return blankLines;
    }

    /** One entry per bound column, in file order. */
    public List<ColumnCounts> columns() {
        return columns;
    }

    public long blankCells(String parameter) {
        return counts(parameter).blank();
    }

    public long nonNumericCells(String parameter) {
        return counts(parameter).nonNumeric();
    }

    public long wildPoints(String parameter) {
        return counts(parameter).wildPoints();
    }

    public long wildPoints() {
        long n = 0;
        for (ColumnCounts c : columns) {
            n += c.wildPoints();
        }
        return n;
    }

    /** Spreadsheet cells with a value right of the last header cell, ignored. */
    public long cellsOutsideHeader() {
        return cellsOutsideHeader;
    }

    public List<String> ignoredColumns() {
        return binding.ignoredColumns();
    }

    public List<String> missingParameters() {
        return binding.missingParameters();
    }

    /** Times the time of day passed midnight (or a day-of-year time the new year). */
    public long rollovers() {
        return rollovers;
    }

    /** Time of the first delivered frame; meaningful when {@link #framesDelivered()} is not zero. */
    public long firstTimeNs() {
        return firstTimeNs;
    }

    public long lastTimeNs() {
        return lastTimeNs;
    }

    /** False when reading ended before the end of the file (read failure or stop). */
    public boolean complete() {
        return complete;
    }

    /** The first problems of each kind, in file order within a kind; the others are counted in the totals. */
    public List<Problem> problems() {
        return problems;
    }

    public long problemsNotKept() {
        return problemsNotKept;
    }

    private ColumnCounts counts(String parameter) {
        for (ColumnCounts c : columns) {
            if (c.parameter().equals(parameter)) {
                return c;
            }
        }
        throw new IllegalArgumentException("no column of " + binding.source() + " feeds parameter " + parameter);
    }

    /** The report in plain lines, the first a summary, the others indented details; no line when nothing to say. */
    public List<String> lines() {
        List<String> out = new ArrayList<>();
        out.add(source() + ": " + rowsRead + plural(rowsRead, " data row", " data rows") + " read, "
                + framesDelivered + plural(framesDelivered, " frame", " frames") + " delivered, " + rowsSkipped()
                + " skipped" + (complete ? "" : "; READING STOPPED BEFORE THE END OF THE FILE"));
        if (anyTime) {
            out.add("  time: column '" + binding.timeHeader() + "' (" + timeForm.label() + "), "
                    + TimeText.format(firstTimeNs, timeForm) + " to " + TimeText.format(lastTimeNs, timeForm)
                    + (rollovers > 0 ? ", crossing " + rollovers + (timeForm == TimeForm.DAY_OF_YEAR_TIME
                    ? plural(rollovers, " new year", " new years") : plural(rollovers, " midnight", " midnights"))
                    : ""));
        } else {
            out.add("  time: column '" + binding.timeHeader() + "', no row with a readable time");
        }
        for (Map.Entry<SkipReason, Long> e : skipped.entrySet()) {
            out.add("  skipped, " + e.getKey().label() + ": " + e.getValue());
        }
        if (blankLines > 0) {
            out.add("  blank lines: " + blankLines);
        }
        for (ColumnCounts c : columns) {
            if (c.blank() + c.nonNumeric() + c.wildPoints() == 0) {
                continue;
            }
            List<String> parts = new ArrayList<>();
            if (c.blank() > 0) {
                parts.add(c.blank() + " blank");
            }
            if (c.nonNumeric() > 0) {
                parts.add(c.nonNumeric() + " not a number");
            }
            if (c.wildPoints() > 0) {
                parts.add(c.wildPoints() + plural(c.wildPoints(), " wild point", " wild points"));
            }
            out.add("  " + c.parameter() + " (column '" + c.header() + "'): " + String.join(", ", parts)
                    + ", set to NaN");
        }
        if (!ignoredColumns().isEmpty()) {
            out.add("  ignored, not in the dictionary (" + ignoredColumns().size() + "): "
                    + String.join(", ", ignoredColumns()));
        }
        if (cellsOutsideHeader > 0) {
            out.add("  ignored, cells outside the header's columns: " + cellsOutsideHeader);
        }
        if (!missingParameters().isEmpty()) {
            out.add("  not in the file, NaN throughout (" + missingParameters().size() + "): "
                    + String.join(", ", missingParameters()));
        }
        if (problemsNotKept > 0) {
            out.add("  " + problemsNotKept + " more problems counted above but not listed");
        }
        return out;
    }

    @Override
    public String toString() {
        return String.join(System.lineSeparator(), lines());
    }

    private static String plural(long n, String one, String many) {
        return n == 1 ? one : many;
    }
}
