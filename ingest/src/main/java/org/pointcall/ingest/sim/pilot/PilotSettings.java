package org.pointcall.ingest.sim.pilot;

import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Objects;

/**
 * How imperfect the simulated pilot is.
 *
 * @param flawProbability    chance that a point is given a flaw (a bad entry, an over-pull...), 0 to 1; the flaw
 *                           is drawn from those that make sense for the point's kind
 * @param trackingErrorScale multiplies the pilot's seeded tracking error (command noise and slow drifts); 0 flies
 *                           with the controllers' own precision, 1 is the usual pilot
 * @param forcedFlaws        flaw to give a point whatever the draw, by card point id ({@link Flaw#NONE} forces a
 *                           clean point); copied. A forced flaw is applied as given, even one that changes nothing
 *                           in that kind's technique (the truth names it all the same)
 */
public record PilotSettings(double flawProbability, double trackingErrorScale, Map<String, Flaw> forcedFlaws) {
    /** The usual pilot: 15 % of points flawed (a figure chosen for the demo), usual tracking error. */
    public static final PilotSettings DEFAULT = new PilotSettings(0.15, 1.0, Map.of());
    /** The usual tracking error and no flaws. */
    public static final PilotSettings NO_FLAWS = new PilotSettings(0.0, 1.0, Map.of());

    public PilotSettings {
        if (!(flawProbability >= 0.0 && flawProbability <= 1.0)) {
            throw new IllegalArgumentException("flaw probability must be between 0 and 1, got " + flawProbability);
        }
        if (!(trackingErrorScale >= 0.0 && trackingErrorScale <= 10.0)) {
            throw new IllegalArgumentException("tracking error scale must be between 0 and 10, got "
                    + trackingErrorScale);
        }
        Objects.requireNonNull(forcedFlaws, "forcedFlaws");
        forcedFlaws = Map.copyOf(forcedFlaws);
    }

    public PilotSettings withFlawProbability(double p) {
        return new PilotSettings(p, trackingErrorScale, forcedFlaws);
    }

    public PilotSettings withTrackingErrorScale(double s) {
        return new PilotSettings(flawProbability, s, forcedFlaws);
    }

    /** A copy that gives point {@code pointId} the flaw {@code flaw} whatever the draw. */
    public PilotSettings withFlaw(String pointId, Flaw flaw) {
        Map<String, Flaw> m = new LinkedHashMap<>(forcedFlaws);
        m.put(Objects.requireNonNull(pointId, "pointId"), Objects.requireNonNull(flaw, "flaw"));
        return new PilotSettings(flawProbability, trackingErrorScale, m);
    }
}
