package org.pointcall.ingest.frame;

/**
 * Receives frames from a source, one at a time, on the source's thread. The frame is only valid during the call:
 * a sink that keeps it must copy it.
 */
@FunctionalInterface
public interface FrameSink {
    void onFrame(Frame frame);
}
