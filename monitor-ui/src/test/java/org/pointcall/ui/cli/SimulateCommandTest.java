package org.pointcall.ui.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.atomic.AtomicLong;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.pointcall.ingest.file.RecordedFiles;
import org.pointcall.ingest.file.ReadReport;
import org.pointcall.ingest.file.RecordedFileSource;
import org.pointcall.ingest.sim.truth.SortieTruth;
import org.pointcall.ingest.udp.UdpSource;
import org.pointcall.ingest.udp.UdpSourceConfig;
import org.pointcall.ingest.wire.DictionaryRegistry;
import org.pointcall.ingest.wire.PacketDecoder;
import org.pointcall.shared.demo.DemoFiles;
import org.pointcall.shared.dictionary.DictionaryFiles;

class SimulateCommandTest {
    private static final String CARD = String.join("\n",
            "sortie: T-1",
            "airframe: veskarn-02",
            "points:",
            "  - id: PD-1",
            "    kind: pitch-doublet",
            "    title: Pitch doublet",
            "    bands:",
            "      - {parameter: KCAS, phase: entry, target: 250, tol: 10, unit: kt}",
            "      - {parameter: Hp, phase: entry, target: 15000, tol: 1000, unit: ft}",
            "");

    private static Path card(Path dir) throws Exception {
        Path c = dir.resolve("card.yaml");
        Files.writeString(c, CARD, StandardCharsets.UTF_8);
        return c;
    }

    @Test
    void aSortieIsWrittenWithItsTruthAndTheSameSeedGivesTheSameBytes(@TempDir Path dir) throws Exception {
        Path c = card(dir);
        CommandRun a = CommandRun.of("simulate", "--card", c.toString(), "--seed", "5", "--out", dir.resolve("a").toString());
        assertEquals(0, a.exitCode(), a.err());
        CommandRun b = CommandRun.of("simulate", "--card", c.toString(), "--seed", "5", "--out", dir.resolve("b").toString());
        assertEquals(0, b.exitCode(), b.err());
        assertArrayEquals(Files.readAllBytes(dir.resolve("a/sortie.csv")), Files.readAllBytes(dir.resolve("b/sortie.csv")));
        assertArrayEquals(Files.readAllBytes(dir.resolve("a/truth.json")), Files.readAllBytes(dir.resolve("b/truth.json")));
        SortieTruth t = SortieTruth.read(dir.resolve("a/truth.json"));
        assertEquals(1, t.points().size());
        assertEquals("pitch-doublet", t.points().get(0).kind());
        try (RecordedFileSource src = RecordedFiles.open(dir.resolve("a/sortie.csv"),
                DictionaryFiles.load(dir.resolve("a/dictionary.yaml")))) {
            ReadReport r = src.readAll(f -> { });
            assertEquals(0, r.rowsSkipped(), "the simulator's own file reads back without a skipped row");
            assertEquals(t.wildPoints(), r.wildPoints(), "every wild point injected is caught by the reader");
            long expectedFrames = Math.round(t.durationS() * t.frameRateHz()) - t.framesDropped();
            assertEquals(expectedFrames, r.framesDelivered(), 2);
        }
        CommandRun c2 = CommandRun.of("simulate", "--card", c.toString(), "--seed", "6", "--out", dir.resolve("c").toString());
        assertEquals(0, c2.exitCode(), c2.err());
        assertTrue(!java.util.Arrays.equals(Files.readAllBytes(dir.resolve("a/sortie.csv")),
                Files.readAllBytes(dir.resolve("c/sortie.csv"))), "another seed, another sortie");
    }

    @Test
    void streamsLiveOverUdpInTheWireFormat(@TempDir Path dir) throws Exception {
        AtomicLong frames = new AtomicLong();
        PacketDecoder dec = new PacketDecoder(new DictionaryRegistry(), DictionaryFiles::parse,
                (id, f, t) -> frames.incrementAndGet());
        try (UdpSource udp = new UdpSource(UdpSourceConfig.loopback(0), dec, System::nanoTime)) {
            udp.start();
            CommandRun r = CommandRun.of("simulate", "--card", card(dir).toString(), "--seed", "5", "--clean",
                    "--to", "udp://127.0.0.1:" + udp.localPort(), "--speed", "200", "--out", dir.resolve("s").toString());
            assertEquals(0, r.exitCode(), r.err());
            Thread.sleep(300);
            udp.stop();
            long rows = Files.readAllLines(dir.resolve("s/sortie.csv")).size() - 1;
            assertEquals(rows, frames.get(), "every frame written is streamed");
            assertEquals(DemoFiles.dictionary().hash(), dec.dictionary(1).hash());
        }
    }

    @Test
    void listsTheAirframesAndRefusesABadTarget() {
        CommandRun l = CommandRun.of("simulate", "--list-airframes");
        assertEquals(0, l.exitCode());
        assertEquals(3, l.out().lines().count(), l.out());
        assertTrue(l.out().contains("veskarn-02"));
        CommandRun bad = CommandRun.of("simulate", "--to", "tcp://x:1");
        assertEquals(2, bad.exitCode());
        assertEquals("pointcall simulate: --to must look like udp://HOST:PORT, got 'tcp://x:1'", bad.err().strip());
    }
}
