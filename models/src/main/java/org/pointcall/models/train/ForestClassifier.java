package org.pointcall.models.train;

import java.util.stream.LongStream;

import org.pointcall.models.balance.ClassWeights;

import smile.base.cart.DecisionNode;
import smile.base.cart.SplitRule;
import smile.classification.DecisionTree;
import smile.classification.RandomForest;
import smile.data.Tuple;

/**
 * A random forest (Smile's {@link RandomForest}, Gini splits). Soft prediction averages the leaves' class
 * frequencies weighted as Smile weighs its trees; it is done here tree by tree, exactly as Smile's
 * {@code predict(Tuple, double[])} does, but through one {@link Tuple} over a reused array and a reused leaf
 * buffer, so a call allocates nothing (Smile's own call makes a projected tuple and an array per call).
 */
public final class ForestClassifier extends Classifier {
    private static final long serialVersionUID = 1L;

    private final RandomForest forest;

    private transient DecisionTree[] trees;
    private transient double[] treeWeight;
    private transient double[] row;
    private transient Tuple tuple;
    private transient double[] leaf;

    private ForestClassifier(TrainingData data, FeaturePrep prep, ForestSettings settings, RandomForest forest) {
        super(ClassifierKind.FOREST, data.featureNames, data.map, data.outputClass, prep, data.rowsPerClass, settings.asMap());
        this.forest = forest;
    }

    /**
     * @param classWeights whether to draw each tree's sample per class in inverse proportion to its frequency
     *                     (inverse-frequency class weights as Smile's forest takes them: integer divisors of each
     *                     class's share of the sample)
     */
    static ForestClassifier fit(TrainingData data, ForestSettings s, boolean classWeights, long seed) {
        FeaturePrep prep = FeaturePrep.fit(data.x, data.n, data.d, false, data.names());
        double[][] x = prep.applyAll(data.x, data.n);
        int mtry = s.splitFeatures() == 0 ? Math.max(1, (int) Math.floor(Math.sqrt(data.d)))
                : Math.min(s.splitFeatures(), data.d);
        int maxNodes = s.maxNodes() == 0 ? Math.max(2, data.n / 5) : s.maxNodes();
        int[] divisors = classWeights ? divisors(data) : null;
        RandomForest rf = RandomForest.fit(SmileFrames.FORMULA, SmileFrames.of(x, data.y), s.trees(), mtry,
                SplitRule.GINI, s.maxDepth(), maxNodes, s.nodeSize(), s.sample(), divisors,
                treeSeeds(seed, s.trees()));
        return new ForestClassifier(data, prep, s, rf);
    }

    /**
     * Per-output divisors from {@link ClassWeights#inverseFrequency}: {@code round(w_max / w_c)}, so the rarest
     * class is drawn whole and a class {@code m} times as frequent is divided by {@code m}.
     */
    static int[] divisors(TrainingData data) {
        double[] w = ClassWeights.inverseFrequency(data.y, data.outputs());
        double max = 0;
        for (double v : w) {
            max = Math.max(max, v);
        }
        int[] div = new int[w.length];
        for (int j = 0; j < w.length; j++) {
            div[j] = Math.max(1, (int) Math.round(max / w[j]));
        }
        return div;
    }

    /** One seed per tree from the run's seed; Smile seeds each tree's own generator with it. */
    static LongStream treeSeeds(long seed, int trees) {
        java.util.SplittableRandom r = new java.util.SplittableRandom(seed);
        long[] seeds = new long[trees];
        for (int i = 0; i < trees; i++) {
            // Smile ignores a seed <= 1 (it then keeps the thread's generator as it is)
            seeds[i] = 2 + (r.nextLong() >>> 1) % (Long.MAX_VALUE - 2);
        }
        return LongStream.of(seeds);
    }

    /** Smile's model. */
    public RandomForest smileModel() {
        return forest;
    }

    /**
     * Smile's variable importance of each feature, in feature order: the Gini impurity decrease of every split on
     * it, summed over all trees.
     */
    public double[] importance() {
        return forest.importance().clone();
    }

    @Override
    void predictOutputs(double[] x, double[] out) {
        if (tuple == null) {
            RandomForest.Model[] models = forest.models();
            trees = new DecisionTree[models.length];
            treeWeight = new double[models.length];
            for (int i = 0; i < models.length; i++) {
                trees[i] = models[i].tree;
                treeWeight[i] = models[i].weight;
            }
            row = new double[x.length];
            tuple = Tuple.of(row, forest.schema());
            leaf = new double[out.length];
        }
        System.arraycopy(x, 0, row, 0, row.length);
        java.util.Arrays.fill(out, 0.0);
        for (int t = 0; t < trees.length; t++) {
            DecisionNode node = (DecisionNode) trees[t].root().predict(tuple);
            node.posteriori(leaf);
            double w = treeWeight[t];
            for (int j = 0; j < out.length; j++) {
                out[j] += w * leaf[j];
            }
        }
        double sum = 0;
        for (double v : out) {
            sum += v;
        }
        if (!(sum > 0)) {
            // every tree weighed 0 (no out-of-bag accuracy): fall back to equal weights rather than NaN
            java.util.Arrays.fill(out, 1.0 / out.length);
            return;
        }
        for (int j = 0; j < out.length; j++) {
            out[j] /= sum;
        }
    }

    @Override
    void resetBuffers() {
        trees = null;
        treeWeight = null;
        row = null;
        tuple = null;
        leaf = null;
    }
}
