package org.pointcall.models.analysis;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.OptionalDouble;
import java.util.OptionalLong;

import org.pointcall.shared.kind.ManoeuvreKind;

/**
 * What the analysis of one flown point found: its key instants on the stream's data time, its metrics in SI (the
 * kind's {@link ManoeuvreKind#metrics() metrics} and any extra ones the analyser reports), the method behind each
 * metric in plain words, and notes on anything that could not be computed and why.
 *
 * @param kind        the analysed manoeuvre
 * @param instantsNs  key instants by name
 * @param metricsSi   metrics by name, SI; a metric that could not be computed is absent and named in {@code notes}
 * @param methods     per metric, the method used ("least-squares fit of a second-order model to pitch rate")
 * @param notes       plain lines for the reader
 */
public record ManoeuvreResult(ManoeuvreKind kind, Map<String, Long> instantsNs, Map<String, Double> metricsSi,
                              Map<String, String> methods, List<String> notes) {
    public ManoeuvreResult {
        Objects.requireNonNull(kind, "kind");
        instantsNs = Map.copyOf(new LinkedHashMap<>(instantsNs));
        for (Map.Entry<String, Double> e : metricsSi.entrySet()) {
            if (e.getValue() == null || !Double.isFinite(e.getValue())) {
                throw new IllegalArgumentException("metric " + e.getKey() + " must be finite, got " + e.getValue());
            }
        }
        metricsSi = Map.copyOf(metricsSi);
        methods = Map.copyOf(methods);
        notes = List.copyOf(notes);
    }

    public OptionalDouble metricSi(String name) {
        Double v = metricsSi.get(name);
        return v == null ? OptionalDouble.empty() : OptionalDouble.of(v);
    }

    public OptionalLong instantNs(String name) {
        Long v = instantsNs.get(name);
        return v == null ? OptionalLong.empty() : OptionalLong.of(v);
    }
}
