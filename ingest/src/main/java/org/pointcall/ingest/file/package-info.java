/**
 * Recorded time histories that users bring as CSV or XLSX files, in their own column names, streamed into frames.
 *
 * <p>{@link org.pointcall.ingest.file.RecordedFiles#open RecordedFiles.open} picks the reader by extension and checks
 * the header against the dictionary before any frame is delivered: a missing time column, a unit that cannot be
 * converted, an unreadable file or one that is not a spreadsheet rejects the whole file with every problem found
 * ({@link org.pointcall.shared.error.InputRejectedException}). After that nothing stops a read: a bad row or cell is
 * dropped or set to NaN, counted in the {@link org.pointcall.ingest.file.ReadReport} and named in one line
 * ({@code file:line:column: what}), the first few of each kind logged and kept, the rest only counted.
 *
 * <p>Header: a column binds to the parameter whose {@code column()} it names, exactly first, then ignoring case and
 * surrounding blanks; {@code NAME [unit]} or {@code NAME (unit)} declares the file's unit, converted to the
 * dictionary's. Time: a column named {@code time}, {@code t}, {@code timestamp}... (or the one named in
 * {@link org.pointcall.ingest.file.ReadOptions}), in seconds (any unit of time in the header), as a time of day
 * {@code HH:MM:SS.sss}, as day-of-year time {@code DDD:HH:MM:SS.sss}, or (XLSX) as formatted date/time cells. Times
 * must increase: a row whose time goes backwards or repeats is skipped and counted, because every stage downstream
 * is time-ordered and a file cannot be re-sorted while streaming. Midnight (and, in day-of-year form, the new year)
 * is crossed when a time of day falls by more than half a day.
 *
 * <p>Threads: a source is read on the caller's thread and delivers frames there, reusing one {@code Frame}; only
 * {@code stop()} may be called from another thread.
 */
package org.pointcall.ingest.file;
