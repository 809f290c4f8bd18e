package org.pointcall.shared.demo;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Path;
import java.util.EnumSet;
import java.util.List;
import java.util.Set;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.pointcall.shared.card.Band;
import org.pointcall.shared.card.BandPhase;
import org.pointcall.shared.card.CardFiles;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.card.TestPoint;
import org.pointcall.shared.dictionary.DictionaryFiles;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.kind.ManoeuvreKind;

class DemoFilesTest {

    @Test
    void demoDictionaryLoadsWithTheParametersOfATestSortie() {
        ParameterDictionary d = DemoFiles.dictionary();
        assertTrue(d.size() >= 30 && d.size() <= 40, "size " + d.size());
        for (String name : List.of("Ps", "Qc", "Hp", "KCAS", "Mach", "KTAS", "OAT", "TAT", "AoA", "AoS", "Pitch",
                "Roll", "Heading", "P", "Q", "R", "Nx", "Ny", "Nz", "Elevator", "Aileron", "Rudder", "StickFp",
                "PedalF", "Throttle", "N1", "FuelFlow", "FuelQty", "EGT", "Gear", "Flap", "dHdt", "dVdt", "SEP",
                "Lat", "Lon")) {
            assertTrue(d.indexOf(name) >= 0, name);
        }
        assertTrue(d.find("Hp").orElseThrow().isDerived());
        assertTrue(d.find("SEP").orElseThrow().isDerived());
        assertEquals(-1, d.indexOf("time"), "time is the frame's, not a parameter");
    }

    @Test
    void demoCardLoadsAndCoversEveryKind() {
        TestCard c = DemoFiles.card();
        assertEquals(12, c.points().size());
        Set<ManoeuvreKind> kinds = EnumSet.noneOf(ManoeuvreKind.class);
        Set<BandPhase> phases = EnumSet.noneOf(BandPhase.class);
        for (TestPoint p : c.points()) {
            kinds.add(p.kind());
            for (Band b : p.bands()) {
                phases.add(b.phase());
            }
        }
        assertEquals(EnumSet.allOf(ManoeuvreKind.class), kinds);
        assertEquals(EnumSet.allOf(BandPhase.class), phases);
        assertTrue(c.limits().size() >= 3);
        assertTrue(DemoFiles.cardText().contains("invented"), "the card says its values are invented");
    }

    @Test
    void writeToCopiesFilesThatLoadToTheSameObjects(@TempDir Path dir) throws IOException {
        List<Path> files = DemoFiles.writeTo(dir.resolve("demo"));
        ParameterDictionary d = DictionaryFiles.load(files.get(0));
        assertEquals(DemoFiles.dictionary(), d);
        assertEquals(DemoFiles.card(), CardFiles.load(files.get(1), d));
        DemoFiles.writeTo(dir.resolve("demo"));
    }
}
