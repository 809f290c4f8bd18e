package org.pointcall.ingest.window;

/**
 * The statistics computed over every window, in their order inside a window's block of the feature vector.
 * Definitions (all over the samples whose time lies in {@code [t - L, t]}, unweighted by time):
 * <ul>
 *   <li>{@link #MEAN}: arithmetic mean;</li>
 *   <li>{@link #STD}: sample standard deviation (divisor n - 1), 0 for a single sample; the same convention as
 *   Apache Commons Math's {@code DescriptiveStatistics#getStandardDeviation};</li>
 *   <li>{@link #MIN}, {@link #MAX}: extreme values;</li>
 *   <li>{@link #SLOPE}: ordinary least-squares slope of value against time, in value units per second; NaN for
 *   fewer than two samples, exactly 0 for a constant window;</li>
 *   <li>{@link #CHANGE}: last value minus first value.</li>
 * </ul>
 */
public enum Stat {
    MEAN("mean"),
    STD("std"),
    MIN("min"),
    MAX("max"),
    SLOPE("slope"),
    CHANGE("change");

    /** Number of statistics per window; a window's block in the feature vector has this length. */
    public static final int COUNT = values().length;

    private final String label;

    Stat(String label) {
        this.label = label;
    }

    /** Short label used in feature names, for example {@code slope} in {@code AoA.slope.0.5s}. */
    public String label() {
        return label;
    }
}
