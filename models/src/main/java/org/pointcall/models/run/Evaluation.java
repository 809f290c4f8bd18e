package org.pointcall.models.run;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import org.pointcall.models.data.LabelledRows;
import org.pointcall.models.metrics.ClassConfusion;
import org.pointcall.models.metrics.DetectedPoint;
import org.pointcall.models.metrics.EventScore;
import org.pointcall.models.metrics.EventScoring;
import org.pointcall.models.metrics.TruePoint;

/**
 * Scores of a model over several sorties run as live: the row-level confusion of every decision tick, the
 * event-level scores of the detector's points against the labelled ones, and the classifier's cost per tick.
 *
 * <p>The sorties are laid end to end on one time line (each one's first frame shifted onto the previous one's last)
 * so that one event scoring covers them all with their own time only. Every point lies within its sortie's span,
 * and intervals that only touch do not overlap, so a point of one sortie can never match another's. Immutable.
 */
public final class Evaluation {
    private final List<SortieResult> sorties;
    private final ClassConfusion rows;
    private final EventScore events;
    private final long ticks;
    private final long classifierNs;
    private final long detectorNs;

    private Evaluation(List<SortieResult> sorties) {
        this.sorties = List.copyOf(sorties);
        int n = 0;
        for (SortieResult s : this.sorties) {
            n += s.ticks();
        }
        int[] truth = new int[n];
        int[] predicted = new int[n];
        List<TruePoint> tp = new ArrayList<>();
        List<DetectedPoint> dp = new ArrayList<>();
        int at = 0;
        double offset = 0;
        long ns = 0;
        long det = 0;
        for (SortieResult s : this.sorties) {
            System.arraycopy(s.truthClass(), 0, truth, at, s.ticks());
            System.arraycopy(s.predictedClass(), 0, predicted, at, s.ticks());
            at += s.ticks();
            double shift = offset - s.spanBeginS();
            for (TruePoint t : s.truth()) {
                tp.add(new TruePoint(t.kind(), t.beginS() + shift, t.endS() + shift, t.cardId()));
            }
            for (DetectedPoint d : s.detected()) {
                dp.add(new DetectedPoint(d.kind(), d.beginS() + shift, d.endS() + shift, d.reportedAtS() + shift));
            }
            offset += s.spanEndS() - s.spanBeginS();
            ns += s.classifierNs();
            det += s.detectorNs();
        }
        this.rows = ClassConfusion.of(truth, predicted, LabelledRows.CLASS_NAMES);
        this.events = EventScoring.score(tp, dp, 0, offset);
        this.ticks = n;
        this.classifierNs = ns;
        this.detectorNs = det;
    }

    /** Aggregates sorties already run. */
    public static Evaluation of(List<SortieResult> sorties) {
        if (sorties.isEmpty()) {
            throw new IllegalArgumentException("an evaluation needs at least one sortie");
        }
        return new Evaluation(sorties);
    }

    public List<SortieResult> sorties() {
        return sorties;
    }

    public ClassConfusion rows() {
        return rows;
    }

    public EventScore events() {
        return events;
    }

    /** Mean classifier time per decision tick, ns, measured on the run's own ticks. */
    public double classifierNsPerTick() {
        return ticks == 0 ? Double.NaN : classifierNs / (double) ticks;
    }

    /** Mean detector time per decision tick (its frames' physics included), ns, measured on the run's own ticks. */
    public double detectorNsPerTick() {
        return ticks == 0 ? Double.NaN : detectorNs / (double) ticks;
    }

    /** The confusion matrix as a table (truth down, predicted across), classes with no row and no prediction left out. */
    public List<String> matrixTable() {
        List<Integer> shown = new ArrayList<>();
        for (int c = 0; c < rows.classCount(); c++) {
            if (rows.support(c) > 0 || rows.predictedCount(c) > 0) {
                shown.add(c);
            }
        }
        int w = 8;
        for (int c : shown) {
            w = Math.max(w, rows.classNames().get(c).length() + 1);
            for (int p : shown) {
                w = Math.max(w, Long.toString(rows.count(c, p)).length() + 1);
            }
        }
        String corner = "truth \\ predicted";
        int first = corner.length() + 1;
        for (int c : shown) {
            first = Math.max(first, rows.classNames().get(c).length() + 1);
        }
        List<String> out = new ArrayList<>();
        StringBuilder head = new StringBuilder(String.format(Locale.ROOT, "%-" + first + "s", corner));
        for (int p : shown) {
            head.append(String.format(Locale.ROOT, "%" + w + "s", rows.classNames().get(p)));
        }
        out.add(head.toString());
        for (int t : shown) {
            StringBuilder line = new StringBuilder(String.format(Locale.ROOT, "%-" + first + "s",
                    rows.classNames().get(t)));
            for (int p : shown) {
                line.append(String.format(Locale.ROOT, "%" + w + "d", rows.count(t, p)));
            }
            out.add(line.toString());
        }
        return out;
    }

    /** {@code name: value} lines: sorties and ticks, row-level scores, event-level scores, cost. */
    public List<String> lines() {
        List<String> out = new ArrayList<>();
        out.add("sorties: " + sorties.size());
        int discarded = 0;
        for (SortieResult s : sorties) {
            discarded += s.discarded();
        }
        out.add("ticks: " + ticks);
        out.addAll(rows.lines());
        out.addAll(events.lines());
        out.add("events.discarded: " + discarded);
        out.add("cost.classifier-ns-per-tick: " + String.format(Locale.ROOT, "%.0f", classifierNsPerTick()));
        out.add("cost.detector-ns-per-tick: " + String.format(Locale.ROOT, "%.0f", detectorNsPerTick()));
        return out;
    }
}
