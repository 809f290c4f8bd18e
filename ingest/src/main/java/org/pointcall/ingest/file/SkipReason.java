package org.pointcall.ingest.file;

/** Why a whole data row of a recorded file was dropped. Every dropped row is counted under exactly one reason. */
public enum SkipReason {
    /** Fewer cells than the header: a line cut short, whose last cell may itself be cut. */
    TOO_FEW_CELLS("truncated line"),
    /** More cells than the header: the cells cannot be matched to columns. */
    TOO_MANY_CELLS("too many cells"),
    /** A quote opened and not closed on the line. */
    UNCLOSED_QUOTE("unclosed quote"),
    /** A line longer than the reader accepts (binary data, or a missing line end). */
    LINE_TOO_LONG("line too long"),
    /** The time cell is empty. */
    NO_TIME("no time"),
    /** The time cell is not a readable time, or not in the form of the earlier rows. */
    BAD_TIME("unreadable time"),
    /** The time is before the last delivered one. */
    TIME_BACKWARDS("time goes backwards"),
    /** The time equals the last delivered one. */
    TIME_REPEATED("time repeats");

    private final String label;

    SkipReason(String label) {
        this.label = label;
    }

    /** Plain words for reports. */
    public String label() {
        return label;
    }
}
