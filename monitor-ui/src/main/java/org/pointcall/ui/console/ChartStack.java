package org.pointcall.ui.console;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

import javafx.scene.control.Label;
import javafx.scene.layout.Priority;
import javafx.scene.layout.VBox;

import org.pointcall.ui.desk.ActivePoint;
import org.pointcall.ui.desk.PointSpan;
import org.pointcall.ui.desk.TraceBand;
import org.pointcall.ui.settings.ConsoleSettings;
import org.pointcall.ui.settings.TraceGroup;
import org.pointcall.ui.trace.SampleRing;
import org.pointcall.ui.trace.TraceFeed;

/** The strip charts: one titled block per chart group, one lane per parameter. JavaFX thread only. */
final class ChartStack {
    /** Enough for 120 s of a 1,000 sample/s trace. */
    static final int HISTORY_SAMPLES = 1 << 17;

    private final VBox node = new VBox(2);
    private final List<LaneChart> lanes = new ArrayList<>();
    /** Ring channel of each lane, -1 when the feed does not carry it. */
    private int[] channelOfLane = new int[0];
    private TraceFeed feed;
    private double nowS = Double.NaN;
    private final SampleRing.Reader reader = this::onSample;

    private final TraceDrawing drawing;
    private int layout = -1;
    private int colours;

    ChartStack(ConsoleSettings settings, TraceFeed feed, TraceDrawing drawing) {
        this.feed = feed;
        this.drawing = drawing;
        node.setId("chart-stack");
        build(settings.groups(), false);
        VBox.setVgrow(node, Priority.ALWAYS);
    }

    /**
     * Shows {@code groups} from now on; a parameter shown before keeps its lane and history. Refuses (the stack
     * unchanged) what the feed cannot chart, with the feed's reasons.
     */
    void regroup(List<TraceGroup> groups) {
        build(groups, true);
    }

    private void build(List<TraceGroup> groups, boolean select) {
        List<String> params = new ArrayList<>();
        for (TraceGroup g : groups) {
            params.addAll(g.parameters());
        }
        if (select && feed != null) {
            layout = feed.select(params); // throws, naming what is wrong, before anything changes
        } else if (feed != null) {
            layout = feed.layoutNumber();
        }
        Map<String, LaneChart> old = new HashMap<>();
        for (LaneChart l : lanes) {
            old.putIfAbsent(l.parameter(), l);
        }
        lanes.clear();
        node.getChildren().clear();
        for (TraceGroup g : groups) {
            Label title = new Label(g.name().toUpperCase(java.util.Locale.ROOT));
            title.getStyleClass().add("group-title");
            node.getChildren().add(title);
            for (int k = 0; k < g.parameters().size(); k++) {
                String p = g.parameters().get(k);
                LaneChart lane = old.remove(p);
                if (lane == null) {
                    lane = new LaneChart(p, feed == null ? "" : feed.unit(p), colours++, HISTORY_SAMPLES, drawing);
                }
                lane.quietTimeAxis(k < g.parameters().size() - 1);
                lanes.add(lane);
                node.getChildren().add(lane.node());
            }
        }
        channelOfLane = new int[lanes.size()];
        for (int i = 0; i < lanes.size(); i++) {
            channelOfLane[i] = feed == null ? -1 : feed.channel(lanes.get(i).parameter());
        }
    }

    VBox node() {
        return node;
    }

    List<LaneChart> lanes() {
        return lanes;
    }

    /** Moves new samples from the pipeline's ring into the lanes' histories; returns how many. */
    int drain() {
        if (feed == null) {
            return 0;
        }
        int total = 0;
        int n;
        do {
            n = feed.ring().drain(reader, 65536);
            total += n;
        } while (n == 65536);
        return total;
    }

    /** Data time going back by more than this means the stream started again (a replay jumped back). */
    static final double RESTART_S = 1.0;

    private void onSample(long timeNs, double[] values) {
        if (values[0] != layout) {
            return; // written under an earlier layout, while the screen was changing its lanes
        }
        double t = timeNs / 1e9;
        if (t < nowS - RESTART_S) {
            clear(); // live data never goes back this far; a replay's jump back does: the traces start again
        }
        for (int i = 0; i < channelOfLane.length; i++) {
            int ch = channelOfLane[i];
            if (ch >= 0) {
                lanes.get(i).history().add(t, values[ch]);
            }
        }
        if (!(t <= nowS)) {
            nowS = t;
        }
    }

    /** Data time of the newest sample, NaN before the first. */
    double nowS() {
        return nowS;
    }

    /** Samples lost because the screen fell a whole ring behind. */
    long lostSamples() {
        return feed == null ? 0 : feed.ring().lost();
    }

    void redraw(double spanS) {
        if (Double.isNaN(nowS)) {
            return;
        }
        for (LaneChart l : lanes) {
            l.redraw(nowS, spanS);
        }
    }

    /** Forgets every sample (after a replay seek). */
    void clear() {
        for (LaneChart l : lanes) {
            l.history().clear();
        }
        nowS = Double.NaN;
    }

    void showPoint(ActivePoint active, List<PointSpan> spans, double spanS) {
        Map<String, TraceBand> bands = new HashMap<>();
        if (active != null) {
            for (TraceBand b : active.traceBands()) {
                bands.putIfAbsent(b.parameter(), b);
            }
        }
        double now = Double.isNaN(nowS) ? 0 : nowS;
        for (LaneChart l : lanes) {
            l.showBand(bands.get(l.parameter()));
            l.showSpans(spans, now, spanS);
        }
    }

    long redraws() {
        long n = 0;
        for (LaneChart l : lanes) {
            n += l.redraws();
        }
        return n;
    }
}
