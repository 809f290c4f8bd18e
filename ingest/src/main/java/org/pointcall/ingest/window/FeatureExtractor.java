package org.pointcall.ingest.window;

import java.util.Arrays;
import java.util.HashSet;
import java.util.List;
import java.util.Objects;
import java.util.Set;

import org.pointcall.ingest.frame.Frame;
import org.pointcall.ingest.frame.FrameSink;
import org.pointcall.shared.dictionary.Parameter;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.PointcallException;

/**
 * Sliding-window features of selected parameters, evaluated at a fixed decision rate on data time.
 *
 * <p>Feed it frames in time order through {@link #onFrame}. A NaN value means "not sampled in this frame" and is
 * skipped, so parameters slower than the frame rate work as they are; an infinite value is skipped and counted.
 * Decision ticks fall on every multiple of the decision period ({@code timeNs % periodNs == 0}, so replays tick at
 * the same instants as the live run). A tick at {@code T} fires once every frame with time {@code <= T} has been
 * taken, that is when the first frame after {@code T} arrives, right after the frame at exactly {@code T}, or on
 * {@link #advanceTo}. At each tick the listener gets one reusable vector laid out by {@link #layout()}.
 *
 * <p>Frames whose time is not after the latest frame time (or the latest {@link #advanceTo} instant) are dropped
 * and counted in {@link #framesRejected()}. Ticks at which every window would be empty, because data stopped for
 * longer than the longest window, are not emitted; they are counted in {@link #ticksSkipped()}.
 *
 * <p>Per frame the work is O(selected parameters) plus O(1) amortised per sample and window; nothing is allocated
 * once the buffers have reached their working size (they are sized at bind time from the dictionary rates and only
 * double, rarely, if a parameter comes faster than its nominal rate). Single-threaded: call it from the stream's
 * pipeline thread only.
 */
public final class FeatureExtractor implements FrameSink {
    private final FeatureLayout layout;
    private final ExtractorSettings settings;
    private final FeatureListener listener;
    private final Track[] tracks;
    private final int frameSlots;
    private final long periodNs;
    private final long longestWindowNs;
    private final int minSamples;
    private final boolean keepInvalid;

    private final double[] features;
    private final boolean[] valid;
    private final double[] coverage;

    private boolean started;
    private long watermarkNs;
    private long lastFrameNs;
    private long nextTickNs;
    private long lastTickNs = Long.MIN_VALUE;

    private long framesAccepted;
    private long framesRejected;
    private long lastRejectedSequence = -1;
    private long valuesNonFinite;
    private long ticksEmitted;
    private long ticksSkipped;

    private FeatureExtractor(ParameterDictionary dictionary, List<WindowSpec> specs, ExtractorSettings settings,
                             FeatureListener listener) {
        this.settings = Objects.requireNonNull(settings, "settings");
        this.listener = Objects.requireNonNull(listener, "listener");
        if (specs.isEmpty()) {
            throw new PointcallException("feature extraction needs at least one window spec");
        }
        int[] slots = new int[specs.size()];
        Set<String> seen = new HashSet<>();
        for (int s = 0; s < specs.size(); s++) {
            String name = specs.get(s).parameter();
            slots[s] = dictionary.indexOf(name);
            if (slots[s] < 0) {
                throw new PointcallException("window spec names parameter '" + name + "', which dictionary '"
                        + dictionary.name() + "' does not hold");
            }
            if (!seen.add(name)) {
                throw new PointcallException("parameter '" + name
                        + "' has two window specs; give all of its window lengths in one");
            }
        }
        this.layout = new FeatureLayout(specs, slots);
        this.frameSlots = dictionary.size();
        this.periodNs = settings.decisionPeriodNs();
        this.minSamples = settings.minSamples();
        this.keepInvalid = settings.invalidWindow() == InvalidWindowPolicy.KEEP;
        this.tracks = new Track[specs.size()];
        long longest = 0;
        int window = 0;
        for (int s = 0; s < specs.size(); s++) {
            WindowSpec spec = specs.get(s);
            Parameter p = dictionary.parameter(slots[s]);
            long[] lengthsNs = new long[spec.windowsS().size()];
            double maxLengthS = 0;
            for (int i = 0; i < lengthsNs.length; i++) {
                double l = spec.windowsS().get(i);
                lengthsNs[i] = WindowSpec.lengthNs(l);
                maxLengthS = Math.max(maxLengthS, l);
                longest = Math.max(longest, lengthsNs[i]);
            }
            double gapS = Double.isNaN(spec.maxGapS()) ? settings.gapFactor() / p.rateHz() : spec.maxGapS();
            long maxGapNs = Math.max(1L, Math.round(gapS * 1e9));
            int capacity = capacityFor(maxLengthS + periodNs * 1e-9, p.rateHz());
            tracks[s] = new Track(slots[s], maxGapNs, lengthsNs, window, capacity);
            window += lengthsNs.length;
        }
        this.longestWindowNs = longest;
        this.features = new double[layout.size()];
        this.valid = new boolean[layout.windowCount()];
        this.coverage = new double[layout.windowCount()];
        Arrays.fill(features, Double.NaN);
    }

    /**
     * Resolves the specs' parameter names to slots of {@code dictionary} and builds the extractor.
     *
     * @throws PointcallException naming the parameter when a spec names one the dictionary does not hold, or names
     *                            one twice
     */
    public static FeatureExtractor bind(ParameterDictionary dictionary, List<WindowSpec> specs,
                                        ExtractorSettings settings, FeatureListener listener) {
        return new FeatureExtractor(Objects.requireNonNull(dictionary, "dictionary"), List.copyOf(specs), settings,
                listener);
    }

    /** Room for {@code lengthS} of samples at the nominal rate plus a quarter for jitter, as a power of two. */
    private static int capacityFor(double lengthS, double rateHz) {
        double need = Math.ceil(lengthS * rateHz * 1.25) + 4;
        if (need > 1 << 30) {
            throw new PointcallException("a window of " + lengthS + " s at " + rateHz
                    + " Hz holds too many samples; use a shorter window");
        }
        int c = 16;
        while (c < need) {
            c <<= 1;
        }
        return c;
    }

    @Override
    public void onFrame(Frame frame) {
        long t = frame.timeNs();
        if (started && t <= watermarkNs) {
            framesRejected++;
            lastRejectedSequence = frame.sequence();
            return;
        }
        if (frame.slots() != frameSlots) {
            throw new IllegalArgumentException("frame has " + frame.slots() + " slots, the bound dictionary "
                    + frameSlots);
        }
        if (!started) {
            started = true;
            nextTickNs = ceilToPeriod(t);
        } else {
            fireTicksThrough(t - 1);
        }
        watermarkNs = t;
        lastFrameNs = t;
        boolean gap = (frame.flags() & Frame.GAP_BEFORE) != 0;
        double[] v = frame.values();
        for (Track track : tracks) {
            double x = v[track.slot];
            if (gap) {
                track.pendingGap = true;
            }
            if (x != x) {
                continue;
            }
            if (x == Double.POSITIVE_INFINITY || x == Double.NEGATIVE_INFINITY) {
                valuesNonFinite++;
                continue;
            }
            track.add(t, x);
        }
        framesAccepted++;
        if (nextTickNs == t) {
            tick(t);
            nextTickNs += periodNs;
        }
    }

    /**
     * Declares that no frame with time {@code <= timeNs} is still to come (for example when a live stream falls
     * silent) and fires the ticks up to it. Later frames at or before {@code timeNs} are rejected.
     *
     * @return the number of ticks fired
     */
    public int advanceTo(long timeNs) {
        if (!started || timeNs <= watermarkNs) {
            return 0;
        }
        long before = ticksEmitted;
        fireTicksThrough(timeNs);
        watermarkNs = timeNs;
        return (int) (ticksEmitted - before);
    }

    /** Forgets all samples and the time line, as after a replay seek; buffers are kept. */
    public void reset() {
        for (Track track : tracks) {
            track.reset();
        }
        started = false;
        lastTickNs = Long.MIN_VALUE;
        Arrays.fill(features, Double.NaN);
        Arrays.fill(valid, false);
        Arrays.fill(coverage, 0.0);
    }

    /** Fires the pending ticks at or before {@code limitNs}, skipping those at which every window is empty. */
    private void fireTicksThrough(long limitNs) {
        while (nextTickNs <= limitNs) {
            if (nextTickNs - longestWindowNs > lastFrameNs) {
                long resume = ceilToPeriod(limitNs + 1);
                ticksSkipped += (resume - nextTickNs) / periodNs;
                nextTickNs = resume;
                return;
            }
            tick(nextTickNs);
            nextTickNs += periodNs;
        }
    }

    private void tick(long nowNs) {
        for (Track track : tracks) {
            track.evaluate(nowNs, features, valid, coverage, minSamples, keepInvalid);
        }
        lastTickNs = nowNs;
        ticksEmitted++;
        listener.onFeatures(nowNs, features, valid, coverage);
    }

    private long ceilToPeriod(long t) {
        return -Math.floorDiv(-t, periodNs) * periodNs;
    }

    public FeatureLayout layout() {
        return layout;
    }

    public ExtractorSettings settings() {
        return settings;
    }

    /** Decision period in nanoseconds (the decision rate's period rounded to whole nanoseconds). */
    public long decisionPeriodNs() {
        return periodNs;
    }

    /** A feature of the latest tick (NaN before the first). */
    public double feature(int index) {
        return features[index];
    }

    /** Whether a window was valid at the latest tick. */
    public boolean valid(int window) {
        return valid[window];
    }

    /** Covered fraction of a window at the latest tick. */
    public double coverage(int window) {
        return coverage[window];
    }

    /** Time of the latest tick, {@link Long#MIN_VALUE} before the first. */
    public long lastTickNs() {
        return lastTickNs;
    }

    public long framesAccepted() {
        return framesAccepted;
    }

    /** Frames dropped because their time was not after the previous frame's (or an {@link #advanceTo} instant). */
    public long framesRejected() {
        return framesRejected;
    }

    /** Sequence number of the latest rejected frame, -1 if none. */
    public long lastRejectedSequence() {
        return lastRejectedSequence;
    }

    /** Infinite values of selected parameters, skipped like absent ones. */
    public long valuesNonFinite() {
        return valuesNonFinite;
    }

    public long ticksEmitted() {
        return ticksEmitted;
    }

    public long ticksSkipped() {
        return ticksSkipped;
    }

    /** How many times a parameter's buffer had to double because it came faster than its nominal rate. */
    public int bufferGrowths() {
        int g = 0;
        for (Track track : tracks) {
            g += track.growths;
        }
        return g;
    }

    /** Exact recomputations of running sums so far, summed over windows (a diagnostic of the re-anchoring). */
    long recomputes() {
        long r = 0;
        for (Track track : tracks) {
            for (SlidingWindow w : track.windows) {
                r += w.recomputes;
            }
        }
        return r;
    }
}
