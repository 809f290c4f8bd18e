package org.pointcall.shared.dictionary;

import java.util.Arrays;

import org.pointcall.shared.table.LinearTable;

/** Raw-to-engineering-unit conversion of one parameter, applied once as a value enters the pipeline. */
public sealed interface Calibration permits Calibration.Identity, Calibration.Polynomial, Calibration.Breakpoints {

    double toEngineering(double raw);

    /**
     * The raw value that gives {@code eu}: what a recorder writes for a calibrated channel (the simulator writes
     * its files this way). NaN when the calibration cannot be inverted there (not monotonic, or outside a table
     * that is not extended monotonically).
     */
    double toRaw(double eu);

    Calibration IDENTITY = new Identity();

    /** No conversion: the source already carries engineering units. */
    record Identity() implements Calibration {
        @Override
        public double toEngineering(double raw) {
            return raw;
        }

        @Override
        public double toRaw(double eu) {
            return eu;
        }
    }

    /** EU = sum of c[i] raw^i (the TMATS COE convention: c[0] is the constant term). */
    record Polynomial(double[] coefficients) implements Calibration {
        public Polynomial {
            if (coefficients.length == 0) {
                throw new IllegalArgumentException("a polynomial calibration needs at least one coefficient");
            }
            coefficients = coefficients.clone();
        }

        @Override
        public double toEngineering(double raw) {
            double acc = 0.0;
            for (int i = coefficients.length - 1; i >= 0; i--) {
                acc = acc * raw + coefficients[i];
            }
            return acc;
        }

        /** Closed form for a linear polynomial; otherwise Newton's method from the linear estimate. */
        @Override
        public double toRaw(double eu) {
            if (coefficients.length == 1) {
                return Double.NaN;
            }
            double x = (eu - coefficients[0]) / coefficients[1];
            if (coefficients.length == 2) {
                return x;
            }
            for (int it = 0; it < 50; it++) {
                double f = toEngineering(x) - eu;
                double d = 0;
                for (int i = coefficients.length - 1; i >= 1; i--) {
                    d = d * x + i * coefficients[i];
                }
                if (d == 0) {
                    return Double.NaN;
                }
                double step = f / d;
                x -= step;
                if (Math.abs(step) <= 1e-13 * Math.max(1, Math.abs(x))) {
                    return x;
                }
            }
            return Double.NaN;
        }

        @Override
        public double[] coefficients() {
            return coefficients.clone();
        }

        @Override
        public boolean equals(Object o) {
            return o instanceof Polynomial p && Arrays.equals(coefficients, p.coefficients);
        }

        @Override
        public int hashCode() {
            return Arrays.hashCode(coefficients);
        }

        @Override
        public String toString() {
            return "Polynomial" + Arrays.toString(coefficients);
        }
    }

    /**
     * Piecewise-linear table of (raw, EU) pairs with strictly increasing raw values; outside the table the end
     * segments are extended linearly.
     */
    record Breakpoints(double[] raw, double[] eu) implements Calibration {
        public Breakpoints {
            if (raw.length < 2 || raw.length != eu.length) {
                throw new IllegalArgumentException("a breakpoint table needs at least two (raw, eu) pairs of equal count");
            }
            for (int i = 1; i < raw.length; i++) {
                if (!(raw[i] > raw[i - 1])) {
                    throw new IllegalArgumentException("breakpoint raw values must increase strictly (index " + i + ")");
                }
            }
            raw = raw.clone();
            eu = eu.clone();
        }

        @Override
        public double toEngineering(double x) {
            return LinearTable.at(raw, eu, x, LinearTable.Ends.EXTEND);
        }

        /** Inverse of the piecewise-linear table when its EU values are strictly monotonic, else NaN. */
        @Override
        public double toRaw(double y) {
            int n = eu.length;
            double sign = Math.signum(eu[n - 1] - eu[0]);
            for (int i = 1; i < n; i++) {
                if (!(sign * (eu[i] - eu[i - 1]) > 0)) {
                    return Double.NaN;
                }
            }
            int hi = 1;
            while (hi < n - 1 && sign * (y - eu[hi]) > 0) {
                hi++;
            }
            int lo = hi - 1;
            double f = (y - eu[lo]) / (eu[hi] - eu[lo]);
            return raw[lo] + f * (raw[hi] - raw[lo]);
        }

        @Override
        public double[] raw() {
            return raw.clone();
        }

        @Override
        public double[] eu() {
            return eu.clone();
        }

        @Override
        public boolean equals(Object o) {
            return o instanceof Breakpoints b && Arrays.equals(raw, b.raw) && Arrays.equals(eu, b.eu);
        }

        @Override
        public int hashCode() {
            return 31 * Arrays.hashCode(raw) + Arrays.hashCode(eu);
        }

        @Override
        public String toString() {
            return "Breakpoints" + Arrays.toString(raw) + "->" + Arrays.toString(eu);
        }
    }
}
