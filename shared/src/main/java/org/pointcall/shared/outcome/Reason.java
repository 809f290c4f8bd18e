package org.pointcall.shared.outcome;

import java.util.Objects;

/**
 * One reason a point is not good, in plain words and numbers ({@code "entry KCAS 158 kt, band 150 +/- 5 kt"}).
 *
 * @param subject the band's parameter or metric, {@code limit:<parameter>} for a safety limit, or {@code point}
 * @param text    the sentence an engineer reads on the radio
 */
public record Reason(String subject, String text) {
    public Reason {
        Objects.requireNonNull(subject, "subject");
        if (text == null || text.isBlank()) {
            throw new IllegalArgumentException("a reason needs its text");
        }
    }
}
