package org.pointcall.models.metrics;

/**
 * Spread of a timing difference over the matched points, s (quantiles as {@link Percentiles}); NaN when there is
 * none.
 *
 * @param count      values summarised
 * @param medianS    median of the signed value (for an error, detected minus true: the bias)
 * @param p95S       95th percentile of the signed value
 * @param absMedianS median of the absolute value
 * @param absP95S    95th percentile of the absolute value
 */
public record TimingSummary(int count, double medianS, double p95S, double absMedianS, double absP95S) {
    public static TimingSummary of(double[] valuesS) {
        double[] abs = new double[valuesS.length];
        for (int i = 0; i < abs.length; i++) {
            abs[i] = Math.abs(valuesS[i]);
        }
        return new TimingSummary(valuesS.length, Percentiles.median(valuesS), Percentiles.of(valuesS, 0.95),
                Percentiles.median(abs), Percentiles.of(abs, 0.95));
    }
}
