package org.pointcall.ui.console;

import java.util.Locale;
import java.util.function.Consumer;

import javafx.geometry.Pos;
import javafx.scene.control.Button;
import javafx.scene.control.Label;
import javafx.scene.control.Slider;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Priority;

import org.pointcall.ui.desk.DeskCommand;
import org.pointcall.ui.desk.TransportState;

/** Replay transport: play/pause, speed, a seek slider and jump to the selected point. Sends commands only. */
final class TransportBar {
    private static final double[] SPEEDS = {0.25, 0.5, 1, 2, 4, 8, 16};

    private final HBox node;
    final Button play = new Button("Play  [Space]");
    private final Label position = new Label("--");
    private final Label speed = new Label("x1");
    private final Slider slider = new Slider(0, 1, 0);
    private final Consumer<DeskCommand> send;
    private TransportState state;
    private boolean updating;

    TransportBar(Consumer<DeskCommand> send, java.util.function.Supplier<String> selectedPoint) {
        this.send = send;
        play.setId("transport-play");
        play.setFocusTraversable(false);
        play.setOnAction(e -> togglePlay());
        Button slower = new Button("Slower  [-]");
        slower.setFocusTraversable(false);
        slower.setOnAction(e -> stepSpeed(-1));
        Button faster = new Button("Faster  [+]");
        faster.setFocusTraversable(false);
        faster.setOnAction(e -> stepSpeed(1));
        Button jump = new Button("Jump to point  [J]");
        jump.setId("transport-jump");
        jump.setFocusTraversable(false);
        jump.setOnAction(e -> {
            String p = selectedPoint.get();
            if (p != null) {
                send.accept(new DeskCommand.JumpToPoint(p));
            }
        });
        position.setId("transport-position");
        position.getStyleClass().add("figure");
        speed.setId("transport-speed");
        speed.getStyleClass().add("figure");
        slider.setId("transport-slider");
        slider.setFocusTraversable(false);
        HBox.setHgrow(slider, Priority.ALWAYS);
        slider.valueChangingProperty().addListener((o, was, now) -> {
            if (!now) {
                send.accept(new DeskCommand.Seek(slider.getValue()));
            }
        });
        slider.setOnMouseReleased(e -> send.accept(new DeskCommand.Seek(slider.getValue())));
        node = new HBox(8, play, slower, speed, faster, slider, position, jump);
        node.setAlignment(Pos.CENTER_LEFT);
        node.getStyleClass().add("transport");
        node.setId("transport");
    }

    HBox node() {
        return node;
    }

    void togglePlay() {
        send.accept(new DeskCommand.PlayPause(state == null || !state.playing()));
    }

    void stepSpeed(int dir) {
        double now = state == null ? 1 : state.speed();
        int at = 0;
        for (int i = 0; i < SPEEDS.length; i++) {
            if (Math.abs(SPEEDS[i] - now) < Math.abs(SPEEDS[at] - now)) {
                at = i;
            }
        }
        send.accept(new DeskCommand.Speed(SPEEDS[Math.max(0, Math.min(SPEEDS.length - 1, at + dir))]));
    }

    void seekBy(double seconds) {
        // keys pressed while a jump is caught up add to the jump, not to where the replay is on the way
        double now = state == null ? 0 : Double.isNaN(state.catchUpToS()) ? state.positionS() : state.catchUpToS();
        double len = state == null ? 0 : state.lengthS();
        send.accept(new DeskCommand.Seek(Math.max(0, Math.min(len, now + seconds))));
    }

    void show(TransportState t) {
        if (t == null || t.equals(state)) {
            return;
        }
        state = t;
        play.setText(t.playing() ? "Pause  [Space]" : "Play  [Space]");
        speed.setText(String.format(Locale.ROOT, "x%s", LaneChart.format(t.speed()).replaceAll("\\.?0+$", "")));
        long p = (long) t.positionS();
        long l = (long) t.lengthS();
        String status;
        if (!Double.isNaN(t.catchUpToS())) {
            long c = (long) t.catchUpToS();
            status = String.format(Locale.ROOT, "catching up to %02d:%02d", c / 60, c % 60);
        } else {
            status = t.playing() ? "playing" : t.positionS() >= t.lengthS() - 0.05 && t.lengthS() > 0 ? "ENDED"
                    : "PAUSED";
        }
        position.setText(String.format(Locale.ROOT, "%02d:%02d / %02d:%02d  %s", p / 60, p % 60, l / 60, l % 60,
                status));
        if (!slider.isValueChanging()) {
            updating = true;
            slider.setMax(Math.max(1, t.lengthS()));
            slider.setValue(t.positionS());
            updating = false;
        }
    }

    boolean updating() {
        return updating;
    }
}
