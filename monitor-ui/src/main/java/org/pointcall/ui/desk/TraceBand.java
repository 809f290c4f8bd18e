package org.pointcall.ui.desk;

import java.util.Objects;

/**
 * A tolerance band to draw on a strip-chart trace, in the trace's (dictionary) unit.
 *
 * @param parameter dictionary parameter the trace shows
 * @param low       lower edge, {@code -Infinity} when open
 * @param high      upper edge, {@code +Infinity} when open
 * @param label     short text, e.g. {@code SL-1 entry}
 */
public record TraceBand(String parameter, double low, double high, String label) {
    public TraceBand {
        Objects.requireNonNull(parameter, "parameter");
        if (!(low < high)) {
            throw new IllegalArgumentException("trace band on " + parameter + " needs low < high");
        }
        label = label == null ? "" : label;
    }
}
