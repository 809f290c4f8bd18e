package org.pointcall.ingest.pipeline;

import java.time.Duration;

import org.pointcall.ingest.udp.UdpSource;
import org.pointcall.ingest.wire.DecodeCounters;
import org.pointcall.ingest.wire.DecodeResult;
import org.pointcall.ingest.wire.PacketDecoder;

import io.micrometer.core.instrument.FunctionCounter;
import io.micrometer.core.instrument.Gauge;
import io.micrometer.core.instrument.MeterRegistry;
import io.micrometer.core.instrument.Tags;
import io.micrometer.core.instrument.Timer;

/**
 * Micrometer meters over the ingest counters. The counters stay plain fields on the hot path; the meters read them
 * when a registry is scraped or the console polls, so instrumentation costs the pipeline nothing per frame.
 *
 * <p>Names: {@code pointcall.ingest.*}, tagged with {@code source}.
 */
public final class IngestMetrics {
    public static final String PREFIX = "pointcall.ingest.";

    private IngestMetrics() {
    }

    /** Timer of arrival to features ready, with percentiles for the console's stream health. */
    public static Timer latencyTimer(MeterRegistry registry, String source) {
        return Timer.builder(PREFIX + "latency")
                .description("datagram arrival to features ready")
                .tags(Tags.of("source", source))
                .publishPercentiles(0.5, 0.99)
                .distributionStatisticExpiry(Duration.ofSeconds(10))
                .register(registry);
    }

    public static void bindUdp(MeterRegistry registry, String source, UdpSource udp) {
        Tags t = Tags.of("source", source);
        FunctionCounter.builder(PREFIX + "datagrams.received", udp, UdpSource::datagrams).tags(t)
                .description("datagrams read from the socket").register(registry);
        FunctionCounter.builder(PREFIX + "datagrams.rejected", udp, UdpSource::rejectedSenders).tags(t)
                .description("datagrams from senders not on the allow-list, dropped").register(registry);
        FunctionCounter.builder(PREFIX + "receive.errors", udp, UdpSource::receiveErrors).tags(t)
                .register(registry);
    }

    public static void bindPipeline(MeterRegistry registry, String source, PacketPipeline pipeline) {
        Tags t = Tags.of("source", source);
        PacketQueue q = pipeline.queue();
        FunctionCounter.builder(PREFIX + "dropped", pipeline, PacketPipeline::droppedQueueFull).tags(t)
                .description("datagrams dropped because the pipeline queue was full").register(registry);
        Gauge.builder(PREFIX + "queue.depth", q, PacketQueue::depth).tags(t)
                .description("datagrams waiting for the pipeline thread").register(registry);
        Gauge.builder(PREFIX + "queue.high.water", q, PacketQueue::highWater).tags(t).register(registry);
        bindDecoder(registry, source, pipeline.decoder());
    }

    public static void bindDecoder(MeterRegistry registry, String source, PacketDecoder decoder) {
        Tags t = Tags.of("source", source);
        DecodeCounters c = decoder.counters();
        FunctionCounter.builder(PREFIX + "packets.decoded", c, x -> x.datagrams() - x.faults()).tags(t)
                .description("packets decoded without fault").register(registry);
        FunctionCounter.builder(PREFIX + "frames.decoded", c, DecodeCounters::framesDelivered).tags(t)
                .register(registry);
        FunctionCounter.builder(PREFIX + "frames.partial", c, DecodeCounters::framesPartial).tags(t)
                .description("frames delivered with some parts lost (NaN in their slots)").register(registry);
        FunctionCounter.builder(PREFIX + "frames.late", c, DecodeCounters::framesLate).tags(t)
                .description("frames that arrived after a later one and were dropped").register(registry);
        FunctionCounter.builder(PREFIX + "sequence.lost", decoder, d -> d.sequenceTotals().lost()).tags(t)
                .description("packets missing from the sequence numbers").register(registry);
        FunctionCounter.builder(PREFIX + "sequence.gaps", decoder, d -> d.sequenceTotals().gapEvents()).tags(t)
                .register(registry);
        for (DecodeResult r : DecodeResult.values()) {
            if (r.isFault()) {
                FunctionCounter.builder(PREFIX + "decode.errors", c, x -> x.get(r))
                        .tags(t.and("kind", r.name().toLowerCase(java.util.Locale.ROOT))).register(registry);
            }
        }
    }
}
