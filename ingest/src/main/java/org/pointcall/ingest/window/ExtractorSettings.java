package org.pointcall.ingest.window;

import java.util.Objects;

/**
 * How a {@link FeatureExtractor} evaluates its windows.
 *
 * @param decisionRateHz features are evaluated at every multiple of {@code 1 / decisionRateHz} on data time (the
 *                       period is rounded to whole nanoseconds); at most 1000 Hz
 * @param gapFactor      an interval longer than this many nominal sample intervals of a parameter (from the
 *                       dictionary rate) is a gap, unless its {@link WindowSpec#maxGapS()} says otherwise
 * @param minSamples     a window with fewer samples is invalid even if it has no gap; at least 2, so that slope and
 *                       standard deviation are defined in every valid window
 * @param invalidWindow  what the features of an invalid window hold
 */
public record ExtractorSettings(double decisionRateHz, double gapFactor, int minSamples,
                                InvalidWindowPolicy invalidWindow) {

    public ExtractorSettings {
        if (!(decisionRateHz > 0) || decisionRateHz > 1000.0) {
            throw new IllegalArgumentException("decision rate must be in (0, 1000] Hz, got " + decisionRateHz);
        }
        if (!(gapFactor >= 1.0) || Double.isInfinite(gapFactor)) {
            throw new IllegalArgumentException("gap factor must be a finite number >= 1, got " + gapFactor);
        }
        if (minSamples < 2) {
            throw new IllegalArgumentException("min samples must be at least 2, got " + minSamples);
        }
        Objects.requireNonNull(invalidWindow, "invalidWindow");
    }

    /** 20 Hz decisions, gaps beyond 3 nominal intervals, at least 2 samples, NaN features for invalid windows. */
    public static ExtractorSettings defaults() {
        return new ExtractorSettings(20.0, 3.0, 2, InvalidWindowPolicy.NAN);
    }

    public ExtractorSettings withDecisionRateHz(double hz) {
        return new ExtractorSettings(hz, gapFactor, minSamples, invalidWindow);
    }

    public ExtractorSettings withGapFactor(double factor) {
        return new ExtractorSettings(decisionRateHz, factor, minSamples, invalidWindow);
    }

    public ExtractorSettings withMinSamples(int n) {
        return new ExtractorSettings(decisionRateHz, gapFactor, n, invalidWindow);
    }

    public ExtractorSettings withInvalidWindow(InvalidWindowPolicy policy) {
        return new ExtractorSettings(decisionRateHz, gapFactor, minSamples, policy);
    }

    long decisionPeriodNs() {
        return Math.max(1L, Math.round(1e9 / decisionRateHz));
    }
}
