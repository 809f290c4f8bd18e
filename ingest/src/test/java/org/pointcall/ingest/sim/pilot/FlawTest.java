package org.pointcall.ingest.sim.pilot;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.HashSet;
import java.util.Set;

import org.junit.jupiter.api.Test;
import org.pointcall.shared.kind.ManoeuvreKind;

class FlawTest {
    @Test
    void keysAreUniqueAndReadBack() {
        Set<String> keys = new HashSet<>();
        for (Flaw f : Flaw.values()) {
            assertTrue(keys.add(f.key()), f.key());
            assertEquals(f, Flaw.byKey(f.key()).orElseThrow());
        }
        assertEquals("none", Flaw.NONE.key());
        assertFalse(Flaw.byKey("bad-landing").isPresent());
    }

    @Test
    void everyKindHasSeveralFlawsAndNoneOfThemIsNone() {
        for (ManoeuvreKind k : ManoeuvreKind.values()) {
            Set<Flaw> f = Flaw.applicableTo(k);
            assertTrue(f.size() >= 3, k.key());
            assertFalse(f.contains(Flaw.NONE), k.key());
        }
    }
}
