package org.pointcall.replay.archive;

import static org.pointcall.replay.archive.ArchiveFormat.*;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.ArrayList;
import java.util.List;
import java.util.zip.CRC32C;

/**
 * The seek index beside an archive ({@code <archive>.idx}): one entry per chunk, and how many bytes of the archive
 * it covers. It is a cache: a missing, damaged or stale index is rebuilt by scanning the archive.
 */
public final class ArchiveIndex {
    private ArchiveIndex() {
    }

    public static Path pathFor(Path archive) {
        return archive.resolveSibling(archive.getFileName() + INDEX_SUFFIX);
    }

    /** Writes the index next to the archive, through a temporary file so a reader never sees half of it. */
    public static void write(Path archive, long coveredBytes, List<ChunkInfo> chunks) throws IOException {
        ByteBuffer b = ByteBuffer.allocate(INDEX_HEADER_BYTES + chunks.size() * INDEX_ENTRY_BYTES + 4).order(ORDER);
        b.putInt(INDEX_MAGIC).putShort((short) VERSION).putShort((short) 0).putLong(coveredBytes)
                .putInt(chunks.size()).putInt(0);
        for (ChunkInfo c : chunks) {
            b.putLong(c.offset()).putInt(c.number()).putInt(c.records()).putInt(c.payloadBytes()).putInt(0)
                    .putLong(c.firstTimeNs()).putLong(c.lastTimeNs());
        }
        CRC32C crc = new CRC32C();
        crc.update(b.array(), 0, b.position());
        b.putInt((int) crc.getValue());
        Path target = pathFor(archive);
        Path tmp = target.resolveSibling(target.getFileName() + ".tmp");
        Files.write(tmp, b.array());
        Files.move(tmp, target, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
    }

    /** What an index file holds. */
    record Loaded(long coveredBytes, List<ChunkInfo> chunks) {
    }

    /** The index, or null when it is missing or fails its checks (then the caller scans). */
    static Loaded read(Path archive) {
        Path p = pathFor(archive);
        byte[] bytes;
        try {
            if (!Files.isRegularFile(p)) {
                return null;
            }
            bytes = Files.readAllBytes(p);
        } catch (IOException e) {
            return null;
        }
        if (bytes.length < INDEX_HEADER_BYTES + 4) {
            return null;
        }
        ByteBuffer b = ByteBuffer.wrap(bytes).order(ORDER);
        CRC32C crc = new CRC32C();
        crc.update(bytes, 0, bytes.length - 4);
        if (b.getInt(0) != INDEX_MAGIC || (b.getShort(4) & 0xffff) != VERSION
                || (int) crc.getValue() != b.getInt(bytes.length - 4)) {
            return null;
        }
        long covered = b.getLong(8);
        long n = b.getInt(16) & 0xffffffffL;
        if (INDEX_HEADER_BYTES + n * INDEX_ENTRY_BYTES + 4 != bytes.length) {
            return null;
        }
        List<ChunkInfo> chunks = new ArrayList<>((int) n);
        b.position(INDEX_HEADER_BYTES);
        try {
            for (int i = 0; i < n; i++) {
                long off = b.getLong();
                int number = b.getInt();
                int records = b.getInt();
                int payload = b.getInt();
                b.getInt();
                chunks.add(new ChunkInfo(off, number, records, payload, b.getLong(), b.getLong()));
            }
        } catch (IllegalArgumentException e) {
            return null;
        }
        return new Loaded(covered, chunks);
    }
}
