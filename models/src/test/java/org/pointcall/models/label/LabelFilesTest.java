package org.pointcall.models.label;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.pointcall.ingest.file.TimeForm;
import org.pointcall.shared.error.InputRejectedException;
import org.pointcall.shared.error.Problem;
import org.pointcall.shared.kind.ManoeuvreKind;

class LabelFilesTest {
    private static final long S = 1_000_000_000L;

    @Test
    void readsSecondsWithCommentsQuotesAndAnyColumnOrder(@TempDir Path dir) throws IOException {
        Path file = dir.resolve("sortie-12.labels.csv");
        Files.writeString(file, "\uFEFF# sortie 12, labelled from the card\r\n"
                + "begin,END,kind,note,card_id\r\n"
                + "\r\n"
                + "300.25,341,loop,\"entry fast, 5 kt; \"\"firm\"\" pull\",L-02\r\n"
                + "120,150.5,stall-level,,S-01\r\n"
                + "# a repeat\r\n"
                + "150.5,170,stall-level,touching the previous one,S-01-R1\r\n", StandardCharsets.UTF_8);
        Labels labels = LabelFiles.load(file);

        assertEquals(TimeForm.SECONDS, labels.timeForm());
        assertEquals(3, labels.size());
        LabelInterval first = labels.interval(0);
        assertEquals(ManoeuvreKind.STALL_LEVEL, first.kind());
        assertEquals(120 * S, first.beginNs());
        assertEquals(150 * S + S / 2, first.endNs());
        assertEquals("S-01", first.cardId());
        assertEquals(5, first.line());
        LabelInterval loop = labels.interval(2);
        assertEquals("entry fast, 5 kt; \"firm\" pull", loop.note());
        assertEquals(300 * S + S / 4, loop.beginNs());

        // [begin, end): the begin instant is in, the end instant is the next interval's or none
        assertNull(labels.kindAt(120 * S - 1));
        assertEquals(ManoeuvreKind.STALL_LEVEL, labels.kindAt(120 * S));
        assertEquals(0, labels.indexAt(150 * S + S / 2 - 1));
        assertEquals(1, labels.indexAt(150 * S + S / 2));
        assertEquals(-1, labels.indexAt(170 * S));
        assertEquals(ManoeuvreKind.LOOP, labels.kindAt(340 * S));
        assertNull(labels.kindAt(341 * S));
        assertEquals((30 * S + S / 2) + (19 * S + S / 2) + (40 * S + 3 * S / 4), labels.labelledNs());
    }

    @Test
    void timesOfDayCrossMidnightInFileOrder() {
        Labels labels = LabelFiles.parse("kind,begin,end\n"
                + "wind-up-turn,23:58:10.5,23:59:40\n"
                + "aileron-roll,23:59:50,00:00:05.125\n"
                + "phugoid,00:10:00,00:14:00\n", "night.csv");
        assertEquals(TimeForm.TIME_OF_DAY, labels.timeForm());
        long day = 86_400 * S;
        assertEquals((23 * 3600 + 58 * 60 + 10) * S + S / 2, labels.interval(0).beginNs());
        assertEquals(day + 5 * S + S / 8, labels.interval(1).endNs());
        assertEquals(day + 600 * S, labels.interval(2).beginNs());
    }

    @Test
    void dayOfYearTimesCountFromTheFirstOfJanuary() {
        Labels labels = LabelFiles.parse("kind,begin,end\nsideslip,045:10:00:00,045:10:02:30.5\n", "doy.csv");
        assertEquals(TimeForm.DAY_OF_YEAR_TIME, labels.timeForm());
        assertEquals(44 * 86_400 * S + 36_000 * S, labels.interval(0).beginNs());
    }

    @Test
    void reportsEveryProblemAtOnceWithLineAndColumn() {
        String text = "kind,begin,end,card_id\n"            // line 1
                + "stall-level,100,130,S-01\n"               // 2: good
                + "stal-level,200,230,S-02\n"                // 3: unknown kind, column 1
                + "loop,300,290,L-01\n"                      // 4: end before begin, end at column 10
                + "loop,120,140,L-02\n"                      // 5: overlaps line 2, begin at column 6
                + "sideslip,4x0,500,X-01\n"                  // 6: bad number, column 10
                + "phugoid,600,700,S-01\n"                   // 7: duplicate card id, column 17
                + "phugoid,800\n";                           // 8: end missing
        InputRejectedException e = assertThrows(InputRejectedException.class,
                () -> LabelFiles.parse(text, "bad.csv"));
        List<Problem> p = e.problems().stream().sorted().toList();
        assertEquals(6, p.size(), e.getMessage());
        assertProblem(p.get(0), 3, 1, "unknown kind 'stal-level'; kinds are stall-level, stall-turn, loop,");
        assertTrue(p.get(0).message().contains("stabilised"), "lists every key: " + p.get(0));
        assertProblem(p.get(1), 4, 10, "end 290.000 s is not after begin 300.000 s");
        assertProblem(p.get(2), 5, 6, "loop 120.000 s to 140.000 s overlaps the stall-level interval of line 2");
        assertProblem(p.get(3), 6, 10, "begin '4x0' is not a number of seconds");
        assertProblem(p.get(4), 7, 17, "card id 'S-01' already labels line 2");
        assertProblem(p.get(5), 8, 12, "end is empty");
        assertTrue(e.getMessage().startsWith("bad.csv:3:1: unknown kind"), e.getMessage());
    }

    private static void assertProblem(Problem p, int line, int column, String start) {
        assertEquals(line, p.line(), p.toString());
        assertEquals(column, p.column(), p.toString());
        assertTrue(p.message().startsWith(start), p.toString());
    }

    @Test
    void missingAndUnknownColumnsRefuseTheHeader() {
        InputRejectedException e = assertThrows(InputRejectedException.class,
                () -> LabelFiles.parse("kind,start,end,cardid\nloop,1,2,x\n", "cols.csv"));
        List<Problem> p = e.problems().stream().sorted().toList();
        assertEquals(3, p.size(), e.getMessage());
        assertProblem(p.get(0), 1, 0, "missing column 'begin'");
        assertProblem(p.get(1), 1, 6, "unknown column 'start'");
        assertProblem(p.get(2), 1, 16, "unknown column 'cardid'");
    }

    @Test
    void oneTimeFormThroughout() {
        InputRejectedException e = assertThrows(InputRejectedException.class,
                () -> LabelFiles.parse("kind,begin,end\nloop,100,160\nloop,00:05:00,00:06:00\n", "mixed.csv"));
        assertEquals(2, e.problems().size(), e.getMessage());
        assertTrue(e.problems().get(0).message().contains("time of day but line 2 gives seconds"), e.getMessage());
    }

    @Test
    void noneIsNotWrittenAndEmptyFilesAreRefused() {
        InputRejectedException none = assertThrows(InputRejectedException.class,
                () -> LabelFiles.parse("kind,begin,end\nnone,1,2\n", "n.csv"));
        assertTrue(none.getMessage().contains("leave it out"), none.getMessage());
        InputRejectedException empty = assertThrows(InputRejectedException.class,
                () -> LabelFiles.parse("# nothing\n\n", "e.csv"));
        assertTrue(empty.getMessage().startsWith("e.csv: empty label file"), empty.getMessage());
        InputRejectedException quote = assertThrows(InputRejectedException.class,
                () -> LabelFiles.parse("kind,begin,end,note\nloop,1,2,\"open\n", "q.csv"));
        assertEquals("q.csv:2:10: quote opened here is not closed on this line", quote.getMessage());
    }

    @Test
    void aHeaderOnlyFileHasNoPoints() {
        Labels labels = LabelFiles.parse("kind,begin,end\n", "transit-only.csv");
        assertEquals(0, labels.size());
        assertNull(labels.kindAt(0));
        assertEquals(Long.MAX_VALUE, labels.distanceToBoundaryNs(5));
    }

    @Test
    void refusesUnreadableFilesNamingThem(@TempDir Path dir) throws IOException {
        Path latin = dir.resolve("latin1.csv");
        Files.write(latin, "kind,begin,end,note\nloop,1,2,caf\u00e9\n".getBytes(StandardCharsets.ISO_8859_1));
        InputRejectedException e = assertThrows(InputRejectedException.class, () -> LabelFiles.load(latin));
        assertEquals(latin + ": not UTF-8 text; save the label file as UTF-8 CSV", e.getMessage());
        Path missing = dir.resolve("missing.csv");
        InputRejectedException m = assertThrows(InputRejectedException.class, () -> LabelFiles.load(missing));
        assertEquals(missing + ": no such label file", m.getMessage());
    }
}
