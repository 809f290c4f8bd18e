package org.pointcall.replay.play;

import java.nio.ByteBuffer;
import java.util.concurrent.locks.LockSupport;

import org.pointcall.ingest.kafka.KafkaFrameSink;
import org.pointcall.ingest.pipeline.PacketPipeline;
import org.pointcall.ingest.pipeline.PacketQueue;
import org.pointcall.ingest.udp.UdpSender;
import org.pointcall.ingest.wire.DictionaryRegistry;
import org.pointcall.ingest.wire.PacketDecoder;
import org.pointcall.ingest.wire.PacketSink;
import org.pointcall.ingest.wire.StreamFrameSink;
import org.pointcall.ingest.wire.WireFormat;
import org.pointcall.shared.dictionary.DictionaryFiles;

/** The places a replay can go: a packet sink, the in-process pipeline, UDP, Kafka. */
public final class ReplayTargets {
    private ReplayTargets() {
    }

    /** Any packet sink (a {@link UdpSender} is one: the wire format over UDP). */
    public static ReplayTarget packets(PacketSink sink) {
        return (p, t) -> sink.onPacket(p);
    }

    /** Over UDP in the wire format; closes the sender at the end. */
    public static ReplayTarget udp(UdpSender sender) {
        return new ReplayTarget() {
            @Override
            public void onPacket(ByteBuffer packet, long dataTimeNs) {
                sender.onPacket(packet);
            }

            @Override
            public void close() {
                sender.close();
            }
        };
    }

    /**
     * Decoded on the replay thread, which then is the pipeline thread: the decoder's sink (a StreamStages) runs
     * derivation, windows and whatever follows. The receive time handed on is the packet's data time.
     */
    public static ReplayTarget decoder(PacketDecoder decoder, Object origin) {
        return new ReplayTarget() {
            @Override
            public void onPacket(ByteBuffer packet, long dataTimeNs) {
                decoder.decode(packet, origin, dataTimeNs);
            }

            @Override
            public void flush() {
                decoder.flushPending();
            }
        };
    }

    /**
     * Decoded into frames on the replay thread: dictionaries are those given in {@code registry} and those the
     * stream announces. {@link StreamFrameSink#of} adapts a plain frame sink.
     */
    public static ReplayTarget frames(DictionaryRegistry registry, StreamFrameSink sink) {
        return decoder(new PacketDecoder(registry, DictionaryFiles::parse, sink), "replay");
    }

    /**
     * Into a running {@link PacketPipeline}'s queue, as a receiver would hand it packets, but waiting for room
     * rather than dropping: a replay may go faster than the pipeline and must not lose what it plays.
     */
    public static ReplayTarget pipeline(PacketPipeline pipeline) {
        PacketQueue q = pipeline.queue();
        return (p, t) -> {
            while (q.depth() >= q.capacity()) {
                LockSupport.parkNanos(50_000);
            }
            pipeline.onDatagram(p, REPLAY_ORIGIN, t);
        };
    }

    private static final java.net.InetSocketAddress REPLAY_ORIGIN =
            new java.net.InetSocketAddress(java.net.InetAddress.getLoopbackAddress(), 0);

    /** To Kafka, one record per packet keyed by the packet's stream id; flushes and closes the sink at the end. */
    public static ReplayTarget kafka(KafkaFrameSink sink) {
        return new ReplayTarget() {
            @Override
            public void onPacket(ByteBuffer packet, long dataTimeNs) {
                byte[] b = new byte[packet.remaining()];
                packet.get(packet.position(), b);
                sink.send(streamId(packet), b);
            }

            @Override
            public void flush() {
                sink.flush();
            }

            @Override
            public void close() {
                sink.close();
            }
        };
    }

    /** The stream id in a wire packet's header (0 when the packet is too short to hold one). */
    static int streamId(ByteBuffer p) {
        int off = 12;
        if (p.remaining() < off + 4) {
            return 0;
        }
        return p.duplicate().order(WireFormat.ORDER).getInt(p.position() + off);
    }
}
