package org.pointcall.ingest.sim.airframe;

import static org.pointcall.ingest.sim.airframe.Checks.finite;
import static org.pointcall.ingest.sim.airframe.Checks.nonNegative;
import static org.pointcall.ingest.sim.airframe.Checks.positive;

/**
 * Mass and inertia about the centre of gravity in body axes. The inertia is held fixed as fuel burns (the change is
 * a few percent over a sortie and the centre of gravity is not tracked either).
 *
 * @param zeroFuelMassKg mass without usable fuel, kg
 * @param fuelMassKg     usable fuel at the start, kg
 * @param ixxKgM2        roll inertia, kg m^2
 * @param iyyKgM2        pitch inertia, kg m^2
 * @param izzKgM2        yaw inertia, kg m^2
 * @param ixzKgM2        product of inertia, kg m^2 (positive when the principal axis is nose-down of body x)
 */
public record MassProperties(double zeroFuelMassKg, double fuelMassKg, double ixxKgM2, double iyyKgM2,
        double izzKgM2, double ixzKgM2) {
    public MassProperties {
        positive("zeroFuelMassKg", zeroFuelMassKg);
        nonNegative("fuelMassKg", fuelMassKg);
        positive("ixxKgM2", ixxKgM2);
        positive("iyyKgM2", iyyKgM2);
        positive("izzKgM2", izzKgM2);
        finite("ixzKgM2", ixzKgM2);
        if (!(ixxKgM2 * izzKgM2 > ixzKgM2 * ixzKgM2)) {
            throw new IllegalArgumentException("inertia must satisfy Ixx Izz > Ixz^2 (positive definite)");
        }
        // a rigid body's moments of inertia obey the triangle inequality
        if (ixxKgM2 + iyyKgM2 < izzKgM2 || iyyKgM2 + izzKgM2 < ixxKgM2 || izzKgM2 + ixxKgM2 < iyyKgM2) {
            throw new IllegalArgumentException("inertia must satisfy the triangle inequality (each of Ixx, Iyy, Izz"
                    + " at most the sum of the other two)");
        }
    }

    /** Mass with full usable fuel, kg. */
    public double fullMassKg() {
        return zeroFuelMassKg + fuelMassKg;
    }
}
