package org.pointcall.ingest.pipeline;

import org.pointcall.shared.dictionary.ParameterDictionary;

/** Builds the stage of a stream when its dictionary becomes known (first announce, or a dictionary change). */
@FunctionalInterface
public interface StageFactory {
    StreamStage create(int streamId, ParameterDictionary dictionary);
}
