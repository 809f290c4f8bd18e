package org.pointcall.ingest.sim.model;

import java.util.Objects;
import org.pointcall.shared.error.Plain;

/**
 * How a flight model runs: its fixed step rate, the seed of everything random in it (turbulence, the side of a wing
 * drop), the steady wind and the turbulence.
 *
 * @param stepRateHz physics steps per second, 500 to 20,000 (500 by default)
 * @param seed       one seed for the whole model; the same seed and inputs give the same bytes of state
 * @param wind       steady wind
 * @param turbulence turbulence
 */
public record SimulationSettings(double stepRateHz, long seed, Wind wind, TurbulenceSettings turbulence) {

    /** 500 Hz, seed 1, calm, no turbulence. */
    public static final SimulationSettings DEFAULT =
            new SimulationSettings(FlightModel.DEFAULT_STEP_RATE_HZ, 1L, Wind.CALM, TurbulenceSettings.NONE);

    public SimulationSettings {
        if (!(stepRateHz >= 500.0 && stepRateHz <= 20000.0)) {
            throw new IllegalArgumentException("step rate must be between 500 and 20000 Hz, got "
                    + Plain.of(stepRateHz));
        }
        Objects.requireNonNull(wind, "wind");
        Objects.requireNonNull(turbulence, "turbulence");
    }

    public SimulationSettings withStepRateHz(double hz) {
        return new SimulationSettings(hz, seed, wind, turbulence);
    }

    public SimulationSettings withSeed(long s) {
        return new SimulationSettings(stepRateHz, s, wind, turbulence);
    }

    public SimulationSettings withWind(Wind w) {
        return new SimulationSettings(stepRateHz, seed, w, turbulence);
    }

    public SimulationSettings withTurbulence(TurbulenceSettings t) {
        return new SimulationSettings(stepRateHz, seed, wind, t);
    }
}
