package org.pointcall.models.card;

import java.util.ArrayList;
import java.util.List;

import org.pointcall.models.analysis.PointHistory;
import org.pointcall.shared.card.Band;
import org.pointcall.shared.card.TestPoint;

/**
 * Whether the aircraft is on the condition of a card point: every throughout band with a recorded parameter inside,
 * from each parameter's newest sample (at most {@link #SAMPLE_AGE_NS} old). A band outside for no longer than
 * {@link #OFF_AFTER_NS} is a transient (a noisy Nz sample) and does not break the condition. The card session uses it
 * to fly a stabilised point the classifier does not call: the card says what the point's condition is, for any
 * airframe.
 *
 * <p>Fed at frame rate from the session's history; allocates only when the point changes. Single-threaded.
 */
final class ConditionWatch {
    static final long NONE = Long.MIN_VALUE;
    /** The newest sample of a parameter counts this long. */
    static final long SAMPLE_AGE_NS = CardSession.LIVE_HOLD_NS;
    /** Outside for longer than this breaks the condition (the verdict's own transient allowance). */
    static final long OFF_AFTER_NS = Math.round(PhaseJudge.TRANSIENT_S * 1e9);

    private TestPoint point;
    private final List<Band> bands = new ArrayList<>();
    private double[] lastSi = new double[0];
    private long[] lastNs = new long[0];
    private long onSinceNs = NONE;
    private long lastOnNs = NONE;
    private long offSinceNs = NONE;
    private String offBand;

    /** Forgets the point and the condition. */
    void reset() {
        point = null;
        bands.clear();
        onSinceNs = NONE;
        lastOnNs = NONE;
        offSinceNs = NONE;
        offBand = null;
    }

    /** True when {@code p} has a hold and at least one throughout band on a parameter the history records. */
    static boolean watchable(TestPoint p, PointHistory h) {
        if (!p.hasHold()) {
            return false;
        }
        for (Band b : p.bands()) {
            if (PhaseJudge.onCondition(b, h)) {
                return true;
            }
        }
        return false;
    }

    /** Takes the newest row of {@code h} at {@code nowNs}, for point {@code p}. */
    void update(TestPoint p, PointHistory h, long nowNs) {
        if (p != point) {
            reset();
            point = p;
            for (Band b : p.bands()) {
                if (PhaseJudge.onCondition(b, h)) {
                    bands.add(b);
                }
            }
            lastSi = new double[bands.size()];
            lastNs = new long[bands.size()];
            java.util.Arrays.fill(lastNs, NONE);
        }
        if (h.isEmpty()) {
            return;
        }
        int row = h.size() - 1;
        boolean inside = !bands.isEmpty();
        String out = null;
        for (int i = 0; i < bands.size(); i++) {
            double v = h.valueSi(bands.get(i).parameter(), row);
            if (Double.isFinite(v)) {
                lastSi[i] = v;
                lastNs[i] = h.timeNs(row);
            }
            if (lastNs[i] == NONE || nowNs - lastNs[i] > SAMPLE_AGE_NS) {
                inside = false;
                out = out == null ? bands.get(i).parameter() + " (no recent value)" : out;
            } else if (!bands.get(i).contains(lastSi[i])) {
                inside = false;
                out = out == null ? bands.get(i).parameter() : out;
            }
        }
        if (inside) {
            offSinceNs = NONE;
            if (onSinceNs == NONE) {
                onSinceNs = nowNs;
            }
            lastOnNs = nowNs;
            return;
        }
        if (offSinceNs == NONE) {
            offSinceNs = nowNs;
            offBand = out;
        }
        if (onSinceNs != NONE && nowNs - offSinceNs > OFF_AFTER_NS) {
            onSinceNs = NONE;
        }
    }

    /** The point watched, or null. */
    TestPoint point() {
        return point;
    }

    /** How long the aircraft has been on condition, ns; 0 when it is not. */
    long onForNs(long nowNs) {
        return onSinceNs == NONE ? 0 : nowNs - onSinceNs;
    }

    /** Since when it has been on condition, or {@link #NONE}. */
    long onSinceNs() {
        return onSinceNs;
    }

    /** The last time every band was inside, or {@link #NONE}. */
    long lastOnNs() {
        return lastOnNs;
    }

    /** True once the condition has been broken (outside for longer than the transient) after it was met. */
    boolean broken() {
        return onSinceNs == NONE && lastOnNs != NONE;
    }

    /** The first band found outside when the condition broke, for the evidence. */
    String offBand() {
        return offBand;
    }
}
