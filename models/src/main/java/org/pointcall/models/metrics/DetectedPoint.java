package org.pointcall.models.metrics;

import java.util.Objects;

import org.pointcall.shared.kind.ManoeuvreKind;

/**
 * A test point a detector reported, in seconds of the recording's time line.
 *
 * @param kind        the manoeuvre detected
 * @param beginS      begin as finally reported (after refinement), s
 * @param endS        end, s; after the begin
 * @param reportedAtS data time at which the detector first reported the begin live, s; NaN when it was not
 *                    reported live (an offline run)
 */
public record DetectedPoint(ManoeuvreKind kind, double beginS, double endS, double reportedAtS) {
    public DetectedPoint {
        Objects.requireNonNull(kind, "kind");
        if (!(endS > beginS) || !Double.isFinite(beginS) || !Double.isFinite(endS)) {
            throw new IllegalArgumentException("a detected point needs finite times with end after begin, got ["
                    + beginS + ", " + endS + "]");
        }
        if (Double.isInfinite(reportedAtS)) {
            throw new IllegalArgumentException("reportedAtS must be finite or NaN");
        }
    }

    /** A point found offline, with no live report time. */
    public static DetectedPoint offline(ManoeuvreKind kind, double beginS, double endS) {
        return new DetectedPoint(kind, beginS, endS, Double.NaN);
    }
}
