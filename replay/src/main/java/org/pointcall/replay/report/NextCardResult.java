package org.pointcall.replay.report;

import org.pointcall.models.card.NextCard;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.error.PointcallException;
import org.pointcall.shared.outcome.PointsFile;

/**
 * The next sortie's card for the report ({@link NextCard}), or why there is none.
 *
 * @param card     the next card, or null
 * @param why      why there is none (null when there is one)
 * @param fileName the file it is written to beside the report
 */
public record NextCardResult(TestCard card, String why, String fileName) {
    /** File name of the next card beside the report. */
    public static final String FILE = "next-card.yaml";

    static NextCardResult of(TestCard flown, PointsFile points) {
        if (flown == null) {
            return new NextCardResult(null, "No card was given, so no next card: give the card that was flown "
                    + "(--card).", null);
        }
        try {
            return new NextCardResult(NextCard.from(flown, points), null, FILE);
        } catch (PointcallException e) {
            return new NextCardResult(null, "No next card: " + e.getMessage() + ".", null);
        }
    }
}
