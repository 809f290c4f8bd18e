package org.pointcall.ui.demo;

import org.pointcall.ingest.frame.Frame;
import org.pointcall.ingest.frame.FrameSink;

/** Frame tap that keeps the newest frame's data time, for other threads to read. */
public final class DataClock implements FrameSink {
    private volatile long timeNs;

    @Override
    public void onFrame(Frame frame) {
        timeNs = frame.timeNs();
    }

    public long timeNs() {
        return timeNs;
    }

    /** Hundredths of a second. */
    public long timeCs() {
        return timeNs / 10_000_000L;
    }
}
