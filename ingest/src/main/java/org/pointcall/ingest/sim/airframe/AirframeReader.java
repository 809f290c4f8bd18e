package org.pointcall.ingest.sim.airframe;

import java.io.Reader;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.pointcall.shared.airdata.PositionErrorCorrection;
import org.pointcall.shared.error.InputRejectedException;
import org.pointcall.shared.error.Plain;
import org.pointcall.shared.error.Problem;
import org.yaml.snakeyaml.Yaml;
import org.yaml.snakeyaml.error.Mark;
import org.yaml.snakeyaml.error.MarkedYAMLException;
import org.yaml.snakeyaml.nodes.MappingNode;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.nodes.NodeTuple;
import org.yaml.snakeyaml.nodes.ScalarNode;
import org.yaml.snakeyaml.nodes.SequenceNode;

/**
 * Reads one airframe profile from YAML through SnakeYAML's node tree, so every problem carries its line and
 * column; all problems of a file are collected and reported together, and nothing of a bad file is returned.
 */
final class AirframeReader {
    private static final double DEG = Math.PI / 180.0;

    private final String source;
    private final List<Problem> problems = new ArrayList<>();

    private AirframeReader(String source) {
        this.source = source;
    }

    static Airframe read(String source, Reader reader) {
        return new AirframeReader(source).readAll(reader);
    }

    private Airframe readAll(Reader reader) {
        Node root;
        try {
            root = new Yaml().compose(reader);
        } catch (MarkedYAMLException e) {
            Mark m = e.getProblemMark() != null ? e.getProblemMark() : e.getContextMark();
            String what = e.getProblem() != null ? e.getProblem() : "not valid YAML";
            problems.add(m == null ? new Problem(source, 0, 0, "not valid YAML: " + what)
                    : new Problem(source, m.getLine() + 1, m.getColumn() + 1, "not valid YAML: " + what));
            throw new InputRejectedException(problems);
        } catch (RuntimeException e) {
            problems.add(new Problem(source, 0, 0, "not valid YAML: " + e.getMessage()));
            throw new InputRejectedException(problems);
        }
        if (root == null) {
            problems.add(new Problem(source, 0, 0, "the file is empty; an airframe profile is a YAML mapping"));
            throw new InputRejectedException(problems);
        }
        Section top = new Section("", root, null);
        String name = top.text("name");
        if (name != null && !name.matches(Airframe.NAME_PATTERN)) {
            top.problemAt("name", "name '" + name + "' must be lower-case letters, digits and dashes");
        }
        String description = top.text("description");

        Section m = top.section("mass");
        double zeroFuel = m.number("zeroFuelMassKg", 1, 1e6);
        double fuel = m.number("fuelMassKg", 0, 1e6);
        double ixx = m.number("ixxKgM2", 1e-3, 1e9);
        double iyy = m.number("iyyKgM2", 1e-3, 1e9);
        double izz = m.number("izzKgM2", 1e-3, 1e9);
        double ixz = m.number("ixzKgM2", -1e9, 1e9);
        m.finish();

        Section g = top.section("geometry");
        double area = g.number("wingAreaM2", 0.01, 2000);
        double span = g.number("spanM", 0.1, 100);
        double chord = g.number("chordM", 0.01, 30);
        g.finish();

        Section lo = top.section("longitudinal");
        double alpha0 = lo.degrees("alphaZeroLiftDeg", -15, 15);
        double cla = lo.number("CLalpha", 0.5, 8);
        double clq = lo.number("CLq", -50, 50);
        double clde = lo.number("CLde", -5, 5);
        double cd0 = lo.number("CD0", 0.001, 0.5);
        double k = lo.number("k", 0, 1);
        double cm0 = lo.number("Cm0", -1, 1);
        double cma = lo.number("Cmalpha", -10, 5);
        double cmq = lo.number("Cmq", -100, 0);
        double cmad = lo.number("Cmalphadot", -100, 10);
        double cmde = lo.number("Cmde", -10, 10);
        double pgCap = lo.optionalNumber("prandtlGlauertMachCap", 0.0, 0, 0.95);
        double dragRise = lo.optionalNumber("dragRiseMach", 0.0, 0, 1.5);
        lo.finish();
        if (cmde == 0.0) {
            lo.problemAt("Cmde", "Cmde must not be zero: the elevator could not trim");
        }

        Section la = top.section("lateral");
        double cyb = la.number("CYbeta", -10, 10);
        double cyp = la.optionalNumber("CYp", 0.0, -10, 10);
        double cyr = la.optionalNumber("CYr", 0.0, -10, 10);
        double cydr = la.number("CYdr", -5, 5);
        double clb = la.number("Clbeta", -5, 5);
        double clp = la.number("Clp", -10, 0);
        double clr = la.number("Clr", -5, 5);
        double clda = la.number("Clda", -5, 5);
        double cldr = la.optionalNumber("Cldr", 0.0, -5, 5);
        double cnb = la.number("Cnbeta", -5, 5);
        double cnp = la.optionalNumber("Cnp", 0.0, -5, 5);
        double cnr = la.number("Cnr", -10, 0);
        double cnda = la.optionalNumber("Cnda", 0.0, -5, 5);
        double cndr = la.number("Cndr", -5, 5);
        la.finish();
        if (clda == 0.0) {
            la.problemAt("Clda", "Clda must not be zero: the ailerons could not roll");
        }
        if (cndr == 0.0) {
            la.problemAt("Cndr", "Cndr must not be zero: the rudder could not yaw");
        }

        Section st = top.section("stall");
        double aStall = st.degrees("alphaStallDeg", 3, 45);
        double aReattach = st.degrees("alphaReattachDeg", 0, 45);
        double aStallNeg = st.degrees("alphaStallNegativeDeg", -45, -3);
        double aReattachNeg = st.degrees("alphaReattachNegativeDeg", -45, 0);
        double width = st.degrees("breakWidthDeg", 0.06, 11);
        Curve sepLift = st.table("separatedLift", "alphaDeg", "CL", DEG);
        double cn90 = st.number("separatedNormalForce", 0.1, 3);
        double sepDrag = st.optionalNumber("separatedDragIncrement", 0.0, 0, 2);
        double tau1 = st.number("separationLagChords", 0.01, 200);
        double tau2 = st.number("hysteresisLagChords", 0, 200);
        double pitchBreak = st.number("pitchBreakCm", -1, 1);
        double wingDrop = st.number("wingDropCl", 0, 0.5);
        double rollDampRatio = st.optionalNumber("rollDampingSeparatedRatio", 1.0, -1, 1);
        st.finish();
        if (!Double.isNaN(aStall) && !Double.isNaN(aReattach) && !(aReattach < aStall)) {
            st.problemAt("alphaReattachDeg", "alphaReattachDeg (" + Plain.of(aReattach / DEG)
                    + ") must be below alphaStallDeg (" + Plain.of(aStall / DEG) + "): the flow reattaches at a"
                    + " lower angle than it separates");
        }
        if (!Double.isNaN(aStallNeg) && !Double.isNaN(aReattachNeg) && !(aReattachNeg > aStallNeg)) {
            st.problemAt("alphaReattachNegativeDeg", "alphaReattachNegativeDeg (" + Plain.of(aReattachNeg / DEG)
                    + ") must be above alphaStallNegativeDeg (" + Plain.of(aStallNeg / DEG) + ")");
        }
        if (sepLift != null && (sepLift.firstX() != 0.0 || Math.abs(sepLift.lastX() - Math.PI / 2) > 1e-9)) {
            st.problemAt("separatedLift", "separatedLift must run from alphaDeg 0 to 90");
        }

        Section e = top.section("engine");
        double tmax = e.number("maxThrustSeaLevelN", 1, 1e7);
        double idle = e.number("idleThrustFraction", 0, 0.5);
        double nRho = e.number("densityExponent", 0, 2);
        Curve machFactor = e.table("thrustMachFactor", "mach", "factor", 1.0);
        double spoolHigh = e.number("spoolTimeHighPowerS", 0.01, 60);
        double spoolLow = e.number("spoolTimeLowPowerS", 0.01, 60);
        double ffMax = e.number("maxFuelFlowSeaLevelKgS", 0, 100);
        double ffIdle = e.number("idleFuelFlowKgS", 0, 100);
        double zT = e.optionalNumber("thrustLineOffsetM", 0.0, -10, 10);
        e.finish();
        if (machFactor != null) {
            for (double f : machFactor.y()) {
                if (f < 0) {
                    e.problemAt("thrustMachFactor", "thrustMachFactor values must be zero or positive");
                    break;
                }
            }
        }
        if (!(ffIdle <= ffMax) && !Double.isNaN(ffIdle) && !Double.isNaN(ffMax)) {
            e.problemAt("idleFuelFlowKgS", "idleFuelFlowKgS must not exceed maxFuelFlowSeaLevelKgS");
        }

        Section c = top.section("controls");
        Surface elevator = c.surface("elevator");
        Surface aileron = c.surface("aileron");
        Surface rudder = c.surface("rudder");
        c.finish();

        PositionErrorCorrection.Table pe = null;
        Section ps = top.section("staticSourceError");
        double[] peMach = ps.numbers("mach");
        double[] peCoeff = ps.numbers("dPpOverQc");
        ps.finish();
        if (peMach != null && peCoeff != null) {
            try {
                pe = new PositionErrorCorrection.Table(peMach, peCoeff);
            } catch (IllegalArgumentException ex) {
                ps.problemAt("mach", ex.getMessage());
            }
        }
        top.finish();

        if (!problems.isEmpty()) {
            throw new InputRejectedException(problems);
        }
        try {
            return new Airframe(name, description,
                    new MassProperties(zeroFuel, fuel, ixx, iyy, izz, ixz),
                    new Geometry(area, span, chord),
                    new LongitudinalAero(alpha0, cla, clq, clde, cd0, k, cm0, cma, cmq, cmad, cmde, pgCap, dragRise),
                    new LateralAero(cyb, cyp, cyr, cydr, clb, clp, clr, clda, cldr, cnb, cnp, cnr, cnda, cndr),
                    new StallCharacteristics(aStall, aReattach, aStallNeg, aReattachNeg, width, sepLift, cn90,
                            sepDrag, tau1, tau2, pitchBreak, wingDrop, rollDampRatio),
                    new Engine(tmax, idle, nRho, machFactor, spoolHigh, spoolLow, ffMax, ffIdle, zT),
                    new ControlSurfaces(elevator, aileron, rudder), pe);
        } catch (IllegalArgumentException ex) {
            // a rule the field checks above do not cover (inertia, for one) is reported where the file begins
            problems.add(new Problem(source, top.line(), top.column(), ex.getMessage()));
            throw new InputRejectedException(problems);
        }
    }

    /** One YAML mapping, its keys checked against what was asked of it. */
    private final class Section {
        private final String path;
        private final Node node;
        /** Where the section is named in its parent (null at the top): missing keys are reported there. */
        private final Node keyNode;
        private final Map<String, NodeTuple> entries = new LinkedHashMap<>();
        private final List<String> asked = new ArrayList<>();
        private final boolean present;

        Section(String path, Node node, Node keyNode) {
            this.path = path;
            this.node = node;
            this.keyNode = keyNode;
            if (node == null) {
                present = false;
                return;
            }
            if (!(node instanceof MappingNode map)) {
                problem(node, (path.isEmpty() ? "an airframe profile" : "'" + path + "'")
                        + " must be a mapping of keys to values");
                present = false;
                return;
            }
            present = true;
            for (NodeTuple t : map.getValue()) {
                if (!(t.getKeyNode() instanceof ScalarNode k)) {
                    problem(t.getKeyNode(), "keys must be plain words");
                    continue;
                }
                if (entries.containsKey(k.getValue())) {
                    problem(k, "key '" + qualified(k.getValue()) + "' appears twice");
                    continue;
                }
                entries.put(k.getValue(), t);
            }
        }

        int line() {
            return node == null ? 0 : node.getStartMark().getLine() + 1;
        }

        int column() {
            return node == null ? 0 : node.getStartMark().getColumn() + 1;
        }

        private String qualified(String key) {
            return path.isEmpty() ? key : path + "." + key;
        }

        /** The value node of a required key, or null after reporting its absence. */
        private Node value(String key, boolean required) {
            asked.add(key);
            if (!present) {
                return null;
            }
            NodeTuple t = entries.get(key);
            if (t == null) {
                if (required) {
                    problem(keyNode != null ? keyNode : node, "missing key '" + qualified(key) + "'");
                }
                return null;
            }
            return t.getValueNode();
        }

        void problemAt(String key, String message) {
            NodeTuple t = present ? entries.get(key) : null;
            problem(t != null ? t.getValueNode() : node, message);
        }

        String text(String key) {
            Node v = value(key, true);
            if (v == null) {
                return null;
            }
            if (!(v instanceof ScalarNode s) || s.getValue().isBlank()) {
                problem(v, "'" + qualified(key) + "' must be a line of text");
                return null;
            }
            return s.getValue().strip();
        }

        double number(String key, double min, double max) {
            return number(key, value(key, true), min, max);
        }

        double optionalNumber(String key, double absent, double min, double max) {
            Node v = value(key, false);
            return v == null ? absent : number(key, v, min, max);
        }

        /** A value given in degrees (the key ends Deg), returned in radians. */
        double degrees(String key, double minDeg, double maxDeg) {
            return number(key, minDeg, maxDeg) * DEG;
        }

        private double number(String key, Node v, double min, double max) {
            if (v == null) {
                return Double.NaN;
            }
            double d = parse(v, qualified(key));
            if (Double.isNaN(d)) {
                return Double.NaN;
            }
            if (!(d >= min && d <= max)) {
                problem(v, "'" + qualified(key) + "' is " + Plain.of(d) + "; it must be between " + Plain.of(min)
                        + " and " + Plain.of(max));
                return Double.NaN;
            }
            return d;
        }

        private double parse(Node v, String what) {
            if (v instanceof ScalarNode s) {
                try {
                    double d = Double.parseDouble(s.getValue().strip().replace("_", ""));
                    if (Double.isFinite(d)) {
                        return d;
                    }
                } catch (NumberFormatException ignored) {
                    // reported below
                }
                problem(v, "'" + what + "' must be a number, got '" + s.getValue() + "'");
            } else {
                problem(v, "'" + what + "' must be a number");
            }
            return Double.NaN;
        }

        double[] numbers(String key) {
            Node v = value(key, true);
            if (v == null) {
                return null;
            }
            if (!(v instanceof SequenceNode seq)) {
                problem(v, "'" + qualified(key) + "' must be a list of numbers, like [0.2, 0.4]");
                return null;
            }
            double[] out = new double[seq.getValue().size()];
            boolean ok = true;
            for (int i = 0; i < out.length; i++) {
                out[i] = parse(seq.getValue().get(i), qualified(key) + "[" + (i + 1) + "]");
                ok &= !Double.isNaN(out[i]);
            }
            return ok ? out : null;
        }

        Section section(String key) {
            Node v = value(key, true);
            NodeTuple t = present ? entries.get(key) : null;
            return new Section(qualified(key), v, t == null ? null : t.getKeyNode());
        }

        /** A two-column table; {@code xScale} converts its first column to SI. */
        Curve table(String key, String xKey, String yKey, double xScale) {
            Section t = section(key);
            double[] x = t.numbers(xKey);
            double[] y = t.numbers(yKey);
            t.finish();
            if (x == null || y == null) {
                return null;
            }
            for (int i = 0; i < x.length; i++) {
                x[i] *= xScale;
            }
            try {
                return new Curve(x, y);
            } catch (IllegalArgumentException ex) {
                t.problemAt(xKey, "'" + t.qualified(xKey) + "': " + ex.getMessage());
                return null;
            }
        }

        Surface surface(String key) {
            Section s = section(key);
            double min = s.degrees("minDeg", -90, 0);
            double max = s.degrees("maxDeg", 0, 90);
            double rate = s.degrees("rateDegS", 0.1, 2000);
            double tau = s.number("timeConstantS", 0.001, 10);
            s.finish();
            if (min == 0.0) {
                s.problemAt("minDeg", "'" + s.qualified("minDeg") + "' must be below zero");
            }
            if (max == 0.0) {
                s.problemAt("maxDeg", "'" + s.qualified("maxDeg") + "' must be above zero");
            }
            if (Double.isNaN(min + max + rate + tau) || min == 0.0 || max == 0.0) {
                return null;
            }
            return new Surface(min, max, rate, tau);
        }

        /** Reports every key that nobody asked for, with the keys that are known. */
        void finish() {
            if (!present) {
                return;
            }
            for (Map.Entry<String, NodeTuple> en : entries.entrySet()) {
                if (!asked.contains(en.getKey())) {
                    problem(en.getValue().getKeyNode(), "unknown key '" + qualified(en.getKey())
                            + "'; known here: " + String.join(", ", asked));
                }
            }
        }
    }

    private void problem(Node at, String message) {
        Mark m = at.getStartMark();
        problems.add(new Problem(source, m.getLine() + 1, m.getColumn() + 1, message));
    }
}
