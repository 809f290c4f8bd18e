package org.pointcall.ui.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;

import org.pointcall.ingest.sim.airframe.AirframeVariation;
import org.pointcall.ingest.sim.pilot.PilotSettings;
import org.pointcall.ingest.sim.sensor.SensorSettings;
import org.pointcall.models.run.SortieSets;
import org.pointcall.shared.card.CardFiles;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.demo.DemoFiles;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.PointcallException;

import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** Flies a labelled set of simulated sorties, for training and evaluating models. */
@Command(name = "sortie-set",
        header = "Fly a labelled set of simulated sorties: N per airframe, each in its own folder.",
        mixinStandardHelpOptions = true,
        description = {
            "Flies the test card COUNT times on each airframe named and writes each sortie to",
            "OUT/<airframe>-<nn>/ (sortie.csv, truth.json, dictionary.yaml, card.yaml), as 'simulate' does.",
            "Sortie i of the a-th airframe (both from 1... a from 0) is flown with seed SEED + 1000 a + i:",
            "the same command gives the same bytes, and more sorties leave the first ones unchanged."
        })
public final class SortieSetCommand implements Callable<Integer> {

    @Option(names = "--airframe", required = true, arity = "1..*", paramLabel = "NAME",
            description = "airframe profiles (see 'simulate --list-airframes')")
    List<String> airframes;

    @Option(names = "--count", required = true, paramLabel = "N", description = "sorties per airframe")
    int count;

    @Option(names = "--seed", defaultValue = "1", description = "base seed (default: ${DEFAULT-VALUE})")
    long seed;

    @Option(names = "--out", required = true, paramLabel = "DIR", description = "folder for the sortie folders")
    Path out;

    @Option(names = "--card", paramLabel = "FILE", description = "test card (default: the demo card)")
    Path cardFile;

    @Option(names = "--rate", paramLabel = "HZ", defaultValue = "64",
            description = "telemetry frame rate (default: ${DEFAULT-VALUE} Hz)")
    double rateHz;

    @Option(names = "--clean", description = "perfect instrumentation: no noise, lag, wild points or dropouts")
    boolean clean;

    @Option(names = "--no-flaws", description = "the pilot makes no deliberate bad entries")
    boolean noFlaws;

    @Option(names = "--vary-airframe", paramLabel = "SPREAD", defaultValue = "0",
            description = "fly each sortie on its own seeded variant of the airframe: mass, size, stability, control"
                    + " power, stall angle, thrust and surfaces each scaled by a factor within 1 +/- SPREAD"
                    + " (0 to 0.4; default: ${DEFAULT-VALUE}, the profile as it is)")
    double spread;

    @Spec
    CommandSpec spec;

    @Override
    public Integer call() {
        PrintWriter w = spec.commandLine().getOut();
        ParameterDictionary dict = DemoFiles.dictionary();
        TestCard card = cardFile == null ? DemoFiles.card() : CardFiles.load(cardFile, dict);
        SortieSets.Flying flying = new SortieSets.Flying(rateHz, clean ? SensorSettings.CLEAN : SensorSettings.DEFAULT,
                noFlaws ? PilotSettings.NO_FLAWS : PilotSettings.DEFAULT);
        if (!(spread >= 0 && spread <= AirframeVariation.MAX_SPREAD)) {
            throw new PointcallException("--vary-airframe must be between 0 and " + AirframeVariation.MAX_SPREAD
                    + ", got " + spread);
        }
        flying = flying.withVariation(new AirframeVariation(spread));
        List<Path> dirs = SortieSets.generate(airframes, count, seed, card, dict, flying, out, (dir, t) -> {
            w.printf(Locale.ROOT, "  %-40s %s, seed %d, %.0f s, %d points%n", dir, t.airframe(), t.seed(),
                    t.durationS(), t.points().size());
            w.flush();
        });
        w.println("sorties: " + dirs.size());
        w.println("wrote: " + out);
        w.flush();
        return 0;
    }
}
