package org.pointcall.models.analysis;

import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

import org.pointcall.models.analysis.stall.StallAnalyser;
import org.pointcall.shared.kind.ManoeuvreKind;

/**
 * The analyser of each manoeuvre kind, and one call to analyse a flown point with it. Analysers are stateless and
 * shared.
 */
public final class Analysers {
    private static final Map<ManoeuvreKind, ManoeuvreAnalyser> BY_KIND = new EnumMap<>(ManoeuvreKind.class);

    static {
        register(new StallAnalyser(ManoeuvreKind.STALL_LEVEL));
        register(new StallAnalyser(ManoeuvreKind.STALL_TURN));
        for (ManoeuvreKind k : ManoeuvreKind.values()) {
            if (!BY_KIND.containsKey(k)) {
                register(new PendingAnalyser(k));
            }
        }
        for (ManoeuvreKind k : ManoeuvreKind.values()) {
            if (!BY_KIND.containsKey(k)) {
                throw new IllegalStateException("no analyser for " + k.key());
            }
        }
    }

    private Analysers() {
    }

    private static void register(ManoeuvreAnalyser a) {
        if (BY_KIND.put(a.kind(), a) != null) {
            throw new IllegalStateException("two analysers for " + a.kind().key());
        }
    }

    /** The analyser of {@code kind}. */
    public static ManoeuvreAnalyser forKind(ManoeuvreKind kind) {
        return BY_KIND.get(Objects.requireNonNull(kind, "kind"));
    }

    /**
     * Analyses one flown point with its kind's analyser; a history missing some of the analyser's parameters gets
     * a note naming them, and whatever can still be computed is.
     */
    public static ManoeuvreResult analyse(ManoeuvreKind kind, PointHistory history, long beginNs, long endNs,
                                          Map<String, Long> hints, Map<String, Double> bandIntervalsS) {
        Objects.requireNonNull(history, "history");
        if (endNs <= beginNs) {
            throw new IllegalArgumentException("a point must end after it begins");
        }
        ManoeuvreAnalyser a = forKind(kind);
        return a.analyse(history, beginNs, endNs, hints == null ? Map.of() : hints,
                bandIntervalsS == null ? Map.of() : bandIntervalsS);
    }

    /** The parameters any analyser reads: what a history kept for analysis should hold. */
    public static List<String> parameters() {
        java.util.LinkedHashSet<String> all = new java.util.LinkedHashSet<>();
        for (ManoeuvreAnalyser a : BY_KIND.values()) {
            all.addAll(a.parameters());
        }
        return List.copyOf(all);
    }
}
