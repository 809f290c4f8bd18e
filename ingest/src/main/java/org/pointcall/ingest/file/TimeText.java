package org.pointcall.ingest.file;

import org.pointcall.shared.units.Units;

/**
 * Parses {@code HH:MM:SS[.fraction]} and {@code DDD:HH:MM:SS[.fraction]} exactly to nanoseconds, rounding a
 * fraction finer than 1 ns half up. One instance per reader; not thread-safe.
 */
final class TimeText {
    static final long NS_PER_DAY = 86_400L * Units.NS_PER_S;

    private long ns;
    private TimeForm form;

    /** True when {@code s[from, to)} holds a time with a colon, whatever its validity. */
    static boolean hasColon(CharSequence s, int from, int to) {
        for (int i = from; i < to; i++) {
            if (s.charAt(i) == ':') {
                return true;
            }
        }
        return false;
    }

    /** @return false when the text is not a valid time of day or day-of-year time */
    boolean parse(CharSequence s, int from, int to, boolean decimalComma) {
        while (from < to && DecimalText.isBlank(s.charAt(from))) {
            from++;
        }
        while (to > from && DecimalText.isBlank(s.charAt(to - 1))) {
            to--;
        }
        int colons = 0;
        for (int i = from; i < to; i++) {
            if (s.charAt(i) == ':') {
                colons++;
            }
        }
        if (colons != 2 && colons != 3) {
            return false;
        }
        int i = from;
        long day = 0;
        if (colons == 3) {
            int e = fieldEnd(s, i, to);
            day = digits(s, i, e, 3);
            if (day < 1 || day > 366) {
                return false;
            }
            i = e + 1;
        }
        int e = fieldEnd(s, i, to);
        long hours = digits(s, i, e, 2);
        i = e + 1;
        e = fieldEnd(s, i, to);
        long minutes = digits(s, i, e, 2);
        i = e + 1;
        if (hours < 0 || hours > 23 || minutes < 0 || minutes > 59) {
            return false;
        }
        int point = i;
        while (point < to && s.charAt(point) != '.' && !(decimalComma && s.charAt(point) == ',')) {
            point++;
        }
        long seconds = digits(s, i, point, 2);
        if (seconds < 0 || seconds > 59) {
            return false;
        }
        long fractionNs = 0;
        if (point < to) {
            long scale = 100_000_000L;
            boolean roundUp = false;
            for (int k = point + 1; k < to; k++) {
                char c = s.charAt(k);
                if (c < '0' || c > '9') {
                    return false;
                }
                if (scale > 0) {
                    fractionNs += (c - '0') * scale;
                    scale /= 10;
                } else if (scale == 0) {
                    roundUp = c >= '5';
                    scale = -1;
                }
            }
            if (roundUp) {
                fractionNs++;
            }
        }
        long tod = ((hours * 60 + minutes) * 60 + seconds) * Units.NS_PER_S + fractionNs;
        if (colons == 3) {
            ns = (day - 1) * NS_PER_DAY + tod;
            form = TimeForm.DAY_OF_YEAR_TIME;
        } else {
            ns = tod;
            form = TimeForm.TIME_OF_DAY;
        }
        return true;
    }

    long ns() {
        return ns;
    }

    TimeForm form() {
        return form;
    }

    private static int fieldEnd(CharSequence s, int from, int to) {
        int i = from;
        while (i < to && s.charAt(i) != ':') {
            i++;
        }
        return i;
    }

    /** The unsigned integer in {@code s[from, to)} of 1 to {@code max} digits, or -1. */
    private static long digits(CharSequence s, int from, int to, int max) {
        if (to <= from || to - from > max) {
            return -1;
        }
        long v = 0;
        for (int i = from; i < to; i++) {
            char c = s.charAt(i);
            if (c < '0' || c > '9') {
                return -1;
            }
            v = v * 10 + (c - '0');
        }
        return v;
    }

    /** Formats nanoseconds in the file's own form, for messages. */
    static String format(long timeNs, TimeForm form) {
        return form.format(timeNs);
    }

    /** Seconds with at least three decimals and as many as needed, up to nine. */
    static String seconds(long timeNs) {
        String sign = timeNs < 0 ? "-" : "";
        long a = Math.abs(timeNs);
        long whole = a / Units.NS_PER_S;
        String frac = String.format(java.util.Locale.ROOT, "%09d", a % Units.NS_PER_S);
        int keep = 9;
        while (keep > 3 && frac.charAt(keep - 1) == '0') {
            keep--;
        }
        return sign + whole + "." + frac.substring(0, keep);
    }
}
