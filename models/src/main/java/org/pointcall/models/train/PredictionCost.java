package org.pointcall.models.train;

import java.lang.management.ManagementFactory;

import org.pointcall.models.data.LabelledRows;

/**
 * What one {@link Classifier#predict(double[], double[])} call costs on one thread: wall time and heap bytes
 * allocated, averaged over many calls after a warm-up. A measurement for benchmarks and comparisons, never for a
 * test's pass or fail (timings on a shared machine are noisy).
 *
 * @param nsPerCall    mean wall time per call
 * @param bytesPerCall mean bytes allocated per call on the calling thread; NaN when the JVM cannot tell
 * @param calls        calls measured
 */
public record PredictionCost(double nsPerCall, double bytesPerCall, long calls) {

    /**
     * Measures {@code classifier} (a {@link Classifier#copy()} of it, so the caller's buffers are left alone) on
     * the rows of {@code rows}, cycling through them: {@code warmUp} calls first, then {@code calls} timed.
     */
    public static PredictionCost measure(Classifier classifier, LabelledRows rows, long warmUp, long calls) {
        if (rows.rows() == 0 || calls < 1) {
            throw new IllegalArgumentException("need rows and at least one call");
        }
        Classifier c = classifier.copy();
        int n = Math.min(rows.rows(), 4096);
        double[][] x = new double[n][];
        for (int i = 0; i < n; i++) {
            x[i] = rows.row(i);
        }
        double[] p = new double[c.classCount()];
        long sink = 0;
        for (long i = 0; i < warmUp; i++) {
            sink += c.predict(x[(int) (i % n)], p);
        }
        java.lang.management.ThreadMXBean mx = ManagementFactory.getThreadMXBean();
        com.sun.management.ThreadMXBean sun = mx instanceof com.sun.management.ThreadMXBean s
                && s.isThreadAllocatedMemorySupported() && s.isThreadAllocatedMemoryEnabled() ? s : null;
        long id = Thread.currentThread().getId();
        long b0 = sun == null ? 0 : sun.getThreadAllocatedBytes(id);
        long t0 = System.nanoTime();
        for (long i = 0; i < calls; i++) {
            sink += c.predict(x[(int) (i % n)], p);
        }
        long t1 = System.nanoTime();
        long b1 = sun == null ? 0 : sun.getThreadAllocatedBytes(id);
        if (sink == Long.MIN_VALUE) {
            // keeps the calls from being optimised away; never true
            throw new IllegalStateException();
        }
        return new PredictionCost((t1 - t0) / (double) calls, sun == null ? Double.NaN : (b1 - b0) / (double) calls,
                calls);
    }
}
