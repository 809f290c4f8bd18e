package org.pointcall.ui.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;

import org.pointcall.models.card.CardAnalysers;
import org.pointcall.models.card.CardSession;
import org.pointcall.models.card.SessionSetup;
import org.pointcall.models.modelfile.LoadedModel;
import org.pointcall.models.train.Classifier;
import org.pointcall.replay.archive.ArchiveReader;
import org.pointcall.replay.play.ArchiveSource;
import org.pointcall.replay.play.ReplayClock;
import org.pointcall.replay.play.ReplayControl;
import org.pointcall.replay.play.ReplayTargets;
import org.pointcall.replay.play.Replayer;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.demo.DemoFiles;
import org.pointcall.shared.dictionary.DictionaryFiles;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.PointcallException;
import org.pointcall.ui.console.ConsoleApp;
import org.pointcall.ui.console.ConsoleSetup;
import org.pointcall.ui.console.TraceDrawing;
import org.pointcall.ui.demo.LiveConsole;
import org.pointcall.ui.demo.ReplayDeck;
import org.pointcall.ui.desk.DeskLink;
import org.pointcall.ui.trace.TraceFeed;
import org.pointcall.ui.demo.SessionDesk;
import org.pointcall.ui.desk.PointSpan;
import org.pointcall.ui.settings.ConsoleSettings;
import org.pointcall.ui.settings.SettingsFile;
import org.pointcall.ui.share.SessionShare;
import org.pointcall.ui.share.ShareAddress;
import org.pointcall.ui.share.ShareRecords;
import org.pointcall.ui.share.WatchConsole;
import org.pointcall.ui.share.WatchFeed;
import org.pointcall.ingest.kafka.KafkaSettings;

import picocli.CommandLine.ArgGroup;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** The console on a live UDP stream or on a recorded sortie archive (with the replay transport). */
@Command(name = "console",
        header = "Open the console on a live stream or a recorded sortie.",
        mixinStandardHelpOptions = true,
        description = {
            "Live: listens on udp://127.0.0.1:PORT (for example fed by 'simulate --to'), runs the card session",
            "and shows it. Replay: plays a sortie archive (from 'record' or 'demo') through the same pipeline",
            "and session, with play, pause, speed, seek and jump to point. Keys: see the window's header.",
            "Watch: follows a session another console or monitor shares on Kafka (--share there), read-only:",
            "its card, points, verdicts, calls and alarms from its beginning, its charts from --backfill ago."
        })
public final class ConsoleCommand implements Callable<Integer> {
    static final class Source {
        @Option(names = "--listen", paramLabel = "udp://127.0.0.1:PORT", description = "live stream to watch")
        String listen;
        @Option(names = "--replay", paramLabel = "ARCHIVE", description = "sortie archive to replay")
        Path replay;
        @Option(names = "--watch", paramLabel = "kafka://HOST:PORT[/PREFIX]", description = "a session shared on "
                + "Kafka by another console or monitor, read-only (or a Kafka settings file)")
        String watch;
    }

    @ArgGroup(exclusive = true, multiplicity = "1")
    Source source;

    @Option(names = "--card", paramLabel = "CARD", description = "test card (default: the demo card)")
    Path cardFile;

    @Option(names = "--share", paramLabel = "kafka://HOST:PORT[/PREFIX]", description = "live: also publish this "
            + "session on Kafka for watching consoles (or a Kafka settings file)")
    String share;

    @Option(names = "--backfill", paramLabel = "SECONDS", defaultValue = "120", description = "watch: chart the "
            + "frames of this many seconds before joining (default: ${DEFAULT-VALUE})")
    double backfillS;

    @Option(names = "--speed", defaultValue = "1", description = "replay speed (default: ${DEFAULT-VALUE})")
    double speed;

    @Option(names = "--paused", description = "replay: open paused")
    boolean paused;

    @Option(names = "--screenshot", paramLabel = "FILE", description = "write a PNG of the whole window, then exit")
    Path screenshot;

    @Option(names = "--after", paramLabel = "SECONDS", defaultValue = "10",
            description = "with --screenshot: wall seconds after the window opens (default: ${DEFAULT-VALUE})")
    double afterS;

    @Option(names = "--settings", paramLabel = "FILE", description = "console layout file (default: "
            + "~/.config/pointcall/console.conf)")
    Path settingsFile;

    @Spec
    CommandSpec spec;

    @Override
    public Integer call() throws Exception {
        PrintWriter err = spec.commandLine().getErr();
        if (source.watch != null && (cardFile != null || share != null)) {
            throw new PointcallException("--watch shows the card and session of the console it watches: "
                    + (cardFile != null ? "--card" : "--share") + " does not go with it");
        }
        if (share != null && source.listen == null) {
            throw new PointcallException("--share shares a live session: give it with --listen");
        }
        if (!(backfillS >= 0)) {
            throw new PointcallException("--backfill must be 0 or more seconds, got " + backfillS);
        }
        if (!ConsoleApp.displayAvailable()) {
            throw new PointcallException(ConsoleApp.windowProblem() + ": the console needs a window; 'monitor "
                    + "--headless' follows a stream without it" + (source.watch == null ? ""
                    : " ('monitor --headless --watch " + source.watch + "' watches this session)"));
        }
        Path settingsPath = settingsFile != null ? settingsFile : SettingsFile.defaultPath();
        List<String> problems = new ArrayList<>();
        ConsoleSettings settings = SettingsFile.load(settingsPath, problems);
        problems.forEach(p -> err.println("console: " + p));
        if (source.watch != null) {
            return watch(ShareAddress.parse(source.watch, "--watch"), settings, settingsPath, err);
        }
        ArchiveReader reader = null;
        ParameterDictionary dict = DemoFiles.dictionary();
        if (source.replay != null) {
            reader = ArchiveReader.open(source.replay);
            if (!reader.dictionaries().isEmpty()) {
                dict = DictionaryFiles.parse(reader.dictionaries().get(0).text(), source.replay.toString());
            }
        }
        TestCard card = cardFile == null ? DemoFiles.card() : AnalyzeCommand.loadCard(cardFile, dict);
        LoadedModel<Classifier> model = DetectorModel.load(null);
        SessionDesk desk = new SessionDesk(card, dict);
        List<String> faults = java.util.Collections.synchronizedList(new ArrayList<>());
        int port = source.listen == null ? 0 : MonitorCommand.address(source.listen).getPort();
        SessionShare shared = share == null ? null : new SessionShare(ShareAddress.parse(share, "--share"),
                cardFile == null ? DemoFiles.cardText() : MonitorCommand.readCard(cardFile), faults::add);
        LiveConsole.SessionFactory sessions = (d, listener) -> new CardSession(SessionSetup.of(d, card, model.model(),
                model.metadata().description(), CardAnalysers.standard()), listener);
        try (AutoCloseable running = reader == null
                ? new LiveConsole(port, dict, settings, desk, sessions, shared == null ? null : shared::tee,
                        faults::add, true)
                : new ReplayDeck(reader, card, dict, settings, sessions, faults::add)) {
            DeskLink link;
            TraceFeed traces;
            if (running instanceof LiveConsole live) {
                if (shared != null) {
                    live.share(shared, "udp on " + source.listen);
                }
                live.start();
                link = live.link();
                traces = live.traces();
            } else {
                ReplayDeck deck = (ReplayDeck) running;
                deck.start(ReplayControl.parseSpeed(Double.toString(speed)), paused);
                link = deck.link();
                traces = deck.traces();
            }
            ConsoleSetup setup = new ConsoleSetup("pointcall console \u2014 " + card.sortie()
                    + (reader == null ? " (live)" : " (replay)"), link, traces, settings, settingsPath,
                    reader != null, ConsoleSetup.DEFAULT_REDRAW_HZ, TraceDrawing.ENVELOPE);
            ConsoleApp.run(setup, screenshot == null ? null : new ConsoleApp.Screenshot(screenshot, afterS));
            if (screenshot != null) {
                spec.commandLine().getOut().println("wrote: " + screenshot);
            }
        } finally {
            if (reader != null) {
                reader.close();
            }
            if (shared != null) {
                shared.close();
                faults.add(shared.summary());
            }
        }
        faults.forEach(f -> err.println("console: " + f));
        spec.commandLine().getOut().flush();
        return 0;
    }

    /** The console on a shared session: waits for it, then opens read-only. */
    private Integer watch(KafkaSettings ks, ConsoleSettings settings, Path settingsPath, PrintWriter err) {
        String where = ShareAddress.describe(ks);
        java.util.function.Consumer<String> say = line -> {
            synchronized (err) {
                err.println("console: " + line);
                err.flush();
            }
        };
        try (WatchConsole watching = new WatchConsole(ks, backfillS, settings.chartedParameters(), null, say)) {
            watching.start();
            while (!watching.awaitSession(10_000_000_000L)) {
                say.accept("still waiting for a shared session on " + where);
            }
            ShareRecords.SessionStart s = watching.desk().start();
            say.accept("watching sortie " + s.sortie() + " (" + s.source() + "), read-only");
            ConsoleSetup setup = new ConsoleSetup("pointcall console \u2014 " + s.sortie() + " (watching " + where
                    + ", read-only)", watching.link(), watching.traces(), settings,
                    settingsPath, false, ConsoleSetup.DEFAULT_REDRAW_HZ, TraceDrawing.ENVELOPE, true);
            ConsoleApp.run(setup, screenshot == null ? null : new ConsoleApp.Screenshot(screenshot, afterS));
            if (screenshot != null) {
                spec.commandLine().getOut().println("wrote: " + screenshot);
            }
            WatchFeed.Counts c = watching.feed().counts();
            say.accept("watched: " + c.sessionRecords() + " session records, " + c.frameRecords()
                    + " frame records, " + c.bad() + " skipped" + (c.badByKind().isEmpty() ? "" : " " + c.badByKind()));
        }
        spec.commandLine().getOut().flush();
        return 0;
    }
}
