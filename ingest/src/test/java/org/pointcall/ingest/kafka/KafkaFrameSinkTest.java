package org.pointcall.ingest.kafka;

import java.util.Map;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.ExtendWith;

import static org.junit.jupiter.api.Assertions.assertEquals;

@ExtendWith(LocalKafkaBroker.Shared.class)
class KafkaFrameSinkTest {

    @Test
    void aPacketTheBrokerCannotTakeIsCountedByKindAndTheOthersAreDelivered(LocalKafkaBroker broker)
            throws Exception {
        KafkaSettings settings = broker.settings("toolarge").withGroupId("toolarge-check");
        KafkaTopics.ensure(settings, 1, (short) 1);
        KafkaFrameSink.SinkCounters c;
        Map<String, Long> kinds;
        try (KafkaFrameSink sink = new KafkaFrameSink(settings)) {
            sink.send(5, NumberedPackets.make(5, 0, 100));
            // over the producer's max.request.size (Kafka default 1 MiB)
            sink.send(5, NumberedPackets.make(5, 1, 2 * 1024 * 1024));
            sink.send(5, NumberedPackets.make(5, 1, 100));
            sink.send(5, NumberedPackets.make(5, 2, 100));
            sink.flush();
            c = sink.counters();
            kinds = sink.failuresByKind();
        }
        assertEquals(new KafkaFrameSink.SinkCounters(4, 3, 1, 300), c);
        assertEquals(0, c.pending());
        assertEquals(Map.of("RecordTooLargeException", 1L), kinds);

        NumberedPackets check = new NumberedPackets(6, 1);
        try (KafkaFrameSource source = new KafkaFrameSource(settings, KafkaFrameSource.StartPosition.EARLIEST,
                check)) {
            source.start();
            Await.until(() -> source.counters().records() >= 3, 60_000, () -> source.counters().toString());
            source.stop();
        }
        assertEquals(0, check.faultCount(), check::faultReport);
        assertEquals(3, check.nextDue()[5]);
    }

    @Test
    void recordTimeIsTheOneGiven(LocalKafkaBroker broker) throws Exception {
        KafkaSettings settings = broker.settings("rectime").withGroupId("rectime-check");
        KafkaTopics.ensure(settings, 1, (short) 1);
        long t0 = 1_700_000_000_123L;
        try (KafkaFrameSink sink = new KafkaFrameSink(settings)) {
            sink.send(9, t0, NumberedPackets.make(9, 0, 32));
            sink.flush();
        }
        long[] seen = {-1, -1};
        try (KafkaFrameSource source = new KafkaFrameSource(settings, KafkaFrameSource.StartPosition.EARLIEST,
                (id, packet, t, partition, offset) -> {
                    seen[0] = id;
                    seen[1] = t;
                })) {
            source.start();
            Await.until(() -> source.counters().records() >= 1, 60_000, () -> source.counters().toString());
            source.stop();
        }
        assertEquals(9, seen[0]);
        assertEquals(t0, seen[1]);
    }
}
