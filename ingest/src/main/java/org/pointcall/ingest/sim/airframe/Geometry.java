package org.pointcall.ingest.sim.airframe;

import static org.pointcall.ingest.sim.airframe.Checks.positive;

/**
 * Reference geometry of the aerodynamic coefficients.
 *
 * @param wingAreaM2 reference wing area S, m^2
 * @param spanM      wing span b, m
 * @param chordM     mean aerodynamic chord c, m
 */
public record Geometry(double wingAreaM2, double spanM, double chordM) {
    public Geometry {
        positive("wingAreaM2", wingAreaM2);
        positive("spanM", spanM);
        positive("chordM", chordM);
    }

    /** Aspect ratio b^2 / S. */
    public double aspectRatio() {
        return spanM * spanM / wingAreaM2;
    }
}
