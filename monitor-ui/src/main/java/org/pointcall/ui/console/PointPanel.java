package org.pointcall.ui.console;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import javafx.scene.control.Button;
import javafx.scene.control.Label;
import javafx.scene.control.ScrollPane;
import javafx.scene.control.TextField;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Priority;
import javafx.scene.layout.VBox;

import org.pointcall.ui.desk.ActivePoint;
import org.pointcall.ui.desk.BandGauge;

/** The point being flown: card entry, clocks, one gauge per band; and the call bar with its note field. */
final class PointPanel {
    private final VBox node;
    private final Label id = new Label("no point in progress");
    private final Label title = new Label("");
    private final Label config = new Label("");
    private final Label elapsed = new Label("--");
    private final Label hold = new Label("--");
    private final Label holdLabel = new Label("in band");
    private final VBox gauges = new VBox(2);
    private final List<GaugeView> gaugeViews = new ArrayList<>();
    private String pointShown;
    final Button arm = new Button("Arm  [A]");
    final Button good = new Button("Good  [G]");
    final Button repeat = new Button("Repeat  [R]");
    final Button ack = new Button("Acknowledge  [K]");
    final TextField note = new TextField();
    private HBox buttons;
    final Label hint = new Label("");

    PointPanel() {
        Label head = new Label("ACTIVE POINT");
        head.getStyleClass().add("panel-title");
        id.getStyleClass().add("headline");
        id.setId("active-point-id");
        title.setWrapText(true);
        config.getStyleClass().add("dim");
        config.setWrapText(true);
        config.setStyle("-fx-font-size: 11px;");
        elapsed.getStyleClass().add("clock");
        elapsed.setId("active-elapsed");
        hold.getStyleClass().add("clock");
        hold.setId("active-hold");
        Label el = new Label("elapsed");
        el.getStyleClass().add("dim");
        Label ho = holdLabel;
        ho.getStyleClass().add("dim");
        HBox clocks = new HBox(18, new VBox(0, el, elapsed), new VBox(0, ho, hold));
        gauges.setId("gauges");
        ScrollPane scroll = new ScrollPane(gauges);
        scroll.setFitToWidth(true);
        scroll.setHbarPolicy(ScrollPane.ScrollBarPolicy.NEVER);
        VBox.setVgrow(scroll, Priority.ALWAYS);
        arm.setId("arm-button");
        good.setId("good-button");
        repeat.setId("repeat-button");
        ack.setId("ack-button");
        for (Button b : List.of(arm, good, repeat, ack)) {
            b.setFocusTraversable(false);
        }
        note.setId("call-note");
        note.setPromptText("note for the call (G or R, type, Enter)");
        note.setFocusTraversable(false);
        hint.setId("call-hint");
        hint.getStyleClass().add("dim");
        hint.setWrapText(true);
        buttons = new HBox(6, arm, good, repeat);
        VBox calls = new VBox(4, buttons, note, hint, ack);
        calls.setStyle("-fx-padding: 6 0 0 0; -fx-border-color: #252d36; -fx-border-width: 1 0 0 0;");
        node = new VBox(4, head, id, title, config, clocks, scroll, calls);
        node.getStyleClass().add("panel");
        node.setId("point-panel");
    }

    VBox node() {
        return node;
    }

    void show(ActivePoint p) {
        if (p == null) {
            if (pointShown != null) {
                pointShown = null;
                id.setText("no point in progress");
                title.setText("");
                config.setText("");
                elapsed.setText("--");
                hold.setText("--");
                gauges.getChildren().clear();
                gaugeViews.clear();
            }
            return;
        }
        // the line under the title changes within a point: a begin from the card says so until the detector has it
        if (!p.config().equals(config.getText())) {
            config.setText(p.config());
        }
        if (!p.pointId().equals(pointShown) || gaugeViews.size() != p.gauges().size()) {
            pointShown = p.pointId();
            id.setText(p.pointId());
            title.setText(p.title());
            gauges.getChildren().clear();
            gaugeViews.clear();
            int i = 0;
            for (BandGauge g : p.gauges()) {
                GaugeView v = new GaugeView(g, i++);
                gaugeViews.add(v);
                gauges.getChildren().add(v.node());
            }
        } else {
            for (int i = 0; i < gaugeViews.size(); i++) {
                gaugeViews.get(i).update(p.gauges().get(i));
            }
        }
        elapsed.setText(String.format(Locale.ROOT, "%5.1f s", p.elapsedS()));
        holdLabel.setText(p.holdRequiredS() > 0 ? "hold" : "in band");
        hold.setText(p.holdRequiredS() > 0
                ? String.format(Locale.ROOT, "%4.1f / %.0f s", p.holdS(), p.holdRequiredS())
                : String.format(Locale.ROOT, "%4.1f s", p.holdS()));
    }

    /** A watching console: no arming or calls here (they are made at the first console); says so instead. */
    void watching() {
        for (Button b : List.of(arm, good, repeat)) {
            b.setVisible(false);
        }
        buttons.setVisible(false);
        buttons.setManaged(false);
        note.setVisible(false);
        note.setManaged(false);
        hint.setText("watching: arming and calls are made at the first console");
    }
}
