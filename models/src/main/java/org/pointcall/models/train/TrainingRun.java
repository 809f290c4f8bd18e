package org.pointcall.models.train;

import java.util.Objects;

/**
 * A training run's result: the evaluation and the final classifier (fitted on every row not held out).
 */
public record TrainingRun(TrainingReport report, Classifier classifier) {
    public TrainingRun {
        Objects.requireNonNull(report, "report");
        Objects.requireNonNull(classifier, "classifier");
    }
}
