package org.pointcall.shared.table;

/**
 * Linear interpolation in a table of (x, y) breakpoints with strictly increasing x: the one routine behind the
 * calibration tables, position-error tables and airframe curves. Allocation-free; the caller validates the table.
 */
public final class LinearTable {
    private LinearTable() {
    }

    /** What happens beyond the first and last breakpoint. */
    public enum Ends {
        /** Hold the end values (a calibration extrapolated outside the flown range would invent data). */
        FLAT,
        /** Extend the end segments linearly. */
        EXTEND
    }

    /** y at {@code v}; NaN for NaN. */
    public static double at(double[] x, double[] y, double v, Ends ends) {
        if (Double.isNaN(v)) {
            return Double.NaN;
        }
        int n = x.length;
        int hi;
        if (v <= x[0]) {
            if (ends == Ends.FLAT) {
                return y[0];
            }
            hi = 1;
        } else if (v >= x[n - 1]) {
            if (ends == Ends.FLAT) {
                return y[n - 1];
            }
            hi = n - 1;
        } else {
            int lo = 0;
            hi = n - 1;
            while (hi - lo > 1) {
                int mid = (lo + hi) >>> 1;
                if (x[mid] <= v) {
                    lo = mid;
                } else {
                    hi = mid;
                }
            }
        }
        int lo = hi - 1;
        double f = (v - x[lo]) / (x[hi] - x[lo]);
        return y[lo] + f * (y[hi] - y[lo]);
    }
}
