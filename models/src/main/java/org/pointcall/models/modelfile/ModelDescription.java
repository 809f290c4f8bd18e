package org.pointcall.models.modelfile;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Objects;
import java.util.Set;

import org.pointcall.ingest.window.ExtractorSettings;
import org.pointcall.ingest.window.Stat;
import org.pointcall.ingest.window.WindowSpec;

/**
 * What a trained detector model needs and is: the parameters it reads, the windows and decision settings its
 * features come from, the feature vector it takes, the classes it answers, and how it was trained. Everything a
 * live run needs to feed the model exactly as it was trained.
 *
 * @param parameters the parameters, by name and unit; each window's parameter is among them
 * @param windows    the sliding windows, in feature-vector order
 * @param extractor  decision rate and window validity rules
 * @param features   feature names in vector order; must be those the windows give ({@code KCAS.mean.2s}...)
 * @param classes    class names by the model's class index ({@code none} and kind keys)
 * @param training   how it was trained
 */
public record ModelDescription(List<RequiredParameter> parameters, List<WindowSpec> windows,
                               ExtractorSettings extractor, List<String> features, List<String> classes,
                               TrainingSummary training) {
    public ModelDescription {
        parameters = List.copyOf(parameters);
        windows = List.copyOf(windows);
        Objects.requireNonNull(extractor, "extractor");
        features = List.copyOf(features);
        classes = List.copyOf(classes);
        Objects.requireNonNull(training, "training");
        new ModelRequirements(parameters);
        if (windows.isEmpty()) {
            throw new IllegalArgumentException("a model needs at least one window");
        }
        Set<String> names = new HashSet<>();
        for (RequiredParameter p : parameters) {
            names.add(p.name());
        }
        for (WindowSpec w : windows) {
            if (!names.contains(w.parameter())) {
                throw new IllegalArgumentException("window on " + w.parameter()
                        + " reads a parameter the model does not list");
            }
        }
        List<String> expected = featureNames(windows);
        if (!expected.equals(features)) {
            throw new IllegalArgumentException("feature list (" + features.size() + ") is not the one the windows "
                    + "give (" + expected.size() + ", starting " + expected.get(0) + ")");
        }
        if (classes.size() < 2 || new HashSet<>(classes).size() != classes.size()) {
            throw new IllegalArgumentException("a model needs at least two distinct classes, got " + classes);
        }
    }

    /**
     * Feature names the windows give, in vector order: per window of each spec, one per {@link Stat}, named
     * {@code <parameter>.<stat>.<length>s} as the feature extractor names them.
     */
    public static List<String> featureNames(List<WindowSpec> windows) {
        List<String> out = new ArrayList<>();
        for (WindowSpec w : windows) {
            for (double lengthS : w.windowsS()) {
                String len = BigDecimal.valueOf(lengthS).stripTrailingZeros().toPlainString() + "s";
                for (Stat s : Stat.values()) {
                    out.add(w.parameter() + "." + s.label() + "." + len);
                }
            }
        }
        return out;
    }

    public ModelRequirements requirements() {
        return new ModelRequirements(parameters);
    }
}
