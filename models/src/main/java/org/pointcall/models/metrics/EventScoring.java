package org.pointcall.models.metrics;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;

/**
 * Scores detected test points against the true ones, as events rather than rows.
 *
 * <p>A detected point matches a true one when both have the same kind and their intervals overlap by an
 * intersection over union (IoU: the length of the intersection over the length of the union) of at least
 * {@code minIou}, 0.5 by default. IoU rather than overlap over the shorter interval, so that a detection much
 * longer or much shorter than the point does not count. Matching is one-to-one and greedy by best overlap: every
 * qualifying pair is ranked by IoU (ties by the true point's begin, then the detection's), and a pair is taken when
 * neither side is matched yet.
 */
public final class EventScoring {
    /** Least intersection over union of a match, by default. */
    public static final double DEFAULT_MIN_IOU = 0.5;

    private EventScoring() {
    }

    /** Intersection over union of {@code [b1, e1]} and {@code [b2, e2]}; 0 when they do not overlap. */
    public static double iou(double b1, double e1, double b2, double e2) {
        double inter = Math.min(e1, e2) - Math.max(b1, b2);
        if (inter <= 0) {
            return 0.0;
        }
        double union = Math.max(e1, e2) - Math.min(b1, b2);
        return inter / union;
    }

    /** {@link #score(List, List, double, double, double)} with {@link #DEFAULT_MIN_IOU}. */
    public static EventScore score(List<TruePoint> truth, List<DetectedPoint> detected, double spanBeginS,
                                   double spanEndS) {
        return score(truth, detected, spanBeginS, spanEndS, DEFAULT_MIN_IOU);
    }

    /**
     * @param spanBeginS start of the scored recording, s (for the non-point time of the false-point rate)
     * @param spanEndS   end of the scored recording, s
     * @param minIou     least IoU of a match, in (0, 1]
     */
    public static EventScore score(List<TruePoint> truth, List<DetectedPoint> detected, double spanBeginS,
                                   double spanEndS, double minIou) {
        if (!(minIou > 0 && minIou <= 1)) {
            throw new IllegalArgumentException("minimum IoU must be in (0, 1], got " + minIou);
        }
        if (!(spanEndS >= spanBeginS) || !Double.isFinite(spanBeginS) || !Double.isFinite(spanEndS)) {
            throw new IllegalArgumentException("scored span must be finite with end >= begin, got [" + spanBeginS
                    + ", " + spanEndS + "]");
        }
        List<TruePoint> t = List.copyOf(truth);
        List<DetectedPoint> d = List.copyOf(detected);
        List<EventMatch> candidates = new ArrayList<>();
        for (int i = 0; i < t.size(); i++) {
            TruePoint tp = t.get(i);
            for (int j = 0; j < d.size(); j++) {
                DetectedPoint dp = d.get(j);
                if (dp.kind() != tp.kind()) {
                    continue;
                }
                double iou = iou(tp.beginS(), tp.endS(), dp.beginS(), dp.endS());
                if (iou >= minIou) {
                    candidates.add(new EventMatch(i, j, iou));
                }
            }
        }
        candidates.sort(Comparator.comparingDouble(EventMatch::iou).reversed()
                .thenComparingDouble(m -> t.get(m.truth()).beginS())
                .thenComparingDouble(m -> d.get(m.detected()).beginS())
                .thenComparingInt(EventMatch::truth).thenComparingInt(EventMatch::detected));
        boolean[] truthUsed = new boolean[t.size()];
        boolean[] detUsed = new boolean[d.size()];
        List<EventMatch> matches = new ArrayList<>();
        for (EventMatch m : candidates) {
            if (!truthUsed[m.truth()] && !detUsed[m.detected()]) {
                truthUsed[m.truth()] = true;
                detUsed[m.detected()] = true;
                matches.add(m);
            }
        }
        matches.sort(Comparator.comparingInt(EventMatch::truth));
        return new EventScore(t, d, matches, minIou, spanBeginS, spanEndS);
    }
}
