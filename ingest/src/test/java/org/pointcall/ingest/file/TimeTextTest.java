package org.pointcall.ingest.file;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class TimeTextTest {
    private static final long S = 1_000_000_000L;

    private final TimeText t = new TimeText();

    private long parse(String s, boolean decimalComma) {
        assertTrue(t.parse(s, 0, s.length(), decimalComma), s);
        return t.ns();
    }

    @Test
    void timeOfDayToNanosecondsFromMidnight() {
        assertEquals(12 * 3600 * S + 34 * 60 * S + 56 * S + 789_000_000L, parse("12:34:56.789", false));
        assertEquals(TimeForm.TIME_OF_DAY, t.form());
        assertEquals(23 * 3600 * S + 59 * 60 * S + 59 * S + 999_999_999L, parse("23:59:59.999999999", false));
        assertEquals(5 * 3600 * S + 500_000_000L, parse("5:00:00,5", true));
        assertEquals(0L, parse("00:00:00", false));
        // the tenth digit rounds half up
        assertEquals(2L, parse("00:00:00.0000000015", false));
    }

    @Test
    void dayOfYearTimeCountsFromTheFirstOfJanuary() {
        assertEquals(0L, parse("001:00:00:00.000", false));
        assertEquals(TimeForm.DAY_OF_YEAR_TIME, t.form());
        assertEquals(364 * TimeText.NS_PER_DAY + 86_399 * S + 500_000_000L, parse("365:23:59:59.5", false));
    }

    @Test
    void rejectsWhatIsNotATime() {
        for (String bad : new String[] {"12:34", "24:00:00", "12:60:00", "12:00:60", "000:12:00:00", "367:00:00:00",
                "12:00:00.5x", "1:2:3:4:5", "ab:cd:ef", "12:00:00,5", ":00:00", "123:00:00"}) {
            assertFalse(t.parse(bad, 0, bad.length(), false), bad);
        }
    }

    @Test
    void formatsInTheFilesOwnForm() {
        assertEquals("12.300 s", TimeText.format(12_300_000_000L, TimeForm.SECONDS));
        assertEquals("0.000000001 s", TimeText.format(1L, TimeForm.SECONDS));
        assertEquals("-1.500 s", TimeText.format(-1_500_000_000L, TimeForm.SECONDS));
        assertEquals("23:59:59.900", TimeText.format(86_399_900_000_000L, TimeForm.TIME_OF_DAY));
        assertEquals("365:23:59:59.500", TimeText.format(364 * TimeText.NS_PER_DAY + 86_399_500_000_000L,
                TimeForm.DAY_OF_YEAR_TIME));
    }
}
