package org.pointcall.models.card;

/** The manoeuvre analysers a card session uses unless told otherwise. */
public final class CardAnalysers {
    private CardAnalysers() {
    }

    /** Every analyser this build has, by kind. */
    public static AnalyserLookup standard() {
        return AnalyserLookup.none();
    }
}
