package org.pointcall.ingest.sim.truth;

import java.util.List;
import java.util.Map;

/**
 * What the simulated pilot really flew for one card point: exact times, key instants, entry conditions, the kind's
 * result metrics computed from the exact state, and the verdict the bands give on that state.
 *
 * @param cardId     the card point's id
 * @param kind       the manoeuvre kind key
 * @param beginS     the pilot starts the technique, s of sortie time
 * @param endS       recovered to steady flight, s of sortie time
 * @param instants   key instants of the kind (for example {@code break}, {@code apex}), s of sortie time
 * @param entry      conditions at the begin (Hp ft, KCAS kt, Mach, Nz g, heading deg, bank deg)
 * @param metrics    the kind's result metrics, in the registry's units
 * @param bands      each band of the point, judged
 * @param inBands    true when every band held
 * @param flaw       the imperfection the pilot was given on purpose, or {@code none}
 */
public record PointTruth(String cardId, String kind, double beginS, double endS, Map<String, Double> instants,
                         Map<String, Double> entry, Map<String, Double> metrics, List<BandTruth> bands,
                         boolean inBands, String flaw) {
    public PointTruth {
        if (!(endS > beginS)) {
            throw new IllegalArgumentException("point " + cardId + " must end after it begins");
        }
        instants = Map.copyOf(instants);
        entry = Map.copyOf(entry);
        metrics = Map.copyOf(metrics);
        bands = List.copyOf(bands);
    }
}
