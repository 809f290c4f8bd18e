package org.pointcall.models.train;

import java.util.Objects;

import org.pointcall.models.balance.NeighbourDistance;
import org.pointcall.models.balance.SmoteSettings;
import org.pointcall.shared.error.Plain;

/**
 * How the training side of a split is balanced.
 *
 * @param method     the method
 * @param ratio      undersample: majority rows kept per row of the largest other class (positive); smote:
 *                   majority rows per row of each raised class (at least 1); NaN for the other methods
 * @param neighbours smote: nearest neighbours drawn towards (at least 1); ignored otherwise
 * @param distance   smote: how nearness is measured; ignored otherwise
 */
public record BalanceSettings(BalanceMethod method, double ratio, int neighbours, NeighbourDistance distance) {
    public BalanceSettings {
        Objects.requireNonNull(method, "method");
        Objects.requireNonNull(distance, "distance");
        if (method == BalanceMethod.UNDERSAMPLE && !(ratio > 0 && Double.isFinite(ratio))) {
            throw new IllegalArgumentException("undersampling ratio must be a positive number, got " + ratio);
        }
        if (method == BalanceMethod.SMOTE && !(ratio >= 1 && Double.isFinite(ratio))) {
            throw new IllegalArgumentException("SMOTE ratio must be at least 1, got " + ratio);
        }
        if (!method.takesRatio()) {
            ratio = Double.NaN;
        }
        if (neighbours < 1) {
            throw new IllegalArgumentException("SMOTE needs at least 1 neighbour, got " + neighbours);
        }
    }

    public static BalanceSettings none() {
        return new BalanceSettings(BalanceMethod.NONE, Double.NaN, SmoteSettings.DEFAULT_K,
                NeighbourDistance.STANDARDISED);
    }

    public static BalanceSettings undersample(double ratio) {
        return new BalanceSettings(BalanceMethod.UNDERSAMPLE, ratio, SmoteSettings.DEFAULT_K,
                NeighbourDistance.STANDARDISED);
    }

    /** SMOTE with the published k = 5 and distances on standardised features. */
    public static BalanceSettings smote(double ratio) {
        return new BalanceSettings(BalanceMethod.SMOTE, ratio, SmoteSettings.DEFAULT_K,
                NeighbourDistance.STANDARDISED);
    }

    public static BalanceSettings classWeights() {
        return new BalanceSettings(BalanceMethod.CLASS_WEIGHTS, Double.NaN, SmoteSettings.DEFAULT_K,
                NeighbourDistance.STANDARDISED);
    }

    /** Short words for reports and model files: {@code undersample 3:1}, {@code smote 1:1 k=5}. */
    public String describe() {
        return switch (method) {
            case NONE -> "none";
            case UNDERSAMPLE -> "undersample " + Plain.of(ratio) + ":1";
            case SMOTE -> "smote " + Plain.of(ratio) + ":1 k=" + neighbours + " "
                    + distance.name().toLowerCase(java.util.Locale.ROOT);
            case CLASS_WEIGHTS -> "class-weights";
        };
    }

    /** Whether a classifier of this kind can be trained with this balance. */
    public boolean supports(ClassifierKind kind) {
        return method != BalanceMethod.CLASS_WEIGHTS || kind == ClassifierKind.FOREST;
    }
}
