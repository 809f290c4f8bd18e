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

    /** A group written as {@code NAME: P1, P2, ...} (the settings file's and the console's group editor's form). */
    public static TraceGroup parse(String text) {
        int colon = text.indexOf(':');
        if (colon < 1) {
            throw new IllegalArgumentException("a group is 'NAME: P1, P2, ...', got '" + text.strip() + "'");
        }
        java.util.List<String> params = new java.util.ArrayList<>();
        for (String p : text.substring(colon + 1).split(",")) {
            if (!p.isBlank()) {
                params.add(p.strip());
            }
        }
        return new TraceGroup(text.substring(0, colon).strip(), params);
    }

    /** The group as {@link #parse} reads it. */
    public String text() {
        return name + ": " + String.join(", ", parameters);
    }
}
