package org.pointcall.ingest.window;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

import org.pointcall.shared.error.PointcallException;

/**
 * The fixed layout of a feature vector, built once at bind time. Windows are numbered in the order of the specs
 * and, inside a spec, of its lengths; window {@code w} owns the block {@code [w * Stat.COUNT, (w + 1) * Stat.COUNT)}
 * with one value per {@link Stat} in declaration order. Feature names read
 * {@code <parameter>.<stat>.<length>s}, for example {@code KCAS.mean.2s} and {@code AoA.slope.0.5s}.
 */
public final class FeatureLayout {
    private final String[] windowParameters;
    private final int[] windowSlots;
    private final double[] windowLengthsS;
    private final String[] windowNames;
    private final List<String> names;
    private final Map<String, Integer> featureIndex;
    private final Map<String, Integer> windowIndex;

    FeatureLayout(List<WindowSpec> specs, int[] slots) {
        int count = 0;
        for (WindowSpec s : specs) {
            count += s.windowsS().size();
        }
        windowParameters = new String[count];
        windowSlots = new int[count];
        windowLengthsS = new double[count];
        windowNames = new String[count];
        List<String> n = new ArrayList<>(count * Stat.COUNT);
        Map<String, Integer> fi = new HashMap<>();
        Map<String, Integer> wi = new HashMap<>();
        int w = 0;
        for (int s = 0; s < specs.size(); s++) {
            WindowSpec spec = specs.get(s);
            for (double lengthS : spec.windowsS()) {
                windowParameters[w] = spec.parameter();
                windowSlots[w] = slots[s];
                windowLengthsS[w] = lengthS;
                String len = lengthLabel(lengthS);
                windowNames[w] = spec.parameter() + "." + len;
                wi.put(windowNames[w], w);
                for (Stat stat : Stat.values()) {
                    String name = spec.parameter() + "." + stat.label() + "." + len;
                    fi.put(name, n.size());
                    n.add(name);
                }
                w++;
            }
        }
        names = List.copyOf(n);
        featureIndex = Map.copyOf(fi);
        windowIndex = Map.copyOf(wi);
    }

    /** Number of features, the length of the feature vector. */
    public int size() {
        return names.size();
    }

    /** Feature names in vector order. */
    public List<String> names() {
        return names;
    }

    public String name(int feature) {
        return names.get(feature);
    }

    /** Index of a feature by its full name, or -1. */
    public int indexOf(String featureName) {
        Integer i = featureIndex.get(featureName);
        return i == null ? -1 : i;
    }

    /** Index of one statistic of one window; throws naming the window when it is not in this layout. */
    public int index(String parameter, Stat stat, double windowS) {
        return featureIndex(windowIndex(parameter, windowS), stat);
    }

    public static int featureIndex(int window, Stat stat) {
        return window * Stat.COUNT + stat.ordinal();
    }

    public int windowCount() {
        return windowSlots.length;
    }

    /** Index of a window (into the validity and coverage arrays); throws naming it when absent. */
    public int windowIndex(String parameter, double windowS) {
        Integer i = windowIndex.get(parameter + "." + lengthLabel(windowS));
        if (i == null) {
            throw new PointcallException("no window of " + windowS + " s on parameter '" + parameter
                    + "' in this feature layout");
        }
        return i;
    }

    /** Name of a window, for example {@code KCAS.2s}. */
    public String windowName(int window) {
        return windowNames[window];
    }

    public String windowParameter(int window) {
        return windowParameters[window];
    }

    /** Frame slot the window reads, resolved from the dictionary at bind time. */
    public int windowSlot(int window) {
        return windowSlots[window];
    }

    public double windowLengthS(int window) {
        return windowLengthsS[window];
    }

    /** Seconds without trailing zeros and a unit suffix: 0.5 gives {@code 0.5s}, 2.0 gives {@code 2s}. */
    static String lengthLabel(double seconds) {
        return BigDecimal.valueOf(seconds).stripTrailingZeros().toPlainString() + "s";
    }
}
