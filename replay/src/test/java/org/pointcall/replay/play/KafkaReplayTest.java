package org.pointcall.replay.play;

import static org.junit.jupiter.api.Assertions.*;

import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.CopyOnWriteArrayList;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.ExtendWith;
import org.junit.jupiter.api.io.TempDir;
import org.pointcall.ingest.kafka.KafkaFrameSink;
import org.pointcall.ingest.kafka.KafkaFrameSource;
import org.pointcall.ingest.kafka.KafkaSettings;
import org.pointcall.ingest.kafka.KafkaTopics;
import org.pointcall.ingest.kafka.LocalKafkaBroker;
import org.pointcall.replay.archive.ArchiveReader;

/** A replay to a real Kafka broker (KRaft, in this JVM, loopback): one record per packet, in order, unchanged. */
@ExtendWith(LocalKafkaBroker.Shared.class)
class KafkaReplayTest {
    @TempDir
    Path dir;

    @Test
    void anArchiveReplayedToKafkaArrivesPacketForPacketKeyedByStream(LocalKafkaBroker broker) throws Exception {
        Path a = dir.resolve("a.pcsa");
        TestArchives data = TestArchives.w1(a, 300, -1);
        KafkaSettings settings = broker.settings("replaytest").withGroupId("replaytest-check");
        KafkaTopics.ensure(settings, 1, (short) 1);
        try (ArchiveReader r = ArchiveReader.open(a)) {
            ReplayTarget kafka = ReplayTargets.kafka(new KafkaFrameSink(settings));
            ReplaySummary s = new Replayer(new ArchiveSource(r), kafka, ReplayClock.SYSTEM,
                    new ReplayControl(ReplayControl.MAX_SPEED, false)).run();
            kafka.close();
            assertEquals(data.packets.size(), s.packets());
        }
        List<byte[]> got = new CopyOnWriteArrayList<>();
        List<Integer> keys = new CopyOnWriteArrayList<>();
        try (KafkaFrameSource source = new KafkaFrameSource(settings, KafkaFrameSource.StartPosition.EARLIEST,
                (id, packet, t, partition, offset) -> {
                    byte[] b = new byte[packet.remaining()];
                    packet.get(packet.position(), b);
                    got.add(b);
                    keys.add(id);
                })) {
            source.start();
            long end = System.nanoTime() + 60_000_000_000L;
            while (got.size() < data.packets.size() && System.nanoTime() < end) {
                Thread.sleep(20);
            }
            source.stop();
        }
        assertEquals(data.packets.size(), got.size());
        for (int i = 0; i < got.size(); i++) {
            assertArrayEquals(data.packets.get(i), got.get(i), "record " + i);
            assertEquals(5, keys.get(i), "keyed by the packet's stream id");
        }
    }
}
