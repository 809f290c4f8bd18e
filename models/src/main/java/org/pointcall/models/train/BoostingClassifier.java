package org.pointcall.models.train;

import smile.classification.GradientTreeBoost;
import smile.data.Tuple;
import smile.math.MathEx;

/**
 * Gradient tree boosting (Smile's {@link GradientTreeBoost}: for more than two classes, one regression tree per
 * class per round on the softmax loss). Prediction goes through one {@link Tuple} over a reused array; Smile's own
 * call still allocates a projected tuple per call and per tree, which we cannot avoid without reaching into its
 * private fields.
 */
public final class BoostingClassifier extends Classifier {
    private static final long serialVersionUID = 1L;

    private final GradientTreeBoost model;

    private transient double[] row;
    private transient Tuple tuple;

    private BoostingClassifier(TrainingData data, FeaturePrep prep, BoostingSettings settings,
                               GradientTreeBoost model) {
        super(ClassifierKind.BOOSTING, data.featureNames, data.map, data.outputClass, prep, data.rowsPerClass,
                settings.asMap());
        this.model = model;
    }

    static BoostingClassifier fit(TrainingData data, BoostingSettings s, long seed) {
        FeaturePrep prep = FeaturePrep.fit(data.x, data.n, data.d, false, data.names());
        double[][] x = prep.applyAll(data.x, data.n);
        // boosting draws its row samples from Smile's generator of the calling thread
        MathEx.setSeed(seed);
        GradientTreeBoost g = GradientTreeBoost.fit(SmileFrames.FORMULA, SmileFrames.of(x, data.y), s.trees(),
                s.maxDepth(), s.maxNodes(), s.nodeSize(), s.shrinkage(), s.sample());
        return new BoostingClassifier(data, prep, s, g);
    }

    public GradientTreeBoost smileModel() {
        return model;
    }

    /** Smile's importance of each feature, in feature order. */
    public double[] importance() {
        return model.importance().clone();
    }

    @Override
    void predictOutputs(double[] x, double[] out) {
        if (tuple == null) {
            row = new double[x.length];
            tuple = Tuple.of(row, model.schema());
        }
        System.arraycopy(x, 0, row, 0, row.length);
        model.predict(tuple, out);
    }

    @Override
    void resetBuffers() {
        row = null;
        tuple = null;
    }
}
