package org.pointcall.ingest.wire;

import org.pointcall.ingest.frame.Frame;
import org.pointcall.ingest.frame.FrameSink;
import org.pointcall.shared.dictionary.ParameterDictionary;

/**
 * Receives decoded frames of every stream of a decoder, on the decoding thread. The frame is reused: copy it to
 * keep it.
 */
@FunctionalInterface
public interface StreamFrameSink {
    /**
     * @param receiveTimeNs the receiver's clock when the datagram that completed this frame arrived (for latency:
     *                      compare with the frame time when both clocks agree)
     */
    void onFrame(int streamId, Frame frame, long receiveTimeNs);

    /** The stream's frames from now on follow this dictionary. Called before the first frame that uses it. */
    default void onDictionary(int streamId, ParameterDictionary dictionary) {
    }

    /** Adapts a plain frame sink: every stream's frames go to it, stream id and receive time dropped. */
    static StreamFrameSink of(FrameSink sink) {
        return (streamId, frame, receiveTimeNs) -> sink.onFrame(frame);
    }
}
