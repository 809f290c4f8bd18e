package org.pointcall.ingest.file;

/**
 * How to read a recorded file. Immutable; change one field with the {@code withX} copies.
 *
 * @param timeColumn   header of the time column, or {@code null} to look for the usual names ({@code time},
 *                     {@code t}, {@code timestamp}, {@code tod}, {@code irig time}, {@code utc}...)
 * @param sheet        XLSX sheet to read, or {@code null} for the first one; ignored for CSV
 * @param sourceName   name of the file in problems and logs, or {@code null} for the path as given
 * @param problemLimit problems of each kind logged and kept in the report; the rest are only counted
 */
public record ReadOptions(String timeColumn, String sheet, String sourceName, int problemLimit) {
    /** Problems of each kind logged and kept by default. */
    public static final int DEFAULT_PROBLEM_LIMIT = 20;

    /** Auto-detected time column, first sheet, the path as the file's name. */
    public static final ReadOptions DEFAULTS = new ReadOptions(null, null, null, DEFAULT_PROBLEM_LIMIT);

    public ReadOptions {
        if (problemLimit < 0) {
            throw new IllegalArgumentException("problem limit must be >= 0, got " + problemLimit);
        }
        timeColumn = blankToNull(timeColumn);
        sheet = blankToNull(sheet);
        sourceName = blankToNull(sourceName);
    }

    public ReadOptions withTimeColumn(String header) {
        return new ReadOptions(header, sheet, sourceName, problemLimit);
    }

    public ReadOptions withSheet(String name) {
        return new ReadOptions(timeColumn, name, sourceName, problemLimit);
    }

    public ReadOptions withSourceName(String name) {
        return new ReadOptions(timeColumn, sheet, name, problemLimit);
    }

    public ReadOptions withProblemLimit(int limit) {
        return new ReadOptions(timeColumn, sheet, sourceName, limit);
    }

    private static String blankToNull(String s) {
        return s == null || s.isBlank() ? null : s;
    }
}
