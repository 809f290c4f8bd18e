package org.pointcall.ingest.wire;

/**
 * Limits of a {@link PacketDecoder}.
 *
 * @param maxDatagramBytes      longer datagrams are counted {@link DecodeResult#OVERSIZE} and dropped
 * @param maxStreams            distinct stream ids tracked; a new one beyond is {@link DecodeResult#STREAM_LIMIT}
 * @param reorderWindow         see {@link StreamTracker}
 * @param resyncAfter           see {@link StreamTracker}
 * @param maxAnnounceTextBytes  longest dictionary text accepted from an announce
 */
public record DecoderOptions(int maxDatagramBytes, int maxStreams, int reorderWindow, int resyncAfter,
                             int maxAnnounceTextBytes) {
    public static final DecoderOptions DEFAULT = new DecoderOptions(WireFormat.DEFAULT_MAX_DATAGRAM_BYTES, 256,
            StreamTracker.DEFAULT_REORDER_WINDOW, StreamTracker.DEFAULT_RESYNC_AFTER, 1 << 20);

    public DecoderOptions {
        WireFormat.checkMaxDatagram(maxDatagramBytes);
        if (maxStreams < 1) {
            throw new IllegalArgumentException("maxStreams must be >= 1, got " + maxStreams);
        }
        if (maxAnnounceTextBytes < 1) {
            throw new IllegalArgumentException("maxAnnounceTextBytes must be >= 1, got " + maxAnnounceTextBytes);
        }
        StreamTracker.check(reorderWindow, resyncAfter);
    }

    public DecoderOptions withMaxDatagramBytes(int bytes) {
        return new DecoderOptions(bytes, maxStreams, reorderWindow, resyncAfter, maxAnnounceTextBytes);
    }

    public DecoderOptions withMaxStreams(int n) {
        return new DecoderOptions(maxDatagramBytes, n, reorderWindow, resyncAfter, maxAnnounceTextBytes);
    }

    public DecoderOptions withReorderWindow(int n) {
        return new DecoderOptions(maxDatagramBytes, maxStreams, n, resyncAfter, maxAnnounceTextBytes);
    }

    public DecoderOptions withResyncAfter(int n) {
        return new DecoderOptions(maxDatagramBytes, maxStreams, reorderWindow, n, maxAnnounceTextBytes);
    }

    public DecoderOptions withMaxAnnounceTextBytes(int n) {
        return new DecoderOptions(maxDatagramBytes, maxStreams, reorderWindow, resyncAfter, n);
    }
}
