/**
 * Frames over Apache Kafka, for scale-out: ingest nodes publish, detector workers in one consumer group share the
 * streams by partition, consoles and recorders each read everything in groups of their own.
 *
 * <h2>Topics and records</h2>
 * {@code <prefix>.frames}: one record per wire packet (the value, opaque here), key = stream id as a 4-byte
 * big-endian int ({@link org.pointcall.ingest.kafka.StreamKey}), so each stream lives in one partition and keeps its
 * order. {@code <prefix>.events}: a shared session's start, events (points, verdicts, alarms, operator calls) and
 * live views, keyed likewise (layout: monitor-ui's {@code ui.share.ShareRecords}).
 * {@code <prefix>.dictionary}: compacted, one partition, key = dictionary hash. {@link
 * org.pointcall.ingest.kafka.KafkaTopics#ensure} creates whichever are missing.
 *
 * <h2>Settings file</h2>
 * Java properties syntax, UTF-8. {@code bootstrap.servers} (required), {@code topic.prefix} (default
 * {@code pointcall}), {@code group.id} (needed to read), then any Kafka producer, consumer or admin client setting,
 * typically TLS and SASL ({@code security.protocol}, {@code ssl.truststore.location}, {@code sasl.mechanism},
 * {@code sasl.jaas.config}...) or tuning ({@code linger.ms}, {@code batch.size}, {@code compression.type}). Unknown
 * names (with a suggestion for near misses), values Kafka would refuse, repeated keys and the settings pointcall
 * fixes (serialisers, {@code acks}, {@code enable.idempotence}, {@code enable.auto.commit},
 * {@code auto.offset.reset}) are reported together, each as {@code file:line:column: message}. Passwords and JAAS
 * configurations are never shown.
 *
 * <h2>Threads</h2>
 * {@link org.pointcall.ingest.kafka.KafkaFrameSink#send} may be called from any thread; acknowledgements are
 * counted on the producer's I/O thread. {@link org.pointcall.ingest.kafka.KafkaFrameSource} owns one poll thread
 * that calls the {@link org.pointcall.ingest.kafka.PacketHandler}; its counters may be read from any thread.
 *
 * <h2>Benchmark</h2>
 * {@link org.pointcall.ingest.kafka.KafkaBench} compares the sink with Kafka's own producer performance tool on the
 * same broker; broker and tool run in child JVMs from class paths resolved by the user's Maven (network or a local
 * repository holding {@code org.apache.kafka:kafka_2.13} and {@code kafka-tools} at pointcall's Kafka version).
 * {@code java -cp <pointcall class path> org.pointcall.ingest.kafka.KafkaBench [--bootstrap host:port]
 * [--records 1000000] [--record-size 256] [--streams 8] [--partitions 4] [--linger-ms 20] [--batch-size 131072]
 * [--rounds 3] [--mvn mvn] [--tool-classpath cp] [--broker-classpath cp]}.
 */
package org.pointcall.ingest.kafka;
