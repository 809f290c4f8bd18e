package org.pointcall.shared.yaml;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.regex.Pattern;

import org.yaml.snakeyaml.DumperOptions;
import org.yaml.snakeyaml.error.Mark;
import org.yaml.snakeyaml.nodes.MappingNode;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.nodes.NodeTuple;
import org.yaml.snakeyaml.nodes.ScalarNode;
import org.yaml.snakeyaml.nodes.Tag;

/**
 * A YAML mapping read field by field. Every wrong thing (unknown or duplicate key, missing key, wrong type) is
 * recorded in the owning {@link YamlDoc} at the node it concerns; getters then return empty, so a loader goes on and
 * finds the other problems.
 */
public final class YamlMap {
    /** Decimal numbers as people write them: 250, -1.5, .5, 2e-3. No hex, octal, underscores or sexagesimal. */
    private static final Pattern NUMBER = Pattern.compile("[-+]?(\\d+(\\.\\d*)?|\\.\\d+)([eE][-+]?\\d+)?");
    private static final Pattern INFINITY = Pattern.compile("([-+]?)\\.(inf|Inf|INF)");

    private final YamlDoc doc;
    private final MappingNode node;
    private final String what;
    private final Map<String, NodeTuple> entries;

    YamlMap(YamlDoc doc, MappingNode node, String what, List<String> keys) {
        this.doc = doc;
        this.node = node;
        this.what = what;
        this.entries = new LinkedHashMap<>();
        for (NodeTuple t : node.getValue()) {
            Node k = t.getKeyNode();
            if (!(k instanceof ScalarNode) || isNull((ScalarNode) k)) {
                doc.problem(k, "a key in " + what + " must be a plain word, got " + YamlDoc.describe(k));
                continue;
            }
            String key = ((ScalarNode) k).getValue();
            NodeTuple first = entries.get(key);
            if (first != null) {
                Mark m = first.getKeyNode().getStartMark();
                doc.problem(k, "duplicate key '" + key + "' (first at line " + (m.getLine() + 1)
                        + ", column " + (m.getColumn() + 1) + ")");
            } else if (!keys.contains(key)) {
                doc.problem(k, "unknown key '" + key + "'; expected one of: " + String.join(", ", keys));
            } else {
                entries.put(key, t);
            }
        }
    }

    private YamlMap(YamlMap from, String what) {
        this.doc = from.doc;
        this.node = from.node;
        this.what = what;
        this.entries = from.entries;
    }

    /** The same mapping, described otherwise in later messages (for example once its name is known). */
    public YamlMap as(String newWhat) {
        return new YamlMap(this, newWhat);
    }

    public String what() {
        return what;
    }

    public MappingNode node() {
        return node;
    }

    public YamlDoc doc() {
        return doc;
    }

    public boolean has(String key) {
        return entries.containsKey(key);
    }

    /** Value node of {@code key}, if the key is present (even with an empty value). */
    public Optional<Node> node(String key) {
        NodeTuple t = entries.get(key);
        return t == null ? Optional.empty() : Optional.of(t.getValueNode());
    }

    /** Value node of {@code key}; its absence is a problem. */
    public Optional<Node> required(String key) {
        Optional<Node> n = node(key);
        if (n.isEmpty()) {
            doc.problem(node, what + " is missing required key '" + key + "'");
        }
        return n;
    }

    /** Where the key itself is written, for problems about the entry as a whole. */
    public Mark keyMark(String key) {
        NodeTuple t = entries.get(key);
        return t == null ? node.getStartMark() : t.getKeyNode().getStartMark();
    }

    /** Text of an optional scalar; an empty value counts as absent. */
    public Optional<String> string(String key) {
        return node(key).flatMap(n -> text(key, n, false));
    }

    /** Text of a required scalar. */
    public Optional<String> requiredString(String key) {
        return required(key).flatMap(n -> text(key, n, true));
    }

    /** An optional finite number. */
    public OptionalDouble number(String key) {
        Optional<Node> n = node(key);
        return n.isEmpty() ? OptionalDouble.empty() : number(key, n.get(), false, false);
    }

    /** A required finite number. */
    public OptionalDouble requiredNumber(String key) {
        Optional<Node> n = required(key);
        return n.isEmpty() ? OptionalDouble.empty() : number(key, n.get(), true, false);
    }

    /** A required number that may also be {@code .inf} or {@code -.inf} (an open end of a range). */
    public OptionalDouble requiredNumberOrInfinity(String key) {
        Optional<Node> n = required(key);
        return n.isEmpty() ? OptionalDouble.empty() : number(key, n.get(), true, true);
    }

    /** The raw text of a scalar value, for messages that quote what the user wrote. */
    public String raw(String key) {
        Optional<Node> n = node(key);
        return n.isPresent() && n.get() instanceof ScalarNode ? ((ScalarNode) n.get()).getValue() : "";
    }

    private Optional<String> text(String key, Node n, boolean required) {
        if (!(n instanceof ScalarNode)) {
            doc.problem(n, key + " must be text, got " + YamlDoc.describe(n));
            return Optional.empty();
        }
        ScalarNode s = (ScalarNode) n;
        if (isNull(s) || (required && s.getValue().isBlank())) {
            if (required) {
                doc.problem(n, key + " has no value");
            }
            return Optional.empty();
        }
        return Optional.of(s.getValue());
    }

    private OptionalDouble number(String key, Node n, boolean required, boolean infinityAllowed) {
        if (n instanceof ScalarNode && isNull((ScalarNode) n)) {
            if (required) {
                doc.problem(n, key + " has no value");
            }
            return OptionalDouble.empty();
        }
        OptionalDouble v = parseNumber(n, infinityAllowed);
        if (v.isEmpty()) {
            doc.problem(n, key + " must be a number, got " + YamlDoc.describe(n));
        }
        return v;
    }

    /** A number in a list item or other node without a key; the caller reports when it is empty. */
    public static OptionalDouble parseNumber(Node n, boolean infinityAllowed) {
        if (!(n instanceof ScalarNode)) {
            return OptionalDouble.empty();
        }
        String t = ((ScalarNode) n).getValue().trim();
        if (NUMBER.matcher(t).matches()) {
            double d = Double.parseDouble(t);
            return Double.isFinite(d) ? OptionalDouble.of(d) : OptionalDouble.empty();
        }
        if (infinityAllowed) {
            var m = INFINITY.matcher(t);
            if (m.matches()) {
                return OptionalDouble.of("-".equals(m.group(1)) ? Double.NEGATIVE_INFINITY : Double.POSITIVE_INFINITY);
            }
        }
        return OptionalDouble.empty();
    }

    /** A plain empty, {@code ~} or {@code null} scalar: YAML's way of writing nothing. */
    static boolean isNull(ScalarNode s) {
        return s.getScalarStyle() == DumperOptions.ScalarStyle.PLAIN && Tag.NULL.equals(s.getTag());
    }
}
