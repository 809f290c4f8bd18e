package org.pointcall.models.label;

import java.math.BigDecimal;
import java.math.RoundingMode;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import org.pointcall.ingest.file.TimeForm;
import org.pointcall.shared.units.Units;

/**
 * Reads and prints the times of a label file: decimal seconds, {@code HH:MM:SS[.fraction]} or
 * {@code DDD:HH:MM:SS[.fraction]}, to whole nanoseconds (a finer fraction is rounded half up). The forms are those
 * the recorded-file reader accepts, so a label is written the way the recording's time column is.
 */
final class LabelTimeText {
    static final long NS_PER_DAY = 86_400L * Units.NS_PER_S;

    private static final Pattern SECONDS = Pattern.compile("[+-]?(\\d+(\\.\\d*)?|\\.\\d+)([eE][+-]?\\d{1,3})?");
    private static final Pattern CLOCK =
            Pattern.compile("(?:(\\d{1,3}):)?(\\d{1,2}):(\\d{1,2}):(\\d{1,2}(?:\\.\\d*)?)");

    private LabelTimeText() {
    }

    /** A parsed time: its form and nanoseconds (from midnight, or from day 1 00:00, or as written in seconds). */
    record Parsed(TimeForm form, long ns) {
    }

    /**
     * @return the time, or {@code null} with {@code why[0]} set to the reason when the text is not a time
     */
    static Parsed parse(String text, String[] why) {
        String t = text.strip();
        if (t.isEmpty()) {
            why[0] = "is empty";
            return null;
        }
        if (t.indexOf(':') >= 0) {
            Matcher m = CLOCK.matcher(t);
            if (!m.matches()) {
                why[0] = "'" + t + "' is not a time: write seconds (123.45), HH:MM:SS.sss or DDD:HH:MM:SS.sss";
                return null;
            }
            long day = m.group(1) == null ? 0 : Long.parseLong(m.group(1));
            long h = Long.parseLong(m.group(2));
            long min = Long.parseLong(m.group(3));
            BigDecimal s = new BigDecimal(m.group(4).endsWith(".") ? m.group(4) + "0" : m.group(4));
            if (m.group(1) != null && (day < 1 || day > 366)) {
                why[0] = "'" + t + "': day of year must be 1 to 366";
                return null;
            }
            if (h > 23 || min > 59 || s.compareTo(BigDecimal.valueOf(60)) >= 0) {
                why[0] = "'" + t + "': hours must be 0 to 23, minutes and seconds 0 to 59";
                return null;
            }
            long ns = ((h * 60 + min) * 60) * Units.NS_PER_S + toNs(s);
            if (m.group(1) != null) {
                return new Parsed(TimeForm.DAY_OF_YEAR_TIME, (day - 1) * NS_PER_DAY + ns);
            }
            return new Parsed(TimeForm.TIME_OF_DAY, ns);
        }
        if (!SECONDS.matcher(t).matches()) {
            why[0] = "'" + t + "' is not a number of seconds (nor HH:MM:SS.sss)";
            return null;
        }
        BigDecimal s = new BigDecimal(t.endsWith(".") ? t + "0" : t);
        // about 292 years either way fit in a long of nanoseconds
        if (s.abs().compareTo(BigDecimal.valueOf(9.2e9)) > 0) {
            why[0] = "'" + t + "' s is out of range";
            return null;
        }
        return new Parsed(TimeForm.SECONDS, toNs(s));
    }

    private static long toNs(BigDecimal seconds) {
        return seconds.movePointRight(9).setScale(0, RoundingMode.HALF_UP).longValueExact();
    }

    /** Prints {@code timeNs} in {@code form}, for messages, as the recorded-file reader does. */
    static String format(long timeNs, TimeForm form) {
        return form.format(timeNs);
    }
}
