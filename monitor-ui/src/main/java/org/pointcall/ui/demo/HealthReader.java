package org.pointcall.ui.demo;

import java.util.concurrent.TimeUnit;

import org.pointcall.ingest.pipeline.IngestMetrics;
import org.pointcall.ui.desk.StreamHealth;

import io.micrometer.core.instrument.FunctionCounter;
import io.micrometer.core.instrument.MeterRegistry;
import io.micrometer.core.instrument.Timer;
import io.micrometer.core.instrument.distribution.ValueAtPercentile;

/**
 * Reads stream health from the ingest meters: frame rate from the change of the decoded-frame count between two
 * readings, counters as they are, latency from the timer's percentiles. Not thread-safe: one reader.
 */
public final class HealthReader {
    private final MeterRegistry meters;
    private long lastFrames;
    private long lastNs = Long.MIN_VALUE;
    private double rateHz;

    public HealthReader(MeterRegistry meters) {
        this.meters = meters;
    }

    private long count(String name) {
        FunctionCounter c = meters.find(IngestMetrics.PREFIX + name).functionCounter();
        return c == null ? 0 : (long) c.count();
    }

    /** A reading at {@code nowNs}; the rate is over the time since the previous reading (at least 0.5 s). */
    public StreamHealth read(long nowNs) {
        long frames = count("frames.decoded");
        if (lastNs == Long.MIN_VALUE) {
            lastNs = nowNs;
            lastFrames = frames;
        } else if (nowNs - lastNs >= 500_000_000L) {
            rateHz = (frames - lastFrames) * 1e9 / (nowNs - lastNs);
            lastNs = nowNs;
            lastFrames = frames;
        }
        double p50 = Double.NaN;
        double p99 = Double.NaN;
        Timer t = meters.find(IngestMetrics.PREFIX + "latency").timer();
        if (t != null && t.count() > 0) {
            for (ValueAtPercentile v : t.takeSnapshot().percentileValues()) {
                if (v.percentile() == 0.5) {
                    p50 = v.value(TimeUnit.MILLISECONDS);
                } else if (v.percentile() == 0.99) {
                    p99 = v.value(TimeUnit.MILLISECONDS);
                }
            }
        }
        return new StreamHealth(rateHz, count("sequence.gaps"), count("sequence.lost"), count("dropped"), p50, p99,
                frames);
    }
}
