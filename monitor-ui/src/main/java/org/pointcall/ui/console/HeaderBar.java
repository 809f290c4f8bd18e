package org.pointcall.ui.console;

import java.util.Locale;

import javafx.geometry.Pos;
import javafx.scene.control.Label;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Priority;
import javafx.scene.layout.Region;

import org.pointcall.ui.desk.StreamHealth;

/** Sortie, data time and stream health across the top. */
final class HeaderBar {
    private final HBox node;
    private final Label sortie = new Label("no sortie");
    private final Label time = new Label("--:--:--");
    private final Label rate = new Label();
    private final Label gaps = new Label();
    private final Label dropped = new Label();
    private final Label latency = new Label();
    private final Label screen = new Label();
    final Label keys = new Label("A arm  G good  R repeat  K acknowledge  \u2191\u2193 select  [ ] span  L chart groups");

    HeaderBar() {
        sortie.getStyleClass().add("headline");
        sortie.setId("header-sortie");
        time.getStyleClass().addAll("figure", "headline");
        time.setId("header-time");
        rate.setId("health-rate");
        gaps.setId("health-gaps");
        dropped.setId("health-dropped");
        latency.setId("health-latency");
        screen.setId("health-screen");
        for (Label l : new Label[] {rate, gaps, dropped, latency, screen}) {
            l.getStyleClass().add("figure");
        }
        keys.getStyleClass().add("dim");
        keys.setStyle("-fx-font-size: 11px;");
        Region gap = new Region();
        HBox.setHgrow(gap, Priority.ALWAYS);
        node = new HBox(18, sortie, time, rate, gaps, dropped, latency, screen, gap, keys);
        node.setAlignment(Pos.CENTER_LEFT);
        node.getStyleClass().add("header");
        node.setId("header");
    }

    HBox node() {
        return node;
    }

    void show(String sortieName, double dataTimeS, StreamHealth h) {
        sortie.setText(sortieName.isEmpty() ? "no sortie" : sortieName);
        long t = (long) Math.max(0, Math.floor(dataTimeS));
        time.setText(String.format(Locale.ROOT, "T+%02d:%02d:%02d", t / 3600, (t / 60) % 60, t % 60));
        rate.setText(h.silent() ? "\u25cb NO DATA" : String.format(Locale.ROOT, "%.0f frames/s", h.frameRateHz()));
        flag(rate, h.silent() && h.framesSeen() > 0);
        gaps.setText(String.format(Locale.ROOT, "gaps %d (lost %d)", h.sequenceGaps(), h.lostPackets()));
        flag(gaps, h.sequenceGaps() > 0);
        dropped.setText(String.format(Locale.ROOT, "dropped %d", h.droppedPackets()));
        flag(dropped, h.droppedPackets() > 0);
        latency.setText(Double.isNaN(h.latencyP50Ms()) ? "latency --"
                : String.format(Locale.ROOT, "latency %.1f / %.1f ms", h.latencyP50Ms(), h.latencyP99Ms()));
    }

    /** The screen's own figures: redraw rate and samples it had to skip. */
    void showScreen(double redrawHz, long lostSamples) {
        screen.setText(String.format(Locale.ROOT, "screen %.0f/s%s", redrawHz,
                lostSamples > 0 ? " skipped " + lostSamples : ""));
    }

    private static void flag(Label l, boolean bad) {
        l.getStyleClass().remove("figure-bad");
        if (bad) {
            l.getStyleClass().add("figure-bad");
        }
    }
}
