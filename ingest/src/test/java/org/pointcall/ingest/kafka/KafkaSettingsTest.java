package org.pointcall.ingest.kafka;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.pointcall.shared.error.InputRejectedException;
import org.pointcall.shared.error.PointcallException;
import org.pointcall.shared.error.Problem;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class KafkaSettingsTest {
    @TempDir
    Path dir;

    private Path write(String name, String... lines) throws Exception {
        Path f = dir.resolve(name);
        Files.writeString(f, String.join("\n", lines) + "\n", StandardCharsets.UTF_8);
        return f;
    }

    @Test
    void aSecuredFileLoadsAndPassesItsClientSettingsToEachClientThatKnowsThem() throws Exception {
        Path f = write("range.properties",
                "# control room, range west",
                "bootstrap.servers = tm-a.range.invalid:9093,tm-b.range.invalid:9093",
                "topic.prefix: sortie.42",
                "group.id   console-2",
                "security.protocol=SASL_SSL",
                "ssl.truststore.location=certs/range-ca.p12",
                "ssl.truststore.password = ch4ngeit",
                "sasl.mechanism=SCRAM-SHA-512",
                "sasl.jaas.config=org.apache.kafka.common.security.scram.ScramLoginModule required \\",
                "    username=\"console\" password=\"s3cret\";",
                "! a comment in the other style",
                "linger.ms=2",
                "session.timeout.ms=20000");
        KafkaSettings s = KafkaSettings.load(f);
        assertEquals("tm-a.range.invalid:9093,tm-b.range.invalid:9093", s.bootstrapServers());
        assertEquals("sortie.42", s.topicPrefix());
        assertEquals("console-2", s.groupId());
        assertEquals("sortie.42.frames", s.framesTopic());
        assertEquals("org.apache.kafka.common.security.scram.ScramLoginModule required username=\"console\""
                + " password=\"s3cret\";", s.clientProperties().get("sasl.jaas.config"));

        Map<String, Object> producer = s.producerConfig();
        assertEquals("SASL_SSL", producer.get("security.protocol"));
        assertEquals("2", producer.get("linger.ms"));
        assertFalse(producer.containsKey("session.timeout.ms"), "a consumer-only setting stays out of a producer");
        assertFalse(producer.containsKey("group.id"));
        Map<String, Object> consumer = s.consumerConfig();
        assertEquals("console-2", consumer.get("group.id"));
        assertEquals("20000", consumer.get("session.timeout.ms"));
        assertFalse(consumer.containsKey("linger.ms"));
        assertEquals("SCRAM-SHA-512", s.adminConfig().get("sasl.mechanism"));

        String shown = s.toString();
        assertFalse(shown.contains("ch4ngeit") || shown.contains("s3cret"), shown);
        assertEquals("[hidden]", s.maskedClientProperties().get("ssl.truststore.password"));
        assertEquals("[hidden]", s.maskedClientProperties().get("sasl.jaas.config"));
        assertEquals("certs/range-ca.p12", s.maskedClientProperties().get("ssl.truststore.location"));
    }

    @Test
    void everyProblemOfAFileIsReportedWithLineAndColumn() throws Exception {
        Path f = write("bad.properties",
                "bootstrap.servers = 127.0.0.1:9092, ground-b:99999",
                "topic.prefix=range west",
                "sasl.mechanisms=PLAIN",
                "linger.ms=soon",
                "acks=1",
                "colour.scheme=dark",
                "  security.protocol = SSH",
                "group.id=console-1",
                "group.id=console-2",
                "ssl.truststore.password=",
                "enable.idempotence=false",
                "ssl.key.password=\\u12G4");
        InputRejectedException e = assertThrows(InputRejectedException.class, () -> KafkaSettings.load(f));
        List<String> expected = List.of(
                f + ":1:21: bootstrap.servers entry 'ground-b:99999' has port 99999, outside 1 to 65535",
                f + ":2:14: topic.prefix 'range west' may hold only letters, digits, '.', '_' and '-'",
                f + ":3:1: unknown setting 'sasl.mechanisms': not a Kafka client setting; did you mean"
                        + " 'sasl.mechanism'?",
                f + ":4:11: 'linger.ms' needs a whole number, got 'soon'",
                f + ":5:1: 'acks' is fixed by pointcall (acks=all with idempotence, so no frame is lost or"
                        + " doubled); remove this line",
                f + ":6:1: unknown setting 'colour.scheme': not a Kafka client setting, nor bootstrap.servers,"
                        + " topic.prefix or group.id",
                f + ":7:23: 'security.protocol' must be one of PLAINTEXT, SASL_PLAINTEXT, SASL_SSL, SSL (any"
                        + " case), got 'SSH'",
                f + ":9:1: 'group.id' is set again (first on line 8); keep one",
                f + ":10:25: 'ssl.truststore.password' has no value",
                f + ":11:1: 'enable.idempotence' is fixed by pointcall (acks=all with idempotence, so no frame is"
                        + " lost or doubled); remove this line",
                f + ":12:18: bad \\u escape '\\u12G4': four hex digits needed");
        assertEquals(expected, e.problems().stream().sorted().map(Problem::toString).toList());
        assertEquals(String.join(System.lineSeparator(), expected), e.getMessage());
    }

    @Test
    void aFileWithoutBrokersIsRefusedAndDefaultsApplyOtherwise() throws Exception {
        Path none = write("empty.properties", "# nothing yet", "", "group.id=recorder");
        InputRejectedException e = assertThrows(InputRejectedException.class, () -> KafkaSettings.load(none));
        assertEquals(none + ": bootstrap.servers is missing (host:port of at least one broker)", e.getMessage());

        KafkaSettings s = KafkaSettings.load(write("min.properties", "bootstrap.servers=127.0.0.1:9092"));
        assertEquals("pointcall", s.topicPrefix());
        assertNull(s.groupId());
        assertTrue(s.clientProperties().isEmpty());
    }

    @Test
    void aMissingFileIsNamed() {
        Path f = dir.resolve("absent.properties");
        PointcallException e = assertThrows(PointcallException.class, () -> KafkaSettings.load(f));
        assertEquals(f + ": no such file", e.getMessage());
    }

    @Test
    void settingsBuiltInCodeAreCheckedAlike() {
        KafkaSettings s = KafkaSettings.of("127.0.0.1:9092");
        IllegalArgumentException fixed = assertThrows(IllegalArgumentException.class,
                () -> s.withClientProperty("value.serializer", "x.Y"));
        assertEquals("'value.serializer' is fixed by pointcall (stream id keys and wire packets are raw bytes);"
                + " remove this line", fixed.getMessage());
        IllegalArgumentException badPrefix = assertThrows(IllegalArgumentException.class,
                () -> s.withTopicPrefix("a/b"));
        assertEquals("topic.prefix 'a/b' may hold only letters, digits, '.', '_' and '-'", badPrefix.getMessage());
        IllegalArgumentException badPort = assertThrows(IllegalArgumentException.class,
                () -> KafkaSettings.of("127.0.0.1"));
        assertEquals("bootstrap.servers entry '127.0.0.1' needs host:port", badPort.getMessage());
        assertEquals("x", s.withClientProperty("client.id", "x").producerConfig().get("client.id"));
    }

    @Test
    void kafkasOwnRangeChecksArePassedOnAndSecretsAreRecognised() {
        // the reason is Kafka's own range check (ConfigDef.Range of sasl.login.refresh.window.factor, 0.5 to 1.0)
        assertEquals("bad value '3.0' for 'sasl.login.refresh.window.factor': Value must be no more than 1.0",
                KafkaSettings.valueProblem("sasl.login.refresh.window.factor", "3.0"));
        assertEquals("'compression.type' must be one of gzip, lz4, none, snappy, zstd, got 'brotli'",
                KafkaSettings.valueProblem("compression.type", "brotli"));
        assertTrue(KafkaSettings.isSecret("sasl.jaas.config"));
        assertTrue(KafkaSettings.isSecret("ssl.key.password"));
        assertFalse(KafkaSettings.isSecret("ssl.truststore.location"));
    }
}
