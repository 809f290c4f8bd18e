package org.pointcall.replay.archive;

import java.nio.ByteBuffer;
import java.nio.charset.StandardCharsets;

/**
 * One record as a reader hands it over: reused from record to record, valid only during the visitor's call.
 * {@link #body()} is a view of the reader's buffer; copy it to keep it.
 */
public final class RecordView {
    private ByteBuffer body;
    private ByteBuffer source;
    private int kind;
    private long timeNs;
    private long extra;
    private int tagOffset;
    private int tagBytes;
    private int chunkNumber;

    RecordView() {
    }

    void set(ByteBuffer src, int kind, long timeNs, long extra, int tagOffset, int tagBytes, int bodyOffset,
             int bodyBytes, int chunkNumber) {
        if (src != source) {
            source = src;
            body = src.duplicate().order(src.order());
        }
        this.kind = kind;
        this.timeNs = timeNs;
        this.extra = extra;
        this.tagOffset = tagOffset;
        this.tagBytes = tagBytes;
        this.chunkNumber = chunkNumber;
        body.limit(bodyOffset + bodyBytes).position(bodyOffset);
    }

    /** {@link ArchiveFormat#KIND_PACKET}, {@link ArchiveFormat#KIND_DICTIONARY} or {@link ArchiveFormat#KIND_TYPED}. */
    public int kind() {
        return kind;
    }

    public boolean isPacket() {
        return kind == ArchiveFormat.KIND_PACKET;
    }

    /** Archive time: for a packet its arrival time, for other records when the recorder took them. */
    public long timeNs() {
        return timeNs;
    }

    /** Packet: the sender (IPv4 address and port packed as the pipeline packs them). Dictionary: its hash. */
    public long extra() {
        return extra;
    }

    /** For a typed record, the time its producer gave (its own clock, usually data time). */
    public long dataTimeNs() {
        return extra;
    }

    /** The type of a typed record (allocates a string), else "". */
    public String type() {
        return tagBytes == 0 ? "" : new String(source.array(), tagOffset, tagBytes, StandardCharsets.US_ASCII);
    }

    /** Whether this is a typed record of type {@code t}, without allocating. */
    public boolean isType(byte[] t) {
        if (kind != ArchiveFormat.KIND_TYPED || t.length != tagBytes) {
            return false;
        }
        byte[] a = source.array();
        for (int i = 0; i < tagBytes; i++) {
            if (a[tagOffset + i] != t[i]) {
                return false;
            }
        }
        return true;
    }

    /** The body between position and limit: the packet as received, the dictionary text, or the JSON bytes. */
    public ByteBuffer body() {
        return body;
    }

    public byte[] bodyBytes() {
        byte[] b = new byte[body.remaining()];
        body.get(body.position(), b);
        return b;
    }

    /** Number of the chunk the record came from. */
    public int chunkNumber() {
        return chunkNumber;
    }
}
