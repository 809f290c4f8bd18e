package org.pointcall.ingest.window;

/** What the feature vector holds for a window that is not {@linkplain FeatureListener valid}. */
public enum InvalidWindowPolicy {
    /** Every statistic of an invalid window is NaN; its coverage fraction still says how much data it had. */
    NAN,
    /**
     * Statistics are computed over whatever samples the window holds (NaN only where undefined: no sample at all,
     * or a slope from one sample); the validity flag is the only sign that the window is short or gapped.
     */
    KEEP
}
