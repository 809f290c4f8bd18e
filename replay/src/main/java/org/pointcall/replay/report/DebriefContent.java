package org.pointcall.replay.report;

import java.time.Instant;
import java.util.Objects;

import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.outcome.PointsFile;

/**
 * What a debrief report is made from.
 *
 * @param points     the sortie's results (from {@code analyze}, a headless monitor, or {@link SortieAnalysis})
 * @param card       the card flown, or null (no bands drawn, no next card)
 * @param cardName   how the card was given (its file name), or null
 * @param dictionary the recording's dictionary (the figures' units)
 * @param quality    the data quality, or null when the recording was not read
 * @param trace      the figures' parameters, or null when the recording was not read (no figures)
 * @param model      the detector model's description, or null when unknown
 * @param madeAt     when the report is made (passed in, so a report can be made again identically)
 * @param tool       the tool and its version, as printed in the report
 */
public record DebriefContent(PointsFile points, TestCard card, String cardName, ParameterDictionary dictionary,
                             DataQuality quality, SortieTrace trace, String model, Instant madeAt, String tool) {
    public DebriefContent {
        Objects.requireNonNull(points, "points");
        Objects.requireNonNull(dictionary, "dictionary");
        Objects.requireNonNull(madeAt, "madeAt");
        tool = tool == null ? "pointcall" : tool;
    }
}
