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

    /**
     * A time in this form, for messages: seconds with three to nine decimals ({@code 12.300 s}), or
     * {@code HH:MM:SS.sss} / {@code DDD:HH:MM:SS.sss} with digits below the millisecond only when present.
     */
    public String format(long timeNs) {
        if (this == SECONDS) {
            return TimeText.seconds(timeNs) + " s";
        }
        long t = Math.floorMod(timeNs, this == DAY_OF_YEAR_TIME ? 366 * TimeText.NS_PER_DAY : TimeText.NS_PER_DAY);
        long day = t / TimeText.NS_PER_DAY;
        t -= day * TimeText.NS_PER_DAY;
        long ms = t / 1_000_000L;
        long subMs = t % 1_000_000L;
        String hms = String.format(java.util.Locale.ROOT, "%02d:%02d:%02d.%03d", ms / 3_600_000L,
                ms / 60_000L % 60, ms / 1000 % 60, ms % 1000);
        if (subMs != 0) {
            hms += String.format(java.util.Locale.ROOT, "%06d", subMs).replaceAll("0+$", "");
        }
        return this == DAY_OF_YEAR_TIME ? String.format(java.util.Locale.ROOT, "%03d:", day + 1) + hms : hms;
    }
}
