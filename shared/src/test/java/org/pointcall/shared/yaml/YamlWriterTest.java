package org.pointcall.shared.yaml;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;
import java.util.Map;
import java.util.Random;

import org.junit.jupiter.api.Test;
import org.yaml.snakeyaml.nodes.MappingNode;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.nodes.ScalarNode;

class YamlWriterTest {

    /** Reads {@code text} back through the same composer the loaders use and returns the value of key {@code k}. */
    private static String readBack(String yaml, String key) {
        YamlDoc doc = new YamlDoc("t");
        Node root = doc.compose(yaml).orElseThrow(() -> new AssertionError(doc.problems() + "\n" + yaml));
        YamlMap m = doc.map(root, "t", List.of(key)).orElseThrow();
        return ((ScalarNode) m.node(key).orElseThrow()).getValue();
    }

    @Test
    void plainWhenSafeQuotedOtherwise() {
        Map<String, String> cases = Map.of(
                "KCAS", "KCAS",
                "Static pressure, nose boom", "Static pressure, nose boom",
                "yes", "\"yes\"",
                "1", "\"1\"",
                "%", "\"%\"",
                "a: b", "\"a: b\"",
                "x #y", "\"x #y\"",
                "tab\there", "\"tab\\there\"",
                "say \"hi\"", "\"say \\\"hi\\\"\"",
                "bell\u0007", "\"bell\\u0007\"");
        cases.forEach((in, out) -> assertEquals(out, YamlWriter.scalar(in), in));
        assertEquals("\"a, b\"", YamlWriter.flowScalar("a, b"), "a comma ends a scalar in a flow collection");
    }

    @Test
    void seededRandomTextReadsBackExactlyInEveryForm() {
        String[] pieces = {"a", "Q", "9", " ", ":", ": ", "#", " #", "'", "\"", "\\", "-", "[", "]", "{", "}", ",",
            "&", "*", "!", "|", ">", "%", "@", "`", "?", "\n", "\n\n", "\t", "\r", "\u00e9", "\ud83d\ude00", "\u0000",
            "\u001b", "\u007f", "\u0085", "\u00a0", "\u2028", "\u2029", "\ufeff", "null", "true", "~", "-.inf"};
        Random rnd = new Random(42);
        for (int n = 0; n < 3000; n++) {
            StringBuilder b = new StringBuilder();
            for (int i = rnd.nextInt(10); i > 0; i--) {
                b.append(pieces[rnd.nextInt(pieces.length)]);
            }
            String s = b.toString();
            assertEquals(s, readBack("k: " + YamlWriter.scalar(s) + "\n", "k"), s);
            assertEquals(s, readBack("{k: " + YamlWriter.flowScalar(s) + "}\n", "k"), s);
            String block = new YamlWriter().text(0, "k", s).toString();
            assertEquals(s, readBack(block, "k"), block);
            String nested = new YamlWriter().entry(0, "items", "").text(2, "- ", "k", s).toString();
            YamlDoc doc = new YamlDoc("t");
            Node item = ((org.yaml.snakeyaml.nodes.SequenceNode) ((MappingNode) doc.compose(nested).orElseThrow())
                    .getValue().get(0).getValueNode()).getValue().get(0);
            assertEquals(s, ((ScalarNode) ((MappingNode) item).getValue().get(0).getValueNode()).getValue(), nested);
        }
    }

    @Test
    void multiLineTextIsALiteralBlockWhenThatIsExact() {
        assertEquals("notes: |\n  line one\n\n  line three\n",
                new YamlWriter().text(0, "notes", "line one\n\nline three\n").toString());
        assertEquals("notes: |-\n  no final break\n  here\n",
                new YamlWriter().text(0, "notes", "no final break\nhere").toString());
        assertEquals("notes: \" leading space\\nsecond\"\n",
                new YamlWriter().text(0, "notes", " leading space\nsecond").toString());
    }

    @Test
    void seededRandomNumbersReadBackToTheSameBits() {
        Random rnd = new Random(7);
        double[] edge = {0.0, -0.0, 1.0, -1.0, 250, 0.1, 1e-300, Double.MIN_VALUE, Double.MAX_VALUE, -Double.MAX_VALUE,
            1e15, 1e15 - 1, 123456789012345.6, Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY};
        for (double v : edge) {
            assertSameBits(v);
        }
        for (int i = 0; i < 20000; i++) {
            assertSameBits(Double.longBitsToDouble(rnd.nextLong()));
        }
        assertEquals("250", YamlWriter.number(250.0));
        assertEquals("-0.0", YamlWriter.number(-0.0));
        assertEquals("0.01221", YamlWriter.number(0.01221));
        assertEquals("[-30, 0.5]", YamlWriter.numbers(-30, 0.5));
    }

    private static void assertSameBits(double v) {
        if (Double.isNaN(v)) {
            return;
        }
        String text = YamlWriter.number(v);
        YamlDoc doc = new YamlDoc("t");
        Node n = doc.compose("k: " + text).map(r -> ((MappingNode) r).getValue().get(0).getValueNode())
                .orElseThrow();
        double back = YamlMap.parseNumber(n, true).orElseThrow(() -> new AssertionError(text));
        assertEquals(Double.doubleToRawLongBits(v), Double.doubleToRawLongBits(back), text);
    }
}
