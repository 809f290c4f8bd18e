package org.pointcall.ingest.pipeline;

import java.util.Arrays;

import org.pointcall.ingest.frame.Frame;
import org.pointcall.ingest.wire.StreamFrameSink;
import org.pointcall.shared.dictionary.ParameterDictionary;

/**
 * Routes a decoder's frames to one {@link StreamStage} per stream, creating a stage when a stream's dictionary is
 * learnt. Streams are few, so a linear scan of a small array beats a map and boxes nothing.
 */
public final class StreamStages implements StreamFrameSink {
    private final StageFactory factory;
    private int[] ids = new int[0];
    private StreamStage[] stages = new StreamStage[0];
    private volatile StreamStage[] published = stages;

    public StreamStages(StageFactory factory) {
        this.factory = factory;
    }

    @Override
    public void onDictionary(int streamId, ParameterDictionary dictionary) {
        StreamStage stage = factory.create(streamId, dictionary);
        int i = find(streamId);
        if (i >= 0) {
            stages[i] = stage;
        } else {
            ids = Arrays.copyOf(ids, ids.length + 1);
            stages = Arrays.copyOf(stages, stages.length + 1);
            ids[ids.length - 1] = streamId;
            stages[stages.length - 1] = stage;
        }
        published = stages.clone();
    }

    @Override
    public void onFrame(int streamId, Frame frame, long receiveTimeNs) {
        int i = find(streamId);
        if (i >= 0) {
            stages[i].onFrame(frame, receiveTimeNs);
        }
    }

    private int find(int streamId) {
        for (int i = 0; i < ids.length; i++) {
            if (ids[i] == streamId) {
                return i;
            }
        }
        return -1;
    }

    /** The stages so far, safe to read from any thread (a copy made when a stage was added). */
    public StreamStage[] stages() {
        return published;
    }
}
