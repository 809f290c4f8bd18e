package org.pointcall.ingest.sim.airframe;

import static org.pointcall.ingest.sim.airframe.Checks.between;
import static org.pointcall.ingest.sim.airframe.Checks.finite;
import static org.pointcall.ingest.sim.airframe.Checks.nonNegative;
import static org.pointcall.ingest.sim.airframe.Checks.positive;

import org.pointcall.shared.error.Plain;

/**
 * Flow separation through and beyond the stall, in the Goman-Khrabrov form: a state {@code x} (1 attached, 0 fully
 * separated) follows {@code tau1 dx/dt = x0(alpha - tau2 alphadot, x) - x}, with both time constants scaled by the
 * chord transit time c/V. The static curve {@code x0} is a tanh step centred at an angle that moves from the stall
 * angle (flow attached) to the lower reattachment angle (flow separated), so the flow separates at one angle and
 * reattaches at a lower one even when flown slowly; {@code tau2} adds the dynamic delay of a fast pitch-up.
 *
 * <p>Coefficients blend the two flows: {@code CL = x CL_attached + (1 - x) CL_separated(alpha)};
 * {@code CD += (1 - x) (CN90 sin^2 alpha + separatedDragIncrement)}; {@code Cm += (1 - x) pitchBreakCm}; a wing drop
 * {@code Cl = side wingDropCl 4 x (1 - x)} with a seeded random side drawn at each departure; roll damping scaled by
 * {@code x + (1 - x) rollDampingSeparatedRatio}.
 *
 * @param alphaStallRad             separation angle, rad
 * @param alphaReattachRad          reattachment angle, rad (below the separation angle)
 * @param alphaStallNegativeRad     negative separation angle, rad
 * @param alphaReattachNegativeRad  negative reattachment angle, rad (between the negative stall and zero)
 * @param breakWidthRad             width of the tanh step, rad
 * @param separatedLift             CL of the fully separated flow against angle of attack, rad, from 0 to pi/2; odd
 *                                  in alpha and mirrored beyond pi/2 as for a flat plate
 * @param separatedNormalForce      normal-force coefficient of the separated wing at 90 degrees (CN90)
 * @param separatedDragIncrement    drag added by the separated wake, beyond the normal force
 * @param separationLagChords       tau1 in chord transit times c/V
 * @param hysteresisLagChords       tau2 in chord transit times c/V
 * @param pitchBreakCm              Cm added when fully separated (negative: nose-down pitch break)
 * @param wingDropCl                peak rolling-moment coefficient of the asymmetric wing drop
 * @param rollDampingSeparatedRatio Clp of the separated flow as a fraction of the attached Clp (below zero: the
 *                                  wing autorotates)
 */
public record StallCharacteristics(double alphaStallRad, double alphaReattachRad, double alphaStallNegativeRad,
        double alphaReattachNegativeRad, double breakWidthRad, Curve separatedLift, double separatedNormalForce,
        double separatedDragIncrement, double separationLagChords, double hysteresisLagChords, double pitchBreakCm,
        double wingDropCl, double rollDampingSeparatedRatio) {
    public StallCharacteristics {
        between("alphaStallRad", alphaStallRad, 0.05, 0.8);
        between("alphaReattachRad", alphaReattachRad, 0.0, alphaStallRad);
        between("alphaStallNegativeRad", alphaStallNegativeRad, -0.8, -0.05);
        between("alphaReattachNegativeRad", alphaReattachNegativeRad, alphaStallNegativeRad, 0.0);
        between("breakWidthRad", breakWidthRad, 0.001, 0.2);
        if (separatedLift == null) {
            throw new IllegalArgumentException("separatedLift table is required");
        }
        if (separatedLift.firstX() != 0.0 || Math.abs(separatedLift.lastX() - Math.PI / 2) > 1e-9) {
            throw new IllegalArgumentException("separatedLift must run from 0 to 90 degrees, got "
                    + Plain.of(Math.toDegrees(separatedLift.firstX())) + " to "
                    + Plain.of(Math.toDegrees(separatedLift.lastX())));
        }
        positive("separatedNormalForce", separatedNormalForce);
        nonNegative("separatedDragIncrement", separatedDragIncrement);
        positive("separationLagChords", separationLagChords);
        nonNegative("hysteresisLagChords", hysteresisLagChords);
        finite("pitchBreakCm", pitchBreakCm);
        nonNegative("wingDropCl", wingDropCl);
        between("rollDampingSeparatedRatio", rollDampingSeparatedRatio, -1.0, 1.0);
    }
}
