package org.pointcall.models.analysis.accel;

import org.pointcall.models.analysis.Series;
import org.pointcall.shared.units.Units;

/**
 * Specific excess power against Mach number from a level acceleration: {@code Ps = dh/dt + (V/g) dV/dt}
 * (the rate of change of energy height {@code He = h + V^2 / 2g}; USNTPS FTM-108 ch. 5, energy methods), with
 * {@code V} the true airspeed and {@code h} the pressure altitude (the run is flown at constant pressure altitude,
 * so the temperature correction of its small rate is left out), the two rates from local least-squares lines over
 * 1 s each side, averaged in Mach bins.
 *
 * @param mach  bin centres
 * @param psMps Ps in each bin, m/s
 */
public record ExcessPower(double[] mach, double[] psMps) {
    /** Width of the Mach bins. */
    public static final double BIN_MACH = 0.02;

    public ExcessPower {
        mach = mach.clone();
        psMps = psMps.clone();
        if (mach.length != psMps.length) {
            throw new IllegalArgumentException("one Ps per Mach bin");
        }
    }

    /** Ps at one instant from the altitude rate, the true airspeed and its rate (SI). */
    public static double ps(double climbMps, double tasMps, double accelMps2) {
        return climbMps + tasMps / Units.G0_MPS2 * accelMps2;
    }

    /** The curve over {@code from..to} seconds of the series' time. */
    public static ExcessPower of(Series hp, Series tas, Series mach, double from, double to) {
        Series climb = hp.slopes(1.0);
        Series accel = tas.slopes(1.0);
        Series v = tas.between(from, to);
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < v.size(); i++) {
            double m = mach.at(v.t(i));
            lo = Math.min(lo, m);
            hi = Math.max(hi, m);
        }
        if (v.size() < 2 || !(hi > lo)) {
            return new ExcessPower(new double[0], new double[0]);
        }
        int first = (int) Math.floor(lo / BIN_MACH);
        int bins = (int) Math.floor(hi / BIN_MACH) - first + 1;
        double[] sum = new double[bins];
        int[] count = new int[bins];
        for (int i = 0; i < v.size(); i++) {
            double t = v.t(i);
            int j = (int) Math.floor(mach.at(t) / BIN_MACH) - first;
            double p = ps(climb.at(t), v.v(i), accel.at(t));
            if (j >= 0 && j < bins && Double.isFinite(p)) {
                sum[j] += p;
                count[j]++;
            }
        }
        int kept = 0;
        for (int c : count) {
            kept += c > 0 ? 1 : 0;
        }
        double[] m = new double[kept];
        double[] p = new double[kept];
        int k = 0;
        for (int j = 0; j < bins; j++) {
            if (count[j] > 0) {
                m[k] = (first + j + 0.5) * BIN_MACH;
                p[k] = sum[j] / count[j];
                k++;
            }
        }
        return new ExcessPower(m, p);
    }

    public int size() {
        return mach.length;
    }

    @Override
    public double[] mach() {
        return mach.clone();
    }

    @Override
    public double[] psMps() {
        return psMps.clone();
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof ExcessPower e && java.util.Arrays.equals(mach, e.mach)
                && java.util.Arrays.equals(psMps, e.psMps);
    }

    @Override
    public int hashCode() {
        return java.util.Arrays.hashCode(mach) * 31 + java.util.Arrays.hashCode(psMps);
    }

    @Override
    public String toString() {
        return "ExcessPower[" + mach.length + " Mach bins]";
    }
}
