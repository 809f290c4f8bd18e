package org.pointcall.ingest.window;

import java.lang.management.ManagementFactory;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.zip.CRC32C;

import org.pointcall.ingest.frame.Frame;

/**
 * Plain-Java throughput harness for feature extraction on the {@link W1Workload}, for a {@code bench} command: it
 * reports speed as a multiple of real time and as a ratio to one CRC-32C pass over the same frame bytes (time,
 * sequence and 256 values per frame), the floor for touching the data once, measured in the same run. Both passes
 * replay one second of frames (about 2 MB of frames and its 2 MB byte image) with time going on: in a live
 * pipeline each frame is decoded just before it is used, so it is in cache, not 20 MB away. The figures are
 * medians of five alternating rounds after a warm-up. Timing is for information; nothing asserts on it.
 */
public final class FeatureBench {
    private static final int ROUNDS = 5;
    private static final int FRAME_BYTES = 16 + W1Workload.PARAMETERS * Double.BYTES;

    private FeatureBench() {
    }

    /**
     * Measured figures of one run.
     *
     * @param dataSeconds       seconds of W1 data processed per round
     * @param frames            frames per round
     * @param selectedSamples   samples of the selected parameters per round
     * @param ticks             decision ticks per round
     * @param extractNsPerFrame median wall time of feature extraction per frame
     * @param crcNsPerFrame     median wall time of CRC-32C per frame's bytes
     * @param allocatedBytes    bytes allocated by this thread during all extraction rounds, -1 if unknown
     */
    public record Result(int dataSeconds, long frames, long selectedSamples, long ticks, double extractNsPerFrame,
                         double crcNsPerFrame, long allocatedBytes) {
        private static final double NS_PER_FRAME_REAL_TIME = 1e9 / W1Workload.FRAME_RATE_HZ;

        public double extractRealTimeMultiple() {
            return NS_PER_FRAME_REAL_TIME / extractNsPerFrame;
        }

        public double crcRealTimeMultiple() {
            return NS_PER_FRAME_REAL_TIME / crcNsPerFrame;
        }

        /** Extraction time over CRC-32C time for the same data: how many data passes extraction is worth. */
        public double extractToCrcRatio() {
            return extractNsPerFrame / crcNsPerFrame;
        }

        /** {@code name: value unit} lines. */
        public List<String> lines() {
            return List.of(
                    line("window.w1.data", dataSeconds, "s"),
                    line("window.w1.frames", frames, "frames"),
                    line("window.w1.selectedSamples", selectedSamples, "samples"),
                    line("window.w1.ticks", ticks, "ticks"),
                    line("window.w1.extract.perFrame", extractNsPerFrame, "ns"),
                    line("window.w1.extract.speed", extractRealTimeMultiple(), "x real time"),
                    line("window.w1.crc32c.perFrame", crcNsPerFrame, "ns"),
                    line("window.w1.crc32c.speed", crcRealTimeMultiple(), "x real time"),
                    line("window.w1.extract.toCrc32c", extractToCrcRatio(), "x"),
                    line("window.w1.extract.allocated", allocatedBytes, "B"));
        }

        private static String line(String name, double value, String unit) {
            return String.format(Locale.ROOT, "%s: %.1f %s", name, value, unit);
        }

        private static String line(String name, long value, String unit) {
            return name + ": " + value + " " + unit;
        }
    }

    /**
     * Runs the harness over {@code seconds} of W1 data per round, after a warm-up of at least two seconds of wall
     * time (the JIT must have compiled the hot path, even on a busy machine), and returns the figures.
     */
    public static Result run(int seconds) {
        return run(seconds, 2_000_000_000L);
    }

    static Result run(int seconds, long warmUpNs) {
        if (seconds < 1) {
            throw new IllegalArgumentException("bench needs at least 1 s of data, got " + seconds);
        }
        int blockFrames = W1Workload.FRAME_RATE_HZ;
        Frame[] block = W1Workload.frames(blockFrames, 20240601L);
        byte[] image = image(block);
        long frames = (long) seconds * W1Workload.FRAME_RATE_HZ;

        TickCounter counter = new TickCounter();
        FeatureExtractor fx = FeatureExtractor.bind(W1Workload.dictionary(), W1Workload.specs(),
                W1Workload.settings(), counter);
        CRC32C crc = new CRC32C();
        Feeder feeder = new Feeder(block);

        long warmUntil = System.nanoTime() + warmUpNs;
        do {
            feeder.feed(fx, 10_000);
            crcPass(crc, image, 10_000);
        } while (System.nanoTime() < warmUntil);

        long[] extractNs = new long[ROUNDS];
        long[] crcNs = new long[ROUNDS];
        long alloc = 0;
        long ticksBefore = 0;
        long ticksPerRound = 0;
        long samplesPerRound = 0;
        com.sun.management.ThreadMXBean mx = threadBean();
        for (int r = 0; r < ROUNDS; r++) {
            ticksBefore = fx.ticksEmitted();
            long a0 = mx == null ? 0 : mx.getCurrentThreadAllocatedBytes();
            long t0 = System.nanoTime();
            long samples = feeder.feed(fx, frames);
            long t1 = System.nanoTime();
            long a1 = mx == null ? 0 : mx.getCurrentThreadAllocatedBytes();
            alloc += a1 - a0;
            extractNs[r] = t1 - t0;
            ticksPerRound = fx.ticksEmitted() - ticksBefore;
            samplesPerRound = samples;

            long c0 = System.nanoTime();
            crcPass(crc, image, frames);
            crcNs[r] = System.nanoTime() - c0;
        }
        return new Result(seconds, frames, samplesPerRound, ticksPerRound, median(extractNs) / (double) frames,
                median(crcNs) / (double) frames, mx == null ? -1 : alloc);
    }

    private static com.sun.management.ThreadMXBean threadBean() {
        if (ManagementFactory.getThreadMXBean() instanceof com.sun.management.ThreadMXBean b
                && b.isThreadAllocatedMemorySupported() && b.isThreadAllocatedMemoryEnabled()) {
            return b;
        }
        return null;
    }

    private static long median(long[] xs) {
        long[] s = xs.clone();
        Arrays.sort(s);
        return s[s.length / 2];
    }

    /** Little-endian image of time, sequence and values per frame: the bytes a wire packet of W1 would carry. */
    private static byte[] image(Frame[] block) {
        ByteBuffer b = ByteBuffer.allocate(block.length * FRAME_BYTES).order(ByteOrder.LITTLE_ENDIAN);
        for (Frame f : block) {
            b.putLong(f.timeNs()).putLong(f.sequence());
            for (double v : f.values()) {
                b.putDouble(v);
            }
        }
        return b.array();
    }

    private static void crcPass(CRC32C crc, byte[] image, long frames) {
        long blockFrames = image.length / FRAME_BYTES;
        long left = frames;
        while (left > 0) {
            long n = Math.min(left, blockFrames);
            crc.update(image, 0, (int) (n * FRAME_BYTES));
            left -= n;
        }
        BLACKHOLE ^= crc.getValue();
    }

    private static volatile long BLACKHOLE;

    /** Replays a block of frames over and over with time going on, so the extractor sees an endless stream. */
    static final class Feeder {
        private final Frame[] block;
        private final int[] selectedSamples;
        private long next;

        Feeder(Frame[] block) {
            this.block = block;
            int[] slots = new int[W1Workload.SELECTED];
            for (int i = 0; i < slots.length; i++) {
                slots[i] = i * 10;
            }
            selectedSamples = new int[block.length];
            for (int k = 0; k < block.length; k++) {
                int c = 0;
                for (int s : slots) {
                    if (!Double.isNaN(block[k].value(s))) {
                        c++;
                    }
                }
                selectedSamples[k] = c;
            }
        }

        /** Feeds {@code frames} frames; returns how many selected samples they carried. */
        long feed(FeatureExtractor fx, long frames) {
            long samples = 0;
            for (long i = 0; i < frames; i++) {
                int k = (int) (next % block.length);
                Frame f = block[k];
                f.timeNs(next * W1Workload.FRAME_INTERVAL_NS);
                f.sequence(next);
                fx.onFrame(f);
                samples += selectedSamples[k];
                next++;
            }
            return samples;
        }
    }

    private static final class TickCounter implements FeatureListener {
        private double sink;

        @Override
        public void onFeatures(long timeNs, double[] features, boolean[] valid, double[] coverage) {
            sink += features[0];
            if (sink == Double.MIN_VALUE) {
                BLACKHOLE++;
            }
        }
    }
}
