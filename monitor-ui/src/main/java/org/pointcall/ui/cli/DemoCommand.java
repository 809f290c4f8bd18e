package org.pointcall.ui.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;

import org.pointcall.ingest.sim.SortieSimulator;
import org.pointcall.ingest.sim.airframe.Airframes;
import org.pointcall.ingest.sim.pilot.PilotSettings;
import org.pointcall.ingest.sim.sensor.SensorSettings;
import org.pointcall.ingest.udp.UdpSender;
import org.pointcall.ingest.udp.UdpSenderConfig;
import org.pointcall.ingest.wire.StreamEncoder;
import org.pointcall.ingest.wire.WireOptions;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.demo.DemoFiles;
import org.pointcall.shared.dictionary.DictionaryFiles;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.PointcallException;
import org.pointcall.ui.console.ConsoleApp;
import org.pointcall.ui.console.ConsoleSetup;
import org.pointcall.ui.console.TraceDrawing;
import org.pointcall.ui.demo.SessionDesk;
import org.pointcall.models.card.CardAnalysers;
import org.pointcall.models.card.CardSession;
import org.pointcall.models.card.SessionSetup;
import org.pointcall.models.modelfile.LoadedModel;
import org.pointcall.models.train.Classifier;
import org.pointcall.replay.record.Recorder;
import org.pointcall.replay.record.RecorderPolicy;
import org.pointcall.ui.demo.LiveConsole;
import org.pointcall.ui.desk.DeskSnapshot;
import org.pointcall.ui.desk.LogEntry;
import org.pointcall.ui.settings.ConsoleSettings;
import org.pointcall.ui.settings.SettingsFile;
import org.pointcall.ui.share.SessionShare;
import org.pointcall.ui.share.ShareAddress;

import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** The one-command demo: a simulated sortie streamed over loopback UDP into the live pipeline and the console. */
@Command(name = "demo",
        header = "Fly the demo card on the simulator and watch it live in the console.",
        mixinStandardHelpOptions = true,
        description = {
            "Starts the simulator flying the demo card of the fictional Veskarn trainer, streams its telemetry",
            "over UDP on 127.0.0.1 into the live pipeline, and opens the console. Without a display it says so",
            "and prints the headless monitor's lines instead."
        })
public final class DemoCommand implements Callable<Integer> {
    @Option(names = "--speed", defaultValue = "4", description = "data time per wall time (default: ${DEFAULT-VALUE})")
    double speed;

    @Option(names = "--card", paramLabel = "CARD", description = "fly this card instead of the demo card")
    Path cardFile;

    @Option(names = "--seed", defaultValue = "1", description = "simulator seed (default: ${DEFAULT-VALUE})")
    long seed;

    @Option(names = "--screenshot", paramLabel = "FILE", description = "write a PNG of the whole window, then exit")
    Path screenshot;

    @Option(names = "--after", paramLabel = "SECONDS", defaultValue = "20",
            description = "with --screenshot: wall seconds after the window opens (default: ${DEFAULT-VALUE})")
    double afterS;

    @Option(names = "--settings", paramLabel = "FILE", description = "console layout file (default: "
            + "~/.config/pointcall/console.conf)")
    Path settingsFile;

    @Option(names = "--headless", description = "no window, even with a display")
    boolean headless;

    @Option(names = "--record", paramLabel = "DIR", defaultValue = "sorties",
            description = "folder for the sortie archive (default: ${DEFAULT-VALUE})")
    Path recordDir;

    @Option(names = "--no-record", description = "do not record the sortie")
    boolean noRecord;

    @Option(names = "--share", paramLabel = "kafka://HOST:PORT[/PREFIX]", description = "also publish the session on "
            + "Kafka for watching consoles ('console --watch'), or give a Kafka settings file")
    String share;

    @Spec
    CommandSpec spec;

    @Override
    public Integer call() throws Exception {
        if (!(speed > 0) || speed > 1000) {
            throw new PointcallException("--speed must be above 0 and at most 1000, got " + speed);
        }
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        boolean window = !headless && ConsoleApp.displayAvailable();
        if (!headless && !window) {
            err.println("demo: " + ConsoleApp.windowProblem() + ": running the headless monitor instead");
            err.flush();
        }
        Path settingsPath = settingsFile != null ? settingsFile : SettingsFile.defaultPath();
        List<String> problems = new ArrayList<>();
        ConsoleSettings settings = SettingsFile.load(settingsPath, problems);
        for (String p : problems) {
            err.println("demo: " + p);
        }
        ParameterDictionary dict = DemoFiles.dictionary();
        TestCard card = cardFile == null ? DemoFiles.card() : AnalyzeCommand.loadCard(cardFile, dict);
        List<String> faults = java.util.Collections.synchronizedList(new ArrayList<>());
        LoadedModel<Classifier> model = DetectorModel.load(null);
        SessionDesk desk = new SessionDesk(card, dict);
        SessionShare shared = share == null ? null : new SessionShare(ShareAddress.parse(share, "--share"),
                cardFile == null ? DemoFiles.cardText() : MonitorCommand.readCard(cardFile), faults::add);
        Recorder recorder = noRecord ? null : Recorder.startIn(recordDir, RecorderPolicy.DEFAULT, System::nanoTime,
                a -> faults.add("recorder: " + a));
        java.util.function.Function<org.pointcall.ingest.udp.DatagramHandler, org.pointcall.ingest.udp.DatagramHandler>
                tee = h -> {
                    org.pointcall.ingest.udp.DatagramHandler r = recorder == null ? h : recorder.tee(h);
                    return shared == null ? r : shared.tee(r);
                };
        try (LiveConsole live = new LiveConsole(0, dict, settings, desk,
                (d, listener) -> new CardSession(SessionSetup.of(d, card, model.model(), model.metadata().description(),
                        CardAnalysers.standard()), listener),
                recorder == null && shared == null ? null : tee, faults::add)) {
            if (shared != null) {
                live.share(shared, "demo simulator over udp");
                out.println("sharing on " + shared.where() + " ('console --watch " + shared.where() + "' watches)");
                out.flush();
            }
            live.start();
            if (recorder != null) {
                out.println("recording: " + recorder.file());
                out.flush();
            }
            java.util.concurrent.atomic.AtomicBoolean stop = new java.util.concurrent.atomic.AtomicBoolean();
            Thread sim = simulator(live.rig().port(), dict, card, err, stop);
            sim.start();
            if (window) {
                // the simulated sortie has an end, unlike live telemetry: once it is over the session is ended, so
                // the point being flown is judged on the screen as in the headless monitor
                Thread ender = new Thread(() -> {
                    try {
                        sim.join();
                        if (!stop.get()) {
                            Thread.sleep(200); // the last datagrams through the pipeline
                            live.endStream();
                        }
                    } catch (InterruptedException e) {
                        Thread.currentThread().interrupt();
                    }
                }, "demo-end");
                ender.setDaemon(true);
                ender.start();
                ConsoleSetup setup = new ConsoleSetup("pointcall demo \u2014 " + card.sortie(), live.link(),
                        live.traces(), settings, settingsPath, false, ConsoleSetup.DEFAULT_REDRAW_HZ,
                        TraceDrawing.ENVELOPE);
                ConsoleApp.run(setup, screenshot == null ? null : new ConsoleApp.Screenshot(screenshot, afterS));
                if (screenshot != null) {
                    out.println("wrote: " + screenshot);
                }
            } else {
                headless(live, sim, out);
            }
            stop.set(true);
            sim.join(5000);
        } finally {
            if (recorder != null) {
                recorder.close();
            }
            if (shared != null) {
                shared.close();
                faults.add(shared.summary());
            }
        }
        for (String f : faults) {
            err.println("demo: " + f);
        }
        out.flush();
        return 0;
    }

    /** Thrown through the simulator to end a sortie early (the console closed). */
    private static final class Stopped extends RuntimeException {
        private static final long serialVersionUID = 1L;

        Stopped() {
            super("stopped", null, false, false);
        }
    }

    private Thread simulator(int port, ParameterDictionary dict, TestCard card, PrintWriter err,
                             java.util.concurrent.atomic.AtomicBoolean stop) {
        Thread t = new Thread(() -> {
            SortieSimulator sim = new SortieSimulator(Airframes.load("veskarn-02"), card, dict, seed, 64,
                    SensorSettings.DEFAULT, PilotSettings.DEFAULT);
            try (UdpSender sender = new UdpSender(UdpSenderConfig.loopback(port))) {
                StreamEncoder stream = sender.openStream(1, dict, DictionaryFiles.toYaml(dict),
                        WireOptions.DEFAULT.withSynthetic(true));
                org.pointcall.ingest.frame.FrameSink paced = SortieSimulator.paced(stream, speed, System::nanoTime);
                sim.run(List.of(f -> {
                    if (stop.get()) {
                        throw new Stopped();
                    }
                    paced.onFrame(f);
                }));
                stream.flush();
            } catch (Stopped e) {
                // the console closed before the sortie ended
            } catch (RuntimeException e) {
                err.println("demo: simulator stopped: " + e.getMessage());
                err.flush();
            }
        }, "simulator");
        t.setDaemon(true);
        return t;
    }

    /**
     * Prints the stream and the log as they come, until the sortie ends; then ends the session (the point being
     * flown when the stream stopped is closed and judged) and prints what that adds to the log.
     */
    private static void headless(LiveConsole live, Thread sim, PrintWriter out) throws InterruptedException {
        int logShown = 0;
        long nextStatus = 0;
        while (true) {
            boolean done = !sim.isAlive();
            if (done) {
                Thread.sleep(200); // the last datagrams through the pipeline
                live.close();
            }
            DeskSnapshot s = live.link().latest();
            List<LogEntry> log = s.log();
            for (int i = Math.min(logShown, log.size()); i < log.size(); i++) {
                out.println(org.pointcall.ui.console.LogLines.line(log.get(i)));
            }
            logShown = log.size();
            long now = System.nanoTime();
            if (now >= nextStatus || done) {
                nextStatus = now + 5_000_000_000L;
                out.println(String.format(Locale.ROOT, "status: T+%.0f s, %.0f frames/s, %d frames, %d gaps, "
                        + "%d dropped", s.dataTimeS(), s.health().frameRateHz(), s.health().framesSeen(),
                        s.health().sequenceGaps(), s.health().droppedPackets()));
            }
            out.flush();
            if (done) {
                return;
            }
            Thread.sleep(200);
        }
    }
}
