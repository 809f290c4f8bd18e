package org.pointcall.replay.play;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;

import org.pointcall.ingest.pipeline.StreamStage;
import org.pointcall.ingest.pipeline.StreamStages;
import org.pointcall.ingest.window.FeatureListener;
import org.pointcall.ingest.window.W1Workload;
import org.pointcall.ingest.wire.DecoderOptions;
import org.pointcall.ingest.wire.DictionaryRegistry;
import org.pointcall.ingest.wire.FaultLog;
import org.pointcall.ingest.wire.PacketDecoder;
import org.pointcall.replay.archive.ArchiveIndex;
import org.pointcall.replay.archive.ArchiveReader;
import org.pointcall.replay.archive.ArchiveWriter;
import org.pointcall.replay.archive.ChunkBuilder;
import org.pointcall.replay.record.W1Feed;
import org.pointcall.shared.dictionary.DictionaryFiles;

/**
 * Benchmark of replay at W1: an archive of the given seconds of W1 is written, then played as fast as possible
 * into the full ingest pipeline on the replay thread (decode, derived parameters, sliding-window features on 24
 * parameters at 20 Hz), against a plain read of the same archive (every chunk read and CRC-checked, every record
 * visited) measured alternately in the same run. Optionally a paced run at 1x measures how closely the replay
 * holds real time. Figures are information, not a test.
 */
public final class ReplayBench {
    private static final int ROUNDS = 5;
    private static final long WARM_UP_NS = 3_000_000_000L;

    private ReplayBench() {
    }

    /** Figures of one run. */
    public record Result(int seconds, long packets, long archiveBytes, long frames, long ticks, double replayWallS,
                         double replayCpuS, double readWallS, double dataSpanS, int pacedSeconds,
                         double pacedElapsedS, double pacedSpanS) {
        public double replaySpeed() {
            return dataSpanS / replayWallS;
        }

        public List<String> lines() {
            List<String> l = new ArrayList<>();
            l.add(f("workload", "W1: %d parameters at %d frames/s, features on %d at 20 Hz", W1Workload.PARAMETERS,
                    W1Workload.FRAME_RATE_HZ, W1Workload.SELECTED));
            l.add(f("archive", "%d s, %d packets, %d bytes", seconds, packets, archiveBytes));
            l.add(f("replay.max.wall", "%.3f s (median of %d)", replayWallS, ROUNDS));
            l.add(f("replay.max.speed", "%.1f x real time (decode, derive, features; wall time)", replaySpeed()));
            l.add(f("replay.max.speed.cpu", "%.1f x real time (replay thread's CPU time, median)",
                    dataSpanS / replayCpuS));
            l.add(f("replay.frames", "%d frames, %d feature ticks", frames, ticks));
            l.add(f("archive.read.speed", "%.1f x real time (read and CRC-check only)", dataSpanS / readWallS));
            l.add(f("replay.toRead", "%.2f x", replayWallS / readWallS));
            if (pacedSeconds > 0) {
                l.add(f("replay.1x.data", "%.6f s", pacedSpanS));
                l.add(f("replay.1x.elapsed", "%.6f s", pacedElapsedS));
                l.add(f("replay.1x.error", "%+.4f %%", 100 * (pacedElapsedS - pacedSpanS) / pacedSpanS));
            }
            return l;
        }

        private static String f(String name, String fmt, Object... a) {
            return name + ": " + String.format(Locale.ROOT, fmt, a);
        }
    }

    public static Result run(int seconds, int pacedSeconds, Path dir) throws IOException {
        if (seconds < 1 || seconds > 600 || pacedSeconds < 0 || pacedSeconds > 600) {
            throw new IllegalArgumentException("bench replay takes 1 to 600 s of data and 0 to 600 s paced");
        }
        Files.createDirectories(dir);
        Path file = dir.resolve("bench-replay-" + System.nanoTime() + ".pcsa");
        try {
            long packets = write(file, Math.max(seconds, pacedSeconds));
            long size = Files.size(file);
            long endNs = 1_000_000_000L + W1Feed.frameTimeNs((long) seconds * W1Workload.FRAME_RATE_HZ);
            long[] out = new long[3];
            long warm = System.nanoTime() + WARM_UP_NS;
            do {
                play(file, endNs, ReplayControl.MAX_SPEED, out);
                readAll(file);
            } while (System.nanoTime() < warm);
            java.lang.management.ThreadMXBean mx = java.lang.management.ManagementFactory.getThreadMXBean();
            long[] wall = new long[ROUNDS];
            long[] cpu = new long[ROUNDS];
            long[] read = new long[ROUNDS];
            for (int r = 0; r < ROUNDS; r++) {
                long cpu0 = mx.getCurrentThreadCpuTime();
                long t0 = System.nanoTime();
                ReplaySummary s = play(file, endNs, ReplayControl.MAX_SPEED, out);
                wall[r] = System.nanoTime() - t0;
                cpu[r] = mx.getCurrentThreadCpuTime() - cpu0;
                out[2] = s.dataSpanNs();
                long c0 = System.nanoTime();
                readAll(file);
                read[r] = System.nanoTime() - c0;
            }
            long frames = out[0];
            long ticks = out[1];
            double span = out[2] / 1e9;
            double pacedElapsed = 0;
            double pacedSpan = 0;
            if (pacedSeconds > 0) {
                long pacedEnd = 1_000_000_000L + W1Feed.frameTimeNs((long) pacedSeconds * W1Workload.FRAME_RATE_HZ);
                ReplaySummary s = play(file, pacedEnd, 1.0, out);
                pacedElapsed = s.elapsedNs() / 1e9;
                pacedSpan = s.dataSpanNs() / 1e9;
            }
            return new Result(seconds, packets, size, frames, ticks, median(wall) / 1e9, median(cpu) / 1e9,
                    median(read) / 1e9, span,
                    pacedSeconds, pacedElapsed, pacedSpan);
        } finally {
            Files.deleteIfExists(file);
            Files.deleteIfExists(ArchiveIndex.pathFor(file));
        }
    }

    /** W1 as received: arrival time = frame time + 1 s, 1 MiB chunks. Returns the packets written. */
    static long write(Path file, int seconds) throws IOException {
        ChunkBuilder cb = new ChunkBuilder(1 << 20);
        long[] t = new long[1];
        int[] number = new int[1];
        long[] n = new long[1];
        try (ArchiveWriter w = ArchiveWriter.create(file, System.currentTimeMillis(), 0L)) {
            IOException[] failed = new IOException[1];
            W1Feed feed = new W1Feed(1, p -> {
                try {
                    if (!cb.fits(0, p.remaining()) || cb.full()) {
                        w.write(cb.seal(number[0]++));
                    }
                } catch (IOException e) {
                    failed[0] = e;
                }
                cb.addPacket(p, t[0], 0L);
                n[0]++;
            });
            long frames = (long) seconds * W1Workload.FRAME_RATE_HZ;
            for (long k = 0; k < frames && failed[0] == null; k++) {
                t[0] = 1_000_000_000L + W1Feed.frameTimeNs(k);
                feed.step();
            }
            if (failed[0] != null) {
                throw failed[0];
            }
            w.write(cb.seal(number[0]));
        }
        return n[0];
    }

    /** Plays the archive until data time {@code endNs} into a fresh W1 pipeline; out[0] frames, out[1] ticks. */
    private static ReplaySummary play(Path file, long endNs, double speed, long[] out) {
        long[] ticks = new long[1];
        FeatureListener count = (tNs, f, v, c) -> ticks[0]++;
        StreamStages stages = new StreamStages((id, d) -> new StreamStage(id, d, W1Workload.specs(),
                W1Workload.settings(), List.of(), count, null, System::nanoTime));
        PacketDecoder decoder = new PacketDecoder(new DictionaryRegistry(), DictionaryFiles::parse, stages,
                DecoderOptions.DEFAULT, new FaultLog(line -> { }, 1, 1_000_000_000L));
        ReplayControl control = new ReplayControl(speed, false);
        ReplayTarget into = ReplayTargets.decoder(decoder, "bench");
        ReplayTarget bounded = new ReplayTarget() {
            @Override
            public void onPacket(ByteBuffer packet, long dataTimeNs) {
                if (dataTimeNs >= endNs) {
                    control.stop();
                    return;
                }
                into.onPacket(packet, dataTimeNs);
            }

            @Override
            public void flush() {
                into.flush();
            }
        };
        ReplaySummary s;
        try (ArchiveReader r = ArchiveReader.open(file)) {
            s = new Replayer(new ArchiveSource(r), bounded, ReplayClock.SYSTEM, control).run();
        }
        out[0] = decoder.counters().framesDelivered();
        out[1] = ticks[0];
        return s;
    }

    private static void readAll(Path file) {
        long[] n = new long[1];
        try (ArchiveReader r = ArchiveReader.open(file)) {
            r.read(v -> {
                n[0] += v.body().remaining();
                return true;
            });
        }
        if (n[0] == 42) {
            System.out.print(""); // keeps the JIT from dropping the pass
        }
    }

    private static long median(long[] v) {
        long[] s = v.clone();
        Arrays.sort(s);
        return s[s.length / 2];
    }
}
