package org.pointcall.models.run;

import java.util.List;

import org.pointcall.ingest.window.WindowSpec;

/** The sliding windows a model is trained on when nothing else is said. */
public final class FeatureWindows {
    /** Window lengths, s: short enough for a 2 s roll or doublet, long enough to see a loop or a slow change. */
    private static final double[] LENGTHS_S = {1.0, 4.0, 12.0};

    /**
     * The quantities the guard rules and the kinds' shapes live in: air data, attitude, body rates, load factor,
     * and the pitch control, which marks an input before the response.
     */
    private static final List<String> PARAMETERS = List.of("KCAS", "Hp", "AoA", "AoS", "Pitch", "Roll", "P", "Q",
            "Nz", "Elevator");

    private FeatureWindows() {
    }

    /** Every parameter of {@link #parameters()} over 1, 4 and 12 s, with the extractor's default gap rule. */
    public static List<WindowSpec> standard() {
        return PARAMETERS.stream().map(p -> WindowSpec.of(p, LENGTHS_S)).toList();
    }

    public static List<String> parameters() {
        return PARAMETERS;
    }
}
