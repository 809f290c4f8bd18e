package org.pointcall.ingest.sim.sortie;

import java.util.Locale;

import org.pointcall.ingest.sim.airframe.Airframe;
import org.pointcall.ingest.sim.airframe.Airframes;
import org.pointcall.ingest.sim.pilot.PilotSettings;
import org.pointcall.ingest.sim.truth.SortieTruth;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.demo.DemoFiles;

/**
 * How fast a whole demo sortie flies: sortie seconds per wall-clock second, the physics at the model's default
 * rate, frames at 100 Hz to an observer that does nothing. Not a test (timings are never asserted): run it by
 * hand, pinned to one core, as the ingest module's developer notes say. Arguments: warm-up runs, timed runs.
 */
public final class SortieSpeed {
    private SortieSpeed() {
    }

    public static void main(String[] args) {
        int warm = args.length > 0 ? Integer.parseInt(args[0]) : 1;
        int runs = args.length > 1 ? Integer.parseInt(args[1]) : 3;
        Airframe a = Airframes.load("veskarn-02");
        TestCard card = DemoFiles.card();
        for (int i = 0; i < warm + runs; i++) {
            long t0 = System.nanoTime();
            SortieTruth t = new SortieFlight(a, card, 1000L + i, PilotSettings.DEFAULT).fly(100.0, FrameObserver.NONE);
            double wall = (System.nanoTime() - t0) / 1e9;
            System.out.printf(Locale.ROOT, "%s run %d: %.1f s of sortie in %.2f s: %.0f x real time%n",
                    i < warm ? "warm-up" : "timed", i + 1, t.durationS(), wall, t.durationS() / wall);
        }
    }
}
