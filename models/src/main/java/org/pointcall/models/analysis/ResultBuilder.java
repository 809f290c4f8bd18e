package org.pointcall.models.analysis;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

import org.pointcall.shared.kind.ManoeuvreKind;

/**
 * Collects what an analyser finds into a {@link ManoeuvreResult}: a metric that came out non-finite is left out and
 * named in the notes with the reason, so a result never carries NaN.
 */
public final class ResultBuilder {
    private final ManoeuvreKind kind;
    private final Map<String, Long> instants = new LinkedHashMap<>();
    private final Map<String, Double> metrics = new LinkedHashMap<>();
    private final Map<String, String> methods = new LinkedHashMap<>();
    private final List<String> notes = new ArrayList<>();

    public ResultBuilder(ManoeuvreKind kind) {
        this.kind = Objects.requireNonNull(kind, "kind");
    }

    public ManoeuvreKind kind() {
        return kind;
    }

    /** A key instant at {@code tS} seconds from {@code originNs}; skipped when not finite. */
    public ResultBuilder instant(String name, long originNs, double tS) {
        if (Double.isFinite(tS)) {
            instants.put(name, originNs + Math.round(tS * 1e9));
        }
        return this;
    }

    /**
     * A metric in SI with the method that gave it; a non-finite value is noted instead, with {@code whyNot}.
     */
    public ResultBuilder metric(String name, double valueSi, String method, String whyNot) {
        if (Double.isFinite(valueSi)) {
            metrics.put(name, valueSi);
            methods.put(name, method);
        } else {
            notes.add(name + ": not computed (" + whyNot + ")");
        }
        return this;
    }

    /** A metric in SI; a non-finite value is noted as not computable from the data. */
    public ResultBuilder metric(String name, double valueSi, String method) {
        return metric(name, valueSi, method, "too few valid samples");
    }

    public ResultBuilder note(String line) {
        notes.add(line);
        return this;
    }

    /** A metric already put, SI; NaN when absent. */
    public double metricSi(String name) {
        Double v = metrics.get(name);
        return v == null ? Double.NaN : v;
    }

    public boolean hasMetric(String name) {
        return metrics.containsKey(name);
    }

    /** The result; each registry metric of the kind still missing and not yet explained gets a note. */
    public ManoeuvreResult build() {
        List<String> all = new ArrayList<>(notes);
        for (org.pointcall.shared.kind.MetricSpec ms : kind.metrics()) {
            if (!metrics.containsKey(ms.name()) && notes.stream().noneMatch(n -> n.startsWith(ms.name() + ":"))) {
                all.add(ms.name() + ": not computed");
            }
        }
        return new ManoeuvreResult(kind, instants, metrics, methods, all);
    }
}
