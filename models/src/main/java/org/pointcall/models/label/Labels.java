package org.pointcall.models.label;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

import org.pointcall.ingest.file.TimeForm;
import org.pointcall.ingest.sim.truth.PointTruth;
import org.pointcall.ingest.sim.truth.SortieTruth;
import org.pointcall.shared.error.InputRejectedException;
import org.pointcall.shared.error.PointcallException;
import org.pointcall.shared.error.Problem;
import org.pointcall.shared.kind.ManoeuvreKind;
import org.pointcall.shared.units.Units;

/**
 * The labelled test points of one recording: non-overlapping intervals sorted by begin (they may touch), on the
 * recording's time line. Every instant outside them is the class {@code none} (transit and everything else). Lookups
 * are binary searches, O(log n), and allocate nothing. Immutable and safe to share between threads.
 */
public final class Labels {
    private final String source;
    private final TimeForm timeForm;
    private final List<LabelInterval> intervals;
    private final long[] beginNs;
    private final long[] endNs;
    private final ManoeuvreKind[] kinds;
    /** Every begin and end, sorted; intervals do not overlap, so this is begin0, end0, begin1, end1... */
    private final long[] boundariesNs;

    private Labels(String source, TimeForm timeForm, List<LabelInterval> sorted) {
        this.source = source;
        this.timeForm = timeForm;
        this.intervals = List.copyOf(sorted);
        int n = sorted.size();
        beginNs = new long[n];
        endNs = new long[n];
        kinds = new ManoeuvreKind[n];
        boundariesNs = new long[2 * n];
        for (int i = 0; i < n; i++) {
            LabelInterval li = sorted.get(i);
            beginNs[i] = li.beginNs();
            endNs[i] = li.endNs();
            kinds[i] = li.kind();
            boundariesNs[2 * i] = li.beginNs();
            boundariesNs[2 * i + 1] = li.endNs();
        }
    }

    /**
     * Labels from intervals in any order.
     *
     * @param source    name of where they came from, for messages
     * @param timeForm  how the times were written (seconds, time of day, day-of-year time): a recording must write
     *                  its time column in a compatible form
     * @throws InputRejectedException naming each interval that overlaps another
     */
    public static Labels of(String source, TimeForm timeForm, List<LabelInterval> intervals) {
        Objects.requireNonNull(source, "source");
        Objects.requireNonNull(timeForm, "timeForm");
        List<LabelInterval> sorted = sortedByBegin(intervals);
        List<Problem> problems = new ArrayList<>();
        overlapProblems(source, sorted, new HashMap<>(), timeForm, problems);
        if (!problems.isEmpty()) {
            throw new InputRejectedException(problems);
        }
        return new Labels(source, timeForm, sorted);
    }

    /** No labelled point at all: every instant is {@code none}. */
    public static Labels empty(String source, TimeForm timeForm) {
        return new Labels(source, timeForm, List.of());
    }

    /**
     * The points a simulated sortie really flew, from its truth file, in seconds of sortie time (the simulator
     * writes its recording's time column in seconds of the same clock).
     *
     * @throws InputRejectedException when a point names a kind this build does not know, or points overlap
     */
    public static Labels fromTruth(SortieTruth truth) {
        String source = "truth of sortie " + truth.sortie();
        List<LabelInterval> out = new ArrayList<>();
        List<Problem> problems = new ArrayList<>();
        int n = 0;
        for (PointTruth p : truth.points()) {
            n++;
            ManoeuvreKind kind = ManoeuvreKind.byKey(p.kind()).orElse(null);
            if (kind == null) {
                problems.add(new Problem(source, 0, 0, "point " + n + " (" + p.cardId() + "): unknown kind '"
                        + p.kind() + "'; kinds are " + ManoeuvreKind.keys()));
                continue;
            }
            out.add(new LabelInterval(kind, Units.secondsToNs(p.beginS()), Units.secondsToNs(p.endS()), p.cardId(),
                    p.flaw() == null || p.flaw().equals("none") ? "" : "flaw: " + p.flaw(), 0));
        }
        if (!problems.isEmpty()) {
            throw new InputRejectedException(problems);
        }
        return of(source, TimeForm.SECONDS, out);
    }

    static List<LabelInterval> sortedByBegin(List<LabelInterval> intervals) {
        List<LabelInterval> sorted = new ArrayList<>(intervals);
        sorted.sort(Comparator.comparingLong(LabelInterval::beginNs).thenComparingLong(LabelInterval::endNs)
                .thenComparingInt(LabelInterval::line));
        return sorted;
    }

    /**
     * Adds a problem for each interval that starts before an earlier one ends, at its own line and begin column.
     *
     * @param beginColumns begin-cell column by line, where known
     */
    static void overlapProblems(String source, List<LabelInterval> sorted, Map<Integer, Integer> beginColumns,
                                TimeForm form, List<Problem> problems) {
        LabelInterval reach = null;
        for (LabelInterval li : sorted) {
            if (reach != null && li.beginNs() < reach.endNs()) {
                String other = reach.line() > 0 ? "the " + reach.kind().key() + " interval of line " + reach.line()
                        : "the " + reach.kind().key() + " point " + reach.cardId();
                problems.add(new Problem(source, li.line(), li.line() == 0 ? 0
                        : beginColumns.getOrDefault(li.line(), 0),
                        li.kind().key() + " " + LabelTimeText.format(li.beginNs(), form) + " to "
                                + LabelTimeText.format(li.endNs(), form) + " overlaps " + other + " ("
                                + LabelTimeText.format(reach.beginNs(), form) + " to "
                                + LabelTimeText.format(reach.endNs(), form)
                                + "); intervals may touch but not overlap"));
            }
            if (reach == null || li.endNs() > reach.endNs()) {
                reach = li;
            }
        }
    }

    public String source() {
        return source;
    }

    /** How the times were written; the recording's time column must be of a compatible form. */
    public TimeForm timeForm() {
        return timeForm;
    }

    /** Sorted by begin. */
    public List<LabelInterval> intervals() {
        return intervals;
    }

    public int size() {
        return intervals.size();
    }

    public LabelInterval interval(int index) {
        return intervals.get(index);
    }

    /** Index of the interval containing {@code timeNs}, or -1 when the instant is {@code none}. O(log n). */
    public int indexAt(long timeNs) {
        int lo = 0;
        int hi = beginNs.length - 1;
        int found = -1;
        while (lo <= hi) {
            int mid = (lo + hi) >>> 1;
            if (beginNs[mid] <= timeNs) {
                found = mid;
                lo = mid + 1;
            } else {
                hi = mid - 1;
            }
        }
        return found >= 0 && timeNs < endNs[found] ? found : -1;
    }

    /** The kind labelled at {@code timeNs}, or {@code null} for {@code none}. O(log n). */
    public ManoeuvreKind kindAt(long timeNs) {
        int i = indexAt(timeNs);
        return i < 0 ? null : kinds[i];
    }

    /**
     * Distance from {@code timeNs} to the nearest begin or end of any interval, ns; {@link Long#MAX_VALUE} when
     * there is no interval. O(log n).
     */
    public long distanceToBoundaryNs(long timeNs) {
        if (boundariesNs.length == 0) {
            return Long.MAX_VALUE;
        }
        int i = Arrays.binarySearch(boundariesNs, timeNs);
        if (i >= 0) {
            return 0;
        }
        int ins = -i - 1;
        long best = Long.MAX_VALUE;
        if (ins < boundariesNs.length) {
            best = boundariesNs[ins] - timeNs;
        }
        if (ins > 0) {
            best = Math.min(best, timeNs - boundariesNs[ins - 1]);
        }
        return best;
    }

    /** Total labelled time, ns. */
    public long labelledNs() {
        long sum = 0;
        for (int i = 0; i < beginNs.length; i++) {
            sum += endNs[i] - beginNs[i];
        }
        return sum;
    }

    /** A copy moved by {@code deltaNs}. */
    public Labels shifted(long deltaNs) {
        if (deltaNs == 0) {
            return this;
        }
        List<LabelInterval> moved = new ArrayList<>(intervals.size());
        for (LabelInterval li : intervals) {
            moved.add(li.shifted(deltaNs));
        }
        return new Labels(source, timeForm, moved);
    }

    /**
     * These labels on the time line of a recording whose first frame is at {@code firstFrameNs} and whose time
     * column has form {@code recordingForm}.
     *
     * <p>Seconds and day-of-year times are used as written. A recording in time of day counts from midnight of its
     * first day, so labels written as times of day are moved by whole days to begin no more than half a day before
     * the recording's first frame: a recording that starts at 23:50 and labels from 00:10 put the labels after
     * midnight, as the reader puts the frames.
     *
     * @throws PointcallException naming both sources when the forms cannot share a time line (seconds against a
     *                            time of day); labels without an interval fit any recording
     */
    public Labels alignedTo(long firstFrameNs, TimeForm recordingForm, String recordingName) {
        Objects.requireNonNull(recordingForm, "recordingForm");
        if (intervals.isEmpty()) {
            return this;
        }
        if (!timeForm.compatibleWith(recordingForm)) {
            throw new PointcallException(source + ": labels are written in " + timeForm.label() + " but "
                    + recordingName + " gives its time in " + recordingForm.label()
                    + "; write the labels the way the recording's time column is written");
        }
        if (timeForm != TimeForm.TIME_OF_DAY) {
            return this;
        }
        long first = beginNs[0];
        long days = Math.floorDiv(firstFrameNs - LabelTimeText.NS_PER_DAY / 2 - first + LabelTimeText.NS_PER_DAY - 1,
                LabelTimeText.NS_PER_DAY);
        return shifted(days * LabelTimeText.NS_PER_DAY);
    }

    /** {@code [begin, end)} of interval {@code index}, in the labels' own form, for messages. */
    public String describe(int index) {
        LabelInterval li = intervals.get(index);
        return li.kind().key() + " " + LabelTimeText.format(li.beginNs(), timeForm) + " to "
                + LabelTimeText.format(li.endNs(), timeForm) + (li.line() > 0 ? " (line " + li.line() + ")" : "")
                + (li.cardId().isEmpty() ? "" : " [" + li.cardId() + "]");
    }

    @Override
    public String toString() {
        return "Labels[" + source + ", " + intervals.size() + " intervals, " + timeForm.label() + "]";
    }
}
