package org.pointcall.ui.desk;

import java.util.Objects;

/**
 * One line of the card list.
 *
 * @param pointId card id of the point
 * @param title   the card's title of the point
 * @param kind    manoeuvre kind key
 * @param mark    its state
 * @param note    the engineer's note of the last call, empty when none
 */
public record CardRow(String pointId, String title, String kind, PointMark mark, String note) {
    public CardRow {
        Objects.requireNonNull(pointId, "pointId");
        Objects.requireNonNull(mark, "mark");
        title = title == null ? "" : title;
        kind = kind == null ? "" : kind;
        note = note == null ? "" : note;
    }

    public CardRow withMark(PointMark m) {
        return new CardRow(pointId, title, kind, m, note);
    }
}
