package org.pointcall.ui.settings;

import java.util.List;
import java.util.Objects;

/**
 * A strip-chart group: parameters shown together, one lane each, on a shared time axis.
 *
 * @param name       the group's heading
 * @param parameters dictionary parameter names, top to bottom
 */
public record TraceGroup(String name, List<String> parameters) {
    public TraceGroup {
        Objects.requireNonNull(name, "name");
        parameters = List.copyOf(parameters);
        if (name.isBlank()) {
            throw new IllegalArgumentException("a chart group needs a name");
        }
        if (parameters.isEmpty()) {
            throw new IllegalArgumentException("chart group '" + name + "' has no parameters");
        }
    }
}
