package org.pointcall.ingest.sim.airframe;

import static org.pointcall.ingest.sim.airframe.Checks.finite;
import static org.pointcall.ingest.sim.airframe.Checks.positive;

import org.pointcall.shared.error.Plain;

/**
 * A control surface and its actuator: the command is clamped to the travel, the surface follows it with a
 * first-order lag and never faster than the rate limit.
 *
 * @param minRad        lower travel limit, rad
 * @param maxRad        upper travel limit, rad
 * @param rateRadS      rate limit, rad/s
 * @param timeConstantS actuator lag, s
 */
public record Surface(double minRad, double maxRad, double rateRadS, double timeConstantS) {
    public Surface {
        finite("minRad", minRad);
        finite("maxRad", maxRad);
        if (!(minRad < 0.0 && maxRad > 0.0)) {
            throw new IllegalArgumentException("travel must span zero (min < 0 < max), got " + Plain.of(minRad)
                    + " to " + Plain.of(maxRad) + " rad");
        }
        positive("rateRadS", rateRadS);
        positive("timeConstantS", timeConstantS);
    }

    /** The command clamped to the travel. */
    public double clamp(double rad) {
        return rad < minRad ? minRad : Math.min(rad, maxRad);
    }
}
