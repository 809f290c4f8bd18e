package org.pointcall.models.train;

import java.util.LinkedHashMap;
import java.util.Map;

import org.pointcall.shared.error.Plain;

/**
 * Settings of the random forest.
 *
 * @param trees           number of trees, at least 1
 * @param maxDepth        deepest a tree grows, at least 2
 * @param maxNodes        most leaves per tree, at least 2; 0 for Smile's default of a fifth of the training rows
 * @param nodeSize        fewest rows a leaf may hold, at least 1
 * @param splitFeatures   features tried at each split, at least 0; 0 for the square root of the feature count
 * @param sample          share of the rows drawn for each tree: 1 draws with replacement (a bootstrap), below 1
 *                        without; in (0, 1]
 */
public record ForestSettings(int trees, int maxDepth, int maxNodes, int nodeSize, int splitFeatures, double sample) {
    public ForestSettings {
        TreeChecks.atLeast("forest trees", trees, 1);
        TreeChecks.atLeast("forest max-depth", maxDepth, 2);
        if (maxNodes != 0) {
            TreeChecks.atLeast("forest max-nodes", maxNodes, 2);
        }
        TreeChecks.atLeast("forest node-size", nodeSize, 1);
        TreeChecks.atLeast("forest split-features", splitFeatures, 0);
        TreeChecks.share("forest sample", sample);
    }

    public ForestSettings withTrees(int n) {
        return new ForestSettings(n, maxDepth, maxNodes, nodeSize, splitFeatures, sample);
    }

    public ForestSettings withMaxDepth(int d) {
        return new ForestSettings(trees, d, maxNodes, nodeSize, splitFeatures, sample);
    }

    /** By config key, as given to the classifier. */
    public Map<String, String> asMap() {
        Map<String, String> m = new LinkedHashMap<>();
        m.put("trees", Integer.toString(trees));
        m.put("max-depth", Integer.toString(maxDepth));
        m.put("max-nodes", Integer.toString(maxNodes));
        m.put("node-size", Integer.toString(nodeSize));
        m.put("split-features", Integer.toString(splitFeatures));
        m.put("sample", Plain.of(sample));
        return m;
    }
}
