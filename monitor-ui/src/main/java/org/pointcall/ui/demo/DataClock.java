package org.pointcall.ui.demo;

import org.pointcall.ingest.frame.Frame;
import org.pointcall.ingest.frame.FrameSink;

/** Frame tap that keeps the newest frame's data time, for other threads to read. */
public final class DataClock implements FrameSink {
    private volatile long timeNs;
    private volatile long firstNs = Long.MIN_VALUE;

    @Override
    public void onFrame(Frame frame) {
        timeNs = frame.timeNs();
        if (firstNs == Long.MIN_VALUE) {
            firstNs = timeNs;
        }
    }

    /** Data time of the first frame, Long.MIN_VALUE before it. */
    public long firstNs() {
        return firstNs;
    }

    public long timeNs() {
        return timeNs;
    }

    /** Hundredths of a second. */
    public long timeCs() {
        return timeNs / 10_000_000L;
    }
}
