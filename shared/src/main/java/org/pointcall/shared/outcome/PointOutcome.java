package org.pointcall.shared.outcome;

import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.TreeMap;

import com.fasterxml.jackson.annotation.JsonIgnore;

/**
 * One flown point as it came out: what was detected, which card point it was bound to, its bands, its metrics, the
 * tool's verdict with reasons, and the engineer's call beside it.
 *
 * @param detection    the detector's point id in its run (1, 2, 3...)
 * @param cardId       the card point it was bound to; null for an unplanned manoeuvre or when there is no card
 * @param kind         manoeuvre kind key
 * @param title        the card point's title, or the kind's display name
 * @param beginNs      begin, data time
 * @param endNs        end, data time
 * @param confidence   the detector's confidence in the kind, 0 to 1
 * @param verdict      the tool's proposal; null when there is no card point to judge against
 * @param reasons      why it is not good (empty when good or unjudged)
 * @param bands        each band of the card point, in card order
 * @param metrics      the kind's analysis results, in the registry's units
 * @param instantsNs   key instants, data time
 * @param notes        plain lines: what could not be computed and why, why the point ended
 * @param operatorCall the engineer's call, or null
 */
public record PointOutcome(long detection, String cardId, String kind, String title, long beginNs, long endNs,
                           double confidence, Verdict verdict, List<Reason> reasons, List<BandResult> bands,
                           List<MetricValue> metrics, Map<String, Long> instantsNs, List<String> notes,
                           OperatorCall operatorCall) {
    public PointOutcome {
        Objects.requireNonNull(kind, "kind");
        Objects.requireNonNull(title, "title");
        if (endNs < beginNs) {
            throw new IllegalArgumentException("point ends before it begins");
        }
        if (!(confidence >= 0 && confidence <= 1)) {
            throw new IllegalArgumentException("confidence must be in [0, 1]");
        }
        if (operatorCall != null && !operatorCall.cardId().equals(cardId)) {
            throw new IllegalArgumentException("operator call on " + operatorCall.cardId() + " kept on " + cardId);
        }
        reasons = List.copyOf(reasons);
        bands = List.copyOf(bands);
        metrics = List.copyOf(metrics);
        instantsNs = Map.copyOf(new TreeMap<>(instantsNs));
        notes = List.copyOf(notes);
    }

    /** True when bound to a card point. */
    @JsonIgnore
    public boolean isPlanned() {
        return cardId != null;
    }

    /** The call that stands: the engineer's when given, else the tool's (null when neither). */
    @JsonIgnore
    public Verdict finalCall() {
        return operatorCall != null ? operatorCall.call() : verdict;
    }

    /** A copy carrying the engineer's call (which must be on this point's card id). */
    public PointOutcome withOperatorCall(OperatorCall call) {
        return new PointOutcome(detection, cardId, kind, title, beginNs, endNs, confidence, verdict, reasons, bands,
                metrics, instantsNs, notes, call);
    }

    /** The metric of that name, or null. */
    public MetricValue metric(String name) {
        for (MetricValue m : metrics) {
            if (m.name().equals(name)) {
                return m;
            }
        }
        return null;
    }
}
