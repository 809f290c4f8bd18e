package org.pointcall.ui.share;

import java.net.InetSocketAddress;
import java.nio.ByteBuffer;
import java.nio.charset.StandardCharsets;
import java.time.Duration;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.TreeMap;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.atomic.LongAdder;
import java.util.function.Consumer;

import org.apache.kafka.clients.consumer.CloseOptions;
import org.apache.kafka.clients.consumer.ConsumerConfig;
import org.apache.kafka.clients.consumer.ConsumerRecord;
import org.apache.kafka.clients.consumer.KafkaConsumer;
import org.apache.kafka.clients.consumer.OffsetAndTimestamp;
import org.apache.kafka.common.KafkaException;
import org.apache.kafka.common.PartitionInfo;
import org.apache.kafka.common.TopicPartition;
import org.apache.kafka.common.errors.WakeupException;
import org.apache.kafka.common.header.Header;
import org.apache.kafka.common.serialization.ByteArrayDeserializer;
import org.pointcall.ingest.kafka.KafkaSettings;
import org.pointcall.ingest.wire.DecoderOptions;
import org.pointcall.ingest.wire.DictionaryRegistry;
import org.pointcall.ingest.wire.FaultLog;
import org.pointcall.ingest.wire.PacketDecoder;
import org.pointcall.ingest.wire.StreamFrameSink;
import org.pointcall.ingest.frame.Frame;
import org.pointcall.shared.card.CardFiles;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.dictionary.DictionaryFiles;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.PointcallException;
import org.pointcall.shared.outcome.PointsFiles;
import org.pointcall.shared.outcome.SessionEvent;

/**
 * Reads a shared session from Kafka for a watching console: {@code <prefix>.dictionary} and {@code <prefix>.events}
 * from their beginning (so a watcher that joins late still sees the whole sortie so far), {@code <prefix>.frames}
 * from {@code backfillS} seconds ago (enough to fill the charts). Frames are decoded here, on the feed's own thread,
 * as a receiver would; session records go to a {@link Listener} on the same thread.
 *
 * <p>It follows one session: the latest to have started (by its start record). A newer start replaces the one
 * followed; records of other sessions are skipped and counted. A record that cannot be read (no type, unknown type,
 * bad JSON, an event that does not fit the card) is counted by kind, named in one line (topic, partition, offset,
 * what is wrong) and skipped; the feed goes on.
 *
 * <p>It reads without a consumer group (partitions assigned, nothing committed): a watcher leaves no trace on the
 * broker and never takes partitions from another reader.
 */
public final class WatchFeed implements AutoCloseable {
    /** What the feed hands on, on its thread. */
    public interface Listener {
        /** A session begins (or the one joined late): card and dictionary as the first session loaded them. */
        void onStart(ShareRecords.SessionStart start, TestCard card, ParameterDictionary dictionary);

        /**
         * One event of the followed session.
         *
         * @throws IllegalArgumentException when it does not fit the card (counted and named by the feed)
         */
        void onEvent(SessionEvent event);

        void onView(ShareRecords.ActiveView view);

        /** A record skipped, named; the feed has counted it. */
        void onFault(String line);
    }

    private static final Duration POLL = Duration.ofMillis(200);
    private static final Duration METADATA = Duration.ofSeconds(2);
    private static final InetSocketAddress ORIGIN = InetSocketAddress.createUnresolved("kafka", 0);

    private final KafkaSettings settings;
    private final double backfillS;
    private final StreamFrameSink frames;
    private final Listener listener;
    private final Consumer<String> notes;
    private final KafkaConsumer<byte[], byte[]> consumer;
    private final DictionaryRegistry registry = new DictionaryRegistry();
    private final PacketDecoder decoder;
    private final Thread thread;
    private final ConcurrentHashMap<String, LongAdder> bad = new ConcurrentHashMap<>();
    private final LongAdder frameRecords = new LongAdder();
    private final LongAdder sessionRecords = new LongAdder();
    private final LongAdder otherSession = new LongAdder();
    private volatile boolean stopping;
    private volatile long lastRecordNs = Long.MIN_VALUE;
    private volatile boolean caughtUp;
    private volatile ShareRecords.SessionStart following;
    private volatile boolean assigned;

    // feed thread only
    private Map<TopicPartition, Long> eventsEnd = new HashMap<>();

    /**
     * @param frames where the followed stream's frames go (the clock and the charts), on the feed's thread
     * @param notes  plain lines for the user (waiting for topics, caught up, a new session)
     */
    public WatchFeed(KafkaSettings settings, double backfillS, StreamFrameSink frames, Listener listener,
                     Consumer<String> notes) {
        this.settings = Objects.requireNonNull(settings, "settings");
        if (!(backfillS >= 0)) {
            throw new IllegalArgumentException("backfill must be >= 0 s");
        }
        this.backfillS = backfillS;
        this.frames = Objects.requireNonNull(frames, "frames");
        this.listener = Objects.requireNonNull(listener, "listener");
        this.notes = Objects.requireNonNull(notes, "notes");
        Map<String, Object> config = settings.consumerConfig();
        config.put(ConsumerConfig.ENABLE_AUTO_COMMIT_CONFIG, false);
        config.put(ConsumerConfig.ALLOW_AUTO_CREATE_TOPICS_CONFIG, false);
        config.put(ConsumerConfig.AUTO_OFFSET_RESET_CONFIG, "earliest");
        try {
            this.consumer = new KafkaConsumer<>(config, new ByteArrayDeserializer(), new ByteArrayDeserializer());
        } catch (KafkaException e) {
            throw new PointcallException("cannot watch " + ShareAddress.describe(settings) + ": " + e.getMessage(), e);
        }
        StreamFrameSink followed = new StreamFrameSink() {
            @Override
            public void onFrame(int streamId, Frame frame, long receiveTimeNs) {
                ShareRecords.SessionStart s = following;
                if (s == null || s.streamId() == streamId) {
                    frames.onFrame(streamId, frame, receiveTimeNs);
                }
            }

            @Override
            public void onDictionary(int streamId, ParameterDictionary dictionary) {
                frames.onDictionary(streamId, dictionary);
            }
        };
        this.decoder = new PacketDecoder(registry, DictionaryFiles::parse, followed, DecoderOptions.DEFAULT,
                new FaultLog(l -> notes.accept("frames: " + l), FaultLog.DEFAULT_MAX_LINES,
                        FaultLog.DEFAULT_WINDOW_NS));
        this.thread = new Thread(this::run, "watch-kafka");
        this.thread.setDaemon(true);
    }

    /** The frames' decoder (its counters feed the stream health). */
    public PacketDecoder decoder() {
        return decoder;
    }

    public void start() {
        thread.start();
    }

    private void run() {
        try {
            if (!assign()) {
                return;
            }
            while (!stopping) {
                try {
                    for (ConsumerRecord<byte[], byte[]> r : consumer.poll(POLL)) {
                        lastRecordNs = System.nanoTime();
                        dispatch(r);
                    }
                    if (!caughtUp) {
                        checkCaughtUp();
                    }
                } catch (WakeupException e) {
                    // close() asked us to leave poll
                } catch (KafkaException e) {
                    count("client " + e.getClass().getSimpleName(), "watch " + ShareAddress.describe(settings)
                            + ": " + e.getClass().getSimpleName() + ": " + e.getMessage() + "; trying again");
                    sleep(1000);
                }
            }
        } finally {
            decoder.flushPending();
            try {
                consumer.close(CloseOptions.timeout(Duration.ofSeconds(5)));
            } catch (KafkaException e) {
                // nothing was committed: nothing is lost by a close that fails
            }
        }
    }

    /** Waits for the topics, assigns every partition and seeks; false when stopped first. */
    private boolean assign() {
        String[] topics = {settings.dictionaryTopic(), settings.eventsTopic(), settings.framesTopic()};
        boolean told = false;
        Map<String, List<TopicPartition>> parts = new HashMap<>();
        while (!stopping) {
            parts.clear();
            try {
                for (String t : topics) {
                    List<PartitionInfo> info = consumer.partitionsFor(t, METADATA);
                    List<TopicPartition> tps = new ArrayList<>();
                    for (PartitionInfo i : info == null ? List.<PartitionInfo>of() : info) {
                        tps.add(new TopicPartition(t, i.partition()));
                    }
                    if (!tps.isEmpty()) {
                        parts.put(t, tps);
                    }
                }
            } catch (WakeupException e) {
                return false;
            } catch (KafkaException e) {
                // the broker is not there yet: say so once, keep asking
            }
            if (parts.size() == topics.length) {
                break;
            }
            if (!told) {
                told = true;
                notes.accept("watch: waiting for a shared session on " + ShareAddress.describe(settings)
                        + " (topics " + settings.topicPrefix() + ".* not there yet)");
            }
            sleep(1000);
        }
        if (stopping) {
            return false;
        }
        List<TopicPartition> all = new ArrayList<>();
        parts.values().forEach(all::addAll);
        consumer.assign(all);
        consumer.seekToBeginning(parts.get(settings.dictionaryTopic()));
        consumer.seekToBeginning(parts.get(settings.eventsTopic()));
        List<TopicPartition> fr = parts.get(settings.framesTopic());
        Map<TopicPartition, Long> at = new HashMap<>();
        long from = System.currentTimeMillis() - Math.round(backfillS * 1000);
        for (TopicPartition tp : fr) {
            at.put(tp, from);
        }
        Map<TopicPartition, OffsetAndTimestamp> found = consumer.offsetsForTimes(at);
        List<TopicPartition> toEnd = new ArrayList<>();
        for (TopicPartition tp : fr) {
            OffsetAndTimestamp o = found.get(tp);
            if (o == null) {
                toEnd.add(tp);
            } else {
                consumer.seek(tp, o.offset());
            }
        }
        if (!toEnd.isEmpty()) {
            // an empty list would mean every assigned partition, the events and dictionaries too
            consumer.seekToEnd(toEnd);
        }
        eventsEnd = new HashMap<>(consumer.endOffsets(parts.get(settings.eventsTopic())));
        assigned = true;
        return true;
    }

    private void checkCaughtUp() {
        for (Map.Entry<TopicPartition, Long> e : eventsEnd.entrySet()) {
            if (consumer.position(e.getKey()) < e.getValue()) {
                return;
            }
        }
        caughtUp = true;
        ShareRecords.SessionStart s = following;
        notes.accept("watch: caught up with " + settings.eventsTopic() + (s == null ? ", no session yet"
                : ", following " + describe(s)));
    }

    private void dispatch(ConsumerRecord<byte[], byte[]> r) {
        String topic = r.topic();
        if (topic.equals(settings.framesTopic())) {
            frameRecords.increment();
            if (r.value() == null) {
                count("frame without a packet", where(r) + ": record without a packet; skipped");
                return;
            }
            // the record time is when the first session received the packet: latency is measured from there
            long ageNs = Math.max(0, (System.currentTimeMillis() - r.timestamp()) * 1_000_000L);
            decoder.decode(ByteBuffer.wrap(r.value()), ORIGIN, System.nanoTime() - ageNs);
        } else if (topic.equals(settings.dictionaryTopic())) {
            dictionary(r);
        } else if (topic.equals(settings.eventsTopic())) {
            sessionRecords.increment();
            session(r);
        }
    }

    private void dictionary(ConsumerRecord<byte[], byte[]> r) {
        if (r.value() == null) {
            return; // a deleted entry of the compacted topic
        }
        try {
            registry.register(DictionaryFiles.parse(new String(r.value(), StandardCharsets.UTF_8), where(r)));
        } catch (RuntimeException e) {
            count("bad dictionary", where(r) + ": not a dictionary: " + firstLine(e.getMessage()) + "; skipped");
        }
    }

    private void session(ConsumerRecord<byte[], byte[]> r) {
        String type = header(r, ShareRecords.TYPE_HEADER);
        String session = header(r, ShareRecords.SESSION_HEADER);
        if (type == null || session == null) {
            count("no header", where(r) + ": no " + (type == null ? ShareRecords.TYPE_HEADER
                    : ShareRecords.SESSION_HEADER) + " header, not a shared-session record; skipped");
            return;
        }
        if (r.value() == null) {
            count("no value", where(r) + ": " + type + " record without a value; skipped");
            return;
        }
        try {
            switch (type) {
                case ShareRecords.START -> start(r, ShareRecords.readStart(r.value()));
                case ShareRecords.EVENT -> {
                    if (isFollowed(session)) {
                        listener.onEvent(PointsFiles.eventFromJson(new String(r.value(), StandardCharsets.UTF_8)));
                    }
                }
                case ShareRecords.VIEW -> {
                    if (isFollowed(session)) {
                        listener.onView(ShareRecords.readView(r.value()));
                    }
                }
                default -> count("unknown type", where(r) + ": unknown record type '" + type + "'; skipped");
            }
        } catch (PointcallException | IllegalArgumentException e) {
            count("bad " + type, where(r) + ": " + firstLine(e.getMessage()) + "; skipped");
        }
    }

    private boolean isFollowed(String session) {
        ShareRecords.SessionStart s = following;
        if (s != null && s.session().equals(session)) {
            return true;
        }
        otherSession.increment();
        return false;
    }

    private void start(ConsumerRecord<byte[], byte[]> r, ShareRecords.SessionStart s) {
        ShareRecords.SessionStart now = following;
        if (now != null && (s.startedAtMs() < now.startedAtMs() || s.session().equals(now.session()))) {
            otherSession.increment();
            return;
        }
        ParameterDictionary dict = DictionaryFiles.parse(s.dictionaryText(), where(r) + " (dictionary)");
        TestCard card = CardFiles.parse(s.cardText(), where(r) + " (card)", dict);
        registry.register(dict);
        following = s;
        if (caughtUp) {
            notes.accept("watch: new session, following " + describe(s));
        }
        listener.onStart(s, card, dict);
    }

    private static String describe(ShareRecords.SessionStart s) {
        return "sortie " + s.sortie() + " (" + s.source() + ", session " + s.session() + ")";
    }

    private static String header(ConsumerRecord<?, ?> r, String key) {
        Header h = r.headers().lastHeader(key);
        return h == null ? null : ShareRecords.text(h.value());
    }

    private void count(String kind, String line) {
        bad.computeIfAbsent(kind, k -> new LongAdder()).increment();
        listener.onFault(line);
    }

    private static String where(ConsumerRecord<?, ?> r) {
        return r.topic() + " partition " + r.partition() + " offset " + r.offset();
    }

    private static String firstLine(String s) {
        return s == null ? "" : s.lines().findFirst().orElse("");
    }

    private static void sleep(long ms) {
        try {
            Thread.sleep(ms);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
    }

    // ------------------------------------------------------------------------------------ counts

    /** The session followed now, or null before the first start record. */
    public ShareRecords.SessionStart following() {
        return following;
    }

    /** True once the events that were on the topic when the feed joined have all been read. */
    public boolean caughtUp() {
        return caughtUp;
    }

    /** True once the feed has found its topics and is reading. */
    public boolean reading() {
        return assigned;
    }

    /** {@link System#nanoTime} of the last record read, {@link Long#MIN_VALUE} before any. */
    public long lastRecordNs() {
        return lastRecordNs;
    }

    /**
     * What the feed has read.
     *
     * @param frameRecords   records of the frames topic
     * @param sessionRecords records of the events topic
     * @param otherSessions  session records skipped because they belong to another session than the one followed
     * @param bad            records skipped as unreadable, and client errors
     * @param badByKind      the same by kind
     */
    public record Counts(long frameRecords, long sessionRecords, long otherSessions, long bad,
                         Map<String, Long> badByKind) {
    }

    public Counts counts() {
        Map<String, Long> byKind = new TreeMap<>();
        bad.forEach((k, v) -> byKind.put(k, v.sum()));
        long n = 0;
        for (long v : byKind.values()) {
            n += v;
        }
        return new Counts(frameRecords.sum(), sessionRecords.sum(), otherSession.sum(), n, byKind);
    }

    /** Stops reading and closes the consumer (waits up to 10 s). */
    @Override
    public void close() {
        stopping = true;
        consumer.wakeup();
        if (thread.isAlive()) {
            try {
                thread.join(10_000);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            }
        } else if (thread.getState() == Thread.State.NEW) {
            consumer.close(CloseOptions.timeout(Duration.ofSeconds(1)));
        }
    }
}
