package org.pointcall.ui.console;

import java.util.List;
import java.util.Locale;

import javafx.geometry.Pos;
import javafx.scene.control.Button;
import javafx.scene.control.Label;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Priority;
import javafx.scene.layout.Region;
import javafx.scene.shape.SVGPath;

import org.pointcall.ui.desk.AlarmLine;

/**
 * Safety alarms across the whole width: hatched and loud while any is unacknowledged, then quiet while a limit is
 * still exceeded, gone when none is. The octagon shape says "limit" without colour.
 */
final class AlarmStrip {
    private final HBox node;
    private final Label text = new Label();
    private final Label count = new Label();
    final Button ack = new Button("Acknowledge  [K]");
    private AlarmLine first;

    AlarmStrip() {
        SVGPath octagon = new SVGPath();
        octagon.setContent("M7 0 L17 0 L24 7 L24 17 L17 24 L7 24 L0 17 L0 7 Z M10.5 4 L13.5 4 L13 14 L11 14 Z "
                + "M10.5 17 L13.5 17 L13.5 20 L10.5 20 Z");
        octagon.setStyle("-fx-fill: #ffd9d4;");
        octagon.setFillRule(javafx.scene.shape.FillRule.EVEN_ODD);
        text.setId("alarm-text");
        count.setId("alarm-count");
        ack.setId("alarm-ack");
        ack.setFocusTraversable(false);
        Region gap = new Region();
        HBox.setHgrow(gap, Priority.ALWAYS);
        node = new HBox(12, octagon, text, gap, count, ack);
        node.setAlignment(Pos.CENTER_LEFT);
        node.getStyleClass().add("alarm-strip");
        node.setId("alarm-strip");
        node.setVisible(false);
        node.setManaged(false);
    }

    HBox node() {
        return node;
    }

    /** The oldest unacknowledged alarm, or null. */
    AlarmLine pending() {
        return first;
    }

    void show(List<AlarmLine> alarms) {
        AlarmLine unacked = null;
        AlarmLine active = null;
        long waiting = 0;
        for (AlarmLine a : alarms) {
            if (!a.acknowledged()) {
                waiting++;
                if (unacked == null) {
                    unacked = a;
                }
            }
            if (a.active()) {
                active = a;
            }
        }
        first = unacked;
        AlarmLine shown = unacked != null ? unacked : active;
        boolean visible = shown != null;
        if (!visible) {
            node.setVisible(false);
            node.setManaged(false);
            return;
        }
        node.getStyleClass().remove("seen");
        if (unacked == null) {
            node.getStyleClass().add("seen");
        }
        long t = (long) Math.max(0, Math.floor(shown.timeS()));
        text.setText(String.format(Locale.ROOT, "LIMIT  %s  (T+%02d:%02d:%02d)%s", shown.text(), t / 3600,
                (t / 60) % 60, t % 60, shown.active() ? "" : "  \u2014 back inside"));
        count.setText(waiting > 0 ? waiting + " to acknowledge" : "acknowledged");
        ack.setVisible(unacked != null);
        node.setVisible(true);
        node.setManaged(true);
    }
}
