package org.pointcall.ingest.kafka;

import java.nio.file.Path;
import java.util.Map;
import java.util.concurrent.atomic.AtomicReference;

import org.apache.kafka.clients.admin.Admin;
import org.apache.kafka.clients.admin.AdminClientConfig;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The broker goes down (SIGTERM) for several seconds while frames are being sent, and comes back. */
class KafkaBrokerRestartTest {
    private static final int STREAMS = 4;
    private static final int PARTITIONS = 2;
    private static final long PER_STREAM = 50_000;
    private static final long TOTAL = STREAMS * PER_STREAM;
    /** Paced well below what the broker takes, so the outage falls in the middle of the sending. */
    private static final long RECORDS_PER_S = 20_000;
    private static final long DOWN_MS = 6_000;

    @TempDir
    Path dir;

    @Test
    void framesSentAcrossABrokerRestartAreNeitherLostNorDoubled() throws Exception {
        String classpath = System.getProperty("surefire.test.class.path", System.getProperty("java.class.path"));
        try (BrokerProcess broker = BrokerProcess.start(classpath, dir, 256)) {
            KafkaSettings settings = KafkaSettings.of(broker.bootstrap()).withTopicPrefix("restart");
            KafkaTopics.ensure(settings, PARTITIONS, (short) 1);
            AtomicReference<Throwable> senderFailure = new AtomicReference<>();
            KafkaFrameSink.SinkCounters sent;
            try (KafkaFrameSink sink = new KafkaFrameSink(settings)) {
                Thread sender = new Thread(() -> {
                    try {
                        sendPaced(sink);
                    } catch (Throwable t) {
                        senderFailure.set(t);
                    }
                }, "restart-test-sender");
                sender.start();
                Await.until(() -> sink.counters().delivered() >= TOTAL / 5, 60_000, () -> sink.counters().toString());
                broker.stop();
                long deliveredWhileDown = sink.counters().delivered();
                Thread.sleep(DOWN_MS);
                // nothing can be acknowledged by a stopped broker: proves the outage really happened mid-send
                assertEquals(deliveredWhileDown, sink.counters().delivered());
                assertTrue(deliveredWhileDown < TOTAL, "the outage must fall inside the sending");
                broker.restart();
                sender.join(180_000);
                assertNull(senderFailure.get());
                sink.flush();
                sent = sink.counters();
                assertEquals(Map.of(), sink.failuresByKind());
            }
            assertEquals(TOTAL, sent.sent());
            assertEquals(TOTAL, sent.delivered(), sent::toString);

            NumberedPackets check = new NumberedPackets(STREAMS, PARTITIONS);
            try (KafkaFrameSource source = new KafkaFrameSource(settings.withGroupId("restart-check"),
                    KafkaFrameSource.StartPosition.EARLIEST, check)) {
                source.start();
                Await.until(() -> source.counters().records() >= TOTAL, 120_000, () -> source.counters().toString());
                source.stop();
            }
            assertEquals(0, check.faultCount(), check::faultReport);
            for (int s = 0; s < STREAMS; s++) {
                assertEquals(PER_STREAM, check.nextDue()[s], "stream " + s);
            }
            try (Admin admin = Admin.create(Map.of(AdminClientConfig.BOOTSTRAP_SERVERS_CONFIG, broker.bootstrap()))) {
                assertEquals(TOTAL, KafkaRoundTripTest.logSize(admin, settings.framesTopic(), PARTITIONS));
            }
        }
    }

    private static void sendPaced(KafkaFrameSink sink) throws InterruptedException {
        long start = System.nanoTime();
        long n = 0;
        for (long seq = 0; seq < PER_STREAM; seq++) {
            for (int s = 0; s < STREAMS; s++) {
                sink.send(s, NumberedPackets.make(s, seq, NumberedPackets.sizeOf(n)));
                n++;
            }
            if (n % 1000 == 0) {
                long dueNs = n * 1_000_000_000L / RECORDS_PER_S;
                long aheadNs = dueNs - (System.nanoTime() - start);
                if (aheadNs > 0) {
                    Thread.sleep(aheadNs / 1_000_000L);
                }
            }
        }
    }
}
