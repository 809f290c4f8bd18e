package org.pointcall.ui.desk;

/**
 * Stream health as the console shows it, read from the ingest meters.
 *
 * @param frameRateHz   frames decoded per second over the last interval
 * @param sequenceGaps  sequence gaps seen so far
 * @param lostPackets   packets missing from the sequence numbers
 * @param droppedPackets datagrams dropped because the pipeline queue was full
 * @param latencyP50Ms  median arrival-to-features latency, ms (NaN when unknown)
 * @param latencyP99Ms  99th percentile of the same, ms
 * @param framesSeen    frames decoded so far
 */
public record StreamHealth(double frameRateHz, long sequenceGaps, long lostPackets, long droppedPackets,
                           double latencyP50Ms, double latencyP99Ms, long framesSeen) {
    /** Before the first reading. */
    public static final StreamHealth NONE = new StreamHealth(0, 0, 0, 0, Double.NaN, Double.NaN, 0);

    /** No frame arrived in the last interval. */
    public boolean silent() {
        return !(frameRateHz > 0);
    }
}
