package org.pointcall.models.data;

import java.util.List;
import java.util.Objects;

import org.pointcall.ingest.window.ExtractorSettings;
import org.pointcall.ingest.window.WindowSpec;

/**
 * How recordings become labelled rows.
 *
 * @param windows         the sliding windows, as the detector will use them
 * @param extractor       decision rate and window validity rules
 * @param boundaryMarginS a tick closer than this to the begin or end of a labelled interval is left out as
 *                        ambiguous (a person's label is seldom exact to the tick), s; 0 keeps every tick
 * @param incompleteRows  what happens to ticks with a NaN feature
 */
public record DatasetSettings(List<WindowSpec> windows, ExtractorSettings extractor, double boundaryMarginS,
                              IncompleteRows incompleteRows) {
    public DatasetSettings {
        windows = List.copyOf(windows);
        if (windows.isEmpty()) {
            throw new IllegalArgumentException("a data set needs at least one window");
        }
        Objects.requireNonNull(extractor, "extractor");
        Objects.requireNonNull(incompleteRows, "incompleteRows");
        if (!(boundaryMarginS >= 0) || Double.isInfinite(boundaryMarginS)) {
            throw new IllegalArgumentException("boundary margin must be a finite number of seconds >= 0, got "
                    + boundaryMarginS);
        }
    }

    /** These windows with the extractor's defaults, no boundary margin, incomplete rows dropped. */
    public static DatasetSettings of(List<WindowSpec> windows) {
        return new DatasetSettings(windows, ExtractorSettings.defaults(), 0.0, IncompleteRows.DROP);
    }

    public DatasetSettings withExtractor(ExtractorSettings settings) {
        return new DatasetSettings(windows, settings, boundaryMarginS, incompleteRows);
    }

    public DatasetSettings withBoundaryMarginS(double marginS) {
        return new DatasetSettings(windows, extractor, marginS, incompleteRows);
    }

    public DatasetSettings withIncompleteRows(IncompleteRows policy) {
        return new DatasetSettings(windows, extractor, boundaryMarginS, policy);
    }
}
