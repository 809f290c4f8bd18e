package org.pointcall.ingest.file;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.pointcall.ingest.file.SortieDictionary.AOA;
import static org.pointcall.ingest.file.SortieDictionary.HP;
import static org.pointcall.ingest.file.SortieDictionary.KCAS;
import static org.pointcall.ingest.file.SortieDictionary.NZ;
import static org.pointcall.ingest.file.SortieDictionary.OAT;
import static org.pointcall.ingest.file.SortieDictionary.PS;

import java.io.IOException;
import java.nio.charset.Charset;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.pointcall.ingest.frame.Frame;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.InputRejectedException;
import org.pointcall.shared.error.Problem;
import org.pointcall.shared.units.Units;

class CsvSourceTest {
    private static final long S = 1_000_000_000L;
    private static final ReadOptions AS_SORTIE = ReadOptions.DEFAULTS.withSourceName("sortie.csv");

    @TempDir
    Path dir;

    private final ParameterDictionary dictionary = SortieDictionary.create();

    private Path write(String name, String content) throws IOException {
        Path p = dir.resolve(name);
        Files.writeString(p, content, StandardCharsets.UTF_8);
        return p;
    }

    private ReadReport read(Path file, ReadOptions options, CollectedFrames frames) {
        try (CsvSource src = CsvSource.open(file, dictionary, options)) {
            return src.readAll(frames);
        }
    }

    private List<String> problems(ReadReport r) {
        return r.problems().stream().map(Problem::toString).toList();
    }

    private InputRejectedException rejected(Path file, ReadOptions options) {
        return assertThrows(InputRejectedException.class, () -> CsvSource.open(file, dictionary, options));
    }

    @Test
    void userColumnNamesBindExactlyFirstThenIgnoringCaseAndBlanks() throws IOException {
        Path f = write("names.csv", "time,KCAS,Hp,alpha_deg, nz ,comment\n0.0,250,10000,4.5,1.02,climb\n");
        CollectedFrames frames = new CollectedFrames();
        ReadReport r = read(f, AS_SORTIE, frames);

        assertEquals(1, frames.size());
        Frame fr = frames.get(0);
        assertEquals(250.0, fr.value(KCAS));
        assertEquals(10000.0, fr.value(HP));
        assertEquals(4.5, fr.value(AOA));
        assertEquals(1.02, fr.value(NZ), "'nz ' binds to the column NZ ignoring case and blanks");
        assertEquals(List.of("comment"), r.ignoredColumns());
        // KTAS is derived: it is computed downstream, so its absence is not reported
        assertEquals(List.of("OAT", "Mach", "Ps"), r.missingParameters());
        assertTrue(Double.isNaN(fr.value(OAT)), "a parameter absent from the file is NaN");
        assertEquals(List.of("KCAS", "Hp", "AoA", "Nz"),
                r.binding().columns().stream().map(BoundColumn::parameter).toList());
    }

    @Test
    void anExactMatchWinsOverACaseInsensitiveOne() throws IOException {
        Path f = write("twice.csv", "time,kcas,KCAS\n0,100,200\n");
        CollectedFrames frames = new CollectedFrames();
        ReadReport r = read(f, AS_SORTIE, frames);
        assertEquals(200.0, frames.get(0).value(KCAS));
        assertEquals(List.of("kcas (KCAS is already read from column 'KCAS')"), r.ignoredColumns());
    }

    @Test
    void theSameColumnTwiceIsRefused() throws IOException {
        Path f = write("dup.csv", "time,KCAS,KCAS\n0,100,200\n");
        InputRejectedException e = rejected(f, AS_SORTIE);
        assertEquals("sortie.csv:1:11: column 'KCAS' repeats column 'KCAS' at 6: both would feed KCAS; remove or "
                + "rename one", e.getMessage());
    }

    @Test
    void unitInHeaderIsConvertedToTheDictionaryUnit() throws IOException {
        double mps = 102.88888888888889;
        Path f = write("si.csv", "time [s],KCAS [m/s],Hp (m),OAT [K],alpha_deg [rad]\n0," + mps + ",3048,288.15,0.1\n");
        CollectedFrames frames = new CollectedFrames();
        read(f, AS_SORTIE, frames);
        Frame fr = frames.get(0);
        // 1 kt = 1852/3600 m/s exactly (NIST SP 811, 2008, B.8): 102.88888888888889 m/s is 200 kt to the 17
        // digits printed; the conversion is one division, so it equals the quotient exactly
        assertEquals(mps / (1852.0 / 3600.0), fr.value(KCAS), 0.0);
        assertEquals(200.0, fr.value(KCAS), 1e-12);
        // 1 ft = 0.3048 m exactly (NIST SP 811, 2008, B.8); tolerance: rounding of one division
        assertEquals(10000.0, fr.value(HP), 1e-9);
        // 0 degC = 273.15 K exactly (SI Brochure, 9th ed.)
        assertEquals(15.0, fr.value(OAT), 1e-12);
        // 1 deg = pi/180 rad exactly (SI Brochure, 9th ed., Table 8)
        assertEquals(0.1 * 180.0 / Math.PI, fr.value(AOA), 1e-12);
    }

    @Test
    void unitMismatchRejectsTheFileWithOneClearLine() throws IOException {
        Path f = write("mismatch.csv", "time,Hp [ft],KCAS [ft]\n0,1000,250\n");
        InputRejectedException e = rejected(f, AS_SORTIE);
        assertEquals(1, e.problems().size());
        assertEquals("sortie.csv:1:14: column 'KCAS [ft]' is in ft, but KCAS is a speed (kt)", e.getMessage());
    }

    @Test
    void everyHeaderProblemIsReportedAtOnce() throws IOException {
        Path f = write("many.csv", "t [kt];KCAS [deg];Hp [furlong];PS_COUNTS [hPa]\n0;1;2;3\n");
        InputRejectedException e = rejected(f, AS_SORTIE);
        List<String> p = e.problems().stream().sorted().map(Problem::toString).toList();
        assertEquals(4, p.size(), p.toString());
        assertEquals("sortie.csv:1:1: time column 't [kt]' is in kt, but time must be in s, ms, us, ns, min or h",
                p.get(0));
        assertEquals("sortie.csv:1:8: column 'KCAS [deg]' is in deg, but KCAS is a speed (kt)", p.get(1));
        assertTrue(p.get(2).startsWith("sortie.csv:1:19: column 'Hp [furlong]': 'furlong' is not a unit pointcall "
                + "knows ("), p.get(2));
        assertEquals("sortie.csv:1:32: column 'PS_COUNTS [hPa]' is in hPa, but Ps has a calibration from raw values "
                + "to Pa; remove the unit from the header if the column holds raw values", p.get(3));
    }

    @Test
    void noTimeColumnIsRefused() throws IOException {
        Path f = write("notime.csv", "clock,KCAS\n0,100\n");
        InputRejectedException e = rejected(f, AS_SORTIE);
        assertTrue(e.getMessage().startsWith("sortie.csv:1: no time column: no column is named time, t, timestamp"),
                e.getMessage());
        CollectedFrames frames = new CollectedFrames();
        ReadReport r = read(f, AS_SORTIE.withTimeColumn("CLOCK"), frames);
        assertEquals(1, r.framesDelivered());
        InputRejectedException named = rejected(f, AS_SORTIE.withTimeColumn("utc"));
        assertEquals("sortie.csv:1: no column 'utc' for the time; the header has 'clock', 'KCAS'",
                named.getMessage());
    }

    @Test
    void aFileWithoutAnyDictionaryColumnIsRefused() throws IOException {
        Path f = write("foreign.csv", "time,lat,lon\n0,1,2\n");
        InputRejectedException e = rejected(f, AS_SORTIE);
        assertEquals("sortie.csv:1: none of the columns is a parameter of dictionary 'test-airframe': the header has "
                + "'time', 'lat', 'lon', the dictionary reads 'KCAS', 'Hp', 'alpha_deg', 'NZ', 'OAT', 'Mach', "
                + "'PS_COUNTS'", e.getMessage());
    }

    @Test
    void emptyFileAndBlankFileAreRefused() throws IOException {
        assertEquals("sortie.csv: empty file: no header row", rejected(write("empty.csv", ""), AS_SORTIE)
                .getMessage());
        assertEquals("sortie.csv: empty file: no header row", rejected(write("blank.csv", "\n  \n\r\n"), AS_SORTIE)
                .getMessage());
    }

    @Test
    void headerOnlyDeliversNothingAndSaysSo() throws IOException {
        Path f = write("header.csv", "time,KCAS\n");
        CollectedFrames frames = new CollectedFrames();
        ReadReport r = read(f, AS_SORTIE, frames);
        assertEquals(0, r.rowsRead());
        assertEquals(0, r.framesDelivered());
        assertEquals(null, r.timeForm());
        assertEquals("sortie.csv: 0 data rows read, 0 frames delivered, 0 skipped", r.lines().get(0));
        assertEquals("  time: column 'time', no row with a readable time", r.lines().get(1));
    }

    @Test
    void unreadableFilesAreRefused() throws IOException {
        assertEquals("sortie.csv: cannot read: no such file",
                rejected(dir.resolve("absent.csv"), AS_SORTIE).getMessage());
        assertEquals("sortie.csv: is a directory, not a file", rejected(dir, AS_SORTIE).getMessage());
        Path zip = dir.resolve("book.csv");
        Files.write(zip, new byte[] {'P', 'K', 3, 4, 20, 0, 0, 0});
        assertTrue(rejected(zip, AS_SORTIE).getMessage().startsWith("sortie.csv: this is a zip archive"));
        Path bin = dir.resolve("bin.csv");
        Files.write(bin, new byte[] {'t', 'i', 'm', 'e', 0, 1, 2, '\n'});
        assertEquals("sortie.csv:1: binary data in the first line: not a CSV text file",
                rejected(bin, AS_SORTIE).getMessage());
    }

    @Test
    void byteOrderMarkIsNotPartOfTheFirstColumn() throws IOException {
        Path f = dir.resolve("bom.csv");
        byte[] body = "time,KCAS\n0.5,101\n".getBytes(StandardCharsets.UTF_8);
        byte[] bytes = new byte[body.length + 3];
        bytes[0] = (byte) 0xEF;
        bytes[1] = (byte) 0xBB;
        bytes[2] = (byte) 0xBF;
        System.arraycopy(body, 0, bytes, 3, body.length);
        Files.write(f, bytes);
        CollectedFrames frames = new CollectedFrames();
        ReadReport r = read(f, AS_SORTIE, frames);
        assertEquals("time", r.binding().timeHeader());
        assertEquals(500_000_000L, frames.get(0).timeNs());
        assertEquals(101.0, frames.get(0).value(KCAS));
    }

    @Test
    void utf16WithByteOrderMarkAndWindows1252AreRead() throws IOException {
        Path u16 = dir.resolve("u16.csv");
        byte[] body = "time\tOAT [\u00b0C]\tKCAS\n1\t-5.5\t99\n".getBytes(StandardCharsets.UTF_16LE);
        byte[] bytes = new byte[body.length + 2];
        bytes[0] = (byte) 0xFF;
        bytes[1] = (byte) 0xFE;
        System.arraycopy(body, 0, bytes, 2, body.length);
        Files.write(u16, bytes);
        CollectedFrames a = new CollectedFrames();
        read(u16, AS_SORTIE, a);
        assertEquals(-5.5, a.get(0).value(OAT));

        Path cp = dir.resolve("cp1252.csv");
        Files.write(cp, "time;OAT [\u00b0C];KCAS\n1;-5,5;99\n".getBytes(Charset.forName("windows-1252")));
        CollectedFrames b = new CollectedFrames();
        read(cp, AS_SORTIE, b);
        assertEquals(-5.5, b.get(0).value(OAT));
        assertEquals(99.0, b.get(0).value(KCAS));
    }

    @Test
    void semicolonSeparatedWithDecimalComma() throws IOException {
        Path f = write("eu.csv", "time;KCAS;Hp\n0,0;120,5;1000\n0,1;121,25;1001,5\n");
        CollectedFrames frames = new CollectedFrames();
        ReadReport r = read(f, AS_SORTIE, frames);
        assertEquals(2, r.framesDelivered());
        assertArrayEquals(new long[] {0L, 100_000_000L}, frames.times());
        assertArrayEquals(new double[] {120.5, 121.25}, frames.values(KCAS));
        assertArrayEquals(new double[] {1000.0, 1001.5}, frames.values(HP));
    }

    @Test
    void quotedFieldsMayHoldSeparatorsAndQuotes() throws IOException {
        Path f = write("quoted.csv", "\"time\",\"KCAS [kt]\",\"note, with comma\"\n"
                + "0.0,\"150.5\",\"a \"\"quoted\"\" note, yes\"\n"
                + " 0.1 , \"151\" ,plain\n");
        CollectedFrames frames = new CollectedFrames();
        ReadReport r = read(f, AS_SORTIE, frames);
        assertEquals(List.of("note, with comma"), r.ignoredColumns());
        assertArrayEquals(new double[] {150.5, 151.0}, frames.values(KCAS));
        assertEquals(0, r.rowsSkipped());
    }

    @Test
    void badLinesAreSkippedCountedAndNamedWhileTheGoodDataAroundIsKept() throws IOException {
        Path f = write("bad.csv", String.join("\n",
                "time,KCAS,Hp",          // line 1
                "0.0,200,1000",          // 2  data row 1
                "0.1,201",               // 3  row 2: truncated
                "0.2,202,1002,99",       // 4  row 3: too many cells
                "#~garbage~#",           // 5  row 4: one cell, truncated
                "x1y,203,1003",          // 6  row 5: time not a number
                "NaN,204,1004",          // 7  row 6: time NaN
                "0.3,NaN,1005",          // 8  row 7: value NaN -> cell NaN, row kept
                "0.4,Inf,-inf",          // 9  row 8: values Inf -> NaN, row kept
                "0.5,abc,1007",          // 10 row 9: value text -> NaN
                "0.6,\"206,1006",        // 11 row 10: unclosed quote
                ",207,1007",             // 12 row 11: no time
                "",                      // 13 blank
                "0.7,208,1008",          // 14 row 12
                "0.8,209,100"));         // 15 row 13, last line cut short (no line end)
        CollectedFrames frames = new CollectedFrames();
        ReadReport r = read(f, AS_SORTIE, frames);

        assertEquals(13, r.rowsRead());
        assertEquals(6, r.framesDelivered());
        assertEquals(7, r.rowsSkipped());
        assertEquals(Map.of(SkipReason.TOO_FEW_CELLS, 2L, SkipReason.TOO_MANY_CELLS, 1L, SkipReason.BAD_TIME, 2L,
                SkipReason.UNCLOSED_QUOTE, 1L, SkipReason.NO_TIME, 1L), r.rowsSkippedByReason());
        assertEquals(1, r.blankLines());
        assertEquals(3, r.nonNumericCells("KCAS"));
        assertEquals(1, r.nonNumericCells("Hp"));
        assertEquals(0, r.blankCells("KCAS"));

        assertArrayEquals(new long[] {1, 7, 8, 9, 12, 13}, frames.sequences(), "sequence = data row number");
        assertArrayEquals(new long[] {0, 300_000_000L, 400_000_000L, 500_000_000L, 700_000_000L, 800_000_000L},
                frames.times());
        assertEquals(200.0, frames.get(0).value(KCAS));
        assertTrue(Double.isNaN(frames.get(1).value(KCAS)));
        assertEquals(1005.0, frames.get(1).value(HP));
        assertTrue(Double.isNaN(frames.get(2).value(HP)));
        assertEquals(208.0, frames.get(4).value(KCAS));
        assertEquals(100.0, frames.get(5).value(HP), "a cut last line with every cell is still read");
        assertFalse(frames.get(0).hasFlag(Frame.GAP_BEFORE));
        assertTrue(frames.get(1).hasFlag(Frame.GAP_BEFORE), "rows were skipped just before");
        assertFalse(frames.get(2).hasFlag(Frame.GAP_BEFORE));
        assertTrue(frames.get(4).hasFlag(Frame.GAP_BEFORE));
        assertTrue(frames.reusedOneFrame());

        assertEquals(List.of(
                "sortie.csv:3: truncated line: 2 of 3 cells; row skipped",
                "sortie.csv:4: too many cells: 4, the header has 3; row skipped",
                "sortie.csv:5: truncated line: 1 of 3 cells; row skipped",
                "sortie.csv:6:1: time 'x1y' is not a number of seconds or a time of day; row skipped",
                "sortie.csv:7:1: time 'NaN' is not a finite number; row skipped",
                "sortie.csv:8:5: column 'KCAS': 'NaN' is not a finite number; cell set to NaN",
                "sortie.csv:9:5: column 'KCAS': 'Inf' is not a finite number; cell set to NaN",
                "sortie.csv:9:9: column 'Hp': '-inf' is not a finite number; cell set to NaN",
                "sortie.csv:10:5: column 'KCAS': 'abc' is not a number; cell set to NaN",
                "sortie.csv:11: unclosed quote; row skipped",
                "sortie.csv:12:1: no time in column 'time'; row skipped"), problems(r));
    }

    @Test
    void timeGoingBackwardsOrRepeatingIsSkippedNotReordered() throws IOException {
        Path f = write("order.csv", String.join("\n",
                "time,KCAS",
                "12.2,1",
                "12.4,2",
                "12.3,3",     // backwards
                "12.4,4",     // repeat of the last delivered time
                "12.5,5",
                "12.5,6",     // repeat
                "12.45,7",    // backwards
                "12.6,8", ""));
        CollectedFrames frames = new CollectedFrames();
        ReadReport r = read(f, AS_SORTIE, frames);
        assertArrayEquals(new double[] {1, 2, 5, 8}, frames.values(KCAS));
        assertEquals(2, r.rowsSkipped(SkipReason.TIME_BACKWARDS));
        assertEquals(2, r.rowsSkipped(SkipReason.TIME_REPEATED));
        assertEquals(List.of(
                "sortie.csv:4: time goes backwards (12.300 s after 12.400 s); row skipped",
                "sortie.csv:5: time repeats (12.400 s); row skipped",
                "sortie.csv:7: time repeats (12.500 s); row skipped",
                "sortie.csv:8: time goes backwards (12.450 s after 12.500 s); row skipped"), problems(r));
        for (int i = 1; i < frames.size(); i++) {
            assertTrue(frames.get(i).timeNs() > frames.get(i - 1).timeNs());
        }
    }

    @Test
    void timeOfDayCrossesMidnight() throws IOException {
        Path f = write("night.csv", "Time,KCAS\n23:59:59.800,1\n23:59:59.900,2\n00:00:00.000,3\n00:00:00.100,4\n"
                + "23:59:59.950,5\n");
        CollectedFrames frames = new CollectedFrames();
        ReadReport r = read(f, AS_SORTIE, frames);
        long day = 86_400 * S;
        assertArrayEquals(new long[] {day - 200_000_000L, day - 100_000_000L, day, day + 100_000_000L},
                frames.times());
        assertEquals(TimeForm.TIME_OF_DAY, r.timeForm());
        assertEquals(1, r.rollovers());
        // an hour-scale step back after midnight is a step back, not another day
        assertEquals(List.of("sortie.csv:6: time goes backwards (23:59:59.950 after 00:00:00.100); row skipped"),
                problems(r));
        assertEquals("  time: column 'Time' (time of day), 23:59:59.800 to 00:00:00.100, crossing 1 midnight",
                r.lines().get(1));
    }

    @Test
    void dayOfYearTimeCrossesTheNewYear() throws IOException {
        Path f = write("irig.csv", "IRIG Time,KCAS\n365:23:59:59.500,1\n001:00:00:00.500,2\n001:00:00:01.000,3\n");
        CollectedFrames frames = new CollectedFrames();
        ReadReport r = read(f, AS_SORTIE, frames);
        long t0 = 364 * TimeText.NS_PER_DAY + 86_399_500_000_000L;
        assertArrayEquals(new long[] {t0, t0 + S, t0 + 1_500_000_000L}, frames.times());
        assertEquals(TimeForm.DAY_OF_YEAR_TIME, r.timeForm());
        assertEquals(1, r.rollovers());
    }

    @Test
    void aTimeInAnotherFormThanTheFirstRowsIsSkipped() throws IOException {
        Path f = write("forms.csv", "time,KCAS\n12:00:00,1\n43201,2\n12:00:02,3\n");
        CollectedFrames frames = new CollectedFrames();
        ReadReport r = read(f, AS_SORTIE, frames);
        assertEquals(2, r.framesDelivered());
        assertEquals(List.of("sortie.csv:3:1: time '43201' is a seconds, but earlier rows give a time of day; row "
                + "skipped"), problems(r));
    }

    @Test
    void secondsKeepNanosecondsAndOtherUnitsOfTimeAreScaled() throws IOException {
        Path abs = write("epoch.csv", "t,KCAS\n1700000000.123456789,1\n1700000000.123456790,2\n");
        CollectedFrames a = new CollectedFrames();
        read(abs, AS_SORTIE, a);
        assertArrayEquals(new long[] {1_700_000_000_123_456_789L, 1_700_000_000_123_456_790L}, a.times());

        Path ms = write("ms.csv", "time [ms],KCAS\n0,1\n12.5,2\n");
        CollectedFrames b = new CollectedFrames();
        ReadReport r = read(ms, AS_SORTIE, b);
        assertArrayEquals(new long[] {0L, 12_500_000L}, b.times());
        assertEquals("ms", r.binding().timeUnit());
    }

    @Test
    void mixedRatesLeaveUnsampledCellsNaNAndCountThem() throws IOException {
        StringBuilder sb = new StringBuilder("time,KCAS,alpha_deg,OAT\n");
        // AoA at 4x the rate of KCAS, OAT once
        for (int i = 0; i < 8; i++) {
            sb.append(i * 0.025).append(',').append(i % 4 == 0 ? "150" : "").append(',').append(2.0 + i)
                    .append(',').append(i == 0 ? "-10" : "").append('\n');
        }
        Path f = write("rates.csv", sb.toString());
        CollectedFrames frames = new CollectedFrames();
        ReadReport r = read(f, AS_SORTIE, frames);
        assertEquals(8, r.framesDelivered());
        assertEquals(6, r.blankCells("KCAS"));
        assertEquals(0, r.blankCells("AoA"));
        assertEquals(7, r.blankCells("OAT"));
        double[] kcas = frames.values(KCAS);
        assertEquals(150.0, kcas[0]);
        assertTrue(Double.isNaN(kcas[1]));
        assertEquals(150.0, kcas[4]);
        assertEquals(9.0, frames.get(7).value(AOA));
        assertTrue(r.problems().isEmpty(), "unsampled cells are not problems");
    }

    @Test
    void calibrationIsAppliedAndWildPointsAreDroppedFlaggedAndCounted() throws IOException {
        Path f = write("wild.csv", "time,KCAS,PS_COUNTS\n0,100,50000\n0.1,9999,50001\n0.2,-1,70000\n0.3,101,10\n");
        CollectedFrames frames = new CollectedFrames();
        ReadReport r = read(f, AS_SORTIE, frames);
        // Ps = 100 + 2 counts (the dictionary's polynomial)
        // 70000 counts give 140100 Pa, above the valid 120000 Pa: a wild point
        assertArrayEquals(new double[] {100_100.0, 100_102.0, Double.NaN, 120.0}, frames.values(PS));
        assertTrue(Double.isNaN(frames.get(1).value(KCAS)));
        assertTrue(Double.isNaN(frames.get(2).value(KCAS)));
        assertFalse(frames.get(0).hasFlag(Frame.WILD_POINT));
        assertTrue(frames.get(1).hasFlag(Frame.WILD_POINT));
        assertTrue(frames.get(2).hasFlag(Frame.WILD_POINT));
        assertEquals(2, r.wildPoints("KCAS"));
        assertEquals(1, r.wildPoints("Ps"));
        assertEquals(3, r.wildPoints());
        assertEquals("sortie.csv:3:5: column 'KCAS': KCAS = 9999 kt is outside its valid range [0, 600] kt; "
                + "wild point set to NaN", r.problems().get(0).toString());
    }

    @Test
    void problemsAreRateLimitedButCountedExactly() throws IOException {
        StringBuilder sb = new StringBuilder("time,KCAS\n");
        for (int i = 0; i < 100; i++) {
            sb.append(i).append(",100\n").append("garbage\n").append(i + 0.5).append(",bad\n");
        }
        Path f = write("flood.csv", sb.toString());
        CollectedFrames frames = new CollectedFrames();
        ReadReport r = read(f, AS_SORTIE.withProblemLimit(5), frames);
        assertEquals(300, r.rowsRead());
        assertEquals(200, r.framesDelivered());
        assertEquals(100, r.rowsSkipped(SkipReason.TOO_FEW_CELLS));
        assertEquals(100, r.nonNumericCells("KCAS"));
        assertEquals(10, r.problems().size());
        assertEquals(190, r.problemsNotKept());
        assertTrue(r.lines().contains("  190 more problems counted above but not listed"), r.lines().toString());
    }

    @Test
    void reportPrintsItselfAsPlainLines() throws IOException {
        Path f = write("report.csv", "time,KCAS,Hp,extra\n0,100,,x\n0.5,abc,1000,y\nbad\n1.0,700,1001,z\n");
        CollectedFrames frames = new CollectedFrames();
        ReadReport r = read(f, AS_SORTIE, frames);
        assertEquals(List.of(
                "sortie.csv: 4 data rows read, 3 frames delivered, 1 skipped",
                "  time: column 'time' (seconds), 0.000 s to 1.000 s",
                "  skipped, truncated line: 1",
                "  KCAS (column 'KCAS'): 1 not a number, 1 wild point, set to NaN",
                "  Hp (column 'Hp'): 1 blank, set to NaN",
                "  ignored, not in the dictionary (1): extra",
                "  not in the file, NaN throughout (5): AoA, Nz, OAT, Mach, Ps"), r.lines());
    }

    @Test
    void crLfLineEndsAndAMissingLastLineEndAreFine() throws IOException {
        Path f = write("crlf.csv", "time,KCAS\r\n0,1\r\n1,2\r\n\r\n2,3");
        CollectedFrames frames = new CollectedFrames();
        ReadReport r = read(f, AS_SORTIE, frames);
        assertArrayEquals(new double[] {1, 2, 3}, frames.values(KCAS));
        assertEquals(1, r.blankLines());
    }

    @Test
    void anEndlessLineIsCutSkippedAndCounted() throws IOException {
        StringBuilder sb = new StringBuilder("time,KCAS\n0,1\n");
        sb.append("9".repeat(CsvSource.MAX_LINE_CHARS + 10)).append('\n').append("1,2\n");
        Path f = write("long.csv", sb.toString());
        CollectedFrames frames = new CollectedFrames();
        ReadReport r = read(f, AS_SORTIE, frames);
        assertArrayEquals(new double[] {1, 2}, frames.values(KCAS));
        assertEquals(1, r.rowsSkipped(SkipReason.LINE_TOO_LONG));
        assertEquals("sortie.csv:3: line longer than 1048576 characters; row skipped", problems(r).get(0));
    }

    @Test
    void stopEndsTheReadAfterTheCurrentRow() throws IOException {
        StringBuilder sb = new StringBuilder("time,KCAS\n");
        for (int i = 0; i < 100; i++) {
            sb.append(i).append(",1\n");
        }
        Path f = write("stop.csv", sb.toString());
        try (CsvSource src = CsvSource.open(f, dictionary, AS_SORTIE)) {
            int[] n = {0};
            ReadReport r = src.readAll(frame -> {
                if (++n[0] == 10) {
                    src.stop();
                }
            });
            assertEquals(10, r.framesDelivered());
            assertFalse(r.complete());
            assertTrue(r.lines().get(0).endsWith("READING STOPPED BEFORE THE END OF THE FILE"));
            assertThrows(IllegalStateException.class, () -> src.readAll(frame -> { }));
        }
    }

    @Test
    void everyCountAddsUpOnALargeFileWhichStreamsInBoundedMemory() throws IOException {
        int rows = 200_000;
        Path f = dir.resolve("large.csv");
        try (var w = Files.newBufferedWriter(f)) {
            w.write("time,KCAS,Hp,alpha_deg,NZ,OAT,Mach,PS_COUNTS,notes\n");
            for (int i = 0; i < rows; i++) {
                if (i % 50_000 == 49_999) {
                    w.write("corrupt line\n");
                }
                int centis = (i % 20) * 5;
                w.write(i / 20 + (centis < 10 ? ".0" : ".") + centis + "," + (200 + i % 100) + ".25,"
                        + (10000 + i % 1000) + ",4.125,1.0" + (i % 10) + ",-12.5,0.61" + (i % 7)
                        + ",45000,comment text for width\n");
            }
        }
        long fileBytes = Files.size(f);
        java.lang.management.MemoryMXBean mem = java.lang.management.ManagementFactory.getMemoryMXBean();
        System.gc();
        long before = mem.getHeapMemoryUsage().getUsed();
        com.sun.management.ThreadMXBean threads =
                (com.sun.management.ThreadMXBean) java.lang.management.ManagementFactory.getThreadMXBean();
        long allocatedBefore = threads.getThreadAllocatedBytes(Thread.currentThread().getId());
        long[] during = {0};
        long[] count = {0};
        double[] sum = {0};
        ReadReport r;
        try (CsvSource src = CsvSource.open(f, dictionary, AS_SORTIE)) {
            r = src.readAll(frame -> {
                count[0]++;
                sum[0] += frame.value(KCAS);
                if (count[0] == rows / 2) {
                    System.gc();
                    during[0] = mem.getHeapMemoryUsage().getUsed();
                }
            });
        }
        long allocated = threads.getThreadAllocatedBytes(Thread.currentThread().getId()) - allocatedBefore;
        assertEquals(rows + 4, r.rowsRead());
        assertEquals(rows, r.framesDelivered());
        assertEquals(rows, count[0]);
        assertEquals(4, r.rowsSkipped(SkipReason.TOO_FEW_CELLS));
        double expected = 0;
        for (int i = 0; i < rows; i++) {
            expected += 200 + i % 100 + 0.25;
        }
        assertEquals(expected, sum[0], 0.0, "every value arrived once");
        // held in memory the file would take at least its size on the heap; the reader keeps a line buffer
        assertTrue(during[0] - before < fileBytes / 4, "heap grew by " + (during[0] - before) + " B reading a "
                + fileBytes + " B file");
        // a string per line alone would allocate more than the file's size; the reader reuses one line buffer
        // (about 0.3 MB in all were measured for this file, buffers and report included)
        if (allocatedBefore >= 0) {
            assertTrue(allocated < fileBytes / 4, allocated + " B allocated reading a " + fileBytes + " B file");
        }
    }
}
