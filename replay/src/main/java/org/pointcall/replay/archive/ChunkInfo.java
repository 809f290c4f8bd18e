package org.pointcall.replay.archive;

/**
 * Where one chunk lies and what it spans: an entry of the index.
 *
 * @param offset       file offset of its header
 * @param number       its number (consecutive in a recording; a jump means chunks were lost before writing)
 * @param records      records it holds
 * @param payloadBytes bytes after its header
 * @param firstTimeNs  earliest record time, archive clock
 * @param lastTimeNs   latest record time, archive clock
 */
public record ChunkInfo(long offset, int number, int records, int payloadBytes, long firstTimeNs, long lastTimeNs) {
    public ChunkInfo {
        if (offset < ArchiveFormat.FILE_HEADER_BYTES || records < 0 || payloadBytes < 0
                || payloadBytes > ArchiveFormat.MAX_PAYLOAD_BYTES) {
            throw new IllegalArgumentException("impossible chunk entry at offset " + offset);
        }
    }

    /** Offset just past the chunk. */
    public long end() {
        return offset + ArchiveFormat.CHUNK_HEADER_BYTES + payloadBytes;
    }
}
