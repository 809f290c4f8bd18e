package org.pointcall.shared.outcome;

import java.util.Objects;

/**
 * One result of a point's analysis.
 *
 * @param name   metric name of the kind ({@code stall-kcas}), or an extra one the analysis reported
 * @param value  in {@code unit}
 * @param unit   the kind registry's unit symbol for the metric; {@code SI} for an extra metric left in SI
 * @param method the method behind it, in plain words; may be empty
 */
public record MetricValue(String name, double value, String unit, String method) {
    public MetricValue {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(unit, "unit");
        method = method == null ? "" : method;
        if (!Double.isFinite(value)) {
            throw new IllegalArgumentException("metric " + name + " must be finite");
        }
    }
}
