/**
 * A simulated sortie: the test pilot ({@link org.pointcall.ingest.sim.pilot.CardPilot}) flies a test card on the
 * flight model, frames go to a {@link org.pointcall.ingest.sim.sortie.FrameObserver} at the output rate, and the
 * exact truth of every point (begin, end, key instants, entry conditions, the kind's metrics and each band judged
 * on the true state) comes back as a {@link org.pointcall.ingest.sim.truth.SortieTruth}.
 *
 * <p>Truth conventions (those of the flight model unless said): bank right wing down positive, sideslip with the
 * wind from the right positive, elevator trailing edge down and rudder trailing edge left positive; the aileron,
 * whose model sign rolls left, is reported right-roll positive as the demo dictionary defines it. Heading is the
 * model's true heading, 0 to 360 deg. Altitudes are pressure altitudes, speeds calibrated unless named.
 */
package org.pointcall.ingest.sim.sortie;
