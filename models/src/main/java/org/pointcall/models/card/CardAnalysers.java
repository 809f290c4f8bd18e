package org.pointcall.models.card;

import java.util.Optional;

import org.pointcall.models.analysis.Analysers;

/** The manoeuvre analysers a card session uses unless told otherwise. */
public final class CardAnalysers {
    private CardAnalysers() {
    }

    /** Every analyser this build has, by kind ({@link Analysers}). */
    public static AnalyserLookup standard() {
        return kind -> Optional.ofNullable(Analysers.forKind(kind));
    }
}
