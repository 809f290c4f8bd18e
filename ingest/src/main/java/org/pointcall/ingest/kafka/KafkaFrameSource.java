package org.pointcall.ingest.kafka;

import java.nio.ByteBuffer;
import java.time.Duration;
import java.util.Collection;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Set;
import java.util.TreeSet;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.locks.LockSupport;

import org.apache.kafka.clients.consumer.CloseOptions;
import org.apache.kafka.clients.consumer.ConsumerConfig;
import org.apache.kafka.clients.consumer.ConsumerRebalanceListener;
import org.apache.kafka.clients.consumer.ConsumerRecord;
import org.apache.kafka.clients.consumer.ConsumerRecords;
import org.apache.kafka.clients.consumer.KafkaConsumer;
import org.apache.kafka.clients.consumer.OffsetAndMetadata;
import org.apache.kafka.clients.consumer.OffsetCommitCallback;
import org.apache.kafka.common.KafkaException;
import org.apache.kafka.common.TopicPartition;
import org.apache.kafka.common.errors.WakeupException;
import org.apache.kafka.common.serialization.ByteBufferDeserializer;
import org.pointcall.shared.error.PointcallException;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;

/**
 * Reads {@code <prefix>.frames} as a member of the settings' consumer group and hands every packet to a
 * {@link PacketHandler} on its own thread. Sources with different group ids each see every frame; sources sharing a
 * group id share the partitions (so the streams) between them.
 *
 * <p>Offsets are committed after the packets of each poll have been handled, and on rebalance and stop: delivery is
 * at least once, and exactly once as long as no member of the group dies between handling and committing. A record
 * without a valid 4-byte key or without a value is counted, logged (first of its kind) and skipped; a handler that
 * throws is counted likewise and the source goes on.
 */
public final class KafkaFrameSource implements AutoCloseable {
    /** Where a group that has no committed offset yet starts reading. */
    public enum StartPosition {
        /** The oldest frame the topic keeps: workers and recorders, which must see everything. */
        EARLIEST,
        /** Frames published from now on: live consoles. */
        LATEST
    }

    private static final Logger LOG = LoggerFactory.getLogger(KafkaFrameSource.class);
    private static final Duration POLL_TIMEOUT = Duration.ofMillis(500);
    private static final Duration COMMIT_TIMEOUT = Duration.ofSeconds(10);
    private static final long ERROR_BACKOFF_NS = TimeUnit.SECONDS.toNanos(1);
    private static final long STOP_WAIT_MS = 30_000;

    private final KafkaConsumer<ByteBuffer, ByteBuffer> consumer;
    private final String topic;
    private final String group;
    private final PacketHandler handler;
    private final ErrorTally badRecords = new ErrorTally(LOG);
    private final ErrorTally handlerErrors = new ErrorTally(LOG);
    private final ErrorTally clientErrors = new ErrorTally(LOG);
    private final OffsetCommitCallback onCommit = this::committed;

    private volatile boolean stopping;
    private volatile Set<Integer> assigned = Set.of();
    private volatile long publishedRecords;
    private volatile long publishedBytes;
    private Thread thread;
    private boolean closedUnstarted;

    // written by the poll thread only
    private long records;
    private long bytes;

    /**
     * Creates the consumer (so configuration errors show here) without joining the group yet.
     *
     * @throws PointcallException when the settings have no group id
     */
    public KafkaFrameSource(KafkaSettings settings, StartPosition start, PacketHandler handler) {
        this.handler = Objects.requireNonNull(handler, "handler");
        Objects.requireNonNull(start, "start");
        if (settings.groupId() == null) {
            throw new PointcallException("reading Kafka frames needs a consumer group: set " + KafkaSettings.GROUP_KEY
                    + " (one per console, one shared by the workers that split the streams)");
        }
        this.topic = settings.framesTopic();
        this.group = settings.groupId();
        Map<String, Object> config = settings.consumerConfig();
        config.put(ConsumerConfig.ENABLE_AUTO_COMMIT_CONFIG, false);
        config.put(ConsumerConfig.AUTO_OFFSET_RESET_CONFIG, start == StartPosition.EARLIEST ? "earliest" : "latest");
        this.consumer = new KafkaConsumer<>(config, new ByteBufferDeserializer(), new ByteBufferDeserializer());
    }

    /** The topic read. */
    public String topic() {
        return topic;
    }

    /** Joins the group and starts the poll thread. */
    public synchronized void start() {
        if (thread != null || stopping) {
            throw new IllegalStateException("a source starts once");
        }
        thread = new Thread(this::run, "kafka-frames-" + group);
        thread.setDaemon(true);
        thread.start();
    }

    /** True while the poll thread runs. */
    public synchronized boolean running() {
        return thread != null && thread.isAlive();
    }

    /**
     * Stops polling, commits what was handled, leaves the group and closes the consumer; waits for all that (up to
     * 30 s). The handler is not called after this returns, except when called from the handler itself, which
     * only asks the loop to end.
     */
    public void stop() {
        Thread t;
        synchronized (this) {
            stopping = true;
            t = thread;
        }
        if (t == null) {
            if (!closedUnstarted) {
                closedUnstarted = true;
                consumer.close(CloseOptions.timeout(COMMIT_TIMEOUT));
            }
            return;
        }
        consumer.wakeup();
        LockSupport.unpark(t);
        if (t == Thread.currentThread()) {
            // called from the handler: the loop ends after this packet's batch
            return;
        }
        try {
            t.join(STOP_WAIT_MS);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
        if (t.isAlive()) {
            LOG.warn("{} consumer of group {} did not stop within {} ms", topic, group, STOP_WAIT_MS);
        }
    }

    @Override
    public void close() {
        stop();
    }

    /** Partitions this member holds now (changes at each rebalance). */
    public Set<Integer> assignedPartitions() {
        return assigned;
    }

    public SourceCounters counters() {
        return new SourceCounters(publishedRecords, publishedBytes, badRecords.total(), handlerErrors.total(),
                clientErrors.total());
    }

    /** Skipped records by reason, sorted. */
    public Map<String, Long> badRecordsByKind() {
        return badRecords.byKind();
    }

    private void run() {
        try {
            consumer.subscribe(List.of(topic), new Rebalance());
            while (!stopping) {
                try {
                    ConsumerRecords<ByteBuffer, ByteBuffer> batch = consumer.poll(POLL_TIMEOUT);
                    if (batch.isEmpty()) {
                        continue;
                    }
                    for (ConsumerRecord<ByteBuffer, ByteBuffer> r : batch) {
                        handle(r);
                    }
                    publishedRecords = records;
                    publishedBytes = bytes;
                    consumer.commitAsync(onCommit);
                } catch (WakeupException e) {
                    // stop() asked us to leave poll; the loop condition ends the thread
                } catch (KafkaException e) {
                    clientError("poll", e);
                    LockSupport.parkNanos(ERROR_BACKOFF_NS);
                }
            }
            commitNow();
        } finally {
            publishedRecords = records;
            publishedBytes = bytes;
            assigned = Set.of();
            try {
                consumer.close(CloseOptions.timeout(COMMIT_TIMEOUT));
            } catch (KafkaException e) {
                clientError("close", e);
            }
        }
    }

    private void handle(ConsumerRecord<ByteBuffer, ByteBuffer> r) {
        ByteBuffer key = r.key();
        ByteBuffer value = r.value();
        if (key == null || key.remaining() != StreamKey.LENGTH) {
            String what = key == null ? "no key" : "key of " + key.remaining() + " bytes";
            badRecords.count("key length", where(r) + ": " + what + ", expected a " + StreamKey.LENGTH
                    + "-byte stream id; record skipped");
            return;
        }
        if (value == null) {
            badRecords.count("no value", where(r) + ": record without a packet; skipped");
            return;
        }
        int streamId = key.getInt(key.position());
        int size = value.remaining();
        try {
            handler.onPacket(streamId, value, r.timestamp(), r.partition(), r.offset());
        } catch (RuntimeException e) {
            String kind = e.getClass().getSimpleName();
            handlerErrors.count(kind, where(r) + ": packet handler failed: " + kind + ": " + e.getMessage());
            return;
        }
        records++;
        bytes += size;
    }

    private static String where(ConsumerRecord<?, ?> r) {
        return r.topic() + " partition " + r.partition() + " offset " + r.offset();
    }

    private void commitNow() {
        // a wakeup from stop() that arrives after the last poll aborts the first attempt only
        for (int attempt = 0; attempt < 2; attempt++) {
            try {
                consumer.commitSync(COMMIT_TIMEOUT);
                return;
            } catch (WakeupException e) {
                continue;
            } catch (KafkaException e) {
                clientError("commit", e);
                return;
            }
        }
    }

    private void committed(Map<TopicPartition, OffsetAndMetadata> offsets, Exception e) {
        if (e != null) {
            clientError("commit", e);
        }
    }

    private void clientError(String action, Exception e) {
        String kind = action + " " + e.getClass().getSimpleName();
        clientErrors.count(kind, topic + " group " + group + ": " + action + " failed: " + e.getClass().getSimpleName()
                + ": " + e.getMessage());
    }

    private final class Rebalance implements ConsumerRebalanceListener {
        @Override
        public void onPartitionsRevoked(Collection<TopicPartition> partitions) {
            // the handled packets' offsets must be committed before another member takes these partitions
            commitNow();
            update(partitions, false);
        }

        @Override
        public void onPartitionsAssigned(Collection<TopicPartition> partitions) {
            update(partitions, true);
        }

        @Override
        public void onPartitionsLost(Collection<TopicPartition> partitions) {
            update(partitions, false);
        }

        private void update(Collection<TopicPartition> partitions, boolean add) {
            Set<Integer> s = new TreeSet<>(assigned);
            for (TopicPartition tp : partitions) {
                if (add) {
                    s.add(tp.partition());
                } else {
                    s.remove(tp.partition());
                }
            }
            assigned = Set.copyOf(s);
        }
    }

    /**
     * What a source has read.
     *
     * @param records       packets handed to the handler without error
     * @param bytes         value bytes of those packets
     * @param badRecords    records skipped for a missing or malformed key or a missing value
     * @param handlerErrors packets whose handler threw
     * @param clientErrors  failed polls and commits (the source retries)
     */
    public record SourceCounters(long records, long bytes, long badRecords, long handlerErrors, long clientErrors) {
        public SourceCounters {
            if (records < 0 || bytes < 0 || badRecords < 0 || handlerErrors < 0 || clientErrors < 0) {
                throw new IllegalArgumentException("counters are never negative");
            }
        }
    }
}
