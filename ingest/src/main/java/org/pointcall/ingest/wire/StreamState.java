package org.pointcall.ingest.wire;

import java.util.Arrays;

import org.pointcall.ingest.frame.Frame;
import org.pointcall.shared.dictionary.ParameterDictionary;

/** Decoder state of one stream id: sequence tracking, bound dictionary, frame reassembly, announce assembly. */
final class StreamState {
    final int streamId;
    final StreamTracker tracker;

    boolean bound;
    ParameterDictionary dictionary;
    long hash;
    int slots;
    /** Frames decoded whole, or an early part delivered at once. */
    Frame out;
    /** The frame being put together from parts. */
    Frame pending;
    long[] pendingSlots;
    int pendingCovered;
    boolean hasPending;
    long pendingIndex;
    long pendingTimeNs;
    long pendingReceiveNs;
    int pendingFlags;

    boolean hasDelivered;
    long lastIndex;
    long lastTimeNs;
    boolean gapPending;

    AnnounceAssembly assembly;

    StreamState(int streamId, StreamTracker tracker) {
        this.streamId = streamId;
        this.tracker = tracker;
    }

    void bind(ParameterDictionary d) {
        dictionary = d;
        hash = d.hash();
        bound = true;
        if (out == null || d.size() != slots) {
            slots = d.size();
            out = new Frame(slots);
            pending = new Frame(slots);
            pendingSlots = new long[(slots + 63) >>> 6];
        }
        hasPending = false;
    }

    void startPending(long index, long timeNs, int flags) {
        pending.clear();
        Arrays.fill(pendingSlots, 0L);
        pendingCovered = 0;
        hasPending = true;
        pendingIndex = index;
        pendingTimeNs = timeNs;
        pendingFlags = flags;
    }

    /** After a restart: frame indices of the new session bear no relation to the old ones. */
    void resetContinuity() {
        hasDelivered = false;
        gapPending = true;
    }
}
