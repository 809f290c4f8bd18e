package org.pointcall.ingest.kafka;

import java.util.Map;
import java.util.concurrent.TimeUnit;
import java.util.stream.Collectors;

import org.apache.kafka.clients.admin.Admin;
import org.apache.kafka.clients.admin.OffsetSpec;
import org.apache.kafka.common.TopicPartition;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.ExtendWith;

import static org.junit.jupiter.api.Assertions.assertEquals;

@ExtendWith(LocalKafkaBroker.Shared.class)
class KafkaRoundTripTest {
    private static final int STREAMS = 8;
    private static final int PARTITIONS = 4;
    private static final long PER_STREAM = 125_000;
    private static final long TOTAL = STREAMS * PER_STREAM;

    @Test
    void millionFramesArriveOnceEachAndInOrderPerStream(LocalKafkaBroker broker) throws Exception {
        KafkaSettings settings = broker.settings("roundtrip").withGroupId("roundtrip-check");
        KafkaTopics.ensure(settings, PARTITIONS, (short) 1);
        NumberedPackets check = new NumberedPackets(STREAMS, PARTITIONS);
        long sentBytes = 0;
        KafkaFrameSink.SinkCounters sent;
        KafkaFrameSource.SourceCounters got;
        try (KafkaFrameSource source = new KafkaFrameSource(settings, KafkaFrameSource.StartPosition.EARLIEST,
                check)) {
            source.start();
            try (KafkaFrameSink sink = new KafkaFrameSink(settings)) {
                for (long seq = 0; seq < PER_STREAM; seq++) {
                    for (int s = 0; s < STREAMS; s++) {
                        int size = NumberedPackets.sizeOf(seq * STREAMS + s);
                        sentBytes += size;
                        sink.send(s, NumberedPackets.make(s, seq, size));
                    }
                }
                sink.flush();
                sent = sink.counters();
                assertEquals(Map.of(), sink.failuresByKind());
            }
            Await.until(() -> source.counters().records() >= TOTAL, 180_000, () -> source.counters().toString());
            source.stop();
            got = source.counters();
        }
        assertEquals(new KafkaFrameSink.SinkCounters(TOTAL, TOTAL, 0, sentBytes), sent);
        assertEquals(0, check.faultCount(), check::faultReport);
        for (int s = 0; s < STREAMS; s++) {
            assertEquals(PER_STREAM, check.nextDue()[s], "stream " + s);
        }
        assertEquals(new KafkaFrameSource.SourceCounters(TOTAL, sentBytes, 0, 0, 0), got);
        // the log itself holds each frame once: a duplicate written by the producer would show here
        assertEquals(TOTAL, logSize(broker, settings.framesTopic(), PARTITIONS));
    }

    static long logSize(LocalKafkaBroker broker, String topic, int partitions) throws Exception {
        try (Admin admin = broker.admin()) {
            return logSize(admin, topic, partitions);
        }
    }

    static long logSize(Admin admin, String topic, int partitions) throws Exception {
        Map<TopicPartition, OffsetSpec> ask = java.util.stream.IntStream.range(0, partitions).boxed()
                .collect(Collectors.toMap(p -> new TopicPartition(topic, p), p -> OffsetSpec.latest()));
        return admin.listOffsets(ask).all().get(30, TimeUnit.SECONDS).values().stream()
                .mapToLong(i -> i.offset()).sum();
    }
}
