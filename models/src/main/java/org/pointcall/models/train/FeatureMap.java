package org.pointcall.models.train;

import java.io.Serializable;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;

import org.pointcall.models.data.LabelledRows;

/**
 * Turns the extractor's feature row into the row a model is fitted on, kept with the model so that training and
 * live scoring compute the same thing. Each output is one input, or an input minus a baseline input, optionally
 * divided by the baseline's magnitude. Allocation-free per row; NaN in, NaN out (the {@link FeaturePrep} that
 * follows imputes it).
 */
public final class FeatureMap implements Serializable {
    private static final long serialVersionUID = 1L;

    /**
     * Parameters whose level belongs to one airframe and one loading rather than to the manoeuvre: its speeds, its
     * altitudes on the card, the angle of attack and control positions it trims at.
     */
    static final Set<String> LEVELS = Set.of("KCAS", "Mach", "Hp", "AoA", "Elevator", "Aileron", "Rudder");
    /** Levels that also scale with the airframe (a 10 kt loss means more to a slow aircraft): divided by baseline. */
    static final Set<String> SCALED = Set.of("KCAS", "Mach");

    private final int inputs;
    private final int[] source;
    /** Baseline input subtracted, or -1. */
    private final int[] minus;
    /** Baseline input divided by (its magnitude), or -1. */
    private final int[] over;
    private final String[] names;

    private FeatureMap(int inputs, int[] source, int[] minus, int[] over, String[] names) {
        this.inputs = inputs;
        this.source = source;
        this.minus = minus;
        this.over = over;
        this.names = names;
    }

    /**
     * The relative form of features named {@code parameter.stat.window} (the extractor's names): for a parameter of
     * {@link #LEVELS}, its baseline is its mean over its longest window; the mean, min and max of every window become
     * differences from that baseline (the baseline itself is left out), and for {@link #SCALED} ones every statistic
     * is then divided by the baseline. Features of other parameters, and names of another shape, pass unchanged.
     * Last come the ranges, {@code max - min} of every window that has both (divided by the baseline for scaled
     * parameters).
     */
    public static FeatureMap relative(List<String> rawNames) {
        Map<String, Integer> baseline = new HashMap<>();
        Map<String, Double> longest = new HashMap<>();
        for (int i = 0; i < rawNames.size(); i++) {
            String[] p = parts(rawNames.get(i));
            if (p != null && LEVELS.contains(p[0]) && p[1].equals("mean")) {
                double len = seconds(p[2]);
                if (len > longest.getOrDefault(p[0], -1.0)) {
                    longest.put(p[0], len);
                    baseline.put(p[0], i);
                }
            }
        }
        List<Integer> src = new ArrayList<>();
        List<Integer> sub = new ArrayList<>();
        List<Integer> div = new ArrayList<>();
        List<String> out = new ArrayList<>();
        for (int i = 0; i < rawNames.size(); i++) {
            String name = rawNames.get(i);
            String[] p = parts(name);
            Integer b = p == null ? null : baseline.get(p[0]);
            if (b == null) {
                src.add(i);
                sub.add(-1);
                div.add(-1);
                out.add(name);
                continue;
            }
            if (i == b) {
                continue;
            }
            boolean level = p[1].equals("mean") || p[1].equals("min") || p[1].equals("max");
            boolean scaled = SCALED.contains(p[0]);
            src.add(i);
            sub.add(level ? b : -1);
            div.add(scaled ? b : -1);
            out.add(name + (level ? "-base" : "") + (scaled ? "/base" : ""));
        }
        // the spread of every window, max - min: a reversal's size in one number, whatever the level it rides on
        Map<String, Integer> index = new HashMap<>();
        for (int i = 0; i < rawNames.size(); i++) {
            index.put(rawNames.get(i), i);
        }
        for (int i = 0; i < rawNames.size(); i++) {
            String[] p = parts(rawNames.get(i));
            if (p == null || !p[1].equals("max")) {
                continue;
            }
            Integer min = index.get(p[0] + ".min." + p[2]);
            if (min == null) {
                continue;
            }
            boolean scaled = SCALED.contains(p[0]) && baseline.containsKey(p[0]);
            src.add(i);
            sub.add(min);
            div.add(scaled ? baseline.get(p[0]) : -1);
            out.add(p[0] + ".range." + p[2] + (scaled ? "/base" : ""));
        }
        int n = src.size();
        int[] s = new int[n];
        int[] m = new int[n];
        int[] o = new int[n];
        for (int j = 0; j < n; j++) {
            s[j] = src.get(j);
            m[j] = sub.get(j);
            o[j] = div.get(j);
        }
        return new FeatureMap(rawNames.size(), s, m, o, out.toArray(new String[0]));
    }

    /** {@code [parameter, stat, window]} of an extractor feature name, or null. */
    private static String[] parts(String name) {
        int a = name.indexOf('.');
        int b = a < 0 ? -1 : name.indexOf('.', a + 1);
        if (a <= 0 || b <= a + 1 || !name.endsWith("s") || b == name.length() - 1) {
            return null;
        }
        String[] p = {name.substring(0, a), name.substring(a + 1, b), name.substring(b + 1)};
        return Double.isNaN(seconds(p[2])) ? null : p;
    }

    private static double seconds(String window) {
        try {
            return Double.parseDouble(window.substring(0, window.length() - 1));
        } catch (NumberFormatException e) {
            return Double.NaN;
        }
    }

    /** Features of the row it reads. */
    public int inputCount() {
        return inputs;
    }

    /** Features of the row it writes. */
    public int outputCount() {
        return source.length;
    }

    /** Names of the features it writes, in order. */
    public List<String> outputNames() {
        return List.of(names);
    }

    /** Maps {@code in} (at least {@link #inputCount()} values) into {@code out}. */
    public void apply(double[] in, double[] out) {
        for (int j = 0; j < source.length; j++) {
            double v = in[source[j]];
            if (minus[j] >= 0) {
                v -= in[minus[j]];
            }
            if (over[j] >= 0) {
                v /= Math.abs(in[over[j]]);
            }
            out[j] = v;
        }
    }

    /** The same rows in the model's features (synthetic flags, classes, times and sorties kept). */
    public LabelledRows apply(LabelledRows rows) {
        LabelledRows.Builder b = LabelledRows.builder(outputNames(), rows.sorties());
        double[] in = new double[rows.featureCount()];
        double[] out = new double[outputCount()];
        for (int i = 0; i < rows.rows(); i++) {
            rows.copyRow(i, in);
            apply(in, out);
            b.add(out, rows.classOf(i), rows.timeNs(i), rows.sortieOf(i), rows.isSynthetic(i));
        }
        return b.build();
    }
}
