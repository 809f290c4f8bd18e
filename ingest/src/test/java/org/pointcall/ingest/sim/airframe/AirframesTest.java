package org.pointcall.ingest.sim.airframe;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.pointcall.shared.error.InputRejectedException;
import org.pointcall.shared.error.PointcallException;
import org.pointcall.shared.error.Problem;

class AirframesTest {
    private static final String[] BUILT_IN = {"veskarn-02", "quillon-tp3", "sparrel-a1"};

    private static String resource(String name) throws IOException {
        try (InputStream in = Airframes.class.getResourceAsStream("/org/pointcall/ingest/sim/airframes/" + name
                + ".yaml")) {
            return new String(in.readAllBytes(), StandardCharsets.UTF_8);
        }
    }

    @Test
    void listsTheThreeBuiltInAirframesWithOneLineDescriptions() {
        List<AirframeSummary> list = Airframes.list();
        assertEquals(List.of(BUILT_IN), list.stream().map(AirframeSummary::name).toList());
        for (AirframeSummary s : list) {
            assertTrue(s.description().contains("fictional"), s.description());
            assertTrue(!s.description().contains("\n") && s.description().length() < 100, s.description());
        }
    }

    @Test
    void everyProfileSaysItsNumbersAreInventedForAFictionalAirframe() throws IOException {
        for (String name : BUILT_IN) {
            String text = resource(name);
            assertTrue(text.contains("invented for a fictional airframe"), name);
            assertEquals(name, Airframes.load(name).name());
        }
    }

    @Test
    void theThreeDifferInScaleAndCharacter() {
        Airframe jet = Airframes.load("veskarn-02");
        Airframe turboprop = Airframes.load("quillon-tp3");
        Airframe aerobatic = Airframes.load("sparrel-a1");
        // wing loading at full fuel, kg/m^2: common practice for the classes ([memory]): jet trainers about 250
        // to 350, turboprop trainers 150 to 200, light aerobatic aircraft 60 to 80
        assertBetween(250, 350, loading(jet));
        assertBetween(150, 200, loading(turboprop));
        assertBetween(60, 80, loading(aerobatic));
        // the aerobatic type rolls hardest (aileron power over roll damping) and autorotates when stalled
        assertTrue(rollPower(aerobatic) > rollPower(turboprop) && rollPower(turboprop) > rollPower(jet));
        assertTrue(aerobatic.stall().rollDampingSeparatedRatio() < 0);
        // and stalls alike upright and inverted (symmetric section)
        assertEquals(aerobatic.stall().alphaStallRad(), -aerobatic.stall().alphaStallNegativeRad(), 1e-12);
    }

    private static double loading(Airframe a) {
        return a.mass().fullMassKg() / a.geometry().wingAreaM2();
    }

    private static double rollPower(Airframe a) {
        return a.lateral().cRollAileron() * a.controls().aileron().maxRad() / a.lateral().cRollP();
    }

    private static void assertBetween(double lo, double hi, double v) {
        assertTrue(v >= lo && v <= hi, v + " not within " + lo + " to " + hi);
    }

    @Test
    void aProfileFileLoadsToTheSameAirframeAsTheBuiltIn(@TempDir Path dir) throws IOException {
        Path f = dir.resolve("copy.yaml");
        Files.writeString(f, resource("quillon-tp3"), StandardCharsets.UTF_8);
        assertEquals(Airframes.load("quillon-tp3"), Airframes.load(f));
    }

    @Test
    void aBadProfileIsRefusedWithEveryProblemLocated(@TempDir Path dir) throws IOException {
        String text = resource("veskarn-02")
                .replace("  CLalpha: 4.7", "  CLalhpa: 4.7")
                .replace("  spanM: 9.6", "  spanM: wide")
                .replace("  Cmq: -13.0", "  Cmq: 13.0")
                .replace("  alphaReattachDeg: 12.0", "  alphaReattachDeg: 18.0")
                .replace("  CD0: 0.021\n", "  CD0: 0.021\n  CD0: 0.022\n")
                .replace("mach:   [0.0, 0.2, 0.4, 0.6, 0.8, 1.0]", "mach:   [0.0, 0.4, 0.2, 0.6, 0.8, 1.0]");
        Path f = dir.resolve("bad.yaml");
        Files.writeString(f, text, StandardCharsets.UTF_8);
        InputRejectedException e = assertThrows(InputRejectedException.class, () -> Airframes.load(f));
        List<Problem> ps = e.problems();
        String src = f.toString();
        expect(ps, src, lineOf(text, "  CLalhpa:"), "unknown key 'longitudinal.CLalhpa'");
        expect(ps, src, lineOf(text, "longitudinal:"), "missing key 'longitudinal.CLalpha'");
        expect(ps, src, lineOf(text, "  spanM: wide"), "'geometry.spanM' must be a number, got 'wide'");
        expect(ps, src, lineOf(text, "  Cmq: 13.0"), "'longitudinal.Cmq' is 13; it must be between -100 and 0");
        expect(ps, src, lineOf(text, "  alphaReattachDeg: 18.0"), "must be below alphaStallDeg");
        expect(ps, src, lineOf(text, "  CD0: 0.022"), "key 'longitudinal.CD0' appears twice");
        expect(ps, src, lineOf(text, "    mach:   [0.0, 0.4"), "must be greater than the previous");
        assertEquals(7, ps.size(), e.getMessage());
        // one line each, in the form editors jump to: file:line:column: message
        for (Problem p : ps) {
            assertTrue(p.line() > 0 && p.column() > 0, p.toString());
            assertTrue(p.toString().startsWith(src + ":" + p.line() + ":" + p.column() + ": "), p.toString());
        }
        assertEquals(src + ":" + lineOf(text, "  spanM: wide") + ":10: 'geometry.spanM' must be a number, got"
                + " 'wide'", ps.stream().filter(p -> p.message().contains("spanM")).findFirst().orElseThrow()
                .toString());
    }

    private static int lineOf(String text, String start) {
        String[] lines = text.split("\n", -1);
        for (int i = 0; i < lines.length; i++) {
            if (lines[i].startsWith(start)) {
                return i + 1;
            }
        }
        throw new AssertionError("no line starting " + start);
    }

    private static void expect(List<Problem> ps, String src, int line, String fragment) {
        assertTrue(ps.stream().anyMatch(p -> p.source().equals(src) && p.line() == line
                && p.message().contains(fragment)), "expected at line " + line + ": " + fragment + " in " + ps);
    }

    @Test
    void brokenYamlEmptyFilesUnknownNamesAndMissingFilesAreOneClearLine(@TempDir Path dir) throws IOException {
        Path broken = dir.resolve("broken.yaml");
        Files.writeString(broken, "name: x\nmass: [1, 2\ngeometry: {}\n", StandardCharsets.UTF_8);
        InputRejectedException e = assertThrows(InputRejectedException.class, () -> Airframes.load(broken));
        assertEquals(1, e.problems().size());
        assertTrue(e.problems().get(0).line() > 0, e.getMessage());
        assertTrue(e.getMessage().startsWith(broken + ":"), e.getMessage());

        Path empty = dir.resolve("empty.yaml");
        Files.writeString(empty, "# nothing\n", StandardCharsets.UTF_8);
        assertTrue(assertThrows(InputRejectedException.class, () -> Airframes.load(empty)).getMessage()
                .contains("empty"));

        Path list = dir.resolve("list.yaml");
        Files.writeString(list, "- a\n- b\n", StandardCharsets.UTF_8);
        assertTrue(assertThrows(InputRejectedException.class, () -> Airframes.load(list)).getMessage()
                .contains("must be a mapping"));

        PointcallException unknown = assertThrows(PointcallException.class, () -> Airframes.load("no-such-jet"));
        assertEquals("no built-in airframe named 'no-such-jet'; built in: veskarn-02, quillon-tp3, sparrel-a1",
                unknown.getMessage());
        Path missing = dir.resolve("missing.yaml");
        assertEquals(missing + ": no such file",
                assertThrows(PointcallException.class, () -> Airframes.load(missing)).getMessage());
    }

    @Test
    void aMissingSectionIsReportedOnceNotOncePerKey(@TempDir Path dir) throws IOException {
        String text = resource("sparrel-a1");
        int start = text.indexOf("lateral:");
        int end = text.indexOf("stall:");
        Path f = dir.resolve("nolateral.yaml");
        Files.writeString(f, text.substring(0, start) + text.substring(end), StandardCharsets.UTF_8);
        InputRejectedException e = assertThrows(InputRejectedException.class, () -> Airframes.load(f));
        assertEquals(1, e.problems().size(), e.getMessage());
        assertTrue(e.getMessage().contains("missing key 'lateral'"), e.getMessage());
    }
}
