package org.pointcall.ingest.kafka;

import java.time.Duration;
import java.util.Map;
import java.util.concurrent.atomic.LongAdder;

import org.apache.kafka.clients.producer.Callback;
import org.apache.kafka.clients.producer.KafkaProducer;
import org.apache.kafka.clients.producer.ProducerConfig;
import org.apache.kafka.clients.producer.ProducerRecord;
import org.apache.kafka.clients.producer.RecordMetadata;
import org.apache.kafka.common.KafkaException;
import org.apache.kafka.common.serialization.ByteArraySerializer;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;

/**
 * Publishes wire packets to {@code <prefix>.frames}, one record per packet, keyed by stream id (4 bytes, big-endian,
 * see {@link StreamKey}) so that each stream stays in one partition and in order.
 *
 * <p>The producer is idempotent with {@code acks=all}: a broker restart or a lost connection is retried without
 * loss, duplication or reordering, for up to {@code delivery.timeout.ms}. A record that fails anyway (timeout, too
 * large, not authorised...) is counted by kind and the first of each kind is logged; nothing fails silently.
 * Batching defaults to {@value #DEFAULT_LINGER_MS} ms linger and {@value #DEFAULT_BATCH_BYTES} byte batches; the
 * settings' client properties ({@code linger.ms}, {@code batch.size}, {@code compression.type}...) override them.
 *
 * <p>{@link #send} may be called from several threads. It blocks only when the producer's buffer is full (broker
 * unreachable), for at most {@code max.block.ms}.
 */
public final class KafkaFrameSink implements AutoCloseable {
    public static final int DEFAULT_LINGER_MS = 5;
    public static final int DEFAULT_BATCH_BYTES = 128 * 1024;

    private static final Logger LOG = LoggerFactory.getLogger(KafkaFrameSink.class);
    private static final Duration CLOSE_TIMEOUT = Duration.ofSeconds(30);

    private final KafkaProducer<byte[], byte[]> producer;
    private final String topic;
    private final LongAdder sent = new LongAdder();
    private final LongAdder delivered = new LongAdder();
    private final LongAdder deliveredBytes = new LongAdder();
    private final ErrorTally failures = new ErrorTally(LOG);
    private final Callback onAck = this::acknowledged;

    public KafkaFrameSink(KafkaSettings settings) {
        this.topic = settings.framesTopic();
        Map<String, Object> config = settings.producerConfig();
        config.putIfAbsent(ProducerConfig.LINGER_MS_CONFIG, DEFAULT_LINGER_MS);
        config.putIfAbsent(ProducerConfig.BATCH_SIZE_CONFIG, DEFAULT_BATCH_BYTES);
        config.put(ProducerConfig.ACKS_CONFIG, "all");
        config.put(ProducerConfig.ENABLE_IDEMPOTENCE_CONFIG, true);
        this.producer = new KafkaProducer<>(config, new ByteArraySerializer(), new ByteArraySerializer());
    }

    /** The topic written to. */
    public String topic() {
        return topic;
    }

    /** As {@link #send(int, long, byte[])} with the record time set by the producer (now). */
    public boolean send(int streamId, byte[] packet) {
        return send(streamId, -1L, packet);
    }

    /**
     * Hands one packet to the producer. The sink owns {@code packet} from now on: do not change it.
     *
     * @param timestampMs record time in milliseconds since the epoch, or negative to let the producer set it
     * @return false when the packet was refused at once (counted as a failure); true when it is on its way, its fate
     *         then shows in {@link #counters()}
     */
    public boolean send(int streamId, long timestampMs, byte[] packet) {
        ProducerRecord<byte[], byte[]> r = new ProducerRecord<>(topic, null, timestampMs < 0 ? null : timestampMs,
                StreamKey.bytes(streamId), packet);
        sent.increment();
        try {
            producer.send(r, onAck);
            return true;
        } catch (KafkaException | IllegalStateException e) {
            fail(e);
            return false;
        }
    }

    private void acknowledged(RecordMetadata metadata, Exception e) {
        if (e == null) {
            delivered.increment();
            deliveredBytes.add(Math.max(0, metadata.serializedValueSize()));
        } else {
            fail(e);
        }
    }

    private void fail(Exception e) {
        String kind = e.getClass().getSimpleName();
        failures.count(kind, "frame to " + topic + " not delivered: " + kind + ": " + e.getMessage());
    }

    /** Blocks until every packet sent so far is acknowledged or failed. */
    public void flush() {
        producer.flush();
    }

    public SinkCounters counters() {
        long failed = failures.total();
        return new SinkCounters(sent.sum(), delivered.sum(), failed, deliveredBytes.sum());
    }

    /** Failed packets by kind of failure (exception simple name), sorted by kind. */
    public Map<String, Long> failuresByKind() {
        return failures.byKind();
    }

    /** Delivers what is pending (waiting up to 30 s) and closes the producer. */
    @Override
    public void close() {
        producer.close(CLOSE_TIMEOUT);
        SinkCounters c = counters();
        if (c.failed() > 0 || c.pending() > 0) {
            LOG.warn("{} closed with {} frames not delivered ({} failed {}, {} pending)", topic,
                    c.failed() + c.pending(), c.failed(), failures.byKind(), c.pending());
        }
    }

    /**
     * What happened to the packets given to a sink.
     *
     * @param sent           packets handed to {@link #send}
     * @param delivered      packets acknowledged by all in-sync replicas
     * @param failed         packets refused or given up; each is also in {@link #failuresByKind()}
     * @param deliveredBytes value bytes of the delivered packets
     */
    public record SinkCounters(long sent, long delivered, long failed, long deliveredBytes) {
        public SinkCounters {
            if (sent < 0 || delivered < 0 || failed < 0 || deliveredBytes < 0) {
                throw new IllegalArgumentException("counters are never negative");
            }
        }

        /** Packets still on their way (counters are read one after another, so this is approximate in flight). */
        public long pending() {
            return Math.max(0, sent - delivered - failed);
        }
    }
}
