package org.pointcall.models.data;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.pointcall.models.data.TestRecordings.S;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.pointcall.ingest.sim.truth.PointTruth;
import org.pointcall.ingest.sim.truth.SortieTruth;
import org.pointcall.ingest.window.WindowSpec;
import org.pointcall.models.label.LabelFiles;
import org.pointcall.models.label.Labels;
import org.pointcall.shared.error.PointcallException;
import org.pointcall.shared.kind.ManoeuvreKind;

class DatasetBuilderTest {
    private static final List<WindowSpec> WINDOWS = List.of(WindowSpec.of("KCAS", 1.0), WindowSpec.of("AoA", 0.5, 1.0));
    private static final DatasetSettings TEN_HZ = DatasetSettings.of(WINDOWS)
            .withExtractor(org.pointcall.ingest.window.ExtractorSettings.defaults().withDecisionRateHz(10));

    private static final String LABELS = "kind,begin,end,card_id\n"
            + "stall-level,20,30,S-1\n"
            + "loop,40,45.5,L-1\n";

    /** The class a tick at {@code tNs} must get, from the label text above, by hand. */
    private static int expectedClass(long tNs) {
        if (tNs >= 20 * S && tNs < 30 * S) {
            return LabelledRows.classIndex(ManoeuvreKind.STALL_LEVEL);
        }
        if (tNs >= 40 * S && tNs < 45 * S + S / 2) {
            return LabelledRows.classIndex(ManoeuvreKind.LOOP);
        }
        return 0;
    }

    @Test
    void everyTickIsLabelledByTheIntervalContainingIt(@TempDir Path dir) {
        Path rec = TestRecordings.write(dir.resolve("s1.csv"), 60, t -> 250.0, t -> t >= 20 && t < 30 ? 14 : 3);
        DatasetBuilder b = DatasetBuilder.create(TestRecordings.dictionary(), TEN_HZ);
        SortieReport report = b.addRecording(rec, LabelFiles.parse(LABELS, "s1.labels.csv"),
                new SortieInfo("s1", "demo-a", rec.toString(), "s1.labels.csv"));
        LabelledRows rows = b.build();

        assertEquals(18, rows.featureCount());
        assertEquals("AoA.mean.0.5s", rows.featureNames().get(6));
        // 60 s of frames from t = 0 tick at 0.0, 0.1, ... 59.9 s
        assertEquals(600, report.ticks());
        assertEquals(report.ticks(), report.rows() + report.incomplete() + report.nearBoundary());
        assertEquals(0, report.nearBoundary());
        for (int i = 0; i < rows.rows(); i++) {
            assertEquals(expectedClass(rows.timeNs(i)), rows.classOf(i), "row at " + rows.timeNs(i));
            assertEquals(250.0, rows.value(i, 0), "KCAS.mean.1s of a constant");
        }
        int[] counts = rows.classCounts();
        // [20, 30) and [40, 45.5) at 10 Hz: 100 and 55 ticks, none of them short of data
        assertEquals(100, counts[LabelledRows.classIndex(ManoeuvreKind.STALL_LEVEL)]);
        assertEquals(55, counts[LabelledRows.classIndex(ManoeuvreKind.LOOP)]);
        assertEquals(rows.rows() - 155, counts[0]);
        assertEquals(Map.of("none", counts[0], "stall-level", 100, "loop", 55), report.rowsPerClass());
        assertTrue(report.labelsWithoutRows().isEmpty());
        assertEquals("s1: 600 decision ticks, " + rows.rows() + " rows kept, " + report.incomplete()
                + " incomplete, 0 near a label boundary", report.lines().get(0));
    }

    @Test
    void ticksWithinTheMarginOfABoundaryAreLeftOutAndCounted(@TempDir Path dir) {
        Path rec = TestRecordings.write(dir.resolve("s1.csv"), 60, t -> 250.0, t -> 3.0);
        DatasetBuilder b = DatasetBuilder.create(TestRecordings.dictionary(), TEN_HZ.withBoundaryMarginS(1.0));
        SortieReport report = b.addRecording(rec, LabelFiles.parse(LABELS, "l.csv"), new SortieInfo("s1", "", "",
                ""));
        LabelledRows rows = b.build();
        // boundaries 20, 30, 40, 45.5 s: ticks strictly closer than 1 s, 19 around each (a tick 1.0 s away stays)
        assertEquals(76, report.nearBoundary());
        for (int i = 0; i < rows.rows(); i++) {
            long t = rows.timeNs(i);
            for (long boundary : new long[] {20 * S, 30 * S, 40 * S, 45 * S + S / 2}) {
                assertTrue(Math.abs(t - boundary) >= S, "row at " + t);
            }
        }
        // 20.0 to 20.9 s and 29.1 to 29.9 s of the stall are within 1 s of its ends
        assertEquals(100 - 10 - 9, rows.classCounts()[LabelledRows.classIndex(ManoeuvreKind.STALL_LEVEL)]);
    }

    @Test
    void timeOfDayRecordingsAndLabelsCrossMidnightTogether(@TempDir Path dir) throws IOException {
        StringBuilder csv = new StringBuilder("time,KCAS,AoA\n");
        long start = (23 * 3600 + 59 * 60 + 30) * 1000L;
        for (int i = 0; i < 1200; i++) {
            long ms = (start + i * 50L) % 86_400_000L;
            csv.append(String.format(java.util.Locale.ROOT, "%02d:%02d:%02d.%03d", ms / 3_600_000, ms / 60_000 % 60,
                    ms / 1000 % 60, ms % 1000)).append(",250,3\n");
        }
        Path rec = Files.writeString(dir.resolve("night.csv"), csv);
        Labels labels = LabelFiles.parse("kind,begin,end\nloop,23:59:50,00:00:10\n", "night.labels.csv");
        DatasetBuilder b = DatasetBuilder.create(TestRecordings.dictionary(), TEN_HZ);
        b.addRecording(rec, labels, new SortieInfo("night", "", "", ""));
        LabelledRows rows = b.build();
        long day = 86_400 * S;
        int loops = 0;
        for (int i = 0; i < rows.rows(); i++) {
            long t = rows.timeNs(i);
            boolean inLoop = t >= day - 10 * S && t < day + 10 * S;
            assertEquals(inLoop ? LabelledRows.classIndex(ManoeuvreKind.LOOP) : 0, rows.classOf(i), "at " + t);
            loops += inLoop ? 1 : 0;
        }
        assertEquals(200, loops);
    }

    @Test
    void labelsInSecondsDoNotFitATimeOfDayRecording(@TempDir Path dir) throws IOException {
        Path rec = Files.writeString(dir.resolve("tod.csv"), "time,KCAS,AoA\n10:00:00.000,250,3\n"
                + "10:00:00.050,250,3\n");
        DatasetBuilder b = DatasetBuilder.create(TestRecordings.dictionary(), TEN_HZ);
        PointcallException e = assertThrows(PointcallException.class, () -> b.addRecording(rec,
                LabelFiles.parse(LABELS, "l.csv"), new SortieInfo("x", "", "", "")));
        assertTrue(e.getMessage().startsWith("l.csv: labels are written in seconds but " + rec
                + " gives its time in time of day"), e.getMessage());
    }

    @Test
    void aSimulatedSortieIsLabelledByItsTruthAndLabelsOutsideTheRecordingAreReported(@TempDir Path dir) {
        Path sortie = dir.resolve("sortie-7");
        sortie.toFile().mkdirs();
        TestRecordings.write(sortie.resolve(DatasetBuilder.SIM_RECORDING), 30, t -> 200 + t, t -> 2.0);
        new SortieTruth(SortieTruth.FORMAT, "demo-b", "sortie-7", 7L, 20, 30, true, 0, 0, 0, List.of(
                new PointTruth("P-1", "pitch-doublet", 10.0, 15.0, Map.of(), Map.of(), Map.of(), List.of(), true,
                        "none"),
                new PointTruth("P-2", "phugoid", 100.0, 200.0, Map.of(), Map.of(), Map.of(), List.of(), true,
                        "none"))).write(sortie.resolve(DatasetBuilder.SIM_TRUTH));
        DatasetBuilder b = DatasetBuilder.create(TestRecordings.dictionary(), TEN_HZ);
        SortieReport report = b.addSimulated(sortie);
        LabelledRows rows = b.build();
        assertEquals("sortie-7", rows.sorties().get(0).name());
        assertEquals("demo-b", rows.sorties().get(0).airframe());
        assertEquals(50, rows.classCounts()[LabelledRows.classIndex(ManoeuvreKind.PITCH_DOUBLET)]);
        assertEquals(List.of("phugoid 100.000 s to 200.000 s [P-2]"), report.labelsWithoutRows());

        PointcallException again = assertThrows(PointcallException.class, () -> b.addSimulated(sortie));
        assertEquals("sortie 'sortie-7' is already in the data set", again.getMessage());
        PointcallException missing = assertThrows(PointcallException.class, () -> b.addSimulated(dir));
        assertTrue(missing.getMessage().endsWith("truth.json is missing"), missing.getMessage());
    }

    @Test
    void windowsNamingAnUnknownParameterAreRefusedBeforeAnyFile() {
        PointcallException e = assertThrows(PointcallException.class, () -> DatasetBuilder.create(
                TestRecordings.dictionary(), DatasetSettings.of(List.of(WindowSpec.of("Nz", 1.0)))));
        assertTrue(e.getMessage().contains("'Nz'"), e.getMessage());
    }

    @Test
    void csvExportReadsBackToTheSameValues(@TempDir Path dir) throws IOException {
        Path rec = TestRecordings.write(dir.resolve("s1.csv"), 12, t -> 250 + Math.sin(t), t -> 3 + 0.1 * t);
        DatasetBuilder b = DatasetBuilder.create(TestRecordings.dictionary(), TEN_HZ.withIncompleteRows(
                IncompleteRows.KEEP));
        b.addRecording(rec, LabelFiles.parse("kind,begin,end\nsideslip,5,7.25\n", "l.csv"),
                new SortieInfo("s,1", "", "", ""));
        LabelledRows rows = b.build();
        Path out = dir.resolve("rows.csv");
        DatasetCsv.write(rows, out);
        List<String> lines = Files.readAllLines(out);
        assertEquals(rows.rows() + 1, lines.size());
        assertTrue(lines.get(0).startsWith("sortie,time_s,class,synthetic,KCAS.mean.1s,KCAS.std.1s,"),
                lines.get(0));
        // the first tick (t = 0) has one sample: its 1 s windows are invalid, kept as empty cells
        assertTrue(lines.get(1).startsWith("\"s,1\",0,none,no,"), lines.get(1));
        for (int i = 0; i < rows.rows(); i++) {
            String[] cells = lines.get(i + 1).substring(lines.get(i + 1).indexOf("\",") + 2).split(",", -1);
            assertEquals(rows.timeNs(i), new java.math.BigDecimal(cells[0]).movePointRight(9).longValueExact());
            assertEquals(LabelledRows.CLASS_NAMES.get(rows.classOf(i)), cells[1]);
            for (int k = 0; k < rows.featureCount(); k++) {
                double v = rows.value(i, k);
                String c = cells[3 + k];
                if (Double.isNaN(v)) {
                    assertEquals("", c);
                } else {
                    assertEquals(v, Double.parseDouble(c), 0.0, "exact round trip");
                }
            }
        }
    }
}
