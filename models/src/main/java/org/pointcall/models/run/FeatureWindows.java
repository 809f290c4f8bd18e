package org.pointcall.models.run;

import java.util.List;

import org.pointcall.ingest.window.WindowSpec;

/** The sliding windows a model is trained on when nothing else is said. */
public final class FeatureWindows {
    /** Window lengths, s: short enough for a 2 s roll or doublet, long enough to see a loop or a slow change. */
    private static final double[] LENGTHS_S = {1.0, 4.0, 12.0};
    /**
     * The same and a slow baseline, for the parameters whose level belongs to the airframe rather than to the
     * manoeuvre (its speeds, altitudes, trim angle of attack and elevator): 30 s is longer than any point's entry
     * change and short enough to be full before the first point of a sortie.
     */
    private static final double[] BASELINE_LENGTHS_S = {1.0, 4.0, 12.0, 30.0};
    private static final java.util.Set<String> BASELINED = java.util.Set.of("KCAS", "Hp", "AoA", "Elevator");

    /**
     * The quantities the guard rules and the kinds' shapes live in: air data, attitude, body rates, load factor,
     * and the pitch control, which marks an input before the response.
     */
    private static final List<String> PARAMETERS = List.of("KCAS", "Hp", "AoA", "AoS", "Pitch", "Roll", "P", "Q",
            "Nz", "Elevator");

    private FeatureWindows() {
    }

    /**
     * Every parameter of {@link #parameters()} over 1, 4 and 12 s, and KCAS, Hp, AoA and Elevator over 30 s too
     * (their baseline), with the extractor's default gap rule.
     */
    public static List<WindowSpec> standard() {
        return PARAMETERS.stream().map(p -> WindowSpec.of(p, BASELINED.contains(p) ? BASELINE_LENGTHS_S : LENGTHS_S))
                .toList();
    }

    public static List<String> parameters() {
        return PARAMETERS;
    }
}
