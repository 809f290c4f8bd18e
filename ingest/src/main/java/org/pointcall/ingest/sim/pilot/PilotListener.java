package org.pointcall.ingest.sim.pilot;

import org.pointcall.shared.card.TestPoint;

/**
 * What the pilot tells the flight about the points it flies, as it flies them. Times are those of the tick the
 * pilot was given; the flight model's state at that tick is the one the event belongs to.
 */
public interface PilotListener {
    /** The pilot starts the technique of {@code point} (card order {@code index}), with {@code flaw}. */
    void pointBegun(int index, TestPoint point, Flaw flaw, double timeS);

    /**
     * A mark of the technique the pilot knows by doing it ({@code pull}, {@code input}, {@code release},
     * {@code start}, {@code end}, {@code break-seen}, {@code recovered}...).
     */
    void pointMark(String name, double timeS);

    /** The point is over: the aircraft is back in steady flight. */
    void pointEnded(double timeS);
}
