package org.pointcall.replay.play;

import java.util.Locale;

/**
 * What a replay played.
 *
 * @param packets     packets played
 * @param bytes       their bytes
 * @param firstDataNs data time of the first packet played (Long.MIN_VALUE when none)
 * @param lastDataNs  data time of the last
 * @param elapsedNs   replay clock from the first packet to the last
 * @param seeks       seeks carried out
 * @param stopped     ended by a stop rather than by the end of the data
 */
public record ReplaySummary(long packets, long bytes, long firstDataNs, long lastDataNs, long elapsedNs, int seeks,
                            boolean stopped) {
    public long dataSpanNs() {
        return packets == 0 ? 0 : lastDataNs - firstDataNs;
    }

    /** Data time over replay time, the achieved speed (infinite when it took no measurable time). */
    public double speed() {
        return elapsedNs == 0 ? Double.POSITIVE_INFINITY : dataSpanNs() / (double) elapsedNs;
    }

    public String line() {
        return String.format(Locale.ROOT, "%d packets (%d bytes), %.3f s of data in %.3f s (%.2f x)%s%s", packets,
                bytes, dataSpanNs() / 1e9, elapsedNs / 1e9, speed(), seeks > 0 ? ", " + seeks + " seeks" : "",
                stopped ? ", stopped" : "");
    }
}
