package org.pointcall.ui.share;

import java.net.InetSocketAddress;
import java.nio.ByteBuffer;
import java.nio.charset.StandardCharsets;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.Set;
import java.util.TreeMap;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.ConcurrentLinkedQueue;
import java.util.concurrent.CopyOnWriteArrayList;
import java.util.concurrent.ThreadLocalRandom;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.concurrent.atomic.AtomicLong;
import java.util.concurrent.atomic.LongAdder;
import java.util.concurrent.locks.LockSupport;
import java.util.function.Consumer;
import java.util.function.Supplier;

import org.apache.kafka.clients.producer.Callback;
import org.apache.kafka.clients.producer.KafkaProducer;
import org.apache.kafka.clients.producer.ProducerConfig;
import org.apache.kafka.clients.producer.ProducerRecord;
import org.apache.kafka.common.KafkaException;
import org.apache.kafka.common.header.internals.RecordHeader;
import org.apache.kafka.common.serialization.ByteArraySerializer;
import org.pointcall.ingest.kafka.KafkaFrameSink;
import org.pointcall.ingest.kafka.KafkaSettings;
import org.pointcall.ingest.kafka.KafkaTopics;
import org.pointcall.ingest.kafka.StreamKey;
import org.pointcall.ingest.pipeline.PacketQueue;
import org.pointcall.ingest.udp.DatagramHandler;
import org.pointcall.ingest.wire.DecoderOptions;
import org.pointcall.ingest.wire.WireFormat;
import org.pointcall.models.card.SessionSnapshot;
import org.pointcall.shared.dictionary.DictionaryFiles;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.PointcallException;
import org.pointcall.shared.outcome.PointsFiles;
import org.pointcall.shared.outcome.SessionEvent;

/**
 * Shares a live session on Kafka, next to what the session does and without slowing it, so that other consoles can
 * watch it: every received wire packet to {@code <prefix>.frames}, each dictionary to {@code <prefix>.dictionary},
 * and to {@code <prefix>.events} the session's start (card and dictionary), its events and the live view of its
 * active point ({@link ShareRecords}).
 *
 * <p>Nothing the session runs on ever waits for Kafka. The receiver's {@link #tee} copies each datagram into a
 * bounded single-producer queue ({@link PacketQueue}) and goes on; a datagram that finds it full is not shared and
 * is counted. Events are queued from the session's thread (bounded likewise). One share thread of its own creates
 * the topics that are missing, sends, and samples the sessions' snapshots for the views; it alone may wait on the
 * broker (metadata, a full producer buffer), which only fills the queues. Failed sends are counted by kind.
 */
public final class SessionShare implements AutoCloseable, org.pointcall.ui.demo.StreamShare {
    private static final int PACKET_QUEUE = 8192;
    private static final int MAX_PENDING_RECORDS = 50_000;
    private static final long VIEW_PERIOD_NS = 250_000_000L;
    private static final long ENSURE_RETRY_NS = 5_000_000_000L;
    private static final Duration CLOSE_TIMEOUT = Duration.ofSeconds(5);

    private final KafkaSettings settings;
    private final String where;
    private final String cardText;
    private final String run;
    private final Consumer<String> notes;
    private final KafkaProducer<byte[], byte[]> producer;
    private final PacketQueue packets = new PacketQueue(PACKET_QUEUE,
            DecoderOptions.DEFAULT.maxDatagramBytes() + 1);
    private final ConcurrentLinkedQueue<Outgoing> records = new ConcurrentLinkedQueue<>();
    private final AtomicInteger pendingRecords = new AtomicInteger();
    private final List<SharedStream> streams = new CopyOnWriteArrayList<>();
    private final Set<Long> dictionariesShared = ConcurrentHashMap.newKeySet();
    private final AtomicInteger sessions = new AtomicInteger();
    private final Thread thread;
    private volatile boolean stopping;
    private volatile boolean topicsReady;

    private final LongAdder packetsSent = new LongAdder();
    private final LongAdder recordsSent = new LongAdder();
    private final LongAdder delivered = new LongAdder();
    private final AtomicLong recordsRefused = new AtomicLong();
    /** Datagrams and records still queued when the share stopped (the brokers never answered in time). */
    private final AtomicLong leftAtClose = new AtomicLong();
    private final ConcurrentHashMap<String, LongAdder> failures = new ConcurrentHashMap<>();
    private final Callback onAck = (m, e) -> {
        if (e == null) {
            delivered.increment();
        } else {
            fail(e);
        }
    };

    /** A record waiting for the share thread. */
    private record Outgoing(String topic, byte[] key, byte[] value, String type, String session) {
    }

    /**
     * Creates the producer (so a bad setting shows at once) and starts the share thread.
     *
     * @param cardText the test card's file text, sent with every session start
     * @param notes    one line per thing worth telling (topics created, first failure of a kind); any thread
     */
    public SessionShare(KafkaSettings settings, String cardText, Consumer<String> notes) {
        this.settings = Objects.requireNonNull(settings, "settings");
        this.where = ShareAddress.describe(settings);
        this.cardText = Objects.requireNonNull(cardText, "cardText");
        this.notes = Objects.requireNonNull(notes, "notes");
        this.run = Long.toHexString(System.currentTimeMillis()) + "-"
                + Integer.toHexString(ThreadLocalRandom.current().nextInt() & 0x7fffffff);
        Map<String, Object> config = settings.producerConfig();
        config.putIfAbsent(ProducerConfig.LINGER_MS_CONFIG, KafkaFrameSink.DEFAULT_LINGER_MS);
        config.putIfAbsent(ProducerConfig.BATCH_SIZE_CONFIG, KafkaFrameSink.DEFAULT_BATCH_BYTES);
        // only the share thread waits for the broker, and not for long: what it cannot send in time is counted
        config.putIfAbsent(ProducerConfig.MAX_BLOCK_MS_CONFIG, 5000);
        config.put(ProducerConfig.ACKS_CONFIG, "all");
        config.put(ProducerConfig.ENABLE_IDEMPOTENCE_CONFIG, true);
        try {
            this.producer = new KafkaProducer<>(config, new ByteArraySerializer(), new ByteArraySerializer());
        } catch (KafkaException e) {
            throw new PointcallException("cannot share on " + where + ": " + e.getMessage(), e);
        }
        this.thread = new Thread(this::loop, "share-kafka");
        this.thread.setDaemon(true);
        this.thread.start();
    }

    /** {@code kafka://servers/prefix}. */
    public String where() {
        return where;
    }

    public KafkaSettings settings() {
        return settings;
    }

    /**
     * A handler that copies each datagram for sharing, then hands it to {@code next}. Never blocks; one receiver
     * thread.
     */
    public DatagramHandler tee(DatagramHandler next) {
        return new DatagramHandler() {
            @Override
            public void onDatagram(ByteBuffer datagram, InetSocketAddress sender, long receiveTimeNs) {
                packets.offer(datagram, receiveTimeNs, 0L);
                next.onDatagram(datagram, sender, receiveTimeNs);
            }

            @Override
            public void onStop() {
                next.onStop();
            }
        };
    }

    /**
     * A card session begins on {@code streamId} with {@code dictionary}: its start record (and the dictionary, the
     * first time it is seen) are queued. Give the returned stream the session's events, and the session to follow
     * for the views. Any thread; never blocks.
     *
     * @param source where the telemetry comes from, in words (for the watcher's header)
     */
    @Override
    public SharedStream begin(int streamId, ParameterDictionary dictionary, String source) {
        String text = DictionaryFiles.toYaml(dictionary);
        if (dictionariesShared.add(dictionary.hash())) {
            enqueue(new Outgoing(settings.dictionaryTopic(), ShareRecords.hashKey(dictionary.hash()),
                    text.getBytes(StandardCharsets.UTF_8), null, null));
        }
        String session = run + "-" + streamId + "-" + sessions.incrementAndGet();
        String sortie = "";
        try {
            sortie = org.pointcall.shared.card.CardFiles.parse(cardText, "card", dictionary).sortie();
        } catch (RuntimeException e) {
            // the session itself loaded this card; the sortie is only a label
        }
        SharedStream s = new SharedStream(streamId, session);
        enqueue(new Outgoing(settings.eventsTopic(), StreamKey.bytes(streamId), ShareRecords.start(
                new ShareRecords.SessionStart(ShareRecords.FORMAT, session, System.currentTimeMillis(), source,
                        streamId, sortie, cardText, text)), ShareRecords.START, session));
        streams.add(s);
        return s;
    }

    /** One card session's side of the share: its events, and the session whose active point it shows. */
    public final class SharedStream implements org.pointcall.ui.demo.StreamShare.Shared {
        private final int streamId;
        private final String session;
        private volatile Supplier<SessionSnapshot> view;
        private volatile boolean ended;
        // share thread only
        private ShareRecords.ActiveView lastView;

        private SharedStream(int streamId, String session) {
            this.streamId = streamId;
            this.session = session;
        }

        /** Queues the event; the session's thread, never blocks. */
        @Override
        public void onEvent(SessionEvent e) {
            enqueue(new Outgoing(settings.eventsTopic(), StreamKey.bytes(streamId),
                    PointsFiles.eventToJson(e).getBytes(StandardCharsets.UTF_8), ShareRecords.EVENT, session));
        }

        /** The session's snapshots, sampled for the live view of its active point. */
        public void follow(Supplier<SessionSnapshot> snapshots) {
            this.view = snapshots;
        }

        /** The session is over (a new dictionary replaced it): no more views. */
        public void end() {
            ended = true;
            streams.remove(this);
        }

        public String session() {
            return session;
        }
    }

    private void enqueue(Outgoing o) {
        if (pendingRecords.incrementAndGet() > MAX_PENDING_RECORDS) {
            pendingRecords.decrementAndGet();
            recordsRefused.incrementAndGet();
            return;
        }
        records.add(o);
    }

    // ------------------------------------------------------------------------------------ the share thread

    private void loop() {
        long nextEnsure = 0;
        long nextView = 0;
        PacketQueue.Handler send = this::sendPacket;
        try {
            while (!stopping) {
                long now = System.nanoTime();
                if (!topicsReady) {
                    if (now >= nextEnsure) {
                        nextEnsure = now + ENSURE_RETRY_NS;
                        ensureTopics();
                    }
                    if (!topicsReady) {
                        // nothing can be sent yet: the queues fill, and what overflows is counted
                        LockSupport.parkNanos(50_000_000L);
                        continue;
                    }
                }
                // snapshots first, then the events queued before them: a view never overtakes its events
                List<Sample> views = now >= nextView ? views() : null;
                int n = sendRecords();
                if (views != null) {
                    nextView = now + VIEW_PERIOD_NS;
                    sendViews(views);
                }
                n += packets.drain(send, 1024);
                if (n == 0) {
                    LockSupport.parkNanos(1_000_000L);
                }
            }
            if (topicsReady) {
                sendRecords();
                while (packets.drain(send, 1024) > 0) {
                    // what the receiver handed over before the end is still shared
                }
            }
        } catch (RuntimeException e) {
            notes.accept("share on " + where + " stopped: " + e.getClass().getSimpleName() + ": " + e.getMessage());
        }
    }

    private void ensureTopics() {
        try {
            List<String> made = KafkaTopics.ensure(settings, 1, (short) 1);
            topicsReady = true;
            if (!made.isEmpty()) {
                notes.accept("share: created " + String.join(", ", made));
            }
        } catch (PointcallException e) {
            if (stopping) {
                return;
            }
            String kind = "topics";
            if (failures.computeIfAbsent(kind, k -> new LongAdder()).sum() == 0) {
                notes.accept("share: " + e.getMessage() + "; trying again every "
                        + ENSURE_RETRY_NS / 1_000_000_000L + " s, meanwhile what does not fit the queues is counted");
            }
            failures.get(kind).increment();
        }
    }

    private void sendPacket(ByteBuffer packet, long arrivalNs, long tag) {
        byte[] b = new byte[packet.remaining()];
        packet.get(packet.position(), b);
        int streamId = b.length >= 16 ? packet.duplicate().order(WireFormat.ORDER).getInt(packet.position() + 12) : 0;
        // the record time is when the first session received the packet, on its wall clock
        long wallMs = System.currentTimeMillis() - (System.nanoTime() - arrivalNs) / 1_000_000L;
        send(new ProducerRecord<>(settings.framesTopic(), null, wallMs, StreamKey.bytes(streamId), b));
        packetsSent.increment();
    }

    private int sendRecords() {
        int n = 0;
        for (Outgoing o; (o = records.poll()) != null; ) {
            pendingRecords.decrementAndGet();
            ProducerRecord<byte[], byte[]> r = new ProducerRecord<>(o.topic(), o.key(), o.value());
            if (o.type() != null) {
                r.headers().add(new RecordHeader(ShareRecords.TYPE_HEADER, o.type().getBytes(StandardCharsets.UTF_8)));
                r.headers().add(new RecordHeader(ShareRecords.SESSION_HEADER,
                        o.session().getBytes(StandardCharsets.UTF_8)));
            }
            send(r);
            recordsSent.increment();
            n++;
        }
        return n;
    }

    /** A stream and its active point now (null between points). */
    private record Sample(SharedStream stream, ShareRecords.ActiveView view) {
    }

    private List<Sample> views() {
        List<Sample> out = new ArrayList<>();
        for (SharedStream s : streams) {
            Supplier<SessionSnapshot> v = s.view;
            if (v == null || s.ended) {
                continue;
            }
            SessionSnapshot snap = v.get();
            out.add(new Sample(s, snap.active() == null ? null : new ShareRecords.ActiveView(snap.timeNs(),
                    snap.active())));
        }
        return out;
    }

    private void sendViews(List<Sample> views) {
        for (Sample sample : views) {
            ShareRecords.ActiveView v = sample.view();
            SharedStream s = sample.stream();
            if (v == null || (s.lastView != null && s.lastView.active().equals(v.active()))) {
                continue;
            }
            s.lastView = v;
            ProducerRecord<byte[], byte[]> r = new ProducerRecord<>(settings.eventsTopic(),
                    StreamKey.bytes(s.streamId), ShareRecords.view(v));
            r.headers().add(new RecordHeader(ShareRecords.TYPE_HEADER,
                    ShareRecords.VIEW.getBytes(StandardCharsets.UTF_8)));
            r.headers().add(new RecordHeader(ShareRecords.SESSION_HEADER,
                    s.session.getBytes(StandardCharsets.UTF_8)));
            send(r);
            recordsSent.increment();
        }
    }

    private void send(ProducerRecord<byte[], byte[]> r) {
        try {
            producer.send(r, onAck);
        } catch (KafkaException | IllegalStateException e) {
            fail(e);
        }
    }

    private void fail(Exception e) {
        String kind = e.getClass().getSimpleName();
        LongAdder a = failures.computeIfAbsent(kind, k -> new LongAdder());
        if (a.sum() == 0) {
            notes.accept("share on " + where + ": not delivered: " + kind + ": " + e.getMessage()
                    + " (first of its kind; later ones are only counted)");
        }
        a.increment();
    }

    // ------------------------------------------------------------------------------------ counts and end

    /**
     * What became of what was given to the share.
     *
     * @param packetsSent    packets handed to the producer
     * @param recordsSent    start, event, view and dictionary records handed to the producer
     * @param delivered      records (of both) the brokers acknowledged
     * @param notShared      datagrams that found the queue full or were too long, records refused for too many
     *                       waiting, and what was still queued at the end: never handed to the producer
     * @param failed         records the producer gave up on, plus failed attempts to create the topics
     * @param failuresByKind the failures by kind (exception simple name, or {@code topics})
     */
    public record Counts(long packetsSent, long recordsSent, long delivered, long notShared, long failed,
                         Map<String, Long> failuresByKind) {
    }

    public Counts counts() {
        Map<String, Long> byKind = new TreeMap<>();
        failures.forEach((k, v) -> byKind.put(k, v.sum()));
        long failed = 0;
        for (long v : byKind.values()) {
            failed += v;
        }
        return new Counts(packetsSent.sum(), recordsSent.sum(), delivered.sum(),
                packets.droppedFull() + packets.droppedOversize() + recordsRefused.get() + leftAtClose.get(), failed,
                byKind);
    }

    /** One line for the end of a run. */
    public String summary() {
        Counts c = counts();
        return String.format(Locale.ROOT, "shared on %s: %d packets and %d records sent, %d delivered; "
                + "not shared %d (queue full), failed %d%s", where, c.packetsSent(), c.recordsSent(), c.delivered(),
                c.notShared(), c.failed(), c.failuresByKind().isEmpty() ? "" : " " + c.failuresByKind());
    }

    /**
     * Sends what is queued, waits up to 5 s for the brokers to take it, and stops. What is still not delivered
     * then is counted as failed.
     */
    @Override
    public void close() {
        if (stopping) {
            return;
        }
        stopping = true;
        LockSupport.unpark(thread);
        try {
            thread.join(CLOSE_TIMEOUT.toMillis());
            if (thread.isAlive()) {
                thread.interrupt();
                thread.join(CLOSE_TIMEOUT.toMillis());
            }
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
        if (!thread.isAlive()) {
            leftAtClose.addAndGet(packets.depth() + Math.max(0, pendingRecords.get()));
        }
        try {
            producer.close(CLOSE_TIMEOUT);
        } catch (KafkaException e) {
            fail(e);
        }
    }
}
