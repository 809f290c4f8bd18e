package org.pointcall.models.train;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalDouble;

import org.pointcall.models.balance.NeighbourDistance;
import org.pointcall.shared.yaml.YamlDoc;
import org.pointcall.shared.yaml.YamlMap;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.nodes.ScalarNode;

/**
 * One read of a training config. Every key may be left out and then takes the value of {@code base} (the shipped
 * default); reading the default itself ({@code base == null}) requires every key, so the defaults live in one
 * place, the resource file. Every problem is recorded in the {@link YamlDoc} at the node it concerns.
 */
final class SettingsReader {
    static final List<String> TOP_KEYS = List.of("classifier", "seed", "folds", "balance", "hold-out", "forest",
            "boosting", "logistic", "svm", "features");
    static final List<String> BALANCE_KEYS = List.of("method", "ratio", "neighbours", "distance");
    static final List<String> HOLD_OUT_KEYS = List.of("airframes", "sorties");
    static final List<String> FOREST_KEYS = List.of("trees", "max-depth", "max-nodes", "node-size",
            "split-features", "sample");
    static final List<String> BOOSTING_KEYS = List.of("trees", "max-depth", "max-nodes", "node-size", "shrinkage",
            "sample");
    static final List<String> LOGISTIC_KEYS = List.of("lambda", "tolerance", "iterations");
    static final List<String> SVM_KEYS = List.of("c", "gamma", "tolerance", "row-cap", "calibration-rows");

    private final YamlDoc doc;
    private TrainerSettings base;

    SettingsReader(YamlDoc doc) {
        this.doc = doc;
    }

    /** Reads {@code text} over the shipped defaults. */
    TrainerSettings read(String text) {
        return read(text, Defaults.SETTINGS);
    }

    TrainerSettings read(String text, TrainerSettings fallback) {
        this.base = fallback;
        Optional<Node> root = doc.compose(text);
        TrainerSettings s = root.map(this::settings).orElse(null);
        doc.rejectIfAny();
        return s;
    }

    /** The shipped default, read once. */
    private static final class Defaults {
        static final TrainerSettings SETTINGS = readDefault();

        private static TrainerSettings readDefault() {
            try (var in = TrainerSettings.class.getResourceAsStream(TrainerSettings.DEFAULT_RESOURCE)) {
                if (in == null) {
                    throw new IllegalStateException("resource " + TrainerSettings.DEFAULT_RESOURCE
                            + " is missing from the build");
                }
                String text = new String(in.readAllBytes(), java.nio.charset.StandardCharsets.UTF_8);
                return new SettingsReader(new YamlDoc(TrainerSettings.DEFAULT_RESOURCE)).read(text, null);
            } catch (java.io.IOException e) {
                throw new IllegalStateException("cannot read resource " + TrainerSettings.DEFAULT_RESOURCE, e);
            }
        }
    }

    static TrainerSettings defaults() {
        return Defaults.SETTINGS;
    }

    private TrainerSettings settings(Node root) {
        Optional<YamlMap> top = doc.map(root, "a training config", TOP_KEYS);
        if (top.isEmpty()) {
            return null;
        }
        YamlMap m = top.get().as("the training config");
        ClassifierKind classifier = m.has("classifier") || base == null
                ? m.requiredString("classifier").flatMap(k -> {
                    Optional<ClassifierKind> c = ClassifierKind.byKey(k);
                    if (c.isEmpty()) {
                        doc.problem(m.node("classifier").orElseThrow(), "unknown classifier '" + k
                                + "'; expected one of: " + String.join(", ", ClassifierKind.keys()));
                    }
                    return c;
                }).orElse(null)
                : base.classifier();
        FeatureForm features = m.has("features") || base == null
                ? m.requiredString("features").flatMap(k -> {
                    Optional<FeatureForm> f = FeatureForm.byKey(k);
                    if (f.isEmpty()) {
                        doc.problem(m.node("features").orElseThrow(), "unknown features '" + k
                                + "'; expected one of: " + String.join(", ", FeatureForm.keys()));
                    }
                    return f;
                }).orElse(null)
                : base.features();
        Long seed = seed(m);
        Integer folds = integer(m, "folds", base == null ? null : base.folds(), 2);
        BalanceSettings balance = section(m, "balance", base == null ? null : base.balance(), this::balance);
        HoldOutSettings holdOut = m.has("hold-out") ? holdOut(m.node("hold-out").orElseThrow())
                : base == null ? HoldOutSettings.nothing() : base.holdOut();
        ForestSettings forest = section(m, "forest", base == null ? null : base.forest(), this::forest);
        BoostingSettings boosting = section(m, "boosting", base == null ? null : base.boosting(), this::boosting);
        LogisticSettings logistic = section(m, "logistic", base == null ? null : base.logistic(), this::logistic);
        SvmSettings svm = section(m, "svm", base == null ? null : base.svm(), this::svm);
        if (classifier != null && balance != null && !balance.supports(classifier)) {
            Node at = m.has("balance") ? m.node("balance").orElseThrow()
                    : m.node("classifier").orElse(m.node());
            if (at instanceof org.yaml.snakeyaml.nodes.MappingNode mn) {
                for (var t : mn.getValue()) {
                    if (t.getKeyNode() instanceof ScalarNode k && "method".equals(k.getValue())) {
                        at = t.getValueNode();
                    }
                }
            }
            doc.problem(at, "balance method class-weights works with the forest only (Smile's boosting, logistic "
                    + "regression and SVM take no class weights); use undersample or smote with classifier "
                    + classifier.key());
        }
        if (doc.hasProblems() || classifier == null || seed == null || folds == null || balance == null
                || holdOut == null || forest == null || boosting == null || logistic == null || svm == null
                || features == null) {
            return null;
        }
        return new TrainerSettings(classifier, balance, folds, holdOut, seed, forest, boosting, logistic, svm,
                features);
    }

    private interface SectionReader<T> {
        T read(YamlMap section, T fallback);
    }

    private <T> T section(YamlMap m, String key, T fallback, SectionReader<T> reader) {
        if (!m.has(key)) {
            if (fallback == null) {
                m.required(key);
            }
            return fallback;
        }
        Node n = m.node(key).orElseThrow();
        List<String> keys = switch (key) {
            case "balance" -> BALANCE_KEYS;
            case "forest" -> FOREST_KEYS;
            case "boosting" -> BOOSTING_KEYS;
            case "logistic" -> LOGISTIC_KEYS;
            default -> SVM_KEYS;
        };
        Optional<YamlMap> sm = doc.map(n, key, keys);
        return sm.map(s -> reader.read(s.as(key), fallback)).orElse(null);
    }

    private Long seed(YamlMap m) {
        if (!m.has("seed")) {
            if (base == null) {
                m.required("seed");
                return null;
            }
            return base.seed();
        }
        Node n = m.node("seed").orElseThrow();
        String raw = m.raw("seed").trim();
        try {
            return Long.parseLong(raw.startsWith("+") ? raw.substring(1) : raw);
        } catch (NumberFormatException e) {
            doc.problem(n, "seed must be a whole number, got " + YamlDoc.describe(n));
            return null;
        }
    }

    /** An integer of at least {@code min}; absent: {@code fallback} (a problem when there is none). */
    private Integer integer(YamlMap m, String key, Integer fallback, int min) {
        if (!m.has(key)) {
            if (fallback == null) {
                m.required(key);
            }
            return fallback;
        }
        Node n = m.node(key).orElseThrow();
        OptionalDouble v = m.requiredNumber(key);
        if (v.isEmpty()) {
            return null;
        }
        double d = v.getAsDouble();
        if (d != Math.rint(d) || Math.abs(d) > Integer.MAX_VALUE) {
            doc.problem(n, key + " must be a whole number, got " + YamlDoc.describe(n));
            return null;
        }
        if (d < min) {
            doc.problem(n, key + " must be at least " + min + ", got " + YamlDoc.describe(n));
            return null;
        }
        return (int) d;
    }

    private enum Range { POSITIVE, AT_LEAST_ZERO, AT_LEAST_ONE, SHARE }

    /** A number in {@code range}; absent: {@code fallback}. */
    private Double number(YamlMap m, String key, Double fallback, Range range) {
        if (!m.has(key)) {
            if (fallback == null) {
                m.required(key);
            }
            return fallback;
        }
        Node n = m.node(key).orElseThrow();
        OptionalDouble v = m.requiredNumber(key);
        if (v.isEmpty()) {
            return null;
        }
        double d = v.getAsDouble();
        String why = switch (range) {
            case POSITIVE -> d > 0 ? null : "a positive number";
            case AT_LEAST_ZERO -> d >= 0 ? null : "a number of at least 0";
            case AT_LEAST_ONE -> d >= 1 ? null : "a number of at least 1";
            case SHARE -> d > 0 && d <= 1 ? null : "a share in (0, 1]";
        };
        if (why != null) {
            doc.problem(n, key + " must be " + why + ", got " + YamlDoc.describe(n));
            return null;
        }
        return d;
    }

    private BalanceSettings balance(YamlMap m, BalanceSettings fallback) {
        Optional<BalanceMethod> method = m.requiredString("method").flatMap(k -> {
            Optional<BalanceMethod> b = BalanceMethod.byKey(k);
            if (b.isEmpty()) {
                doc.problem(m.node("method").orElseThrow(), "unknown balance method '" + k + "'; expected one of: "
                        + String.join(", ", BalanceMethod.keys()));
            }
            return b;
        });
        Double ratio = null;
        if (method.isPresent() && method.get().takesRatio()) {
            ratio = number(m, "ratio", null, method.get() == BalanceMethod.SMOTE ? Range.AT_LEAST_ONE
                    : Range.POSITIVE);
        } else if (method.isPresent() && m.has("ratio")) {
            doc.problem(m.node("ratio").orElseThrow(), "ratio goes with balance method undersample or smote, not "
                    + method.get().key());
        }
        int defaultK = fallback == null ? org.pointcall.models.balance.SmoteSettings.DEFAULT_K : fallback.neighbours();
        Integer k = integer(m, "neighbours", defaultK, 1);
        NeighbourDistance distance = fallback == null ? NeighbourDistance.STANDARDISED : fallback.distance();
        if (m.has("distance")) {
            Optional<String> t = m.requiredString("distance");
            distance = null;
            if (t.isPresent()) {
                for (NeighbourDistance nd : NeighbourDistance.values()) {
                    if (nd.name().toLowerCase(Locale.ROOT).equals(t.get())) {
                        distance = nd;
                    }
                }
                if (distance == null) {
                    doc.problem(m.node("distance").orElseThrow(), "unknown distance '" + t.get()
                            + "'; expected one of: euclidean, standardised");
                }
            }
        }
        if (method.isEmpty() || k == null || distance == null || (method.get().takesRatio() && ratio == null)) {
            return null;
        }
        return new BalanceSettings(method.get(), ratio == null ? Double.NaN : ratio, k, distance);
    }

    private HoldOutSettings holdOut(Node n) {
        if (n instanceof ScalarNode s && s.getValue().isEmpty()) {
            return HoldOutSettings.nothing();
        }
        Optional<YamlMap> om = doc.map(n, "hold-out", HOLD_OUT_KEYS);
        if (om.isEmpty()) {
            return null;
        }
        YamlMap m = om.get().as("hold-out");
        List<String> airframes = names(m, "airframes");
        List<String> sorties = names(m, "sorties");
        if (airframes == null || sorties == null) {
            return null;
        }
        return new HoldOutSettings(airframes, sorties);
    }

    private List<String> names(YamlMap m, String key) {
        Optional<Node> n = m.node(key);
        if (n.isEmpty()) {
            return List.of();
        }
        Optional<List<Node>> items = doc.list(n.get(), key);
        if (items.isEmpty()) {
            return null;
        }
        List<String> out = new ArrayList<>();
        boolean ok = true;
        for (Node item : items.get()) {
            if (item instanceof ScalarNode s && !s.getValue().isBlank()) {
                out.add(s.getValue());
            } else {
                doc.problem(item, "each of " + key + " must be a name, got " + YamlDoc.describe(item));
                ok = false;
            }
        }
        return ok ? out : null;
    }

    private ForestSettings forest(YamlMap m, ForestSettings f) {
        Integer trees = integer(m, "trees", f == null ? null : f.trees(), 1);
        Integer depth = integer(m, "max-depth", f == null ? null : f.maxDepth(), 2);
        Integer nodes = maxNodes(m, f == null ? null : f.maxNodes());
        Integer nodeSize = integer(m, "node-size", f == null ? null : f.nodeSize(), 1);
        Integer split = integer(m, "split-features", f == null ? null : f.splitFeatures(), 0);
        Double sample = number(m, "sample", f == null ? null : f.sample(), Range.SHARE);
        if (trees == null || depth == null || nodes == null || nodeSize == null || split == null || sample == null) {
            return null;
        }
        return new ForestSettings(trees, depth, nodes, nodeSize, split, sample);
    }

    private Integer maxNodes(YamlMap m, Integer fallback) {
        Integer v = integer(m, "max-nodes", fallback, 0);
        if (v != null && v == 1 && m.has("max-nodes")) {
            doc.problem(m.node("max-nodes").orElseThrow(), "max-nodes must be 0 (a fifth of the training rows) or "
                    + "at least 2, got '1'");
            return null;
        }
        return v;
    }

    private BoostingSettings boosting(YamlMap m, BoostingSettings b) {
        Integer trees = integer(m, "trees", b == null ? null : b.trees(), 1);
        Integer depth = integer(m, "max-depth", b == null ? null : b.maxDepth(), 2);
        Integer nodes = integer(m, "max-nodes", b == null ? null : b.maxNodes(), 2);
        Integer nodeSize = integer(m, "node-size", b == null ? null : b.nodeSize(), 1);
        Double shrinkage = number(m, "shrinkage", b == null ? null : b.shrinkage(), Range.SHARE);
        Double sample = number(m, "sample", b == null ? null : b.sample(), Range.SHARE);
        if (trees == null || depth == null || nodes == null || nodeSize == null || shrinkage == null
                || sample == null) {
            return null;
        }
        return new BoostingSettings(trees, depth, nodes, nodeSize, shrinkage, sample);
    }

    private LogisticSettings logistic(YamlMap m, LogisticSettings l) {
        Double lambda = number(m, "lambda", l == null ? null : l.lambda(), Range.AT_LEAST_ZERO);
        Double tol = number(m, "tolerance", l == null ? null : l.tolerance(), Range.POSITIVE);
        Integer it = integer(m, "iterations", l == null ? null : l.iterations(), 1);
        if (lambda == null || tol == null || it == null) {
            return null;
        }
        return new LogisticSettings(lambda, tol, it);
    }

    private SvmSettings svm(YamlMap m, SvmSettings s) {
        Double c = number(m, "c", s == null ? null : s.c(), Range.POSITIVE);
        Double gamma;
        if (m.has("gamma") && "auto".equals(m.raw("gamma").trim())) {
            gamma = Double.NaN;
        } else if (m.has("gamma")) {
            Node n = m.node("gamma").orElseThrow();
            OptionalDouble v = YamlMap.parseNumber(n, false);
            gamma = v.isPresent() && v.getAsDouble() > 0 ? v.getAsDouble() : null;
            if (gamma == null) {
                doc.problem(n, "gamma must be auto or a positive number, got " + YamlDoc.describe(n));
            }
        } else {
            gamma = s == null ? null : s.gamma();
            if (s == null) {
                m.required("gamma");
            }
        }
        Double tol = number(m, "tolerance", s == null ? null : s.tolerance(), Range.POSITIVE);
        Integer cap = integer(m, "row-cap", s == null ? null : s.rowCap(), 10);
        Integer cal = integer(m, "calibration-rows", s == null ? null : s.calibrationRows(), 0);
        if (c == null || gamma == null || tol == null || cap == null || cal == null) {
            return null;
        }
        return new SvmSettings(c, gamma, tol, cap, cal);
    }
}
