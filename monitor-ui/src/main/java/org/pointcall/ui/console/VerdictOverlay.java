package org.pointcall.ui.console;

import java.util.Locale;

import javafx.geometry.Pos;
import javafx.scene.control.Label;
import javafx.scene.layout.HBox;
import javafx.scene.layout.StackPane;
import javafx.scene.layout.VBox;
import javafx.scene.shape.SVGPath;

import org.pointcall.ui.desk.VerdictCard;

/**
 * The end-of-point verdict, large across the charts until it is acknowledged: the word, its shape, a border whose
 * pattern differs by outcome (solid, long dashes, dots), the reasons, and how to acknowledge it.
 */
final class VerdictOverlay {
    private final VBox box;
    private final StackPane node;
    private final Label word = new Label();
    private final Label point = new Label();
    private final VBox reasons = new VBox(3);
    private final SVGPath mark;
    private VerdictCard shown;
    private final StackPane markBox;

    VerdictOverlay() {
        word.getStyleClass().add("verdict-word");
        word.setId("verdict-word");
        point.getStyleClass().add("headline");
        point.setId("verdict-point");
        reasons.setId("verdict-reasons");
        mark = Marks.of(org.pointcall.ui.desk.PointMark.GOOD, 12);
        mark.setScaleX(5);
        mark.setScaleY(5);
        markBox = new StackPane(mark);
        markBox.setMinSize(80, 80);
        HBox top = new HBox(24, markBox, new VBox(0, word, point));
        top.setAlignment(Pos.CENTER_LEFT);
        Label how = new Label("K or Acknowledge to clear   \u2022   G / R to call it yourself, with a note");
        how.getStyleClass().add("dim");
        // the same caution as the README: the verdict is a proposal, never the call itself
        Label caution = new Label("A proposal to the test team: the call is the engineer's; the test conductor, "
                + "the test plan's limits and the flight manual come first.");
        caution.getStyleClass().add("dim");
        caution.setId("verdict-caution");
        caution.setWrapText(true);
        box = new VBox(10, top, reasons, how, caution);
        box.getStyleClass().add("verdict-box");
        box.setMaxSize(720, javafx.scene.layout.Region.USE_PREF_SIZE);
        box.setId("verdict-box");
        node = new StackPane(box);
        node.setAlignment(Pos.CENTER);
        node.setPickOnBounds(false);
        node.setVisible(false);
        node.setId("verdict-overlay");
    }

    StackPane node() {
        return node;
    }

    /**
     * Shows an unacknowledged verdict, hides otherwise. While the next point is flown it stays, but compact and
     * at the top, so that the charts of the new point stay readable.
     */
    void show(VerdictCard v, boolean compact) {
        boolean visible = v != null && !v.acknowledged();
        node.setVisible(visible);
        if (compact != box.getStyleClass().contains("compact")) {
            if (compact) {
                box.getStyleClass().add("compact");
            } else {
                box.getStyleClass().remove("compact");
            }
            node.setAlignment(compact ? Pos.TOP_CENTER : Pos.CENTER);
            mark.setScaleX(compact ? 2.5 : 5);
            mark.setScaleY(compact ? 2.5 : 5);
            markBox.setMinSize(compact ? 40 : 80, compact ? 40 : 80);
        }
        if (!visible || v.equals(shown)) {
            return;
        }
        shown = v;
        String k = v.outcome().name().toLowerCase(Locale.ROOT);
        box.getStyleClass().removeAll("good", "repeat", "incomplete");
        box.getStyleClass().add(k);
        word.setText(v.outcome().name());
        point.setText("point " + v.pointId());
        Marks.restyle(mark, v.outcome().mark());
        mark.setFillRule(javafx.scene.shape.FillRule.EVEN_ODD);
        mark.getStyleClass().add("mark-big");
        reasons.getChildren().clear();
        if (v.reasons().isEmpty()) {
            Label l = new Label("every band held");
            l.getStyleClass().add("verdict-reason");
            reasons.getChildren().add(l);
        }
        for (String r : v.reasons()) {
            Label l = new Label("\u2022 " + r);
            l.getStyleClass().add("verdict-reason");
            l.setWrapText(true);
            reasons.getChildren().add(l);
        }
    }
}
