package org.pointcall.models.train;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/** The classifiers pointcall trains, each over a Smile model, named in the training config by its key. */
public enum ClassifierKind {
    /** Random forest of classification trees; soft votes average the leaves' class frequencies. */
    FOREST("forest", "smile.classification.RandomForest"),
    /** Gradient tree boosting, one regression tree per class per round, softmax over the class scores. */
    BOOSTING("boosting", "smile.classification.GradientTreeBoost"),
    /** Multinomial logistic regression on standardised features. */
    LOGISTIC("logistic", "smile.classification.LogisticRegression"),
    /** Gaussian-kernel SVMs one class against the rest, Platt-scaled, on standardised features. */
    SVM("svm", "smile.classification.OneVersusRest");

    private final String key;
    private final String smileClass;

    ClassifierKind(String key, String smileClass) {
        this.key = key;
        this.smileClass = smileClass;
    }

    /** Name in the training config. */
    public String key() {
        return key;
    }

    /** The Smile class of the trained model, for a model file's summary. */
    public String smileClass() {
        return smileClass;
    }

    public static Optional<ClassifierKind> byKey(String key) {
        for (ClassifierKind k : values()) {
            if (k.key.equals(key)) {
                return Optional.of(k);
            }
        }
        return Optional.empty();
    }

    /** Every key, for messages. */
    public static List<String> keys() {
        List<String> out = new ArrayList<>();
        for (ClassifierKind k : values()) {
            out.add(k.key);
        }
        return out;
    }
}
