package org.pointcall.ingest.window.bench;

import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.util.concurrent.TimeUnit;
import java.util.zip.CRC32C;

import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;
import org.pointcall.ingest.frame.Frame;
import org.pointcall.ingest.window.FeatureExtractor;
import org.pointcall.ingest.window.FeatureListener;
import org.pointcall.ingest.window.W1Workload;

/**
 * Feature extraction on the reference workload W1, one frame per operation, against a CRC-32C pass over the same
 * frame's bytes (time, sequence, 256 values) in the same run. At 1,000 frames/s, real time is 1,000,000 ns per
 * 1,000 frames, so the multiple of real time is 1e6 / (ns per frame * 1000). Run with {@code -prof gc}: the
 * allocation rate per operation should be about 0 B. How to run: see the package documentation of
 * {@code org.pointcall.ingest.window}.
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.NANOSECONDS)
@Warmup(iterations = 3, time = 2)
@Measurement(iterations = 5, time = 2)
@Fork(value = 1, jvmArgsAppend = {"-Xms256m", "-Xmx256m"})
public class FeatureExtractorBenchmark {
    /** One second of frames, replayed with time going on: about 2 MB, in cache as a just-decoded frame would be. */
    private static final int BLOCK_FRAMES = W1Workload.FRAME_RATE_HZ;
    private static final int FRAME_BYTES = 16 + W1Workload.PARAMETERS * Double.BYTES;

    private Frame[] block;
    private byte[] image;
    private FeatureExtractor extractor;
    private final CRC32C crc = new CRC32C();
    private long next;
    private double sink;

    @Setup
    public void setUp() {
        block = W1Workload.frames(BLOCK_FRAMES, 20240601L);
        ByteBuffer b = ByteBuffer.allocate(BLOCK_FRAMES * FRAME_BYTES).order(ByteOrder.LITTLE_ENDIAN);
        for (Frame f : block) {
            b.putLong(f.timeNs()).putLong(f.sequence());
            for (double v : f.values()) {
                b.putDouble(v);
            }
        }
        image = b.array();
        FeatureListener listener = (timeNs, features, valid, coverage) -> sink += features[0];
        extractor = FeatureExtractor.bind(W1Workload.dictionary(), W1Workload.specs(), W1Workload.settings(),
                listener);
    }

    /** One W1 frame through the extractor (20 Hz ticks included, one in 50 frames). */
    @Benchmark
    public double w1Frame() {
        Frame f = block[(int) (next % BLOCK_FRAMES)];
        f.timeNs(next * W1Workload.FRAME_INTERVAL_NS);
        f.sequence(next);
        next++;
        extractor.onFrame(f);
        return sink;
    }

    /** CRC-32C over one frame's 2,064 bytes: the floor for touching the data once. */
    @Benchmark
    public long crc32cFrame() {
        int k = (int) (next++ % BLOCK_FRAMES);
        crc.reset();
        crc.update(image, k * FRAME_BYTES, FRAME_BYTES);
        return crc.getValue();
    }
}
