package org.pointcall.models.metrics;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

import org.pointcall.models.label.LabelInterval;
import org.pointcall.models.label.Labels;
import org.pointcall.shared.kind.ManoeuvreKind;
import org.pointcall.shared.units.Units;

/**
 * A test point that was really flown (from labels or a simulator's truth), in seconds of the recording's time line.
 *
 * @param kind   the manoeuvre
 * @param beginS begin, s
 * @param endS   end, s; after the begin
 * @param cardId card point id, or empty
 */
public record TruePoint(ManoeuvreKind kind, double beginS, double endS, String cardId) {
    public TruePoint {
        Objects.requireNonNull(kind, "kind");
        if (!(endS > beginS) || !Double.isFinite(beginS) || !Double.isFinite(endS)) {
            throw new IllegalArgumentException("a true point needs finite times with end after begin, got ["
                    + beginS + ", " + endS + "]");
        }
        cardId = cardId == null ? "" : cardId;
    }

    /** Every labelled interval as a true point. */
    public static List<TruePoint> fromLabels(Labels labels) {
        List<TruePoint> out = new ArrayList<>(labels.size());
        for (LabelInterval li : labels.intervals()) {
            out.add(new TruePoint(li.kind(), Units.nsToSeconds(li.beginNs()), Units.nsToSeconds(li.endNs()),
                    li.cardId()));
        }
        return out;
    }
}
