package org.pointcall.ingest.pipeline;

import java.lang.management.ManagementFactory;
import java.nio.ByteBuffer;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.zip.CRC32C;

import org.pointcall.ingest.frame.Frame;
import org.pointcall.ingest.window.FeatureListener;
import org.pointcall.ingest.window.W1Workload;
import org.pointcall.ingest.wire.DecoderOptions;
import org.pointcall.ingest.wire.DictionaryRegistry;
import org.pointcall.ingest.wire.FaultLog;
import org.pointcall.ingest.wire.PacketDecoder;
import org.pointcall.ingest.wire.StreamEncoder;
import org.pointcall.ingest.wire.WireFormat;
import org.pointcall.ingest.wire.WireOptions;
import org.pointcall.shared.dictionary.DictionaryFiles;
import org.pointcall.shared.dictionary.ParameterDictionary;

/**
 * Benchmark of the ingest hot path on the reference workload W1 (256 parameters at 1,000 frames/s, features on
 * 24 of them): wire packets decoded, derived and windowed on one thread, against a plain CRC-32C pass over the same
 * bytes (the floor for touching the data once), measured alternately in the same run. Timing is information only.
 */
public final class IngestBench {
    private static final int ROUNDS = 5;

    private IngestBench() {
    }

    /** Figures of one run. */
    public record Result(int dataSeconds, long frames, long packets, long bytes, long ticks, double ingestNsPerFrame,
                         double crcNsPerFrame, long allocatedBytesPerRound) {
        public double realTimeMultiple() {
            return 1e9 / W1Workload.FRAME_RATE_HZ / ingestNsPerFrame;
        }

        public double toCrcRatio() {
            return ingestNsPerFrame / crcNsPerFrame;
        }

        public List<String> lines() {
            List<String> l = new ArrayList<>();
            l.add(f("workload", "W1: %d parameters at %d frames/s, features on %d", W1Workload.PARAMETERS,
                    W1Workload.FRAME_RATE_HZ, W1Workload.SELECTED));
            l.add(f("data", "%d s, %d frames, %d packets, %d bytes", dataSeconds, frames, packets, bytes));
            l.add(f("ingest.perFrame", "%.1f ns", ingestNsPerFrame));
            l.add(f("ingest.speed", "%.1f x real time", realTimeMultiple()));
            l.add(f("crc32c.perFrame", "%.1f ns", crcNsPerFrame));
            l.add(f("ingest.toCrc32c", "%.2f x", toCrcRatio()));
            l.add(f("ingest.allocated", "%d B per round (binding a fresh decoder and windows included)", allocatedBytesPerRound));
            l.add(f("ticks", "%d per round", ticks));
            return l;
        }

        private static String f(String name, String fmt, Object... a) {
            return name + ": " + String.format(Locale.ROOT, fmt, a);
        }
    }

    /** Runs over {@code seconds} of W1 per round after a warm-up of at least two seconds. */
    public static Result run(int seconds) {
        if (seconds < 1 || seconds > 600) {
            throw new IllegalArgumentException("bench ingest takes 1 to 600 s of data per round, got " + seconds);
        }
        ParameterDictionary dict = W1Workload.dictionary();
        List<byte[]> packets = encode(dict, seconds);
        byte[][] data = packets.toArray(new byte[0][]);
        long bytes = 0;
        for (byte[] p : data) {
            bytes += p.length;
        }
        ByteBuffer[] views = new ByteBuffer[data.length];
        for (int i = 0; i < data.length; i++) {
            views[i] = ByteBuffer.wrap(data[i]);
        }
        CRC32C crc = new CRC32C();
        long warmUntil = System.nanoTime() + 2_000_000_000L;
        do {
            decodeAll(dict, views);
            crcAll(crc, data);
        } while (System.nanoTime() < warmUntil);

        long[] ingestNs = new long[ROUNDS];
        long[] crcNs = new long[ROUNDS];
        long alloc = 0;
        long ticks = 0;
        com.sun.management.ThreadMXBean mx = ManagementFactory.getThreadMXBean()
                instanceof com.sun.management.ThreadMXBean b && b.isThreadAllocatedMemorySupported() ? b : null;
        for (int r = 0; r < ROUNDS; r++) {
            long a0 = mx == null ? 0 : mx.getCurrentThreadAllocatedBytes();
            long t0 = System.nanoTime();
            ticks = decodeAll(dict, views);
            long t1 = System.nanoTime();
            long a1 = mx == null ? 0 : mx.getCurrentThreadAllocatedBytes();
            alloc = Math.max(alloc, a1 - a0);
            ingestNs[r] = t1 - t0;
            long c0 = System.nanoTime();
            crcAll(crc, data);
            crcNs[r] = System.nanoTime() - c0;
        }
        long frames = (long) seconds * W1Workload.FRAME_RATE_HZ;
        return new Result(seconds, frames, data.length, bytes, ticks, median(ingestNs) / (double) frames,
                median(crcNs) / (double) frames, mx == null ? -1 : alloc);
    }

    /** W1 frames as frame packets (announces left out: the receiver is given the dictionary). */
    static List<byte[]> encode(ParameterDictionary dict, int seconds) {
        List<byte[]> out = new ArrayList<>();
        StreamEncoder enc = new StreamEncoder(1, 1, dict, DictionaryFiles.toYaml(dict), WireOptions.DEFAULT, p -> {
            if ((p.get(p.position() + 5) & 0xff) == WireFormat.TYPE_FRAMES) {
                byte[] b = new byte[p.remaining()];
                p.get(p.position(), b);
                out.add(b);
            }
        });
        Frame[] block = W1Workload.frames(W1Workload.FRAME_RATE_HZ, 20261201L);
        Frame f = Frame.forDictionary(dict);
        for (int s = 0; s < seconds; s++) {
            for (int i = 0; i < block.length; i++) {
                f.copyFrom(block[i]);
                f.timeNs((long) s * 1_000_000_000L + block[i].timeNs());
                f.sequence((long) s * block.length + i);
                enc.onFrame(f);
            }
        }
        enc.flush();
        return out;
    }

    /** Decodes every packet through a fresh decoder and stage; returns the decision ticks emitted. */
    private static long decodeAll(ParameterDictionary dict, ByteBuffer[] packets) {
        long[] ticks = new long[1];
        FeatureListener count = (t, f, v, c) -> ticks[0]++;
        StreamStages stages = new StreamStages((id, d) -> new StreamStage(id, d, W1Workload.specs(),
                W1Workload.settings(), List.of(), count, null, System::nanoTime));
        PacketDecoder decoder = new PacketDecoder(new DictionaryRegistry(List.of(dict)), DictionaryFiles::parse,
                stages, DecoderOptions.DEFAULT, new FaultLog(line -> { }, 1, 1_000_000_000L));
        for (ByteBuffer p : packets) {
            p.clear();
            decoder.decode(p, "bench", 0L);
        }
        decoder.flushPending();
        return ticks[0];
    }

    private static void crcAll(CRC32C crc, byte[][] data) {
        crc.reset();
        for (byte[] p : data) {
            crc.update(p, 0, p.length);
        }
        if (crc.getValue() == 42) {
            System.out.print(""); // keeps the JIT from dropping the pass
        }
    }

    private static long median(long[] v) {
        long[] s = v.clone();
        Arrays.sort(s);
        return s[s.length / 2];
    }
}
