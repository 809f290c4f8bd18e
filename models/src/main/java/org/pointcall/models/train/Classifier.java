package org.pointcall.models.train;

import java.io.Serializable;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.Objects;

import org.pointcall.models.data.LabelledRows;

/**
 * A trained classifier of feature rows: for one row, the probability of every class of
 * {@link LabelledRows#CLASS_NAMES} ({@code none} and the manoeuvre kinds). A class with no training row gets
 * probability 0. Missing (NaN) features are replaced by their training medians (the {@link FeaturePrep} is part of
 * the model).
 *
 * <p>{@link #predict(double[], double[])} reuses buffers held by the instance, so one instance serves one thread;
 * {@link #copy()} gives another thread its own buffers over the same (immutable) trained model. The forest, the
 * logistic regression and the SVM allocate nothing per call; the boosting model allocates inside Smile (a few
 * small objects per call, see the models README).
 *
 * <p>Serializable, for {@link org.pointcall.models.modelfile.ModelFiles}: it holds only Smile's model, primitive
 * arrays, strings and classes of this package, which the model file's allow-list admits.
 */
public abstract class Classifier implements Serializable, Cloneable {
    private static final long serialVersionUID = 1L;

    private final ClassifierKind kind;
    private final String[] featureNames;
    /** Null: the model reads the extractor's features as they are (and files written before it existed). */
    private final FeatureMap map;
    /** Class index (of {@link LabelledRows#CLASS_NAMES}) of each of the model's outputs, ascending. */
    private final int[] outputClass;
    private final FeaturePrep prep;
    private final long[] trainingRowsPerClass;
    private final String[] settingKeys;
    private final String[] settingValues;

    private transient double[] mapped;
    private transient double[] prepared;
    private transient double[] outputs;

    /**
     * @param outputClass class index of each model output, ascending
     * @param trainingRowsPerClass rows of each class the model was fitted on (after balancing)
     */
    Classifier(ClassifierKind kind, List<String> featureNames, FeatureMap map, int[] outputClass, FeaturePrep prep,
               long[] trainingRowsPerClass, Map<String, String> settings) {
        this.kind = Objects.requireNonNull(kind, "kind");
        this.featureNames = featureNames.toArray(new String[0]);
        this.map = map;
        if (map != null && map.inputCount() != this.featureNames.length) {
            throw new IllegalArgumentException("feature map reads " + map.inputCount() + " features, the model "
                    + this.featureNames.length);
        }
        this.outputClass = outputClass.clone();
        this.prep = Objects.requireNonNull(prep, "prep");
        this.trainingRowsPerClass = trainingRowsPerClass.clone();
        this.settingKeys = settings.keySet().toArray(new String[0]);
        this.settingValues = settings.values().toArray(new String[0]);
        int modelFeatures = map == null ? this.featureNames.length : map.outputCount();
        if (prep.featureCount() != modelFeatures) {
            throw new IllegalArgumentException("prep has " + prep.featureCount() + " features, the model "
                    + modelFeatures);
        }
    }

    public final ClassifierKind kind() {
        return kind;
    }

    public final List<String> featureNames() {
        return List.of(featureNames);
    }

    public final int featureCount() {
        return featureNames.length;
    }

    /** The features the model itself was fitted on: {@link #featureNames()} mapped, or those when unmapped. */
    public final List<String> modelFeatureNames() {
        return map == null ? featureNames() : map.outputNames();
    }

    /** What the model does to the extractor's features first, null for nothing. */
    public final FeatureMap featureMap() {
        return map;
    }

    /** Length of the posterior array {@link #predict} fills: every class of {@link LabelledRows#CLASS_NAMES}. */
    public final int classCount() {
        return LabelledRows.classCount();
    }

    /** Whether the model saw rows of class {@code c} (it can answer only those). */
    public final boolean knows(int c) {
        return Arrays.binarySearch(outputClass, c) >= 0;
    }

    /** Training rows per class name after balancing, classes with none left out, in class order. */
    public final Map<String, Long> trainingRowsPerClass() {
        Map<String, Long> m = new java.util.LinkedHashMap<>();
        for (int c = 0; c < trainingRowsPerClass.length; c++) {
            if (trainingRowsPerClass[c] > 0) {
                m.put(LabelledRows.CLASS_NAMES.get(c), trainingRowsPerClass[c]);
            }
        }
        return java.util.Collections.unmodifiableMap(m);
    }

    /** The settings it was trained with, by config key. */
    public final Map<String, String> settings() {
        Map<String, String> m = new java.util.LinkedHashMap<>();
        for (int i = 0; i < settingKeys.length; i++) {
            m.put(settingKeys[i], settingValues[i]);
        }
        return java.util.Collections.unmodifiableMap(m);
    }

    public final FeaturePrep prep() {
        return prep;
    }

    /**
     * Class probabilities of one feature row.
     *
     * @param features  the row, at least {@link #featureCount()} values in the model's feature order; NaN for a
     *                  missing value
     * @param posterior filled with the probability of each class index, length {@link #classCount()}; sums to 1
     * @return the most probable class (the lowest index on a tie)
     */
    public final int predict(double[] features, double[] posterior) {
        if (posterior.length != LabelledRows.classCount()) {
            throw new IllegalArgumentException("posterior has " + posterior.length + " entries, "
                    + LabelledRows.classCount() + " classes needed");
        }
        if (features.length < featureNames.length) {
            throw new IllegalArgumentException("row has " + features.length + " values, " + featureNames.length
                    + " features needed");
        }
        if (prepared == null) {
            prepared = new double[prep.featureCount()];
            mapped = map == null ? null : new double[map.outputCount()];
            outputs = new double[outputClass.length];
        }
        if (map == null) {
            prep.apply(features, prepared);
        } else {
            map.apply(features, mapped);
            prep.apply(mapped, prepared);
        }
        predictOutputs(prepared, outputs);
        Arrays.fill(posterior, 0.0);
        int best = 0;
        for (int j = 0; j < outputClass.length; j++) {
            posterior[outputClass[j]] = outputs[j];
            if (outputs[j] > outputs[best]) {
                best = j;
            }
        }
        return outputClass[best];
    }

    /** Most probable class of every row of {@code rows} (whose features must be the model's). */
    public final int[] predict(LabelledRows rows) {
        if (!rows.featureNames().equals(featureNames())) {
            throw new IllegalArgumentException("rows have other features than the model");
        }
        int[] out = new int[rows.rows()];
        double[] row = new double[rows.featureCount()];
        double[] p = new double[classCount()];
        for (int i = 0; i < out.length; i++) {
            rows.copyRow(i, row);
            out[i] = predict(row, p);
        }
        return out;
    }

    /**
     * The model's probabilities of its outputs (one per known class, ascending class index) for a prepared row.
     * Must not allocate where Smile allows.
     */
    abstract void predictOutputs(double[] x, double[] out);

    /** An instance over the same trained model with buffers of its own, for use on another thread. */
    public final Classifier copy() {
        try {
            Classifier c = (Classifier) super.clone();
            c.prepared = null;
            c.mapped = null;
            c.outputs = null;
            c.resetBuffers();
            return c;
        } catch (CloneNotSupportedException e) {
            throw new AssertionError(e);
        }
    }

    /** Drops a subclass's own transient buffers in a copy (they are made again on first use). */
    void resetBuffers() {
    }

    int outputCount() {
        return outputClass.length;
    }

    @Override
    public String toString() {
        return kind.key() + " classifier over " + featureNames.length + " features, " + outputClass.length
                + " classes " + settings();
    }
}
