package org.pointcall.shared.outcome;

import java.util.Locale;
import java.util.Objects;

import com.fasterxml.jackson.annotation.JsonSubTypes;
import com.fasterxml.jackson.annotation.JsonTypeInfo;

/**
 * Something a card session reports, on data time, in the order it happened: a point begun, a band's status
 * changed, a point finished (with its verdict), an unplanned manoeuvre, a safety limit broken or cleared, a point
 * armed, an engineer's call, a begin flagged from the card that was withdrawn. Immutable; stored as JSON records (the {@code event} property names the type).
 */
@JsonTypeInfo(use = JsonTypeInfo.Id.NAME, property = "event")
@JsonSubTypes({
    @JsonSubTypes.Type(value = SessionEvent.PointStarted.class, name = "point-started"),
    @JsonSubTypes.Type(value = SessionEvent.BandChanged.class, name = "band-changed"),
    @JsonSubTypes.Type(value = SessionEvent.PointFinished.class, name = "point-finished"),
    @JsonSubTypes.Type(value = SessionEvent.Unplanned.class, name = "unplanned"),
    @JsonSubTypes.Type(value = SessionEvent.AlarmChanged.class, name = "alarm"),
    @JsonSubTypes.Type(value = SessionEvent.PointArmed.class, name = "armed"),
    @JsonSubTypes.Type(value = SessionEvent.PointWithdrawn.class, name = "point-withdrawn"),
    @JsonSubTypes.Type(value = SessionEvent.CallTaken.class, name = "call")
})
public sealed interface SessionEvent {
    /** Data time of the event. */
    long timeNs();

    /** One line for a log or a headless run. */
    String line();

    /** A detected point has begun; {@code cardId} is the card point it was bound to, or null. */
    record PointStarted(long timeNs, long detection, String kind, String cardId, String title, long beginNs)
            implements SessionEvent {
        public PointStarted {
            Objects.requireNonNull(kind, "kind");
        }

        @Override
        public String line() {
            return stamp(timeNs) + "begin  " + (cardId == null ? "(no card point)" : cardId) + " " + kind
                    + " from " + seconds(beginNs) + " s" + (title == null ? "" : ": " + title);
        }
    }

    /** A band of the active point changed status. */
    record BandChanged(long timeNs, String cardId, int index, String subject, String phase, BandStatus from,
                       BandStatus to, Double value, String unit, String band) implements SessionEvent {
        public BandChanged {
            Objects.requireNonNull(subject, "subject");
            Objects.requireNonNull(from, "from");
            Objects.requireNonNull(to, "to");
        }

        @Override
        public String line() {
            return stamp(timeNs) + "band   " + cardId + " " + phase + " " + subject + ": " + from.key() + " -> "
                    + to.key() + (value == null ? "" : ", " + Numbers.near(value, 4) + ("1".equals(unit) ? "" : " " + unit))
                    + " (band "
                    + band + ")";
        }
    }

    /** A point bound to the card (or any point when there is no card) has finished. */
    record PointFinished(long timeNs, PointOutcome outcome) implements SessionEvent {
        public PointFinished {
            Objects.requireNonNull(outcome, "outcome");
        }

        @Override
        public String line() {
            return stamp(timeNs) + "end    " + describe(outcome);
        }
    }

    /** A detected point that matched no card point: logged, analysed, never dropped. */
    record Unplanned(long timeNs, PointOutcome outcome) implements SessionEvent {
        public Unplanned {
            Objects.requireNonNull(outcome, "outcome");
        }

        @Override
        public String line() {
            return stamp(timeNs) + "unplanned " + describe(outcome);
        }
    }

    /** A safety limit broken or cleared. */
    record AlarmChanged(LimitAlarm alarm) implements SessionEvent {
        public AlarmChanged {
            Objects.requireNonNull(alarm, "alarm");
        }

        @Override
        public long timeNs() {
            return alarm.timeNs();
        }

        @Override
        public String line() {
            LimitAlarm a = alarm;
            return stamp(a.timeNs()) + "LIMIT  " + a.parameter() + " " + Numbers.near(a.value(), 4) + " " + a.unit()
                    + (a.raised() ? " breaks " : " back inside ") + a.limit()
                    + (a.raised() ? "" : ", peak " + Numbers.near(a.peak(), 4) + " " + a.unit())
                    + (a.cardId() == null ? "" : " (during " + a.cardId() + ")");
        }
    }

    /** The engineer armed a card point: the next detection of its kind binds to it. */
    record PointArmed(long timeNs, String cardId) implements SessionEvent {
        public PointArmed {
            Objects.requireNonNull(cardId, "cardId");
        }

        @Override
        public String line() {
            return stamp(timeNs) + "armed  " + cardId;
        }
    }

    /**
     * A point begun live from its departure from the card point's entry ({@link PointStarted} with that
     * {@code detection}) that the detector never confirmed: it was not a flight, and the card point waits as before.
     */
    record PointWithdrawn(long timeNs, long detection, String cardId, String why) implements SessionEvent {
        public PointWithdrawn {
            Objects.requireNonNull(why, "why");
        }

        @Override
        public String line() {
            return stamp(timeNs) + "undo   " + (cardId == null ? "(no card point)" : cardId) + " begin withdrawn: "
                    + why;
        }
    }

    /** The engineer's own call on a point, kept beside the tool's. */
    record CallTaken(OperatorCall call, Verdict toolVerdict) implements SessionEvent {
        public CallTaken {
            Objects.requireNonNull(call, "call");
        }

        @Override
        public long timeNs() {
            return call.atNs();
        }

        @Override
        public String line() {
            return stamp(call.atNs()) + "call   " + call.cardId() + " " + call.call().key().toUpperCase(Locale.ROOT)
                    + " by the engineer" + (toolVerdict == null ? "" : " (tool: " + toolVerdict.key() + ")")
                    + (call.note().isEmpty() ? "" : ": " + call.note());
        }
    }

    /** {@code SL-1 stall-level 812.4 to 840.1 s: REPEAT: reason; reason} */
    static String describe(PointOutcome o) {
        StringBuilder b = new StringBuilder();
        b.append(o.cardId() == null ? "-" : o.cardId()).append(' ').append(o.kind()).append(' ')
                .append(seconds(o.beginNs())).append(" to ").append(seconds(o.endNs())).append(" s");
        if (o.verdict() != null) {
            b.append(": ").append(o.verdict().key().toUpperCase(Locale.ROOT));
            for (int i = 0; i < o.reasons().size(); i++) {
                b.append(i == 0 ? ": " : "; ").append(o.reasons().get(i).text());
            }
        }
        return b.toString();
    }

    private static String stamp(long timeNs) {
        return String.format(Locale.ROOT, "%9s s  ", seconds(timeNs));
    }

    private static String seconds(long ns) {
        return String.format(Locale.ROOT, "%.1f", ns / 1e9);
    }
}
