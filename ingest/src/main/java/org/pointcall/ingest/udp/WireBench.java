package org.pointcall.ingest.udp;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.OptionalLong;
import java.util.concurrent.locks.LockSupport;

import org.pointcall.ingest.frame.Frame;
import org.pointcall.ingest.wire.DecoderOptions;
import org.pointcall.ingest.wire.DictionaryRegistry;
import org.pointcall.ingest.wire.FaultLog;
import org.pointcall.ingest.wire.PacketDecoder;
import org.pointcall.ingest.wire.SequenceTotals;
import org.pointcall.ingest.wire.StreamEncoder;
import org.pointcall.ingest.wire.StreamFrameSink;
import org.pointcall.ingest.wire.StreamTracker;
import org.pointcall.ingest.wire.WireOptions;
import org.pointcall.shared.dictionary.Parameter;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.PointcallException;
import org.pointcall.shared.units.Unit;
import org.slf4j.LoggerFactory;

/**
 * UDP loopback bench of the wire format: a real sender and a real {@link UdpSource} in this process, one frame of
 * 32 float64 slots per packet. {@link #paced} holds a rate and expects no loss; {@link #overload} sends flat out into
 * a small receive buffer to make the kernel drop, and checks that loss counted from sequence gaps equals sent minus
 * received. Both end with a short slow tail so a loss at the very end still shows as a gap.
 *
 * <p>Run with {@code java -cp <ingest classpath> org.pointcall.ingest.udp.WireBench [paced RATE SECONDS] [overload
 * PACKETS RCVBUF]}; the {@code bench udp} command calls the static methods.
 */
public final class WireBench {
    /** Slots per frame: a typical handling-qualities parameter set. */
    public static final int SLOTS = 32;
    private static final int TAIL_PACKETS = 20;
    private static final long DRAIN_TIMEOUT_NS = 3_000_000_000L;
    private static final int STREAM_ID = 1;
    private static final int MAX_LATENCY_SAMPLES = 20_000_000;

    private WireBench() {
    }

    /** Sends at {@code packetsPerSecond} for {@code duration} into a receive buffer of {@code receiveBufferBytes}. */
    public static BenchReport paced(double packetsPerSecond, Duration duration, int receiveBufferBytes) {
        if (!(packetsPerSecond > 0)) {
            throw new IllegalArgumentException("a paced run needs a positive rate, got " + packetsPerSecond);
        }
        long expected = (long) (packetsPerSecond * duration.toNanos() / 1e9);
        return run("udp-paced", packetsPerSecond, duration.toNanos(), Long.MAX_VALUE, receiveBufferBytes, expected);
    }

    /** Sends {@code packets} as fast as the socket takes them into a (small) receive buffer. */
    public static BenchReport overload(long packets, int receiveBufferBytes) {
        if (packets < 1) {
            throw new IllegalArgumentException("an overload run sends at least one packet");
        }
        return run("udp-overload", 0, Long.MAX_VALUE, packets, receiveBufferBytes, packets);
    }

    private static BenchReport run(String name, double pps, long durationNs, long maxPackets, int rcvbuf,
                                   long expectedFrames) {
        ParameterDictionary dictionary = benchDictionary();
        DictionaryRegistry registry = new DictionaryRegistry(List.of(dictionary));
        LatencySink sink = new LatencySink((int) Math.min(expectedFrames + TAIL_PACKETS + 16, MAX_LATENCY_SAMPLES));
        PacketDecoder decoder = new PacketDecoder(registry, (text, source) -> {
            throw new PointcallException(source + ": the bench receiver reads no dictionary text");
        }, sink, DecoderOptions.DEFAULT, FaultLog.toLogger(LoggerFactory.getLogger(WireBench.class)));
        OptionalLong kernelBefore = kernelReceiveBufferErrors();

        UdpSource source = new UdpSource(UdpSourceConfig.loopback(0).withReceiveBufferBytes(rcvbuf), decoder,
                System::nanoTime);
        long mainSent;
        long mainNs;
        long mainFrames;
        UdpSender sender = new UdpSender(UdpSenderConfig.loopback(source.localPort()));
        try {
            source.start();
            StreamEncoder enc = sender.openStream(STREAM_ID, dictionary, "bench dictionary (preloaded)",
                    WireOptions.DEFAULT.withMaxFramesPerPacket(1));
            Frame frame = Frame.forDictionary(dictionary);
            Pacer pacer = new Pacer(pps, System::nanoTime);
            long start = System.nanoTime();
            long end = durationNs == Long.MAX_VALUE ? Long.MAX_VALUE : start + durationNs;
            long i = 0;
            while (i < maxPackets) {
                pacer.awaitNext();
                long now = System.nanoTime();
                if (now >= end) {
                    break;
                }
                frame.values()[0] = i;
                frame.timeNs(now);
                enc.onFrame(frame);
                i++;
            }
            mainNs = System.nanoTime() - start;
            mainSent = sender.sentPackets();
            mainFrames = i;
            LockSupport.parkNanos(100_000_000L);
            Pacer slow = new Pacer(1000, System::nanoTime);
            for (int k = 0; k < TAIL_PACKETS; k++) {
                slow.awaitNext();
                frame.values()[0] = i + k;
                frame.timeNs(System.nanoTime());
                enc.onFrame(frame);
            }
            long sent = sender.sentPackets();
            long deadline = System.nanoTime() + DRAIN_TIMEOUT_NS;
            while (System.nanoTime() < deadline) {
                StreamTracker t = decoder.tracker(STREAM_ID);
                if (t != null && t.received() + t.lost() >= sent) {
                    break;
                }
                LockSupport.parkNanos(10_000_000L);
            }
        } finally {
            sender.close();
            source.close();
        }
        OptionalLong kernelAfter = kernelReceiveBufferErrors();

        long sent = sender.sentPackets();
        SequenceTotals seq = decoder.sequenceTotals();
        List<BenchReport.Figure> f = new ArrayList<>();
        if (pps > 0) {
            f.add(fig("target_rate", pps, "packets/s"));
            f.add(fig("duration", durationNs / 1e9, "s"));
        }
        f.add(fig("packet_size", 56 + 8 * SLOTS + 4, "bytes"));
        f.add(fig("receive_buffer_requested", rcvbuf, "bytes"));
        f.add(fig("receive_buffer_granted", source.receiveBufferBytes(), "bytes"));
        f.add(fig("sent", sent, "packets"));
        f.add(fig("send_errors", sender.sendErrors(), "packets"));
        f.add(fig("received", seq.received(), "packets"));
        f.add(fig("lost_from_gaps", seq.lost(), "packets"));
        f.add(fig("sent_minus_received", sent - seq.received(), "packets"));
        f.add(fig("gap_events", seq.gapEvents(), ""));
        f.add(fig("duplicates", seq.duplicates(), "packets"));
        f.add(fig("late", seq.late(), "packets"));
        f.add(fig("decode_faults", decoder.counters().faults(), "packets"));
        f.add(fig("frames_delivered", decoder.counters().framesDelivered(), "frames"));
        f.add(fig("achieved_send_rate", mainSent / (mainNs / 1e9), "packets/s"));
        f.add(fig("achieved_receive_rate", sink.rate(mainFrames), "frames/s"));
        f.add(fig("latency_p50", sink.percentileUs(0.50), "us"));
        f.add(fig("latency_p99", sink.percentileUs(0.99), "us"));
        f.add(fig("latency_max", sink.percentileUs(1.0), "us"));
        if (kernelBefore.isPresent() && kernelAfter.isPresent()) {
            // system-wide counter: another process's UDP drops in the same interval would add to it
            f.add(fig("kernel_rcvbuf_errors", kernelAfter.getAsLong() - kernelBefore.getAsLong(), "packets"));
        }
        boolean exact = seq.lost() == sent - seq.received() && seq.duplicates() == 0 && seq.stale() == 0;
        f.add(fig("loss_accounting_exact", exact ? 1 : 0, "(1 = lost_from_gaps equals sent_minus_received)"));
        return new BenchReport(name, f);
    }

    private static BenchReport.Figure fig(String name, double value, String unit) {
        return new BenchReport.Figure(name, value, unit);
    }

    /** The 32-slot dictionary the bench streams. */
    public static ParameterDictionary benchDictionary() {
        List<Parameter> ps = new ArrayList<>(SLOTS);
        for (int i = 0; i < SLOTS; i++) {
            ps.add(new Parameter(String.format("bench.p%02d", i), Unit.NONE, "bench value", 20, -1e12, 1e12, null,
                    null, null));
        }
        return new ParameterDictionary("udp-bench", ps);
    }

    /** Linux only: datagrams the kernel dropped for a full receive buffer, system-wide; empty elsewhere. */
    static OptionalLong kernelReceiveBufferErrors() {
        try {
            List<String> lines = Files.readAllLines(Path.of("/proc/net/snmp"));
            for (int i = 0; i + 1 < lines.size(); i++) {
                if (lines.get(i).startsWith("Udp: ") && lines.get(i + 1).startsWith("Udp: ")) {
                    String[] names = lines.get(i).trim().split("\\s+");
                    String[] values = lines.get(i + 1).trim().split("\\s+");
                    for (int k = 1; k < names.length && k < values.length; k++) {
                        if (names[k].equals("RcvbufErrors")) {
                            return OptionalLong.of(Long.parseLong(values[k]));
                        }
                    }
                }
            }
        } catch (IOException | RuntimeException e) {
            return OptionalLong.empty();
        }
        return OptionalLong.empty();
    }

    /** Records send-to-receive latency of every frame (both stamps from this process's nanoTime). */
    private static final class LatencySink implements StreamFrameSink {
        private final long[] latencyNs;
        private final long[] receiveNs;
        private final long[] index;
        private int n;

        LatencySink(int capacity) {
            latencyNs = new long[capacity];
            receiveNs = new long[capacity];
            index = new long[capacity];
        }

        @Override
        public void onFrame(int streamId, Frame frame, long receiveTimeNs) {
            if (n < latencyNs.length) {
                latencyNs[n] = receiveTimeNs - frame.timeNs();
                receiveNs[n] = receiveTimeNs;
                index[n] = frame.sequence();
                n++;
            }
        }

        // read after the source thread ended (join), so the arrays are stable

        /** Frames per second received over the main phase (frames with index below {@code mainFrames}). */
        double rate(long mainFrames) {
            long first = 0;
            long last = 0;
            int count = 0;
            for (int k = 0; k < n; k++) {
                if (index[k] < mainFrames) {
                    if (count == 0) {
                        first = receiveNs[k];
                    }
                    last = receiveNs[k];
                    count++;
                }
            }
            return count < 2 ? 0 : (count - 1) / ((last - first) / 1e9);
        }

        double percentileUs(double q) {
            if (n == 0) {
                return Double.NaN;
            }
            long[] sorted = Arrays.copyOf(latencyNs, n);
            Arrays.sort(sorted);
            int k = (int) Math.min(n - 1, Math.max(0, Math.ceil(q * n) - 1));
            return sorted[k] / 1000.0;
        }
    }

    /**
     * Prints the figures of the runs named in {@code args}; with none, both: 20,000 packets/s for 10 s, then 200,000
     * packets flat out into a 4 KiB receive buffer.
     */
    public static void main(String[] args) {
        List<BenchReport> reports = new ArrayList<>();
        int i = 0;
        if (args.length == 0) {
            reports.add(paced(20_000, Duration.ofSeconds(10), UdpSourceConfig.DEFAULT_RECEIVE_BUFFER_BYTES));
            reports.add(overload(200_000, 4096));
        }
        while (i < args.length) {
            switch (args[i]) {
                case "paced" -> {
                    double rate = Double.parseDouble(args[i + 1]);
                    double seconds = Double.parseDouble(args[i + 2]);
                    reports.add(paced(rate, Duration.ofNanos((long) (seconds * 1e9)),
                            UdpSourceConfig.DEFAULT_RECEIVE_BUFFER_BYTES));
                    i += 3;
                }
                case "overload" -> {
                    reports.add(overload(Long.parseLong(args[i + 1]), Integer.parseInt(args[i + 2])));
                    i += 3;
                }
                default -> throw new IllegalArgumentException("unknown run '" + args[i]
                        + "': use 'paced RATE SECONDS' or 'overload PACKETS RCVBUF'");
            }
        }
        for (BenchReport r : reports) {
            r.lines().forEach(System.out::println);
        }
    }
}
