package org.pointcall.ingest.kafka;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;

import org.apache.kafka.clients.producer.KafkaProducer;
import org.apache.kafka.clients.producer.ProducerRecord;
import org.apache.kafka.common.serialization.ByteArraySerializer;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.ExtendWith;
import org.pointcall.shared.error.PointcallException;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

@ExtendWith(LocalKafkaBroker.Shared.class)
class KafkaFrameSourceTest {

    @Test
    void recordsWithBadKeysOrNoPacketAreCountedAndSkippedAndTheRestDelivered(LocalKafkaBroker broker)
            throws Exception {
        KafkaSettings settings = broker.settings("badrecords").withGroupId("badrecords-check");
        KafkaTopics.ensure(settings, 1, (short) 1);
        // written with a plain producer: our sink cannot produce such records
        try (KafkaProducer<byte[], byte[]> raw = new KafkaProducer<>(settings.producerConfig(),
                new ByteArraySerializer(), new ByteArraySerializer())) {
            String t = settings.framesTopic();
            raw.send(new ProducerRecord<>(t, StreamKey.bytes(7), NumberedPackets.make(7, 0, 40)));
            raw.send(new ProducerRecord<>(t, new byte[] {0, 0, 7}, NumberedPackets.make(7, 99, 40)));
            raw.send(new ProducerRecord<>(t, StreamKey.bytes(7), NumberedPackets.make(7, 1, 40)));
            raw.send(new ProducerRecord<>(t, null, NumberedPackets.make(7, 99, 40)));
            raw.send(new ProducerRecord<>(t, StreamKey.bytes(7), null));
            raw.send(new ProducerRecord<>(t, new byte[] {0, 0, 0, 7, 0}, NumberedPackets.make(7, 99, 40)));
            raw.send(new ProducerRecord<>(t, StreamKey.bytes(7), NumberedPackets.make(7, 2, 40)));
            raw.flush();
        }
        NumberedPackets check = new NumberedPackets(8, 1);
        List<Long> offsets = new ArrayList<>();
        KafkaFrameSource.SourceCounters got;
        Map<String, Long> kinds;
        try (KafkaFrameSource source = new KafkaFrameSource(settings, KafkaFrameSource.StartPosition.EARLIEST,
                (id, packet, t, partition, offset) -> {
                    offsets.add(offset);
                    check.onPacket(id, packet, t, partition, offset);
                })) {
            source.start();
            Await.until(() -> source.counters().records() + source.counters().badRecords() >= 7, 60_000,
                    () -> source.counters().toString());
            source.stop();
            got = source.counters();
            kinds = source.badRecordsByKind();
        }
        assertEquals(List.of(0L, 2L, 6L), offsets);
        assertEquals(0, check.faultCount(), check::faultReport);
        assertEquals(3, check.nextDue()[7]);
        assertEquals(new KafkaFrameSource.SourceCounters(3, 120, 4, 0, 0), got);
        assertEquals(Map.of("key length", 3L, "no value", 1L), kinds);
    }

    @Test
    void aHandlerThatThrowsIsCountedAndTheSourceGoesOn(LocalKafkaBroker broker) throws Exception {
        KafkaSettings settings = broker.settings("handlerfault").withGroupId("handlerfault-check");
        KafkaTopics.ensure(settings, 1, (short) 1);
        try (KafkaFrameSink sink = new KafkaFrameSink(settings)) {
            for (int seq = 0; seq < 10; seq++) {
                sink.send(3, NumberedPackets.make(3, seq, 32));
            }
            sink.flush();
        }
        List<Long> handled = new ArrayList<>();
        KafkaFrameSource.SourceCounters got;
        try (KafkaFrameSource source = new KafkaFrameSource(settings, KafkaFrameSource.StartPosition.EARLIEST,
                (id, packet, t, partition, offset) -> {
                    long seq = packet.getLong(packet.position() + 4);
                    if (seq == 4) {
                        throw new IllegalStateException("decoder refused packet " + seq);
                    }
                    handled.add(seq);
                })) {
            source.start();
            Await.until(() -> source.counters().records() + source.counters().handlerErrors() >= 10, 60_000,
                    () -> source.counters().toString());
            source.stop();
            got = source.counters();
        }
        assertEquals(List.of(0L, 1L, 2L, 3L, 5L, 6L, 7L, 8L, 9L), handled);
        assertEquals(new KafkaFrameSource.SourceCounters(9, 9 * 32, 0, 1, 0), got);
    }

    @Test
    void aGroupResumesAfterItsCommittedOffset(LocalKafkaBroker broker) throws Exception {
        KafkaSettings settings = broker.settings("resume").withGroupId("resume-check");
        KafkaTopics.ensure(settings, 1, (short) 1);
        try (KafkaFrameSink sink = new KafkaFrameSink(settings)) {
            for (int seq = 0; seq < 5; seq++) {
                sink.send(1, NumberedPackets.make(1, seq, 32));
            }
            sink.flush();
            List<Long> first = readAll(settings, 5);
            assertEquals(List.of(0L, 1L, 2L, 3L, 4L), first);
            for (int seq = 5; seq < 8; seq++) {
                sink.send(1, NumberedPackets.make(1, seq, 32));
            }
            sink.flush();
        }
        // same group: only what came after the commit made on stop
        assertEquals(List.of(5L, 6L, 7L), readAll(settings, 3));
    }

    private static List<Long> readAll(KafkaSettings settings, int expected) throws InterruptedException {
        List<Long> seqs = new ArrayList<>();
        try (KafkaFrameSource source = new KafkaFrameSource(settings, KafkaFrameSource.StartPosition.EARLIEST,
                (id, packet, t, partition, offset) -> seqs.add(packet.getLong(packet.position() + 4)))) {
            source.start();
            Await.until(() -> source.counters().records() >= expected, 60_000, () -> source.counters().toString());
            source.stop();
        }
        return seqs;
    }

    @Test
    void readingWithoutAGroupIsRefusedWithTheFix() {
        PointcallException e = assertThrows(PointcallException.class, () -> new KafkaFrameSource(
                KafkaSettings.of("127.0.0.1:9"), KafkaFrameSource.StartPosition.LATEST, (i, p, t, q, o) -> { }));
        assertEquals("reading Kafka frames needs a consumer group: set group.id (one per console, one shared by the"
                + " workers that split the streams)", e.getMessage());
    }
}
