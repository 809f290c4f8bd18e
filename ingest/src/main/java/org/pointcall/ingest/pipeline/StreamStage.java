package org.pointcall.ingest.pipeline;

import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.function.LongSupplier;

import org.pointcall.ingest.derive.DerivedParameters;
import org.pointcall.ingest.frame.Frame;
import org.pointcall.ingest.frame.FrameSink;
import org.pointcall.ingest.window.ExtractorSettings;
import org.pointcall.ingest.window.FeatureExtractor;
import org.pointcall.ingest.window.FeatureListener;
import org.pointcall.ingest.window.WindowSpec;
import org.pointcall.shared.dictionary.ParameterDictionary;

import io.micrometer.core.instrument.Timer;

/**
 * The per-stream part of the pipeline, after decoding: derived parameters, then the frame taps (recorder, console
 * snapshot, safety limits), then the sliding windows whose features go to the detector. Single-threaded: it runs
 * on its pipeline's thread and allocates nothing per frame.
 */
public final class StreamStage implements FrameSink {
    private final int streamId;
    private final ParameterDictionary dictionary;
    private final DerivedParameters derived;
    private final FrameSink[] taps;
    private final FeatureExtractor features;
    private final Timer latency;
    private final LongSupplier nowNs;
    private long frames;
    private long currentReceiveNs = Long.MIN_VALUE;

    /**
     * @param taps     frame consumers after derivation, before windows (each gets the reused frame)
     * @param listener receives the features at every decision tick; may be {@code null} for no windows
     * @param latency  timer of arrival to features ready, or {@code null}
     * @param nowNs    the clock that stamped arrival times
     */
    public StreamStage(int streamId, ParameterDictionary dictionary, List<WindowSpec> windows,
                       ExtractorSettings settings, List<FrameSink> taps, FeatureListener listener, Timer latency,
                       LongSupplier nowNs) {
        this.streamId = streamId;
        this.dictionary = dictionary;
        this.derived = DerivedParameters.bind(dictionary);
        this.taps = taps.toArray(new FrameSink[0]);
        this.latency = latency;
        this.nowNs = nowNs;
        this.features = windows.isEmpty() || listener == null ? null
                : FeatureExtractor.bind(dictionary, windows, settings, timed(listener));
    }

    private FeatureListener timed(FeatureListener listener) {
        if (latency == null) {
            return listener;
        }
        return (timeNs, f, valid, coverage) -> {
            listener.onFeatures(timeNs, f, valid, coverage);
            if (currentReceiveNs != Long.MIN_VALUE) {
                latency.record(nowNs.getAsLong() - currentReceiveNs, TimeUnit.NANOSECONDS);
            }
        };
    }

    public int streamId() {
        return streamId;
    }

    public ParameterDictionary dictionary() {
        return dictionary;
    }

    /** The feature extractor, or {@code null} when the stage has no windows. */
    public FeatureExtractor features() {
        return features;
    }

    public long frames() {
        return frames;
    }

    /** A frame from a file or simulator: no arrival time. */
    @Override
    public void onFrame(Frame frame) {
        onFrame(frame, Long.MIN_VALUE);
    }

    /** A frame that arrived at {@code receiveTimeNs} on the pipeline's clock. */
    public void onFrame(Frame frame, long receiveTimeNs) {
        frames++;
        currentReceiveNs = receiveTimeNs;
        derived.apply(frame);
        for (FrameSink tap : taps) {
            tap.onFrame(frame);
        }
        if (features != null) {
            features.onFrame(frame);
        }
    }
}
