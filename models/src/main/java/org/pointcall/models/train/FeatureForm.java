package org.pointcall.models.train;

import java.util.Arrays;
import java.util.List;
import java.util.Optional;

/**
 * What a classifier is fitted on: the extractor's window statistics as they are, or with the levels that belong to
 * one airframe (its speeds, its trim angle of attack and elevator, its altitudes) taken relative to a slow running
 * baseline ({@link FeatureMap#relative}).
 */
public enum FeatureForm {
    /** The window statistics as the extractor gives them. */
    RAW("raw"),
    /** Airframe levels relative to the parameter's longest window mean; speeds also as a share of it. */
    RELATIVE("relative");

    private final String key;

    FeatureForm(String key) {
        this.key = key;
    }

    /** The config key, {@code raw} or {@code relative}. */
    public String key() {
        return key;
    }

    public static Optional<FeatureForm> byKey(String key) {
        return Arrays.stream(values()).filter(f -> f.key.equals(key)).findFirst();
    }

    public static List<String> keys() {
        return Arrays.stream(values()).map(FeatureForm::key).toList();
    }

    /** The map from the extractor's features to the model's, null for {@link #RAW} (nothing to do). */
    FeatureMap mapFor(List<String> rawNames) {
        return this == RAW ? null : FeatureMap.relative(rawNames);
    }
}
