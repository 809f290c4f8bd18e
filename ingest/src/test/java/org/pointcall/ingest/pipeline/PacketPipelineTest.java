package org.pointcall.ingest.pipeline;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicLong;

import org.junit.jupiter.api.Test;
import org.pointcall.ingest.frame.Frame;
import org.pointcall.ingest.frame.FrameSink;
import org.pointcall.ingest.udp.UdpSender;
import org.pointcall.ingest.udp.UdpSenderConfig;
import org.pointcall.ingest.udp.UdpSource;
import org.pointcall.ingest.udp.UdpSourceConfig;
import org.pointcall.ingest.window.ExtractorSettings;
import org.pointcall.ingest.window.WindowSpec;
import org.pointcall.ingest.wire.DecoderOptions;
import org.pointcall.ingest.wire.DictionaryRegistry;
import org.pointcall.ingest.wire.FaultLog;
import org.pointcall.ingest.wire.StreamEncoder;
import org.pointcall.ingest.wire.WireOptions;
import org.pointcall.shared.airdata.AirData;
import org.pointcall.shared.atmosphere.StandardAtmosphere;
import org.pointcall.shared.demo.DemoFiles;
import org.pointcall.shared.dictionary.DictionaryFiles;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.units.Units;

import io.micrometer.core.instrument.MeterRegistry;
import io.micrometer.core.instrument.Timer;
import io.micrometer.core.instrument.simple.SimpleMeterRegistry;

/** The live path end to end on real loopback sockets: sender, receiver, queue, decoder, derive, windows, meters. */
class PacketPipelineTest {
    private final ParameterDictionary dict = DemoFiles.dictionary();
    private final String dictText = DictionaryFiles.toYaml(dict);

    private final class Rig implements AutoCloseable {
        final MeterRegistry meters = new SimpleMeterRegistry();
        final List<String> log = new ArrayList<>();
        final AtomicLong featureTicks = new AtomicLong();
        final AtomicLong framesSeen = new AtomicLong();
        volatile double lastHpFt = Double.NaN;
        final PacketPipeline pipeline;
        final UdpSource udp;
        final StreamStages stages;

        Rig(int queuePackets, FrameSink slowTap) {
            FaultLog faults = new FaultLog(line -> {
                synchronized (log) {
                    log.add(line);
                }
            }, 20, 1_000_000_000L);
            Timer latency = IngestMetrics.latencyTimer(meters, "test");
            int hp = dict.indexOf("Hp");
            stages = new StreamStages((id, d) -> new StreamStage(id, d,
                    List.of(WindowSpec.of("KCAS", 0.5, 2.0), WindowSpec.of("Hp", 2.0)),
                    ExtractorSettings.defaults(),
                    List.of(f -> {
                        framesSeen.incrementAndGet();
                        lastHpFt = f.value(hp);
                    }, slowTap),
                    (t, f, v, c) -> featureTicks.incrementAndGet(), latency, System::nanoTime));
            pipeline = new PacketPipeline("test", new DictionaryRegistry(), DictionaryFiles::parse, stages,
                    DecoderOptions.DEFAULT, queuePackets, faults, System::nanoTime);
            udp = new UdpSource(UdpSourceConfig.loopback(0), pipeline, faults, System::nanoTime);
            IngestMetrics.bindUdp(meters, "test", udp);
            IngestMetrics.bindPipeline(meters, "test", pipeline);
            pipeline.start();
            udp.start();
        }

        double counter(String name) {
            return meters.get(IngestMetrics.PREFIX + name).functionCounter().count();
        }

        @Override
        public void close() {
            udp.stop();
            pipeline.close();
        }
    }

    /** A steady 250 KCAS at 15,000 ft, as raw pressures, for {@code seconds} at the dictionary's 32 Hz. */
    private static void fly(ParameterDictionary dict, StreamEncoder enc, int frames) {
        Frame f = Frame.forDictionary(dict);
        double hpM = Units.ftToM(15000);
        double p = StandardAtmosphere.pressurePa(hpM);
        double qc = AirData.impactPressureFromCas(Units.ktToMps(250));
        for (int i = 0; i < frames; i++) {
            f.clear();
            f.timeNs(i * 31_250_000L);
            f.sequence(i);
            f.value(dict.indexOf("Ps"), p / Units.PA_PER_HPA);
            f.value(dict.indexOf("Qc"), qc / Units.PA_PER_HPA);
            f.value(dict.indexOf("OAT"), Units.kToDegC(StandardAtmosphere.temperatureK(hpM)));
            enc.onFrame(f);
        }
        enc.flush();
    }

    @Test
    void framesSentOverUdpComeOutDerivedAndWindowedWithMetersCounting() throws Exception {
        try (Rig rig = new Rig(PacketPipeline.DEFAULT_QUEUE_PACKETS, f -> { });
             UdpSender sender = new UdpSender(UdpSenderConfig.loopback(rig.udp.localPort()).withPacketsPerSecond(4000))) {
            StreamEncoder enc = sender.openStream(7, dict, dictText, WireOptions.DEFAULT);
            int frames = 32 * 5;
            fly(dict, enc, frames);
            long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(10);
            while (rig.framesSeen.get() < frames && System.nanoTime() < deadline) {
                Thread.sleep(10);
            }
            assertEquals(frames, rig.framesSeen.get(), "every frame sent reaches the stage");
            assertEquals(15000.0, rig.lastHpFt, 1e-6, "Hp derived from the static pressure on the stage");
            // 5 s of data at 20 Hz decisions: ticks from the first frame to the last, 0.05 s apart.
            assertTrue(rig.featureTicks.get() >= 95 && rig.featureTicks.get() <= 101, "ticks " + rig.featureTicks);
            assertEquals(frames, rig.counter("frames.decoded"));
            assertEquals(sender.sentPackets(), rig.counter("datagrams.received"));
            assertEquals(0, rig.counter("dropped"));
            assertEquals(0, rig.counter("sequence.lost"));
            Timer latency = rig.meters.get(IngestMetrics.PREFIX + "latency").timer();
            assertEquals(rig.featureTicks.get(), latency.count(), "one latency sample per decision tick");
            assertTrue(latency.max(TimeUnit.NANOSECONDS) > 0);
        }
    }

    @Test
    void aStalledStageNeverBlocksTheReceiverAndEveryDropIsCounted() throws Exception {
        FrameSink stall = f -> {
            try {
                Thread.sleep(2); // a consumer far slower than the link
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            }
        };
        try (Rig rig = new Rig(8, stall);
             UdpSender sender = new UdpSender(UdpSenderConfig.loopback(rig.udp.localPort()).withPacketsPerSecond(5000))) {
            StreamEncoder enc = sender.openStream(9, dict, dictText,
                    WireOptions.DEFAULT.withMaxFramesPerPacket(1).withAnnounceIntervalNs(100_000_000L));
            fly(dict, enc, 2000);
            long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(10);
            while (rig.counter("datagrams.received") < sender.sentPackets() && System.nanoTime() < deadline) {
                Thread.sleep(10);
            }
            assertEquals(sender.sentPackets(), rig.counter("datagrams.received"), "the receiver kept reading");
            assertTrue(rig.pipeline.awaitDrained(TimeUnit.SECONDS.toNanos(10)));
            double dropped = rig.counter("dropped");
            assertTrue(dropped > 0, "the queue must have overflowed in this set-up");
            assertEquals(sender.sentPackets(), rig.counter("packets.decoded")
                    + dropped + unknownDictionary(rig), "every datagram decoded or counted as dropped");
            synchronized (rig.log) {
                assertTrue(rig.log.stream().anyMatch(l -> l.startsWith("pipeline queue full (8 packets)")), rig.log.toString());
            }
        }
    }

    private static double unknownDictionary(Rig rig) {
        return rig.meters.find(IngestMetrics.PREFIX + "decode.errors").tag("kind", "unknown_dictionary")
                .functionCounter().count();
    }
}
