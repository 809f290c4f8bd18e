package org.pointcall.models.analysis;

import java.util.List;
import java.util.Map;

import org.pointcall.shared.kind.ManoeuvreKind;

/** Stands for a kind whose analyser is not written yet: a result with no metric and a note saying so. */
final class PendingAnalyser implements ManoeuvreAnalyser {
    private final ManoeuvreKind kind;

    PendingAnalyser(ManoeuvreKind kind) {
        this.kind = kind;
    }

    @Override
    public ManoeuvreKind kind() {
        return kind;
    }

    @Override
    public ManoeuvreResult analyse(PointHistory history, long beginNs, long endNs, Map<String, Long> hintedInstantsNs,
                                   Map<String, Double> bandIntervalsS) {
        return new ResultBuilder(kind).note("no analysis of " + kind.displayName() + " in this build yet").build();
    }

    @Override
    public List<String> parameters() {
        return List.of();
    }
}
