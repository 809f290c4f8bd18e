package org.pointcall.shared.card;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.stream.Collectors;

import org.pointcall.shared.dictionary.DimensionRules;
import org.pointcall.shared.dictionary.Parameter;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.InputRejectedException;
import org.pointcall.shared.kind.ManoeuvreKind;
import org.pointcall.shared.kind.MetricSpec;
import org.pointcall.shared.units.Dimension;
import org.pointcall.shared.units.Unit;
import org.pointcall.shared.yaml.YamlDoc;
import org.pointcall.shared.yaml.YamlMap;
import org.pointcall.shared.yaml.YamlWriter;
import org.yaml.snakeyaml.error.Mark;
import org.yaml.snakeyaml.nodes.Node;

/**
 * Reads and writes the test card file (YAML; the format is described in the shared module's README). A card is read
 * against the parameter dictionary of the stream it will be flown with: every parameter it names must be in it, in a
 * unit of the same dimension. Every problem of a file is reported at once; nothing of a rejected file is returned.
 */
public final class CardFiles {
    private static final List<String> TOP_KEYS = List.of("sortie", "airframe", "area", "notes", "limits", "points");
    private static final List<String> POINT_KEYS = List.of("id", "kind", "title", "config", "hold", "bands");
    private static final List<String> BAND_KEYS = List.of("parameter", "metric", "phase", "at", "before", "over",
            "target", "tol", "tol-minus", "tol-plus", "min", "max", "unit");
    private static final List<String> LIMIT_KEYS = List.of("parameter", "min", "max", "unit");

    private CardFiles() {
    }

    /** Reads a card file (UTF-8) against {@code dict}; problems name the file as {@code card} is written. */
    public static TestCard load(Path card, ParameterDictionary dict) {
        return parse(YamlDoc.readFile(card), card.toString(), dict);
    }

    /**
     * Reads card text against {@code dict}.
     *
     * @throws InputRejectedException with every problem found, sorted by line and column
     */
    public static TestCard parse(String text, String sourceName, ParameterDictionary dict) {
        YamlDoc doc = new YamlDoc(sourceName);
        Optional<Node> root = doc.compose(text);
        TestCard card = root.map(r -> new Reader(doc, dict).card(r)).orElse(null);
        doc.rejectIfAny();
        return card;
    }

    /** One read; holds the dictionary and the document the problems go to. */
    private static final class Reader {
        private final YamlDoc doc;
        private final ParameterDictionary dict;

        Reader(YamlDoc doc, ParameterDictionary dict) {
            this.doc = doc;
            this.dict = dict;
        }

        TestCard card(Node root) {
            Optional<YamlMap> top = doc.map(root, "a test card file", TOP_KEYS);
            if (top.isEmpty()) {
                return null;
            }
            YamlMap m = top.get().as("the test card");
            Optional<String> sortie = m.requiredString("sortie");
            Optional<String> airframe = m.requiredString("airframe");
            String area = m.string("area").orElse("");
            String notes = m.string("notes").orElse("");
            List<SafetyLimit> limits = new ArrayList<>();
            Optional<Node> ln = m.node("limits");
            if (ln.isPresent() && !isEmptyValue(ln.get())) {
                for (Node item : doc.list(ln.get(), "limits").orElse(List.of())) {
                    limit(item).ifPresent(limits::add);
                }
            }
            List<TestPoint> points = new ArrayList<>();
            Map<String, Node> firstId = new HashMap<>();
            Optional<Node> pn = m.required("points");
            if (pn.isPresent()) {
                Optional<List<Node>> items = doc.list(pn.get(), "points");
                if (items.isPresent() && items.get().isEmpty()) {
                    doc.problem(pn.get(), "points must list at least one test point");
                }
                for (Node item : items.orElse(List.of())) {
                    point(item, firstId).ifPresent(points::add);
                }
            }
            if (doc.hasProblems()) {
                return null;
            }
            try {
                return new TestCard(sortie.orElseThrow(), airframe.orElseThrow(), area, notes, limits, points);
            } catch (IllegalArgumentException e) {
                doc.problem(root, e.getMessage());
                return null;
            }
        }

        private Optional<SafetyLimit> limit(Node item) {
            Optional<YamlMap> om = doc.map(item, "a safety limit", LIMIT_KEYS);
            if (om.isEmpty()) {
                return Optional.empty();
            }
            YamlMap m = om.get().as("a safety limit");
            Optional<Parameter> p = m.requiredString("parameter").flatMap(name -> parameter(m, name));
            String what = "limit on " + p.map(Parameter::name).orElse(m.raw("parameter"));
            Optional<Unit> unit = m.requiredString("unit").flatMap(u -> unit(m, u,
                    p.map(pp -> List.of(pp.unit().dimension())).orElse(null), what, p.map(Parameter::name)
                            .orElse(null), false));
            OptionalDouble min = m.number("min");
            OptionalDouble max = m.number("max");
            boolean ok = true;
            if (min.isEmpty() && max.isEmpty() && !m.has("min") && !m.has("max")) {
                doc.problem(item, what + " needs min, max or both");
                ok = false;
            } else if (min.isPresent() && max.isPresent() && !(max.getAsDouble() > min.getAsDouble())) {
                doc.problem(item, what + " must have max above min, got min " + m.raw("min") + ", max "
                        + m.raw("max"));
                ok = false;
            }
            if (!ok || p.isEmpty() || unit.isEmpty() || (m.has("min") && min.isEmpty())
                    || (m.has("max") && max.isEmpty())) {
                return Optional.empty();
            }
            return build(item, () -> SafetyLimit.of(p.get().name(), unit.get(),
                    min.orElse(Double.NEGATIVE_INFINITY), max.orElse(Double.POSITIVE_INFINITY)));
        }

        private Optional<TestPoint> point(Node item, Map<String, Node> firstId) {
            Optional<YamlMap> om = doc.map(item, "a test point", POINT_KEYS);
            if (om.isEmpty()) {
                return Optional.empty();
            }
            YamlMap m = om.get().as("a test point");
            Optional<String> id = m.requiredString("id");
            if (id.isPresent()) {
                Node idNode = m.node("id").orElseThrow();
                if (!TestPoint.ID.matcher(id.get()).matches()) {
                    doc.problem(idNode, "point id '" + id.get()
                            + "' must start with a letter or digit and hold only letters, digits, '-', '_' and '.'");
                    id = Optional.empty();
                } else {
                    Node first = firstId.putIfAbsent(id.get(), idNode);
                    if (first != null) {
                        Mark f = first.getStartMark();
                        doc.problem(idNode, "duplicate point id '" + id.get() + "' (first at line "
                                + (f.getLine() + 1) + ", column " + (f.getColumn() + 1) + ")");
                    }
                    m = m.as("point " + id.get());
                }
            }
            Optional<ManoeuvreKind> kind = m.requiredString("kind").flatMap(k -> {
                Optional<ManoeuvreKind> mk = ManoeuvreKind.byKey(k);
                if (mk.isEmpty()) {
                    String why = "transit".equals(k)
                            ? "unknown kind 'transit': transit is the flying between points, not a test point; "
                            : "unknown kind '" + k + "'; ";
                    doc.problem(om.get().node("kind").orElseThrow(), why + "expected one of: " + ManoeuvreKind.keys());
                }
                return mk;
            });
            Optional<String> title = m.requiredString("title");
            String config = m.string("config").orElse("");
            double holdS = Double.NaN;
            OptionalDouble hold = m.number("hold");
            if (hold.isPresent()) {
                if (hold.getAsDouble() > 0) {
                    holdS = hold.getAsDouble();
                } else {
                    doc.problem(m.node("hold").orElseThrow(), "hold must be a positive number of seconds, got '"
                            + m.raw("hold") + "'");
                }
            }
            List<Band> bands = new ArrayList<>();
            boolean bandsOk = true;
            Optional<Node> bn = m.node("bands");
            if (bn.isPresent() && !isEmptyValue(bn.get())) {
                Optional<List<Node>> items = doc.list(bn.get(), "bands");
                bandsOk = items.isPresent();
                for (Node b : items.orElse(List.of())) {
                    Optional<Band> band = band(b, kind.orElse(null), kind.isPresent());
                    band.ifPresent(bands::add);
                    bandsOk &= band.isPresent();
                }
            }
            if (id.isEmpty() || kind.isEmpty() || title.isEmpty() || !bandsOk) {
                return Optional.empty();
            }
            double h = holdS;
            String i = id.get();
            return build(item, () -> new TestPoint(i, kind.get(), title.get(), config, h, bands));
        }

        /** One band; {@code kind} is null when the point's kind is unknown (then metrics and instants go unchecked). */
        private Optional<Band> band(Node item, ManoeuvreKind kind, boolean kindKnown) {
            Optional<YamlMap> om = doc.map(item, "a band", BAND_KEYS);
            if (om.isEmpty()) {
                return Optional.empty();
            }
            YamlMap m = om.get().as("a band");
            boolean ok = true;

            // what it is on
            String paramName = null;
            String metricName = null;
            List<Dimension> dims = null;
            Optional<Parameter> param = Optional.empty();
            MetricSpec metric = null;
            if (m.has("parameter") && m.has("metric")) {
                doc.problem(item, "a band is on a parameter or on a metric, not both");
                ok = false;
            } else if (!m.has("parameter") && !m.has("metric")) {
                doc.problem(item, "a band needs 'parameter' (a dictionary name) or 'metric' (a result of the kind)");
                ok = false;
            } else if (m.has("parameter")) {
                Optional<String> pn = m.requiredString("parameter");
                param = pn.flatMap(n -> parameter(m, n));
                paramName = pn.orElse(null);
                ok &= param.isPresent();
            } else {
                Optional<String> mn = m.requiredString("metric");
                metricName = mn.orElse(null);
                if (mn.isPresent() && kind != null) {
                    metric = kind.metric(mn.get()).orElse(null);
                    if (metric == null) {
                        doc.problem(m.node("metric").orElseThrow(), "unknown metric '" + mn.get() + "' of "
                                + kind.key() + "; its metrics are: " + kind.metrics().stream()
                                .map(MetricSpec::name).collect(Collectors.joining(", ")));
                    }
                }
                ok &= metric != null;
            }
            String subject = paramName != null ? paramName : metricName;
            String what = "band on " + (subject == null ? "?" : subject);
            final YamlMap bm = subject == null ? m : m.as(what);

            // when it applies
            BandPhase phase = null;
            if (metricName != null || bm.has("metric")) {
                phase = BandPhase.RESULT;
                Optional<String> ph = bm.string("phase");
                if (ph.isPresent() && !ph.get().equals(BandPhase.RESULT.key())) {
                    doc.problem(bm.node("phase").orElseThrow(), "a band on a metric applies to the result: its phase is "
                            + "result (or left out), got '" + ph.get() + "'");
                    ok = false;
                }
            } else if (bm.has("parameter")) {
                Optional<String> ph = bm.requiredString("phase");
                if (ph.isPresent()) {
                    phase = BandPhase.byKey(ph.get()).orElse(null);
                    if (phase == null) {
                        doc.problem(bm.node("phase").orElseThrow(), "unknown phase '" + ph.get()
                                + "'; expected one of: " + BandPhase.keys());
                    } else if (phase == BandPhase.RESULT) {
                        doc.problem(bm.node("phase").orElseThrow(), "phase result is for a band on a metric; a band "
                                + "on a parameter applies at entry, throughout, rate or instant");
                        phase = null;
                    }
                }
                ok &= phase != null;
            }
            String instant = null;
            double overS = Double.NaN;
            ok &= onlyWith(bm, "at", phase, BandPhase.INSTANT);
            ok &= onlyWith(bm, "before", phase, BandPhase.RATE);
            ok &= onlyWith(bm, "over", phase, BandPhase.RATE);
            if (phase == BandPhase.INSTANT || phase == BandPhase.RATE) {
                String key = phase == BandPhase.INSTANT ? "at" : "before";
                Optional<String> at = bm.requiredString(key);
                if (at.isPresent() && kind != null && !kind.hasInstant(at.get())) {
                    doc.problem(bm.node(key).orElseThrow(), "unknown key instant '" + at.get() + "' of " + kind.key()
                            + "; its instants are: " + String.join(", ", kind.keyInstants()));
                    ok = false;
                }
                instant = at.orElse(null);
                ok &= at.isPresent();
            }
            if (phase == BandPhase.RATE) {
                OptionalDouble over = bm.requiredNumber("over");
                if (over.isPresent() && !(over.getAsDouble() > 0)) {
                    doc.problem(bm.node("over").orElseThrow(), "over must be a positive number of seconds, got '"
                            + bm.raw("over") + "'");
                    ok = false;
                } else if (over.isPresent()) {
                    overS = over.getAsDouble();
                } else {
                    ok = false;
                }
            }

            // its unit
            boolean rate = phase == BandPhase.RATE;
            if (param.isPresent()) {
                Dimension pd = param.get().unit().dimension();
                dims = rate ? DimensionRules.perSecond(pd) : List.of(pd);
                if (dims.isEmpty()) {
                    doc.problem(bm.node("phase").orElseThrow(), "a rate band on " + paramName + " is not possible: "
                            + paramName + " is " + DimensionRules.phrase(pd)
                            + ", and pointcall has no unit for its rate of change");
                    ok = false;
                    dims = null;
                }
            } else if (metric != null) {
                dims = List.of(metric.unit().dimension());
            }
            final List<Dimension> expect = dims;
            Optional<Unit> unit = bm.requiredString("unit").flatMap(u -> unit(bm, u, expect,
                    (rate ? "rate " : "") + what, subject, rate));
            ok &= unit.isPresent();

            // its limits
            Optional<double[]> limits = limits(bm, item, what);
            ok &= limits.isPresent();
            if (!ok || !kindKnown) {
                return Optional.empty();
            }
            Unit u = unit.get();
            double[] l = limits.get();
            String pName = paramName;
            String mName = metricName;
            BandPhase ph = phase;
            String in = instant;
            double ov = overS;
            if (!Double.isNaN(l[0])) {
                return build(item, () -> Band.ofTarget(pName, mName, ph, in, ov, u, l[0], l[1], l[2]));
            }
            return build(item, () -> Band.ofRange(pName, mName, ph, in, ov, u, l[3], l[4]));
        }

        /** {target, tolMinus, tolPlus, min, max} in the band's unit; NaN where not given, infinity for open ends. */
        private Optional<double[]> limits(YamlMap m, Node item, String what) {
            boolean target = m.has("target");
            boolean anyTol = m.has("tol") || m.has("tol-minus") || m.has("tol-plus");
            boolean range = m.has("min") || m.has("max");
            if (target && range) {
                doc.problem(item, what + " takes target with tol, or min and max, not both");
                return Optional.empty();
            }
            if (!target && anyTol) {
                doc.problem(m.keyMark(m.has("tol") ? "tol" : m.has("tol-minus") ? "tol-minus" : "tol-plus"),
                        what + ": tol goes with a target");
                return Optional.empty();
            }
            if (target) {
                OptionalDouble t = m.requiredNumber("target");
                OptionalDouble tol = m.number("tol");
                OptionalDouble tm = m.number("tol-minus");
                OptionalDouble tp = m.number("tol-plus");
                if (m.has("tol") && tol.isEmpty() || m.has("tol-minus") && tm.isEmpty()
                        || m.has("tol-plus") && tp.isEmpty() || t.isEmpty()) {
                    return Optional.empty();
                }
                if (!m.has("tol") && !(m.has("tol-minus") && m.has("tol-plus"))) {
                    doc.problem(item, what + " has a target and needs tol (or tol-minus and tol-plus)");
                    return Optional.empty();
                }
                boolean ok = true;
                for (String k : List.of("tol", "tol-minus", "tol-plus")) {
                    OptionalDouble v = m.number(k);
                    if (v.isPresent() && v.getAsDouble() < 0) {
                        doc.problem(m.node(k).orElseThrow(), k + " must not be negative, got '" + m.raw(k) + "'");
                        ok = false;
                    }
                }
                if (!ok) {
                    return Optional.empty();
                }
                double minus = tm.isPresent() ? tm.getAsDouble() : tol.getAsDouble();
                double plus = tp.isPresent() ? tp.getAsDouble() : tol.getAsDouble();
                if (!(minus + plus > 0)) {
                    List<String> said = new ArrayList<>();
                    for (String k : List.of("tol", "tol-minus", "tol-plus")) {
                        if (m.has(k)) {
                            said.add(k + ": " + m.raw(k));
                        }
                    }
                    doc.problem(item, what + " has no width (" + String.join(", ", said) + ")");
                    return Optional.empty();
                }
                return Optional.of(new double[] {t.getAsDouble(), minus, plus, Double.NaN, Double.NaN});
            }
            if (!range) {
                doc.problem(item, what + " needs target and tol, or min, max or both");
                return Optional.empty();
            }
            OptionalDouble min = m.number("min");
            OptionalDouble max = m.number("max");
            if (m.has("min") && min.isEmpty() || m.has("max") && max.isEmpty()) {
                return Optional.empty();
            }
            if (min.isPresent() && max.isPresent() && !(max.getAsDouble() > min.getAsDouble())) {
                doc.problem(item, what + " has no width (min: " + m.raw("min") + ", max: " + m.raw("max") + ")");
                return Optional.empty();
            }
            return Optional.of(new double[] {Double.NaN, Double.NaN, Double.NaN,
                min.orElse(Double.NEGATIVE_INFINITY), max.orElse(Double.POSITIVE_INFINITY)});
        }

        private boolean onlyWith(YamlMap m, String key, BandPhase phase, BandPhase allowed) {
            if (m.has(key) && phase != null && phase != allowed) {
                doc.problem(m.keyMark(key), "'" + key + "' goes only with phase " + allowed.key() + ", this band's "
                        + "phase is " + phase.key());
                return false;
            }
            return true;
        }

        private Optional<Parameter> parameter(YamlMap m, String name) {
            Optional<Parameter> p = dict.find(name);
            if (p.isEmpty()) {
                doc.problem(m.node("parameter").orElseThrow(), "unknown parameter '" + name + "': dictionary '"
                        + dict.name() + "' has no parameter of that name");
            }
            return p;
        }

        /**
         * Looks a unit up and checks it against the dimensions expected ({@code null}: unknown, so unchecked).
         */
        private Optional<Unit> unit(YamlMap m, String text, List<Dimension> expect, String what, String subject,
                                    boolean rate) {
            Node at = m.node("unit").orElseThrow();
            Optional<Unit> u = Unit.bySymbol(text);
            if (u.isEmpty()) {
                if (expect == null) {
                    doc.problem(at, "unknown unit '" + text + "'; known units: " + Unit.knownSymbols());
                } else {
                    doc.problem(at, "unknown unit '" + text + "'; units of " + phrases(expect) + ": "
                            + symbols(expect));
                }
                return Optional.empty();
            }
            if (expect != null && !expect.contains(u.get().dimension())) {
                String is = rate ? "the rate of change of " + subject + " is " + phrases(expect) + " ("
                        + symbols(expect) + ")" : subject + " is " + phrases(expect);
                doc.problem(at, "unit mismatch: " + what + " is in " + u.get().symbol() + ", but " + is);
                return Optional.empty();
            }
            return u;
        }

        private static String phrases(List<Dimension> ds) {
            return ds.stream().map(DimensionRules::phrase).collect(Collectors.joining(" or "));
        }

        private static String symbols(List<Dimension> ds) {
            List<String> out = new ArrayList<>();
            for (Dimension d : ds) {
                out.addAll(DimensionRules.symbols(d));
            }
            return String.join(", ", out);
        }

        /** Model constructors check every rule again; a rule the reader missed still ends as a located problem. */
        private <T> Optional<T> build(Node at, java.util.function.Supplier<T> make) {
            try {
                return Optional.of(make.get());
            } catch (IllegalArgumentException e) {
                doc.problem(at, e.getMessage());
                return Optional.empty();
            }
        }

        private static boolean isEmptyValue(Node n) {
            return n instanceof org.yaml.snakeyaml.nodes.ScalarNode
                    && YamlDoc.describe(n).equals("no value");
        }
    }

    /** Writes {@code card} as card text: same card, same bytes; it reads back (with its dictionary) to an equal card. */
    public static String toYaml(TestCard card) {
        YamlWriter w = new YamlWriter();
        w.comment(0, "pointcall test card");
        w.text(0, "sortie", card.sortie());
        w.text(0, "airframe", card.airframe());
        if (!card.area().isEmpty()) {
            w.text(0, "area", card.area());
        }
        if (!card.notes().isEmpty()) {
            w.text(0, "notes", card.notes());
        }
        if (!card.limits().isEmpty()) {
            w.entry(0, "limits", "");
            for (SafetyLimit l : card.limits()) {
                StringBuilder b = new StringBuilder("- {parameter: ").append(YamlWriter.flowScalar(l.parameter()));
                if (l.hasMin()) {
                    b.append(", min: ").append(Decimals.inUnit(l.minSi(), l.unit(), false));
                }
                if (l.hasMax()) {
                    b.append(", max: ").append(Decimals.inUnit(l.maxSi(), l.unit(), false));
                }
                b.append(", unit: ").append(YamlWriter.flowScalar(l.unit().symbol())).append('}');
                w.line(2, b.toString());
            }
        }
        w.entry(0, "points", "");
        for (TestPoint p : card.points()) {
            w.entry(2, "- ", "id", YamlWriter.scalar(p.id()));
            w.entry(4, "kind", p.kind().key());
            w.text(4, "title", p.title());
            if (!p.config().isEmpty()) {
                w.text(4, "config", p.config());
            }
            if (p.hasHold()) {
                w.entry(4, "hold", YamlWriter.number(p.holdS()));
            }
            if (!p.bands().isEmpty()) {
                w.entry(4, "bands", "");
                for (Band b : p.bands()) {
                    w.line(6, "- " + band(b));
                }
            }
        }
        return w.toString();
    }

    private static String band(Band b) {
        StringBuilder s = new StringBuilder("{");
        if (b.parameter() != null) {
            s.append("parameter: ").append(YamlWriter.flowScalar(b.parameter()));
        } else {
            s.append("metric: ").append(YamlWriter.flowScalar(b.metric()));
        }
        s.append(", phase: ").append(b.phase().key());
        if (b.phase() == BandPhase.INSTANT) {
            s.append(", at: ").append(YamlWriter.flowScalar(b.instant()));
        } else if (b.phase() == BandPhase.RATE) {
            s.append(", before: ").append(YamlWriter.flowScalar(b.instant()));
            s.append(", over: ").append(YamlWriter.number(b.overS()));
        }
        Unit u = b.unit();
        if (b.isTarget()) {
            s.append(", target: ").append(Decimals.inUnit(b.targetSi(), u, false));
            if (b.tolMinusSi() == b.tolPlusSi()) {
                s.append(", tol: ").append(Decimals.inUnit(b.tolMinusSi(), u, true));
            } else {
                s.append(", tol-minus: ").append(Decimals.inUnit(b.tolMinusSi(), u, true));
                s.append(", tol-plus: ").append(Decimals.inUnit(b.tolPlusSi(), u, true));
            }
        } else {
            if (b.minSi() != Double.NEGATIVE_INFINITY) {
                s.append(", min: ").append(Decimals.inUnit(b.minSi(), u, false));
            }
            if (b.maxSi() != Double.POSITIVE_INFINITY) {
                s.append(", max: ").append(Decimals.inUnit(b.maxSi(), u, false));
            }
        }
        return s.append(", unit: ").append(YamlWriter.flowScalar(u.symbol())).append('}').toString();
    }
}
