package org.pointcall.ingest.wire;

/** What {@link StreamTracker#observe} made of one packet's epoch and sequence number. */
public enum SequenceVerdict {
    /** First packet of the stream. */
    FIRST(true),
    /** The next number. */
    IN_ORDER(true),
    /** Ahead of the next number: the packets in between are counted missing. */
    AFTER_GAP(true),
    /** Behind the newest, within the reorder window, not seen before: fills part of an earlier gap. */
    LATE(true),
    /** Seen before: dropped. */
    DUPLICATE(false),
    /** Too far behind to tell (beyond the reorder window, or older than the first packet tracked): dropped. */
    STALE(false),
    /** A new epoch: the sender restarted; tracking starts again from this packet. */
    RESTART(true),
    /** Many stale packets in a row with the old epoch: taken as a restart that kept its epoch. */
    RESYNC(true);

    private final boolean accepted;

    SequenceVerdict(boolean accepted) {
        this.accepted = accepted;
    }

    public boolean accepted() {
        return accepted;
    }

    /** Continuity with the previous packets is broken (frames after it get a gap flag). */
    public boolean discontinuity() {
        return this == AFTER_GAP || this == RESTART || this == RESYNC;
    }
}
