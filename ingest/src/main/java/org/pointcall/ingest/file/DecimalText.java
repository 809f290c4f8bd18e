package org.pointcall.ingest.file;

import java.math.BigDecimal;
import java.math.RoundingMode;

/**
 * Scans a decimal number inside a longer text, without allocating on the usual path, and converts it to a double
 * (rounded exactly as {@link Double#parseDouble} does) or to an exact count of nanoseconds. One instance per reader;
 * not thread-safe.
 */
final class DecimalText {
    /** 2^53: every integer up to it is a double. */
    private static final long EXACT_DOUBLE_MANTISSA = 1L << 53;
    /** Powers of ten that are exact doubles (10^22 is the last). */
    private static final double[] POW10_DOUBLE = new double[23];
    private static final long[] POW10_LONG = new long[19];

    static {
        double d = 1.0;
        for (int i = 0; i < POW10_DOUBLE.length; i++) {
            POW10_DOUBLE[i] = d;
            d *= 10.0;
        }
        long l = 1L;
        for (int i = 0; i < POW10_LONG.length; i++) {
            POW10_LONG[i] = l;
            l *= 10L;
        }
    }

    private boolean negative;
    private long mantissa;
    private int exponent;
    private boolean fitsLong;
    private int start;
    private int end;
    private long ns;

    /**
     * Scans {@code s[from, to)} (blanks around it allowed) as {@code [+-]digits[.digits][e[+-]digits]}, with a
     * comma for the point when {@code decimalComma}.
     *
     * @return false when the text is not such a number (empty, letters, NaN, Inf, two points...)
     */
    boolean scan(CharSequence s, int from, int to, boolean decimalComma) {
        while (from < to && isBlank(s.charAt(from))) {
            from++;
        }
        while (to > from && isBlank(s.charAt(to - 1))) {
            to--;
        }
        start = from;
        end = to;
        if (from == to) {
            return false;
        }
        int i = from;
        char c = s.charAt(i);
        negative = c == '-';
        if (c == '-' || c == '+') {
            i++;
        }
        long m = 0;
        int digits = 0;
        int exp = 0;
        boolean anyDigit = false;
        boolean fits = true;
        while (i < to && (c = s.charAt(i)) >= '0' && c <= '9') {
            anyDigit = true;
            if (m != 0 || c != '0') {
                if (digits < 18) {
                    m = m * 10 + (c - '0');
                    digits++;
                } else {
                    fits = false;
                    exp++;
                }
            }
            i++;
        }
        if (i < to && (s.charAt(i) == '.' || (decimalComma && s.charAt(i) == ','))) {
            i++;
            while (i < to && (c = s.charAt(i)) >= '0' && c <= '9') {
                anyDigit = true;
                if (m != 0 || c != '0') {
                    if (digits < 18) {
                        m = m * 10 + (c - '0');
                        digits++;
                        exp--;
                    } else {
                        fits = false;
                    }
                } else {
                    exp--;
                }
                i++;
            }
        }
        if (!anyDigit) {
            return false;
        }
        if (i < to && (s.charAt(i) == 'e' || s.charAt(i) == 'E')) {
            i++;
            boolean expNegative = false;
            if (i < to && (s.charAt(i) == '-' || s.charAt(i) == '+')) {
                expNegative = s.charAt(i) == '-';
                i++;
            }
            int e = 0;
            boolean anyExpDigit = false;
            while (i < to && (c = s.charAt(i)) >= '0' && c <= '9') {
                anyExpDigit = true;
                if (e < 100_000) {
                    e = e * 10 + (c - '0');
                }
                i++;
            }
            if (!anyExpDigit) {
                return false;
            }
            exp += expNegative ? -e : e;
        }
        if (i != to) {
            return false;
        }
        mantissa = m;
        exponent = exp;
        fitsLong = fits;
        return true;
    }

    /** The scanned number as the nearest double (may be infinite when huge). Call after a successful scan. */
    double toDouble(CharSequence s) {
        double v;
        if (mantissa == 0 && fitsLong) {
            v = 0.0;
        } else if (fitsLong && mantissa <= EXACT_DOUBLE_MANTISSA && exponent >= -22 && exponent <= 22) {
            // Clinger's fast path: both operands are exact doubles, so one correctly rounded operation gives the
            // correctly rounded result.
            v = exponent >= 0 ? mantissa * POW10_DOUBLE[exponent] : mantissa / POW10_DOUBLE[-exponent];
        } else {
            return Double.parseDouble(plainText(s));
        }
        return negative ? -v : v;
    }

    /**
     * The scanned number times {@code nsPerUnit}, rounded half away from zero to a whole nanosecond.
     *
     * @return false when it does not fit a long; else the result is in {@link #ns()}
     */
    boolean toNs(CharSequence s, long nsPerUnit) {
        if (fitsLong && nsPerUnit > 0) {
            // nsPerUnit = coefficient * 10^k (1e9 for s, 6e10 for min): fold the power into the exponent, so a
            // 17-digit time in seconds does not overflow before it is scaled back
            long coefficient = nsPerUnit;
            int e = exponent;
            while (coefficient % 10 == 0) {
                coefficient /= 10;
                e++;
            }
            long hi = Math.multiplyHigh(mantissa, coefficient);
            long p = mantissa * coefficient;
            if (hi == 0 && p >= 0) {
                if (e >= 0 && e < POW10_LONG.length) {
                    long scale = POW10_LONG[e];
                    if (Math.multiplyHigh(p, scale) == 0 && p * scale >= 0) {
                        ns = negative ? -(p * scale) : p * scale;
                        return true;
                    }
                } else if (e < 0 && -e < POW10_LONG.length) {
                    long d = POW10_LONG[-e];
                    long q = p / d;
                    if (2 * (p % d) >= d) {
                        q++;
                    }
                    ns = negative ? -q : q;
                    return true;
                }
            }
        }
        try {
            ns = new BigDecimal(plainText(s)).multiply(BigDecimal.valueOf(nsPerUnit))
                    .setScale(0, RoundingMode.HALF_UP).longValueExact();
            return true;
        } catch (ArithmeticException | NumberFormatException e) {
            return false;
        }
    }

    long ns() {
        return ns;
    }

    private String plainText(CharSequence s) {
        return s.subSequence(start, end).toString().replace(',', '.');
    }

    static boolean isBlank(char c) {
        return c == ' ' || c == '\t' || c == '\u00a0';
    }

    /** True for the ways loggers and spreadsheets write a non-finite value: NaN, Inf, 1.#INF, #N/A... */
    static boolean isNonFiniteWord(CharSequence s, int from, int to) {
        while (from < to && isBlank(s.charAt(from))) {
            from++;
        }
        while (to > from && isBlank(s.charAt(to - 1))) {
            to--;
        }
        if (from < to && (s.charAt(from) == '-' || s.charAt(from) == '+')) {
            from++;
        }
        String w = s.subSequence(from, to).toString().toLowerCase(java.util.Locale.ROOT);
        return switch (w) {
            case "nan", "qnan", "snan", "inf", "infinity", "1.#inf", "1.#qnan", "1.#ind", "#n/a", "n/a", "#num!",
                    "#div/0!", "#value!" -> true;
            default -> false;
        };
    }
}
