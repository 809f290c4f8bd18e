package org.pointcall.shared.dictionary;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.Set;
import java.util.regex.Pattern;
import java.util.stream.Collectors;

import org.pointcall.shared.error.InputRejectedException;
import org.pointcall.shared.units.Dimension;
import org.pointcall.shared.units.Unit;
import org.pointcall.shared.yaml.YamlDoc;
import org.pointcall.shared.yaml.YamlMap;
import org.pointcall.shared.yaml.YamlWriter;
import org.yaml.snakeyaml.error.Mark;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.nodes.SequenceNode;

/**
 * Reads and writes the parameter dictionary file (YAML; the format is described in the shared module's README).
 * Reading reports every problem of a file at once, each with its line and column, and returns nothing unless the
 * whole file is valid. Writing is deterministic and reads back to an equal dictionary.
 */
public final class DictionaryFiles {
    private static final List<String> TOP_KEYS = List.of("name", "parameters");
    private static final List<String> PARAMETER_KEYS = List.of("name", "unit", "description", "rate", "valid",
            "column", "calibration", "derive");
    private static final List<String> RANGE_KEYS = List.of("min", "max");
    private static final List<String> CALIBRATION_KEYS = List.of("polynomial", "table");
    private static final List<String> DERIVE_KEYS = List.of("method", "inputs");
    private static final Pattern NAME = Pattern.compile("[A-Za-z][A-Za-z0-9_.]*");

    private DictionaryFiles() {
    }

    /** Reads a dictionary file (UTF-8); the problems name the file as {@code file} is written. */
    public static ParameterDictionary load(Path file) {
        return parse(YamlDoc.readFile(file), file.toString());
    }

    /**
     * Reads dictionary text.
     *
     * @param sourceName how problems name the text (a file name, "announce from 10.0.0.7")
     * @throws InputRejectedException with every problem found, sorted by line and column
     */
    public static ParameterDictionary parse(String yamlText, String sourceName) {
        YamlDoc doc = new YamlDoc(sourceName);
        Optional<Node> root = doc.compose(yamlText);
        ParameterDictionary dict = root.map(r -> read(doc, r)).orElse(null);
        doc.rejectIfAny();
        return dict;
    }

    /** What one parameter entry said, with the nodes needed to place later problems. */
    private static final class Draft {
        Node node;
        String name;
        Unit unit;
        Node unitNode;
        String description;
        double rateHz = Double.NaN;
        double validMin = Double.NaN;
        double validMax = Double.NaN;
        String column;
        Calibration calibration;
        Node deriveNode;
        DerivationMethod method;
        final List<String> inputs = new ArrayList<>();
        final List<Node> inputNodes = new ArrayList<>();
    }

    private static ParameterDictionary read(YamlDoc doc, Node root) {
        Optional<YamlMap> top = doc.map(root, "a dictionary file", TOP_KEYS);
        if (top.isEmpty()) {
            return null;
        }
        YamlMap m = top.get().as("the dictionary");
        Optional<String> name = m.requiredString("name");
        List<Draft> drafts = new ArrayList<>();
        Optional<Node> listNode = m.required("parameters");
        if (listNode.isPresent()) {
            Optional<List<Node>> items = doc.list(listNode.get(), "parameters");
            if (items.isPresent() && items.get().isEmpty()) {
                doc.problem(listNode.get(), "parameters must list at least one parameter");
            }
            for (Node item : items.orElse(List.of())) {
                drafts.add(readParameter(doc, item));
            }
        }
        checkNames(doc, drafts);
        checkDerivations(doc, drafts);
        if (doc.hasProblems()) {
            return null;
        }
        List<Parameter> ps = new ArrayList<>();
        for (Draft d : drafts) {
            try {
                Derivation der = d.method == null ? null : new Derivation(d.method, d.inputs);
                ps.add(new Parameter(d.name, d.unit, d.description, d.rateHz, d.validMin, d.validMax, d.column,
                        d.calibration, der));
            } catch (IllegalArgumentException e) {
                // every rule of the model is checked above with a better message; this keeps a new rule honest
                doc.problem(d.node, e.getMessage());
            }
        }
        return doc.hasProblems() ? null : new ParameterDictionary(name.orElseThrow(), ps);
    }

    private static Draft readParameter(YamlDoc doc, Node item) {
        Draft d = new Draft();
        d.node = item;
        Optional<YamlMap> om = doc.map(item, "a parameter", PARAMETER_KEYS);
        if (om.isEmpty()) {
            return d;
        }
        YamlMap m = om.get().as("a parameter");
        Optional<String> name = m.requiredString("name");
        if (name.isPresent()) {
            if (NAME.matcher(name.get()).matches()) {
                d.name = name.get();
                m = m.as("parameter " + d.name);
            } else {
                doc.problem(m.node("name").orElseThrow(), "parameter name '" + name.get()
                        + "' must start with a letter and hold only letters, digits, '_' and '.'");
            }
        }
        Optional<String> unit = m.requiredString("unit");
        d.unitNode = m.node("unit").orElse(null);
        if (unit.isPresent()) {
            d.unit = Unit.bySymbol(unit.get()).orElse(null);
            if (d.unit == null) {
                doc.problem(d.unitNode, "unknown unit '" + unit.get() + "'; known units: " + Unit.knownSymbols());
            }
        }
        d.description = m.string("description").orElse("");
        OptionalDouble rate = m.requiredNumber("rate");
        if (rate.isPresent()) {
            if (rate.getAsDouble() > 0) {
                d.rateHz = rate.getAsDouble();
            } else {
                doc.problem(m.node("rate").orElseThrow(), "rate must be a positive number of Hz, got '"
                        + m.raw("rate") + "'");
            }
        }
        Optional<Node> valid = m.required("valid");
        if (valid.isPresent()) {
            readRange(doc, valid.get(), d, m.what());
        }
        d.column = m.string("column").orElse(null);
        Optional<Node> cal = m.node("calibration");
        if (cal.isPresent()) {
            d.calibration = readCalibration(doc, cal.get(), m.what());
        }
        Optional<Node> der = m.node("derive");
        if (der.isPresent()) {
            d.deriveNode = der.get();
            readDerivation(doc, der.get(), d, m.what());
            if (cal.isPresent()) {
                doc.problem(m.keyMark("calibration"), m.what()
                        + " is derived, so it takes no calibration (calibrate its inputs)");
            }
        }
        return d;
    }

    private static void readRange(YamlDoc doc, Node node, Draft d, String of) {
        Optional<YamlMap> om = doc.map(node, "valid range of " + of.replaceFirst("^parameter ", ""), RANGE_KEYS);
        if (om.isEmpty()) {
            return;
        }
        YamlMap r = om.get();
        OptionalDouble min = r.requiredNumberOrInfinity("min");
        OptionalDouble max = r.requiredNumberOrInfinity("max");
        if (min.isPresent() && max.isPresent()) {
            if (max.getAsDouble() > min.getAsDouble()) {
                d.validMin = min.getAsDouble();
                d.validMax = max.getAsDouble();
            } else {
                doc.problem(node, r.what() + " must have max above min, got min " + r.raw("min") + ", max "
                        + r.raw("max"));
            }
        }
    }

    private static Calibration readCalibration(YamlDoc doc, Node node, String of) {
        Optional<YamlMap> om = doc.map(node, "calibration of " + of.replaceFirst("^parameter ", ""),
                CALIBRATION_KEYS);
        if (om.isEmpty()) {
            return null;
        }
        YamlMap c = om.get();
        boolean poly = c.has("polynomial");
        boolean table = c.has("table");
        if (poly == table) {
            doc.problem(node, c.what() + (poly ? " takes 'polynomial' or 'table', not both"
                    : " needs 'polynomial' (coefficients c0, c1, ...) or 'table' (rows [raw, eu])"));
            return null;
        }
        if (poly) {
            Node pn = c.node("polynomial").orElseThrow();
            Optional<List<Node>> items = doc.list(pn, "polynomial");
            if (items.isEmpty()) {
                return null;
            }
            if (items.get().isEmpty()) {
                doc.problem(pn, "polynomial needs at least one coefficient (c0)");
                return null;
            }
            double[] coef = new double[items.get().size()];
            boolean ok = true;
            for (int i = 0; i < coef.length; i++) {
                Node n = items.get().get(i);
                OptionalDouble v = YamlMap.parseNumber(n, false);
                if (v.isEmpty()) {
                    doc.problem(n, "polynomial coefficient c" + i + " must be a number, got " + YamlDoc.describe(n));
                    ok = false;
                } else {
                    coef[i] = v.getAsDouble();
                }
            }
            return ok ? new Calibration.Polynomial(coef) : null;
        }
        Node tn = c.node("table").orElseThrow();
        Optional<List<Node>> rows = doc.list(tn, "table");
        if (rows.isEmpty()) {
            return null;
        }
        if (rows.get().size() < 2) {
            doc.problem(tn, "calibration table needs at least two rows [raw, eu], got " + rows.get().size());
            return null;
        }
        int n = rows.get().size();
        double[] raw = new double[n];
        double[] eu = new double[n];
        boolean ok = true;
        for (int i = 0; i < n; i++) {
            Node row = rows.get().get(i);
            List<Node> cells = row instanceof SequenceNode ? ((SequenceNode) row).getValue() : null;
            OptionalDouble r = cells != null && cells.size() == 2 ? YamlMap.parseNumber(cells.get(0), false)
                    : OptionalDouble.empty();
            OptionalDouble e = cells != null && cells.size() == 2 ? YamlMap.parseNumber(cells.get(1), false)
                    : OptionalDouble.empty();
            if (r.isEmpty() || e.isEmpty()) {
                doc.problem(row, "calibration table row " + (i + 1) + " must be a pair of numbers [raw, eu], got "
                        + rowText(row));
                ok = false;
                continue;
            }
            raw[i] = r.getAsDouble();
            eu[i] = e.getAsDouble();
            if (i > 0 && ok && !(raw[i] > raw[i - 1])) {
                doc.problem(row, "calibration table raw values must increase: raw " + cellText(cells.get(0))
                        + " (row " + (i + 1) + ") is not above raw " + YamlWriter.number(raw[i - 1]) + " (row " + i
                        + ")");
                ok = false;
            }
        }
        return ok ? new Calibration.Breakpoints(raw, eu) : null;
    }

    private static String rowText(Node row) {
        if (row instanceof SequenceNode) {
            return "[" + ((SequenceNode) row).getValue().stream().map(DictionaryFiles::cellText)
                    .collect(Collectors.joining(", ")) + "]";
        }
        return YamlDoc.describe(row);
    }

    private static String cellText(Node n) {
        String s = YamlDoc.describe(n);
        return s.startsWith("'") ? s.substring(1, s.length() - 1) : s;
    }

    private static void readDerivation(YamlDoc doc, Node node, Draft d, String of) {
        Optional<YamlMap> om = doc.map(node, "derivation of " + of.replaceFirst("^parameter ", ""), DERIVE_KEYS);
        if (om.isEmpty()) {
            return;
        }
        YamlMap m = om.get();
        Optional<String> key = m.requiredString("method");
        if (key.isPresent()) {
            d.method = DerivationMethod.byKey(key.get()).orElse(null);
            if (d.method == null) {
                doc.problem(m.node("method").orElseThrow(), "unknown derivation method '" + key.get()
                        + "'; expected one of: " + methodKeys());
            }
        }
        Optional<Node> in = m.required("inputs");
        if (in.isEmpty() || d.method == null) {
            return;
        }
        Optional<YamlMap> oi = doc.map(in.get(), "inputs of " + d.method.key(), d.method.inputRoles());
        if (oi.isEmpty()) {
            return;
        }
        boolean complete = true;
        for (String role : d.method.inputRoles()) {
            Optional<String> p = oi.get().requiredString(role);
            if (p.isPresent()) {
                d.inputs.add(p.get());
                d.inputNodes.add(oi.get().node(role).orElseThrow());
            } else {
                complete = false;
            }
        }
        if (!complete) {
            d.method = null;
        }
    }

    private static String methodKeys() {
        StringBuilder b = new StringBuilder();
        for (DerivationMethod dm : DerivationMethod.values()) {
            b.append(b.length() == 0 ? "" : ", ").append(dm.key());
        }
        return b.toString();
    }

    private static void checkNames(YamlDoc doc, List<Draft> drafts) {
        Map<String, Draft> first = new HashMap<>();
        for (Draft d : drafts) {
            if (d.name == null) {
                continue;
            }
            Draft f = first.putIfAbsent(d.name, d);
            if (f != null) {
                Mark m = f.node.getStartMark();
                doc.problem(d.node, "duplicate parameter '" + d.name + "' (first at line " + (m.getLine() + 1)
                        + ", column " + (m.getColumn() + 1) + ")");
            }
        }
    }

    private static void checkDerivations(YamlDoc doc, List<Draft> drafts) {
        Map<String, Integer> byName = new LinkedHashMap<>();
        for (int i = 0; i < drafts.size(); i++) {
            if (drafts.get(i).name != null) {
                byName.putIfAbsent(drafts.get(i).name, i);
            }
        }
        for (Draft d : drafts) {
            if (d.method == null) {
                continue;
            }
            Dimension rateOf = null;
            for (int k = 0; k < d.inputs.size(); k++) {
                String in = d.inputs.get(k);
                Node at = d.inputNodes.get(k);
                Integer idx = byName.get(in);
                if (idx == null) {
                    doc.problem(at, "unknown input '" + in + "' of " + d.method.key()
                            + ": no parameter of that name in the dictionary");
                    continue;
                }
                Unit inUnit = drafts.get(idx).unit;
                if (inUnit == null) {
                    continue;
                }
                Dimension need = d.method.inputDimensions().get(k);
                if (need != null && inUnit.dimension() != need) {
                    doc.problem(at, "unit mismatch: input '" + in + "' of " + d.method.key() + " must be "
                            + DimensionRules.phrase(need) + ", but " + in + " is in " + inUnit.symbol());
                } else if (need == null) {
                    if (DimensionRules.perSecond(inUnit.dimension()).isEmpty()) {
                        doc.problem(at, "input '" + in + "' of " + d.method.key() + " is "
                                + DimensionRules.phrase(inUnit.dimension())
                                + ", and pointcall has no unit for its rate of change");
                    } else {
                        rateOf = inUnit.dimension();
                    }
                }
            }
            if (d.unit == null) {
                continue;
            }
            Dimension out = d.method.outputDimension();
            if (out != null && d.unit.dimension() != out) {
                doc.problem(d.unitNode, "unit mismatch: " + d.method.key() + " gives " + DimensionRules.phrase(out)
                        + ", but " + d.name + " is in " + d.unit.symbol());
            } else if (out == null && rateOf != null
                    && !DimensionRules.perSecond(rateOf).contains(d.unit.dimension())) {
                List<Dimension> ok = DimensionRules.perSecond(rateOf);
                List<String> symbols = new ArrayList<>();
                for (Dimension dd : ok) {
                    symbols.addAll(DimensionRules.symbols(dd));
                }
                doc.problem(d.unitNode, "unit mismatch: the rate of change of " + d.inputs.get(0) + " is "
                        + ok.stream().map(DimensionRules::phrase).collect(Collectors.joining(" or ")) + " ("
                        + String.join(", ", symbols) + "), but " + d.name + " is in " + d.unit.symbol());
            }
        }
        reportCycles(doc, drafts, byName);
    }

    /** Depth-first search over "is computed from"; each cycle is reported once, at its first parameter in the file. */
    private static void reportCycles(YamlDoc doc, List<Draft> drafts, Map<String, Integer> byName) {
        int n = drafts.size();
        int[] state = new int[n]; // 0 new, 1 on the current path, 2 done
        Set<String> reported = new HashSet<>();
        for (int s = 0; s < n; s++) {
            if (state[s] == 0) {
                visit(s, drafts, byName, state, new ArrayList<>(), reported, doc);
            }
        }
    }

    private static void visit(int i, List<Draft> drafts, Map<String, Integer> byName, int[] state, List<Integer> path,
                              Set<String> reported, YamlDoc doc) {
        state[i] = 1;
        path.add(i);
        Draft d = drafts.get(i);
        if (d.method != null) {
            for (String in : d.inputs) {
                Integer j = byName.get(in);
                if (j == null) {
                    continue;
                }
                if (state[j] == 1) {
                    List<Integer> cycle = new ArrayList<>(path.subList(path.indexOf(j), path.size()));
                    int startAt = cycle.indexOf(cycle.stream().min(Integer::compare).orElseThrow());
                    List<Integer> rotated = new ArrayList<>(cycle.subList(startAt, cycle.size()));
                    rotated.addAll(cycle.subList(0, startAt));
                    StringBuilder text = new StringBuilder();
                    for (int k : rotated) {
                        text.append(drafts.get(k).name).append(" -> ");
                    }
                    text.append(drafts.get(rotated.get(0)).name);
                    if (reported.add(text.toString())) {
                        doc.problem(drafts.get(rotated.get(0)).deriveNode, "derivation cycle: " + text
                                + " (a parameter cannot be computed, even indirectly, from itself)");
                    }
                } else if (state[j] == 0) {
                    visit(j, drafts, byName, state, path, reported, doc);
                }
            }
        }
        path.remove(path.size() - 1);
        state[i] = 2;
    }

    /**
     * Writes {@code dict} as dictionary text: same dictionary, same bytes. Optional fields at their default (empty
     * description, column equal to the name, no calibration) are left out.
     */
    public static String toYaml(ParameterDictionary dict) {
        YamlWriter w = new YamlWriter();
        w.comment(0, "pointcall parameter dictionary; the order of the parameters is their frame slot order");
        w.entry(0, "name", YamlWriter.scalar(dict.name()));
        w.entry(0, "parameters", "");
        for (Parameter p : dict.parameters()) {
            w.entry(2, "- ", "name", YamlWriter.scalar(p.name()));
            w.entry(4, "unit", YamlWriter.scalar(p.unit().symbol()));
            if (!p.description().isEmpty()) {
                w.text(4, "description", p.description());
            }
            w.entry(4, "rate", YamlWriter.number(p.rateHz()));
            w.entry(4, "valid", "{min: " + YamlWriter.number(p.validMin()) + ", max: "
                    + YamlWriter.number(p.validMax()) + "}");
            if (!p.column().equals(p.name())) {
                w.entry(4, "column", YamlWriter.scalar(p.column()));
            }
            Calibration c = p.calibration();
            if (c instanceof Calibration.Polynomial) {
                w.entry(4, "calibration", "");
                w.entry(6, "polynomial", YamlWriter.numbers(((Calibration.Polynomial) c).coefficients()));
            } else if (c instanceof Calibration.Breakpoints) {
                Calibration.Breakpoints b = (Calibration.Breakpoints) c;
                double[] raw = b.raw();
                double[] eu = b.eu();
                w.entry(4, "calibration", "");
                w.entry(6, "table", "");
                for (int i = 0; i < raw.length; i++) {
                    w.line(8, "- " + YamlWriter.numbers(raw[i], eu[i]));
                }
            }
            if (p.derivation() != null) {
                Derivation der = p.derivation();
                w.entry(4, "derive", "");
                w.entry(6, "method", der.method().key());
                StringBuilder in = new StringBuilder("{");
                for (int i = 0; i < der.inputs().size(); i++) {
                    in.append(i == 0 ? "" : ", ").append(der.method().inputRoles().get(i)).append(": ")
                            .append(YamlWriter.flowScalar(der.inputs().get(i)));
                }
                w.entry(6, "inputs", in.append('}').toString());
            }
        }
        return w.toString();
    }
}
