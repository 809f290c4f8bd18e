package org.pointcall.models.analysis.handling;

/**
 * Flight phase categories of MIL-F-8785C (1980), paragraph 1.4 [memory]: A, non-terminal phases needing rapid manoeuvring or
 * precise tracking; B, non-terminal phases flown with gradual manoeuvres (climb, cruise, descent); C, terminal
 * phases (take-off, approach, landing).
 */
public enum FlightPhaseCategory {
    A, B, C;

    /** Category C with the gear or the flaps down, B otherwise: a test point at altitude is flown as cruise. */
    public static FlightPhaseCategory ofConfiguration(boolean gearDown, boolean flapsDown) {
        return gearDown || flapsDown ? C : B;
    }
}
