package org.pointcall.shared.yaml;

import java.io.IOException;
import java.io.StringReader;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Optional;

import org.pointcall.shared.error.InputRejectedException;
import org.pointcall.shared.error.Problem;
import org.yaml.snakeyaml.LoaderOptions;
import org.yaml.snakeyaml.Yaml;
import org.yaml.snakeyaml.error.Mark;
import org.yaml.snakeyaml.error.MarkedYAMLException;
import org.yaml.snakeyaml.error.YAMLException;
import org.yaml.snakeyaml.nodes.MappingNode;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.nodes.ScalarNode;
import org.yaml.snakeyaml.nodes.SequenceNode;

/**
 * One YAML text being read by a loader. It composes the text into SnakeYAML nodes (which keep their marks) and
 * collects every {@link Problem} found, so a loader can report them all at once instead of stopping at the first.
 * Not thread-safe: one instance per read.
 */
public final class YamlDoc {
    private final String source;
    private final List<Problem> problems = new ArrayList<>();

    public YamlDoc(String source) {
        this.source = source;
    }

    public String source() {
        return source;
    }

    /**
     * Reads a whole UTF-8 text file. A missing, unreadable or non-UTF-8 file is rejected with one problem naming it.
     */
    public static String readFile(Path file) {
        try {
            return Files.readString(file, StandardCharsets.UTF_8);
        } catch (NoSuchFileException e) {
            throw reject(file, "no such file");
        } catch (CharacterCodingException e) {
            throw reject(file, "not UTF-8 text");
        } catch (IOException e) {
            throw reject(file, "cannot be read (" + e.getClass().getSimpleName() + ": " + e.getMessage() + ")");
        }
    }

    private static InputRejectedException reject(Path file, String why) {
        return new InputRejectedException(List.of(new Problem(file.toString(), 0, 0, why)));
    }

    /**
     * Composes the single document of {@code text}. A syntax error becomes one problem at SnakeYAML's mark; an empty
     * text (or one of comments only) becomes a whole-file problem. Either way the result is empty.
     */
    public Optional<Node> compose(String text) {
        String t = !text.isEmpty() && text.charAt(0) == '\uFEFF' ? text.substring(1) : text;
        Node root;
        try {
            root = new Yaml(new LoaderOptions()).compose(new StringReader(t));
        } catch (MarkedYAMLException e) {
            Mark m = e.getProblemMark() != null ? e.getProblemMark() : e.getContextMark();
            StringBuilder msg = new StringBuilder("YAML syntax error: ").append(e.getProblem());
            if (e.getContext() != null) {
                msg.append(" (").append(e.getContext());
                if (e.getContextMark() != null && e.getContextMark() != m) {
                    msg.append(" started at line ").append(e.getContextMark().getLine() + 1)
                            .append(", column ").append(e.getContextMark().getColumn() + 1);
                }
                msg.append(')');
            }
            problem(m, msg.toString());
            return Optional.empty();
        } catch (YAMLException e) {
            problem("YAML syntax error: " + e.getMessage());
            return Optional.empty();
        }
        if (root == null) {
            problem("file is empty: no YAML document in it");
            return Optional.empty();
        }
        return Optional.of(root);
    }

    /** Records a problem at the start of {@code at}. */
    public void problem(Node at, String message) {
        problem(at.getStartMark(), message);
    }

    /** Records a problem at {@code at} (SnakeYAML marks are 0-based, problems 1-based). */
    public void problem(Mark at, String message) {
        if (at == null) {
            problem(message);
        } else {
            problems.add(new Problem(source, at.getLine() + 1, at.getColumn() + 1, message));
        }
    }

    /** Records a problem about the whole source. */
    public void problem(String message) {
        problems.add(new Problem(source, 0, 0, message));
    }

    public boolean hasProblems() {
        return !problems.isEmpty();
    }

    /** Problems so far, in source order (line, then column, then the order found). */
    public List<Problem> problems() {
        List<Problem> sorted = new ArrayList<>(problems);
        Collections.sort(sorted);
        return List.copyOf(sorted);
    }

    /** Throws {@link InputRejectedException} with every problem, sorted, if there is any. */
    public void rejectIfAny() {
        if (!problems.isEmpty()) {
            throw new InputRejectedException(problems());
        }
    }

    /**
     * Views {@code node} as a mapping with the given keys (in the order they are listed to the user). Unknown and
     * duplicate keys are reported; a node that is not a mapping is reported and gives an empty result.
     */
    public Optional<YamlMap> map(Node node, String what, List<String> keys) {
        if (!(node instanceof MappingNode)) {
            problem(node, what + " must be a mapping of keys (" + String.join(", ", keys) + "), got "
                    + describe(node));
            return Optional.empty();
        }
        return Optional.of(new YamlMap(this, (MappingNode) node, what, keys));
    }

    /** Items of {@code node} when it is a sequence; otherwise a problem and an empty result. */
    public Optional<List<Node>> list(Node node, String what) {
        if (node instanceof SequenceNode) {
            return Optional.of(((SequenceNode) node).getValue());
        }
        problem(node, what + " must be a list, got " + describe(node));
        return Optional.empty();
    }

    /** How a node reads in a message: the scalar text in quotes, or "a list", "a mapping". */
    public static String describe(Node node) {
        if (node instanceof ScalarNode) {
            ScalarNode s = (ScalarNode) node;
            if (YamlMap.isNull(s)) {
                return "no value";
            }
            return "'" + s.getValue() + "'";
        }
        if (node instanceof SequenceNode) {
            return "a list";
        }
        return "a mapping";
    }
}
