package org.pointcall.replay.record;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.List;
import java.util.concurrent.CopyOnWriteArrayList;
import java.util.concurrent.locks.LockSupport;

/**
 * Records the W1 feed onto a small file system that is nearly full (a ballast file takes most of it) until the
 * recorder says the disk refuses writes and that its memory is full, then frees the ballast, records a little
 * longer and closes; copies the archive out and prints the recorder's figures. Run by {@link DiskFullTest} on a
 * tmpfs of its own mount namespace.
 */
public final class DiskFullChild {
    private DiskFullChild() {
    }

    public static void main(String[] args) throws IOException {
        Path small = Path.of(args[0]);
        Path copyTo = Path.of(args[1]);
        long ballastBytes = Long.parseLong(args[2]);
        Path ballast = small.resolve("ballast");
        byte[] block = new byte[64 << 10];
        try (OutputStream o = Files.newOutputStream(ballast)) {
            for (long n = 0; n < ballastBytes; n += block.length) {
                o.write(block);
            }
        }
        List<RecorderAlarm> alarms = new CopyOnWriteArrayList<>();
        Path file = small.resolve("rec.pcsa");
        RecorderPolicy policy = RecorderPolicy.DEFAULT.withMaxChunkBytes(64 << 10).withMaxChunkAgeNs(50_000_000L)
                .withMemoryLimitBytes(1 << 20).withRetryIntervalNs(100_000_000L);
        Recorder rec = Recorder.start(file, policy, System::nanoTime, a -> {
            alarms.add(a);
            System.out.println("alarm " + a);
        });
        W1Feed feed = new W1Feed(2, p -> rec.offer(p, System.nanoTime()));
        long start = System.nanoTime();
        long freedAt = -1;
        long giveUp = start + 30_000_000_000L;
        while (System.nanoTime() < giveUp) {
            feed.step();
            if (freedAt < 0 && has(alarms, AlarmKind.WRITE_FAILED) && has(alarms, AlarmKind.MEMORY_FULL)) {
                Files.delete(ballast);
                freedAt = feed.nextFrame();
                System.out.println("ballast freed at frame " + freedAt);
            }
            if (freedAt >= 0 && has(alarms, AlarmKind.WRITING_AGAIN) && feed.nextFrame() > freedAt + 300) {
                break;
            }
            long wait = start + W1Feed.frameTimeNs(feed.nextFrame()) - System.nanoTime();
            if (wait > 0) {
                LockSupport.parkNanos(wait);
            }
        }
        rec.close();
        RecorderStats s = rec.stats();
        Files.copy(file, copyTo, StandardCopyOption.REPLACE_EXISTING);
        System.out.println("fed " + feed.packets() + " written " + s.packetsWritten() + " lost " + s.lostDiskFull()
                + " failures " + s.writeFailures());
    }

    private static boolean has(List<RecorderAlarm> alarms, AlarmKind k) {
        for (RecorderAlarm a : alarms) {
            if (a.kind() == k) {
                return true;
            }
        }
        return false;
    }
}
