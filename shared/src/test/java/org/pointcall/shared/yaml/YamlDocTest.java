package org.pointcall.shared.yaml;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.OptionalDouble;

import org.junit.jupiter.api.Test;
import org.pointcall.shared.error.InputRejectedException;
import org.pointcall.shared.error.Problem;

class YamlDocTest {
    private static final List<String> KEYS = List.of("a", "b", "c");

    private static List<String> problems(YamlDoc doc) {
        return doc.problems().stream().map(Problem::toString).toList();
    }

    @Test
    void duplicateKeysAreProblemsAndTheFirstValueCounts() {
        YamlDoc doc = new YamlDoc("f.yaml");
        YamlMap m = doc.map(doc.compose("a: 1\nb: 2\na: 3\n").orElseThrow(), "x", KEYS).orElseThrow();
        assertEquals(List.of("f.yaml:3:1: duplicate key 'a' (first at line 1, column 1)"), problems(doc));
        assertEquals(OptionalDouble.of(1), m.number("a"));
    }

    @Test
    void aSecondDocumentIsASyntaxProblem() {
        YamlDoc doc = new YamlDoc("f.yaml");
        assertTrue(doc.compose("a: 1\n---\nb: 2\n").isEmpty());
        assertEquals(List.of("f.yaml:2:1: YAML syntax error: but found another document (expected a single document"
                + " in the stream started at line 1, column 1)"), problems(doc));
    }

    @Test
    void byteOrderMarkIsSkippedAndColumnsStayTrue() {
        YamlDoc doc = new YamlDoc("f.yaml");
        YamlMap m = doc.map(doc.compose("\ufeffa: x\nb: fast\n").orElseThrow(), "x", KEYS).orElseThrow();
        m.number("b");
        assertEquals(List.of("f.yaml:2:4: b must be a number, got 'fast'"), problems(doc));
    }

    @Test
    void emptyValuesAreAbsentForOptionalKeysAndAProblemForRequiredOnes() {
        YamlDoc doc = new YamlDoc("f.yaml");
        YamlMap m = doc.map(doc.compose("a:\nb: ~\nc: ''\n").orElseThrow(), "x", KEYS).orElseThrow();
        assertTrue(m.string("a").isEmpty());
        assertTrue(m.number("b").isEmpty());
        assertEquals("", m.string("c").orElseThrow(), "a quoted empty text is a value");
        m.requiredString("a");
        m.requiredNumber("b");
        assertEquals(List.of("f.yaml:1:3: a has no value", "f.yaml:2:4: b has no value"), problems(doc));
    }

    @Test
    void numbersAreDecimalOnly() {
        YamlDoc doc = new YamlDoc("f.yaml");
        YamlMap m = doc.map(doc.compose("a: 0x1F\nb: 1_000\nc: .5e1\n").orElseThrow(), "x", KEYS).orElseThrow();
        assertTrue(m.number("a").isEmpty());
        assertTrue(m.number("b").isEmpty());
        assertEquals(OptionalDouble.of(5.0), m.number("c"));
        assertEquals(List.of("f.yaml:1:4: a must be a number, got '0x1F'",
                "f.yaml:2:4: b must be a number, got '1_000'"), problems(doc));
    }

    @Test
    void rejectCarriesEveryProblemSorted() {
        YamlDoc doc = new YamlDoc("f.yaml");
        doc.problem("whole file");
        YamlMap m = doc.map(doc.compose("c: z\nd: 1\n").orElseThrow(), "x", KEYS).orElseThrow();
        m.number("c");
        InputRejectedException e = assertThrows(InputRejectedException.class, doc::rejectIfAny);
        assertEquals(List.of("f.yaml: whole file", "f.yaml:1:4: c must be a number, got 'z'",
                "f.yaml:2:1: unknown key 'd'; expected one of: a, b, c"),
                e.problems().stream().map(Problem::toString).toList());
    }
}
