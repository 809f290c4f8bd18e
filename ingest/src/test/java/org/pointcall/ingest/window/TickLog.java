package org.pointcall.ingest.window;

import java.util.ArrayList;
import java.util.List;

/** Test listener keeping a copy of every tick. */
final class TickLog implements FeatureListener {
    record Tick(long timeNs, double[] features, boolean[] valid, double[] coverage) {
    }

    final List<Tick> ticks = new ArrayList<>();

    @Override
    public void onFeatures(long timeNs, double[] features, boolean[] valid, double[] coverage) {
        ticks.add(new Tick(timeNs, features.clone(), valid.clone(), coverage.clone()));
    }

    /** The tick at {@code timeS} seconds (ticks fall on whole nanoseconds of the 20 Hz grid). */
    Tick at(double timeS) {
        long t = Math.round(timeS * 1e9);
        for (Tick k : ticks) {
            if (k.timeNs() == t) {
                return k;
            }
        }
        throw new AssertionError("no tick at " + timeS + " s");
    }
}
