package org.pointcall.ingest.file;

import org.pointcall.ingest.frame.FrameSink;

/**
 * A recorded file opened against a dictionary: the header is already checked and bound; {@link #readAll} streams
 * the rows. Read once, on one thread.
 */
public interface RecordedFileSource extends AutoCloseable {

    /** How the header was bound: known before any frame. */
    HeaderBinding binding();

    /**
     * Reads every data row, delivering one frame per good row to {@code sink} (the same {@link
     * org.pointcall.ingest.frame.Frame} each time: copy it to keep it). Bad rows and cells are counted, never
     * thrown; an exception of the sink passes through.
     *
     * @return what was read, skipped and set to NaN
     * @throws IllegalStateException when called a second time or after {@link #close}
     */
    ReadReport readAll(FrameSink sink);

    /** Asks a running {@link #readAll} to return after the current row; safe from any thread. */
    void stop();

    /** Releases the file; never throws. */
    @Override
    void close();
}
