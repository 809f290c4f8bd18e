package org.pointcall.models.train;

import smile.classification.LogisticRegression;

/**
 * Multinomial logistic regression (Smile's {@link LogisticRegression}; binomial when only two classes are present)
 * on standardised features, with missing features imputed by their training medians. A call allocates nothing.
 */
public final class LogisticClassifier extends Classifier {
    private static final long serialVersionUID = 1L;

    private final LogisticRegression model;

    private LogisticClassifier(TrainingData data, FeaturePrep prep, LogisticSettings settings,
                               LogisticRegression model) {
        super(ClassifierKind.LOGISTIC, data.featureNames, data.map, data.outputClass, prep, data.rowsPerClass,
                settings.asMap());
        this.model = model;
    }

    static LogisticClassifier fit(TrainingData data, LogisticSettings s) {
        FeaturePrep prep = FeaturePrep.fit(data.x, data.n, data.d, true, data.names());
        double[][] x = prep.applyAll(data.x, data.n);
        LogisticRegression lr = LogisticRegression.fit(x, data.y, s.lambda(), s.tolerance(), s.iterations());
        return new LogisticClassifier(data, prep, s, lr);
    }

    public LogisticRegression smileModel() {
        return model;
    }

    @Override
    void predictOutputs(double[] x, double[] out) {
        model.predict(x, out);
    }
}
