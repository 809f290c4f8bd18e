package org.pointcall.models.train;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/** How training rows are balanced before a classifier is fitted; named in the training config by its key. */
public enum BalanceMethod {
    /** The rows as they are. */
    NONE("none"),
    /** Random undersampling of the majority class ({@link org.pointcall.models.balance.Undersampling}). */
    UNDERSAMPLE("undersample"),
    /** SMOTE oversampling of every other class ({@link org.pointcall.models.balance.Smote}). */
    SMOTE("smote"),
    /**
     * Inverse-frequency class weights ({@link org.pointcall.models.balance.ClassWeights}). Only the forest takes
     * them (as per-class divisors of its bootstrap sample); Smile's boosting, logistic regression and SVM take no
     * row or class weights.
     */
    CLASS_WEIGHTS("class-weights");

    private final String key;

    BalanceMethod(String key) {
        this.key = key;
    }

    public String key() {
        return key;
    }

    /** Whether a ratio goes with the method. */
    public boolean takesRatio() {
        return this == UNDERSAMPLE || this == SMOTE;
    }

    public static Optional<BalanceMethod> byKey(String key) {
        for (BalanceMethod m : values()) {
            if (m.key.equals(key)) {
                return Optional.of(m);
            }
        }
        return Optional.empty();
    }

    public static List<String> keys() {
        List<String> out = new ArrayList<>();
        for (BalanceMethod m : values()) {
            out.add(m.key);
        }
        return out;
    }
}
