package org.pointcall.ui.console;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import javafx.geometry.Pos;
import javafx.scene.control.Label;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Priority;
import javafx.scene.layout.VBox;

import io.fair_acc.chartfx.XYChart;
import io.fair_acc.chartfx.axes.spi.DefaultNumericAxis;
import io.fair_acc.chartfx.plugins.XValueIndicator;
import io.fair_acc.chartfx.plugins.YRangeIndicator;
import io.fair_acc.chartfx.renderer.ErrorStyle;
import io.fair_acc.chartfx.renderer.spi.ErrorDataSetRenderer;
import io.fair_acc.dataset.spi.DoubleDataSet;

import org.pointcall.ui.desk.PointSpan;
import org.pointcall.ui.desk.TraceBand;
import org.pointcall.ui.trace.TraceHistory;

/**
 * One strip-chart lane: one parameter on a ChartFX chart, its current value beside it, the active point's band on
 * it and point begin/end markers. Everything here runs on the JavaFX thread; the data set is rewritten from the
 * lane's {@link TraceHistory} at most once per pulse.
 */
final class LaneChart {
    private static final String[] COLOURS = {"#7fb2e5", "#e0b266", "#9ccf8a", "#d59ad5", "#6fcfcf", "#e59a8a",
        "#b6b6e8", "#c8c87a"};

    private final String parameter;
    private final String unit;
    private final TraceHistory history;
    private final TraceDrawing feed;
    private final XYChart chart;
    private final DefaultNumericAxis xAxis;
    private final DefaultNumericAxis yAxis;
    private final DoubleDataSet data;
    private final HBox node;
    private final Label value = new Label("--");
    private final VBox side;
    private double[] x = new double[0];
    private double[] y = new double[0];
    private YRangeIndicator band;
    private TraceBand bandShown;
    private final List<XValueIndicator> markers = new ArrayList<>();
    private List<PointSpan> spansShown = List.of();
    private long redraws;
    private long skipped;
    private Boolean insideShown;
    /** The figure beside the trace changes at most 5 times a second, so that it can be read (common practice). */
    private static final long VALUE_PERIOD_NS = 200_000_000L;
    private long valueShownNs = Long.MIN_VALUE / 2;
    private double drawnNowS = Double.NaN;
    private double drawnSpanS = Double.NaN;
    private long drawnAdded = -1;
    private double drawnWidth = Double.NaN;

    LaneChart(String parameter, String unit, int colour, int historyCapacity, TraceDrawing feed) {
        this.parameter = parameter;
        this.unit = unit;
        this.history = new TraceHistory(historyCapacity);
        this.feed = feed;
        xAxis = new DefaultNumericAxis("", 0, 30, 5);
        xAxis.setAutoRanging(false);
        xAxis.setAnimated(false);
        yAxis = new DefaultNumericAxis("", 0, 1, 0.2);
        yAxis.setAutoRanging(true);
        yAxis.setAutoRangePadding(0.08);
        yAxis.setAnimated(false);
        yAxis.setForceZeroInRange(false);
        yAxis.setMaxMajorTickLabelCount(4);
        yAxis.setTickLabelFormatter(TICKS);
        // one width for every lane, so that the time axes of all lanes line up
        yAxis.setMinWidth(52);
        yAxis.setPrefWidth(52);
        yAxis.setMaxWidth(52);
        xAxis.setTickLabelFormatter(TICKS);
        xAxis.getAxisLabel().setVisible(false);
        yAxis.getAxisLabel().setVisible(false);
        ErrorDataSetRenderer r = new CountingRenderer(this);
        r.setDrawMarker(false);
        r.setErrorStyle(ErrorStyle.NONE);
        r.setPointReduction(false);
        r.setParallelImplementation(false);
        if (feed == TraceDrawing.ENVELOPE) {
            // ChartFX strokes a line of a data set that may hold NaN as one path; otherwise, segment by segment.
            // One path is rasterised once: about a fifth less screen CPU in software rendering (bench console).
            // The plain baseline keeps ChartFX's default.
            r.setAllowNaNs(true);
        }
        data = new DoubleDataSet(parameter, 4096);
        data.setStyle("-fx-line-color: " + COLOURS[colour % COLOURS.length] + "; -fx-line-width: 1.0;");
        r.getDatasets().add(data);
        chart = new XYChart(xAxis, yAxis);
        chart.getRenderers().setAll(r);
        chart.setLegendVisible(false);
        chart.setAnimated(false);
        chart.setToolBarPinned(false);
        chart.getToolBar().setVisible(false);
        chart.getToolBar().setManaged(false);
        chart.setMinHeight(60);
        chart.setPrefHeight(110);
        chart.setId("lane-chart-" + parameter);
        HBox.setHgrow(chart, Priority.ALWAYS);

        Label name = new Label(parameter);
        name.getStyleClass().add("lane-name");
        name.setStyle("-fx-text-fill: " + COLOURS[colour % COLOURS.length] + ";");
        value.getStyleClass().add("lane-value");
        value.setId("lane-value-" + parameter);
        Label u = new Label(unit);
        u.getStyleClass().add("lane-unit");
        side = new VBox(0, name, value, u);
        side.getStyleClass().add("lane-side");
        side.setAlignment(Pos.CENTER_LEFT);
        node = new HBox(0, chart, side);
        VBox.setVgrow(node, Priority.ALWAYS);
    }

    private static final javafx.util.StringConverter<Number> TICKS = new javafx.util.StringConverter<>() {
        @Override
        public String toString(Number n) {
            double v = n.doubleValue();
            double a = Math.abs(v);
            return String.format(Locale.ROOT, a >= 100 || v == Math.rint(v) ? "%.0f" : a >= 1 ? "%.1f" : "%.2f", v);
        }

        @Override
        public Number fromString(String s) {
            return Double.valueOf(s);
        }
    };

    /** Hides the time labels of a lane that is not the last of its group (quiet), or shows them. */
    void quietTimeAxis(boolean quiet) {
        xAxis.getStyleClass().remove("quiet-axis");
        if (quiet) {
            xAxis.getStyleClass().add("quiet-axis");
        }
        xAxis.setPrefHeight(quiet ? 6 : USE_COMPUTED);
        xAxis.setMaxHeight(quiet ? 6 : USE_COMPUTED);
        // nothing to draw on it: an invisible axis costs the software renderer nothing per frame
        xAxis.setVisible(!quiet);
    }

    private static final double USE_COMPUTED = javafx.scene.layout.Region.USE_COMPUTED_SIZE;

    /** The ErrorDataSetRenderer, counting the renders ChartFX really does (for the benchmark). */
    private static final class CountingRenderer extends ErrorDataSetRenderer {
        private final LaneChart lane;

        CountingRenderer(LaneChart lane) {
            this.lane = lane;
        }

        @Override
        public void render() {
            super.render();
            lane.redraws++;
        }
    }

    HBox node() {
        return node;
    }

    String parameter() {
        return parameter;
    }

    TraceHistory history() {
        return history;
    }

    XYChart chart() {
        return chart;
    }

    long redraws() {
        return redraws;
    }

    /**
     * Rewrites the data set for the span ending at {@code nowS}; JavaFX thread. ChartFX read-locks a chart's data
     * sets from its layout until its post-layout render, and a layout can happen outside a pulse (showing the
     * window, taking a snapshot): then the chart still holds the lock here, and writing would wait for ourselves.
     * Such a pulse is skipped (returns false); the next one draws the newer data.
     */
    boolean redraw(double nowS, double spanS) {
        double widthPx = chart.getWidth();
        if (nowS == drawnNowS && spanS == drawnSpanS && history.added() == drawnAdded && widthPx == drawnWidth) {
            return false; // nothing new (a paused replay): ChartFX is not asked to draw the same again
        }
        if (((io.fair_acc.dataset.locks.DefaultDataSetLock<?>) data.lock()).getReaderCount() > 0) {
            skipped++;
            return false;
        }
        double from = nowS - spanS;
        xAxis.set(from, nowS);
        int n;
        if (feed == TraceDrawing.ENVELOPE) {
            // a min/max pair every two pixels keeps every excursion a line of this width can show
            int columns = Math.max(64, (int) Math.ceil(Math.max(widthPx, 200) / 4));
            ensure(2 * columns + 2);
            n = history.envelope(from, nowS, columns, x, y);
        } else {
            ensure(history.size());
            n = history.copySpan(from, nowS, x, y);
        }
        data.set(x, y, n, true);
        drawnNowS = nowS;
        drawnSpanS = spanS;
        drawnAdded = history.added();
        drawnWidth = widthPx;
        double v = history.lastValue();
        long wall = System.nanoTime();
        if (wall - valueShownNs >= VALUE_PERIOD_NS) {
            value.setText(format(v));
            valueShownNs = wall;
        }
        updateInside(v);
        return true;
    }

    /** Pulses skipped because ChartFX still held the data set. */
    long skipped() {
        return skipped;
    }

    private void updateInside(double v) {
        Boolean inside = bandShown == null || Double.isNaN(v) ? null : v >= bandShown.low() && v <= bandShown.high();
        if (inside == insideShown) {
            return;
        }
        insideShown = inside;
        side.getStyleClass().removeAll("inside", "outside");
        if (inside != null) {
            side.getStyleClass().add(inside ? "inside" : "outside");
        }
    }

    private void ensure(int n) {
        if (x.length < n) {
            x = new double[n];
            y = new double[n];
        }
    }

    static String format(double v) {
        if (Double.isNaN(v)) {
            return "--";
        }
        double a = Math.abs(v);
        String f = a >= 1000 ? "%.0f" : a >= 100 ? "%.1f" : a >= 10 ? "%.2f" : "%.3f";
        return String.format(Locale.ROOT, f, v);
    }

    /** Shows the band of the active point on this trace, or none. */
    void showBand(TraceBand b) {
        if (b == null ? bandShown == null : b.equals(bandShown)) {
            return;
        }
        if (band != null) {
            chart.getPlugins().remove(band);
            band = null;
        }
        bandShown = b;
        insideShown = null;
        side.getStyleClass().removeAll("inside", "outside");
        if (b != null) {
            double lo = Double.isInfinite(b.low()) ? -1e12 : b.low();
            double hi = Double.isInfinite(b.high()) ? 1e12 : b.high();
            band = new YRangeIndicator(yAxis, lo, hi, b.label());
            band.setEditable(false);
            chart.getPlugins().add(band);
        }
    }

    /** Begin and end markers of points in view. */
    void showSpans(List<PointSpan> spans, double nowS, double spanS) {
        List<PointSpan> inView = new ArrayList<>();
        for (PointSpan s : spans) {
            if (s.beginS() >= nowS - spanS - 1 || s.open() || s.endS() >= nowS - spanS - 1) {
                inView.add(s);
            }
        }
        if (inView.equals(spansShown)) {
            return;
        }
        spansShown = inView;
        chart.getPlugins().removeAll(markers);
        markers.clear();
        for (PointSpan s : inView) {
            markers.add(marker(s.beginS(), "\u25b8 " + s.pointId()));
            if (!s.open()) {
                markers.add(marker(s.endS(), s.pointId() + " \u25c2"));
            }
        }
        chart.getPlugins().addAll(markers);
    }

    private XValueIndicator marker(double t, String text) {
        XValueIndicator m = new XValueIndicator(xAxis, t, text);
        m.setEditable(false);
        return m;
    }
}
