package org.pointcall.replay.record;

import org.pointcall.ingest.frame.Frame;
import org.pointcall.ingest.window.W1Workload;
import org.pointcall.ingest.wire.PacketSink;
import org.pointcall.ingest.wire.StreamEncoder;
import org.pointcall.ingest.wire.WireOptions;
import org.pointcall.shared.dictionary.DictionaryFiles;
import org.pointcall.shared.dictionary.ParameterDictionary;

/**
 * The reference workload W1 (256 parameters at 1,000 frames/s) as a wire stream, frame by frame, the same packets
 * on every run: one second of seeded frames repeated with running times, encoded by a {@link StreamEncoder} with
 * a fixed epoch (two part packets a frame, plus the dictionary announce every second). Single-threaded.
 */
public final class W1Feed {
    public static final long SEED = 20261201L;
    private final ParameterDictionary dictionary = W1Workload.dictionary();
    private final String dictionaryText = DictionaryFiles.toYaml(dictionary);
    private final Frame[] block = W1Workload.frames(W1Workload.FRAME_RATE_HZ, SEED);
    private final Frame frame = Frame.forDictionary(dictionary);
    private final StreamEncoder encoder;
    private long next;

    public W1Feed(int streamId, PacketSink out) {
        this.encoder = new StreamEncoder(streamId, 1, dictionary, dictionaryText, WireOptions.DEFAULT, out);
    }

    public ParameterDictionary dictionary() {
        return dictionary;
    }

    public String dictionaryText() {
        return dictionaryText;
    }

    /** Index of the next frame. */
    public long nextFrame() {
        return next;
    }

    /** Time of frame {@code k}, ns from the stream's start. */
    public static long frameTimeNs(long k) {
        return k * W1Workload.FRAME_INTERVAL_NS;
    }

    /** Encodes the next frame; its packets go to the sink before this returns. */
    public void step() {
        Frame src = block[(int) (next % block.length)];
        frame.copyFrom(src);
        frame.timeNs(frameTimeNs(next));
        frame.sequence(next);
        encoder.onFrame(frame);
        next++;
    }

    public long packets() {
        return encoder.packets();
    }
}
