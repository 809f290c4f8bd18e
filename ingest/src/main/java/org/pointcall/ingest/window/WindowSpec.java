package org.pointcall.ingest.window;

import java.util.HashSet;
import java.util.List;
import java.util.Objects;
import java.util.Set;

/**
 * Which parameter to window and over which lengths. The name is resolved to a frame slot once, when a
 * {@link FeatureExtractor} is bound; the slot then appears in the {@link FeatureLayout}.
 *
 * @param parameter dictionary name of the parameter
 * @param windowsS  window lengths in seconds, each positive and at most {@link #MAX_WINDOW_S}, no duplicates; the
 *                  feature vector keeps this order
 * @param maxGapS   largest interval between two samples that still counts as continuous data, in seconds; NaN to
 *                  use the extractor's default ({@link ExtractorSettings#gapFactor()} times the nominal interval)
 */
public record WindowSpec(String parameter, List<Double> windowsS, double maxGapS) {
    /** Longest window accepted: one hour. Longer ones are a configuration mistake at any decision rate we use. */
    public static final double MAX_WINDOW_S = 3600.0;

    public WindowSpec {
        Objects.requireNonNull(parameter, "parameter");
        if (parameter.isBlank()) {
            throw new IllegalArgumentException("a window spec needs a parameter name");
        }
        windowsS = List.copyOf(windowsS);
        if (windowsS.isEmpty()) {
            throw new IllegalArgumentException("window spec for " + parameter + " needs at least one window length");
        }
        Set<Long> seen = new HashSet<>();
        for (double w : windowsS) {
            if (!(w > 0) || w > MAX_WINDOW_S) {
                throw new IllegalArgumentException("window length for " + parameter + " must be in (0, "
                        + MAX_WINDOW_S + "] s, got " + w);
            }
            if (!seen.add(lengthNs(w))) {
                throw new IllegalArgumentException("window length " + w + " s is given twice for " + parameter);
            }
        }
        if (!Double.isNaN(maxGapS) && !(maxGapS > 0 && maxGapS < Double.POSITIVE_INFINITY)) {
            throw new IllegalArgumentException("max gap for " + parameter + " must be a positive number of seconds"
                    + " or NaN for the default, got " + maxGapS);
        }
    }

    /** Windows of the given lengths with the default gap threshold. */
    public static WindowSpec of(String parameter, double... windowsS) {
        Double[] boxed = new Double[windowsS.length];
        for (int i = 0; i < windowsS.length; i++) {
            boxed[i] = windowsS[i];
        }
        return new WindowSpec(parameter, List.of(boxed), Double.NaN);
    }

    public WindowSpec withMaxGapS(double gapS) {
        return new WindowSpec(parameter, windowsS, gapS);
    }

    static long lengthNs(double seconds) {
        return Math.round(seconds * 1e9);
    }
}
