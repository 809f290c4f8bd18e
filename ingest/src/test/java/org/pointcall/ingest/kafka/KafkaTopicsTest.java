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

    private static int partitions(TopicDescription d) {
        return d.partitions().size();
    }

    private static String policy(Config c) {
        return c.get("cleanup.policy").value();
    }
}
