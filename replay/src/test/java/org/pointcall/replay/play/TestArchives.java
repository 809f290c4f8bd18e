package org.pointcall.replay.play;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import org.pointcall.replay.archive.ArchiveReader;
import org.pointcall.replay.archive.ArchiveWriter;
import org.pointcall.replay.archive.ChunkBuilder;
import org.pointcall.replay.record.W1Feed;

/** Archives of the W1 feed with chosen arrival times, written through the real writer. */
final class TestArchives {
    final List<byte[]> packets = new ArrayList<>();
    final List<Long> times = new ArrayList<>();

    /** {@code frames} W1 frames; packet i arrives at frame time plus an uneven jitter, so gaps are irregular. */
    static TestArchives w1(Path file, int frames, long eventAtFrame) throws IOException {
        TestArchives a = new TestArchives();
        W1Feed feed = new W1Feed(5, p -> {
            byte[] b = new byte[p.remaining()];
            p.get(p.position(), b);
            a.packets.add(b);
        });
        ChunkBuilder cb = new ChunkBuilder(32 << 10);
        int[] number = {0};
        try (ArchiveWriter w = ArchiveWriter.create(file, 0L, 0L)) {
            for (int k = 0; k < frames; k++) {
                int before = a.packets.size();
                feed.step();
                for (int i = before; i < a.packets.size(); i++) {
                    long t = 1_000_000_000L + W1Feed.frameTimeNs(k) + (i * 7919L) % 300_000L;
                    a.times.add(t);
                    if (!cb.fits(0, a.packets.get(i).length) || cb.full()) {
                        w.write(cb.seal(number[0]++));
                    }
                    cb.addPacket(ByteBuffer.wrap(a.packets.get(i)), t, 0L);
                }
                if (k == eventAtFrame) {
                    cb.addTyped(ChunkBuilder.tagBytes("event"), "{\"point\":\"3\"}".getBytes(StandardCharsets.UTF_8),
                            a.times.get(a.times.size() - 1) + 1, k);
                }
            }
            w.write(cb.seal(number[0]));
        }
        return a;
    }

    /** Packets of an archive in file order. */
    static List<byte[]> packetsOf(Path file) {
        List<byte[]> out = new ArrayList<>();
        try (ArchiveReader r = ArchiveReader.open(file)) {
            r.read(v -> {
                if (v.isPacket()) {
                    out.add(v.bodyBytes());
                }
                return true;
            });
        }
        return out;
    }

    static List<Long> timesOf(Path file) {
        List<Long> out = new ArrayList<>();
        try (ArchiveReader r = ArchiveReader.open(file)) {
            r.read(v -> {
                if (v.isPacket()) {
                    out.add(v.timeNs());
                }
                return true;
            });
        }
        return out;
    }
}
