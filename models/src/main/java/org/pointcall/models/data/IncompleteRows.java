package org.pointcall.models.data;

/** What a data set does with a decision tick at which some feature is NaN (a window short of data or gapped). */
public enum IncompleteRows {
    /** Leave the tick out and count it: classifiers are trained on complete rows only. */
    DROP,
    /** Keep it with its NaN features, for a person looking at the data or a model that takes missing values. */
    KEEP
}
