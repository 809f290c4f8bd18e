package org.pointcall.ui.trace;

import java.util.List;
import java.util.Objects;

/**
 * What the charts read: the parameters a {@link SampleRing}'s channels hold, with their display units.
 *
 * @param parameters channel names, in channel order
 * @param units      unit symbol of each channel
 * @param ring       the samples
 */
public record TraceFeed(List<String> parameters, List<String> units, SampleRing ring) {
    public TraceFeed {
        parameters = List.copyOf(parameters);
        units = List.copyOf(units);
        Objects.requireNonNull(ring, "ring");
        if (parameters.size() != ring.channels() || units.size() != ring.channels()) {
            throw new IllegalArgumentException("a trace feed names each channel of its ring once, with a unit");
        }
    }

    /** Channel of a parameter, or -1. */
    public int channel(String parameter) {
        return parameters.indexOf(parameter);
    }
}
