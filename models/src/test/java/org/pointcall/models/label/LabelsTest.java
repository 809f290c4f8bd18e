package org.pointcall.models.label;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;

import org.junit.jupiter.api.Test;
import org.pointcall.ingest.file.TimeForm;
import org.pointcall.ingest.sim.truth.PointTruth;
import org.pointcall.ingest.sim.truth.SortieTruth;
import org.pointcall.shared.error.InputRejectedException;
import org.pointcall.shared.error.PointcallException;
import org.pointcall.shared.kind.ManoeuvreKind;

class LabelsTest {
    private static final long S = 1_000_000_000L;

    @Test
    void lookupsAgreeWithALinearScanOnRandomIntervals() {
        SplittableRandom rnd = new SplittableRandom(7);
        List<LabelInterval> list = new ArrayList<>();
        long t = 0;
        ManoeuvreKind[] kinds = ManoeuvreKind.values();
        for (int i = 0; i < 300; i++) {
            t += rnd.nextLong(0, 5 * S);          // gaps of 0 make touching intervals
            long d = rnd.nextLong(1, 60 * S);
            list.add(new LabelInterval(kinds[rnd.nextInt(kinds.length)], t, t + d, "", "", 0));
            t += d;
        }
        List<LabelInterval> shuffled = new ArrayList<>(list);
        java.util.Collections.shuffle(shuffled, new java.util.Random(3));
        Labels labels = Labels.of("random", TimeForm.SECONDS, shuffled);
        for (int q = 0; q < 20_000; q++) {
            long at = rnd.nextLong(-10 * S, t + 10 * S);
            ManoeuvreKind expected = null;
            long nearest = Long.MAX_VALUE;
            for (LabelInterval li : list) {
                if (li.contains(at)) {
                    expected = li.kind();
                }
                nearest = Math.min(nearest, Math.min(Math.abs(at - li.beginNs()), Math.abs(at - li.endNs())));
            }
            assertEquals(expected, labels.kindAt(at), "at " + at);
            assertEquals(nearest, labels.distanceToBoundaryNs(at), "at " + at);
        }
        // exactly on boundaries
        for (LabelInterval li : list) {
            assertEquals(li.kind(), labels.kindAt(li.beginNs()));
            assertEquals(0, labels.distanceToBoundaryNs(li.endNs()));
        }
    }

    @Test
    void overlapsAreRefusedOutsideFilesToo() {
        List<LabelInterval> l = List.of(
                new LabelInterval(ManoeuvreKind.LOOP, 0, 10 * S, "a", "", 0),
                new LabelInterval(ManoeuvreKind.PHUGOID, 5 * S, 20 * S, "b", "", 0));
        InputRejectedException e = assertThrows(InputRejectedException.class,
                () -> Labels.of("code", TimeForm.SECONDS, l));
        assertTrue(e.getMessage().contains("phugoid 5.000 s to 20.000 s overlaps the loop point a"),
                e.getMessage());
    }

    @Test
    void truthBecomesLabelsInSeconds() {
        SortieTruth truth = new SortieTruth(SortieTruth.FORMAT, "demo-airframe", "sortie-3", 42L, 50.0, 900.0,
                false, 0, 0, 0, List.of(
                point("L-1", "loop", 400.0, 460.5, "none"),
                point("S-1", "stall-level", 100.0, 160.0, "late recovery")));
        Labels labels = Labels.fromTruth(truth);
        assertEquals(TimeForm.SECONDS, labels.timeForm());
        assertEquals(2, labels.size());
        assertEquals(ManoeuvreKind.STALL_LEVEL, labels.interval(0).kind());
        assertEquals("S-1", labels.interval(0).cardId());
        assertEquals("flaw: late recovery", labels.interval(0).note());
        assertEquals(460 * S + S / 2, labels.interval(1).endNs());
        assertEquals(ManoeuvreKind.LOOP, labels.kindAt(400 * S));

        SortieTruth odd = new SortieTruth(SortieTruth.FORMAT, "a", "sortie-4", 1L, 50, 10, false, 0, 0, 0,
                List.of(point("X", "barrel-roll", 1, 2, "none")));
        InputRejectedException e = assertThrows(InputRejectedException.class, () -> Labels.fromTruth(odd));
        assertTrue(e.getMessage().contains("unknown kind 'barrel-roll'"), e.getMessage());
    }

    private static PointTruth point(String id, String kind, double b, double e, String flaw) {
        return new PointTruth(id, kind, b, e, Map.of(), Map.of(), Map.of(), List.of(), true, flaw);
    }

    @Test
    void alignmentRefusesSecondsAgainstTimeOfDayAndMovesTimesOfDayByWholeDays() {
        Labels secs = LabelFiles.parse("kind,begin,end\nloop,10,20\n", "s.csv");
        PointcallException e = assertThrows(PointcallException.class,
                () -> secs.alignedTo(0, TimeForm.TIME_OF_DAY, "rec.csv"));
        assertEquals("s.csv: labels are written in seconds but rec.csv gives its time in time of day; write the "
                + "labels the way the recording's time column is written", e.getMessage());
        assertSame(secs, secs.alignedTo(5 * S, TimeForm.SECONDS, "rec.csv"));

        Labels tod = LabelFiles.parse("kind,begin,end\nloop,00:10:00,00:11:00\n", "t.csv");
        long day = 86_400 * S;
        // recording starts 23:50 the day before: the label lies after midnight
        Labels moved = tod.alignedTo(day - 600 * S, TimeForm.TIME_OF_DAY, "rec.csv");
        assertEquals(day + 600 * S, moved.interval(0).beginNs());
        // recording starts 08:00: the same day's 00:10 (7 h 50 min before) is nearer than the next day's
        assertEquals(600 * S, tod.alignedTo(8 * 3600 * S, TimeForm.TIME_OF_DAY, "r").interval(0).beginNs());
        // recording starts 13:00: the next day's 00:10 (11 h 10 min later) is nearer
        assertEquals(day + 600 * S, tod.alignedTo(13 * 3600 * S, TimeForm.TIME_OF_DAY, "r").interval(0)
                .beginNs());
        // recording starts 00:05: same day
        assertEquals(600 * S, tod.alignedTo(300 * S, TimeForm.TIME_OF_DAY, "r").interval(0).beginNs());
    }
}
