package org.pointcall.ingest.sim.pilot;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.Map;

import org.junit.jupiter.api.Test;

class PilotSettingsTest {
    @Test
    void outOfRangeValuesAreRefused() {
        assertThrows(IllegalArgumentException.class, () -> new PilotSettings(1.5, 1.0, Map.of()));
        assertThrows(IllegalArgumentException.class, () -> new PilotSettings(-0.1, 1.0, Map.of()));
        assertThrows(IllegalArgumentException.class, () -> new PilotSettings(0.1, -1.0, Map.of()));
        assertThrows(IllegalArgumentException.class, () -> new PilotSettings(Double.NaN, 1.0, Map.of()));
    }

    @Test
    void copiesChangeOneThing() {
        PilotSettings s = PilotSettings.DEFAULT.withFlaw("SL-1", Flaw.ENTRY_FAST).withFlaw("LP-1", Flaw.NONE);
        assertEquals(0.15, s.flawProbability());
        assertEquals(Map.of("SL-1", Flaw.ENTRY_FAST, "LP-1", Flaw.NONE), s.forcedFlaws());
        assertEquals(0.0, s.withFlawProbability(0.0).flawProbability());
        assertEquals(s.forcedFlaws(), s.withTrackingErrorScale(2.0).forcedFlaws());
        assertEquals(Map.of(), PilotSettings.DEFAULT.forcedFlaws());
    }
}
