package org.pointcall.ingest.sim.airframe;

import static org.pointcall.ingest.sim.airframe.Checks.finite;

/**
 * Lateral-directional derivatives, body axes: side force {@code CY}, rolling moment {@code Cl} and yawing moment
 * {@code Cn} from sideslip (per rad), roll and yaw rate (per unit p b/2V, r b/2V), aileron and rudder (per rad).
 */
public record LateralAero(double cYBeta, double cYP, double cYR, double cYRudder, double cRollBeta,
        double cRollP, double cRollR, double cRollAileron, double cRollRudder, double cnBeta, double cnP,
        double cnR, double cnAileron, double cnRudder) {
    public LateralAero {
        finite("cYBeta", cYBeta);
        finite("cYP", cYP);
        finite("cYR", cYR);
        finite("cYRudder", cYRudder);
        finite("cRollBeta", cRollBeta);
        finite("cRollP", cRollP);
        finite("cRollR", cRollR);
        finite("cRollAileron", cRollAileron);
        finite("cRollRudder", cRollRudder);
        finite("cnBeta", cnBeta);
        finite("cnP", cnP);
        finite("cnR", cnR);
        finite("cnAileron", cnAileron);
        finite("cnRudder", cnRudder);
        if (cRollAileron == 0.0) {
            throw new IllegalArgumentException("cRollAileron must not be zero: the ailerons could not roll");
        }
        if (cnRudder == 0.0) {
            throw new IllegalArgumentException("cnRudder must not be zero: the rudder could not yaw");
        }
    }
}
