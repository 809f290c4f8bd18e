package org.pointcall.ingest.sim.truth;

/**
 * One band of a flown point judged on the simulator's exact state.
 *
 * @param subject parameter or metric name, as on the card
 * @param phase   band phase key ({@code entry}, {@code throughout}, {@code rate}, {@code instant}, {@code result})
 * @param value   the value the band was judged on, in the band's unit (for {@code throughout}, the sample
 *                furthest outside, or the one nearest an edge when all were inside)
 * @param unit    the band's unit symbol
 * @param band    the band as written ({@code 320 +/- 10 kt})
 * @param inside  whether the point held this band
 */
public record BandTruth(String subject, String phase, double value, String unit, String band, boolean inside) {
}
