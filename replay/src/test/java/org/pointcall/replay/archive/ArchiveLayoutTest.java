package org.pointcall.replay.archive;

import static org.junit.jupiter.api.Assertions.*;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.zip.CRC32C;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The byte layout ARCHIVE-FORMAT.md documents, checked byte by byte on a file the real writer wrote. */
class ArchiveLayoutTest {
    @TempDir
    Path dir;

    private static int[] u8(byte[] p, int from, int to) {
        int[] out = new int[to - from];
        for (int i = from; i < to; i++) {
            out[i - from] = p[i] & 0xff;
        }
        return out;
    }

    private static int crc(byte[] p, int from, int to) {
        CRC32C c = new CRC32C();
        c.update(p, from, to - from);
        return (int) c.getValue();
    }

    @Test
    void headerChunkAndRecordFieldsSitWhereTheDocumentSays() throws IOException {
        Path f = dir.resolve("l.pcsa");
        ChunkBuilder cb = new ChunkBuilder(4096);
        byte[] packet = {9, 8, 7};
        cb.addPacket(ByteBuffer.wrap(packet), 0x0102L, 0x7f000001_1f90L);
        cb.addTyped(ChunkBuilder.tagBytes("note"), "{}".getBytes(StandardCharsets.UTF_8), 0x0203L, -1L);
        try (ArchiveWriter w = ArchiveWriter.create(f, 0x1122334455L, 0x0AL)) {
            w.write(cb.seal(5));
        }
        byte[] p = Files.readAllBytes(f);
        ByteBuffer b = ByteBuffer.wrap(p).order(ByteOrder.LITTLE_ENDIAN);
        // file header
        assertArrayEquals(new int[] {'P', 'C', 'S', 'A', 1, 0, 32, 0}, u8(p, 0, 8));
        assertEquals(0x1122334455L, b.getLong(8));
        assertEquals(0x0AL, b.getLong(16));
        assertEquals(0, b.getInt(24));
        assertEquals(crc(p, 0, 28), b.getInt(28));
        // chunk header at 32
        int records = 24 + 3 + 24 + 4 + 2;
        assertArrayEquals(new int[] {'P', 'C', 'C', 'K', 5, 0, 0, 0}, u8(p, 32, 40));
        assertEquals(records, b.getInt(40), "payload bytes");
        assertEquals(2, b.getInt(44), "records");
        assertEquals(0x0102L, b.getLong(48), "first time");
        assertEquals(0x0203L, b.getLong(56), "last time");
        assertEquals(crc(p, 72, 72 + records), b.getInt(64), "payload CRC");
        assertEquals(crc(p, 32, 68), b.getInt(68), "header CRC over bytes 0 to 35 of the chunk");
        // packet record at 72
        assertArrayEquals(new int[] {1, 0, 0, 0, 3, 0, 0, 0}, u8(p, 72, 80), "kind 1, no tag, body 3");
        assertEquals(0x0102L, b.getLong(80));
        assertEquals(0x7f000001_1f90L, b.getLong(88), "sender 127.0.0.1:8080");
        assertArrayEquals(new int[] {9, 8, 7}, u8(p, 96, 99));
        // typed record at 99
        assertArrayEquals(new int[] {3, 4, 0, 0, 2, 0, 0, 0}, u8(p, 99, 107), "kind 3, tag 4, body 2");
        assertEquals(0x0203L, b.getLong(107));
        assertEquals(-1L, b.getLong(115), "producer's time");
        assertArrayEquals(new int[] {'n', 'o', 't', 'e', '{', '}'}, u8(p, 123, 129));
        assertEquals(129, p.length);

        byte[] idx = Files.readAllBytes(ArchiveIndex.pathFor(f));
        ByteBuffer x = ByteBuffer.wrap(idx).order(ByteOrder.LITTLE_ENDIAN);
        assertEquals(24 + 40 + 4, idx.length);
        assertArrayEquals(new int[] {'P', 'C', 'S', 'I', 1, 0, 0, 0}, u8(idx, 0, 8));
        assertEquals(129L, x.getLong(8), "bytes covered");
        assertEquals(1, x.getInt(16));
        assertEquals(32L, x.getLong(24), "chunk offset");
        assertEquals(5, x.getInt(32));
        assertEquals(2, x.getInt(36));
        assertEquals(records, x.getInt(40));
        assertEquals(0x0102L, x.getLong(48));
        assertEquals(0x0203L, x.getLong(56));
        assertEquals(crc(idx, 0, idx.length - 4), x.getInt(idx.length - 4));
    }

    @Test
    void theDocumentNamesTheSameSizesAsTheCode() throws IOException {
        List<String> doc = Files.readAllLines(Path.of("ARCHIVE-FORMAT.md"));
        String all = String.join("\n", doc);
        assertTrue(all.contains("## File header, " + ArchiveFormat.FILE_HEADER_BYTES + " bytes"));
        assertTrue(all.contains("## Chunk header, " + ArchiveFormat.CHUNK_HEADER_BYTES + " bytes"));
        assertTrue(all.contains("| 24 + t | b | body |"));
        assertTrue(all.contains("then one " + ArchiveFormat.INDEX_ENTRY_BYTES + "-byte entry per"));
        assertTrue(all.contains("Extension `" + ArchiveFormat.EXTENSION + "`"));
    }
}
