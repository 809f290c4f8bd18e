package org.pointcall.ui.console;

import java.util.Locale;

import javafx.scene.control.Label;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Pane;
import javafx.scene.layout.Priority;
import javafx.scene.layout.Region;
import javafx.scene.layout.VBox;
import javafx.scene.shape.Line;
import javafx.scene.shape.Polygon;
import javafx.scene.shape.Rectangle;

import org.pointcall.ui.desk.BandGauge;

/**
 * One band of the active point as a rail: the band lit on a track, the target as a tick, the value as a pointer
 * that turns from a triangle (inside) to a notched arrow (outside), and the state in words beside it.
 */
final class GaugeView {
    private static final double W = 220;
    private static final double H = 16;

    private final VBox node;
    private final Label state = new Label();
    private final Label figures = new Label();
    private final Rectangle fill = new Rectangle();
    private final Line target = new Line();
    private final Polygon pointer = new Polygon();
    private final String key;

    GaugeView(BandGauge g, int index) {
        this.key = g.subject() + "|" + g.phase();
        Label subject = new Label(g.subject());
        subject.getStyleClass().add("gauge-subject");
        Label band = new Label(g.phase() + "  " + g.text());
        band.getStyleClass().add("gauge-band");
        Region gap = new Region();
        HBox.setHgrow(gap, Priority.ALWAYS);
        state.getStyleClass().add("gauge-state");
        state.setId("gauge-state-" + index);
        HBox top = new HBox(6, subject, band, gap, state);
        Rectangle track = new Rectangle(0, 3, W, H - 6);
        track.getStyleClass().add("gauge-track");
        fill.getStyleClass().add("gauge-band-fill");
        fill.setY(3);
        fill.setHeight(H - 6);
        target.getStyleClass().add("gauge-target");
        target.setStartY(1);
        target.setEndY(H - 1);
        pointer.getStyleClass().add("gauge-pointer");
        Pane rail = new Pane(track, fill, target, pointer);
        rail.setMinSize(W, H);
        rail.setPrefSize(W, H);
        rail.setMaxSize(W, H);
        figures.getStyleClass().addAll("figure", "dim");
        figures.setStyle("-fx-font-size: 11px;");
        node = new VBox(2, top, rail, figures);
        node.getStyleClass().add("gauge");
        node.setId("gauge-" + index);
        update(g);
    }

    String key() {
        return key;
    }

    VBox node() {
        return node;
    }

    void update(BandGauge g) {
        // Scale: the band takes the middle half of the rail; open ends borrow the target or value for a scale.
        double lo = g.low();
        double hi = g.high();
        double ref = !Double.isNaN(g.target()) ? g.target() : g.known() ? g.value() : 0;
        if (Double.isInfinite(lo)) {
            lo = Math.min(hi - Math.max(1e-9, Math.abs(hi - ref)) * 2, ref - Math.abs(hi) * 0.1 - 1e-9);
        }
        if (Double.isInfinite(hi)) {
            hi = Math.max(lo + Math.max(1e-9, Math.abs(ref - lo)) * 2, ref + Math.abs(lo) * 0.1 + 1e-9);
        }
        double width = hi - lo;
        double sMin = lo - width / 2;
        double sMax = hi + width / 2;
        double bx0 = Double.isInfinite(g.low()) ? 0 : px(lo, sMin, sMax);
        double bx1 = Double.isInfinite(g.high()) ? W : px(hi, sMin, sMax);
        fill.setX(bx0);
        fill.setWidth(Math.max(1, bx1 - bx0));
        boolean hasTarget = !Double.isNaN(g.target());
        target.setVisible(hasTarget);
        if (hasTarget) {
            double tx = px(g.target(), sMin, sMax);
            target.setStartX(tx);
            target.setEndX(tx);
        }
        pointer.getStyleClass().remove("outside");
        state.getStyleClass().removeAll("inside", "outside", "pending");
        pointer.setVisible(g.known());
        if (g.known()) {
            double vx = Math.max(0, Math.min(W, px(g.value(), sMin, sMax)));
            if (g.inside()) {
                pointer.getPoints().setAll(vx, H / 2 - 1, vx - 5, -1.0, vx + 5, -1.0);
            } else {
                pointer.getPoints().setAll(vx, H, vx - 6, 0.0, vx, 4.0, vx + 6, 0.0);
                pointer.getStyleClass().add("outside");
            }
        }
        // words and shapes from the session's own reading of the band, not from the pointer
        switch (g.standing()) {
            case WAITING -> {
                state.setText(g.known() ? "WAIT \u25cb" : "\u2013 no value");
                state.getStyleClass().add("pending");
            }
            case CLEAR -> {
                state.setText("IN \u25cf");
                state.getStyleClass().add("inside");
            }
            case MARGINAL -> {
                state.setText("EDGE \u25c6");
                state.getStyleClass().add("outside");
            }
            case OUT -> {
                state.setText("OUT \u25b2");
                state.getStyleClass().add("outside");
            }
        }
        figures.setText(String.format(Locale.ROOT, "now %s %s   margin %s   outside %.1f s",
                LaneChart.format(g.value()), g.unit(), Double.isNaN(g.marginToEdge()) ? "--"
                        : LaneChart.format(g.marginToEdge()), g.outsideS()));
    }

    private static double px(double v, double sMin, double sMax) {
        return (v - sMin) / (sMax - sMin) * W;
    }
}
