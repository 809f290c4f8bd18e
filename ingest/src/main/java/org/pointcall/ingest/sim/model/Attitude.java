package org.pointcall.ingest.sim.model;

/**
 * Attitude quaternion helpers (scalar first, rotating NED into body axes; Stevens and Lewis, Aircraft Control and
 * Simulation, 1.8): Euler angles out of a quaternion and a quaternion out of Euler angles (3-2-1: heading psi, then
 * pitch theta, then bank phi). Static and allocation-free; quaternions live in a double[] at an offset.
 */
final class Attitude {
    private Attitude() {
    }

    /** Writes the unit quaternion of (phi, theta, psi) at {@code out[off..off+3]}. */
    static void fromEuler(double phi, double theta, double psi, double[] out, int off) {
        double cf = Math.cos(0.5 * phi);
        double sf = Math.sin(0.5 * phi);
        double ct = Math.cos(0.5 * theta);
        double st = Math.sin(0.5 * theta);
        double cp = Math.cos(0.5 * psi);
        double sp = Math.sin(0.5 * psi);
        out[off] = cf * ct * cp + sf * st * sp;
        out[off + 1] = sf * ct * cp - cf * st * sp;
        out[off + 2] = cf * st * cp + sf * ct * sp;
        out[off + 3] = cf * ct * sp - sf * st * cp;
    }

    /** Pitch, -pi/2 to pi/2: -asin(C13), clamped against rounding just beyond +-1. */
    static double theta(double[] q, int off) {
        double c13 = 2.0 * (q[off + 1] * q[off + 3] - q[off] * q[off + 2]);
        return -Math.asin(Math.max(-1.0, Math.min(1.0, c13)));
    }

    /** Bank, -pi to pi: atan2(C23, C33). */
    static double phi(double[] q, int off) {
        double e0 = q[off];
        double e1 = q[off + 1];
        double e2 = q[off + 2];
        double e3 = q[off + 3];
        return Math.atan2(2.0 * (e2 * e3 + e0 * e1), e0 * e0 - e1 * e1 - e2 * e2 + e3 * e3);
    }

    /** Heading, -pi to pi: atan2(C12, C11). */
    static double psi(double[] q, int off) {
        double e0 = q[off];
        double e1 = q[off + 1];
        double e2 = q[off + 2];
        double e3 = q[off + 3];
        return Math.atan2(2.0 * (e1 * e2 + e0 * e3), e0 * e0 + e1 * e1 - e2 * e2 - e3 * e3);
    }
}
