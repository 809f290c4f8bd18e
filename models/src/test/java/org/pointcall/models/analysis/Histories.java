package org.pointcall.models.analysis;

import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Random;
import java.util.function.DoubleUnaryOperator;

import org.pointcall.ingest.frame.Frame;
import org.pointcall.shared.demo.DemoFiles;
import org.pointcall.shared.dictionary.ParameterDictionary;

/**
 * Builds point histories of the demo dictionary from functions of time, in the dictionary's own units (as frames
 * carry them), with optional Gaussian noise: analytic signals whose metrics are known exactly.
 */
public final class Histories {
    public static final ParameterDictionary DICTIONARY = DemoFiles.dictionary();

    private final Map<String, DoubleUnaryOperator> signals = new LinkedHashMap<>();
    private final Map<String, Double> noise = new LinkedHashMap<>();

    public Histories with(String name, DoubleUnaryOperator f) {
        signals.put(name, f);
        return this;
    }

    public Histories noisy(String name, double std) {
        noise.put(name, std);
        return this;
    }

    /** Samples every {@code stepS} from {@code fromS} to {@code toS}, time 0 at {@code originNs}. */
    public PointHistory sample(long originNs, double fromS, double toS, double stepS, long seed) {
        PointHistory h = PointHistory.of(DICTIONARY, java.util.List.copyOf(signals.keySet()), 1024);
        Frame f = Frame.forDictionary(DICTIONARY);
        Random rnd = new Random(seed);
        int n = (int) Math.round((toS - fromS) / stepS);
        for (int k = 0; k <= n; k++) {
            double t = fromS + k * stepS;
            f.clear();
            f.timeNs(originNs + Math.round(t * 1e9));
            for (Map.Entry<String, DoubleUnaryOperator> e : signals.entrySet()) {
                double v = e.getValue().applyAsDouble(t);
                Double s = noise.get(e.getKey());
                if (s != null) {
                    v += s * rnd.nextGaussian();
                }
                f.value(DICTIONARY.indexOf(e.getKey()), v);
            }
            h.append(f);
        }
        return h;
    }
}
