package org.pointcall.ui.cli;

import static org.junit.jupiter.api.Assertions.*;

import java.net.DatagramSocket;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.pointcall.ingest.udp.UdpSender;
import org.pointcall.ingest.udp.UdpSenderConfig;
import org.pointcall.ingest.udp.UdpSource;
import org.pointcall.ingest.udp.UdpSourceConfig;
import org.pointcall.ingest.wire.FaultLog;
import org.pointcall.replay.archive.ArchiveReader;
import org.pointcall.replay.record.Recorder;
import org.pointcall.replay.record.RecorderPolicy;
import org.pointcall.replay.record.W1Feed;

class RecordReplayCommandTest {
    @TempDir
    Path dir;

    private static int freePort() throws Exception {
        try (DatagramSocket s = new DatagramSocket(0, java.net.InetAddress.getLoopbackAddress())) {
            return s.getLocalPort();
        }
    }

    private static List<byte[]> packetsOf(Path file) {
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

    private Path onlyArchive(Path folder) throws Exception {
        try (Stream<Path> s = Files.list(folder)) {
            List<Path> l = s.filter(p -> p.toString().endsWith(".pcsa")).toList();
            return l.size() == 1 ? l.get(0) : null;
        }
    }

    @Test
    void aLiveStreamIsRecordedInspectedAndReplayedBitForBit() throws Exception {
        int port = freePort();
        Path out = dir.resolve("rec");
        CompletableFuture<CommandRun> recording = CompletableFuture.supplyAsync(() -> CommandRun.of("record",
                "--listen", "udp://127.0.0.1:" + port, "--out", out.toString(), "--until-idle", "1"));
        long end = System.nanoTime() + 20_000_000_000L;
        while ((!Files.isDirectory(out) || onlyArchive(out) == null) && System.nanoTime() < end) {
            Thread.sleep(20);
        }
        Thread.sleep(300);
        List<byte[]> sent = new ArrayList<>();
        try (UdpSender tx = new UdpSender(UdpSenderConfig.loopback(port))) {
            W1Feed feed = new W1Feed(9, p -> {
                byte[] b = new byte[p.remaining()];
                p.get(p.position(), b);
                sent.add(b);
                tx.onPacket(p);
            });
            for (int k = 0; k < 500; k++) {
                feed.step();
            }
        }
        CommandRun rec = recording.get(60, TimeUnit.SECONDS);
        assertEquals(0, rec.exitCode(), rec.out() + rec.err());
        assertTrue(rec.out().contains("packets: " + sent.size() + " recorded, 0 not recorded"), rec.out());
        Path archive = onlyArchive(out);
        List<byte[]> kept = packetsOf(archive);
        assertEquals(sent.size(), kept.size());
        for (int i = 0; i < sent.size(); i++) {
            assertArrayEquals(sent.get(i), kept.get(i));
        }

        CommandRun inspect = CommandRun.of("inspect", "--input", archive.toString());
        assertEquals(0, inspect.exitCode(), inspect.out() + inspect.err());
        assertTrue(inspect.out().contains("packets: " + sent.size()), inspect.out());
        assertTrue(inspect.out().contains("stream 9: " + sent.size() + " packets"), inspect.out());
        assertTrue(inspect.out().contains("decoded: 500 frames (0 partial), 1 dictionaries learnt, 0 bad packets, 0 "
                + "packets lost"), inspect.out());

        Path again = dir.resolve("again.pcsa");
        Recorder second = Recorder.start(again, RecorderPolicy.DEFAULT, System::nanoTime, a -> { });
        UdpSource rx = new UdpSource(UdpSourceConfig.loopback(0), second, new FaultLog(l -> { }, 1, 1_000_000_000L),
                System::nanoTime);
        rx.start();
        CommandRun replay = CommandRun.of("replay", "--input", archive.toString(), "--speed", "20",
                "--to", "udp://127.0.0.1:" + rx.localPort());
        assertEquals(0, replay.exitCode(), replay.out() + replay.err());
        assertTrue(replay.out().contains("replayed: " + sent.size() + " packets"), replay.out());
        long stop = System.nanoTime() + 5_000_000_000L;
        while (rx.datagrams() < sent.size() && System.nanoTime() < stop) {
            Thread.sleep(10);
        }
        rx.stop();
        second.close();
        List<byte[]> replayed = packetsOf(again);
        assertEquals(sent.size(), replayed.size());
        for (int i = 0; i < sent.size(); i++) {
            assertArrayEquals(sent.get(i), replayed.get(i));
        }
    }

    @Test
    void badInputIsOneLineAndExitCodeTwo() throws Exception {
        Path notThere = dir.resolve("nothing.pcsa");
        Path text = dir.resolve("text.pcsa");
        Files.writeString(text, "not an archive");
        String[][] cases = {
            {"replay", "--input", notThere.toString(), "--to", "udp://127.0.0.1:5999"},
            {"replay", "--input", text.toString(), "--to", "udp://127.0.0.1:5999"},
            {"replay", "--input", text.toString(), "--to", "udp://127.0.0.1:5999", "--speed", "500"},
            {"replay", "--input", text.toString(), "--to", "tcp://127.0.0.1:5999"},
            {"replay", "--input", text.toString(), "--to", "kafka://127.0.0.1:9092"},
            {"record", "--listen", "udp://127.0.0.1:99999", "--out", dir.toString()},
            {"inspect", "--input", text.toString()},
        };
        String[] expected = {
            notThere + ": no such archive",
            text + ":0: not a pointcall sortie archive",
            "speed 500.0 is outside 0.1 to 100 times real time (or max)",
            "a destination is udp://HOST:PORT or kafka://BOOTSTRAP/PREFIX",
            "give kafka://BOOTSTRAP/PREFIX",
            "port must be 1 to 65535",
            text + ":0: not a pointcall sortie archive",
        };
        for (int i = 0; i < cases.length; i++) {
            CommandRun r = CommandRun.of(cases[i]);
            assertEquals(2, r.exitCode(), String.join(" ", cases[i]) + "\n" + r.out() + r.err());
            assertEquals(1, r.err().strip().lines().count(), r.err());
            assertTrue(r.err().contains(expected[i]), r.err());
            assertFalse(r.err().contains("Exception"), r.err());
        }
    }
}
