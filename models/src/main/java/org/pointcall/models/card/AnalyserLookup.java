package org.pointcall.models.card;

import java.util.Optional;

import org.pointcall.models.analysis.ManoeuvreAnalyser;
import org.pointcall.shared.kind.ManoeuvreKind;

/** Finds the analyser of a manoeuvre kind; empty when the kind has none yet (its metrics are then absent). */
@FunctionalInterface
public interface AnalyserLookup {
    Optional<ManoeuvreAnalyser> forKind(ManoeuvreKind kind);

    /** No analysers at all: points are matched and their parameter bands judged, result bands have no value. */
    static AnalyserLookup none() {
        return kind -> Optional.empty();
    }
}
