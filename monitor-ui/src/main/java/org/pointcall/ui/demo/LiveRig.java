package org.pointcall.ui.demo;

import java.util.ArrayList;
import java.util.List;

import org.pointcall.ingest.frame.FrameSink;
import org.pointcall.ingest.pipeline.IngestMetrics;
import org.pointcall.ingest.pipeline.PacketPipeline;
import org.pointcall.ingest.pipeline.StreamStage;
import org.pointcall.ingest.pipeline.StreamStages;
import org.pointcall.ingest.udp.UdpSource;
import org.pointcall.ingest.udp.UdpSourceConfig;
import org.pointcall.ingest.window.ExtractorSettings;
import org.pointcall.ingest.window.FeatureListener;
import org.pointcall.ingest.window.WindowSpec;
import org.pointcall.ingest.wire.DecoderOptions;
import org.pointcall.ingest.wire.DictionaryRegistry;
import org.pointcall.ingest.wire.FaultLog;
import org.pointcall.shared.dictionary.DictionaryFiles;

import io.micrometer.core.instrument.MeterRegistry;
import io.micrometer.core.instrument.Timer;
import io.micrometer.core.instrument.simple.SimpleMeterRegistry;

/**
 * The live receive side on one UDP port: socket, bounded queue, pipeline thread, per-stream stage with the frame
 * taps it is given (chart tap, session, recorder), and the ingest meters the console's stream health reads.
 */
public final class LiveRig implements AutoCloseable {
    /** The source tag of the meters. */
    public static final String SOURCE = "live";

    private final MeterRegistry meters = new SimpleMeterRegistry();
    private final UdpSource udp;
    private final PacketPipeline pipeline;
    private final StreamStages stages;

    /**
     * @param port     UDP port on 127.0.0.1, 0 for any free one
     * @param taps     frame consumers on the pipeline thread, after derivation
     * @param windows  feature windows (empty for none)
     * @param features listener of the features at each decision tick, or {@code null}
     * @param faults   where fault lines go (rate-limited)
     */
    public LiveRig(int port, List<FrameSink> taps, List<WindowSpec> windows, FeatureListener features,
                   java.util.function.Consumer<String> faults) {
        FaultLog log = new FaultLog(faults, FaultLog.DEFAULT_MAX_LINES, FaultLog.DEFAULT_WINDOW_NS);
        Timer latency = IngestMetrics.latencyTimer(meters, SOURCE);
        List<FrameSink> tapList = new ArrayList<>(taps);
        stages = new StreamStages((id, d) -> new StreamStage(id, d, windows, ExtractorSettings.defaults(), tapList,
                features, latency, System::nanoTime));
        pipeline = new PacketPipeline(SOURCE, new DictionaryRegistry(), DictionaryFiles::parse, stages,
                DecoderOptions.DEFAULT, PacketPipeline.DEFAULT_QUEUE_PACKETS, log, System::nanoTime);
        udp = new UdpSource(UdpSourceConfig.loopback(port), pipeline, log, System::nanoTime);
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

    public StreamStages stages() {
        return stages;
    }

    /** Waits until what was received has gone through the pipeline (at most {@code timeoutNs}). */
    public boolean awaitDrained(long timeoutNs) {
        return pipeline.awaitDrained(timeoutNs);
    }

    @Override
    public void close() {
        udp.stop();
        pipeline.close();
    }
}
