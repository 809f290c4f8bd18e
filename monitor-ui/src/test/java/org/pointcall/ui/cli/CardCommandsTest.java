package org.pointcall.ui.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.net.BindException;
import java.net.DatagramSocket;
import java.net.InetAddress;
import java.net.InetSocketAddress;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.atomic.AtomicReference;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.pointcall.shared.card.CardFiles;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.demo.DemoFiles;
import org.pointcall.shared.outcome.PointOutcome;
import org.pointcall.shared.outcome.PointsFile;
import org.pointcall.shared.outcome.PointsFiles;
import org.pointcall.shared.outcome.Reason;
import org.pointcall.shared.outcome.Verdict;

/**
 * analyze, monitor --headless, next-card and evaluate --verdicts on a short simulated sortie: the pilot flies card
 * A (a wings-level stall, a loop from 320 KCAS); the tool judges it against card B, whose loop asks for 300 +/- 5
 * KCAS and whose Nz limit is 3.5 g, so the loop must come out REPEAT for both reasons and the stall GOOD.
 */
class CardCommandsTest {
    /** A stall and a loop whose entry KCAS band is filled in ({@code %s} target, {@code %s} tolerance). */
    static final String POINTS = String.join("\n",
            "points:",
            "  - id: SL-1",
            "    kind: stall-level",
            "    title: Wings-level stall, clean, idle, 1 kt/s entry",
            "    bands:",
            "      - {parameter: Hp, phase: entry, target: 10000, tol: 500, unit: ft}",
            "      - {parameter: Roll, phase: throughout, target: 0, tol: 5, unit: deg}",
            "      - {parameter: KCAS, phase: rate, before: break, over: 10, target: -1.0, tol: 0.25, unit: kt/s}",
            "      - {metric: stall-kcas, phase: result, min: 106, max: 120, unit: kt}",
            "      - {metric: altitude-loss, phase: result, max: 800, unit: ft}",
            "  - id: LP-1",
            "    kind: loop",
            "    title: Loop, 4 g pull",
            "    bands:",
            "      - {parameter: KCAS, phase: entry, target: %s, tol: %s, unit: kt}",
            "      - {parameter: Hp, phase: entry, target: 8000, tol: 300, unit: ft}",
            "");

    private static String card(String sortie, String limit, String kcas, String tol) {
        return "sortie: " + sortie + "\nairframe: veskarn-02\nlimits:\n  - {parameter: Nz, max: " + limit
                + ", unit: g}\n" + String.format(POINTS, kcas, tol);
    }

    @TempDir
    static Path dir;
    static Path cardA;
    static Path cardB;
    static Path sortie;
    static CommandRun analyzed;

    @BeforeAll
    static void flyAndAnalyse() throws Exception {
        cardA = dir.resolve("card-a.yaml");
        cardB = dir.resolve("card-b.yaml");
        Files.writeString(cardA, card("T-7", "6.0", "320", "10"), StandardCharsets.UTF_8);
        Files.writeString(cardB, card("T-7", "3.5", "300", "5"), StandardCharsets.UTF_8);
        sortie = dir.resolve("sortie");
        CommandRun sim = CommandRun.of("simulate", "--card", cardA.toString(), "--seed", "11", "--no-flaws",
                "--out", sortie.toString());
        assertEquals(0, sim.exitCode(), sim.err());
        analyzed = CommandRun.of("analyze", "--input", sortie.resolve("sortie.csv").toString(), "--card",
                cardB.toString(), "--out", dir.resolve("analysis").toString());
        assertEquals(0, analyzed.exitCode(), analyzed.err());
    }

    private static Map<String, PointOutcome> planned(PointsFile f) {
        Map<String, PointOutcome> m = new LinkedHashMap<>();
        for (PointOutcome o : f.points()) {
            if (o.cardId() != null && o.verdict() != Verdict.INCOMPLETE) {
                m.put(o.cardId(), o);
            }
        }
        return m;
    }

    private static List<String> reasons(PointOutcome o) {
        return o.reasons().stream().map(Reason::text).toList();
    }

    @Test
    void analyzeGivesTheVerdictsWithReasonsInBothFilesAndOnTheScreen() throws Exception {
        PointsFile f = PointsFiles.read(dir.resolve("analysis/points.json"));
        Map<String, PointOutcome> byId = planned(f);
        assertEquals(List.of("SL-1", "LP-1"), List.copyOf(byId.keySet()), analyzed.out());
        PointOutcome stall = byId.get("SL-1");
        assertEquals(Verdict.GOOD, stall.verdict(), analyzed.out());
        assertTrue(stall.metric("stall-kcas").value() > 106 && stall.metric("stall-kcas").value() < 120);
        PointOutcome loop = byId.get("LP-1");
        assertEquals(Verdict.REPEAT, loop.verdict());
        List<String> why = reasons(loop);
        // the pilot flew card A's 320 KCAS: the entry must be reported against card B's band, in its own terms
        assertTrue(why.stream().anyMatch(r -> r.matches("entry KCAS 3[12]\\d kt, band 300 \\+/- 5 kt")), why.toString());
        assertTrue(why.stream().anyMatch(r -> r.startsWith("safety limit broken: Nz reached ")
                && r.contains("limit at most 3.5 g")), why.toString());
        assertTrue(f.alarms().stream().anyMatch(a -> a.raised() && a.parameter().equals("Nz") && a.value() > 3.5
                && "LP-1".equals(a.cardId())));
        String csv = Files.readString(dir.resolve("analysis/points.csv"));
        assertTrue(csv.lines().findFirst().orElseThrow().contains("stall-kcas (kt)"));
        assertTrue(csv.lines().anyMatch(l -> l.startsWith("LP-1,loop,") && l.contains(",repeat,,repeat,")), csv);
        assertTrue(analyzed.out().lines().anyMatch(l -> l.startsWith("SL-1") && l.contains("GOOD")), analyzed.out());
    }

    @Test
    void withoutACardEveryPointIsListedWithNoVerdict() {
        CommandRun r = CommandRun.of("analyze", "--input", sortie.resolve("sortie.csv").toString(), "--out",
                dir.resolve("plain").toString());
        assertEquals(0, r.exitCode(), r.err());
        PointsFile f = PointsFiles.read(dir.resolve("plain/points.json"));
        assertTrue(f.points().size() >= 2);
        for (PointOutcome o : f.points()) {
            assertEquals(null, o.verdict());
            assertEquals(null, o.cardId());
        }
        assertTrue(f.points().stream().anyMatch(o -> o.kind().equals("stall-level") && o.metric("stall-kcas") != null));
    }

    @Test
    void theNextCardKeepsTheRepeatWithWhatToCorrectAndLoads() throws Exception {
        Path next = dir.resolve("next.yaml");
        CommandRun r = CommandRun.of("next-card", "--results", dir.resolve("analysis").toString(), "--card",
                cardB.toString(), "--out", next.toString());
        assertEquals(0, r.exitCode(), r.err());
        TestCard c = CardFiles.load(next, DemoFiles.dictionary());
        assertEquals(List.of("LP-1"), c.points().stream().map(p -> p.id()).toList(), "the good stall is done");
        assertTrue(c.point("LP-1").orElseThrow().title().matches(".*enter (1\\d|2\\d) kt slower.*"),
                c.point("LP-1").orElseThrow().title());
        assertEquals("T-7-next", c.sortie());
    }

    @Test
    void evaluateVerdictsAgreesWithTheTruthOnTheCardTheSortieWasFlownTo() {
        CommandRun r = CommandRun.of("evaluate", "--verdicts", "--data", sortie.toString());
        assertEquals(0, r.exitCode(), r.err());
        assertEquals(2, r.number("verdicts.points"));
        assertEquals(2, r.number("verdicts.detected"), r.out());
        assertEquals(1.0, r.number("verdicts.agreement"), 1e-12, r.out());
    }

    @Test
    void monitorHeadlessFollowsTheSortieOverRealUdpAndWritesTheSamePoints() throws Exception {
        int port;
        try (DatagramSocket s = new DatagramSocket(new InetSocketAddress(InetAddress.getLoopbackAddress(), 0))) {
            port = s.getLocalPort();
        }
        Path out = dir.resolve("live");
        AtomicReference<CommandRun> mon = new AtomicReference<>();
        Thread t = new Thread(() -> mon.set(CommandRun.of("monitor", "--headless", "--listen",
                "udp://127.0.0.1:" + port, "--card", cardB.toString(), "--until-idle", "2", "--out", out.toString(),
                "--record", dir.resolve("archive").toString())));
        t.start();
        long deadline = System.nanoTime() + 30_000_000_000L;
        while (System.nanoTime() < deadline && isFree(port)) {
            Thread.sleep(50);
        }
        assertFalse(isFree(port), "the monitor listens");
        CommandRun sim = CommandRun.of("simulate", "--card", cardA.toString(), "--seed", "11", "--no-flaws",
                "--to", "udp://127.0.0.1:" + port, "--speed", "30");
        assertEquals(0, sim.exitCode(), sim.err());
        t.join(60_000);
        CommandRun m = mon.get();
        assertEquals(0, m.exitCode(), m.err());
        String o = m.out();
        assertTrue(o.lines().anyMatch(l -> l.contains("begin  SL-1 stall-level")), o);
        assertTrue(o.lines().anyMatch(l -> l.contains("end    SL-1 stall-level") && l.contains(": GOOD")), o);
        assertTrue(o.lines().anyMatch(l -> l.contains("LIMIT  Nz") && l.contains("breaks at most 3.5 g")), o);
        assertTrue(o.lines().anyMatch(l -> l.contains("end    LP-1 loop") && l.contains(": REPEAT: entry KCAS")), o);
        Map<String, PointOutcome> live = planned(PointsFiles.read(out.resolve("points.json")));
        Map<String, PointOutcome> file = planned(PointsFiles.read(dir.resolve("analysis/points.json")));
        assertEquals(file.keySet(), live.keySet());
        for (String id : file.keySet()) {
            assertEquals(file.get(id).verdict(), live.get(id).verdict(), id + " live and from the file");
        }
        // live monitoring records by default: every datagram and the session's events are in the archive
        List<Path> archives;
        try (var files = Files.list(dir.resolve("archive"))) {
            archives = files.filter(f -> f.toString().endsWith(".pcsa")).toList();
        }
        assertEquals(1, archives.size(), archives.toString());
        try (org.pointcall.replay.archive.ArchiveReader ar =
                     org.pointcall.replay.archive.ArchiveReader.open(archives.get(0))) {
            long[] packets = new long[1];
            List<String> events = new java.util.ArrayList<>();
            ar.read(r -> {
                if (r.isPacket()) {
                    packets[0]++;
                } else if ("session.event".equals(r.type())) {
                    events.add(new String(r.bodyBytes(), StandardCharsets.UTF_8));
                }
                return true;
            });
            assertTrue(o.contains("stopped: " + packets[0] + " datagrams"), "every datagram recorded: " + packets[0]);
            assertTrue(events.stream().anyMatch(e -> e.contains("SL-1")), "session events recorded");
        }
    }

    private static boolean isFree(int port) {
        try (DatagramSocket s = new DatagramSocket(new InetSocketAddress(InetAddress.getLoopbackAddress(), port))) {
            return s.isBound();
        } catch (BindException e) {
            return false;
        } catch (java.net.SocketException e) {
            return false;
        }
    }

    @Test
    void badInputIsOneLineAndExitTwo() throws Exception {
        Path badCard = dir.resolve("bad-card.yaml");
        Files.writeString(badCard, card("T-8", "6.0", "320", "10").replace("parameter: Hp", "parameter: Hpx"),
                StandardCharsets.UTF_8);
        List<String[]> runs = List.of(
                new String[] {"analyze", "--input", dir.resolve("missing.csv").toString(), "--out", dir.toString()},
                new String[] {"analyze", "--input", sortie.resolve("sortie.csv").toString(), "--card",
                    badCard.toString(), "--out", dir.resolve("x").toString()},
                new String[] {"monitor", "--headless", "--listen", "tcp://nowhere", "--card", cardB.toString()},
                new String[] {"monitor", "--listen", "udp://127.0.0.1:0", "--card", cardB.toString()},
                new String[] {"next-card", "--results", dir.resolve("nothing").toString(), "--card", cardB.toString(),
                    "--out", dir.resolve("n.yaml").toString()},
                new String[] {"evaluate", "--verdicts"});
        for (String[] args : runs) {
            CommandRun r = CommandRun.of(args);
            assertEquals(2, r.exitCode(), String.join(" ", args) + "\n" + r.out() + r.err());
            assertFalse(r.err().contains("Exception") || r.err().contains("\tat "), r.err());
        }
        CommandRun r = CommandRun.of(runs.get(1));
        assertTrue(r.err().contains("bad-card.yaml:") && r.err().contains("unknown parameter 'Hpx'"), r.err());
    }
}
