package org.pointcall.shared.kind;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.HashSet;
import java.util.List;
import java.util.Set;

import org.junit.jupiter.api.Test;
import org.pointcall.shared.units.Dimension;
import org.pointcall.shared.units.Unit;

class ManoeuvreKindTest {

    @Test
    void keysAreUniqueAndLookUpTheirKind() {
        Set<String> keys = new HashSet<>();
        for (ManoeuvreKind k : ManoeuvreKind.values()) {
            assertTrue(keys.add(k.key()), k.key());
            assertEquals(k, ManoeuvreKind.byKey(k.key()).orElseThrow());
            assertFalse(k.metrics().isEmpty(), k.key());
            assertFalse(k.keyInstants().isEmpty(), k.key());
            assertFalse(k.displayName().isBlank());
            assertFalse(k.description().isBlank());
            assertEquals(k.keyInstants().size(), new HashSet<>(k.keyInstants()).size(), k.key());
        }
        assertEquals(String.join(", ", keys.stream().sorted().toList()),
                String.join(", ", List.of(ManoeuvreKind.keys().split(", ")).stream().sorted().toList()));
    }

    @Test
    void transitIsNotAKind() {
        assertTrue(ManoeuvreKind.byKey("transit").isEmpty());
    }

    @Test
    void stallMetricsAreInTheirTradeUnits() {
        ManoeuvreKind k = ManoeuvreKind.STALL_LEVEL;
        assertEquals(Unit.KNOT_PER_SECOND, k.metric("entry-rate").orElseThrow().unit());
        assertEquals(Unit.KNOT, k.metric("stall-kcas").orElseThrow().unit());
        assertEquals(Unit.DEGREE, k.metric("max-aoa").orElseThrow().unit());
        assertEquals(Unit.G, k.metric("nz-at-break").orElseThrow().unit());
        assertEquals(Unit.FOOT, k.metric("altitude-loss").orElseThrow().unit());
        assertEquals(Unit.SECOND, k.metric("recovery-time").orElseThrow().unit());
        assertTrue(k.hasInstant("break"));
        assertTrue(ManoeuvreKind.STALL_TURN.metric("bank-at-break").isPresent());
        assertTrue(ManoeuvreKind.LOOP.hasInstant("apex"));
    }

    @Test
    void driftMetricsOfAStabilisedPointArePerMinute() {
        ManoeuvreKind k = ManoeuvreKind.STABILISED;
        assertEquals(Dimension.SPEED, k.metric("hp-drift").orElseThrow().unit().dimension());
        assertEquals(Dimension.RATE_OF_SPEED, k.metric("kcas-drift").orElseThrow().unit().dimension());
        assertEquals(Dimension.ANGULAR_RATE, k.metric("heading-drift").orElseThrow().unit().dimension());
        // 60 kt/min is 1 kt/s, 60 deg/min is 1 deg/s: both by the definition of the minute (60 s, exact)
        assertEquals(Unit.KNOT_PER_SECOND.toSi(1), Unit.KNOT_PER_MINUTE.toSi(60), 1e-15);
        assertEquals(Unit.DEGREE_PER_SECOND.toSi(1), Unit.DEGREE_PER_MINUTE.toSi(60), 1e-15);
    }

    @Test
    void everyKindNamedByTheCardFormatIsHere() {
        List<String> expected = List.of("stall-level", "stall-turn", "loop", "wind-up-turn", "level-accel",
                "pitch-doublet", "phugoid", "sideslip", "aileron-roll", "stabilised");
        for (String key : expected) {
            assertTrue(ManoeuvreKind.byKey(key).isPresent(), key);
        }
        assertEquals(expected.size(), ManoeuvreKind.values().length);
    }
}
