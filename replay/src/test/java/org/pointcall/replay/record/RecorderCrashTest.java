package org.pointcall.replay.record;

import static org.junit.jupiter.api.Assertions.*;

import java.io.BufferedReader;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.pointcall.replay.archive.ArchiveIndex;
import org.pointcall.replay.archive.ArchiveReader;

class RecorderCrashTest {
    @TempDir
    Path dir;

    @Test
    void aRecordingKilledHardOpensWithEverythingWrittenBeforeTheKill() throws Exception {
        Path file = dir.resolve("crash.pcsa");
        Process child = ChildJvm.start(RecordingChild.class, file.toString());
        long lastWritten = -1;
        List<String> seen = new ArrayList<>();
        try (BufferedReader out = new BufferedReader(new InputStreamReader(child.getInputStream(),
                StandardCharsets.UTF_8))) {
            String line;
            while ((line = out.readLine()) != null) {
                seen.add(line);
                if (line.startsWith("written ")) {
                    lastWritten = Long.parseLong(line.substring(8));
                    if (lastWritten >= 1500) {
                        break;
                    }
                }
            }
            assertTrue(lastWritten >= 1500, "child stopped early: " + seen);
            child.destroyForcibly(); // SIGKILL: no shutdown hook, no close, no index
            assertTrue(child.waitFor(30, TimeUnit.SECONDS));
        } finally {
            child.destroyForcibly();
        }
        assertEquals(137, child.exitValue(), "killed by SIGKILL (128 + 9)");
        assertFalse(Files.exists(ArchiveIndex.pathFor(file)), "the index is only written on close");

        List<byte[]> expected = new ArrayList<>();
        W1Feed feed = new W1Feed(3, p -> {
            byte[] b = new byte[p.remaining()];
            p.get(p.position(), b);
            expected.add(b);
        });
        List<byte[]> got = new ArrayList<>();
        try (ArchiveReader r = ArchiveReader.open(file)) {
            assertTrue(r.indexRebuilt());
            assertTrue(r.damage().isEmpty(), r.damage().toString());
            r.read(v -> {
                if (v.isPacket()) {
                    got.add(v.bodyBytes());
                }
                return true;
            });
            // the child printed the count after the chunk was written: all of those are there, maybe more
            assertTrue(got.size() >= lastWritten, got.size() + " packets back, " + lastWritten + " reported written");
            if (r.cutTail() != null) {
                assertTrue(r.healthLines().get(r.healthLines().size() - 1).contains("bytes cut at offset"));
            }
        }
        while (expected.size() < got.size()) {
            feed.step();
        }
        for (int i = 0; i < got.size(); i++) {
            assertArrayEquals(expected.get(i), got.get(i), "packet " + i);
        }
    }
}
