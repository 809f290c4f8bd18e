/**
 * The simulated test pilot: closed-loop controllers on the flight model's true state (what a pilot reads from
 * attitude, airspeed, altimeter, g-meter and AoA gauge) that fly each manoeuvre kind of a test card the way a test
 * pilot does, the transits between points, and the pilot's imperfections (seeded tracking error, slow drifts and
 * occasional bad entries, each named as a {@link org.pointcall.ingest.sim.pilot.Flaw}).
 *
 * <p>{@link org.pointcall.ingest.sim.pilot.CardPilot} is the entry point: it is ticked at its control rate with the
 * flight model, sets the model's controls and reports the begin, key marks and end of each point to a
 * {@link org.pointcall.ingest.sim.pilot.PilotListener}. Targets come from the card point's bands; where a card is
 * silent the kind's usual values (common practice) scaled to the airframe's envelope are used.
 *
 * <p>Sign conventions are the flight model's: elevator trailing edge down, aileron rolling left and rudder
 * trailing edge left positive; bank right wing down, sideslip with the wind from the right positive.
 * Single-threaded; one pilot per flight.
 */
package org.pointcall.ingest.sim.pilot;
