package org.pointcall.ingest.window;

/**
 * Receives the features at every decision tick, on the thread that feeds the extractor. The arrays are owned by the
 * extractor and overwritten at the next tick: a listener that keeps them must copy them.
 *
 * <p>A window is <em>valid</em> when it holds at least the minimum number of samples and data covers all of
 * {@code [t - L, t]}: history reaches back to {@code t - L}, no interval between consecutive samples inside it is a
 * gap (longer than the gap threshold, or spanning a frame flagged {@code Frame.GAP_BEFORE}), and the newest sample
 * is not older than the gap threshold. The coverage fraction is the share of {@code [t - L, t]} that is covered in
 * that sense (1.0 exactly for a valid window).
 */
@FunctionalInterface
public interface FeatureListener {
    /**
     * @param timeNs   the decision instant, data time of the stream
     * @param features one value per {@link FeatureLayout#names() feature name}
     * @param valid    per window ({@link FeatureLayout#windowCount()}), whether it is valid
     * @param coverage per window, covered fraction of its length, in [0, 1]
     */
    void onFeatures(long timeNs, double[] features, boolean[] valid, double[] coverage);
}
