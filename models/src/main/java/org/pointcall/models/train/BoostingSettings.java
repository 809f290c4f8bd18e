package org.pointcall.models.train;

import java.util.LinkedHashMap;
import java.util.Map;

import org.pointcall.shared.error.Plain;

/**
 * Settings of gradient tree boosting. Each round fits one regression tree per class, so training and prediction
 * cost grow with {@code trees x classes}.
 *
 * @param trees     boosting rounds, at least 1
 * @param maxDepth  deepest a tree grows, at least 2
 * @param maxNodes  most leaves per tree, at least 2
 * @param nodeSize  fewest rows a leaf may hold, at least 1
 * @param shrinkage learning rate, in (0, 1]
 * @param sample    share of the rows drawn (without replacement) for each round, in (0, 1]
 */
public record BoostingSettings(int trees, int maxDepth, int maxNodes, int nodeSize, double shrinkage,
                               double sample) {
    public BoostingSettings {
        TreeChecks.atLeast("boosting trees", trees, 1);
        TreeChecks.atLeast("boosting max-depth", maxDepth, 2);
        TreeChecks.atLeast("boosting max-nodes", maxNodes, 2);
        TreeChecks.atLeast("boosting node-size", nodeSize, 1);
        TreeChecks.share("boosting shrinkage", shrinkage);
        TreeChecks.share("boosting sample", sample);
    }

    public BoostingSettings withTrees(int n) {
        return new BoostingSettings(n, maxDepth, maxNodes, nodeSize, shrinkage, sample);
    }

    public Map<String, String> asMap() {
        Map<String, String> m = new LinkedHashMap<>();
        m.put("trees", Integer.toString(trees));
        m.put("max-depth", Integer.toString(maxDepth));
        m.put("max-nodes", Integer.toString(maxNodes));
        m.put("node-size", Integer.toString(nodeSize));
        m.put("shrinkage", Plain.of(shrinkage));
        m.put("sample", Plain.of(sample));
        return m;
    }
}
