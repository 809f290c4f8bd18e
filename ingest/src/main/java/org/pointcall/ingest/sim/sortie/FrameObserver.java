package org.pointcall.ingest.sim.sortie;

import org.pointcall.ingest.sim.model.FlightModel;

/**
 * Receives the simulated aircraft at every output frame instant. The model and configuration are live views,
 * valid during the call only (the flight may replace the model instance when the configuration changes): read
 * what is needed, keep nothing.
 */
@FunctionalInterface
public interface FrameObserver {
    /** Observer that does nothing, for timing runs and truth-only flights. */
    FrameObserver NONE = (t, m, c) -> { };

    /**
     * @param timeS  the frame instant, s of sortie time ({@code k / frameRateHz}); the model's state is the one of
     *               the physics step nearest that instant
     * @param model  the flight model, at that state
     * @param config gear, flaps and what else the model does not carry
     */
    void onFrame(double timeS, FlightModel model, AircraftConfig config);
}
