package org.pointcall.ingest.kafka;

import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;

import org.apache.kafka.common.utils.Utils;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.ExtendWith;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

@ExtendWith(LocalKafkaBroker.Shared.class)
class KafkaConsumerGroupsTest {
    private static final int PARTITIONS = 4;
    private static final int STREAMS = 8;
    private static final long PER_STREAM = 1_000;

    @Test
    void separateGroupsEachSeeAllWhileOneGroupSplitsThePartitions(LocalKafkaBroker broker) throws Exception {
        KafkaSettings settings = broker.settings("groups");
        KafkaTopics.ensure(settings, PARTITIONS, (short) 1);
        int[] streamIds = twoStreamsPerPartition();
        // stream ids are 0..STREAMS-1 inside the checkers: map through the chosen ids
        NumberedPackets consoleA = new NumberedPackets(STREAMS, PARTITIONS);
        NumberedPackets consoleB = new NumberedPackets(STREAMS, PARTITIONS);
        NumberedPackets worker1 = new NumberedPackets(STREAMS, PARTITIONS);
        NumberedPackets worker2 = new NumberedPackets(STREAMS, PARTITIONS);
        List<KafkaFrameSource> sources = new ArrayList<>();
        try {
            KafkaFrameSource a = open(sources, settings.withGroupId("console-a"), consoleA, streamIds);
            KafkaFrameSource b = open(sources, settings.withGroupId("console-b"), consoleB, streamIds);
            KafkaFrameSource w1 = open(sources, settings.withGroupId("workers"), worker1, streamIds);
            KafkaFrameSource w2 = open(sources, settings.withGroupId("workers"), worker2, streamIds);
            // send only once the workers' group has settled, so no rebalance replays a record
            Await.until(() -> a.assignedPartitions().size() == PARTITIONS
                    && b.assignedPartitions().size() == PARTITIONS && !w1.assignedPartitions().isEmpty()
                    && !w2.assignedPartitions().isEmpty()
                    && w1.assignedPartitions().size() + w2.assignedPartitions().size() == PARTITIONS,
                    60_000, () -> "assigned a " + a.assignedPartitions() + " b " + b.assignedPartitions()
                            + " w1 " + w1.assignedPartitions() + " w2 " + w2.assignedPartitions());
            Set<Integer> w1Parts = w1.assignedPartitions();
            Set<Integer> w2Parts = w2.assignedPartitions();
            try (KafkaFrameSink sink = new KafkaFrameSink(settings)) {
                for (long seq = 0; seq < PER_STREAM; seq++) {
                    for (int s = 0; s < STREAMS; s++) {
                        sink.send(streamIds[s], NumberedPackets.make(s, seq, 64));
                    }
                }
                sink.flush();
                assertEquals(STREAMS * PER_STREAM, sink.counters().delivered());
            }
            long total = STREAMS * PER_STREAM;
            Await.until(() -> a.counters().records() >= total && b.counters().records() >= total
                    && w1.counters().records() + w2.counters().records() >= total, 60_000,
                    () -> "a " + a.counters() + " b " + b.counters() + " w1 " + w1.counters() + " w2 "
                            + w2.counters());
            sources.forEach(KafkaFrameSource::stop);

            for (NumberedPackets console : List.of(consoleA, consoleB)) {
                assertEquals(0, console.faultCount(), console::faultReport);
                assertEquals(total, console.packets());
            }
            assertEquals(0, worker1.faultCount(), worker1::faultReport);
            assertEquals(0, worker2.faultCount(), worker2::faultReport);
            Set<Integer> overlap = new HashSet<>(w1Parts);
            overlap.retainAll(w2Parts);
            assertTrue(overlap.isEmpty(), "workers share no partition: " + w1Parts + " / " + w2Parts);
            assertEquals(total, worker1.packets() + worker2.packets());
            assertTrue(worker1.packets() > 0 && worker2.packets() > 0);
            // each stream went whole to the worker holding its partition
            for (int s = 0; s < STREAMS; s++) {
                int p = consoleA.partitionOf(s);
                NumberedPackets holder = w1Parts.contains(p) ? worker1 : worker2;
                NumberedPackets other = holder == worker1 ? worker2 : worker1;
                assertEquals(PER_STREAM, holder.nextDue()[s], "stream " + s + " at its worker");
                assertEquals(0, other.nextDue()[s], "stream " + s + " not at the other worker");
            }
            assertFalse(w1Parts.isEmpty() || w2Parts.isEmpty());
        } finally {
            sources.forEach(KafkaFrameSource::stop);
        }
    }

    private static KafkaFrameSource open(List<KafkaFrameSource> sources, KafkaSettings settings,
                                         NumberedPackets check, int[] streamIds) {
        KafkaFrameSource s = new KafkaFrameSource(settings, KafkaFrameSource.StartPosition.EARLIEST,
                (id, packet, t, partition, offset) -> check.onPacket(indexOf(streamIds, id), packet, t, partition,
                        offset));
        sources.add(s);
        s.start();
        return s;
    }

    private static int indexOf(int[] ids, int id) {
        for (int i = 0; i < ids.length; i++) {
            if (ids[i] == id) {
                return i;
            }
        }
        return -1;
    }

    /**
     * Stream ids that Kafka's default partitioner (murmur2 of the key, made positive, modulo the partition count)
     * spreads two to a partition, so every partition and therefore every worker has traffic.
     */
    private static int[] twoStreamsPerPartition() {
        int[] perPartition = new int[PARTITIONS];
        int[] ids = new int[STREAMS];
        int n = 0;
        for (int id = 100; n < STREAMS; id++) {
            int p = Utils.toPositive(Utils.murmur2(StreamKey.bytes(id))) % PARTITIONS;
            if (perPartition[p] < STREAMS / PARTITIONS) {
                perPartition[p]++;
                ids[n++] = id;
            }
        }
        return ids;
    }
}
