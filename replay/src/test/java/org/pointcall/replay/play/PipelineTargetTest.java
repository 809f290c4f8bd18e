package org.pointcall.replay.play;

import static org.junit.jupiter.api.Assertions.*;

import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.atomic.AtomicLong;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.pointcall.ingest.pipeline.PacketPipeline;
import org.pointcall.ingest.pipeline.StreamStage;
import org.pointcall.ingest.pipeline.StreamStages;
import org.pointcall.ingest.window.W1Workload;
import org.pointcall.ingest.wire.DecoderOptions;
import org.pointcall.ingest.wire.DictionaryRegistry;
import org.pointcall.ingest.wire.FaultLog;
import org.pointcall.replay.archive.ArchiveReader;
import org.pointcall.shared.dictionary.DictionaryFiles;

class PipelineTargetTest {
    @TempDir
    Path dir;

    @Test
    void atMaxSpeedIntoARunningPipelineWithASmallQueueNothingIsDropped() throws Exception {
        Path a = dir.resolve("a.pcsa");
        TestArchives.w1(a, 2000, -1);
        AtomicLong ticks = new AtomicLong();
        StreamStages stages = new StreamStages((id, d) -> new StreamStage(id, d, W1Workload.specs(),
                W1Workload.settings(), List.of(), (t, f, v, c) -> ticks.incrementAndGet(), null, System::nanoTime));
        PacketPipeline pipeline = new PacketPipeline("replay-test", new DictionaryRegistry(), DictionaryFiles::parse,
                stages, DecoderOptions.DEFAULT, 16, new FaultLog(l -> { }, 10, 1_000_000_000L), System::nanoTime);
        pipeline.start();
        try (ArchiveReader r = ArchiveReader.open(a)) {
            new Replayer(new ArchiveSource(r), ReplayTargets.pipeline(pipeline), ReplayClock.SYSTEM,
                    new ReplayControl(ReplayControl.MAX_SPEED, false)).run();
        }
        pipeline.onStop();
        pipeline.close();
        assertEquals(0, pipeline.droppedQueueFull());
        assertEquals(2000, pipeline.decoder().counters().framesDelivered());
        assertEquals(0, pipeline.decoder().counters().faults());
        assertEquals(2000, stages.stages()[0].frames());
        assertTrue(ticks.get() >= 39, "features at 20 Hz over 2 s: " + ticks.get());
    }
}
