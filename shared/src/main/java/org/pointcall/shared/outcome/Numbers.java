package org.pointcall.shared.outcome;

import java.math.BigDecimal;
import java.math.RoundingMode;

/** Numbers as a reason or a log line gives them: as many decimals as the band's scale needs, no more. */
public final class Numbers {
    private Numbers() {
    }

    /** {@code value} to the decimals that resolve a tenth of {@code scale} (158 for a 10 kt band; 0.96 for 0.2 g). */
    public static String scaled(double value, double scale) {
        if (!Double.isFinite(value)) {
            return Double.toString(value);
        }
        double step = Double.isFinite(scale) && scale > 0 ? scale / 10 : Math.max(Math.abs(value) / 100, 1e-9);
        int decimals = (int) Math.max(0, Math.min(9, -Math.floor(Math.log10(step))));
        return plain(value, decimals);
    }

    /** {@code value} with at most {@code digits} significant digits, no exponent, no trailing zeros. */
    public static String near(double value, int digits) {
        if (!Double.isFinite(value)) {
            return Double.toString(value);
        }
        if (value == 0) {
            return "0";
        }
        int decimals = (int) Math.max(0, Math.min(9, digits - 1 - Math.floor(Math.log10(Math.abs(value)))));
        String s = plain(value, decimals);
        return s.indexOf('.') < 0 ? s : s.replaceAll("0+$", "").replaceAll("\\.$", "");
    }

    private static String plain(double value, int decimals) {
        String s = new BigDecimal(value).setScale(decimals, RoundingMode.HALF_EVEN).toPlainString();
        return s.equals("-0") || s.matches("-0\\.0*") ? s.substring(1) : s;
    }
}
