package org.pointcall.ingest.pipeline;

import java.net.InetSocketAddress;
import java.nio.ByteBuffer;
import java.util.concurrent.locks.LockSupport;
import java.util.function.LongSupplier;

import org.pointcall.ingest.udp.DatagramHandler;
import org.pointcall.ingest.udp.SenderTags;
import org.pointcall.ingest.wire.DecoderOptions;
import org.pointcall.ingest.wire.DictionaryDecoder;
import org.pointcall.ingest.wire.DictionaryRegistry;
import org.pointcall.ingest.wire.FaultLog;
import org.pointcall.ingest.wire.PacketDecoder;
import org.pointcall.ingest.wire.StreamFrameSink;

/**
 * The live pipeline of one source: the receiver thread offers datagrams to a bounded {@link PacketQueue}; one
 * pipeline thread drains it, decodes and runs each stream's {@link StreamStage}.
 *
 * <p>The receiver never waits: a datagram that finds the queue full is dropped and counted
 * ({@link #droppedQueueFull()}) and an operator-visible line is logged, rate-limited. Streams of one source share
 * its pipeline thread; give heavy streams their own source (port) to spread them over cores.
 */
public final class PacketPipeline implements DatagramHandler, AutoCloseable {
    /** Default queue: 8192 datagrams, about 0.4 s of W1 (two packets a frame at 1,000 frames/s) behind. */
    public static final int DEFAULT_QUEUE_PACKETS = 8192;

    private final PacketQueue queue;
    private final PacketDecoder decoder;
    private final FaultLog log;
    private final LongSupplier nowNs;
    private final SenderTag origin = new SenderTag();
    private final Thread thread;
    private volatile boolean stopping;
    private volatile boolean receiverDone;

    /**
     * @param sink where decoded frames go, usually a {@link StreamStages}
     */
    public PacketPipeline(String name, DictionaryRegistry registry, DictionaryDecoder parser, StreamFrameSink sink,
                          DecoderOptions options, int queuePackets, FaultLog log, LongSupplier nowNs) {
        this.queue = new PacketQueue(queuePackets, options.maxDatagramBytes() + 1);
        this.decoder = new PacketDecoder(registry, parser, sink, options, log);
        this.log = log;
        this.nowNs = nowNs;
        this.thread = new Thread(this::drainLoop, "pipeline-" + name);
        this.thread.setDaemon(true);
    }

    public PacketDecoder decoder() {
        return decoder;
    }

    public PacketQueue queue() {
        return queue;
    }

    public void start() {
        thread.start();
    }

    /** Receiver side: copies the datagram into the queue, or counts it as dropped. Never blocks. */
    @Override
    public void onDatagram(ByteBuffer datagram, InetSocketAddress sender, long receiveTimeNs) {
        if (!queue.offer(datagram, receiveTimeNs, SenderTags.pack(sender))) {
            if (log.admit(receiveTimeNs)) {
                log.emit("pipeline queue full (" + queue.capacity() + " packets): datagram from " + sender
                        + " dropped; " + (queue.droppedFull() + queue.droppedOversize())
                        + " dropped so far; the pipeline is not keeping up");
            }
        }
    }

    /** Receiver side: no more datagrams will come. The pipeline drains what is queued, then stops. */
    @Override
    public void onStop() {
        receiverDone = true;
    }

    private void drainLoop() {
        PacketQueue.Handler h = (buf, arrivalNs, tag) -> {
            origin.set(tag);
            decoder.decode(buf, origin, arrivalNs);
        };
        int idle = 0;
        while (true) {
            int n = queue.drain(h, 256);
            if (n > 0) {
                idle = 0;
                continue;
            }
            if ((stopping || receiverDone) && queue.depth() == 0) {
                break;
            }
            // Idle strategy: spin briefly, then yield, then park 50 us (Agrona-style back-off).
            if (++idle < 100) {
                Thread.onSpinWait();
            } else if (idle < 200) {
                Thread.yield();
            } else {
                LockSupport.parkNanos(50_000);
            }
        }
        decoder.flushPending();
    }

    /** Datagrams dropped because the queue was full or they were larger than a slot. */
    public long droppedQueueFull() {
        return queue.droppedFull() + queue.droppedOversize();
    }

    /** Stops after draining what is queued, and waits for the pipeline thread. */
    @Override
    public void close() {
        stopping = true;
        try {
            thread.join(10_000);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
    }

    /** Waits until the queue is empty (for tests and replay at full speed); returns false on time-out. */
    public boolean awaitDrained(long timeoutNs) {
        long end = nowNs.getAsLong() + timeoutNs;
        while (queue.depth() > 0) {
            if (nowNs.getAsLong() > end) {
                return false;
            }
            LockSupport.parkNanos(100_000);
        }
        return true;
    }

    /** The sender of the packet being decoded, as a {@link SenderTags} long. */
    static final class SenderTag {
        private long tag;

        void set(long t) {
            tag = t;
        }

        /** Only called when a log line is written. */
        @Override
        public String toString() {
            return SenderTags.format(tag);
        }
    }
}
