package org.pointcall.models.card;

import java.util.Objects;

import org.pointcall.models.detect.DetectorSettings;
import org.pointcall.models.modelfile.ModelDescription;
import org.pointcall.models.train.Classifier;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.dictionary.ParameterDictionary;

/**
 * What a {@link CardSession} is built from.
 *
 * @param dictionary         the stream's dictionary (frames come in its units)
 * @param card               the test card, or null to analyse every detected point with no verdict
 * @param classifier         the detector model's classifier
 * @param model              the model's description (windows, decision rate, features)
 * @param detectorSettings   segmenter settings
 * @param analysers          the manoeuvre analysers
 * @param snapshotIntervalS  data time between published snapshots at most (events publish at once)
 */
public record SessionSetup(ParameterDictionary dictionary, TestCard card, Classifier classifier,
                           ModelDescription model, DetectorSettings detectorSettings, AnalyserLookup analysers,
                           double snapshotIntervalS) {
    /** Default snapshot interval: 40 ms of data time, a console's frame pace. */
    public static final double DEFAULT_SNAPSHOT_INTERVAL_S = 0.04;

    public SessionSetup {
        Objects.requireNonNull(dictionary, "dictionary");
        Objects.requireNonNull(classifier, "classifier");
        Objects.requireNonNull(model, "model");
        Objects.requireNonNull(detectorSettings, "detectorSettings");
        Objects.requireNonNull(analysers, "analysers");
        if (!(snapshotIntervalS >= 0 && Double.isFinite(snapshotIntervalS))) {
            throw new IllegalArgumentException("snapshot interval must be >= 0 s");
        }
    }

    /** Default detector settings and snapshot interval. */
    public static SessionSetup of(ParameterDictionary dictionary, TestCard card, Classifier classifier,
                                  ModelDescription model, AnalyserLookup analysers) {
        return new SessionSetup(dictionary, card, classifier, model, DetectorSettings.defaults(), analysers,
                DEFAULT_SNAPSHOT_INTERVAL_S);
    }
}
