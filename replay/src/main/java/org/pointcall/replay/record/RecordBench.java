package org.pointcall.replay.record;

import java.io.IOException;
import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.net.InetSocketAddress;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.CopyOnWriteArrayList;
import java.util.concurrent.locks.LockSupport;

import org.pointcall.ingest.window.W1Workload;
import org.pointcall.replay.archive.ArchiveReader;

/**
 * Benchmark of the recorder at W1 (256 parameters at 1,000 frames/s: 2,000 packets of 1,084 bytes a second, plus
 * the announce): the feed is paced in real time on the producer thread, as a receiver would hand packets over, for
 * the given seconds; the recorder thread's own CPU time is read from the JVM (ThreadMXBean). Afterwards the
 * archive is read back and every packet counted. Figures are information, not a test.
 */
public final class RecordBench {
    private RecordBench() {
    }

    /** Figures of one run. */
    public record Result(int seconds, long offered, long recorded, long notRecorded, long inArchive, double wallS,
                         double recorderCpuS, double producerCpuS, long archiveBytes, long chunks, long queueHighWater,
                         int queueCapacity, List<String> alarms, int damaged) {
        public double recorderCpuShare() {
            return recorderCpuS / wallS;
        }

        public List<String> lines() {
            List<String> l = new ArrayList<>();
            l.add(f("workload", "W1: %d parameters at %d frames/s, %d s paced in real time", W1Workload.PARAMETERS,
                    W1Workload.FRAME_RATE_HZ, seconds));
            l.add(f("packets.offered", "%d", offered));
            l.add(f("packets.recorded", "%d", recorded));
            l.add(f("packets.notRecorded", "%d", notRecorded));
            l.add(f("packets.readBack", "%d (archive damage: %d)", inArchive, damaged));
            l.add(f("recorder.cpu", "%.2f %% of one core (thread CPU %.3f s over %.3f s wall)",
                    100 * recorderCpuShare(), recorderCpuS, wallS));
            l.add(f("recorder.cpuPerPacket", "%.0f ns", recorderCpuS * 1e9 / Math.max(1, recorded)));
            l.add(f("producer.cpu", "%.2f %% of one core (pacing and encoding the feed included)",
                    100 * producerCpuS / wallS));
            l.add(f("archive", "%d bytes, %d chunks, %.2f MB/s", archiveBytes, chunks, archiveBytes / wallS / 1e6));
            l.add(f("queue.highWater", "%d of %d packets", queueHighWater, queueCapacity));
            l.add(f("alarms", "%d%s", alarms.size(), alarms.isEmpty() ? "" : " " + alarms));
            return l;
        }

        private static String f(String name, String fmt, Object... a) {
            return name + ": " + String.format(Locale.ROOT, fmt, a);
        }
    }

    public static Result run(int seconds, Path dir, RecorderPolicy policy) throws IOException {
        if (seconds < 1 || seconds > 3600) {
            throw new IllegalArgumentException("bench record takes 1 to 3600 s, got " + seconds);
        }
        Files.createDirectories(dir);
        Path file = Recorder.newArchivePath(dir, java.time.Instant.now());
        List<String> alarms = new CopyOnWriteArrayList<>();
        ThreadMXBean mx = ManagementFactory.getThreadMXBean();
        InetSocketAddress sender = new InetSocketAddress("127.0.0.1", 40000);
        Recorder rec = Recorder.start(file, policy, System::nanoTime, a -> alarms.add(a.toString()));
        W1Feed feed = new W1Feed(1, p -> rec.onDatagram(p, sender, System.nanoTime()));
        long frames = (long) seconds * W1Workload.FRAME_RATE_HZ;
        long cpu0 = mx.getThreadCpuTime(rec.threadId());
        long pcpu0 = mx.getCurrentThreadCpuTime();
        long t0 = System.nanoTime();
        for (long k = 0; k < frames; k++) {
            long due = t0 + W1Feed.frameTimeNs(k);
            long wait;
            while ((wait = due - System.nanoTime()) > 0) {
                LockSupport.parkNanos(wait);
            }
            feed.step();
        }
        long cpu1 = mx.getThreadCpuTime(rec.threadId());
        long t1 = System.nanoTime();
        long pcpu1 = mx.getCurrentThreadCpuTime();
        long high = rec.queueHighWater();
        rec.close();
        RecorderStats s = rec.stats();
        long[] back = new long[1];
        int damaged;
        try (ArchiveReader r = ArchiveReader.open(file)) {
            r.read(v -> {
                if (v.isPacket()) {
                    back[0]++;
                }
                return true;
            });
            damaged = r.damage().size();
        }
        Result res = new Result(seconds, feed.packets(), s.packetsWritten(), s.notRecorded(), back[0],
                (t1 - t0) / 1e9, (cpu1 - cpu0) / 1e9, (pcpu1 - pcpu0) / 1e9, s.bytesWritten(), s.chunksWritten(),
                high, policy.queuePackets(), alarms, damaged);
        Files.deleteIfExists(file);
        Files.deleteIfExists(org.pointcall.replay.archive.ArchiveIndex.pathFor(file));
        return res;
    }
}
