package org.pointcall.models.run;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.stream.Stream;

import org.pointcall.ingest.file.CsvWriter;
import org.pointcall.ingest.sim.SortieSimulator;
import org.pointcall.ingest.sim.airframe.Airframe;
import org.pointcall.ingest.sim.airframe.AirframeVariation;
import org.pointcall.ingest.sim.airframe.Airframes;
import org.pointcall.ingest.sim.pilot.PilotSettings;
import org.pointcall.ingest.sim.sensor.SensorSettings;
import org.pointcall.ingest.sim.truth.SortieTruth;
import org.pointcall.models.data.DatasetBuilder;
import org.pointcall.shared.card.CardFiles;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.dictionary.DictionaryFiles;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.PointcallException;

/**
 * Labelled sets of simulated sorties on disk, and finding the sortie folders under the folders a user names.
 *
 * <p>A set is one folder per sortie, {@code <airframe>-<nn>}, each holding {@code sortie.csv}, {@code truth.json},
 * {@code dictionary.yaml} and {@code card.yaml} as the {@code simulate} command writes them. Sortie {@code i}
 * (from 1) of the {@code a}-th airframe named is flown with seed {@code seed + 1000 a + i}, so that adding an
 * airframe or a sortie leaves the others' bytes unchanged. Each truth names its sortie
 * {@code <card sortie> <airframe>-<nn>}, unique within the set.
 */
public final class SortieSets {
    /** Most sorties per airframe, so that seeds of two airframes never meet. */
    public static final int MAX_PER_AIRFRAME = 999;

    private SortieSets() {
    }

    /**
     * How the sorties of a set are flown.
     *
     * @param frameRateHz telemetry frame rate
     * @param sensors     instrumentation (noise, dropouts) or clean
     * @param pilot       deliberate bad entries or none
     * @param variation   random variants of each airframe, one per sortie ({@link AirframeVariation#NONE}: the
     *                    profiles as they are); when it varies, the pilot's tracking error scale is drawn per sortie
     *                    from the same spread too
     */
    public record Flying(double frameRateHz, SensorSettings sensors, PilotSettings pilot,
                         AirframeVariation variation) {
        public Flying {
            Objects.requireNonNull(sensors, "sensors");
            Objects.requireNonNull(pilot, "pilot");
            Objects.requireNonNull(variation, "variation");
        }

        /** The airframe profiles as they are. */
        public Flying(double frameRateHz, SensorSettings sensors, PilotSettings pilot) {
            this(frameRateHz, sensors, pilot, AirframeVariation.NONE);
        }

        /** A copy whose airframes vary by {@code v}. */
        public Flying withVariation(AirframeVariation v) {
            return new Flying(frameRateHz, sensors, pilot, v);
        }

        /** 64 Hz, noisy sensors with dropouts, a pilot with flaws: as the {@code simulate} command's defaults. */
        public static Flying realistic() {
            return new Flying(64.0, SensorSettings.DEFAULT, PilotSettings.DEFAULT);
        }
    }

    /** Told after each sortie is written. */
    @FunctionalInterface
    public interface Listener {
        void written(Path dir, SortieTruth truth);
    }

    /**
     * Flies {@code count} sorties of {@code card} per airframe into subfolders of {@code out}.
     *
     * @return the sortie folders, in order
     * @throws PointcallException for an unknown airframe (before anything is written), a count out of range, or a
     *                            folder that cannot be written
     */
    public static List<Path> generate(List<String> airframes, int count, long seed, TestCard card,
                                      ParameterDictionary dictionary, Flying flying, Path out, Listener listener) {
        if (airframes.isEmpty()) {
            throw new PointcallException("name at least one airframe");
        }
        if (count < 1 || count > MAX_PER_AIRFRAME) {
            throw new PointcallException("sorties per airframe must be 1 to " + MAX_PER_AIRFRAME + ", got " + count);
        }
        List<Airframe> loaded = new ArrayList<>();
        for (String name : airframes) {
            loaded.add(Airframes.load(name));
        }
        List<Path> dirs = new ArrayList<>();
        try {
            for (int a = 0; a < loaded.size(); a++) {
                Airframe airframe = loaded.get(a);
                for (int i = 1; i <= count; i++) {
                    String name = String.format(Locale.ROOT, "%s-%02d", airframes.get(a), i);
                    Path dir = out.resolve(name);
                    long s = seed + 1000L * a + i;
                    SortieTruth truth = flyOne(airframe, card, dictionary, s, flying, dir, card.sortie() + " " + name);
                    dirs.add(dir);
                    listener.written(dir, truth);
                }
            }
        } catch (IOException e) {
            throw new PointcallException(out + ": cannot write the sortie set (" + e.getMessage() + ")", e);
        }
        return dirs;
    }

    /** Seed of a sortie's airframe variant: apart from the flight's own seed, so the two draws are unrelated. */
    static long variantSeed(long sortieSeed) {
        return sortieSeed * 0x9E3779B97F4A7C15L + 0x632BE59BD9B4E019L;
    }

    /** Variants tried per sortie before giving up: a drawn variant may be unable to trim or fly the card. */
    static final int VARIANT_ATTEMPTS = 5;

    private static SortieTruth flyOne(Airframe airframe, TestCard card, ParameterDictionary dictionary, long seed,
                                      Flying flying, Path dir, String sortieName) throws IOException {
        Files.createDirectories(dir);
        AirframeVariation v = flying.variation();
        if (!v.varies()) {
            return flyAs(airframe, flying.pilot(), card, dictionary, seed, flying, dir, sortieName);
        }
        // a variant the simulated pilot cannot fly (no trim, or a departure it does not recover from) is drawn
        // again: the set is meant to hold flyable aircraft of the type, not to test the pilot's limits
        PointcallException last = null;
        for (int k = 0; k < VARIANT_ATTEMPTS; k++) {
            long vs = variantSeed(seed) + k;
            Airframe flown;
            try {
                flown = v.apply(airframe, vs);
            } catch (IllegalArgumentException e) {
                last = new PointcallException(airframe.name() + " variant " + vs + ": " + e.getMessage());
                continue;
            }
            double u = new java.util.SplittableRandom(~vs).nextDouble();
            PilotSettings pilot = flying.pilot().withTrackingErrorScale(
                    flying.pilot().trackingErrorScale() * (1.0 + v.spread() * (2.0 * u - 1.0)));
            try {
                return flyAs(flown, pilot, card, dictionary, seed, flying, dir, sortieName);
            } catch (PointcallException e) {
                last = e;
            }
        }
        throw new PointcallException(sortieName + ": no flyable variant of " + airframe.name() + " in "
                + VARIANT_ATTEMPTS + " draws; last: " + last.getMessage(), last);
    }

    private static SortieTruth flyAs(Airframe flown, PilotSettings pilot, TestCard card,
                                     ParameterDictionary dictionary, long seed, Flying flying, Path dir,
                                     String sortieName) throws IOException {
        SortieSimulator sim = new SortieSimulator(flown, card, dictionary, seed, flying.frameRateHz(),
                flying.sensors(), pilot);
        SortieTruth t;
        try (CsvWriter csv = CsvWriter.create(dir.resolve(DatasetBuilder.SIM_RECORDING), dictionary)) {
            t = sim.run(List.of(csv));
        }
        SortieTruth named = new SortieTruth(t.format(), t.airframe(), sortieName, t.seed(), t.frameRateHz(),
                t.durationS(), t.cleanSensors(), t.framesDropped(), t.dropouts(), t.wildPoints(), t.points());
        named.write(dir.resolve(DatasetBuilder.SIM_TRUTH));
        Files.writeString(dir.resolve("dictionary.yaml"), DictionaryFiles.toYaml(dictionary), StandardCharsets.UTF_8);
        Files.writeString(dir.resolve("card.yaml"), CardFiles.toYaml(card), StandardCharsets.UTF_8);
        return named;
    }

    /**
     * The sortie folders a user named: each folder that holds {@code sortie.csv} is one; otherwise its direct
     * subfolders that hold one are, in name order.
     *
     * @throws PointcallException naming the folder, when one does not exist or holds no sortie
     */
    public static List<Path> find(List<Path> folders) {
        List<Path> out = new ArrayList<>();
        for (Path f : folders) {
            if (!Files.isDirectory(f)) {
                throw new PointcallException(f + ": no such folder");
            }
            if (Files.isRegularFile(f.resolve(DatasetBuilder.SIM_RECORDING))) {
                out.add(f);
                continue;
            }
            List<Path> subs;
            try (Stream<Path> s = Files.list(f)) {
                subs = s.filter(p -> Files.isRegularFile(p.resolve(DatasetBuilder.SIM_RECORDING))).sorted().toList();
            } catch (IOException e) {
                throw new PointcallException(f + ": cannot list the folder (" + e.getMessage() + ")", e);
            }
            if (subs.isEmpty()) {
                throw new PointcallException(f + ": no " + DatasetBuilder.SIM_RECORDING
                        + " in it or in its subfolders");
            }
            out.addAll(subs);
        }
        return out;
    }
}
