package org.pointcall.ui.cli;

import java.io.PrintWriter;
import java.net.InetSocketAddress;
import java.net.URI;
import java.net.URISyntaxException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.Callable;
import java.util.concurrent.TimeUnit;

import org.pointcall.ingest.pipeline.PacketPipeline;
import org.pointcall.ingest.udp.DatagramHandler;
import org.pointcall.ingest.udp.UdpSource;
import org.pointcall.replay.record.Recorder;
import org.pointcall.replay.record.RecorderPolicy;
import org.pointcall.ingest.udp.UdpSourceConfig;
import org.pointcall.ingest.wire.DecoderOptions;
import org.pointcall.ingest.wire.DictionaryRegistry;
import org.pointcall.ingest.wire.FaultLog;
import org.pointcall.ingest.wire.StreamFrameSink;
import org.pointcall.ingest.frame.Frame;
import org.pointcall.models.card.CardAnalysers;
import org.pointcall.models.card.CardSession;
import org.pointcall.models.card.SessionSetup;
import org.pointcall.models.modelfile.LoadedModel;
import org.pointcall.models.train.Classifier;
import org.pointcall.shared.card.CardFiles;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.demo.DemoFiles;
import org.pointcall.shared.dictionary.DictionaryFiles;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.PointcallException;
import org.pointcall.shared.outcome.PointsFile;
import org.pointcall.shared.outcome.PointsFiles;
import org.pointcall.shared.outcome.SessionEvent;
import org.pointcall.ui.share.SessionShare;
import org.pointcall.ui.share.ShareAddress;

import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** The live pipeline without a screen: telemetry over UDP, one line per event, the points files at the end. */
@Command(name = "monitor",
        header = "Follow a test card live over UDP (or watch a shared one); --headless prints one line per event.",
        mixinStandardHelpOptions = true,
        description = "Listens for pointcall wire-format telemetry, runs each stream through the live pipeline "
                + "and the card session (detector, card matching, live bands, safety limits, analysis, verdicts) "
                + "and prints one line per event: point begun, band status changed, point ended with its verdict, "
                + "unplanned manoeuvre, limit alarm. With --out, writes points.json and points.csv when it stops "
                + "(after --until-idle seconds without a datagram, or on Ctrl-C). With --share "
                + "kafka://HOST:PORT/PREFIX it also publishes the session (every datagram, the dictionary, the card and every event) for "
                + "consoles elsewhere to watch; with --watch instead of --listen it follows such a shared session, "
                + "read-only, from its beginning. The tool proposes; the team decides.%n")
public final class MonitorCommand implements Callable<Integer> {

    @Option(names = "--headless", description = "no console: events as lines on standard output")
    boolean headless;

    @Option(names = "--listen", paramLabel = "udp://HOST:PORT", description = "where to listen")
    String listen;

    @Option(names = "--watch", paramLabel = "kafka://HOST:PORT[/PREFIX]",
            description = "instead of --listen: follow a session another monitor or console shares on Kafka "
                    + "(read-only; card and dictionary come with it), or give a Kafka settings file")
    String watch;

    @Option(names = "--share", paramLabel = "kafka://HOST:PORT[/PREFIX]",
            description = "also publish this session on Kafka for watching consoles (PREFIX.frames, .dictionary, "
                    + ".events; default prefix pointcall), or give a Kafka settings file")
    String share;

    @Option(names = "--card", paramLabel = "CARD", description = "test card (with --listen)")
    Path cardFile;

    @Option(names = "--dictionary", paramLabel = "DICT",
            description = "dictionary to check the card against before a stream announces its own (default: demo)")
    Path dictionaryFile;

    @Option(names = "--model", paramLabel = "MODEL", description = "detector model (default: the one in the jar)")
    Path modelFile;

    @Option(names = "--until-idle", paramLabel = "SECONDS",
            description = "stop after this long without a datagram, once data has come")
    Double untilIdleS;

    @Option(names = "--out", paramLabel = "DIR", description = "folder for points.json and points.csv at the end")
    Path out;

    @Option(names = "--record", paramLabel = "DIR", defaultValue = "sorties",
            description = "folder for the sortie archive of this session: every datagram as received and the "
                    + "session's events (default: ${DEFAULT-VALUE})")
    Path recordDir;

    @Option(names = "--no-record", description = "do not record the session")
    boolean noRecord;

    @Spec
    CommandSpec spec;

    /** The sessions of the streams heard so far; touched on the pipeline thread, read after it has stopped. */
    private final Map<Integer, CardSession> sessions = new LinkedHashMap<>();

    @Override
    public Integer call() throws InterruptedException {
        PrintWriter w = spec.commandLine().getOut();
        if (!headless) {
            throw new PointcallException("the console is not part of this command yet: give --headless");
        }
        if (untilIdleS != null && !(untilIdleS > 0)) {
            throw new PointcallException("--until-idle must be a positive number of seconds, got " + untilIdleS);
        }
        if ((listen == null) == (watch == null)) {
            throw new PointcallException("give one of --listen udp://HOST:PORT (follow a stream here) or --watch "
                    + "kafka://HOST:PORT/PREFIX (follow a session shared elsewhere)");
        }
        if (watch != null) {
            if (share != null || cardFile != null) {
                throw new PointcallException("--watch follows the card and session of the first console: "
                        + (share != null ? "--share" : "--card") + " does not go with it");
            }
            return new WatchPrinter(ShareAddress.parse(watch, "--watch"), untilIdleS, out, w).run();
        }
        if (cardFile == null) {
            throw new PointcallException("--listen needs --card CARD (the test card to follow)");
        }
        InetSocketAddress bind = address(listen);
        ParameterDictionary checkDict = dictionaryFile == null ? DemoFiles.dictionary()
                : DictionaryFiles.load(dictionaryFile);
        TestCard checked = AnalyzeCommand.loadCard(cardFile, checkDict);
        LoadedModel<Classifier> model = DetectorModel.load(modelFile);
        FaultLog faults = new FaultLog(line -> say(w, "fault: " + line), FaultLog.DEFAULT_MAX_LINES,
                FaultLog.DEFAULT_WINDOW_NS);
        SessionShare shared = share == null ? null : new SessionShare(ShareAddress.parse(share, "--share"),
                readCard(cardFile), line -> say(w, line));
        Recorder recorder = noRecord ? null : Recorder.startIn(recordDir, RecorderPolicy.DEFAULT, System::nanoTime,
                a -> say(w, "recorder: " + a));
        Map<Integer, SessionShare.SharedStream> sharedStreams = new LinkedHashMap<>();
        StreamFrameSink sink = new StreamFrameSink() {
            @Override
            public void onFrame(int streamId, Frame frame, long receiveTimeNs) {
                CardSession s = sessions.get(streamId);
                if (s != null) {
                    s.onFrame(frame);
                }
            }

            @Override
            public void onDictionary(int streamId, ParameterDictionary dictionary) {
                CardSession old = sessions.remove(streamId);
                if (old != null) {
                    old.finish();
                }
                SessionShare.SharedStream oldShared = sharedStreams.remove(streamId);
                if (oldShared != null) {
                    oldShared.end();
                }
                try {
                    TestCard card = CardFiles.load(cardFile, dictionary);
                    SessionShare.SharedStream ss = shared == null ? null
                            : shared.begin(streamId, dictionary, "udp stream " + streamId + " on " + listen);
                    CardSession s = new CardSession(SessionSetup.of(dictionary, card, model.model(),
                            model.metadata().description(), CardAnalysers.standard()), e -> {
                                say(w, line(e));
                                if (recorder != null) {
                                    recorder.appendRecord("session.event", e.timeNs(),
                                            PointsFiles.eventToJson(e).getBytes(StandardCharsets.UTF_8));
                                }
                                if (ss != null) {
                                    ss.onEvent(e);
                                }
                            });
                    if (ss != null) {
                        ss.follow(s::snapshot);
                        sharedStreams.put(streamId, ss);
                    }
                    sessions.put(streamId, s);
                    say(w, "stream " + streamId + ": dictionary '" + dictionary.name() + "', card " + card.sortie()
                            + " (" + card.points().size() + " points)");
                } catch (PointcallException | IllegalArgumentException e) {
                    say(w, "stream " + streamId + " ignored: " + e.getMessage());
                }
            }
        };
        PacketPipeline pipeline = new PacketPipeline("monitor", new DictionaryRegistry(), DictionaryFiles::parse,
                sink, DecoderOptions.DEFAULT, PacketPipeline.DEFAULT_QUEUE_PACKETS, faults, System::nanoTime);
        UdpSource udp;
        try {
            udp = new UdpSource(new UdpSourceConfig(bind, UdpSourceConfig.DEFAULT_RECEIVE_BUFFER_BYTES, java.util.Set.of(), true),
                    teed(recorder, shared, pipeline), faults, System::nanoTime);
        } catch (RuntimeException e) {
            throw new PointcallException("cannot listen on " + listen + ": " + e.getMessage(), e);
        }
        if (recorder != null) {
            say(w, "recording: " + recorder.file());
        }
        if (shared != null) {
            say(w, "sharing on " + shared.where() + " for watching consoles");
        }
        Thread stopper = new Thread(() -> stop(udp, pipeline, recorder, shared, w), "monitor-stop");
        Runtime.getRuntime().addShutdownHook(stopper);
        pipeline.start();
        udp.start();
        say(w, "listening on udp://" + udp.localAddress().getHostString() + ":" + udp.localPort() + ", card "
                + checked.sortie() + "; the tool proposes, the test team decides");
        long lastCount = -1;
        long lastChangeNs = System.nanoTime();
        while (true) {
            TimeUnit.MILLISECONDS.sleep(100);
            long n = udp.datagrams();
            long now = System.nanoTime();
            if (n != lastCount) {
                lastCount = n;
                lastChangeNs = now;
            } else if (untilIdleS != null && n > 0 && now - lastChangeNs > untilIdleS * 1e9) {
                break;
            }
        }
        Runtime.getRuntime().removeShutdownHook(stopper);
        stop(udp, pipeline, recorder, shared, w);
        return 0;
    }

    private static DatagramHandler teed(Recorder recorder, SessionShare shared, PacketPipeline pipeline) {
        DatagramHandler h = recorder == null ? pipeline : recorder.tee(pipeline);
        return shared == null ? h : shared.tee(h);
    }

    /** The card file's text, as shared with watchers (the same bytes the session loaded). */
    static String readCard(Path card) {
        try {
            return java.nio.file.Files.readString(card, StandardCharsets.UTF_8);
        } catch (java.io.IOException e) {
            throw new PointcallException(card + ": cannot read (" + e.getMessage() + ")", e);
        }
    }

    private boolean stopped;

    /** Stops the receiver, drains the pipeline, finishes every session and writes the points files. */
    private synchronized void stop(UdpSource udp, PacketPipeline pipeline, Recorder recorder, SessionShare shared,
                                   PrintWriter w) {
        if (stopped) {
            return;
        }
        stopped = true;
        udp.stop();
        pipeline.close(); // joins the pipeline thread: the sessions are ours from here
        List<PointsFile> files = new ArrayList<>();
        for (Map.Entry<Integer, CardSession> e : sessions.entrySet()) {
            CardSession s = e.getValue();
            s.finish();
            files.add(s.pointsFile("udp stream " + e.getKey() + " on " + listen));
        }
        if (recorder != null) {
            recorder.close();
            say(w, "recorded: " + recorder.file());
        }
        if (shared != null) {
            shared.close();
            say(w, shared.summary());
        }
        say(w, "stopped: " + udp.datagrams() + " datagrams, " + sessions.values().stream()
                .mapToLong(CardSession::frames).sum() + " frames");
        if (out != null) {
            for (int i = 0; i < files.size(); i++) {
                Path dir = files.size() == 1 ? out : out.resolve("stream-" + sessions.keySet().toArray()[i]);
                List<Path> written = PointsFiles.write(dir, files.get(i));
                say(w, "wrote: " + written.get(0) + ", " + written.get(1));
            }
            if (files.isEmpty()) {
                say(w, "no stream was heard: no points files written");
            }
        }
    }

    static String line(SessionEvent e) {
        return e.line();
    }

    private static void say(PrintWriter w, String line) {
        synchronized (w) {
            w.println(line);
            w.flush();
        }
    }

    static InetSocketAddress address(String uri) {
        String form = "--listen must look like udp://HOST:PORT, got '" + uri + "'";
        try {
            URI u = new URI(uri);
            if (!"udp".equals(u.getScheme()) || u.getHost() == null || u.getPort() < 0) {
                throw new PointcallException(form);
            }
            return new InetSocketAddress(u.getHost(), u.getPort());
        } catch (URISyntaxException e) {
            throw new PointcallException(form);
        }
    }
}
