package org.pointcall.ingest.file;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;

import org.pointcall.ingest.frame.Frame;
import org.pointcall.ingest.frame.FrameSink;
import org.pointcall.shared.dictionary.Parameter;
import org.pointcall.shared.error.Problem;

/**
 * Turns rows into frames, the same for every file format: time first (a row without a usable, increasing time is
 * skipped whole), then each bound cell parsed, calibrated, converted and range-checked. Allocates nothing per row
 * unless a problem is to be recorded.
 */
final class RowDecoder {
    private static final double US_PER_DAY = 86_400.0e6;
    private static final int MAX_QUOTED_CHARS = 40;

    private final String source;
    private final ColumnPlan plan;
    private final ProblemLog log;
    private final boolean decimalComma;
    private final Frame frame;
    private final DecimalText decimal = new DecimalText();
    private final TimeText timeText = new TimeText();

    private final long[] skipped = new long[SkipReason.values().length];
    private final long[] blank;
    private final long[] nonNumeric;
    private final long[] wild;
    private long dataRows;
    private long delivered;
    private long blankLines;
    private long outsideHeader;
    private boolean complete = true;
    private boolean gapPending;

    private TimeForm form;
    private boolean haveTime;
    private long firstNs;
    private long lastNs;
    private long rolloverNs;
    private long rollovers;

    RowDecoder(String source, ColumnPlan plan, int slots, ProblemLog log, boolean decimalComma) {
        this.source = source;
        this.plan = plan;
        this.log = log;
        this.decimalComma = decimalComma;
        this.frame = new Frame(slots);
        this.blank = new long[plan.bound()];
        this.nonNumeric = new long[plan.bound()];
        this.wild = new long[plan.bound()];
    }

    /** A row with no cell filled: not data, counted apart. */
    void blankLines(long n) {
        blankLines += n;
    }

    /** Counts a new data row and returns its number, the sequence of its frame. */
    long startDataRow() {
        return ++dataRows;
    }

    /** Drops the current data row for {@code reason}. */
    void skip(SkipReason reason, int line, int column, String message) {
        skipped[reason.ordinal()]++;
        gapPending = true;
        if (log.admit(reason.ordinal())) {
            log.record(new Problem(source, line, column, message + "; row skipped"));
        }
    }

    /** A cell with a value right of the last header cell (spreadsheets only: CSV counts cells per line). */
    void outsideHeader(int line, int column, String reference) {
        outsideHeader++;
        if (log.admit(ProblemLog.OUTSIDE_HEADER)) {
            log.record(new Problem(source, line, column, "cell " + reference
                    + " has a value but its column has no header; ignored"));
        }
    }

    /** Reading ended before the end of the file. */
    void failed(int line, String message) {
        complete = false;
        if (log.admit(ProblemLog.READ_FAILURE)) {
            log.record(new Problem(source, line, 0, message));
        }
    }

    void stopped() {
        complete = false;
    }

    void decode(RowCells cells, int line, FrameSink sink) {
        int tc = plan.timeColumn;
        byte kind = cells.kind(tc);
        if (kind == RowCells.BLANK) {
            skip(SkipReason.NO_TIME, line, cells.position(tc), "no time in column '" + plan.binding.timeHeader() + "'");
            return;
        }
        CharSequence text = cells.text(tc);
        int from = cells.textStart(tc);
        int to = cells.textEnd(tc);
        long raw;
        TimeForm f;
        if (kind == RowCells.DAYS) {
            double days = decimal.scan(text, from, to, false) ? decimal.toDouble(text) : Double.NaN;
            if (!(days >= 0) || days > 100_000) {
                skip(SkipReason.BAD_TIME, line, cells.position(tc), "time '" + quote(text, from, to)
                        + "' is not a spreadsheet date or time");
                return;
            }
            // a day count carries about 1 us at present-day dates: finer digits are rounding noise
            raw = Math.round(days * US_PER_DAY) * 1000L;
            f = days < 1.0 ? TimeForm.TIME_OF_DAY : TimeForm.SPREADSHEET_DATE;
        } else if (kind == RowCells.TEXT && TimeText.hasColon(text, from, to)) {
            if (!timeText.parse(text, from, to, decimalComma)) {
                skip(SkipReason.BAD_TIME, line, cells.position(tc), "time '" + quote(text, from, to)
                        + "' is not a time of day HH:MM:SS[.s] or DDD:HH:MM:SS[.s]");
                return;
            }
            raw = timeText.ns();
            f = timeText.form();
        } else if (kind == RowCells.TEXT && decimal.scan(text, from, to, decimalComma)) {
            if (!decimal.toNs(text, plan.timeNsPerUnit)) {
                skip(SkipReason.BAD_TIME, line, cells.position(tc), "time '" + quote(text, from, to)
                        + "' is out of range");
                return;
            }
            raw = decimal.ns();
            f = TimeForm.SECONDS;
        } else {
            boolean nonFinite = DecimalText.isNonFiniteWord(text, from, to);
            skip(SkipReason.BAD_TIME, line, cells.position(tc), "time '" + quote(text, from, to) + "' is "
                    + (nonFinite ? "not a finite number" : "not a number of seconds or a time of day"));
            return;
        }
        if (form == null) {
            form = f;
        } else if (!f.compatibleWith(form)) {
            skip(SkipReason.BAD_TIME, line, cells.position(tc), "time '" + quote(text, from, to) + "' is a "
                    + f.label() + ", but earlier rows give a " + form.label());
            return;
        }
        // a time of day (or day-of-year time) is taken as the instant nearest the last one: falling by more than
        // half a day it has passed midnight, rising by more it is a step back just across midnight
        long t = raw;
        long rollover = 0;
        if (f == TimeForm.TIME_OF_DAY || f == TimeForm.DAY_OF_YEAR_TIME) {
            t += rolloverNs;
            if (haveTime) {
                // the new year starts the day after the last day seen (365 or 366)
                long period = f == TimeForm.DAY_OF_YEAR_TIME
                        ? ((lastNs - rolloverNs) / TimeText.NS_PER_DAY + 1) * TimeText.NS_PER_DAY
                        : TimeText.NS_PER_DAY;
                if (t < lastNs - period / 2) {
                    rollover = period;
                } else if (t > lastNs + period / 2) {
                    t -= period;
                }
                t += rollover;
            }
        }
        if (haveTime && t <= lastNs) {
            if (t < lastNs) {
                skip(SkipReason.TIME_BACKWARDS, line, 0, "time goes backwards ("
                        + TimeText.format(t, form) + " after " + TimeText.format(lastNs, form) + ")");
            } else {
                skip(SkipReason.TIME_REPEATED, line, 0, "time repeats ("
                        + TimeText.format(t, form) + ")");
            }
            return;
        }
        if (rollover != 0) {
            rolloverNs += rollover;
            rollovers++;
        }

        frame.clear();
        boolean wildRow = false;
        for (int k = 0; k < plan.column.length; k++) {
            int c = plan.column[k];
            byte ck = cells.kind(c);
            if (ck == RowCells.BLANK) {
                blank[k]++;
                continue;
            }
            CharSequence s = cells.text(c);
            int a = cells.textStart(c);
            int b = cells.textEnd(c);
            double v = ck != RowCells.ERROR && decimal.scan(s, a, b, decimalComma) ? decimal.toDouble(s) : Double.NaN;
            if (!Double.isFinite(v)) {
                nonNumeric[k]++;
                if (log.admit(ProblemLog.NOT_A_NUMBER)) {
                    String why = ck == RowCells.ERROR ? "is a spreadsheet error"
                            : DecimalText.isNonFiniteWord(s, a, b) || decimal.scan(s, a, b, decimalComma)
                            ? "is not a finite number" : "is not a number";
                    log.record(new Problem(source, line, cells.position(c), where(cells, c, k) + ": '"
                            + quote(s, a, b) + "' " + why + "; cell set to NaN"));
                }
                continue;
            }
            if (plan.calibration[k] != null) {
                v = plan.calibration[k].toEngineering(v);
            }
            Parameter p = plan.parameter[k];
            if (plan.fromUnit[k] != null) {
                v = plan.fromUnit[k].convert(v, p.unit());
            }
            if (!p.isPlausible(v)) {
                wild[k]++;
                wildRow = true;
                if (log.admit(ProblemLog.WILD_POINT)) {
                    log.record(new Problem(source, line, cells.position(c), where(cells, c, k) + ": " + p.name()
                            + " = " + number(v) + " " + p.unit().symbol() + " is outside its valid range ["
                            + number(p.validMin()) + ", " + number(p.validMax()) + "] " + p.unit().symbol()
                            + "; wild point set to NaN"));
                }
                continue;
            }
            frame.value(plan.slot[k], v);
        }
        frame.timeNs(t);
        frame.sequence(dataRows);
        if (gapPending) {
            frame.addFlags(Frame.GAP_BEFORE);
            gapPending = false;
        }
        if (wildRow) {
            frame.addFlags(Frame.WILD_POINT);
        }
        if (!haveTime) {
            firstNs = t;
            haveTime = true;
        }
        lastNs = t;
        delivered++;
        sink.onFrame(frame);
    }

    ReadReport report() {
        Map<SkipReason, Long> byReason = new EnumMap<>(SkipReason.class);
        for (SkipReason r : SkipReason.values()) {
            if (skipped[r.ordinal()] > 0) {
                byReason.put(r, skipped[r.ordinal()]);
            }
        }
        List<ColumnCounts> columns = new ArrayList<>();
        for (int k = 0; k < plan.column.length; k++) {
            columns.add(new ColumnCounts(plan.header[k], plan.parameter[k].name(), blank[k], nonNumeric[k], wild[k]));
        }
        return new ReadReport(plan.binding, form, dataRows, delivered, byReason, blankLines, columns, outsideHeader,
                rollovers, haveTime, firstNs, lastNs, complete, log.kept(), log.notKept());
    }

    private String where(RowCells cells, int column, int k) {
        String ref = cells.cellReference(column);
        return "column '" + plan.header[k] + "'" + (ref == null ? "" : " (cell " + ref + ")");
    }

    /** The cell as it was written, shortened and with control characters shown as '?'. */
    static String quote(CharSequence s, int from, int to) {
        while (from < to && DecimalText.isBlank(s.charAt(from))) {
            from++;
        }
        while (to > from && DecimalText.isBlank(s.charAt(to - 1))) {
            to--;
        }
        StringBuilder sb = new StringBuilder(Math.min(to - from, MAX_QUOTED_CHARS + 3));
        for (int i = from; i < to && sb.length() < MAX_QUOTED_CHARS; i++) {
            char c = s.charAt(i);
            sb.append(c < 0x20 || c == 0x7f ? '?' : c);
        }
        if (to - from > MAX_QUOTED_CHARS) {
            sb.append("...");
        }
        return sb.toString();
    }

    static String number(double v) {
        if (v == Math.rint(v) && Math.abs(v) < 1e15) {
            return Long.toString((long) v);
        }
        return Double.toString(v);
    }
}
