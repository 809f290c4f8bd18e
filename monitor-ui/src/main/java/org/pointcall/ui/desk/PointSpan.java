package org.pointcall.ui.desk;

import java.util.Objects;

/**
 * Where a point began and ended on the data time axis, for the chart markers.
 *
 * @param pointId card id, or the detected kind when unbound
 * @param beginS  data time it began, seconds
 * @param endS    data time it ended, NaN while it is still being flown
 */
public record PointSpan(String pointId, double beginS, double endS) {
    public PointSpan {
        Objects.requireNonNull(pointId, "pointId");
        if (!Double.isFinite(beginS)) {
            throw new IllegalArgumentException("a point span needs a finite begin time");
        }
    }

    public boolean open() {
        return Double.isNaN(endS);
    }
}
