package org.pointcall.ingest.sim.airframe;

import java.util.Arrays;

import org.pointcall.shared.error.Plain;
import org.pointcall.shared.table.LinearTable;

/**
 * A one-dimensional table, linear between breakpoints and held flat beyond the first and last (a profile says
 * nothing outside its range, so it is not extrapolated). Arrays are copied in and out.
 *
 * @param x breakpoints, strictly increasing, at least two
 * @param y value at each breakpoint
 */
public record Curve(double[] x, double[] y) {
    public Curve {
        if (x == null || y == null) {
            throw new IllegalArgumentException("a table needs both columns");
        }
        if (x.length != y.length) {
            throw new IllegalArgumentException("a table has " + x.length + " breakpoints but " + y.length
                    + " values");
        }
        if (x.length < 2) {
            throw new IllegalArgumentException("a table needs at least 2 points, got " + x.length);
        }
        x = x.clone();
        y = y.clone();
        for (int i = 0; i < x.length; i++) {
            Checks.finite("table breakpoint " + (i + 1), x[i]);
            Checks.finite("table value " + (i + 1), y[i]);
            if (i > 0 && !(x[i] > x[i - 1])) {
                throw new IllegalArgumentException("table breakpoint " + (i + 1) + " (" + Plain.of(x[i])
                        + ") must be greater than the previous (" + Plain.of(x[i - 1]) + ")");
            }
        }
    }

    @Override
    public double[] x() {
        return x.clone();
    }

    @Override
    public double[] y() {
        return y.clone();
    }

    /** Value at {@code v}, held flat beyond the ends; allocation-free. */
    public double valueAt(double v) {
        return LinearTable.at(x, y, v, LinearTable.Ends.FLAT);
    }

    /** Smallest and largest breakpoint. */
    public double firstX() {
        return x[0];
    }

    public double lastX() {
        return x[x.length - 1];
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof Curve c && Arrays.equals(x, c.x) && Arrays.equals(y, c.y);
    }

    @Override
    public int hashCode() {
        return 31 * Arrays.hashCode(x) + Arrays.hashCode(y);
    }

    @Override
    public String toString() {
        return "table " + Arrays.toString(x) + " -> " + Arrays.toString(y);
    }
}
