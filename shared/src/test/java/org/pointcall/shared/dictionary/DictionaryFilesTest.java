package org.pointcall.shared.dictionary;

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
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.pointcall.shared.demo.DemoFiles;
import org.pointcall.shared.error.InputRejectedException;
import org.pointcall.shared.error.Problem;
import org.pointcall.shared.units.Dimension;
import org.pointcall.shared.units.Unit;

class DictionaryFilesTest {

    private static String fixture(String name) {
        try (InputStream in = DictionaryFilesTest.class.getResourceAsStream("bad/" + name)) {
            return new String(in.readAllBytes(), StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new AssertionError(e);
        }
    }

    /** Parses a named bad fixture and returns its problems as the user sees them. */
    private static List<String> problemsOf(String name) {
        InputRejectedException e = assertThrows(InputRejectedException.class,
                () -> DictionaryFiles.parse(fixture(name), name));
        List<String> out = new ArrayList<>();
        for (Problem p : e.problems()) {
            out.add(p.toString());
        }
        assertEquals(String.join(System.lineSeparator(), out), e.getMessage(), "message lists every problem");
        return out;
    }

    @Test
    void unknownKeyIsReportedWithTheAcceptedKeysAndTheMissingOneToo() {
        assertEquals(List.of(
                "unknown-key.yaml:3:5: parameter KCAS is missing required key 'rate'",
                "unknown-key.yaml:5:5: unknown key 'rate_hz'; expected one of: name, unit, description, rate, valid,"
                        + " column, calibration, derive"),
                problemsOf("unknown-key.yaml"));
    }

    @Test
    void wrongTypesQuoteWhatWasWritten() {
        assertEquals(List.of(
                "wrong-type.yaml:5:11: rate must be a number, got 'fast'",
                "wrong-type.yaml:6:26: max must be a number, got a list"),
                problemsOf("wrong-type.yaml"));
    }

    @Test
    void unknownUnitListsTheKnownOnes() {
        assertEquals(List.of("unknown-unit.yaml:4:11: unknown unit 'knts'; known units: " + Unit.knownSymbols()),
                problemsOf("unknown-unit.yaml"));
        // the list names the usual trade symbols
        String msg = problemsOf("unknown-unit.yaml").get(0);
        for (String s : List.of(" kt,", " ft,", " hPa,", " deg,", " g,")) {
            assertEquals(true, msg.contains(s), s);
        }
    }

    @Test
    void missingRequiredKeysAreReportedAtTheirEntry() {
        assertEquals(List.of(
                "missing-key.yaml:3:5: parameter KCAS is missing required key 'unit'",
                "missing-key.yaml:6:5: a parameter is missing required key 'name'"),
                problemsOf("missing-key.yaml"));
    }

    @Test
    void yamlSyntaxErrorIsOneProblemAtSnakeYamlsMark() {
        assertEquals(List.of("syntax-error.yaml:5:10: YAML syntax error: mapping values are not allowed here"),
                problemsOf("syntax-error.yaml"));
    }

    @ParameterizedTest
    @ValueSource(strings = {"empty.yaml", "comments-only.yaml"})
    void emptyFileIsRejectedAsAWhole(String name) {
        assertEquals(List.of(name + ": file is empty: no YAML document in it"), problemsOf(name));
    }

    @Test
    void aListAtTheTopIsNotADictionary() {
        assertEquals(List.of("not-a-mapping.yaml:1:1: a dictionary file must be a mapping of keys (name, parameters),"
                + " got a list"), problemsOf("not-a-mapping.yaml"));
    }

    @Test
    void derivationCyclesAreReportedOnceEachIncludingSelfReference() {
        assertEquals(List.of(
                "derivation-cycle.yaml:12:7: derivation cycle: EnergyA -> EnergyB -> EnergyA (a parameter cannot be"
                        + " computed, even indirectly, from itself)",
                "derivation-cycle.yaml:26:7: derivation cycle: Loop -> Loop (a parameter cannot be computed, even"
                        + " indirectly, from itself)"),
                problemsOf("derivation-cycle.yaml"));
    }

    @Test
    void derivationInputAndOutputOfTheWrongDimensionAreUnitMismatches() {
        assertEquals(List.of(
                "input-dimension.yaml:13:33: unit mismatch: input 'Ps' of pressure-altitude must be a pressure, but"
                        + " Ps is in kt",
                "input-dimension.yaml:15:11: unit mismatch: the rate of change of Ps is a rate of change of speed or"
                        + " an acceleration (kt/s, m/s/s, kt/min, m/s^2), but dVdt is in kt"),
                problemsOf("input-dimension.yaml"));
    }

    @Test
    void calibrationTableRawValuesMustIncreaseStrictly() {
        assertEquals(List.of("table-not-increasing.yaml:11:11: calibration table raw values must increase: raw 0"
                + " (row 3) is not above raw 0 (row 2)"), problemsOf("table-not-increasing.yaml"));
    }

    @Test
    void everyProblemOfAFileIsReportedTogetherInLineOrder() {
        assertEquals(List.of(
                "several-problems.yaml:7:12: valid range of Ps must have max above min, got min 1100, max 100",
                "several-problems.yaml:10:11: rate must be a positive number of Hz, got '-4'",
                "several-problems.yaml:12:5: unknown key 'colunm'; expected one of: name, unit, description, rate,"
                        + " valid, column, calibration, derive",
                "several-problems.yaml:13:5: duplicate parameter 'KCAS' (first at line 8, column 5)",
                "several-problems.yaml:21:5: parameter Hp is derived, so it takes no calibration (calibrate its"
                        + " inputs)",
                "several-problems.yaml:22:23: polynomial coefficient c1 must be a number, got 'one'",
                "several-problems.yaml:25:33: unknown input 'Pss' of pressure-altitude: no parameter of that name in"
                        + " the dictionary",
                "several-problems.yaml:31:15: unknown derivation method 'machh'; expected one of: pressure-altitude,"
                        + " calibrated-airspeed, mach, true-airspeed, rate, specific-excess-power",
                "several-problems.yaml:33:11: parameter name '2nd' must start with a letter and hold only letters,"
                        + " digits, '_' and '.'"),
                problemsOf("several-problems.yaml"));
    }

    @Test
    void oneBadParameterRejectsTheWholeFileAndTheGoodOnesRaiseNothing() {
        String good = DemoFiles.dictionaryText();
        String bad = good + "  - name: Extra\n    unit: kt\n    rate: often\n    valid: {min: 0, max: 1}\n";
        InputRejectedException e = assertThrows(InputRejectedException.class,
                () -> DictionaryFiles.parse(bad, "demo+1.yaml"));
        int line = (int) good.lines().count() + 3;
        assertEquals(List.of(new Problem("demo+1.yaml", line, 11, "rate must be a number, got 'often'")),
                e.problems());
    }

    @Test
    void loadNamesTheFileAsGivenAndReadsTheSameAsParse(@TempDir Path dir) throws IOException {
        Path f = dir.resolve("d.yaml");
        Files.writeString(f, DemoFiles.dictionaryText(), StandardCharsets.UTF_8);
        assertEquals(DemoFiles.dictionary(), DictionaryFiles.load(f));

        Path bad = dir.resolve("bad.yaml");
        Files.writeString(bad, fixture("wrong-type.yaml"), StandardCharsets.UTF_8);
        InputRejectedException e = assertThrows(InputRejectedException.class, () -> DictionaryFiles.load(bad));
        assertEquals(bad + ":5:11: rate must be a number, got 'fast'", e.problems().get(0).toString());

        Path missing = dir.resolve("nowhere.yaml");
        e = assertThrows(InputRejectedException.class, () -> DictionaryFiles.load(missing));
        assertEquals(List.of(missing + ": no such file"), e.problems().stream().map(Problem::toString).toList());

        Path latin1 = dir.resolve("latin1.yaml");
        Files.write(latin1, "name: caf\u00e9\n".getBytes(StandardCharsets.ISO_8859_1));
        e = assertThrows(InputRejectedException.class, () -> DictionaryFiles.load(latin1));
        assertEquals(List.of(latin1 + ": not UTF-8 text"), e.problems().stream().map(Problem::toString).toList());
    }

    @Test
    void demoDictionaryRoundTripsExactly() {
        ParameterDictionary d = DemoFiles.dictionary();
        String text = DictionaryFiles.toYaml(d);
        ParameterDictionary back = DictionaryFiles.parse(text, "written");
        assertEquals(d, back);
        assertEquals(d.hash(), back.hash());
        assertEquals(d.hashCode(), back.hashCode());
        assertEquals(d.parameters(), back.parameters());
        assertEquals(text, DictionaryFiles.toYaml(back), "writing is deterministic");
    }

    @Test
    void seededRandomDictionariesRoundTripExactly() {
        Random rnd = new Random(20240611L);
        for (int n = 0; n < 200; n++) {
            ParameterDictionary d = randomDictionary(rnd);
            String text = DictionaryFiles.toYaml(d);
            ParameterDictionary back;
            try {
                back = DictionaryFiles.parse(text, "random-" + n);
            } catch (InputRejectedException e) {
                throw new AssertionError(e.getMessage() + "\n" + text, e);
            }
            assertEquals(d, back, text);
            assertEquals(d.hash(), back.hash());
            for (int i = 0; i < d.size(); i++) {
                Parameter a = d.parameter(i);
                Parameter b = back.parameter(i);
                // record equality compares doubles by their bits; checked field by field to name a failure
                assertEquals(Double.doubleToLongBits(a.rateHz()), Double.doubleToLongBits(b.rateHz()), a.name());
                assertEquals(Double.doubleToLongBits(a.validMin()), Double.doubleToLongBits(b.validMin()), a.name());
                assertEquals(a.description(), b.description());
                assertEquals(a.column(), b.column());
                assertEquals(a.calibration(), b.calibration());
                assertEquals(a.derivation(), b.derivation());
            }
            assertEquals(text, DictionaryFiles.toYaml(back));
        }
    }

    /** A dictionary exercising every field: awkward text, extreme doubles, every calibration and derivation. */
    static ParameterDictionary randomDictionary(Random rnd) {
        int n = 1 + rnd.nextInt(25);
        List<Parameter> ps = new ArrayList<>();
        List<String> names = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            String name;
            do {
                name = randomName(rnd);
            } while (names.contains(name));
            names.add(name);
            Derivation der = null;
            Unit unit = pick(rnd, Unit.values());
            if (i > 0 && rnd.nextInt(3) == 0) {
                DerivationMethod m = pick(rnd, DerivationMethod.values());
                List<String> inputs = new ArrayList<>();
                Dimension rateOf = null;
                for (Dimension need : m.inputDimensions()) {
                    List<Parameter> fit = new ArrayList<>();
                    for (Parameter p : ps) {
                        Dimension pd = p.unit().dimension();
                        if (need == null ? !DimensionRules.perSecond(pd).isEmpty() : pd == need) {
                            fit.add(p);
                        }
                    }
                    if (fit.isEmpty()) {
                        inputs = null;
                        break;
                    }
                    Parameter in = fit.get(rnd.nextInt(fit.size()));
                    inputs.add(in.name());
                    if (need == null) {
                        rateOf = in.unit().dimension();
                    }
                }
                if (inputs != null) {
                    der = new Derivation(m, inputs);
                    Dimension out = m.outputDimension() != null ? m.outputDimension()
                            : pick(rnd, DimensionRules.perSecond(rateOf).toArray(new Dimension[0]));
                    List<Unit> us = new ArrayList<>();
                    for (Unit u : Unit.values()) {
                        if (u.dimension() == out) {
                            us.add(u);
                        }
                    }
                    unit = us.get(rnd.nextInt(us.size()));
                }
            }
            Calibration cal = null;
            if (der == null) {
                switch (rnd.nextInt(3)) {
                    case 0:
                        double[] c = new double[1 + rnd.nextInt(5)];
                        for (int k = 0; k < c.length; k++) {
                            c[k] = randomDouble(rnd);
                        }
                        cal = new Calibration.Polynomial(c);
                        break;
                    case 1:
                        int rows = 2 + rnd.nextInt(7);
                        double[] raw = new double[rows];
                        double[] eu = new double[rows];
                        raw[0] = rnd.nextGaussian() * 1000;
                        for (int k = 0; k < rows; k++) {
                            if (k > 0) {
                                raw[k] = Math.max(Math.nextUp(raw[k - 1]),
                                        raw[k - 1] + Math.abs(rnd.nextGaussian() * 100));
                            }
                            eu[k] = randomDouble(rnd);
                        }
                        cal = new Calibration.Breakpoints(raw, eu);
                        break;
                    default:
                        break;
                }
            }
            double min = rnd.nextInt(10) == 0 ? Double.NEGATIVE_INFINITY : randomDouble(rnd);
            double max = rnd.nextInt(10) == 0 ? Double.POSITIVE_INFINITY
                    : (Double.isInfinite(min) ? 0 : min) + Math.abs(randomDouble(rnd)) + 1;
            if (!(max > min)) {
                max = Math.nextUp(min);
            }
            double rate = rnd.nextBoolean() ? 1 + rnd.nextInt(200) : Math.exp(rnd.nextGaussian() * 3);
            String column = rnd.nextInt(3) == 0 ? null : randomText(rnd, 12);
            String description = rnd.nextInt(4) == 0 ? "" : randomText(rnd, 40);
            ps.add(new Parameter(name, unit, description, rate, min, max, column, cal, der));
        }
        return new ParameterDictionary(randomText(rnd, 30) + "x", ps);
    }

    private static final String[] TRICKY_NAMES = {"on", "No", "y", "null", "True", "a.b", "x_1", "OFF", "Yes"};

    private static String randomName(Random rnd) {
        if (rnd.nextInt(5) == 0) {
            return TRICKY_NAMES[rnd.nextInt(TRICKY_NAMES.length)];
        }
        String first = "ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz";
        String rest = first + "0123456789_.";
        StringBuilder b = new StringBuilder().append(first.charAt(rnd.nextInt(first.length())));
        int len = rnd.nextInt(8);
        for (int i = 0; i < len; i++) {
            b.append(rest.charAt(rnd.nextInt(rest.length())));
        }
        return b.toString();
    }

    /** Text with the characters YAML treats specially, line breaks, non-ASCII and non-printable ones. */
    static String randomText(Random rnd, int maxLen) {
        String[] pieces = {"a", "Z", "7", " ", ": ", " #", "#", "'", "\"", "\\", "-", "- ", "[", "]", "{", "}", ",",
            "&", "*", "!", "|", ">", "%", "@", "`", "?", "\n", "\t", "\r", "\u00b0", "\u00e9", "\u20ac",
            "\ud83d\ude00", "\u0001", "\u0085", "\u2028", "\ufeff", "true", "null", "~", "0x1F", "1e5", ".inf",
            "  ", "Static pressure"};
        int len = rnd.nextInt(maxLen + 1);
        StringBuilder b = new StringBuilder();
        for (int i = 0; i < len; i++) {
            b.append(pieces[rnd.nextInt(pieces.length)]);
        }
        return b.toString();
    }

    static double randomDouble(Random rnd) {
        switch (rnd.nextInt(6)) {
            case 0: return rnd.nextInt(20001) - 10000;
            case 1: return Math.round(rnd.nextGaussian() * 1e4) / 100.0;
            case 2: return rnd.nextGaussian() * Math.pow(10, rnd.nextInt(40) - 20);
            case 3: return Double.longBitsToDouble(rnd.nextLong() & 0x7fefffffffffffffL) * (rnd.nextBoolean() ? 1 : -1);
            case 4: return rnd.nextBoolean() ? -0.0 : Double.MIN_VALUE;
            default: return rnd.nextDouble();
        }
    }

    private static <T> T pick(Random rnd, T[] all) {
        return all[rnd.nextInt(all.length)];
    }
}
