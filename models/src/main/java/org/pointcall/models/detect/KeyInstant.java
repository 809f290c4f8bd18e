package org.pointcall.models.detect;

import java.util.Objects;

/**
 * A named instant inside a detected point, on the stream's data time: {@code break} of a stall (the AoA maximum),
 * {@code apex} of a loop, {@code nz-max} of a wind-up turn. Names are those of the kind's
 * {@link org.pointcall.shared.kind.ManoeuvreKind#keyInstants() key instants} where the kind lists one, so card bands
 * can refer to them.
 *
 * @param name   instant name, lower case with hyphens
 * @param timeNs data time of the instant
 */
public record KeyInstant(String name, long timeNs) {
    public KeyInstant {
        Objects.requireNonNull(name, "name");
        if (name.isBlank()) {
            throw new IllegalArgumentException("a key instant needs a name");
        }
    }
}
