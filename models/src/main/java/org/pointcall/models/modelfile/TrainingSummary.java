package org.pointcall.models.modelfile;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

/**
 * How a model was trained, kept in its file so that a person can tell two models apart and judge one.
 *
 * @param datasets           the data sets (sorties, directories, label files) it was trained on
 * @param rowsPerClass       training rows per class name, after balancing
 * @param balance            how the classes were balanced (for example {@code undersample none 3:1, SMOTE k=5 1:1})
 * @param classifier         the classifier (for example {@code smile.classification.RandomForest})
 * @param classifierSettings its settings by name, as given to it
 * @param crossValidation    cross-validation scores by name (for example {@code macro-f1-mean})
 */
public record TrainingSummary(List<String> datasets, Map<String, Long> rowsPerClass, String balance,
                              String classifier, Map<String, String> classifierSettings,
                              Map<String, Double> crossValidation) {
    public TrainingSummary {
        datasets = List.copyOf(datasets);
        rowsPerClass = ordered(rowsPerClass);
        balance = Objects.requireNonNullElse(balance, "");
        classifier = Objects.requireNonNull(classifier, "classifier");
        classifierSettings = ordered(classifierSettings);
        crossValidation = ordered(crossValidation);
        for (Map.Entry<String, Long> e : rowsPerClass.entrySet()) {
            if (e.getValue() == null || e.getValue() < 0) {
                throw new IllegalArgumentException("rows of class " + e.getKey() + " must be >= 0");
            }
        }
    }

    private static <V> Map<String, V> ordered(Map<String, V> m) {
        for (Map.Entry<String, V> e : m.entrySet()) {
            Objects.requireNonNull(e.getKey(), "key");
            Objects.requireNonNull(e.getValue(), e.getKey());
        }
        return Collections.unmodifiableMap(new LinkedHashMap<>(m));
    }
}
