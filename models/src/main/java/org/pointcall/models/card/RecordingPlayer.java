package org.pointcall.models.card;

import java.nio.file.Path;

import org.pointcall.ingest.file.ReadOptions;
import org.pointcall.ingest.file.ReadReport;
import org.pointcall.ingest.file.RecordedFileSource;
import org.pointcall.ingest.file.RecordedFiles;
import org.pointcall.shared.error.PointcallException;

/** Plays a recorded file (CSV, XLSX) through a card session on the recording's own time line, then finishes it. */
public final class RecordingPlayer {
    private RecordingPlayer() {
    }

    /**
     * @return what the reader did (rows skipped, and why)
     * @throws org.pointcall.shared.error.InputRejectedException when the recording is refused
     * @throws PointcallException                                when no frame could be read
     */
    public static ReadReport play(Path recording, CardSession session) {
        ReadReport read;
        try (RecordedFileSource source = RecordedFiles.open(recording, session.dictionary(), ReadOptions.DEFAULTS)) {
            read = source.readAll(session::onFrame);
        }
        if (session.frames() == 0) {
            throw new PointcallException(recording + ": no frame could be read");
        }
        session.finish();
        return read;
    }
}
