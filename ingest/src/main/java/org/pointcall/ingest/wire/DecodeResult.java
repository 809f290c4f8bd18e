package org.pointcall.ingest.wire;

/**
 * Outcome of decoding one datagram. Exactly one is counted per datagram in {@link DecodeCounters}. Checks run in a
 * fixed order (framing, then CRC, then header ranges, then content; the order is in WIRE-FORMAT.md), so a datagram
 * with several defects is counted under the first found. Content faults (unknown dictionary, slot count) do not
 * depend on sequence state: a duplicate with a bad hash is still counted as a fault.
 */
public enum DecodeResult {
    /** A frames packet was accepted; its frames were delivered or are waiting for their other parts. */
    FRAMES(false),
    /** An announce fragment was accepted (the dictionary was already known, or the fragment was stored). */
    ANNOUNCE(false),
    /** The packet's sequence number was seen already: dropped. */
    DUPLICATE(false),
    /** The sequence number lies far behind the newest, beyond the reorder window: dropped (see StreamTracker). */
    STALE(false),

    /** Longer than the receiver's maximum datagram size. */
    OVERSIZE(true),
    /** Shorter than its headers, or than the length its header declares. */
    TRUNCATED(true),
    /** Not this format. */
    BAD_MAGIC(true),
    /** A version this build does not read. */
    BAD_VERSION(true),
    /** Longer than its header declares, or the body does not match the header's counts. */
    LENGTH_MISMATCH(true),
    /** The CRC-32C trailer does not match the bytes. */
    BAD_CRC(true),
    /** A header field is out of range or inconsistent (unknown type or flag, slot range past the dictionary...). */
    BAD_HEADER(true),
    /** A new stream id beyond the decoder's stream limit. */
    STREAM_LIMIT(true),
    /** Frames for a dictionary hash neither registered nor announced yet: dropped. */
    UNKNOWN_DICTIONARY(true),
    /** The header's slot count differs from the dictionary its hash names. */
    SLOT_COUNT_MISMATCH(true),
    /** The last fragment of an announce completed a text that is not a valid dictionary for its hash. */
    BAD_ANNOUNCE(true);

    private final boolean fault;

    DecodeResult(boolean fault) {
        this.fault = fault;
    }

    /** True when the datagram was rejected as bad (as opposed to accepted, or dropped as a repeat). */
    public boolean isFault() {
        return fault;
    }
}
