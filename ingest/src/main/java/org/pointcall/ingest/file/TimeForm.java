package org.pointcall.ingest.file;

/**
 * How a file writes its time column; fixed by the first row with a readable time. Frame times are the column's
 * value in nanoseconds, never re-based: seconds as written, a time of day from midnight of the first day, a
 * day-of-year time from the first of January, spreadsheet date cells from the workbook's date origin.
 */
public enum TimeForm {
    /** A number of seconds (or of the unit in the header), relative or absolute. */
    SECONDS("seconds", 0),
    /** {@code HH:MM:SS.sss}, or a spreadsheet time cell below one day. */
    TIME_OF_DAY("time of day", 1),
    /** {@code DDD:HH:MM:SS.sss}, the day-of-year form IRIG time code readers print. */
    DAY_OF_YEAR_TIME("day-of-year time", 2),
    /** Spreadsheet date-time cells (days since the workbook's date origin). */
    SPREADSHEET_DATE("spreadsheet date and time", 1);

    private final String label;
    private final int scale;

    TimeForm(String label, int scale) {
        this.label = label;
        this.scale = scale;
    }

    public String label() {
        return label;
    }

    /** True when times of both forms count from the same origin, so a file may mix them. */
    public boolean compatibleWith(TimeForm other) {
        return scale == other.scale;
    }
}
