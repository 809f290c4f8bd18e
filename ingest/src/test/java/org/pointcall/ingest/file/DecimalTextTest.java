package org.pointcall.ingest.file;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigDecimal;
import java.math.RoundingMode;
import java.util.Locale;
import java.util.SplittableRandom;

import org.junit.jupiter.api.Test;

class DecimalTextTest {

    private final DecimalText d = new DecimalText();

    private double parse(String s, boolean decimalComma) {
        assertTrue(d.scan(s, 0, s.length(), decimalComma), s);
        return d.toDouble(s);
    }

    @Test
    void roundsExactlyAsTheJdkParserOnSeededRandomDecimals() {
        SplittableRandom rnd = new SplittableRandom(20240611L);
        for (int i = 0; i < 40_000; i++) {
            String s = switch (i % 4) {
                case 0 -> Double.toString(Double.longBitsToDouble(rnd.nextLong()) % 1e6);
                case 1 -> String.format(Locale.ROOT, "%." + rnd.nextInt(0, 12) + "f", rnd.nextDouble(-1e5, 1e5));
                case 2 -> Long.toString(rnd.nextLong(-10_000_000_000L, 10_000_000_000L)) + "e"
                        + rnd.nextInt(-30, 30);
                default -> rnd.nextInt(0, 1000) + "." + Long.toString(rnd.nextLong(0, Long.MAX_VALUE));
            };
            if (s.contains("NaN") || s.contains("Infinity")) {
                continue;
            }
            double expected = Double.parseDouble(s);
            double got = parse(s, false);
            assertEquals(Double.doubleToRawLongBits(expected), Double.doubleToRawLongBits(got), s);
        }
    }

    @Test
    void acceptsTheUsualSpellingsAndADecimalCommaOnlyWhenAsked() {
        assertEquals(12.5, parse(" 12.5 ", false));
        assertEquals(12.5, parse("12,5", true));
        assertEquals(-0.5, parse("-.5", false));
        assertEquals(5.0, parse("+5.", false));
        assertEquals(1500.0, parse("1.5E3", false));
        assertEquals(Double.doubleToRawLongBits(-0.0), Double.doubleToRawLongBits(parse("-0", false)));
        for (String bad : new String[] {"", " ", "12,5", "1.2.3", "1e", "e5", ".", "-", "0x10", "12 5", "1,5.0",
                "NaN", "Infinity", "1.5f", "abc", "1_000"}) {
            assertFalse(d.scan(bad, 0, bad.length(), false), bad);
        }
        assertFalse(d.scan("1,250.5", 0, 7, true));
    }

    @Test
    void convertsToWholeNanosecondsExactlyWithHalfUpRounding() {
        assertNs(1_700_000_000_123_456_789L, "1700000000.123456789", 1_000_000_000L);
        assertNs(12_300_000_000L, "12.3", 1_000_000_000L);
        assertNs(2L, "1.5", 1L);
        assertNs(-2L, "-1.5", 1L);
        assertNs(1_500_000L, "1.5", 1_000_000L);
        assertNs(60_000_000_000L, "1", 60_000_000_000L);
        assertNs(1_000_000_000_000L, "1e3", 1_000_000_000L);
        assertNs(1L, "0.0000000005", 1_000_000_000L);
        // 17 significant digits, as a float printer writes 1234.55: scaled by the power of ten, not overflowed
        assertNs(1_234_550_000_000L, "1234.5500000000002", 1_000_000_000L);
        assertNs(90_000_000_000L, "1.5", 60_000_000_000L);
        // more digits than a long holds: the exact decimal path must agree with BigDecimal
        String longText = "12.3456789012345678901234";
        long expected = new BigDecimal(longText).multiply(BigDecimal.valueOf(1_000_000_000L))
                .setScale(0, RoundingMode.HALF_UP).longValueExact();
        assertNs(expected, longText, 1_000_000_000L);
        assertTrue(d.scan("1e30", 0, 4, false));
        assertFalse(d.toNs("1e30", 1_000_000_000L), "beyond the range of a long");
    }

    private void assertNs(long expected, String text, long nsPerUnit) {
        assertTrue(d.scan(text, 0, text.length(), false), text);
        assertTrue(d.toNs(text, nsPerUnit), text);
        assertEquals(expected, d.ns(), text);
    }

    @Test
    void namesTheUsualNonFiniteWords() {
        for (String w : new String[] {"NaN", "nan", "-nan", "Inf", "-inf", "+Infinity", "1.#INF", "#N/A", "#DIV/0!"}) {
            assertTrue(DecimalText.isNonFiniteWord(w, 0, w.length()), w);
        }
        assertFalse(DecimalText.isNonFiniteWord("abc", 0, 3));
    }
}
