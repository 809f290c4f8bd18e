package org.pointcall.shared.card;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.pointcall.shared.demo.DemoFiles;
import org.pointcall.shared.dictionary.DimensionRules;
import org.pointcall.shared.dictionary.Parameter;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.InputRejectedException;
import org.pointcall.shared.error.Problem;
import org.pointcall.shared.kind.ManoeuvreKind;
import org.pointcall.shared.kind.MetricSpec;
import org.pointcall.shared.units.Dimension;
import org.pointcall.shared.units.Unit;
import org.pointcall.shared.units.Units;

class CardFilesTest {
    private static final ParameterDictionary DICT = DemoFiles.dictionary();
    private static final String KINDS = "stall-level, stall-turn, loop, wind-up-turn, level-accel, pitch-doublet,"
            + " phugoid, sideslip, aileron-roll, stabilised";

    private static String fixture(String name) {
        try (InputStream in = CardFilesTest.class.getResourceAsStream("bad/" + name)) {
            return new String(in.readAllBytes(), StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new AssertionError(e);
        }
    }

    private static List<String> problemsOf(String name) {
        InputRejectedException e = assertThrows(InputRejectedException.class,
                () -> CardFiles.parse(fixture(name), name, DICT));
        List<String> out = new ArrayList<>();
        for (Problem p : e.problems()) {
            out.add(p.toString());
        }
        return out;
    }

    @Test
    void bandOnAParameterNotInTheDictionary() {
        assertEquals(List.of("unknown-parameter.yaml:8:21: unknown parameter 'KCASS': dictionary 'Veskarn prototype"
                + " 02 FTI, issue 1' has no parameter of that name"), problemsOf("unknown-parameter.yaml"));
    }

    @Test
    void bandsWithoutWidthQuoteWhatWasWritten() {
        assertEquals(List.of(
                "no-width.yaml:8:9: band on KCAS has no width (tol: 0)",
                "no-width.yaml:9:9: band on Hp has no width (min: 10000, max: 10000)",
                "no-width.yaml:10:9: band on Nz has no width (tol-minus: 0, tol-plus: 0)",
                "no-width.yaml:11:9: band on hold-time has no width (min: 40, max: 30)"),
                problemsOf("no-width.yaml"));
    }

    @Test
    void unitsMustHaveTheDimensionOfTheParameterItsRateOrTheMetric() {
        assertEquals(List.of(
                "unit-mismatch.yaml:4:39: unit mismatch: limit on KCAS is in ft, but KCAS is a speed",
                "unit-mismatch.yaml:10:68: unit mismatch: band on KCAS is in ft, but KCAS is a speed",
                "unit-mismatch.yaml:11:94: unit mismatch: rate band on KCAS is in kt, but the rate of change of KCAS"
                        + " is a rate of change of speed or an acceleration (kt/s, m/s/s, kt/min, m/s^2)",
                "unit-mismatch.yaml:12:32: a rate band on Nz is not possible: Nz is a load factor, and pointcall has"
                        + " no unit for its rate of change",
                "unit-mismatch.yaml:13:55: unit mismatch: band on stall-kcas is in deg, but stall-kcas is a speed"),
                problemsOf("unit-mismatch.yaml"));
    }

    @Test
    void duplicatePointIdNamesBothPlaces() {
        assertEquals(List.of("duplicate-id.yaml:10:9: duplicate point id 'TP-1' (first at line 4, column 9)"),
                problemsOf("duplicate-id.yaml"));
    }

    @Test
    void unknownKindListsTheKindsAndTransitIsNotOne() {
        assertEquals(List.of(
                "unknown-kind.yaml:5:11: unknown kind 'stall'; expected one of: " + KINDS,
                "unknown-kind.yaml:10:11: unknown kind 'transit': transit is the flying between points, not a test"
                        + " point; expected one of: " + KINDS),
                problemsOf("unknown-kind.yaml"));
    }

    @Test
    void unknownUnitListsTheUnitsOfTheExpectedDimension() {
        assertEquals(List.of("unknown-unit.yaml:8:73: unknown unit 'knts'; units of a speed: m/s, kt, ft/min, ft/s"),
                problemsOf("unknown-unit.yaml"));
    }

    @Test
    void yamlSyntaxErrorIsOneProblemAtSnakeYamlsMark() {
        assertEquals(List.of("syntax-error.yaml:5:1: YAML syntax error: found character '\\t(TAB)' that cannot start"
                + " any token. (Do not use \\t(TAB) for indentation) (while scanning for the next token)"),
                problemsOf("syntax-error.yaml"));
    }

    @Test
    void blankFileIsEmpty() {
        assertEquals(List.of("empty.yaml: file is empty: no YAML document in it"), problemsOf("empty.yaml"));
    }

    @Test
    void missingRequiredKeysNameTheirOwner() {
        assertEquals(List.of(
                "missing-key.yaml:1:1: the test card is missing required key 'sortie'",
                "missing-key.yaml:3:5: point P1 is missing required key 'title'",
                "missing-key.yaml:6:9: band on KCAS is missing required key 'unit'",
                "missing-key.yaml:7:9: band on Nz is missing required key 'phase'"),
                problemsOf("missing-key.yaml"));
    }

    @Test
    void wrongTypes() {
        assertEquals(List.of(
                "wrong-type.yaml:7:11: hold must be a number, got 'long'",
                "wrong-type.yaml:9:54: target must be a number, got 'fast'",
                "wrong-type.yaml:10:64: tol must be a number, got a list",
                "wrong-type.yaml:12:11: kind must be text, got a list"),
                problemsOf("wrong-type.yaml"));
    }

    @Test
    void everyProblemOfACardIsReportedTogetherInLineOrder() {
        assertEquals(List.of(
                "several-problems.yaml:5:1: unknown key 'remarks'; expected one of: sortie, airframe, area, notes,"
                        + " limits, points",
                "several-problems.yaml:7:5: limit on Nz needs min, max or both",
                "several-problems.yaml:8:5: limit on AoA must have max above min, got min 18, max 10",
                "several-problems.yaml:14:47: unknown key instant 'top' of loop; its instants are: pull, apex, exit",
                "several-problems.yaml:15:41: 'at' goes only with phase instant, this band's phase is entry",
                "several-problems.yaml:16:32: unknown phase 'during'; expected one of: entry, throughout, rate,"
                        + " instant, result",
                "several-problems.yaml:17:18: unknown metric 'apex-height' of loop; its metrics are: entry-hp,"
                        + " entry-kcas, pull-nz, max-nz, apex-hp, apex-kcas, exit-hp-change, exit-heading-change,"
                        + " duration",
                "several-problems.yaml:18:33: a band on a metric applies to the result: its phase is result (or left"
                        + " out), got 'entry'",
                "several-problems.yaml:19:32: phase result is for a band on a metric; a band on a parameter applies"
                        + " at entry, throughout, rate or instant",
                "several-problems.yaml:20:9: a band is on a parameter or on a metric, not both",
                "several-problems.yaml:21:9: a band needs 'parameter' (a dictionary name) or 'metric' (a result of"
                        + " the kind)",
                "several-problems.yaml:22:9: band on KCAS takes target with tol, or min and max, not both",
                "several-problems.yaml:23:9: band on KCAS has a target and needs tol (or tol-minus and tol-plus)",
                "several-problems.yaml:24:41: band on KCAS: tol goes with a target",
                "several-problems.yaml:25:59: tol must not be negative, got '-10'",
                "several-problems.yaml:26:48: unknown key instant 'break' of loop; its instants are: pull, apex,"
                        + " exit",
                "several-problems.yaml:26:61: over must be a positive number of seconds, got '0'",
                "several-problems.yaml:27:9: band on KCAS needs target and tol, or min, max or both",
                "several-problems.yaml:28:11: hold must be a positive number of seconds, got '-5'",
                "several-problems.yaml:29:9: point id 'bad id' must start with a letter or digit and hold only"
                        + " letters, digits, '-', '_' and '.'"),
                problemsOf("several-problems.yaml"));
    }

    @Test
    void oneBadBandRejectsTheWholeCardAndTheGoodPointsRaiseNothing() {
        String good = DemoFiles.cardText();
        String bad = good + "  - id: EXTRA\n    kind: loop\n    title: One more\n    bands:\n"
                + "      - {parameter: Nz, phase: instant, at: apex, max: 5, unit: ft}\n";
        InputRejectedException e = assertThrows(InputRejectedException.class,
                () -> CardFiles.parse(bad, "demo+1.yaml", DICT));
        int line = (int) good.lines().count() + 5;
        assertEquals(List.of(new Problem("demo+1.yaml", line, 65,
                "unit mismatch: band on Nz is in ft, but Nz is a load factor")), e.problems());
    }

    @Test
    void aCardIsReadAgainstItsDictionary() {
        // the demo card names AoS; a dictionary without it rejects the card at every band on AoS
        List<Parameter> fewer = new ArrayList<>(DICT.parameters());
        fewer.removeIf(p -> p.name().equals("AoS"));
        ParameterDictionary other = new ParameterDictionary("no beta", fewer);
        InputRejectedException e = assertThrows(InputRejectedException.class,
                () -> CardFiles.parse(DemoFiles.cardText(), "card.yaml", other));
        assertEquals(2, e.problems().size(), e.getMessage());
        for (Problem p : e.problems()) {
            assertEquals("unknown parameter 'AoS': dictionary 'no beta' has no parameter of that name", p.message());
        }
    }

    @Test
    void bandsStoreSiAndKeepTheCardUnit() {
        TestCard c = DemoFiles.card();
        Band kcas = c.point("TP-1").orElseThrow().bands().get(0);
        assertEquals(Unit.KNOT, kcas.unit());
        // 1 kt = 1852/3600 m/s exactly (NIST SP 811, Appendix B.8); the product is one rounding from exact
        assertEquals(250 * 1852.0 / 3600.0, kcas.targetSi(), 1e-12);
        assertEquals(248 * Units.MPS_PER_KT, kcas.lowSi(), 1e-12);
        assertEquals(252 * Units.MPS_PER_KT, kcas.highSi(), 1e-12);

        Band rate = c.point("SL-1").orElseThrow().bands().get(2);
        assertEquals(BandPhase.RATE, rate.phase());
        assertEquals("break", rate.instant());
        assertEquals(10.0, rate.overS());
        assertEquals(-1.25 * Units.MPS_PER_KT, rate.lowSi(), 1e-12);

        SafetyLimit egt = c.limits().get(6);
        assertEquals("EGT", egt.parameter());
        // degC to K adds 273.15 exactly (SI Brochure, 9th ed.)
        assertEquals(760 + 273.15, egt.maxSi(), 1e-9);
        assertEquals(false, egt.hasMin());
    }

    @Test
    void demoCardRoundTripsExactly() {
        TestCard c = DemoFiles.card();
        String text = CardFiles.toYaml(c);
        TestCard back = CardFiles.parse(text, "written", DICT);
        assertEquals(c, back);
        assertEquals(c.hashCode(), back.hashCode());
        assertEquals(text, CardFiles.toYaml(back), "writing is deterministic");
    }

    @Test
    void seededRandomCardsRoundTripExactly() {
        Random rnd = new Random(7_300_511L);
        for (int n = 0; n < 300; n++) {
            TestCard c = randomCard(rnd);
            String text = CardFiles.toYaml(c);
            TestCard back;
            try {
                back = CardFiles.parse(text, "random-" + n, DICT);
            } catch (InputRejectedException e) {
                throw new AssertionError(e.getMessage() + "\n" + text, e);
            }
            assertEquals(c, back, text);
            assertEquals(text, CardFiles.toYaml(back));
        }
    }

    @Test
    void loadNamesTheFile(@TempDir Path dir) throws IOException {
        Path f = dir.resolve("c.yaml");
        Files.writeString(f, fixture("duplicate-id.yaml"), StandardCharsets.UTF_8);
        InputRejectedException e = assertThrows(InputRejectedException.class, () -> CardFiles.load(f, DICT));
        assertEquals(f + ":10:9: duplicate point id 'TP-1' (first at line 4, column 9)", e.getMessage());
        Files.writeString(f, DemoFiles.cardText(), StandardCharsets.UTF_8);
        assertEquals(DemoFiles.card(), CardFiles.load(f, DICT));
    }

    private static TestCard randomCard(Random rnd) {
        List<Parameter> ps = DICT.parameters();
        List<SafetyLimit> limits = new ArrayList<>();
        for (int i = rnd.nextInt(5); i > 0; i--) {
            Parameter p = ps.get(rnd.nextInt(ps.size()));
            Unit u = unitOf(rnd, List.of(p.unit().dimension()));
            double a = value(rnd);
            double b = a + Math.abs(value(rnd)) + 0.5;
            switch (rnd.nextInt(3)) {
                case 0: limits.add(SafetyLimit.of(p.name(), u, a, Double.POSITIVE_INFINITY)); break;
                case 1: limits.add(SafetyLimit.of(p.name(), u, Double.NEGATIVE_INFINITY, b)); break;
                default: limits.add(SafetyLimit.of(p.name(), u, a, b)); break;
            }
        }
        List<TestPoint> points = new ArrayList<>();
        int np = 1 + rnd.nextInt(12);
        for (int i = 0; i < np; i++) {
            ManoeuvreKind kind = ManoeuvreKind.values()[rnd.nextInt(ManoeuvreKind.values().length)];
            List<Band> bands = new ArrayList<>();
            for (int k = rnd.nextInt(8); k > 0; k--) {
                bands.add(randomBand(rnd, kind));
            }
            double hold = rnd.nextBoolean() ? Double.NaN : rnd.nextBoolean() ? 5 + rnd.nextInt(60)
                    : Math.abs(rnd.nextGaussian()) * 50 + 1e-9;
            points.add(new TestPoint("P" + i + (rnd.nextBoolean() ? "-a.b_c" : ""), kind,
                    "T" + text(rnd), rnd.nextBoolean() ? "" : text(rnd), hold, bands));
        }
        return new TestCard("S" + text(rnd), "A" + text(rnd), rnd.nextBoolean() ? "" : text(rnd),
                rnd.nextBoolean() ? "" : text(rnd) + "\n" + text(rnd), limits, points);
    }

    private static Band randomBand(Random rnd, ManoeuvreKind kind) {
        if (rnd.nextInt(3) == 0) {
            MetricSpec m = kind.metrics().get(rnd.nextInt(kind.metrics().size()));
            return randomLimits(rnd, null, m.name(), BandPhase.RESULT, null, Double.NaN,
                    unitOf(rnd, List.of(m.unit().dimension())));
        }
        List<Parameter> ps = DICT.parameters();
        Parameter p = ps.get(rnd.nextInt(ps.size()));
        BandPhase phase = BandPhase.values()[rnd.nextInt(4)];
        List<Dimension> dims = List.of(p.unit().dimension());
        if (phase == BandPhase.RATE) {
            dims = DimensionRules.perSecond(p.unit().dimension());
            if (dims.isEmpty()) {
                phase = BandPhase.THROUGHOUT;
                dims = List.of(p.unit().dimension());
            }
        }
        String instant = phase == BandPhase.RATE || phase == BandPhase.INSTANT
                ? kind.keyInstants().get(rnd.nextInt(kind.keyInstants().size())) : null;
        double over = phase == BandPhase.RATE ? (rnd.nextBoolean() ? 1 + rnd.nextInt(20) : rnd.nextDouble() + 1e-3)
                : Double.NaN;
        return randomLimits(rnd, p.name(), null, phase, instant, over, unitOf(rnd, dims));
    }

    private static Band randomLimits(Random rnd, String param, String metric, BandPhase phase, String instant,
                                     double over, Unit u) {
        double a = value(rnd);
        switch (rnd.nextInt(5)) {
            case 0: {
                double tol = Math.abs(value(rnd)) + 0.01;
                return Band.ofTarget(param, metric, phase, instant, over, u, a, tol, tol);
            }
            case 1:
                return Band.ofTarget(param, metric, phase, instant, over, u, a, Math.abs(value(rnd)),
                        Math.abs(value(rnd)) + 0.01);
            case 2:
                return Band.ofRange(param, metric, phase, instant, over, u, a, Double.POSITIVE_INFINITY);
            case 3:
                return Band.ofRange(param, metric, phase, instant, over, u, Double.NEGATIVE_INFINITY, a);
            default:
                return Band.ofRange(param, metric, phase, instant, over, u, a, a + Math.abs(value(rnd)) + 0.01);
        }
    }

    /** Values as written on cards (round decimals) and as computed (full double precision, tiny, huge). */
    private static double value(Random rnd) {
        switch (rnd.nextInt(4)) {
            case 0: return rnd.nextInt(2001) - 1000;
            case 1: return Math.round(rnd.nextGaussian() * 1e4) / 1000.0;
            case 2: return rnd.nextGaussian() * Math.pow(10, rnd.nextInt(16) - 8);
            default: return rnd.nextGaussian() * 300;
        }
    }

    private static Unit unitOf(Random rnd, List<Dimension> dims) {
        List<Unit> us = new ArrayList<>();
        for (Unit u : Unit.values()) {
            if (dims.contains(u.dimension())) {
                us.add(u);
            }
        }
        return us.get(rnd.nextInt(us.size()));
    }

    private static String text(Random rnd) {
        String[] pieces = {"a", "Z", "7", " ", ": ", " #", "'", "\"", "\\", "- ", "[", "}", ",", "&", "*", "|",
            "%", "\t", "\u00b0", "\u20ac", "\ud83d\ude00", "\u0002", "\u2029", "yes", "~", "Gear up, flaps up"};
        StringBuilder b = new StringBuilder();
        for (int i = rnd.nextInt(12); i > 0; i--) {
            b.append(pieces[rnd.nextInt(pieces.length)]);
        }
        return b.toString();
    }
}
