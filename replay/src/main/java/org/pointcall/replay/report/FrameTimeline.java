package org.pointcall.replay.report;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

import org.pointcall.ingest.frame.Frame;

/**
 * Counts what a frame stream's time line says about its quality: the frame step, the time gaps (frames that never
 * came: a telemetry dropout, or rows lost from a file) and the frames flagged by the decoder. A gap is a step longer
 * than {@link #GAP_FACTOR} times the usual step, which is the median of the first {@link #LEARN_STEPS} steps.
 * Fed on one thread; nothing is allocated per frame once the usual step is known.
 */
public final class FrameTimeline {
    /** A step this many times the usual one or longer is a gap: jitter of a few percent never reaches it. */
    public static final double GAP_FACTOR = 2.5;
    /** Steps the usual step is learnt from. */
    public static final int LEARN_STEPS = 1024;
    /** Gaps kept with their times (for the figures); the others are counted only. */
    public static final int KEPT_GAPS = 1000;

    /** A stretch of time with no frame, from the last frame before it to the first after it. */
    public record Gap(long fromNs, long toNs) {
        public Gap {
            if (toNs <= fromNs) {
                throw new IllegalArgumentException("a gap ends after it begins");
            }
        }

        public double lengthS() {
            return (toNs - fromNs) * 1e-9;
        }
    }

    private final long[] learning = new long[LEARN_STEPS];
    private final long[] learningAt = new long[LEARN_STEPS];
    private int learnt;
    private long stepNs;
    private long frames;
    private long firstNs;
    private long lastNs;
    private long gapCount;
    private long missingNs;
    private long longestGapNs;
    private final List<Gap> gaps = new ArrayList<>();
    private long flaggedGapBefore;
    private long flaggedWild;
    private long flaggedPartsMissing;
    private long flaggedTimeSuspect;

    public void onFrame(Frame f) {
        long t = f.timeNs();
        if (frames == 0) {
            firstNs = t;
        } else {
            long d = t - lastNs;
            if (d > 0) {
                if (stepNs == 0) {
                    learningAt[learnt] = lastNs;
                    learning[learnt++] = d;
                    if (learnt == LEARN_STEPS) {
                        settle();
                    }
                } else {
                    step(lastNs, d);
                }
            }
        }
        lastNs = Math.max(lastNs, t);
        frames++;
        if (f.hasFlag(Frame.GAP_BEFORE)) {
            flaggedGapBefore++;
        }
        if (f.hasFlag(Frame.WILD_POINT)) {
            flaggedWild++;
        }
        if (f.hasFlag(Frame.PARTS_MISSING)) {
            flaggedPartsMissing++;
        }
        if (f.hasFlag(Frame.TIME_SUSPECT)) {
            flaggedTimeSuspect++;
        }
    }

    /** Call at the end (a short stream learns its step from what it had). */
    public void finish() {
        if (stepNs == 0 && learnt > 0) {
            settle();
        }
    }

    private void settle() {
        long[] sorted = Arrays.copyOf(learning, learnt);
        Arrays.sort(sorted);
        stepNs = Math.max(1, sorted[learnt / 2]);
        for (int i = 0; i < learnt; i++) {
            step(learningAt[i], learning[i]);
        }
        learnt = 0;
    }

    private void step(long fromNs, long d) {
        if (d >= GAP_FACTOR * stepNs) {
            gapCount++;
            missingNs += d - stepNs;
            longestGapNs = Math.max(longestGapNs, d);
            if (gaps.size() < KEPT_GAPS) {
                gaps.add(new Gap(fromNs, fromNs + d));
            }
        }
    }

    public long frames() {
        return frames;
    }

    public long firstNs() {
        return firstNs;
    }

    public long lastNs() {
        return lastNs;
    }

    /** The usual step between frames, s; NaN before {@link #finish()} on a short stream. */
    public double stepS() {
        return stepNs == 0 ? Double.NaN : stepNs * 1e-9;
    }

    public long gapCount() {
        return gapCount;
    }

    /** Time with no frame, s: each gap less one usual step. */
    public double missingS() {
        return missingNs * 1e-9;
    }

    public double longestGapS() {
        return longestGapNs * 1e-9;
    }

    /** The first {@link #KEPT_GAPS} gaps, in time order. */
    public List<Gap> gaps() {
        return List.copyOf(gaps);
    }

    /** Frames the decoder flagged with a sequence gap before them (streams; files have none). */
    public long flaggedGapBefore() {
        return flaggedGapBefore;
    }

    public long flaggedWild() {
        return flaggedWild;
    }

    public long flaggedPartsMissing() {
        return flaggedPartsMissing;
    }

    public long flaggedTimeSuspect() {
        return flaggedTimeSuspect;
    }
}
