package org.pointcall.models.detect;

import org.pointcall.ingest.frame.Frame;
import org.pointcall.ingest.frame.FrameSink;

/**
 * Turns per-tick class probabilities plus the physics of the frames into {@link PointEvent point events}, live. The
 * life cycle follows data time: {@link #init} once, then frames and ticks interleaved in time order (a tick at
 * {@code T} after the frames up to {@code T}), then {@link #finish}. Everything is on data time passed in; nothing
 * reads a clock. Single-threaded: call it from the stream's pipeline thread only; listeners are called on it.
 */
public interface Detector extends FrameSink {
    /** Starts a run at data time {@code timeNs}: forgets every point, probability and physical value. */
    void init(long timeNs);

    /** Takes the physics of one frame (cheap, allocation-free). Frames not after the previous one are dropped. */
    @Override
    void onFrame(Frame frame);

    /**
     * One decision tick.
     *
     * @param timeNs             data time, after the previous tick's; ticks not after it are dropped and counted
     * @param classProbabilities one probability per class of the detector's {@link ClassLayout}; read during the
     *                           call only. A tick holding a non-finite value is dropped and counted.
     */
    void onTick(long timeNs, double[] classProbabilities);

    /**
     * One decision tick with the classifier's explanation: the names of the features that weighed most, which are
     * quoted in the evidence of a point that begins at this tick. The array is read during the call only; null
     * entries end it.
     */
    void onTick(long timeNs, double[] classProbabilities, String[] topFeatures);

    /** Ends the run at data time {@code timeNs}: an open point is ended (or discarded) now. */
    void finish(long timeNs);

    /** The latest physical state, as filled from the frames; owned by the detector, valid until the next frame. */
    PhysicalState state();
}
