package org.pointcall.models.analysis;

import java.util.Map;

import org.pointcall.shared.kind.ManoeuvreKind;

/**
 * Computes a manoeuvre kind's key instants and metrics from the time history of a flown point.
 *
 * <p>The history starts some seconds before {@code beginNs} (pre-roll, for entry rates) and may run past
 * {@code endNs}. The detector's own key instants are hints: an analyser may refine them from the data.
 */
public interface ManoeuvreAnalyser {
    /** The kind this analyser serves. */
    ManoeuvreKind kind();

    /**
     * @param history          the point's parameters, SI, by dictionary name
     * @param beginNs          the point's begin (detected or labelled)
     * @param endNs            the point's end
     * @param hintedInstantsNs key instants already known (from the detector), possibly empty
     * @param bandIntervalsS   per band subject with a stated interval ({@code KCAS} rate over 10 s), that interval
     */
    ManoeuvreResult analyse(PointHistory history, long beginNs, long endNs, Map<String, Long> hintedInstantsNs,
                            Map<String, Double> bandIntervalsS);

    /** The dictionary names this analyser reads; a history missing some gets notes, not an exception. */
    java.util.List<String> parameters();
}
