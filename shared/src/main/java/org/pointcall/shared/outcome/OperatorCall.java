package org.pointcall.shared.outcome;

import java.util.Objects;

/**
 * The engineer's own call on a card point: it overrides the tool's verdict, which is kept beside it.
 *
 * @param cardId the card point
 * @param call   {@link Verdict#GOOD} or {@link Verdict#REPEAT}
 * @param note   the engineer's words, may be empty
 * @param atNs   data time at which the call was taken
 */
public record OperatorCall(String cardId, Verdict call, String note, long atNs) {
    public OperatorCall {
        Objects.requireNonNull(cardId, "cardId");
        Objects.requireNonNull(call, "call");
        if (call == Verdict.INCOMPLETE) {
            throw new IllegalArgumentException("an engineer calls a point good or repeat");
        }
        note = note == null ? "" : note.strip();
    }
}
