package org.pointcall.replay.report;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Objects;

import org.pointcall.ingest.derive.DerivedParameters;
import org.pointcall.ingest.file.ReadOptions;
import org.pointcall.ingest.file.ReadReport;
import org.pointcall.ingest.file.RecordedFileSource;
import org.pointcall.ingest.file.RecordedFiles;
import org.pointcall.ingest.frame.Frame;
import org.pointcall.models.card.CardAnalysers;
import org.pointcall.models.card.CardSession;
import org.pointcall.models.card.SessionSetup;
import org.pointcall.models.modelfile.ModelDescription;
import org.pointcall.models.train.Classifier;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.PointcallException;
import org.pointcall.shared.outcome.PointsFile;

/**
 * Reads a recorded sortie once for a report: through the card session exactly as {@code analyze} does (same setup,
 * same analysers, so the verdicts are the same), while the parameters the figures need and the frames' time line
 * are kept beside it. Without a card session ({@link #observe}) the recording only gives the figures and the data
 * quality, for results analysed earlier.
 */
public final class SortieAnalysis {
    /** Progress is told every this many frames. */
    private static final int PROGRESS_FRAMES = 4096;

    private SortieAnalysis() {
    }

    /**
     * What one reading gave.
     *
     * @param points  the session's points file (null from {@link #observe})
     * @param trace   the traced parameters
     * @param quality the data quality
     */
    public record Reading(PointsFile points, SortieTrace trace, DataQuality quality) {
        public Reading {
            Objects.requireNonNull(trace, "trace");
            Objects.requireNonNull(quality, "quality");
        }
    }

    /**
     * Analyses a recorded file (CSV, XLSX) against a card (or none).
     *
     * @throws PointcallException when the file cannot be read or gives no frame
     */
    public static Reading analyse(Path recording, ParameterDictionary dictionary, TestCard card,
                                  Classifier classifier, ModelDescription model, ReportProgress progress) {
        CardSession session = new CardSession(SessionSetup.of(dictionary, card, classifier, model,
                CardAnalysers.standard()), e -> { });
        SortieTrace trace = new SortieTrace(dictionary, FigurePlan.traced(card, dictionary),
                SortieTrace.DEFAULT_STEP_S);
        FrameTimeline timeline = new FrameTimeline();
        ReadReport read = read(recording, dictionary, progress, f -> {
            session.onFrame(f); // computes the derived parameters into the frame
            trace.onFrame(f);
            timeline.onFrame(f);
        });
        session.finish();
        trace.finish();
        timeline.finish();
        PointsFile points = session.pointsFile(recording.getFileName().toString());
        return new Reading(points, trace, DataQuality.of(read, timeline));
    }

    /** Reads a recorded file for its figures and data quality only (derived parameters computed, no detection). */
    public static Reading observe(Path recording, ParameterDictionary dictionary, TestCard card,
                                  ReportProgress progress) {
        DerivedParameters derived = DerivedParameters.bind(dictionary);
        SortieTrace trace = new SortieTrace(dictionary, FigurePlan.traced(card, dictionary),
                SortieTrace.DEFAULT_STEP_S);
        FrameTimeline timeline = new FrameTimeline();
        ReadReport read = read(recording, dictionary, progress, f -> {
            derived.apply(f);
            trace.onFrame(f);
            timeline.onFrame(f);
        });
        trace.finish();
        timeline.finish();
        return new Reading(null, trace, DataQuality.of(read, timeline));
    }

    private interface FrameUse {
        void use(Frame f);
    }

    private static ReadReport read(Path recording, ParameterDictionary dictionary, ReportProgress progress,
                                   FrameUse use) {
        if (!Files.isRegularFile(recording)) {
            throw new PointcallException(recording + ": no such recording");
        }
        long rows = estimatedRows(recording);
        long[] seen = new long[1];
        ReadReport read;
        try (RecordedFileSource source = RecordedFiles.open(recording, dictionary, ReadOptions.DEFAULTS)) {
            read = source.readAll(f -> {
                use.use(f);
                if (++seen[0] % PROGRESS_FRAMES == 0) {
                    progress.progress(rows > 0 ? Math.min(0.99, (double) seen[0] / rows) : 0,
                            String.format(Locale.ROOT, "reading %s: %d frames", recording.getFileName(), seen[0]));
                }
            });
        }
        if (read.framesDelivered() == 0) {
            throw new PointcallException(recording + ": no frame could be read");
        }
        progress.progress(1, "read " + read.framesDelivered() + " frames");
        return read;
    }

    /** Line count of a text file (a CSV's rows, near enough); 0 when unknown (a spreadsheet). */
    static long estimatedRows(Path file) {
        if (file.getFileName().toString().toLowerCase(Locale.ROOT).endsWith(".xlsx")) {
            return 0;
        }
        long n = 0;
        byte[] buf = new byte[1 << 16];
        try (InputStream in = Files.newInputStream(file)) {
            for (int r = in.read(buf); r > 0; r = in.read(buf)) {
                for (int i = 0; i < r; i++) {
                    if (buf[i] == '\n') {
                        n++;
                    }
                }
            }
        } catch (IOException e) {
            return 0; // only for the progress bar: the reader itself reports what is wrong
        }
        return Math.max(0, n - 1);
    }
}
