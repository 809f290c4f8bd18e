package org.pointcall.replay.play;

import static org.junit.jupiter.api.Assertions.*;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.pointcall.ingest.file.ReadOptions;
import org.pointcall.ingest.frame.Frame;
import org.pointcall.ingest.wire.DecoderOptions;
import org.pointcall.ingest.wire.DictionaryRegistry;
import org.pointcall.ingest.wire.FaultLog;
import org.pointcall.ingest.wire.PacketDecoder;
import org.pointcall.ingest.wire.WireOptions;
import org.pointcall.shared.dictionary.DictionaryFiles;
import org.pointcall.shared.dictionary.Parameter;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.units.Unit;

class FileSourceTest {
    @TempDir
    Path dir;

    private final ParameterDictionary dict = new ParameterDictionary("two", List.of(
            new Parameter("A", Unit.NONE, "first", 10, -1e6, 1e6, null, null, null),
            new Parameter("B", Unit.NONE, "second", 10, -1e6, 1e6, null, null, null)));

    private Path csv() throws Exception {
        StringBuilder sb = new StringBuilder("time,A,B\n");
        for (int i = 0; i < 50; i++) {
            sb.append(i / 10.0).append(',').append(i).append(',').append(-0.5 * i).append('\n');
        }
        Path f = dir.resolve("two.csv");
        Files.writeString(f, sb);
        return f;
    }

    @Test
    void aCsvFilePlaysAsAWireStreamOnItsFrameTimesAndDecodesBackToItsRows() throws Exception {
        FileSource src = new FileSource(csv(), dict, ReadOptions.DEFAULTS, 4, WireOptions.DEFAULT
                .withMaxFramesPerPacket(1));
        List<Frame> frames = new ArrayList<>();
        List<Long> frameClock = new ArrayList<>();
        ManualClock clock = new ManualClock(0);
        PacketDecoder decoder = new PacketDecoder(new DictionaryRegistry(), DictionaryFiles::parse, (id, f, t) -> {
            assertEquals(4, id);
            assertTrue(f.hasFlag(Frame.SYNTHETIC));
            frames.add(f.copy());
            frameClock.add(clock.nowNs());
        }, DecoderOptions.DEFAULT, new FaultLog(l -> fail(l), 10, 1_000_000_000L));
        ReplayControl control = new ReplayControl(2, false);
        ReplaySummary s = new Replayer(src, ReplayTargets.decoder(decoder, "test"), clock, control).run();
        assertEquals(50, frames.size());
        for (int i = 0; i < 50; i++) {
            assertEquals(i * 100_000_000L, frames.get(i).timeNs());
            assertEquals(i, frames.get(i).value(0));
            assertEquals(-0.5 * i, frames.get(i).value(1));
            assertEquals(frames.get(i).timeNs() / 2, frameClock.get(i) - frameClock.get(0), "paced at 2x");
        }
        assertEquals(50, src.lastReport().framesDelivered());
        assertEquals(4.9e9, s.dataSpanNs(), 0);
    }

    @Test
    void seekingInAFileOpensItAgainAndStartsAtTheTimeAsked() throws Exception {
        FileSource src = new FileSource(csv(), dict, ReadOptions.DEFAULTS, 4, WireOptions.DEFAULT
                .withMaxFramesPerPacket(1));
        List<Long> times = new ArrayList<>();
        PacketDecoder decoder = new PacketDecoder(new DictionaryRegistry(), DictionaryFiles::parse,
                (id, f, t) -> times.add(f.timeNs()), DecoderOptions.DEFAULT, new FaultLog(l -> { }, 10, 1L));
        ReplayControl control = new ReplayControl(ReplayControl.MAX_SPEED, false);
        control.seek(3_000_000_000L);
        new Replayer(src, ReplayTargets.decoder(decoder, "test"), new ManualClock(0), control).run();
        assertEquals(20, times.size());
        assertEquals(3_000_000_000L, times.get(0));
    }
}
