package org.pointcall.replay.report;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

import org.pointcall.ingest.file.ColumnCounts;
import org.pointcall.ingest.file.ReadReport;
import org.pointcall.ingest.file.SkipReason;
import org.pointcall.replay.report.FrameTimeline.Gap;

/**
 * What the data of a sortie was like, for the report's summary: its span, the frame step, the time gaps (dropouts),
 * the rows a file reader skipped and why, the cells it could not read and the wild points it rejected, by parameter.
 *
 * @param source            the recording as named to the user
 * @param frames            frames delivered
 * @param firstNs           data time of the first frame
 * @param lastNs            data time of the last frame
 * @param frameStepS        the usual step between frames, s (NaN with fewer than two frames)
 * @param gapCount          time gaps (steps of {@link FrameTimeline#GAP_FACTOR} usual steps or more)
 * @param missingS          time with no frame, s
 * @param longestGapS       the longest gap, s (0 with none)
 * @param gaps              the first gaps, with their times
 * @param rowsRead          data rows of a file (0 for a stream)
 * @param rowsSkipped       rows skipped, by reason in plain words; non-zero counts only
 * @param unreadableCells   cells that were not a number, by parameter; non-zero only
 * @param wildPoints        values outside their valid range, set to NaN, by parameter; non-zero only
 * @param flaggedFrames     frames a stream decoder flagged, by flag in plain words; non-zero only
 * @param missingParameters dictionary parameters the recording does not carry
 * @param ignoredColumns    columns of the file that are not in the dictionary
 * @param complete          false when reading stopped before the end of the recording
 * @param problems          the first problems in the reader's own words ({@code file:line:column: what})
 */
public record DataQuality(String source, long frames, long firstNs, long lastNs, double frameStepS, long gapCount,
                          double missingS, double longestGapS, List<Gap> gaps, long rowsRead,
                          Map<String, Long> rowsSkipped, Map<String, Long> unreadableCells,
                          Map<String, Long> wildPoints, Map<String, Long> flaggedFrames,
                          List<String> missingParameters, List<String> ignoredColumns, boolean complete,
                          List<String> problems) {
    public DataQuality {
        Objects.requireNonNull(source, "source");
        if (frames < 0 || gapCount < 0 || rowsRead < 0 || !(missingS >= 0) || !(longestGapS >= 0)) {
            throw new IllegalArgumentException("data quality counts must be >= 0");
        }
        gaps = List.copyOf(gaps);
        rowsSkipped = ordered(rowsSkipped);
        unreadableCells = ordered(unreadableCells);
        wildPoints = ordered(wildPoints);
        flaggedFrames = ordered(flaggedFrames);
        missingParameters = List.copyOf(missingParameters);
        ignoredColumns = List.copyOf(ignoredColumns);
        problems = List.copyOf(problems);
    }

    private static Map<String, Long> ordered(Map<String, Long> m) {
        return Collections.unmodifiableMap(new LinkedHashMap<>(m));
    }

    /** Shown problems at most. */
    public static final int PROBLEMS_SHOWN = 10;

    /** From a recorded file's read report and the time line of the frames it delivered. */
    public static DataQuality of(ReadReport read, FrameTimeline timeline) {
        Map<String, Long> skipped = new LinkedHashMap<>();
        for (Map.Entry<SkipReason, Long> e : read.rowsSkippedByReason().entrySet()) {
            if (e.getValue() > 0) {
                skipped.put(e.getKey().label(), e.getValue());
            }
        }
        Map<String, Long> unreadable = new LinkedHashMap<>();
        Map<String, Long> wild = new LinkedHashMap<>();
        for (ColumnCounts c : read.columns()) {
            if (c.nonNumeric() > 0) {
                unreadable.merge(c.parameter(), c.nonNumeric(), Long::sum);
            }
            if (c.wildPoints() > 0) {
                wild.merge(c.parameter(), c.wildPoints(), Long::sum);
            }
        }
        List<String> problems = read.problems().stream().limit(PROBLEMS_SHOWN).map(Object::toString).toList();
        return new DataQuality(read.source(), timeline.frames(), timeline.firstNs(), timeline.lastNs(),
                timeline.stepS(), timeline.gapCount(), timeline.missingS(), timeline.longestGapS(), timeline.gaps(),
                read.rowsRead(), skipped, unreadable, wild, flagged(timeline), read.missingParameters(),
                read.ignoredColumns(), read.complete(), problems);
    }

    /** The frame flags a stream decoder set, in plain words. */
    static Map<String, Long> flagged(FrameTimeline t) {
        Map<String, Long> m = new LinkedHashMap<>();
        put(m, "sequence gap before the frame", t.flaggedGapBefore());
        put(m, "wild point set to NaN", t.flaggedWild());
        put(m, "part of the frame lost", t.flaggedPartsMissing());
        put(m, "time backwards or repeated", t.flaggedTimeSuspect());
        return m;
    }

    private static void put(Map<String, Long> m, String k, long v) {
        if (v > 0) {
            m.put(k, v);
        }
    }

    /** Data span, s. */
    public double durationS() {
        return frames == 0 ? 0 : (lastNs - firstNs) * 1e-9;
    }

    public long rowsSkippedTotal() {
        return rowsSkipped.values().stream().mapToLong(Long::longValue).sum();
    }

    public long unreadableTotal() {
        return unreadableCells.values().stream().mapToLong(Long::longValue).sum();
    }

    public long wildPointsTotal() {
        return wildPoints.values().stream().mapToLong(Long::longValue).sum();
    }
}
