package org.pointcall.models.metrics;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.SplittableRandom;

import org.apache.commons.math3.stat.descriptive.rank.Percentile;
import org.apache.commons.math3.stat.descriptive.rank.Percentile.EstimationType;
import org.junit.jupiter.api.Test;
import org.pointcall.models.label.LabelFiles;
import org.pointcall.shared.kind.ManoeuvreKind;

class EventScoringTest {
    private static final ManoeuvreKind STALL = ManoeuvreKind.STALL_LEVEL;
    private static final ManoeuvreKind LOOP = ManoeuvreKind.LOOP;
    private static final ManoeuvreKind ROLL = ManoeuvreKind.AILERON_ROLL;

    @Test
    void intersectionOverUnion() {
        assertEquals(1.0 / 3, EventScoring.iou(0, 10, 5, 15), 1e-15);
        assertEquals(0.5, EventScoring.iou(0, 10, 0, 5), 1e-15);
        assertEquals(0.0, EventScoring.iou(0, 10, 10, 20));
        assertEquals(1.0, EventScoring.iou(3, 4, 3, 4));
    }

    @Test
    void aHandScoredSortie() {
        List<TruePoint> truth = TruePoint.fromLabels(LabelFiles.parse("kind,begin,end,card_id\n"
                + "stall-level,100,160,S-1\n"
                + "stall-level,400,460,S-2\n"
                + "loop,1000,1060,L-1\n"
                + "aileron-roll,2000,2010,R-1\n", "truth.csv"));
        List<DetectedPoint> detected = List.of(
                new DetectedPoint(STALL, 102, 158, 104),        // S-1: IoU 56/60
                new DetectedPoint(STALL, 405, 470, 409),        // S-2: IoU 55/70
                new DetectedPoint(LOOP, 1000, 1020, 1003),      // IoU 20/60 < 0.5: false, L-1 missed
                new DetectedPoint(STALL, 2000, 2010, 2001),     // the roll taken for a stall: false, R-1 missed
                DetectedPoint.offline(STALL, 3000, 3030));      // in transit: false
        EventScore s = EventScoring.score(truth, detected, 0, 3600);

        assertEquals(2, s.matches().size());
        assertEquals(56.0 / 60, s.matches().get(0).iou(), 1e-15);
        assertEquals(new KindScore(4, 5, 2), s.overall());
        assertEquals(0.4, s.overall().precision(), 1e-15);
        assertEquals(0.5, s.overall().recall(), 1e-15);
        assertEquals(4.0 / 9, s.overall().f1(), 1e-15);
        assertEquals(new KindScore(2, 4, 2), s.perKind().get(STALL));
        assertEquals(2.0 / 3, s.perKind().get(STALL).f1(), 1e-15);
        assertEquals(0.0, s.perKind().get(LOOP).f1());
        assertTrue(Double.isNaN(s.perKind().get(ROLL).precision()), "nothing detected as a roll");
        assertEquals(0.0, s.perKind().get(ROLL).recall());
        assertEquals(3, s.perKind().size());

        // begin errors +2, +5; end errors -2, +10 (quantiles by linear interpolation, h = (n - 1) p)
        assertEquals(3.5, s.beginError().medianS(), 1e-12);
        assertEquals(2 + 0.95 * 3, s.beginError().absP95S(), 1e-12);
        assertEquals(4.0, s.endError().medianS(), 1e-12);
        assertEquals(6.0, s.endError().absMedianS(), 1e-12);
        assertEquals(2 + 0.95 * 8, s.endError().absP95S(), 1e-12);
        // live latencies 4 and 9 s
        assertEquals(2, s.liveBeginLatency().count());
        assertEquals(6.5, s.liveBeginLatency().medianS(), 1e-12);
        assertEquals(4 + 0.95 * 5, s.liveBeginLatency().p95S(), 1e-12);
        // 3600 s less 60 + 60 + 60 + 10 s of points; 3 false points
        assertEquals(3410.0, s.nonPointS(), 1e-9);
        assertEquals(3 / (3410.0 / 3600), s.falsePointsPerHour(), 1e-12);

        List<String> lines = s.lines();
        assertTrue(lines.contains("events.precision: 0.4"), lines.toString());
        assertTrue(lines.contains("events.stall-level.f1: 0.666667"), lines.toString());
        assertTrue(lines.contains("events.aileron-roll.precision: NaN"), lines.toString());
        assertTrue(lines.contains("events.begin-error.abs-p95-s: 4.85"), lines.toString());
        assertTrue(lines.contains("events.live-begin-latency.median-s: 6.5"), lines.toString());
        assertTrue(lines.contains("events.false-points-per-hour: 3.16716"), lines.toString());
        for (String l : lines) {
            assertTrue(l.matches("[a-z0-9.-]+: \\S+"), "name: value, got " + l);
        }
    }

    @Test
    void matchingIsOneToOneByBestOverlap() {
        List<TruePoint> truth = List.of(new TruePoint(STALL, 0, 10, "A"));
        // the second detection overlaps better and wins although it comes later; the first is then false
        EventScore s = EventScoring.score(truth, List.of(DetectedPoint.offline(STALL, 0, 9),
                DetectedPoint.offline(STALL, 0, 10)), 0, 100);
        assertEquals(List.of(new EventMatch(0, 1, 1.0)), s.matches());
        assertEquals(1, s.overall().falsePoints());

        // one detection across two touching points overlaps each by 6/20 = 0.3: no match at 0.5, both at 0.25
        List<TruePoint> two = List.of(new TruePoint(LOOP, 0, 10, "A"), new TruePoint(LOOP, 10, 20, "B"));
        List<DetectedPoint> wide = List.of(DetectedPoint.offline(LOOP, 4, 16));
        assertEquals(0, EventScoring.score(two, wide, 0, 100).matches().size());
        EventScore loose = EventScoring.score(two, wide, 0, 100, 0.25);
        assertEquals(1, loose.matches().size(), "one-to-one: a detection matches one point at most");
        assertEquals(1, loose.overall().missed());

        // two detections, two points, where taking pairs in detection order would pair them worse
        List<TruePoint> p = List.of(new TruePoint(STALL, 0, 10, "A"), new TruePoint(STALL, 6, 16, "B"));
        List<DetectedPoint> d = List.of(DetectedPoint.offline(STALL, 4, 14), DetectedPoint.offline(STALL, 1, 11));
        // IoU: d0-A 6/14, d0-B 8/12, d1-A 9/11, d1-B 5/15
        EventScore best = EventScoring.score(p, d, 0, 100, 0.3);
        assertEquals(List.of(new EventMatch(0, 1, 9.0 / 11), new EventMatch(1, 0, 8.0 / 12)), best.matches());
    }

    @Test
    void nothingDetectedNothingFlown() {
        EventScore s = EventScoring.score(List.of(), List.of(), 0, 7200);
        assertTrue(Double.isNaN(s.overall().precision()));
        assertTrue(Double.isNaN(s.overall().f1()));
        assertEquals(0.0, s.falsePointsPerHour());
        assertTrue(Double.isNaN(s.beginError().medianS()));
        EventScore allPoint = EventScoring.score(List.of(new TruePoint(STALL, 0, 10, "")),
                List.of(DetectedPoint.offline(STALL, 20, 30)), 0, 10);
        assertTrue(Double.isNaN(allPoint.falsePointsPerHour()), "no non-point time to divide by");
    }

    @Test
    void quantilesMatchCommonsMathDefinitionSeven() {
        SplittableRandom r = new SplittableRandom(9);
        for (int n = 1; n < 40; n++) {
            double[] x = new double[n];
            for (int i = 0; i < n; i++) {
                x[i] = r.nextGaussian() * 3;
            }
            for (double p : new double[] {0.05, 0.5, 0.95, 1.0}) {
                // Apache Commons Math 3.6.1 Percentile, EstimationType.R_7 (Hyndman and Fan definition 7);
                // the same formula in double arithmetic, so 1e-12
                double expected = new Percentile().withEstimationType(EstimationType.R_7).evaluate(x, p * 100);
                assertEquals(expected, Percentiles.of(x, p), 1e-12, "n " + n + " p " + p);
            }
        }
    }
}
