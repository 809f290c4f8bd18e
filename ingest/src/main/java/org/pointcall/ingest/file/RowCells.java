package org.pointcall.ingest.file;

/**
 * The cells of one data row as a reader holds them, addressed by header column. Text is read in place: a cell is
 * {@code text(c)} between {@code textStart(c)} and {@code textEnd(c)}, so no string is made per cell.
 */
interface RowCells {
    byte BLANK = 0;
    /** Text to parse: a CSV cell, a spreadsheet number or string. */
    byte TEXT = 1;
    /** A spreadsheet number formatted as a date or time: a count of days. */
    byte DAYS = 2;
    /** A spreadsheet error value such as {@code #DIV/0!}. */
    byte ERROR = 3;

    byte kind(int column);

    CharSequence text(int column);

    int textStart(int column);

    int textEnd(int column);

    /** 1-based column for problems. */
    int position(int column);

    /** Spreadsheet cell reference such as {@code C12} for messages, or {@code null}. */
    String cellReference(int column);
}
