package org.pointcall.shared.error;

import java.math.BigDecimal;
import java.math.MathContext;

/**
 * Numbers for one-line user messages: six significant digits, no trailing zeros, and no exponent unless the value is
 * absurdly large or small (then {@code 1E+300}).
 */
public final class Plain {
    private Plain() {
    }

    private static final MathContext SIX = new MathContext(6);

    public static String of(double v) {
        if (Double.isNaN(v) || Double.isInfinite(v)) {
            return Double.toString(v);
        }
        BigDecimal d = new BigDecimal(v).round(SIX).stripTrailingZeros();
        double a = Math.abs(v);
        return a != 0.0 && (a < 1e-6 || a >= 1e9) ? d.toString() : d.toPlainString();
    }
}
