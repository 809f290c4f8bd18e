package org.pointcall.models.analysis;

import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

import org.pointcall.models.analysis.accel.LevelAccelAnalyser;
import org.pointcall.models.analysis.doublet.DoubletAnalyser;
import org.pointcall.models.analysis.loop.LoopAnalyser;
import org.pointcall.models.analysis.phugoid.PhugoidAnalyser;
import org.pointcall.models.analysis.roll.AileronRollAnalyser;
import org.pointcall.models.analysis.sideslip.SideslipAnalyser;
import org.pointcall.models.analysis.stabilised.StabilisedAnalyser;
import org.pointcall.models.analysis.stall.StallAnalyser;
import org.pointcall.models.analysis.windup.WindUpTurnAnalyser;
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
        register(new LoopAnalyser());
        register(new WindUpTurnAnalyser());
        register(new LevelAccelAnalyser());
        register(new DoubletAnalyser());
        register(new PhugoidAnalyser());
        register(new SideslipAnalyser());
        register(new AileronRollAnalyser());
        register(new StabilisedAnalyser());
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
        ManoeuvreResult r = a.analyse(history, beginNs, endNs, hints == null ? Map.of() : hints,
                bandIntervalsS == null ? Map.of() : bandIntervalsS);
        String gap = largestGap(history, beginNs, endNs);
        if (gap == null) {
            return r;
        }
        List<String> notes = new java.util.ArrayList<>(r.notes());
        notes.add(gap);
        return new ManoeuvreResult(r.kind(), r.instantsNs(), r.metricsSi(), r.methods(), notes);
    }

    /** Frames further apart than this within a point are a telemetry gap worth telling the reader about. */
    public static final double GAP_NOTE_S = 0.25;

    /** A note on the longest gap between frames within the point, or null when none is over {@link #GAP_NOTE_S}. */
    static String largestGap(PointHistory h, long beginNs, long endNs) {
        long worst = 0;
        long at = 0;
        int i = Math.max(1, h.firstAtOrAfter(beginNs));
        for (; i < h.size() && h.timeNs(i - 1) <= endNs; i++) {
            long d = h.timeNs(i) - h.timeNs(i - 1);
            if (d > worst) {
                worst = d;
                at = h.timeNs(i - 1);
            }
        }
        if (worst * 1e-9 <= GAP_NOTE_S) {
            return null;
        }
        return String.format(java.util.Locale.ROOT, "telemetry gap of %.2f s from %.2f s after the begin: metrics "
                + "over it rest on the data either side", worst * 1e-9, (at - beginNs) * 1e-9);
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
