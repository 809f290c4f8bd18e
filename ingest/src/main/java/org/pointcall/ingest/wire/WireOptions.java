package org.pointcall.ingest.wire;

/**
 * How a {@link StreamEncoder} packs a stream.
 *
 * @param maxDatagramBytes   largest datagram written; {@link WireFormat#DEFAULT_MAX_DATAGRAM_BYTES} keeps clear of IP
 *                           fragmentation on Ethernet, up to {@link WireFormat#MAX_UDP_PAYLOAD_BYTES}
 * @param float32            carry values as float32 (half the bytes, about 7 significant digits)
 * @param maxFramesPerPacket cap on frames batched into one packet, 0 for as many as fit; 1 gives the lowest latency
 *                           since a frame then never waits for the next one
 * @param announceIntervalNs re-announce the dictionary whenever frame time has moved on this much since the last
 *                           announce, so a receiver started late or one that lost the announce catches up; 0 announces
 *                           only before the first frame
 * @param synthetic          mark every packet as coming from a simulator or replay
 */
public record WireOptions(int maxDatagramBytes, boolean float32, int maxFramesPerPacket, long announceIntervalNs,
                          boolean synthetic) {
    public static final long DEFAULT_ANNOUNCE_INTERVAL_NS = 1_000_000_000L;
    public static final WireOptions DEFAULT = new WireOptions(WireFormat.DEFAULT_MAX_DATAGRAM_BYTES, false, 0,
            DEFAULT_ANNOUNCE_INTERVAL_NS, false);

    public WireOptions {
        WireFormat.checkMaxDatagram(maxDatagramBytes);
        if (maxFramesPerPacket < 0) {
            throw new IllegalArgumentException("maxFramesPerPacket must be >= 0 (0 = as many as fit), got "
                    + maxFramesPerPacket);
        }
        if (announceIntervalNs < 0) {
            throw new IllegalArgumentException("announceIntervalNs must be >= 0, got " + announceIntervalNs);
        }
    }

    public WireOptions withMaxDatagramBytes(int bytes) {
        return new WireOptions(bytes, float32, maxFramesPerPacket, announceIntervalNs, synthetic);
    }

    public WireOptions withFloat32(boolean f) {
        return new WireOptions(maxDatagramBytes, f, maxFramesPerPacket, announceIntervalNs, synthetic);
    }

    public WireOptions withMaxFramesPerPacket(int n) {
        return new WireOptions(maxDatagramBytes, float32, n, announceIntervalNs, synthetic);
    }

    public WireOptions withAnnounceIntervalNs(long ns) {
        return new WireOptions(maxDatagramBytes, float32, maxFramesPerPacket, ns, synthetic);
    }

    public WireOptions withSynthetic(boolean s) {
        return new WireOptions(maxDatagramBytes, float32, maxFramesPerPacket, announceIntervalNs, s);
    }

    int flags() {
        return (float32 ? WireFormat.FLAG_FLOAT32 : 0) | (synthetic ? WireFormat.FLAG_SYNTHETIC : 0);
    }
}
