package org.pointcall.ingest.sim.airframe;

import java.util.Objects;

/** The three primary control surfaces. */
public record ControlSurfaces(Surface elevator, Surface aileron, Surface rudder) {
    public ControlSurfaces {
        Objects.requireNonNull(elevator, "elevator");
        Objects.requireNonNull(aileron, "aileron");
        Objects.requireNonNull(rudder, "rudder");
    }
}
