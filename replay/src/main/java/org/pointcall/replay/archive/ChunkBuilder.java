package org.pointcall.replay.archive;

import static org.pointcall.replay.archive.ArchiveFormat.*;

import java.nio.ByteBuffer;
import java.nio.charset.StandardCharsets;
import java.util.zip.CRC32C;

/**
 * Collects records into the payload of one chunk and seals it (header and CRC-32Cs) into bytes ready to write.
 * Adding a record copies its bytes into a buffer allocated once; only {@link #seal} allocates, once per chunk.
 * Single-threaded.
 */
public final class ChunkBuilder {
    private final ByteBuffer payload;
    private final int targetBytes;
    private final CRC32C crc = new CRC32C();
    private int records;
    private int packets;
    private long firstTimeNs;
    private long lastTimeNs;

    /**
     * @param targetBytes payload size at which {@link #full()} says to seal; a record never straddles chunks, so the
     *                    buffer also has room for one largest record beyond it
     */
    public ChunkBuilder(int targetBytes) {
        if (targetBytes < 1024 || targetBytes > MAX_PAYLOAD_BYTES - 2 * MAX_BODY_BYTES) {
            throw new IllegalArgumentException("chunk size must be 1 KiB to 62 MiB, got " + targetBytes + " bytes");
        }
        this.targetBytes = targetBytes;
        this.payload = ByteBuffer.allocate(targetBytes + RECORD_HEADER_BYTES + MAX_TAG_BYTES + MAX_BODY_BYTES)
                .order(ORDER);
    }

    public boolean isEmpty() {
        return records == 0;
    }

    public boolean full() {
        return payload.position() >= targetBytes;
    }

    public int records() {
        return records;
    }

    /** Packet records in the chunk being built. */
    public int packets() {
        return packets;
    }

    public int payloadBytes() {
        return payload.position();
    }

    public long firstTimeNs() {
        return firstTimeNs;
    }

    public long lastTimeNs() {
        return lastTimeNs;
    }

    /** Whether a record with this body and tag fits now (an empty chunk takes any allowed record). */
    public boolean fits(int tagBytes, int bodyBytes) {
        return payload.remaining() >= RECORD_HEADER_BYTES + tagBytes + bodyBytes;
    }

    /** Copies the remaining bytes of {@code packet} (its position is not moved). */
    public void addPacket(ByteBuffer packet, long timeNs, long senderTag) {
        int len = packet.remaining();
        header(KIND_PACKET, 0, len, timeNs, senderTag);
        payload.put(payload.position(), packet, packet.position(), len);
        payload.position(payload.position() + len);
        packets++;
    }

    public void addDictionary(long hash, byte[] text, long timeNs) {
        header(KIND_DICTIONARY, 0, text.length, timeNs, hash);
        payload.put(text);
    }

    /** A typed record: {@code tag} its type, {@code body} its JSON bytes, {@code dataTimeNs} the caller's time. */
    public void addTyped(byte[] tag, byte[] body, long timeNs, long dataTimeNs) {
        header(KIND_TYPED, tag.length, body.length, timeNs, dataTimeNs);
        payload.put(tag);
        payload.put(body);
    }

    private void header(int kind, int tagBytes, int bodyBytes, long timeNs, long extra) {
        if (tagBytes > MAX_TAG_BYTES || bodyBytes > MAX_BODY_BYTES) {
            throw new IllegalArgumentException("record too large: tag " + tagBytes + " bytes (at most " + MAX_TAG_BYTES
                    + "), body " + bodyBytes + " bytes (at most " + MAX_BODY_BYTES + ")");
        }
        if (!fits(tagBytes, bodyBytes)) {
            throw new IllegalStateException("record does not fit the chunk: seal it first");
        }
        if (records == 0) {
            firstTimeNs = timeNs;
            lastTimeNs = timeNs;
        } else {
            firstTimeNs = Math.min(firstTimeNs, timeNs);
            lastTimeNs = Math.max(lastTimeNs, timeNs);
        }
        records++;
        payload.put((byte) kind).put((byte) tagBytes).putShort((short) 0).putInt(bodyBytes).putLong(timeNs)
                .putLong(extra);
    }

    /** The chunk as it goes to disk, numbered {@code number}; the builder is then empty again. */
    public byte[] seal(int number) {
        int len = payload.position();
        byte[] out = new byte[CHUNK_HEADER_BYTES + len];
        ByteBuffer b = ByteBuffer.wrap(out).order(ORDER);
        crc.reset();
        crc.update(payload.array(), 0, len);
        b.putInt(CHUNK_MAGIC).putInt(number).putInt(len).putInt(records).putLong(firstTimeNs).putLong(lastTimeNs)
                .putInt((int) crc.getValue());
        crc.reset();
        crc.update(out, 0, CH_HEADER_CRC);
        b.putInt((int) crc.getValue());
        System.arraycopy(payload.array(), 0, out, CHUNK_HEADER_BYTES, len);
        payload.clear();
        records = 0;
        packets = 0;
        return out;
    }

    /** The archive's file header. */
    public static byte[] fileHeader(long createdEpochMs, long clockAtCreationNs) {
        byte[] out = new byte[FILE_HEADER_BYTES];
        ByteBuffer b = ByteBuffer.wrap(out).order(ORDER);
        b.putInt(FILE_MAGIC).putShort((short) VERSION).putShort((short) FILE_HEADER_BYTES).putLong(createdEpochMs)
                .putLong(clockAtCreationNs).putInt(0);
        CRC32C c = new CRC32C();
        c.update(out, 0, FH_CRC);
        b.putInt((int) c.getValue());
        return out;
    }

    /** UTF-8 bytes of a record type, checked: 1 to 64 bytes of letters, digits, '.', '-' or '_'. */
    public static byte[] tagBytes(String type) {
        if (type == null || type.isEmpty() || !type.matches("[A-Za-z0-9._-]+")) {
            throw new IllegalArgumentException("a record type is 1 to " + MAX_TAG_BYTES
                    + " letters, digits, '.', '-' or '_', got '" + type + "'");
        }
        byte[] t = type.getBytes(StandardCharsets.US_ASCII);
        if (t.length > MAX_TAG_BYTES) {
            throw new IllegalArgumentException("record type '" + type + "' is longer than " + MAX_TAG_BYTES + " bytes");
        }
        return t;
    }
}
