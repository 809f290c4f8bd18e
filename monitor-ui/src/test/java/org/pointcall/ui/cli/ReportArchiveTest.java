package org.pointcall.ui.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.ByteBuffer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.pointcall.ingest.frame.Frame;
import org.pointcall.ingest.frame.FrameSink;
import org.pointcall.ingest.sim.SortieSimulator;
import org.pointcall.ingest.sim.airframe.Airframes;
import org.pointcall.ingest.sim.pilot.PilotSettings;
import org.pointcall.ingest.sim.sensor.SensorSettings;
import org.pointcall.ingest.wire.StreamEncoder;
import org.pointcall.ingest.wire.WireOptions;
import org.pointcall.replay.archive.ArchiveWriter;
import org.pointcall.replay.archive.ChunkBuilder;
import org.pointcall.shared.card.CardFiles;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.demo.DemoFiles;
import org.pointcall.shared.dictionary.DictionaryFiles;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.outcome.OperatorCall;
import org.pointcall.shared.outcome.PointsFile;
import org.pointcall.shared.outcome.PointsFiles;
import org.pointcall.shared.outcome.SessionEvent;
import org.pointcall.shared.outcome.Verdict;

/**
 * report on a sortie archive: a simulated stall encoded in the wire format, every packet written through the real
 * archive writer, and the engineer's call recorded beside them as a session event. The report must judge the
 * stall and carry the engineer's call over the tool's.
 */
class ReportArchiveTest {
    private static final String CARD = String.join("\n",
            "sortie: AR-2",
            "airframe: veskarn-02",
            "points:",
            "  - id: SL-1",
            "    kind: stall-level",
            "    title: Wings-level stall",
            "    bands:",
            "      - {parameter: Hp, phase: entry, target: 10000, tol: 500, unit: ft}",
            "      - {metric: stall-kcas, phase: result, min: 106, max: 120, unit: kt}",
            // flown after the stall, so that the stall has ended well before the data does
            "  - id: LP-1",
            "    kind: loop",
            "    title: Loop from 320 KCAS, 4 g pull",
            "    bands:",
            "      - {parameter: KCAS, phase: entry, target: 320, tol: 10, unit: kt}",
            "");

    @TempDir
    Path dir;

    @Test
    void anArchiveIsAnalysedAndTheRecordedCallStands() throws Exception {
        ParameterDictionary dict = DemoFiles.dictionary();
        TestCard card = CardFiles.parse(CARD, "card.yaml", dict);
        Path cardFile = dir.resolve("card.yaml");
        Files.writeString(cardFile, CARD, StandardCharsets.UTF_8);
        Path archive = dir.resolve("sortie.pcsa");
        ChunkBuilder cb = new ChunkBuilder(64 << 10);
        int[] chunk = {0};
        long[] frameNs = {0};
        try (ArchiveWriter w = ArchiveWriter.create(archive, 0L, 0L)) {
            StreamEncoder enc = new StreamEncoder(1, StreamEncoder.newEpoch(), dict, DictionaryFiles.toYaml(dict),
                    WireOptions.DEFAULT.withSynthetic(true), p -> add(w, cb, chunk, p, frameNs[0]));
            FrameSink tap = (Frame f) -> {
                frameNs[0] = f.timeNs();
                enc.onFrame(f);
            };
            new SortieSimulator(Airframes.load("veskarn-02"), card, dict, 7, 32, SensorSettings.DEFAULT,
                    PilotSettings.NO_FLAWS).run(List.of(tap));
            enc.flush();
            OperatorCall call = new OperatorCall("SL-1", Verdict.REPEAT, "buffet came early, fly it again",
                    frameNs[0]);
            byte[] json = PointsFiles.eventToJson(new SessionEvent.CallTaken(call, null))
                    .getBytes(StandardCharsets.UTF_8);
            cb.addTyped(ChunkBuilder.tagBytes("call"), json, frameNs[0] + 1, frameNs[0]);
            w.write(cb.seal(chunk[0]));
        }
        Path out = dir.resolve("report");
        CommandRun r = CommandRun.of("report", "--input", archive.toString(), "--card", cardFile.toString(), "--out",
                out.toString(), "--no-pdf");
        assertEquals(0, r.exitCode(), r.err());
        PointsFile f = PointsFiles.read(out.resolve("points.json"));
        var stall = f.points().stream().filter(p -> "SL-1".equals(p.cardId())).reduce((a, b) -> b).orElseThrow();
        assertEquals(Verdict.REPEAT, stall.finalCall(), r.out());
        assertEquals("buffet came early, fly it again", stall.operatorCall().note());
        String html = Files.readString(out.resolve("report.html"));
        assertTrue(html.contains("data-call=\"repeat\""), "the engineer's call is not in the point table");
        assertTrue(html.contains("buffet came early, fly it again"));
        assertTrue(html.contains("sortie.pcsa"));
        assertTrue(html.contains("data:image/png;base64,"), "no figure");
    }

    private static void add(ArchiveWriter w, ChunkBuilder cb, int[] chunk, ByteBuffer p, long timeNs) {
        try {
            if (!cb.fits(0, p.remaining()) || cb.full()) {
                w.write(cb.seal(chunk[0]++));
            }
            cb.addPacket(p, timeNs, 0L);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
