package org.pointcall.models.metrics;

/**
 * Event counts and scores of one kind (or of all kinds together).
 *
 * @param truePoints points really flown
 * @param detected   points the detector reported
 * @param matched    detected points matched one-to-one to a true one
 */
public record KindScore(int truePoints, int detected, int matched) {
    public KindScore {
        if (matched > truePoints || matched > detected || matched < 0) {
            throw new IllegalArgumentException("matched " + matched + " of " + truePoints + " true and " + detected
                    + " detected points");
        }
    }

    /** Matched share of the detected points; NaN when nothing was detected. */
    public double precision() {
        return detected == 0 ? Double.NaN : matched / (double) detected;
    }

    /** Matched share of the true points; NaN when there were none. */
    public double recall() {
        return truePoints == 0 ? Double.NaN : matched / (double) truePoints;
    }

    /** {@code 2 matched / (true + detected)}, the harmonic mean of precision and recall; NaN when both are 0. */
    public double f1() {
        return truePoints + detected == 0 ? Double.NaN : 2.0 * matched / (truePoints + detected);
    }

    public int falsePoints() {
        return detected - matched;
    }

    public int missed() {
        return truePoints - matched;
    }
}
