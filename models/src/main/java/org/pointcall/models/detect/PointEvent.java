package org.pointcall.models.detect;

import java.util.List;
import java.util.Objects;
import java.util.OptionalLong;

import org.pointcall.shared.kind.ManoeuvreKind;

/**
 * What the detector says about one test point, on the stream's data time. A point's events share its
 * {@code pointId} and come in this order: one {@link Type#BEGUN}, any number of {@link Type#REFINED}, then exactly
 * one {@link Type#ENDED} or {@link Type#DISCARDED}. Points never overlap: a point's last event comes before the next
 * point's {@code BEGUN}.
 *
 * @param type         what happened
 * @param pointId      1, 2, 3... in the order points began, per detector run
 * @param kind         the manoeuvre as now classified (a {@code REFINED} may change it)
 * @param beginNs      best estimate of the begin so far
 * @param endNs        the end; {@link #UNKNOWN_NS} until {@code ENDED} or {@code DISCARDED}
 * @param reportedAtNs data time at which this event was decided (the tick that produced it); the live-begin latency
 *                     of a point is the {@code BEGUN} event's {@code reportedAtNs - beginNs} against the true begin
 * @param begunAtNs    data time the point's {@code BEGUN} was reported (equal to {@code reportedAtNs} for it)
 * @param confidence   mean smoothed class probability of {@code kind} over the point so far, in [0, 1]
 * @param keyInstants  named instants found so far, in time order
 * @param evidence     plain lines: top features given by the classifier, guard rules that passed, failed or could
 *                     not be checked, minimum duration, kind switches, why the point ended
 */
public record PointEvent(Type type, long pointId, ManoeuvreKind kind, long beginNs, long endNs, long reportedAtNs,
                         long begunAtNs, double confidence, List<KeyInstant> keyInstants, List<String> evidence) {

    /** Marks a time not known yet. */
    public static final long UNKNOWN_NS = Long.MIN_VALUE;

    /** The four things that happen to a point. */
    public enum Type {
        /** The hysteresis entered: the point is under way (live). */
        BEGUN,
        /** Something known about the open point changed: its kind, or the guard rules confirmed it. */
        REFINED,
        /** The point is over and passed its minimum duration and guard rules. */
        ENDED,
        /** A begun point that its minimum duration or a guard rule rejected; the evidence names which. */
        DISCARDED
    }

    public PointEvent {
        Objects.requireNonNull(type, "type");
        Objects.requireNonNull(kind, "kind");
        if (pointId <= 0) {
            throw new IllegalArgumentException("point id must be positive, got " + pointId);
        }
        if (beginNs == UNKNOWN_NS) {
            throw new IllegalArgumentException("every point event needs a begin");
        }
        boolean closed = type == Type.ENDED || type == Type.DISCARDED;
        if (closed && endNs == UNKNOWN_NS) {
            throw new IllegalArgumentException(type + " needs an end");
        }
        if (!closed && endNs != UNKNOWN_NS) {
            throw new IllegalArgumentException(type + " cannot carry an end yet");
        }
        if (closed && endNs < beginNs) {
            throw new IllegalArgumentException("end " + endNs + " before begin " + beginNs);
        }
        if (begunAtNs > reportedAtNs) {
            throw new IllegalArgumentException("begun at " + begunAtNs + " after this report at " + reportedAtNs);
        }
        if (!(confidence >= 0.0 && confidence <= 1.0)) {
            throw new IllegalArgumentException("confidence must be in [0, 1], got " + confidence);
        }
        keyInstants = List.copyOf(keyInstants);
        evidence = List.copyOf(evidence);
    }

    /** True for {@code ENDED} and {@code DISCARDED}: nothing more will be said about this point. */
    public boolean isFinal() {
        return type == Type.ENDED || type == Type.DISCARDED;
    }

    /** End minus begin, or {@link #UNKNOWN_NS} while the point is open. */
    public long durationNs() {
        return endNs == UNKNOWN_NS ? UNKNOWN_NS : endNs - beginNs;
    }

    public OptionalLong keyInstant(String name) {
        for (KeyInstant k : keyInstants) {
            if (k.name().equals(name)) {
                return OptionalLong.of(k.timeNs());
            }
        }
        return OptionalLong.empty();
    }

    /** True when some evidence line starts with {@code prefix} (for example {@code "failed loop-pitch-90"}). */
    public boolean hasEvidence(String prefix) {
        for (String e : evidence) {
            if (e.startsWith(prefix)) {
                return true;
            }
        }
        return false;
    }
}
