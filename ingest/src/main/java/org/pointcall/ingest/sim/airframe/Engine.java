package org.pointcall.ingest.sim.airframe;

import static org.pointcall.ingest.sim.airframe.Checks.between;
import static org.pointcall.ingest.sim.airframe.Checks.finite;
import static org.pointcall.ingest.sim.airframe.Checks.nonNegative;
import static org.pointcall.ingest.sim.airframe.Checks.positive;

/**
 * Engine and thrust, any kind (jet, turboprop, piston-propeller) in one form:
 * {@code T = Tmax (rho/rho0)^n f(M) (idle + (1 - idle) s)} along body x, where {@code s} is the power state that
 * follows the throttle with a first-order lag whose time constant runs from {@code spoolTimeLowPowerS} at idle to
 * {@code spoolTimeHighPowerS} at full power (engines accelerate slowest from idle). A propeller's fall of thrust
 * with speed goes into {@code f(M)}. Fuel flow {@code (idleFlow + (maxFlow - idleFlow) s) (rho/rho0)^n}; with the
 * tanks empty the engine stops.
 *
 * @param maxThrustSeaLevelN     static thrust at full power at sea level, N
 * @param idleThrustFraction     thrust at idle as a fraction of full
 * @param densityExponent        n of the density lapse
 * @param thrustMachFactor       f(M), 1 at M = 0 for a consistent static thrust
 * @param spoolTimeHighPowerS    power-lag time constant near full power, s
 * @param spoolTimeLowPowerS     power-lag time constant near idle, s
 * @param maxFuelFlowSeaLevelKgS fuel flow at full power at sea level, kg/s
 * @param idleFuelFlowKgS        fuel flow at idle at sea level, kg/s
 * @param thrustLineOffsetM      thrust line below the centre of gravity, m (positive gives nose-up moment)
 */
public record Engine(double maxThrustSeaLevelN, double idleThrustFraction, double densityExponent,
        Curve thrustMachFactor, double spoolTimeHighPowerS, double spoolTimeLowPowerS,
        double maxFuelFlowSeaLevelKgS, double idleFuelFlowKgS, double thrustLineOffsetM) {
    public Engine {
        positive("maxThrustSeaLevelN", maxThrustSeaLevelN);
        between("idleThrustFraction", idleThrustFraction, 0.0, 0.5);
        between("densityExponent", densityExponent, 0.0, 2.0);
        if (thrustMachFactor == null) {
            throw new IllegalArgumentException("thrustMachFactor table is required");
        }
        for (double f : thrustMachFactor.y()) {
            nonNegative("thrustMachFactor value", f);
        }
        positive("spoolTimeHighPowerS", spoolTimeHighPowerS);
        positive("spoolTimeLowPowerS", spoolTimeLowPowerS);
        nonNegative("maxFuelFlowSeaLevelKgS", maxFuelFlowSeaLevelKgS);
        between("idleFuelFlowKgS", idleFuelFlowKgS, 0.0, maxFuelFlowSeaLevelKgS);
        finite("thrustLineOffsetM", thrustLineOffsetM);
    }
}
