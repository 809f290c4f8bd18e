package org.pointcall.ingest.kafka;

import java.util.List;
import java.util.Set;
import java.util.concurrent.TimeUnit;

import org.apache.kafka.clients.admin.Admin;
import org.apache.kafka.clients.admin.Config;
import org.apache.kafka.clients.admin.TopicDescription;
import org.apache.kafka.common.config.ConfigResource;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.ExtendWith;

import static org.junit.jupiter.api.Assertions.assertEquals;

@ExtendWith(LocalKafkaBroker.Shared.class)
class KafkaTopicsTest {

    @Test
    void createsTheMissingTopicsOnceWithACompactedDictionary(LocalKafkaBroker broker) throws Exception {
        KafkaSettings settings = broker.settings("site-7.range");
        assertEquals(List.of("site-7.range.frames", "site-7.range.events", "site-7.range.dictionary"),
                KafkaTopics.ensure(settings, 3, (short) 1));
        assertEquals(List.of(), KafkaTopics.ensure(settings, 3, (short) 1));
        try (Admin admin = broker.admin()) {
            var described = admin.describeTopics(Set.of(settings.framesTopic(), settings.eventsTopic(),
                    settings.dictionaryTopic())).allTopicNames().get(30, TimeUnit.SECONDS);
            assertEquals(3, partitions(described.get(settings.framesTopic())));
            assertEquals(3, partitions(described.get(settings.eventsTopic())));
            assertEquals(1, partitions(described.get(settings.dictionaryTopic())));
            ConfigResource dict = new ConfigResource(ConfigResource.Type.TOPIC, settings.dictionaryTopic());
            ConfigResource frames = new ConfigResource(ConfigResource.Type.TOPIC, settings.framesTopic());
            var configs = admin.describeConfigs(List.of(dict, frames)).all().get(30, TimeUnit.SECONDS);
            assertEquals("compact", policy(configs.get(dict)));
            assertEquals("delete", policy(configs.get(frames)));
        }
    }

    @Test
    void aProducerStartingRightAfterCreationLosesNoFirstBatch(LocalKafkaBroker broker) throws Exception {
        // a first batch refused by a leader not yet serving was lost at the delivery timeout while later batches
        // got in; short timeouts make such a loss show within seconds
        for (int round = 0; round < 5; round++) {
            KafkaSettings settings = broker.settings("fresh-" + round)
                    .withClientProperty("delivery.timeout.ms", "8000")
                    .withClientProperty("request.timeout.ms", "4000");
            KafkaTopics.ensure(settings, 4, (short) 1);
            try (KafkaFrameSink sink = new KafkaFrameSink(settings)) {
                for (long seq = 0; seq < 500; seq++) {
                    for (int s = 0; s < 8; s++) {
                        sink.send(s, NumberedPackets.make(s, seq, 300));
                    }
                }
                sink.flush();
                assertEquals(java.util.Map.of(), sink.failuresByKind(), "round " + round);
                assertEquals(4000, sink.counters().delivered());
            }
            assertEquals(4000, KafkaRoundTripTest.logSize(broker, settings.framesTopic(), 4));
        }
    }

    private static int partitions(TopicDescription d) {
        return d.partitions().size();
    }

    private static String policy(Config c) {
        return c.get("cleanup.policy").value();
    }
}
