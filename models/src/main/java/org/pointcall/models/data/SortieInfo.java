package org.pointcall.models.data;

import java.util.Objects;

/**
 * One sortie whose rows are in a {@link LabelledRows} set.
 *
 * @param name      unique name of the sortie in the set (for example {@code sortie-12})
 * @param airframe  the airframe that flew it, or empty when not known (held-out sets are often chosen by it)
 * @param recording the recorded file its rows came from, as given, or empty
 * @param labels    where its labels came from (a label file, a truth file), or empty
 */
public record SortieInfo(String name, String airframe, String recording, String labels) {
    public SortieInfo {
        Objects.requireNonNull(name, "name");
        if (name.isBlank()) {
            throw new IllegalArgumentException("a sortie needs a name");
        }
        airframe = airframe == null ? "" : airframe;
        recording = recording == null ? "" : recording;
        labels = labels == null ? "" : labels;
    }
}
