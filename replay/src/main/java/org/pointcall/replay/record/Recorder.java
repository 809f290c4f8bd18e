package org.pointcall.replay.record;

import java.io.IOException;
import java.net.InetSocketAddress;
import java.nio.ByteBuffer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.util.ArrayDeque;
import java.util.Locale;
import java.util.concurrent.ConcurrentLinkedQueue;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.concurrent.locks.LockSupport;
import java.util.function.LongSupplier;

import org.pointcall.ingest.pipeline.PacketQueue;
import org.pointcall.ingest.udp.DatagramHandler;
import org.pointcall.ingest.udp.SenderTags;
import org.pointcall.replay.archive.ArchiveFormat;
import org.pointcall.replay.archive.ArchiveWriter;
import org.pointcall.replay.archive.ChunkBuilder;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.PointcallException;

/**
 * Records a live stream into a sortie archive, on its own thread. Packets are taken as they arrive, before any
 * decoding: the receiving thread copies each into a bounded single-producer/single-consumer {@link PacketQueue}
 * and never waits; when the queue is full the packet is counted and an {@link AlarmKind#QUEUE_OVERFLOW} alarm is
 * raised. Typed records (events, verdicts, alarms, operator calls, notes) come from any thread through
 * {@link #appendRecord}.
 *
 * <p>The recorder thread packs records into chunks, seals a chunk when it is full or {@link
 * RecorderPolicy#maxChunkAgeNs()} old, writes it and (by default) syncs it. When the file system refuses a write
 * (disk full, device gone) it raises {@link AlarmKind#WRITE_FAILED}, keeps the sealed chunks in memory up to
 * {@link RecorderPolicy#memoryLimitBytes()} (giving up the oldest beyond it, {@link AlarmKind#MEMORY_FULL}), tries
 * again every {@link RecorderPolicy#retryIntervalNs()}, and says {@link AlarmKind#WRITING_AGAIN} when the held
 * data is on disk, also leaving a {@value #LOSS_RECORD} record in the archive with what was lost.
 *
 * <p>Attach it in front of a pipeline with {@link #tee}, or hand it packets with {@link #onDatagram} /
 * {@link #offer} from one producer thread.
 */
public final class Recorder implements DatagramHandler, AutoCloseable {
    /** Type of the record the recorder leaves when it lost data. */
    public static final String LOSS_RECORD = "recorder.loss";
    private static final int MAX_PENDING_RECORDS = 100_000;
    private static final long IDLE_PARK_NS = 1_000_000L;
    private static final long ALARM_REPEAT_NS = 1_000_000_000L;
    private static final DateTimeFormatter NAME = DateTimeFormatter.ofPattern("'sortie-'yyyyMMdd'T'HHmmss'Z'",
            Locale.ROOT).withZone(ZoneOffset.UTC);

    private final Path file;
    private final long startClockNs;
    private final RecorderPolicy policy;
    private final LongSupplier clock;
    private final RecorderListener listener;
    private final PacketQueue queue;
    private final ConcurrentLinkedQueue<Pending> pending = new ConcurrentLinkedQueue<>();
    private final AtomicInteger pendingCount = new AtomicInteger();
    private final ArchiveWriter writer;
    private final ChunkBuilder chunk;
    private final ArrayDeque<Sealed> held = new ArrayDeque<>();
    private final Thread thread;
    private final PacketQueue.Handler take = this::take;
    private volatile boolean stopping;
    private volatile Throwable failure;

    // written by the recorder thread only, read by stats() from anywhere
    private volatile long packetsTaken;
    private volatile long packetsWritten;
    private volatile long lostDiskFull;
    private volatile long records;
    private volatile long chunksWritten;
    private volatile long heldBytes;
    private volatile long writeFailures;
    private final java.util.concurrent.atomic.AtomicLong recordsRefused = new java.util.concurrent.atomic.AtomicLong();

    private int nextChunk;
    private long chunkOpenedNs;
    private long now;
    private long retryAtNs;
    private boolean failing;
    private long failingSinceNs;
    private long lostAtFailureStart;
    private long lostFirstNs = Long.MAX_VALUE;
    private long lostLastNs = Long.MIN_VALUE;
    private long reportedOverflow;
    private long reportedOversize;
    private long lastOverflowAlarmNs = Long.MIN_VALUE;
    private long lastMemoryAlarmNs = Long.MIN_VALUE;

    private Recorder(Path file, RecorderPolicy policy, LongSupplier clock, RecorderListener listener,
                     ArchiveWriter writer, long startClockNs) {
        this.file = file;
        this.startClockNs = startClockNs;
        this.policy = policy;
        this.clock = clock;
        this.listener = listener;
        this.writer = writer;
        this.queue = new PacketQueue(policy.queuePackets(), policy.maxPacketBytes());
        this.chunk = new ChunkBuilder(policy.maxChunkBytes());
        this.thread = new Thread(this::run, "recorder-" + file.getFileName());
        this.thread.setDaemon(true);
    }

    /**
     * Creates the archive {@code file} (it must not exist) and starts recording.
     *
     * @param clockNs the clock that stamps arrival times (the same the receiver uses), e.g. {@code System::nanoTime}
     * @throws PointcallException when the archive cannot be created (one line naming it)
     */
    public static Recorder start(Path file, RecorderPolicy policy, LongSupplier clockNs, RecorderListener listener) {
        ArchiveWriter w;
        long start;
        try {
            Path parent = file.toAbsolutePath().getParent();
            if (parent != null) {
                Files.createDirectories(parent);
            }
            start = clockNs.getAsLong();
            w = ArchiveWriter.create(file, System.currentTimeMillis(), start);
        } catch (java.nio.file.FileAlreadyExistsException e) {
            throw new PointcallException(file + ": an archive of that name exists already; archives are never "
                    + "overwritten");
        } catch (IOException e) {
            throw new PointcallException(file + ": cannot create the sortie archive: " + e.getMessage(), e);
        }
        Recorder r = new Recorder(file, policy, clockNs, listener, w, start);
        r.thread.start();
        return r;
    }

    /** Starts recording into a new archive in {@code dir}, named by the UTC time now (sortie-YYYYMMDDTHHMMSSZ). */
    public static Recorder startIn(Path dir, RecorderPolicy policy, LongSupplier clockNs, RecorderListener listener) {
        return start(newArchivePath(dir, Instant.now()), policy, clockNs, listener);
    }

    /** A free archive name in {@code dir} for a recording started at {@code at}. */
    public static Path newArchivePath(Path dir, Instant at) {
        String base = NAME.format(at);
        Path p = dir.resolve(base + ArchiveFormat.EXTENSION);
        for (int i = 2; Files.exists(p); i++) {
            p = dir.resolve(base + "-" + i + ArchiveFormat.EXTENSION);
        }
        return p;
    }

    public Path file() {
        return file;
    }

    public RecorderPolicy policy() {
        return policy;
    }

    /** Id of the recorder thread (to read its CPU time). */
    public long threadId() {
        return thread.getId();
    }

    /** Receiver side: copies the packet into the queue, or counts it. Never blocks. One producer thread. */
    @Override
    public void onDatagram(ByteBuffer datagram, InetSocketAddress sender, long receiveTimeNs) {
        queue.offer(datagram, receiveTimeNs, SenderTags.pack(sender));
    }

    /**
     * As {@link #onDatagram} for packets from a source without a sender address (Kafka, a replay).
     *
     * @return false when the packet was not taken (queue full or packet too long; counted)
     */
    public boolean offer(ByteBuffer packet, long arrivalNs) {
        return queue.offer(packet, arrivalNs, 0L);
    }

    /** The recorder is told nothing when a receiver stops: a recording ends with {@link #close}. */
    @Override
    public void onStop() {
    }

    /** A handler that records each datagram, then hands it to {@code next} (a pipeline, usually). */
    public DatagramHandler tee(DatagramHandler next) {
        return new DatagramHandler() {
            @Override
            public void onDatagram(ByteBuffer datagram, InetSocketAddress sender, long receiveTimeNs) {
                queue.offer(datagram, receiveTimeNs, SenderTags.pack(sender));
                next.onDatagram(datagram, sender, receiveTimeNs);
            }

            @Override
            public void onStop() {
                next.onStop();
            }
        };
    }

    /**
     * Stores a typed record: {@code type} names it (letters, digits, '.', '-', '_'; for example {@code event},
     * {@code verdict}, {@code alarm}, {@code call}, {@code note}), {@code json} is its payload, stored as given.
     * Any thread; never blocks.
     *
     * @param timeNs the producer's own time of the record (data time, usually); the recorder also stamps when it
     *               took it, on the archive clock
     * @return false when over {@value #MAX_PENDING_RECORDS} records wait to be taken (the record is counted, not kept)
     * @throws IllegalStateException after {@link #close}
     */
    public boolean appendRecord(String type, long timeNs, byte[] json) {
        byte[] tag = ChunkBuilder.tagBytes(type);
        if (json.length > ArchiveFormat.MAX_BODY_BYTES) {
            throw new IllegalArgumentException("record of type " + type + " has " + json.length
                    + " bytes, more than the " + ArchiveFormat.MAX_BODY_BYTES + " a record may hold");
        }
        return enqueue(new Pending(ArchiveFormat.KIND_TYPED, tag, json.clone(), timeNs, clock.getAsLong()));
    }

    /** Stores a dictionary the receiver was given up front, as its text (the same text an announce carries). */
    public boolean recordDictionary(ParameterDictionary dictionary, String text) {
        return enqueue(new Pending(ArchiveFormat.KIND_DICTIONARY, null, text.getBytes(StandardCharsets.UTF_8),
                dictionary.hash(), clock.getAsLong()));
    }

    private boolean enqueue(Pending p) {
        if (stopping) {
            throw new IllegalStateException("recorder of " + file + " is closed");
        }
        return take(p);
    }

    private boolean take(Pending p) {
        if (pendingCount.incrementAndGet() > MAX_PENDING_RECORDS) {
            pendingCount.decrementAndGet();
            recordsRefused.incrementAndGet();
            return false;
        }
        pending.add(p);
        return true;
    }

    public RecorderStats stats() {
        return new RecorderStats(packetsTaken, packetsWritten, queue.droppedFull(), queue.droppedOversize(),
                lostDiskFull, records, chunksWritten, writer.committedBytes(), heldBytes, writeFailures);
    }

    /** Deepest the queue has been. */
    public long queueHighWater() {
        return queue.highWater();
    }

    /**
     * Takes what is queued, writes it and syncs, closes the archive and writes its index. Waits for the recorder
     * thread. When the disk still refuses the last chunks they are lost and said so by an alarm. Idempotent.
     */
    @Override
    public void close() {
        stopping = true;
        LockSupport.unpark(thread);
        try {
            thread.join();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
        Throwable f = failure;
        if (f != null) {
            throw new PointcallException("recorder of " + file + " failed: " + f, f);
        }
    }

    private void run() {
        try {
            loop();
        } catch (RuntimeException | Error e) {
            failure = e;
            alarm(AlarmKind.WRITE_FAILED, "recorder of " + file + " stopped on an internal error (" + e
                    + "); later packets are not recorded");
        } finally {
            try {
                writer.close();
            } catch (IOException e) {
                alarm(AlarmKind.WRITE_FAILED, "closing " + file + " failed: " + e.getMessage()
                        + "; the archive opens anyway, its index is rebuilt by scanning");
            }
        }
    }

    private void loop() {
        while (true) {
            now = clock.getAsLong();
            int n = queue.drain(take, 1024);
            int r = takeRecords();
            checkDrops();
            if (!chunk.isEmpty() && now - chunkOpenedNs >= policy.maxChunkAgeNs()) {
                seal();
            }
            writeHeld(false);
            if (n == 0 && r == 0) {
                if (stopping && queue.depth() == 0 && pending.isEmpty()) {
                    break;
                }
                LockSupport.parkNanos(IDLE_PARK_NS);
            }
        }
        for (int pass = 0; pass < 2; pass++) {
            // a second pass writes the loss record a successful last write may have left
            takeRecords();
            if (!chunk.isEmpty()) {
                seal();
            }
            writeHeld(true);
        }
        if (!held.isEmpty()) {
            long lost = 0;
            for (Sealed s : held) {
                lost += s.packets;
            }
            lostDiskFull += lost;
            alarm(AlarmKind.WRITE_FAILED, "recording of " + file + " closed with " + held.size()
                    + " chunks (" + lost + " packets) still refused by the file system: they are lost");
            held.clear();
            heldBytes = 0;
        }
    }

    private void take(ByteBuffer packet, long arrivalNs, long tag) {
        int len = packet.remaining();
        if (!chunk.fits(0, len)) {
            seal();
        }
        if (chunk.isEmpty()) {
            chunkOpenedNs = now;
        }
        chunk.addPacket(packet, arrivalNs, tag);
        packetsTaken++;
        if (chunk.full()) {
            seal();
        }
    }

    private int takeRecords() {
        int n = 0;
        Pending p;
        while ((p = pending.poll()) != null) {
            pendingCount.decrementAndGet();
            int tagBytes = p.tag == null ? 0 : p.tag.length;
            if (!chunk.fits(tagBytes, p.body.length)) {
                seal();
            }
            if (chunk.isEmpty()) {
                chunkOpenedNs = now;
            }
            if (p.kind == ArchiveFormat.KIND_TYPED) {
                chunk.addTyped(p.tag, p.body, p.takenNs, p.extra);
            } else {
                chunk.addDictionary(p.extra, p.body, p.takenNs);
            }
            records++;
            n++;
            if (chunk.full()) {
                seal();
            }
        }
        return n;
    }

    private void seal() {
        int packets = chunk.packets();
        long t0 = chunk.firstTimeNs();
        long t1 = chunk.lastTimeNs();
        byte[] bytes = chunk.seal(nextChunk++);
        held.addLast(new Sealed(bytes, packets, t0, t1));
        heldBytes += bytes.length;
        while (heldBytes > policy.memoryLimitBytes() && held.size() > 1) {
            Sealed gone = held.pollFirst();
            heldBytes -= gone.bytes.length;
            lostDiskFull += gone.packets;
            lostFirstNs = Math.min(lostFirstNs, gone.firstTimeNs);
            lostLastNs = Math.max(lostLastNs, gone.lastTimeNs);
            if (now - lastMemoryAlarmNs >= ALARM_REPEAT_NS || lastMemoryAlarmNs == Long.MIN_VALUE) {
                lastMemoryAlarmNs = now;
                alarm(AlarmKind.MEMORY_FULL, "recorder memory for " + file + " is full ("
                        + (policy.memoryLimitBytes() >> 20) + " MiB held while the disk refuses writes): the oldest "
                        + "held data is given up, " + lostDiskFull + " packets so far");
            }
        }
    }

    private void writeHeld(boolean closing) {
        if (held.isEmpty() || (!closing && failing && now < retryAtNs)) {
            return;
        }
        boolean wrote = false;
        while (!held.isEmpty()) {
            Sealed s = held.peekFirst();
            try {
                writer.write(s.bytes);
            } catch (IOException e) {
                onWriteFailure(e);
                return;
            }
            held.pollFirst();
            heldBytes -= s.bytes.length;
            packetsWritten += s.packets;
            chunksWritten++;
            wrote = true;
        }
        if (wrote && policy.sync() == SyncMode.EACH_CHUNK) {
            try {
                writer.sync();
            } catch (IOException e) {
                onWriteFailure(e);
                return;
            }
        }
        if (failing) {
            failing = false;
            long lost = lostDiskFull - lostAtFailureStart;
            String span = lost == 0 ? "" : String.format(Locale.ROOT, " (those that arrived %.3f s to %.3f s into "
                    + "the recording)", (lostFirstNs - startClockNs) / 1e9, (lostLastNs - startClockNs) / 1e9);
            alarm(AlarmKind.WRITING_AGAIN, "writing " + file + " again after "
                    + String.format(Locale.ROOT, "%.1f s", (now - failingSinceNs) / 1e9) + "; the data held in memory"
                    + " is on disk; " + (lost == 0 ? "nothing was lost" : lost + " packets were lost" + span));
            String json = "{\"failedAtNs\":" + failingSinceNs + ",\"resumedAtNs\":" + now + ",\"packetsLost\":"
                    + lost + (lost == 0 ? "" : ",\"lostFromNs\":" + lostFirstNs + ",\"lostToNs\":" + lostLastNs) + "}";
            take(new Pending(ArchiveFormat.KIND_TYPED, ChunkBuilder.tagBytes(LOSS_RECORD),
                    json.getBytes(StandardCharsets.UTF_8), now, now));
        }
    }

    private void onWriteFailure(IOException e) {
        writeFailures++;
        retryAtNs = now + policy.retryIntervalNs();
        if (!failing) {
            failing = true;
            failingSinceNs = now;
            lostAtFailureStart = lostDiskFull;
            lostFirstNs = Long.MAX_VALUE;
            lostLastNs = Long.MIN_VALUE;
            alarm(AlarmKind.WRITE_FAILED, "RECORDING AT RISK: cannot write " + file + ": " + e.getMessage()
                    + (e.getMessage() != null && e.getMessage().contains("space") ? "" : " (disk full?)")
                    + "; keeping the newest data in memory (up to " + (policy.memoryLimitBytes() >> 20)
                    + " MiB) and retrying every "
                    + String.format(Locale.ROOT, "%.1f s", policy.retryIntervalNs() / 1e9));
        }
    }

    private void checkDrops() {
        long over = queue.droppedFull();
        long size = queue.droppedOversize();
        if ((over > reportedOverflow || size > reportedOversize)
                && (lastOverflowAlarmNs == Long.MIN_VALUE || now - lastOverflowAlarmNs >= ALARM_REPEAT_NS)) {
            lastOverflowAlarmNs = now;
            if (over > reportedOverflow) {
                alarm(AlarmKind.QUEUE_OVERFLOW, "recorder of " + file + " fell behind: " + over
                        + " packets not recorded so far (its queue of " + queue.capacity() + " was full)");
            }
            if (size > reportedOversize) {
                alarm(AlarmKind.OVERSIZE, "recorder of " + file + ": " + size + " packets longer than "
                        + policy.maxPacketBytes() + " bytes not recorded so far");
            }
            reportedOverflow = over;
            reportedOversize = size;
        }
    }

    private void alarm(AlarmKind kind, String message) {
        try {
            listener.onAlarm(new RecorderAlarm(kind, now, message));
        } catch (RuntimeException ignored) {
            // a failing listener must not stop the recording
        }
    }

    private record Pending(int kind, byte[] tag, byte[] body, long extra, long takenNs) {
    }

    private record Sealed(byte[] bytes, int packets, long firstTimeNs, long lastTimeNs) {
    }
}
