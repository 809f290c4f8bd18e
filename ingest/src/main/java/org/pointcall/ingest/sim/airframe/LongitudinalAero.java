package org.pointcall.ingest.sim.airframe;

import static org.pointcall.ingest.sim.airframe.Checks.between;
import static org.pointcall.ingest.sim.airframe.Checks.finite;
import static org.pointcall.ingest.sim.airframe.Checks.nonNegative;
import static org.pointcall.ingest.sim.airframe.Checks.positive;

/**
 * Longitudinal aerodynamics of the attached flow (the stall is in {@link StallCharacteristics}). Lift
 * {@code CL = CLalpha (alpha - alpha0) + CLq qhat + CLde de}, drag polar {@code CD = CD0 + k CL^2} plus wave drag,
 * pitching moment {@code Cm = Cm0 + Cmalpha alpha + Cmq qhat + Cmalphadot alphadothat + Cmde de}, with
 * {@code qhat = q c / 2V} and {@code alphadothat = alphadot c / 2V}. Derivatives per radian.
 *
 * @param alphaZeroLiftRad       angle of attack of zero lift, rad
 * @param cLAlpha                lift-curve slope CLalpha at low Mach, per rad
 * @param cLQ                    CLq, per unit qhat
 * @param cLElevator             CLde, per rad
 * @param cD0                    zero-lift drag coefficient CD0
 * @param inducedDragFactor      k of the drag polar, 1 / (pi e A)
 * @param cm0                    Cm0
 * @param cmAlpha                Cmalpha, per rad (negative for a statically stable airframe)
 * @param cmQ                    Cmq, per unit qhat
 * @param cmAlphaDot             Cmalphadot, per unit alphadot c / 2V
 * @param cmElevator             Cmde, per rad
 * @param prandtlGlauertMachCap  the Prandtl-Glauert factor 1/sqrt(1 - M^2) on CLalpha is evaluated at no more than
 *                               this Mach (it diverges at M = 1); 0 turns the compressibility factor off
 * @param dragRiseMach           Mach above which wave drag 20 (M - Mdr)^4 is added (Lock's approximation, common
 *                               practice); 0 turns it off
 */
public record LongitudinalAero(double alphaZeroLiftRad, double cLAlpha, double cLQ, double cLElevator, double cD0,
        double inducedDragFactor, double cm0, double cmAlpha, double cmQ, double cmAlphaDot, double cmElevator,
        double prandtlGlauertMachCap, double dragRiseMach) {
    public LongitudinalAero {
        between("alphaZeroLiftRad", alphaZeroLiftRad, -0.3, 0.3);
        positive("cLAlpha", cLAlpha);
        finite("cLQ", cLQ);
        finite("cLElevator", cLElevator);
        positive("cD0", cD0);
        nonNegative("inducedDragFactor", inducedDragFactor);
        finite("cm0", cm0);
        finite("cmAlpha", cmAlpha);
        finite("cmQ", cmQ);
        finite("cmAlphaDot", cmAlphaDot);
        finite("cmElevator", cmElevator);
        if (cmElevator == 0.0) {
            throw new IllegalArgumentException("cmElevator must not be zero: the elevator could not trim");
        }
        between("prandtlGlauertMachCap", prandtlGlauertMachCap, 0.0, 0.95);
        between("dragRiseMach", dragRiseMach, 0.0, 1.5);
    }
}
