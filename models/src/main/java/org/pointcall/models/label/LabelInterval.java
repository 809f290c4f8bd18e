package org.pointcall.models.label;

import java.util.Objects;

import org.pointcall.shared.kind.ManoeuvreKind;

/**
 * One labelled test point: a manoeuvre kind over the half-open interval {@code [beginNs, endNs)} of the recording's
 * time line (the recording's own clock, as {@link org.pointcall.ingest.file.RecordedFiles} reads it).
 *
 * @param kind    the manoeuvre flown
 * @param beginNs first instant of the point, ns of recording time
 * @param endNs   first instant after the point, ns of recording time; after {@code beginNs}
 * @param cardId  the test card point's id, or empty when the label does not name one
 * @param note    free text of the labeller, or empty
 * @param line    line of the label file the interval came from, 0 when it came from elsewhere (a truth file)
 */
public record LabelInterval(ManoeuvreKind kind, long beginNs, long endNs, String cardId, String note, int line) {
    public LabelInterval {
        Objects.requireNonNull(kind, "kind");
        if (endNs <= beginNs) {
            throw new IllegalArgumentException("a label interval must end after it begins, got [" + beginNs + ", "
                    + endNs + ") ns");
        }
        if (line < 0) {
            throw new IllegalArgumentException("line must be >= 0");
        }
        cardId = cardId == null ? "" : cardId;
        note = note == null ? "" : note;
    }

    /** Whether {@code timeNs} lies in {@code [beginNs, endNs)}. */
    public boolean contains(long timeNs) {
        return timeNs >= beginNs && timeNs < endNs;
    }

    public long durationNs() {
        return endNs - beginNs;
    }

    /** A copy moved by {@code deltaNs} on the time line. */
    public LabelInterval shifted(long deltaNs) {
        return new LabelInterval(kind, beginNs + deltaNs, endNs + deltaNs, cardId, note, line);
    }
}
