package org.pointcall.replay.record;

import java.nio.file.Path;
import java.util.concurrent.locks.LockSupport;

/**
 * A process that records the W1 feed (at about 2,000 packets/s) into an archive until it is killed, printing
 * "written N" whenever the packets on disk reach a new count. Run by {@link RecorderCrashTest}.
 */
public final class RecordingChild {
    private RecordingChild() {
    }

    public static void main(String[] args) {
        Path file = Path.of(args[0]);
        Recorder rec = Recorder.start(file, RecorderPolicy.DEFAULT.withMaxChunkAgeNs(50_000_000L), System::nanoTime,
                a -> System.out.println("alarm " + a));
        W1Feed feed = new W1Feed(3, p -> rec.offer(p, System.nanoTime()));
        long reported = -1;
        long start = System.nanoTime();
        while (true) {
            feed.step();
            long w = rec.stats().packetsWritten();
            if (w != reported) {
                reported = w;
                System.out.println("written " + w);
                System.out.flush();
            }
            long due = start + W1Feed.frameTimeNs(feed.nextFrame());
            long wait = due - System.nanoTime();
            if (wait > 0) {
                LockSupport.parkNanos(wait);
            }
        }
    }
}
