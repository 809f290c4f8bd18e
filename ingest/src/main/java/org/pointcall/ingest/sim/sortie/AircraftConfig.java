package org.pointcall.ingest.sim.sortie;

/**
 * What a telemetry mapper needs beyond the flight model's state: the landing gear and flap selector, and what
 * the pilot is doing (for logs and labels, not for telemetry). Stick forces are not modelled: a mapper derives
 * them from the surface positions if it wants them. Mutated by the flight only, between frames.
 */
public final class AircraftConfig {
    private int gearDown;
    private int flap;
    private String activity = "";

    AircraftConfig() {
    }

    /** 1 when the gear is down and locked, 0 otherwise (in transit included). */
    public int gearDown() {
        return gearDown;
    }

    /** Flap selector: 0 up, 1 take-off, 2 landing. */
    public int flap() {
        return flap;
    }

    /** What the pilot is doing: {@code transit to <point id>}, a point id, {@code closing leg} or {@code done}. */
    public String activity() {
        return activity;
    }

    void set(int gearDownNow, int flapNow) {
        gearDown = gearDownNow;
        flap = flapNow;
    }

    void activity(String a) {
        activity = a;
    }
}
