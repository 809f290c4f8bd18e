package org.pointcall.ingest.file;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.pointcall.ingest.file.SortieDictionary.HP;
import static org.pointcall.ingest.file.SortieDictionary.KCAS;
import static org.pointcall.ingest.file.SortieDictionary.NZ;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import org.apache.poi.hssf.usermodel.HSSFWorkbook;
import org.apache.poi.ss.usermodel.Cell;
import org.apache.poi.ss.usermodel.CellStyle;
import org.apache.poi.ss.usermodel.FormulaError;
import org.apache.poi.ss.usermodel.Row;
import org.apache.poi.ss.usermodel.Sheet;
import org.apache.poi.xssf.streaming.SXSSFWorkbook;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.pointcall.ingest.frame.Frame;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.InputRejectedException;
import org.pointcall.shared.error.Problem;

class XlsxSourceTest {
    private static final ReadOptions AS_SORTIE = ReadOptions.DEFAULTS.withSourceName("sortie.xlsx");

    @TempDir
    Path dir;

    private final ParameterDictionary dictionary = SortieDictionary.create();

    /** A time of day written as a formatted time cell in the workbook and as HH:MM:SS.sss in the CSV. */
    record TimeOfDay(double seconds) {
        String text() {
            long ms = Math.round(seconds * 1000);
            return String.format(Locale.ROOT, "%02d:%02d:%02d.%03d", ms / 3_600_000, ms / 60_000 % 60,
                    ms / 1000 % 60, ms % 1000);
        }
    }

    /** A spreadsheet error cell, #DIV/0! in the CSV. */
    record ErrorCell() {
    }

    /** Writes the same table as a workbook (first sheet {@code sheet}, after {@code before} empty rows). */
    private Path workbook(String name, String sheet, int before, List<Object[]> rows, String... otherSheets)
            throws IOException {
        Path p = dir.resolve(name);
        try (SXSSFWorkbook wb = new SXSSFWorkbook(50)) {
            CellStyle timeStyle = wb.createCellStyle();
            timeStyle.setDataFormat(wb.createDataFormat().getFormat("hh:mm:ss.000"));
            for (String other : otherSheets) {
                wb.createSheet(other).createRow(0).createCell(0).setCellValue("notes only");
            }
            Sheet sh = wb.createSheet(sheet);
            for (int r = 0; r < rows.size(); r++) {
                Row row = sh.createRow(r + before);
                Object[] cells = rows.get(r);
                for (int c = 0; c < cells.length; c++) {
                    Object v = cells[c];
                    if (v == null) {
                        continue;
                    }
                    Cell cell = row.createCell(c);
                    if (v instanceof Double d) {
                        cell.setCellValue(d);
                    } else if (v instanceof String s) {
                        cell.setCellValue(s);
                    } else if (v instanceof Boolean b) {
                        cell.setCellValue(b);
                    } else if (v instanceof TimeOfDay t) {
                        cell.setCellValue(t.seconds() / 86_400.0);
                        cell.setCellStyle(timeStyle);
                    } else if (v instanceof ErrorCell) {
                        cell.setCellErrorValue(FormulaError.DIV0.getCode());
                    }
                }
            }
            try (OutputStream out = Files.newOutputStream(p)) {
                wb.write(out);
            }
        }
        return p;
    }

    private Path csv(String name, List<Object[]> rows) throws IOException {
        StringBuilder sb = new StringBuilder();
        for (Object[] cells : rows) {
            for (int c = 0; c < cells.length; c++) {
                if (c > 0) {
                    sb.append(',');
                }
                Object v = cells[c];
                if (v instanceof Double d) {
                    sb.append(Double.toString(d));
                } else if (v instanceof Boolean b) {
                    sb.append(b ? '1' : '0');
                } else if (v instanceof TimeOfDay t) {
                    sb.append(t.text());
                } else if (v instanceof ErrorCell) {
                    sb.append("#DIV/0!");
                } else if (v != null) {
                    sb.append(v);
                }
            }
            sb.append('\n');
        }
        Path p = dir.resolve(name);
        Files.writeString(p, sb.toString(), StandardCharsets.UTF_8);
        return p;
    }

    private record Read(ReadReport report, CollectedFrames frames) {
    }

    private Read read(Path file, ReadOptions options) {
        CollectedFrames frames = new CollectedFrames();
        try (RecordedFileSource src = RecordedFiles.open(file, dictionary, options)) {
            return new Read(src.readAll(frames), frames);
        }
    }

    private static void assertSameFrames(CollectedFrames expected, CollectedFrames actual) {
        assertEquals(expected.size(), actual.size(), "frame count");
        for (int i = 0; i < expected.size(); i++) {
            Frame e = expected.get(i);
            Frame a = actual.get(i);
            assertEquals(e.timeNs(), a.timeNs(), "time of frame " + i);
            assertEquals(e.sequence(), a.sequence(), "sequence of frame " + i);
            assertEquals(e.flags(), a.flags(), "flags of frame " + i);
            assertArrayEquals(e.values(), a.values(), "values of frame " + i);
        }
    }

    private static void assertSameCounts(ReadReport expected, ReadReport actual) {
        assertEquals(expected.rowsRead(), actual.rowsRead());
        assertEquals(expected.framesDelivered(), actual.framesDelivered());
        assertEquals(expected.rowsSkippedByReason(), actual.rowsSkippedByReason());
        assertEquals(expected.columns(), actual.columns());
        assertEquals(expected.ignoredColumns(), actual.ignoredColumns());
        assertEquals(expected.missingParameters(), actual.missingParameters());
        assertEquals(expected.timeForm(), actual.timeForm());
        assertEquals(expected.rollovers(), actual.rollovers());
    }

    private static List<Object[]> sortieTable() {
        List<Object[]> rows = new ArrayList<>();
        rows.add(new Object[] {"time", "KCAS [m/s]", "Hp", "NZ", "notes"});
        for (int i = 0; i < 12; i++) {
            Object time = i * 0.125;
            Object kcas = 100.0 + i * 0.3;
            Object hp = i % 3 == 1 ? null : 10_000.0 + i;
            Object nz = 1.0 + i / 100.0;
            switch (i) {
                case 4 -> kcas = "abc";
                case 5 -> hp = "NaN";
                case 6 -> nz = new ErrorCell();
                case 7 -> time = "7x";
                case 8 -> kcas = 9999.0;
                case 9 -> time = 0.75;
                default -> {
                }
            }
            rows.add(new Object[] {time, kcas, hp, nz, i % 2 == 0 ? "text" : null});
        }
        return rows;
    }

    @Test
    void aWorkbookGivesTheSameFramesAndCountsAsTheEquivalentCsv() throws IOException {
        List<Object[]> table = sortieTable();
        Read fromCsv = read(csv("sortie.csv", table), AS_SORTIE);
        Read fromXlsx = read(workbook("sortie.xlsx", "Run 1", 0, table), AS_SORTIE);

        assertSameFrames(fromCsv.frames(), fromXlsx.frames());
        assertSameCounts(fromCsv.report(), fromXlsx.report());

        ReadReport r = fromXlsx.report();
        assertEquals(12, r.rowsRead());
        assertEquals(10, r.framesDelivered());
        assertEquals(1, r.rowsSkipped(SkipReason.BAD_TIME));
        assertEquals(1, r.rowsSkipped(SkipReason.TIME_BACKWARDS), "0.75 s after 1.0 s");
        assertEquals(1, r.nonNumericCells("KCAS"));
        assertEquals(1, r.wildPoints("KCAS"), "9999 m/s is far above 600 kt");
        assertEquals(1, r.nonNumericCells("Hp"));
        assertEquals(3, r.blankCells("Hp"), "rows 1, 4 and 10 delivered with Hp left empty");
        assertEquals(1, r.nonNumericCells("Nz"));
        assertEquals(List.of("notes"), r.ignoredColumns());
        Frame first = fromXlsx.frames().get(0);
        assertEquals(100.0 / (1852.0 / 3600.0), first.value(KCAS), 0.0);
        assertEquals(10_000.0, first.value(HP));
        assertEquals(1.0, first.value(NZ));
        List<String> problems = r.problems().stream().map(Problem::toString).toList();
        assertTrue(problems.contains("sortie.xlsx:6:2: column 'KCAS [m/s]' (cell B6): 'abc' is not a number; cell "
                + "set to NaN"), problems.toString());
        assertTrue(problems.contains("sortie.xlsx:8:4: column 'NZ' (cell D8): '#DIV/0!' is a spreadsheet error; "
                + "cell set to NaN"), problems.toString());
        assertTrue(problems.contains("sortie.xlsx:9:1: time '7x' is not a number of seconds or a time of day; row "
                + "skipped"), problems.toString());
    }

    @Test
    void timeOfDayCellsCrossMidnightLikeTheirCsvText() throws IOException {
        List<Object[]> table = new ArrayList<>();
        table.add(new Object[] {"Time", "KCAS", "NZ"});
        double[] seconds = {86_399.8, 86_399.9, 0.0, 0.1, 0.1, 0.25};
        for (int i = 0; i < seconds.length; i++) {
            table.add(new Object[] {new TimeOfDay(seconds[i]), 150.0 + i, i == 2 ? null : Boolean.TRUE});
        }
        Read fromCsv = read(csv("night.csv", table), AS_SORTIE);
        Read fromXlsx = read(workbook("night.xlsx", "Sheet1", 0, table), AS_SORTIE);
        assertSameFrames(fromCsv.frames(), fromXlsx.frames());
        assertSameCounts(fromCsv.report(), fromXlsx.report());
        long day = TimeText.NS_PER_DAY;
        assertArrayEquals(new long[] {day - 200_000_000L, day - 100_000_000L, day, day + 100_000_000L,
                day + 250_000_000L}, fromXlsx.frames().times());
        assertEquals(1, fromXlsx.report().rollovers());
        assertEquals(1, fromXlsx.report().rowsSkipped(SkipReason.TIME_REPEATED));
        assertEquals(1.0, fromXlsx.frames().get(0).value(NZ), "a true cell reads as 1");
    }

    @Test
    void timeAsTextCellsAndAHeaderBelowEmptyRows() throws IOException {
        List<Object[]> table = new ArrayList<>();
        table.add(new Object[] {"tod", "KCAS"});
        table.add(new Object[] {"12:00:00.5", 100.0});
        table.add(new Object[] {"12:00:01.0", 101.0, null, null, null, null, null, 7.0});
        Path p = workbook("text.xlsx", "data", 2, table);
        Read r = read(p, AS_SORTIE);
        assertEquals(3, r.report().binding().headerLine());
        assertArrayEquals(new long[] {43_200_500_000_000L, 43_201_000_000_000L}, r.frames().times());
        assertArrayEquals(new long[] {1, 2}, r.frames().sequences());
        assertEquals(1, r.report().cellsOutsideHeader());
        assertEquals(List.of("sortie.xlsx:5:8: cell H5 has a value but its column has no header; ignored"),
                r.report().problems().stream().map(Problem::toString).toList());
    }

    @Test
    void aNamedSheetIsReadAndAMissingOneNamesTheSheetsThere() throws IOException {
        List<Object[]> table = new ArrayList<>();
        table.add(new Object[] {"time", "KCAS"});
        table.add(new Object[] {0.0, 120.0});
        Path p = workbook("sheets.xlsx", "Run 1", 0, table, "Notes");
        Read r = read(p, AS_SORTIE.withSheet("run 1"));
        assertEquals(120.0, r.frames().get(0).value(KCAS));
        InputRejectedException e = assertThrows(InputRejectedException.class,
                () -> XlsxSource.open(p, dictionary, AS_SORTIE.withSheet("Run 2")));
        assertEquals("sortie.xlsx: no sheet named 'Run 2'; the workbook has 'Notes', 'Run 1'", e.getMessage());
        InputRejectedException first = assertThrows(InputRejectedException.class,
                () -> XlsxSource.open(p, dictionary, AS_SORTIE));
        assertTrue(first.getMessage().startsWith("sortie.xlsx:1: no time column"), first.getMessage());
    }

    @Test
    void headerUnitMismatchIsRefusedBeforeAnyFrame() throws IOException {
        List<Object[]> table = new ArrayList<>();
        table.add(new Object[] {"time", "Hp [ft]", "KCAS [ft]"});
        table.add(new Object[] {0.0, 1000.0, 250.0});
        Path p = workbook("units.xlsx", "Sheet1", 0, table);
        InputRejectedException e = assertThrows(InputRejectedException.class,
                () -> RecordedFiles.open(p, dictionary, AS_SORTIE));
        assertEquals("sortie.xlsx:1:3: column 'KCAS [ft]' is in ft, but KCAS is a speed (kt)", e.getMessage());
    }

    @Test
    void whatIsNotAWorkbookIsRefused() throws IOException {
        Path text = dir.resolve("fake.xlsx");
        Files.writeString(text, "time,KCAS\n0,1\n");
        assertEquals("sortie.xlsx: not a spreadsheet: not a readable .xlsx workbook (zip of spreadsheet parts)",
                assertThrows(InputRejectedException.class, () -> XlsxSource.open(text, dictionary, AS_SORTIE))
                        .getMessage());
        Path empty = dir.resolve("empty.xlsx");
        Files.write(empty, new byte[0]);
        assertEquals("sortie.xlsx: empty file: not a spreadsheet",
                assertThrows(InputRejectedException.class, () -> XlsxSource.open(empty, dictionary, AS_SORTIE))
                        .getMessage());
        Path old = dir.resolve("old.xlsx");
        try (HSSFWorkbook wb = new HSSFWorkbook(); OutputStream out = Files.newOutputStream(old)) {
            wb.createSheet("s").createRow(0).createCell(0).setCellValue("time");
            wb.write(out);
        }
        assertEquals("sortie.xlsx: this is an old binary Excel (.xls) file; save it as .xlsx or .csv",
                assertThrows(InputRejectedException.class, () -> XlsxSource.open(old, dictionary, AS_SORTIE))
                        .getMessage());
        Path blankSheet = workbook("blank.xlsx", "Sheet1", 0, List.of());
        assertEquals("sortie.xlsx: the sheet is empty: no header row",
                assertThrows(InputRejectedException.class, () -> XlsxSource.open(blankSheet, dictionary, AS_SORTIE))
                        .getMessage());
        assertEquals("sortie.xlsx: cannot read: no such file",
                assertThrows(InputRejectedException.class,
                        () -> XlsxSource.open(dir.resolve("absent.xlsx"), dictionary, AS_SORTIE)).getMessage());
    }

    @Test
    void aFailingSinkIsNotMistakenForADamagedSheet() throws IOException {
        List<Object[]> table = new ArrayList<>();
        table.add(new Object[] {"time", "KCAS"});
        table.add(new Object[] {0.0, 120.0});
        Path p = workbook("sink.xlsx", "Sheet1", 0, table);
        IllegalStateException thrown = new IllegalStateException("sink full");
        try (RecordedFileSource src = RecordedFiles.open(p, dictionary, AS_SORTIE)) {
            assertEquals(thrown, assertThrows(IllegalStateException.class, () -> src.readAll(f -> {
                throw thrown;
            })));
        }
    }

    @Test
    void aLongSheetStreamsEveryRow() throws IOException {
        int n = 5_000;
        List<Object[]> table = new ArrayList<>(n + 1);
        table.add(new Object[] {"time", "KCAS", "Hp"});
        for (int i = 0; i < n; i++) {
            table.add(new Object[] {i * 0.05, 200.0 + i % 50, 12_000.0});
        }
        Read r = read(workbook("long.xlsx", "Sheet1", 0, table), AS_SORTIE);
        assertEquals(n, r.report().framesDelivered());
        assertEquals(0, r.report().rowsSkipped());
        double sum = 0;
        for (double v : r.frames().values(KCAS)) {
            sum += v;
        }
        assertEquals(n * 200.0 + (n / 50) * (49 * 50 / 2.0), sum, 0.0);
        assertEquals((n - 1) * 50_000_000L, r.frames().get(n - 1).timeNs());
    }
}
