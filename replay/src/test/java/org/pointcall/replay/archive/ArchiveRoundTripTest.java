package org.pointcall.replay.archive;

import static org.junit.jupiter.api.Assertions.*;

import java.io.IOException;
import java.io.RandomAccessFile;
import java.nio.ByteBuffer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.pointcall.replay.record.W1Feed;

class ArchiveRoundTripTest {
    @TempDir
    Path dir;
    Path file;
    final List<byte[]> packets = new ArrayList<>();
    final List<Long> times = new ArrayList<>();

    /** 2 s of W1 (about 4,000 packets of 1,084 bytes) in 64 KiB chunks, with typed records between them. */
    @BeforeEach
    void write() throws IOException {
        file = dir.resolve("a" + ArchiveFormat.EXTENSION);
        W1Feed feed = new W1Feed(7, p -> {
            byte[] b = new byte[p.remaining()];
            p.get(p.position(), b);
            packets.add(b);
        });
        ChunkBuilder cb = new ChunkBuilder(64 << 10);
        int number = 0;
        try (ArchiveWriter w = ArchiveWriter.create(file, 1_700_000_000_000L, 5L)) {
            cb.addDictionary(feed.dictionary().hash(), feed.dictionaryText().getBytes(StandardCharsets.UTF_8), 0);
            for (int k = 0; k < 2000; k++) {
                int before = packets.size();
                feed.step();
                for (int i = before; i < packets.size(); i++) {
                    long t = W1Feed.frameTimeNs(k) + 1000L * (i - before);
                    times.add(t);
                    byte[] p = packets.get(i);
                    if (!cb.fits(0, p.length)) {
                        w.write(cb.seal(number++));
                    }
                    cb.addPacket(ByteBuffer.wrap(p), t, 0x7f000001_1234L);
                    if (cb.full()) {
                        w.write(cb.seal(number++));
                    }
                }
                if (k % 500 == 0) {
                    byte[] json = ("{\"k\":" + k + "}").getBytes(StandardCharsets.UTF_8);
                    if (!cb.fits(4, json.length)) {
                        w.write(cb.seal(number++));
                    }
                    cb.addTyped(ChunkBuilder.tagBytes("note"), json, W1Feed.frameTimeNs(k), k);
                }
            }
            w.write(cb.seal(number));
        }
    }

    private int packetsIn(ChunkInfo c) {
        int[] n = new int[1];
        try (ArchiveReader r = ArchiveReader.open(file)) {
            r.read(v -> {
                if (v.isPacket() && v.chunkNumber() == c.number()) {
                    n[0]++;
                }
                return true;
            });
        }
        return n[0];
    }

    private List<byte[]> readPackets(ArchiveReader r) {
        List<byte[]> out = new ArrayList<>();
        r.read(v -> {
            if (v.isPacket()) {
                out.add(v.bodyBytes());
            }
            return true;
        });
        return out;
    }

    @Test
    void everyPacketComesBackInOrderWithItsArrivalTime() {
        try (ArchiveReader r = ArchiveReader.open(file)) {
            assertFalse(r.indexRebuilt(), "a cleanly closed archive is opened from its index");
            assertTrue(r.chunks().size() > 50, "many chunks: " + r.chunks().size());
            assertTrue(r.damage().isEmpty());
            assertNull(r.cutTail());
            List<byte[]> back = new ArrayList<>();
            List<Long> t = new ArrayList<>();
            r.read(v -> {
                if (v.isPacket()) {
                    back.add(v.bodyBytes());
                    t.add(v.timeNs());
                    assertEquals(0x7f000001_1234L, v.extra());
                }
                return true;
            });
            assertEquals(packets.size(), back.size());
            for (int i = 0; i < packets.size(); i++) {
                assertArrayEquals(packets.get(i), back.get(i), "packet " + i);
            }
            assertEquals(times, t);
            List<TypedRecord> notes = r.typedRecords("note");
            assertEquals(4, notes.size());
            assertEquals("{\"k\":1500}", notes.get(3).jsonText());
            assertEquals(1500, notes.get(3).dataTimeNs());
            assertEquals(1, r.dictionaries().size());
            assertEquals(1_700_000_000_000L, r.createdEpochMs());
        }
    }

    @Test
    void aMissingIndexIsRebuiltByScanningAndWrittenBack() throws IOException {
        List<ChunkInfo> fromIndex;
        try (ArchiveReader r = ArchiveReader.open(file)) {
            fromIndex = r.chunks();
        }
        Files.delete(ArchiveIndex.pathFor(file));
        try (ArchiveReader r = ArchiveReader.open(file)) {
            assertTrue(r.indexRebuilt());
            assertEquals(fromIndex, r.chunks());
            assertEquals(packets.size(), readPackets(r).size());
        }
        assertTrue(Files.exists(ArchiveIndex.pathFor(file)));
        try (ArchiveReader r = ArchiveReader.open(file)) {
            assertFalse(r.indexRebuilt());
        }
    }

    @Test
    void aCorruptChunkInTheMiddleIsSkippedNamingItsOffsetAndLaterChunksAreRead() throws IOException {
        ChunkInfo bad;
        try (ArchiveReader r = ArchiveReader.open(file)) {
            bad = r.chunks().get(r.chunks().size() / 2);
        }
        int lostPackets = packetsIn(bad);
        flipByte(bad.offset() + ArchiveFormat.CHUNK_HEADER_BYTES + 100);
        Files.delete(ArchiveIndex.pathFor(file));
        try (ArchiveReader r = ArchiveReader.open(file)) {
            assertEquals(1, r.damage().size(), r.damage().toString());
            Damage d = r.damage().get(0);
            assertEquals(bad.offset(), d.offset());
            assertTrue(d.message().contains("at offset " + bad.offset()), d.message());
            assertTrue(d.message().contains("payload CRC-32C mismatch"), d.message());
            List<byte[]> back = readPackets(r);
            assertEquals(packets.size() - lostPackets, back.size());
            assertArrayEquals(packets.get(packets.size() - 1), back.get(back.size() - 1), "the last chunk is read");
            assertTrue(r.healthLines().get(0).contains("offset " + bad.offset()));
        }
        assertFalse(Files.exists(ArchiveIndex.pathFor(file)), "no index is written over damage, so it is seen again");
    }

    @Test
    void aDamagedChunkHeaderIsSkippedToTheNextValidHeader() throws IOException {
        ChunkInfo bad;
        ChunkInfo after;
        try (ArchiveReader r = ArchiveReader.open(file)) {
            bad = r.chunks().get(10);
            after = r.chunks().get(11);
        }
        flipByte(bad.offset() + 9); // the payload length: the header CRC no longer matches
        Files.delete(ArchiveIndex.pathFor(file));
        try (ArchiveReader r = ArchiveReader.open(file)) {
            assertEquals(1, r.damage().size());
            Damage d = r.damage().get(0);
            assertEquals(bad.offset(), d.offset());
            assertEquals(after.offset() - bad.offset(), d.bytes());
            assertTrue(d.message().startsWith("offset " + bad.offset() + ":"), d.message());
            assertEquals(after, r.chunks().get(10));
        }
    }

    @Test
    void damageFoundWhileReadingThroughAnIndexIsReportedAndSkipped() throws IOException {
        ChunkInfo bad;
        try (ArchiveReader r = ArchiveReader.open(file)) {
            bad = r.chunks().get(3);
        }
        int lost = packetsIn(bad);
        flipByte(bad.end() - 1);
        try (ArchiveReader r = ArchiveReader.open(file)) {
            assertFalse(r.indexRebuilt());
            assertEquals(packets.size() - lost, readPackets(r).size());
            assertEquals(1, r.damage().size());
            assertTrue(r.damage().get(0).message().contains("chunk " + bad.number() + " at offset " + bad.offset()));
        }
    }

    @Test
    void aTornLastChunkIsCutAndSaysHowMuchAndWhatSpan() throws IOException {
        ChunkInfo last;
        try (ArchiveReader r = ArchiveReader.open(file)) {
            last = r.chunks().get(r.chunks().size() - 1);
        }
        int lastPackets = packetsIn(last);
        long keep = last.offset() + ArchiveFormat.CHUNK_HEADER_BYTES + 10;
        try (RandomAccessFile raf = new RandomAccessFile(file.toFile(), "rw")) {
            raf.setLength(keep);
        }
        try (ArchiveReader r = ArchiveReader.open(file)) {
            CutTail c = r.cutTail();
            assertNotNull(c);
            assertEquals(last.offset(), c.offset());
            assertEquals(ArchiveFormat.CHUNK_HEADER_BYTES + 10, c.bytes());
            assertTrue(c.spanKnown());
            assertEquals(last.records(), c.records());
            assertEquals(last.firstTimeNs(), c.firstTimeNs());
            assertEquals(last.lastTimeNs(), c.lastTimeNs());
            assertTrue(r.damage().isEmpty());
            assertEquals(packets.size() - lastPackets, readPackets(r).size());
            assertTrue(r.healthLines().get(0).contains(c.bytes() + " bytes cut at offset " + c.offset()));
        }
        try (RandomAccessFile raf = new RandomAccessFile(file.toFile(), "rw")) {
            raf.setLength(last.offset() + 20);
        }
        try (ArchiveReader r = ArchiveReader.open(file)) {
            assertEquals(20, r.cutTail().bytes());
            assertFalse(r.cutTail().spanKnown());
        }
    }

    @Test
    void readingFromATimeStartsAtTheFirstRecordAtOrAfterIt() {
        long from = W1Feed.frameTimeNs(1234) + 1;
        int expected = 0;
        while (times.get(expected) < from) {
            expected++;
        }
        int first = expected;
        try (ArchiveReader r = ArchiveReader.open(file)) {
            List<byte[]> got = new ArrayList<>();
            r.readFrom(from, v -> {
                if (v.isPacket()) {
                    got.add(v.bodyBytes());
                }
                return true;
            });
            assertEquals(packets.size() - first, got.size());
            assertArrayEquals(packets.get(first), got.get(0));
        }
    }

    @Test
    void aFileThatIsNotAnArchiveIsRefusedInOneLine() throws IOException {
        Path other = dir.resolve("x.pcsa");
        Files.writeString(other, "time,alt\n0,100\n");
        var e = assertThrows(org.pointcall.shared.error.PointcallException.class, () -> ArchiveReader.open(other));
        assertEquals(other + ":0: not a pointcall sortie archive (no 'PCSA' header)", e.getMessage());
    }

    private void flipByte(long at) throws IOException {
        try (RandomAccessFile raf = new RandomAccessFile(file.toFile(), "rw")) {
            raf.seek(at);
            int b = raf.read();
            raf.seek(at);
            raf.write(b ^ 0x5a);
        }
    }
}
