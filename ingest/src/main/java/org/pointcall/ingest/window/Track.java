package org.pointcall.ingest.window;

/**
 * The samples of one parameter, on primitive rings shared by all of its windows (each window keeps its own start).
 * Holds enough history for the longest window plus the samples of one decision period; grows by doubling only when
 * a parameter comes faster than its nominal rate.
 */
final class Track {
    /**
     * Gap value of a sample with no predecessor (first after bind or reset). Any positive value marks "not
     * continuous"; this one is large, yet sums of many cannot overflow a long.
     */
    static final long NO_PREDECESSOR = 1L << 46;

    final int slot;
    final long maxGapNs;
    final SlidingWindow[] windows;
    private final int longest;

    long[] timesNs;
    double[] values;
    /** Per sample: 0 when the interval from the previous sample is continuous, else that interval (> 0). */
    long[] gapNs;
    int mask;
    /** Sequence number the next sample gets. */
    long tailSeq;
    long lastTimeNs;
    boolean hasSample;
    /** A frame flagged GAP_BEFORE arrived since the last sample of this parameter. */
    boolean pendingGap;
    int growths;
    /**
     * Monotonic deques over the longest window. Every window of the track ends at the same newest sample, so a
     * shorter window's deque is a suffix of these: each window only keeps the position where its part begins.
     */
    final SeqDeque minQ;
    final SeqDeque maxQ;

    Track(int slot, long maxGapNs, long[] lengthsNs, int firstWindow, int capacity) {
        this.slot = slot;
        this.maxGapNs = maxGapNs;
        timesNs = new long[capacity];
        values = new double[capacity];
        gapNs = new long[capacity];
        mask = capacity - 1;
        minQ = new SeqDeque(capacity);
        maxQ = new SeqDeque(capacity);
        windows = new SlidingWindow[lengthsNs.length];
        int lg = 0;
        for (int i = 0; i < lengthsNs.length; i++) {
            windows[i] = new SlidingWindow(this, lengthsNs[i], firstWindow + i);
            if (lengthsNs[i] > lengthsNs[lg]) {
                lg = i;
            }
        }
        longest = lg;
    }

    void add(long timeNs, double value) {
        if (tailSeq - windows[longest].startSeq > mask) {
            // Windows shed old samples at ticks; when the ring fills first (decisions slower than the window
            // turns over), shed what the new sample pushes out, and grow only if the window really holds more.
            for (SlidingWindow w : windows) {
                w.evictBefore(timeNs - w.lengthNs);
            }
            trimDeques();
            long headSeq = windows[longest].startSeq;
            if (tailSeq - headSeq > mask) {
                grow(headSeq);
            }
        }
        long gap;
        if (!hasSample) {
            gap = NO_PREDECESSOR;
        } else {
            long dt = timeNs - lastTimeNs;
            gap = pendingGap || dt > maxGapNs ? Math.min(dt, NO_PREDECESSOR) : 0L;
        }
        int p = (int) (tailSeq & mask);
        timesNs[p] = timeNs;
        values[p] = value;
        gapNs[p] = gap;
        long seq = tailSeq++;
        while (!maxQ.isEmpty() && values[(int) (maxQ.last() & mask)] <= value) {
            maxQ.popLast();
        }
        maxQ.pushLast(seq);
        while (!minQ.isEmpty() && values[(int) (minQ.last() & mask)] >= value) {
            minQ.popLast();
        }
        minQ.pushLast(seq);
        long newest = maxQ.tailPos() - 1;
        long newestMin = minQ.tailPos() - 1;
        for (SlidingWindow w : windows) {
            w.add(seq, timeNs, value, gap, newestMin, newest);
        }
        lastTimeNs = timeNs;
        hasSample = true;
        pendingGap = false;
    }

    void evaluate(long nowNs, double[] features, boolean[] valid, double[] coverage, int minSamples, boolean keep) {
        for (SlidingWindow w : windows) {
            w.evaluate(nowNs, features, valid, coverage, minSamples, keep);
        }
        trimDeques();
    }

    /** Drops deque entries older than the longest window, which no window can reach any more. */
    private void trimDeques() {
        long start = windows[longest].startSeq;
        while (!maxQ.isEmpty() && maxQ.first() < start) {
            maxQ.popFirst();
        }
        while (!minQ.isEmpty() && minQ.first() < start) {
            minQ.popFirst();
        }
    }

    void reset() {
        tailSeq = 0;
        hasSample = false;
        pendingGap = false;
        minQ.clear();
        maxQ.clear();
        for (SlidingWindow w : windows) {
            w.reset();
        }
    }

    private void grow(long headSeq) {
        int capacity = (mask + 1) << 1;
        if (capacity <= 0) {
            throw new IllegalStateException("window buffer of slot " + slot + " cannot grow beyond 2^30 samples");
        }
        long[] t = new long[capacity];
        double[] v = new double[capacity];
        long[] g = new long[capacity];
        int m = capacity - 1;
        for (long s = headSeq; s < tailSeq; s++) {
            int from = (int) (s & mask);
            int to = (int) (s & m);
            t[to] = timesNs[from];
            v[to] = values[from];
            g[to] = gapNs[from];
        }
        timesNs = t;
        values = v;
        gapNs = g;
        mask = m;
        minQ.grow(capacity);
        maxQ.grow(capacity);
        growths++;
    }
}
