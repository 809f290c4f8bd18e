package org.pointcall.models.train;

import java.util.LinkedHashMap;
import java.util.Map;

import org.pointcall.shared.error.Plain;

/**
 * Settings of multinomial logistic regression.
 *
 * @param lambda     L2 regularisation weight, at least 0
 * @param tolerance  convergence tolerance of the optimiser, positive
 * @param iterations most optimiser iterations, at least 1
 */
public record LogisticSettings(double lambda, double tolerance, int iterations) {
    public LogisticSettings {
        if (!(lambda >= 0 && Double.isFinite(lambda))) {
            throw new IllegalArgumentException("logistic lambda must be a number >= 0, got " + lambda);
        }
        TreeChecks.positive("logistic tolerance", tolerance);
        TreeChecks.atLeast("logistic iterations", iterations, 1);
    }

    public Map<String, String> asMap() {
        Map<String, String> m = new LinkedHashMap<>();
        m.put("lambda", Plain.of(lambda));
        m.put("tolerance", Plain.of(tolerance));
        m.put("iterations", Integer.toString(iterations));
        return m;
    }
}
