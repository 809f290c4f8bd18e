package org.pointcall.models.card;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;

import org.junit.jupiter.api.Test;
import org.pointcall.ingest.frame.Frame;
import org.pointcall.shared.card.SafetyLimit;
import org.pointcall.shared.demo.DemoFiles;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.outcome.LimitAlarm;
import org.pointcall.shared.units.Unit;

class LimitWatchTest {
    private static final ParameterDictionary DICT = DemoFiles.dictionary();

    @Test
    void anAlarmIsRaisedOnTheFirstFrameBeyondKeepsItsPeakAndClearsAfterHalfASecondInside() {
        List<LimitAlarm> out = new ArrayList<>();
        LimitWatch w = new LimitWatch(List.of(SafetyLimit.of("Nz", Unit.G, Double.NEGATIVE_INFINITY, 6.0),
                SafetyLimit.of("Nope", Unit.G, Double.NEGATIVE_INFINITY, 6.0)), DICT, out::add);
        assertEquals(List.of("Nope"), w.unwatched());
        Frame f = Frame.forDictionary(DICT);
        int nz = DICT.indexOf("Nz");
        double[] g = {5.0, 6.2, 6.5, 5.9, 6.1, 5.0, 5.0, 5.0, 5.0, 5.0, 5.0, 5.0};
        for (int i = 0; i < g.length; i++) {
            f.clear();
            f.timeNs(i * 100_000_000L); // 10 Hz
            f.value(nz, g[i]);
            w.onFrame(f, i < 6 ? "LP-1" : null);
        }
        assertEquals(2, out.size(), out.toString());
        LimitAlarm up = out.get(0);
        assertTrue(up.raised());
        assertEquals(100_000_000L, up.timeNs());
        assertEquals(6.2, up.value(), 1e-12);
        assertEquals("at most 6 g", up.limit());
        assertEquals("LP-1", up.cardId());
        LimitAlarm down = out.get(1);
        assertFalse(down.raised());
        // back inside at 0.5 s, dipped out again at 0.4 s... inside for good from 0.5 s: cleared at 1.0 s
        assertEquals(1_000_000_000L, down.timeNs());
        assertEquals(6.5, down.peak(), 1e-12);
        assertFalse(w.anyRaised());
    }

    @Test
    void noValueBreaksNoLimit() {
        List<LimitAlarm> out = new ArrayList<>();
        LimitWatch w = new LimitWatch(List.of(SafetyLimit.of("Hp", Unit.FOOT, 6000, Double.POSITIVE_INFINITY)), DICT,
                out::add);
        Frame f = Frame.forDictionary(DICT);
        f.timeNs(0);
        w.onFrame(f, null);
        assertTrue(out.isEmpty());
        f.value(DICT.indexOf("Hp"), 5000);
        w.onFrame(f, null);
        assertEquals("at least 6000 ft", out.get(0).limit());
        assertEquals(List.of("Hp at least 6000 ft"), w.raisedNow());
    }
}
