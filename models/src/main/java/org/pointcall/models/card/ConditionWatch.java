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
 * <p>A <em>near</em> watch ({@link #near}) asks instead whether the aircraft is held steady close to the condition:
 * each two-sided band widened by a number of band widths on either side, and each parameter steady (its value,
 * smoothed over {@link #SMOOTHING_S}, moving over no more than one band width since the watch came on). It finds a
 * stabilised point flown off its condition (held at 132 KCAS for a 140 +/- 2 point), which is a flight of the point
 * to repeat, not nothing; a pass through the widened bands in transit is not steady and is not taken for one.
 *
 * <p>Fed at frame rate from the session's history; allocates only when the point changes. Single-threaded.
 */
final class ConditionWatch {
    static final long NONE = Long.MIN_VALUE;
    /** The newest sample of a parameter counts this long. */
    static final long SAMPLE_AGE_NS = CardSession.LIVE_HOLD_NS;
    /** Outside for longer than this breaks the condition (the verdict's own transient allowance). */
    static final long OFF_AFTER_NS = Math.round(PhaseJudge.TRANSIENT_S * 1e9);

    /** Time constant of the smoothing a near watch's steadiness test runs on, s (sensor noise out, drift in). */
    static final double SMOOTHING_S = 1.0;
    /** A near watch's parameter is steady while its smoothed value moves over no more than this many band widths. */
    static final double STEADY_WIDTHS = 0.5;

    private final double widen;
    private TestPoint point;
    private final List<Band> bands = new ArrayList<>();
    private double[] lastSi = new double[0];
    private long[] lastNs = new long[0];
    private double[] smooth = new double[0];
    private double[] lowest = new double[0];
    private double[] highest = new double[0];
    private long onSinceNs = NONE;
    private long lastOnNs = NONE;
    private long offSinceNs = NONE;
    private String offBand;

    /** A watch of the condition itself: every band as the card gives it. */
    ConditionWatch() {
        this.widen = 0;
    }

    private ConditionWatch(double widen) {
        if (!(widen > 0)) {
            throw new IllegalArgumentException("a near watch widens its bands by a positive number of widths");
        }
        this.widen = widen;
    }

    /**
     * A watch of steady flight near the condition: each two-sided band widened by {@code widths} band widths on either
     * side (a one-sided band stays as it is), and every two-sided band's parameter steady.
     */
    static ConditionWatch near(double widths) {
        return new ConditionWatch(widths);
    }

    /** True for a {@link #near} watch. */
    boolean isNear() {
        return widen > 0;
    }

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
            smooth = new double[bands.size()];
            lowest = new double[bands.size()];
            highest = new double[bands.size()];
        }
        if (h.isEmpty()) {
            return;
        }
        int row = h.size() - 1;
        boolean inside = !bands.isEmpty();
        String out = null;
        for (int i = 0; i < bands.size(); i++) {
            Band b = bands.get(i);
            double v = h.valueSi(b.parameter(), row);
            if (Double.isFinite(v)) {
                if (widen > 0) {
                    smooth[i] = lastNs[i] == NONE || nowNs - lastNs[i] > SAMPLE_AGE_NS ? v
                            : smooth[i] + (v - smooth[i]) * (1 - Math.exp(-(h.timeNs(row) - lastNs[i]) * 1e-9
                            / SMOOTHING_S));
                }
                lastSi[i] = v;
                lastNs[i] = h.timeNs(row);
            }
            double width = b.highSi() - b.lowSi();
            double pad = widen > 0 && Double.isFinite(width) ? widen * width : 0;
            if (lastNs[i] == NONE || nowNs - lastNs[i] > SAMPLE_AGE_NS) {
                inside = false;
                out = out == null ? b.parameter() + " (no recent value)" : out;
            } else if (lastSi[i] < b.lowSi() - pad || lastSi[i] > b.highSi() + pad) {
                inside = false;
                out = out == null ? b.parameter() : out;
            } else if (pad > 0 && onSinceNs != NONE
                    && Math.max(highest[i], smooth[i]) - Math.min(lowest[i], smooth[i]) > STEADY_WIDTHS * width) {
                inside = false;
                out = out == null ? b.parameter() + " (not steady)" : out;
            }
        }
        if (inside) {
            offSinceNs = NONE;
            if (onSinceNs == NONE) {
                onSinceNs = nowNs;
                System.arraycopy(smooth, 0, lowest, 0, smooth.length);
                System.arraycopy(smooth, 0, highest, 0, smooth.length);
            }
            for (int i = 0; i < smooth.length; i++) {
                lowest[i] = Math.min(lowest[i], smooth[i]);
                highest[i] = Math.max(highest[i], smooth[i]);
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
