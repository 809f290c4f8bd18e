package org.pointcall.ingest.wire;

import java.util.function.Consumer;

import org.slf4j.Logger;

/**
 * Rate-limited problem log: at most {@code maxLines} lines per window of {@code windowNs}; lines beyond are dropped
 * and summed into one line when the next window opens. Counters elsewhere stay exact; only the text is limited, so
 * a flood of bad packets cannot flood the log.
 *
 * <p>Callers ask {@link #admit} first and build the line only when admitted, so a suppressed line costs nothing.
 * Time is passed in. Confined to one thread.
 */
public final class FaultLog {
    public static final int DEFAULT_MAX_LINES = 10;
    public static final long DEFAULT_WINDOW_NS = 1_000_000_000L;

    private final Consumer<String> out;
    private final int maxLines;
    private final long windowNs;
    private boolean opened;
    private long windowStartNs;
    private int linesInWindow;
    private long suppressedInWindow;
    private long emitted;
    private long suppressed;

    public FaultLog(Consumer<String> out, int maxLines, long windowNs) {
        if (maxLines < 1 || windowNs <= 0) {
            throw new IllegalArgumentException("a fault log needs maxLines >= 1 and a positive window");
        }
        this.out = out;
        this.maxLines = maxLines;
        this.windowNs = windowNs;
    }

    /** Warnings to this logger, {@value #DEFAULT_MAX_LINES} lines a second. */
    public static FaultLog toLogger(Logger logger) {
        return new FaultLog(logger::warn, DEFAULT_MAX_LINES, DEFAULT_WINDOW_NS);
    }

    /** True when a line may be written now; false counts it as suppressed. */
    public boolean admit(long nowNs) {
        if (!opened || nowNs - windowStartNs >= windowNs || nowNs < windowStartNs) {
            if (suppressedInWindow > 0) {
                out.accept(suppressedInWindow + " more problem lines suppressed in the last "
                        + (windowNs / 1_000_000L) + " ms (counters stay exact)");
                emitted++;
            }
            opened = true;
            windowStartNs = nowNs;
            linesInWindow = 0;
            suppressedInWindow = 0;
        }
        if (linesInWindow < maxLines) {
            linesInWindow++;
            return true;
        }
        suppressedInWindow++;
        suppressed++;
        return false;
    }

    public void emit(String line) {
        emitted++;
        out.accept(line);
    }

    /** Lines written, summaries included. */
    public long emitted() {
        return emitted;
    }

    /** Lines dropped by the limit. */
    public long suppressed() {
        return suppressed;
    }
}
