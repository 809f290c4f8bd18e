package org.pointcall.models.train;

import java.util.LinkedHashMap;
import java.util.Map;

import org.pointcall.shared.error.Plain;

/**
 * Settings of the Gaussian-kernel SVM. Kernel machines cost O(n^2) or more to train and O(support vectors) per
 * prediction, so the SVM is fitted on a class-stratified random subsample of at most {@code rowCap} training rows.
 *
 * @param c               soft-margin penalty, positive
 * @param gamma           kernel width as {@code k(x, y) = exp(-gamma |x - y|^2)} on standardised features,
 *                        positive; NaN for {@code 1 / features} (common practice for standardised inputs)
 * @param tolerance       convergence tolerance, positive
 * @param rowCap          most rows the SVM is fitted on, at least 10
 * @param calibrationRows most training rows, outside the fitted subsample, that the Platt scaling of each class's
 *                        decision value is fitted on, at least 0; when no training row is left over, the scaling
 *                        is fitted on the subsample itself (and is then over-confident)
 */
public record SvmSettings(double c, double gamma, double tolerance, int rowCap, int calibrationRows) {
    public SvmSettings {
        TreeChecks.positive("svm c", c);
        if (!Double.isNaN(gamma)) {
            TreeChecks.positive("svm gamma", gamma);
        }
        TreeChecks.positive("svm tolerance", tolerance);
        TreeChecks.atLeast("svm row-cap", rowCap, 10);
        TreeChecks.atLeast("svm calibration-rows", calibrationRows, 0);
    }

    public SvmSettings withRowCap(int cap) {
        return new SvmSettings(c, gamma, tolerance, cap, calibrationRows);
    }

    /** The gamma used for {@code features} features. */
    public double gammaFor(int features) {
        return Double.isNaN(gamma) ? 1.0 / features : gamma;
    }

    public Map<String, String> asMap() {
        Map<String, String> m = new LinkedHashMap<>();
        m.put("c", Plain.of(c));
        m.put("gamma", Double.isNaN(gamma) ? "auto" : Plain.of(gamma));
        m.put("tolerance", Plain.of(tolerance));
        m.put("row-cap", Integer.toString(rowCap));
        m.put("calibration-rows", Integer.toString(calibrationRows));
        return m;
    }
}
