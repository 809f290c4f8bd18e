package org.pointcall.replay.record;

import static org.junit.jupiter.api.Assertions.*;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.pointcall.replay.archive.ArchiveReader;
import org.pointcall.replay.archive.TypedRecord;

/**
 * A real full disk: a 4 MiB tmpfs mounted in a private mount namespace of a child process ({@code unshare}, as an
 * unprivileged user mapped to root), so it exists only for that child and vanishes with it. Skipped where no such
 * namespace can be made.
 */
class DiskFullTest {
    @TempDir
    Path dir;

    private static boolean namespacesWork() {
        try {
            Process p = new ProcessBuilder("unshare", "-rm", "true").redirectErrorStream(true).start();
            return p.waitFor(10, TimeUnit.SECONDS) && p.exitValue() == 0;
        } catch (Exception e) {
            return false;
        }
    }

    @Test
    void aFullDiskRaisesAnAlarmKeepsTheNewestDataAndWritesItWhenThereIsRoomAgain() throws Exception {
        Assumptions.assumeTrue(namespacesWork(), "no mount namespace can be made here (unshare -rm failed)");
        Path small = Files.createDirectory(dir.resolve("small"));
        Path copy = dir.resolve("copy.pcsa");
        ProcessBuilder child = ChildJvm.java(DiskFullChild.class, small.toString(), copy.toString(),
                String.valueOf(3L << 20));
        List<String> cmd = new ArrayList<>(List.of("unshare", "-rm", "--", "sh", "-c",
                "mount -t tmpfs -o size=4m tmpfs \"$1\" && shift && exec \"$@\"", "sh", small.toString()));
        cmd.addAll(child.command());
        Process p = new ProcessBuilder(cmd).redirectErrorStream(true).start();
        String out;
        try {
            out = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
            assertTrue(p.waitFor(60, TimeUnit.SECONDS));
        } finally {
            p.destroyForcibly();
        }
        System.out.println(out);
        assertEquals(0, p.exitValue(), out);
        assertTrue(out.contains("WRITE_FAILED: RECORDING AT RISK: cannot write " + small.resolve("rec.pcsa")
                + ": No space left on device"), out);
        assertTrue(out.contains("MEMORY_FULL: recorder memory for"), out);
        assertTrue(out.contains("WRITING_AGAIN: writing"), out);
        Matcher m = Pattern.compile("fed (\\d+) written (\\d+) lost (\\d+) failures (\\d+)").matcher(out);
        assertTrue(m.find(), out);
        long fed = Long.parseLong(m.group(1));
        long written = Long.parseLong(m.group(2));
        long lost = Long.parseLong(m.group(3));
        assertTrue(lost > 0, "memory was full, so the oldest held data went: " + out);
        assertEquals(fed, written + lost, out);

        List<byte[]> expected = new ArrayList<>();
        W1Feed feed = new W1Feed(2, b -> {
            byte[] x = new byte[b.remaining()];
            b.get(b.position(), x);
            expected.add(x);
        });
        while (expected.size() < fed) {
            feed.step();
        }
        List<byte[]> got = new ArrayList<>();
        List<TypedRecord> loss;
        try (ArchiveReader r = ArchiveReader.open(copy)) {
            assertTrue(r.damage().isEmpty(), r.damage().toString());
            assertNull(r.cutTail());
            r.read(v -> {
                if (v.isPacket()) {
                    got.add(v.bodyBytes());
                }
                return true;
            });
            loss = r.typedRecords(Recorder.LOSS_RECORD);
            assertTrue(r.chunkNumbersMissing() > 0);
        }
        assertEquals(written, got.size());
        // what is missing is one stretch: the oldest chunks held when memory ran out; before it everything written
        // before the disk filled, after it the newest data, held in memory and written once there was room
        int a = 0;
        while (a < got.size() && java.util.Arrays.equals(got.get(a), expected.get(a))) {
            a++;
        }
        assertTrue(a > 0 && a < got.size(), "a gap inside the recording, at " + a);
        for (int i = a; i < got.size(); i++) {
            assertArrayEquals(expected.get((int) (i + lost)), got.get(i), "packet " + i + " after the gap");
        }
        assertEquals(1, loss.size());
        assertTrue(loss.get(0).jsonText().contains("\"packetsLost\":" + lost), loss.get(0).jsonText());
    }
}
