package org.pointcall.ui.demo;

import java.util.Arrays;
import java.util.concurrent.TimeUnit;
import java.util.function.Consumer;

import org.pointcall.ingest.frame.Frame;
import org.pointcall.ingest.frame.FrameSink;
import org.pointcall.ingest.pipeline.IngestMetrics;
import org.pointcall.ingest.pipeline.PacketPipeline;
import org.pointcall.ingest.udp.DatagramHandler;
import org.pointcall.ingest.udp.UdpSource;
import org.pointcall.ingest.udp.UdpSourceConfig;
import org.pointcall.ingest.wire.DecoderOptions;
import org.pointcall.ingest.wire.DictionaryRegistry;
import org.pointcall.ingest.wire.FaultLog;
import org.pointcall.ingest.wire.StreamFrameSink;
import org.pointcall.shared.dictionary.DictionaryFiles;
import org.pointcall.shared.dictionary.ParameterDictionary;

import io.micrometer.core.instrument.MeterRegistry;
import io.micrometer.core.instrument.Timer;
import io.micrometer.core.instrument.simple.SimpleMeterRegistry;

/**
 * The live receive side on one UDP port: socket, optional recorder tee (the recorder copies every datagram on its
 * own thread and never holds the receiver up), bounded queue, pipeline thread, and per stream the frame consumer
 * its {@link StreamHost} gives (card session, then the console's taps). The ingest meters feed the console's stream
 * health; latency is arrival to the frame fully handled.
 */
public final class LiveRig implements AutoCloseable {
    /** The source tag of the meters. */
    public static final String SOURCE = "live";

    /** Makes the frame consumer of a stream when its dictionary is learnt; runs on the pipeline thread. */
    @FunctionalInterface
    public interface StreamHost {
        FrameSink onStream(int streamId, ParameterDictionary dictionary);
    }

    private final MeterRegistry meters = new SimpleMeterRegistry();
    private final UdpSource udp;
    private final PacketPipeline pipeline;

    /**
     * @param port     UDP port on 127.0.0.1, 0 for any free one
     * @param host     per-stream consumers
     * @param tee      sees every datagram before the pipeline (a recorder), or {@code null}
     * @param faults   where fault lines go (rate-limited)
     */
    public LiveRig(int port, StreamHost host, java.util.function.Function<DatagramHandler, DatagramHandler> tee,
                   Consumer<String> faults) {
        this(port, host, tee, faults, true);
    }

    /**
     * @param arrivalClock receive times are this machine's {@code System.nanoTime} (live); false for a replay fed
     *                     straight into the pipeline with archive times, where latency means nothing
     */
    public LiveRig(int port, StreamHost host, java.util.function.Function<DatagramHandler, DatagramHandler> tee,
                   Consumer<String> faults, boolean arrivalClock) {
        FaultLog log = new FaultLog(faults, FaultLog.DEFAULT_MAX_LINES, FaultLog.DEFAULT_WINDOW_NS);
        Timer latency = IngestMetrics.latencyTimer(meters, SOURCE);
        StreamFrameSink sink = new StreamFrameSink() {
            private int[] ids = new int[0];
            private FrameSink[] sinks = new FrameSink[0];

            @Override
            public void onDictionary(int streamId, ParameterDictionary dictionary) {
                FrameSink s = host.onStream(streamId, dictionary);
                for (int i = 0; i < ids.length; i++) {
                    if (ids[i] == streamId) {
                        sinks[i] = s;
                        return;
                    }
                }
                ids = Arrays.copyOf(ids, ids.length + 1);
                sinks = Arrays.copyOf(sinks, sinks.length + 1);
                ids[ids.length - 1] = streamId;
                sinks[sinks.length - 1] = s;
            }

            @Override
            public void onFrame(int streamId, Frame frame, long receiveTimeNs) {
                for (int i = 0; i < ids.length; i++) {
                    if (ids[i] == streamId) {
                        sinks[i].onFrame(frame);
                        if (arrivalClock) {
                            latency.record(System.nanoTime() - receiveTimeNs, TimeUnit.NANOSECONDS);
                        }
                        return;
                    }
                }
            }
        };
        pipeline = new PacketPipeline(SOURCE, new DictionaryRegistry(), DictionaryFiles::parse, sink,
                DecoderOptions.DEFAULT, PacketPipeline.DEFAULT_QUEUE_PACKETS, log, System::nanoTime);
        DatagramHandler in = tee == null ? pipeline : tee.apply(pipeline);
        udp = new UdpSource(UdpSourceConfig.loopback(port), in, log, System::nanoTime);
        IngestMetrics.bindUdp(meters, SOURCE, udp);
        IngestMetrics.bindPipeline(meters, SOURCE, pipeline);
    }

    public void start() {
        pipeline.start();
        udp.start();
    }

    public int port() {
        return udp.localPort();
    }

    public MeterRegistry meters() {
        return meters;
    }

    public PacketPipeline pipeline() {
        return pipeline;
    }

    /** Waits until what was received has gone through the pipeline (at most {@code timeoutNs}). */
    public boolean awaitDrained(long timeoutNs) {
        return pipeline.awaitDrained(timeoutNs);
    }

    /** Datagrams taken from the socket so far. */
    public long datagrams() {
        return udp.datagrams();
    }

    @Override
    public void close() {
        udp.stop();
        pipeline.close();
    }
}
