package org.pointcall.ingest.wire;

/** Sequence counts of a decoder summed over its streams; see {@link StreamTracker} for each meaning. */
public record SequenceTotals(long received, long lost, long gapEvents, long late, long duplicates, long stale,
                             long restarts, long resyncs) {
}
