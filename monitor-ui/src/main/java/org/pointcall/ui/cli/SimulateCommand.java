package org.pointcall.ui.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.net.InetSocketAddress;
import java.net.URI;
import java.net.URISyntaxException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;

import org.pointcall.ingest.file.CsvWriter;
import org.pointcall.ingest.frame.FrameSink;
import org.pointcall.ingest.sim.SortieSimulator;
import org.pointcall.ingest.sim.airframe.Airframe;
import org.pointcall.ingest.sim.airframe.AirframeSummary;
import org.pointcall.ingest.sim.airframe.Airframes;
import org.pointcall.ingest.sim.pilot.PilotSettings;
import org.pointcall.ingest.sim.sensor.SensorSettings;
import org.pointcall.ingest.sim.truth.PointTruth;
import org.pointcall.ingest.sim.truth.SortieTruth;
import org.pointcall.ingest.udp.UdpSender;
import org.pointcall.ingest.udp.UdpSenderConfig;
import org.pointcall.ingest.wire.StreamEncoder;
import org.pointcall.ingest.wire.WireOptions;
import org.pointcall.shared.card.CardFiles;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.demo.DemoFiles;
import org.pointcall.shared.dictionary.DictionaryFiles;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.PointcallException;

import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** Flies a test card on a simulated aircraft and writes (or streams) its telemetry and the exact truth. */
@Command(name = "simulate",
        header = "Fly a test card on a simulated aircraft: telemetry and exact truth.",
        mixinStandardHelpOptions = true,
        description = {
            "A simulated test pilot flies the card on a six-degree-of-freedom model of a fictional airframe;",
            "simulated instrumentation measures it (noise, lags, mixed rates, wild points, dropouts).",
            "Writes DIR/sortie.csv (columns and units as in the dictionary), DIR/truth.json (what was flown),",
            "and copies of the dictionary and card; or streams the frames live over UDP in pointcall's wire",
            "format. The same seed gives the same bytes."
        })
public final class SimulateCommand implements Callable<Integer> {

    @Option(names = "--list-airframes", description = "list the built-in airframe profiles and exit")
    boolean listAirframes;

    @Option(names = "--airframe", paramLabel = "NAME", defaultValue = "veskarn-02",
            description = "airframe profile (default: ${DEFAULT-VALUE}); see --list-airframes")
    String airframeName;

    @Option(names = "--airframe-file", paramLabel = "FILE", description = "your own airframe profile (YAML)")
    Path airframeFile;

    @Option(names = "--card", paramLabel = "FILE", description = "test card (default: the demo card)")
    Path cardFile;

    @Option(names = "--seed", defaultValue = "1", description = "random seed (default: ${DEFAULT-VALUE})")
    long seed;

    @Option(names = "--rate", paramLabel = "HZ", defaultValue = "64",
            description = "telemetry frame rate (default: ${DEFAULT-VALUE} Hz)")
    double rateHz;

    @Option(names = "--out", paramLabel = "DIR", description = "folder for sortie.csv and truth.json")
    Path out;

    @Option(names = "--to", paramLabel = "udp://HOST:PORT", description = "stream the frames live over UDP")
    String to;

    @Option(names = "--speed", defaultValue = "1", description = "with --to: data time per wall time (default: ${DEFAULT-VALUE})")
    double speed;

    @Option(names = "--clean", description = "perfect instrumentation: no noise, lag, wild points or dropouts")
    boolean clean;

    @Option(names = "--no-flaws", description = "the pilot makes no deliberate bad entries")
    boolean noFlaws;

    @Spec
    CommandSpec spec;

    @Override
    public Integer call() throws IOException {
        PrintWriter w = spec.commandLine().getOut();
        if (listAirframes) {
            for (AirframeSummary a : Airframes.list()) {
                w.printf(Locale.ROOT, "%-14s %s%n", a.name(), a.description());
            }
            w.flush();
            return 0;
        }
        if (out == null && to == null) {
            throw new PointcallException("give --out DIR, --to udp://HOST:PORT, or both");
        }
        Airframe airframe = airframeFile != null ? Airframes.load(airframeFile) : Airframes.load(airframeName);
        ParameterDictionary dict = DemoFiles.dictionary();
        TestCard card = cardFile == null ? DemoFiles.card() : CardFiles.load(cardFile, dict);
        PilotSettings pilot = noFlaws ? PilotSettings.NO_FLAWS : PilotSettings.DEFAULT;
        SortieSimulator sim = new SortieSimulator(airframe, card, dict, seed, rateHz,
                clean ? SensorSettings.CLEAN : SensorSettings.DEFAULT, pilot);

        List<FrameSink> sinks = new ArrayList<>();
        CsvWriter csv = null;
        if (out != null) {
            Files.createDirectories(out);
            csv = CsvWriter.create(out.resolve("sortie.csv"), dict);
            sinks.add(csv);
        }
        UdpSender sender = null;
        StreamEncoder stream = null;
        if (to != null) {
            sender = new UdpSender(UdpSenderConfig.to(udpTarget(to)));
            stream = sender.openStream(1, dict, DictionaryFiles.toYaml(dict), WireOptions.DEFAULT.withSynthetic(true));
            sinks.add(SortieSimulator.paced(stream, speed, System::nanoTime));
        }
        SortieTruth truth;
        try {
            truth = sim.run(sinks);
        } finally {
            if (stream != null) {
                stream.flush();
            }
            if (sender != null) {
                sender.close();
            }
            if (csv != null) {
                csv.close();
            }
        }
        if (out != null) {
            truth.write(out.resolve("truth.json"));
            Files.writeString(out.resolve("dictionary.yaml"), DictionaryFiles.toYaml(dict), StandardCharsets.UTF_8);
            Files.writeString(out.resolve("card.yaml"), CardFiles.toYaml(card), StandardCharsets.UTF_8);
        }
        w.printf(Locale.ROOT, "sortie: %s on %s, seed %d, %.0f s of flight at %.0f Hz%n", truth.sortie(),
                truth.airframe(), truth.seed(), truth.durationS(), truth.frameRateHz());
        w.printf(Locale.ROOT, "telemetry: %d dropouts (%d frames), %d wild points%s%n", truth.dropouts(),
                truth.framesDropped(), truth.wildPoints(), truth.cleanSensors() ? ", clean sensors" : "");
        for (PointTruth p : truth.points()) {
            w.printf(Locale.ROOT, "  %-7s %-14s %7.1f to %7.1f s  %s%s%n", p.cardId(), p.kind(), p.beginS(), p.endS(),
                    p.inBands() ? "inside its bands" : "OUTSIDE its bands", "none".equals(p.flaw()) ? ""
                    : " (flaw: " + p.flaw() + ")");
        }
        if (out != null) {
            w.println("wrote: " + out.resolve("sortie.csv") + ", " + out.resolve("truth.json"));
        }
        w.flush();
        return 0;
    }

    static InetSocketAddress udpTarget(String uri) {
        try {
            URI u = new URI(uri);
            if (!"udp".equals(u.getScheme()) || u.getHost() == null || u.getPort() < 1) {
                throw new PointcallException("--to must look like udp://HOST:PORT, got '" + uri + "'");
            }
            return new InetSocketAddress(u.getHost(), u.getPort());
        } catch (URISyntaxException e) {
            throw new PointcallException("--to must look like udp://HOST:PORT, got '" + uri + "'");
        }
    }
}
