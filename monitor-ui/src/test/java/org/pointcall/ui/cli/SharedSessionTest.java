package org.pointcall.ui.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.net.BindException;
import java.net.DatagramSocket;
import java.net.InetAddress;
import java.net.InetSocketAddress;
import java.net.ServerSocket;
import java.net.SocketException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.CopyOnWriteArrayList;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicReference;
import java.util.function.BooleanSupplier;

import javafx.scene.Scene;
import javafx.scene.control.Label;
import javafx.scene.control.ListView;
import javafx.scene.input.KeyCode;

import org.apache.kafka.clients.producer.KafkaProducer;
import org.apache.kafka.clients.producer.ProducerRecord;
import org.apache.kafka.common.header.internals.RecordHeader;
import org.apache.kafka.common.serialization.ByteArraySerializer;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.ExtendWith;
import org.junit.jupiter.api.io.TempDir;
import org.pointcall.ingest.kafka.KafkaSettings;
import org.pointcall.ingest.kafka.LocalKafkaBroker;
import org.pointcall.ingest.kafka.StreamKey;
import org.pointcall.models.card.CardPointState;
import org.pointcall.models.card.SessionSnapshot;
import org.pointcall.shared.outcome.PointOutcome;
import org.pointcall.shared.outcome.PointsFile;
import org.pointcall.shared.outcome.PointsFiles;
import org.pointcall.ui.console.ConsoleSetup;
import org.pointcall.ui.console.ConsoleView;
import org.pointcall.ui.console.TraceDrawing;
import org.pointcall.ui.desk.CardRow;
import org.pointcall.ui.desk.DeskSnapshot;
import org.pointcall.ui.desk.PointMark;
import org.pointcall.ui.settings.ConsoleSettings;
import org.pointcall.ui.share.ShareRecords;
import org.pointcall.ui.share.WatchConsole;
import org.pointcall.ui.share.WatchDesk;
import org.testfx.api.FxRobot;
import org.testfx.api.FxToolkit;
import org.testfx.util.WaitForAsyncUtils;

/**
 * A second console over Kafka, end to end on a real broker (KRaft, in this JVM, loopback) and real UDP: the first
 * session is {@code monitor --headless --share}, fed by {@code simulate --to udp://} (a stall and a loop of card A,
 * judged against card B: the stall GOOD, the loop REPEAT with a 3.5 g limit broken). A watching console that was
 * there before the sortie, and a headless watcher that joins after it, must both show the first session's points
 * (ids, verdicts, times) and alarms; the live one also charts the frames. Records that are not a shared session's
 * are counted and named, and nothing else is lost. A share to a broker that is not there must not hold up the
 * session it shares.
 */
@ExtendWith(LocalKafkaBroker.Shared.class)
class SharedSessionTest {
    private static final String PREFIX = "share-test";
    private static final String CARD_A = card("6.0", "320", "10");
    private static final String CARD_B = card("3.5", "300", "5");

    private static String card(String limit, String kcas, String tol) {
        return "sortie: T-7\nairframe: veskarn-02\nlimits:\n  - {parameter: Nz, max: " + limit + ", unit: g}\n"
                + String.format(CardCommandsTest.POINTS, kcas, tol);
    }

    @TempDir
    static Path dir;
    static Path cardA;
    static Path cardB;
    static KafkaSettings settings;
    static WatchConsole early;
    static final List<String> earlyNotes = new CopyOnWriteArrayList<>();
    static CommandRun first;
    static PointsFile firstPoints;

    @BeforeAll
    static void flyAndShare(LocalKafkaBroker broker) throws Exception {
        cardA = dir.resolve("card-a.yaml");
        cardB = dir.resolve("card-b.yaml");
        Files.writeString(cardA, CARD_A, StandardCharsets.UTF_8);
        Files.writeString(cardB, CARD_B, StandardCharsets.UTF_8);
        settings = broker.settings(PREFIX);
        // the watching console is up before anything is shared: it waits for the topics, then follows live
        early = new WatchConsole(settings, 120, ConsoleSettings.defaults().chartedParameters(), null,
                earlyNotes::add);
        early.start();
        first = monitor(dir.resolve("first"), "--share", "kafka://" + broker.bootstrap() + "/" + PREFIX);
        firstPoints = PointsFiles.read(dir.resolve("first/points.json"));
        String session = early.desk().start() == null ? "none" : early.desk().start().session();
        // three records that are no shared session's: no headers; an event that is not JSON; an event of a point
        // the card does not have
        try (KafkaProducer<byte[], byte[]> p = new KafkaProducer<>(settings.producerConfig(),
                new ByteArraySerializer(), new ByteArraySerializer())) {
            p.send(new ProducerRecord<>(settings.eventsTopic(), StreamKey.bytes(1), bytes("hello")));
            p.send(record(session, ShareRecords.EVENT, "{\"event\":\"point-started\", broken"));
            p.send(record(session, ShareRecords.EVENT,
                    "{\"event\":\"armed\",\"timeNs\":999000000000,\"cardId\":\"XX-9\"}"));
            p.flush();
        }
        waitFor(() -> early.feed().counts().bad() >= 3, 30, "the early watcher reads the bad records");
    }

    @AfterAll
    static void stop() {
        if (early != null) {
            early.close();
        }
    }

    private static ProducerRecord<byte[], byte[]> record(String session, String type, String json) {
        ProducerRecord<byte[], byte[]> r = new ProducerRecord<>(settings.eventsTopic(), StreamKey.bytes(1),
                bytes(json));
        r.headers().add(new RecordHeader(ShareRecords.TYPE_HEADER, bytes(type)));
        r.headers().add(new RecordHeader(ShareRecords.SESSION_HEADER, bytes(session)));
        return r;
    }

    private static byte[] bytes(String s) {
        return s.getBytes(StandardCharsets.UTF_8);
    }

    /** {@code monitor --headless} on a free UDP port fed by {@code simulate}; returns when it has stopped. */
    private static CommandRun monitor(Path out, String... extra) throws Exception {
        int port;
        try (DatagramSocket s = new DatagramSocket(new InetSocketAddress(InetAddress.getLoopbackAddress(), 0))) {
            port = s.getLocalPort();
        }
        List<String> args = new ArrayList<>(List.of("monitor", "--headless", "--listen", "udp://127.0.0.1:" + port,
                "--card", cardB.toString(), "--until-idle", "2", "--out", out.toString(), "--no-record"));
        args.addAll(List.of(extra));
        AtomicReference<CommandRun> mon = new AtomicReference<>();
        Thread t = new Thread(() -> mon.set(CommandRun.of(args.toArray(String[]::new))));
        t.start();
        int p = port;
        waitFor(() -> !isFree(p), 30, "the monitor listens");
        CommandRun sim = CommandRun.of("simulate", "--card", cardA.toString(), "--seed", "11", "--no-flaws",
                "--to", "udp://127.0.0.1:" + port, "--speed", "30");
        assertEquals(0, sim.exitCode(), sim.err());
        t.join(90_000);
        CommandRun m = mon.get();
        assertNotNull(m, "the monitor stopped");
        assertEquals(0, m.exitCode(), m.out() + m.err());
        return m;
    }

    private static void waitFor(BooleanSupplier c, int seconds, String what) throws InterruptedException {
        long end = System.nanoTime() + TimeUnit.SECONDS.toNanos(seconds);
        while (!c.getAsBoolean()) {
            if (System.nanoTime() > end) {
                throw new AssertionError("timed out: " + what);
            }
            Thread.sleep(50);
        }
    }

    private static boolean isFree(int port) {
        try (DatagramSocket s = new DatagramSocket(new InetSocketAddress(InetAddress.getLoopbackAddress(), port))) {
            return s.isBound();
        } catch (BindException e) {
            return false;
        } catch (SocketException e) {
            return false;
        }
    }

    /** The points of a file as {@code id verdict begin end}, planned and unplanned, in order. */
    private static List<String> points(List<PointOutcome> os) {
        List<String> out = new ArrayList<>();
        for (PointOutcome o : os) {
            out.add((o.cardId() == null ? "unplanned " + o.kind() : o.cardId()) + " " + o.verdict() + " "
                    + o.beginNs() + " " + o.endNs() + " " + o.reasons().size());
        }
        return out;
    }

    @Test
    void theFirstSessionSharesEverythingAndStillJudgesAsAlone() {
        String o = first.out();
        assertTrue(o.contains("sharing on kafka://"), o);
        assertTrue(o.lines().anyMatch(l -> l.contains("end    SL-1 stall-level") && l.contains(": GOOD")), o);
        assertTrue(o.lines().anyMatch(l -> l.contains("end    LP-1 loop") && l.contains(": REPEAT")), o);
        String summary = o.lines().filter(l -> l.startsWith("shared on ")).findFirst().orElseThrow();
        assertTrue(summary.contains("not shared 0 (queue full), failed 0"), summary);
        long sent = Long.parseLong(summary.replaceAll(".*: (\\d+) packets.*", "$1"));
        long records = Long.parseLong(summary.replaceAll(".* and (\\d+) records sent.*", "$1"));
        long delivered = Long.parseLong(summary.replaceAll(".*, (\\d+) delivered.*", "$1"));
        long datagrams = Long.parseLong(o.replaceAll("(?s).*stopped: (\\d+) datagrams.*", "$1"));
        assertEquals(datagrams, sent, "every datagram received is shared");
        assertEquals(sent + records, delivered, "and delivered");
    }

    @Test
    void aConsoleWatchingLiveShowsTheSamePointsAlarmsAndTraces() throws Exception {
        waitFor(() -> early.desk().mirror() != null
                && points(early.desk().mirror().outcomes()).equals(points(firstPoints.points())), 30,
                "the live watcher has every point: " + (early.desk().mirror() == null ? "-"
                        : points(early.desk().mirror().outcomes())) + " vs " + points(firstPoints.points()));
        assertEquals(firstPoints.alarms(), early.desk().mirror().alarms(), "the same alarms");
        assertEquals(firstPoints.notFlown(), early.desk().mirror().notFlown());
        waitFor(() -> early.link().latest().card().size() == 2, 10, "a snapshot with the card");
        DeskSnapshot s = early.link().latest();
        assertTrue(s.sortie().startsWith("T-7") && s.sortie().contains(WatchDesk.MARK), s.sortie());
        Map<String, PointMark> marks = new java.util.HashMap<>();
        for (CardRow r : s.card()) {
            marks.put(r.pointId(), r.mark());
        }
        assertEquals(Map.of("SL-1", PointMark.GOOD, "LP-1", PointMark.REPEAT), marks);
        assertTrue(s.alarms().stream().anyMatch(a -> a.text().startsWith("Nz") && a.text().contains("3.5")),
                s.alarms().toString());
        assertTrue(s.log().stream().anyMatch(l -> l.text().contains("LP-1") && l.text().contains("REPEAT")));
        assertTrue(s.health().framesSeen() > 10_000, "frames decoded at the watcher: " + s.health());
        assertEquals(0, s.health().lostPackets(), "no packet lost on the way: " + s.health());
        // the charts got the frames, derived parameters included (KCAS is computed from pressures)
        var traces = early.traces();
        assertNotNull(traces);
        assertTrue(traces.ring().written() > 10_000, "samples charted: " + traces.ring().written());
        int kcas = traces.channel("KCAS");
        assertTrue(kcas >= 0, traces.parameters().toString());
        double[] last = new double[1];
        traces.ring().drain((t, v) -> last[0] = v[kcas], Integer.MAX_VALUE);
        assertTrue(last[0] > 80 && last[0] < 500, "a KCAS in knots, derived at the watcher: " + last[0]);
        // the bad records were counted and named, and the feed went on
        List<String> faults = s.log().stream().map(l -> l.text()).filter(t -> t.contains(PREFIX + ".events"))
                .toList();
        assertEquals(3, faults.size(), faults.toString());
        assertTrue(faults.stream().anyMatch(f -> f.contains("no pointcall.type header")), faults.toString());
        assertTrue(faults.stream().anyMatch(f -> f.contains("not a session event record")), faults.toString());
        assertTrue(faults.stream().anyMatch(f -> f.contains("no point 'XX-9'")), faults.toString());
    }

    @Test
    void aWatcherThatJoinsAfterTheSortieSeesItAllAndWritesTheSamePoints() throws Exception {
        CommandRun late = CommandRun.of("monitor", "--headless", "--watch", "kafka://" + settings.bootstrapServers()
                + "/" + PREFIX, "--until-idle", "1", "--out", dir.resolve("late").toString());
        assertEquals(0, late.exitCode(), late.out() + late.err());
        String o = late.out();
        assertTrue(o.contains("watching: sortie T-7 (2 points)"), o);
        assertTrue(o.lines().anyMatch(l -> l.contains("end    SL-1 stall-level") && l.contains(": GOOD")), o);
        assertTrue(o.lines().anyMatch(l -> l.contains("LIMIT  Nz") && l.contains("breaks at most 3.5 g")), o);
        for (String line : first.out().lines().filter(l -> l.matches("\\s+[0-9.]+ s  .*")).toList()) {
            assertTrue(o.contains(line), "the first session's line is the watcher's: " + line);
        }
        assertTrue(o.lines().filter(l -> l.startsWith("fault: " + PREFIX + ".events partition 0 offset ")).count()
                == 3, o);
        assertTrue(o.contains("3 skipped"), o);
        PointsFile late2 = PointsFiles.read(dir.resolve("late/points.json"));
        assertEquals(points(firstPoints.points()), points(late2.points()));
        assertEquals(firstPoints.alarms(), late2.alarms());
        assertEquals(firstPoints.notFlown(), late2.notFlown());
        for (int i = 0; i < firstPoints.points().size(); i++) {
            assertEquals(firstPoints.points().get(i).metrics(), late2.points().get(i).metrics(),
                    "the metrics travel with the verdict");
        }
    }

    @Test
    void aConsoleThatJoinsAfterTheSortieChartsItsLastSecondsAndShowsEveryPoint() throws Exception {
        // joining late, the console reads the events from their beginning and the frames from --backfill ago
        try (WatchConsole late = new WatchConsole(settings, 300, ConsoleSettings.defaults().chartedParameters(), null,
                l -> { })) {
            late.start();
            assertTrue(late.awaitSession(TimeUnit.SECONDS.toNanos(30)), "the late console finds the session");
            waitFor(() -> late.feed().caughtUp() && late.desk().mirror() != null
                    && points(late.desk().mirror().outcomes()).equals(points(firstPoints.points())), 30,
                    "the late console has every point");
            waitFor(() -> late.traces() != null && late.traces().ring().written() > 10_000, 30,
                    "the late console charts the frames it backfilled");
            waitFor(() -> late.link().latest().card().size() == 2, 10, "a snapshot with the card");
            assertEquals(PointMark.REPEAT, late.link().latest().card().get(1).mark());
        }
    }

    @Test
    void theWatchingScreenSaysItIsReadOnlyAndRefusesCalls() throws Exception {
        FxToolkit.registerPrimaryStage();
        ConsoleView[] view = new ConsoleView[1];
        FxToolkit.setupStage(stage -> {
            view[0] = new ConsoleView(new ConsoleSetup("watch", early.link(), early.traces(),
                    ConsoleSettings.defaults(), null, false, 30, TraceDrawing.ENVELOPE, true));
            stage.setScene(new Scene(view[0].root(), 1400, 900));
            stage.show();
            view[0].root().requestFocus();
            view[0].start();
        });
        FxRobot robot = new FxRobot();
        try {
            WaitForAsyncUtils.waitFor(10, TimeUnit.SECONDS, () -> ((Label) robot.lookup("#header-sortie").query())
                    .getText().contains(WatchDesk.MARK));
            WaitForAsyncUtils.waitFor(10, TimeUnit.SECONDS, () -> robot.lookup("#card-state-LP-1").tryQuery()
                    .map(n -> ((Label) n).getText().startsWith("REPEAT")).orElse(false));
            assertTrue(((Label) robot.lookup("#card-state-SL-1").query()).getText().startsWith("GOOD"));
            long sent = early.link().sentCount();
            robot.press(KeyCode.A).release(KeyCode.A);
            WaitForAsyncUtils.waitFor(10, TimeUnit.SECONDS, () -> ((Label) robot.lookup("#call-hint").query())
                    .getText().startsWith("watching"));
            assertEquals(sent, early.link().sentCount(), "the watching screen sends no arming");
            assertFalse(robot.lookup("#arm-button").query().isVisible(), "and shows no arm or call buttons");
            // a command that reaches the watched desk all the same is refused there, and said so in the log
            early.link().send(new org.pointcall.ui.desk.DeskCommand.Arm("LP-1"));
            WaitForAsyncUtils.waitFor(10, TimeUnit.SECONDS, () -> ((ListView<?>) robot.lookup("#event-log")
                    .query()).getItems().stream().anyMatch(i -> i.toString().contains(WatchDesk.REFUSED)));
            SessionSnapshot snap = early.desk().mirror().snapshot(0);
            assertEquals(CardPointState.REPEAT, snap.points().get(1).state(), "nothing was armed by the watcher");
        } finally {
            WaitForAsyncUtils.asyncFx(() -> view[0].stop()).get(5, TimeUnit.SECONDS);
            FxToolkit.cleanupStages();
        }
    }

    @Test
    void aShareWithNoBrokerNeverHoldsTheSessionUp() throws Exception {
        int dead;
        try (ServerSocket s = new ServerSocket(0, 1, InetAddress.getLoopbackAddress())) {
            dead = s.getLocalPort();
        }
        CommandRun m = monitor(dir.resolve("alone"), "--share", "kafka://127.0.0.1:" + dead + "/nobody");
        PointsFile alone = PointsFiles.read(dir.resolve("alone/points.json"));
        assertEquals(points(firstPoints.points()), points(alone.points()), "the same points with no broker");
        String summary = m.out().lines().filter(l -> l.startsWith("shared on ")).findFirst().orElseThrow();
        assertTrue(summary.contains(" 0 delivered"), summary);
        long datagrams = Long.parseLong(m.out().replaceAll("(?s).*stopped: (\\d+) datagrams.*", "$1"));
        long notShared = Long.parseLong(summary.replaceAll(".*not shared (\\d+) .*", "$1"));
        long failed = Long.parseLong(summary.replaceAll(".*failed (\\d+).*", "$1"));
        long sent = Long.parseLong(summary.replaceAll(".*: (\\d+) packets.*", "$1"));
        assertTrue(notShared + sent >= datagrams, "every datagram is either sent or counted: " + summary);
        assertTrue(notShared + failed > 0, "and what did not reach a broker is counted: " + summary);
        assertFalse(m.err().contains("\tat "), m.err());
    }
}
