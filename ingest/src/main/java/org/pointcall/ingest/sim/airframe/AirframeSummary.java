package org.pointcall.ingest.sim.airframe;

import java.util.Objects;

/** A built-in airframe's name and one-line description, for listings. */
public record AirframeSummary(String name, String description) {
    public AirframeSummary {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(description, "description");
    }
}
