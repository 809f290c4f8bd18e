package org.pointcall.shared.outcome;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.pointcall.shared.error.PointcallException;

class PointsFilesTest {
    private static PointOutcome stall() {
        return new PointOutcome(3, "SL-1", "stall-level", "Wings-level stall", 41_100_000_000L, 99_100_000_000L, 0.93,
                Verdict.REPEAT, List.of(new Reason("KCAS", "entry KCAS 158 kt, band 150 +/- 5 kt")),
                List.of(new BandResult(0, "KCAS", "entry", "kt", "150 +/- 5 kt", 158.0, -0.3, BandStatus.OUT, false, 0),
                        new BandResult(1, "stall-kcas", "result", "kt", "106 to 120 kt", null, null,
                                BandStatus.WAITING, false, 0)),
                List.of(new MetricValue("stall-kcas", 113.04, "kt", "KCAS at the AoA maximum"),
                        new MetricValue("entry-rate", 0.996, "kt/s", "")),
                Map.of("break", 80_000_000_000L), List.of("a note, with a comma"),
                new OperatorCall("SL-1", Verdict.GOOD, "entry was fine by the chase", 100_000_000_000L));
    }

    private static PointOutcome unplanned() {
        return new PointOutcome(4, null, "loop", "Loop", 120_000_000_000L, 150_000_000_000L, 0.8, null, List.of(),
                List.of(), List.of(new MetricValue("max-nz", 4.2, "g", "")), Map.of(), List.of(), null);
    }

    @Test
    void aPointsFileReadsBackEqualAndTheEngineersCallStands(@TempDir Path dir) {
        PointsFile f = PointsFile.of("sortie.csv", "VSK02-F041", "veskarn-02", List.of(stall(), unplanned()),
                List.of(new LimitAlarm("Nz", "g", "at most 6 g", true, 130_000_000_000L, 6.1, 6.1, null)),
                List.of("TP-2"));
        PointsFiles.write(dir, f);
        PointsFile back = PointsFiles.read(dir.resolve(PointsFiles.JSON_FILE));
        assertEquals(f, back);
        assertEquals(Verdict.GOOD, back.points().get(0).finalCall(), "the engineer's call overrides");
        assertEquals(Verdict.REPEAT, back.points().get(0).verdict(), "the tool's is kept");
        assertTrue(PointsFiles.toJson(f).contains("\"verdict\" : \"repeat\""), "verdicts are written as their keys");
    }

    @Test
    void theCsvHasOneRowPerPointAndAColumnPerMetricWithItsUnit() {
        String csv = PointsFiles.toCsv(PointsFile.of("s", "S", "a", List.of(stall(), unplanned()), List.of(),
                List.of()));
        List<String> lines = csv.lines().toList();
        assertEquals(3, lines.size());
        List<String> head = List.of(lines.get(0).split(","));
        assertEquals(List.of("card_id", "kind", "begin_s", "end_s", "verdict", "engineer_call", "final_call",
                "confidence", "reasons", "entry-rate (kt/s)", "stall-kcas (kt)"), head.subList(0, 11));
        assertTrue(head.contains("max-nz (g)"), "the loop's metrics are there too");
        assertTrue(lines.get(1).startsWith("SL-1,stall-level,41.100,99.100,repeat,good,good,0.930,"), lines.get(1));
        assertTrue(lines.get(1).contains("\"entry KCAS 158 kt, band 150 +/- 5 kt\",0.996,113.04"), lines.get(1));
        assertTrue(lines.get(2).startsWith(",loop,120.000,150.000,,,,0.800,,"), lines.get(2));
    }

    @Test
    void sessionEventsAreRecordsThatReadBack() {
        List<SessionEvent> events = List.of(
                new SessionEvent.PointStarted(41_000_000_000L, 3, "stall-level", "SL-1", "Wings-level stall",
                        40_000_000_000L),
                new SessionEvent.BandChanged(42_000_000_000L, "SL-1", 1, "Roll", "throughout", BandStatus.CLEAR,
                        BandStatus.OUT, 6.2, "deg", "0 +/- 5 deg"),
                new SessionEvent.PointFinished(99_500_000_000L, stall()),
                new SessionEvent.Unplanned(150_500_000_000L, unplanned()),
                new SessionEvent.AlarmChanged(new LimitAlarm("Nz", "g", "at most 6 g", false, 131_000_000_000L, 5.8,
                        6.3, "LP-1")),
                new SessionEvent.PointArmed(10_000_000_000L, "SL-2"),
                new SessionEvent.CallTaken(new OperatorCall("SL-1", Verdict.GOOD, "", 100_000_000_000L),
                        Verdict.REPEAT));
        for (SessionEvent e : events) {
            String json = PointsFiles.eventToJson(e);
            assertTrue(!json.contains("\n"), "one record per line");
            assertEquals(e, PointsFiles.eventFromJson(json));
        }
        assertEquals("     42.0 s  band   SL-1 throughout Roll: clear -> out, 6.2 deg (band 0 +/- 5 deg)",
                events.get(1).line());
        assertTrue(events.get(2).line().endsWith("SL-1 stall-level 41.1 to 99.1 s: REPEAT: entry KCAS 158 kt, band "
                + "150 +/- 5 kt"), events.get(2).line());
    }

    @Test
    void aFileOfAnotherFormatIsRefusedInOneLine() {
        PointcallException e = assertThrows(PointcallException.class,
                () -> PointsFiles.fromJson("{\"format\": \"other/1\"}", "x.json"));
        assertEquals("x.json: not a points file (format 'other/1', expected 'pointcall-points/1')", e.getMessage());
        assertThrows(PointcallException.class, () -> PointsFiles.fromJson("{", "y.json"));
    }

    @Test
    void numbersTakeTheDecimalsOfTheirBand() {
        assertEquals("158", Numbers.scaled(157.8, 10));
        assertEquals("0.96", Numbers.scaled(0.9637, 0.2));
        assertEquals("-1.78", Numbers.scaled(-1.7834, 0.5));
        assertEquals("4.27", Numbers.near(4.274, 3));
        assertEquals("0", Numbers.scaled(-0.0001, 10), "no negative zero");
    }
}
