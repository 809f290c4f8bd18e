package org.pointcall.ui.console;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;

import javafx.animation.AnimationTimer;
import javafx.scene.Parent;
import javafx.scene.Scene;
import javafx.scene.control.SplitPane;
import javafx.scene.control.TextInputControl;
import javafx.scene.image.WritableImage;
import javafx.scene.input.KeyCode;
import javafx.scene.input.KeyEvent;
import javafx.scene.layout.BorderPane;
import javafx.scene.layout.StackPane;
import javafx.scene.layout.VBox;

import io.fair_acc.chartfx.utils.WriteFxImage;

import org.pointcall.shared.error.PointcallException;
import org.pointcall.ui.desk.CardRow;
import org.pointcall.ui.desk.DeskCommand;
import org.pointcall.ui.desk.DeskSnapshot;
import org.pointcall.ui.desk.Outcome;
import org.pointcall.ui.desk.PointMark;
import org.pointcall.ui.settings.ConsoleSettings;
import org.pointcall.ui.settings.SettingsFile;
import org.pointcall.ui.settings.TraceGroup;

/**
 * The console's window content and its screen pump. It holds no domain logic: it draws the latest
 * {@link DeskSnapshot} and the charted samples, and turns keys and clicks into {@link DeskCommand}s on the link.
 *
 * <p>Threads: everything here runs on the JavaFX thread. An {@link AnimationTimer} runs once per pulse: it moves
 * new samples from the pipeline's ring into the lanes' own histories (never blocking the pipeline, which overwrites
 * what the screen did not take), redraws the charts at most {@link ConsoleSetup#maxRedrawHz()} times a second, and
 * applies the latest snapshot if its version changed. Snapshots published between two pulses are never drawn.
 */
public final class ConsoleView {
    private static final double[] SPANS = {10, 20, 30, 60, 90, 120};

    private final ConsoleSetup setup;
    private ConsoleSettings settings;
    private final BorderPane root = new BorderPane();
    private final HeaderBar header = new HeaderBar();
    private final AlarmStrip alarms = new AlarmStrip();
    private final CardPanel card;
    private final ChartStack charts;
    private final PointPanel point = new PointPanel();
    private final VerdictOverlay verdict = new VerdictOverlay();
    private final LogPanel log = new LogPanel();
    private final TransportBar transport;
    private final SplitPane split;
    private final AnimationTimer pump;
    private DeskSnapshot shown = DeskSnapshot.empty();
    private long shownVersion = -1;
    private Outcome pendingCall;
    private String pendingPoint;
    /** When the next redraw is due, on the pulse clock. */
    private long lastRedrawNs;
    private long rateWindowStartNs;
    private long redrawsInWindow;
    private double redrawHz;
    private long pumpRedraws;

    private final LanesPanel lanes;
    private boolean swallowTyped;

    public ConsoleView(ConsoleSetup setup) {
        this.setup = setup;
        this.settings = setup.settings();
        card = new CardPanel(id -> root.requestFocus());
        charts = new ChartStack(settings, setup.traces(), setup.drawing());
        transport = new TransportBar(setup.link()::send, card::selected);

        lanes = new LanesPanel(setup.traces() == null ? List.of() : setup.traces().names(),
                p -> setup.traces() == null ? "" : setup.traces().unit(p));
        StackPane centre = new StackPane(charts.node(), verdict.node(), lanes.node());
        centre.setId("centre");
        split = new SplitPane(card.node(), centre, point.node());
        split.setId("columns");
        split.setDividerPositions(settings.cardSplit(), 1 - settings.pointSplit());
        SplitPane.setResizableWithParent(card.node(), false);
        SplitPane.setResizableWithParent(point.node(), false);
        root.setTop(new VBox(header.node(), alarms.node()));
        root.setCenter(split);
        VBox bottom = new VBox();
        if (setup.replay()) {
            bottom.getChildren().add(transport.node());
        }
        log.node().setPrefHeight(150);
        log.node().setMinHeight(90);
        bottom.getChildren().add(log.node());
        root.setBottom(bottom);
        root.setId("console-root");
        root.getStylesheets().add(ConsoleView.class.getResource("console.css").toExternalForm());
        root.setFocusTraversable(true);
        root.addEventFilter(KeyEvent.KEY_PRESSED, this::onKey);
        // the key that opens the group editor must not also type itself into it
        root.addEventFilter(KeyEvent.KEY_TYPED, e -> {
            if (swallowTyped) {
                swallowTyped = false;
                e.consume();
            }
        });

        point.arm.setOnAction(e -> arm());
        point.good.setOnAction(e -> beginCall(Outcome.GOOD));
        point.repeat.setOnAction(e -> beginCall(Outcome.REPEAT));
        point.ack.setOnAction(e -> acknowledge());
        alarms.ack.setOnAction(e -> acknowledge());
        point.note.setOnAction(e -> finishCall());
        lanes.apply.setOnAction(e -> applyLanes());
        if (setup.watching()) {
            point.watching();
            header.keys.setText("K acknowledge here  \u2191\u2193 select  [ ] span  L chart groups");
        }
        lanes.cancel.setOnAction(e -> closeLanes());
        point.note.setDisable(true);

        pump = new AnimationTimer() {
            @Override
            public void handle(long nowNs) {
                pulse(nowNs);
            }
        };
    }

    public Parent root() {
        return root;
    }

    /** Starts the screen pump. */
    public void start() {
        pump.start();
    }

    public void stop() {
        pump.stop();
    }

    /** The layout as it is now, for saving. */
    public ConsoleSettings currentSettings() {
        double[] d = split.getDividerPositions();
        ConsoleSettings s = settings;
        if (d.length == 2) {
            s = s.withSplits(d[0], 1 - d[1]);
        }
        if (root.getScene() != null && root.getScene().getWindow() != null) {
            s = s.withWindow(root.getScene().getWindow().getWidth(), root.getScene().getWindow().getHeight());
        }
        return s;
    }

    /** Chart redraws done by ChartFX so far (every lane). */
    public long chartRenders() {
        return charts.redraws();
    }

    /** ChartFX renders of each lane so far. */
    public long[] laneRenders() {
        long[] r = new long[charts.lanes().size()];
        for (int i = 0; i < r.length; i++) {
            r[i] = charts.lanes().get(i).redraws();
        }
        return r;
    }

    /** Times the pump rewrote the charts' data. */
    public long pumpRedraws() {
        return pumpRedraws;
    }

    public int lanes() {
        return charts.lanes().size();
    }

    private void pulse(long nowNs) {
        charts.drain();
        // Redraws are due on a fixed period; pulses come at the display's rate (60 Hz), so a 25 Hz cap mixes two-
        // and three-pulse intervals instead of rounding down to every third pulse (20 Hz).
        long periodNs = (long) (1e9 / setup.maxRedrawHz());
        if (nowNs >= lastRedrawNs - 8_000_000L) {
            lastRedrawNs = Math.max(lastRedrawNs + periodNs, nowNs - periodNs);
            charts.redraw(settings.spanS());
            pumpRedraws++;
            redrawsInWindow++;
        }
        if (nowNs - rateWindowStartNs >= 1_000_000_000L) {
            redrawHz = redrawsInWindow * 1e9 / (nowNs - rateWindowStartNs);
            rateWindowStartNs = nowNs;
            redrawsInWindow = 0;
            header.showScreen(redrawHz, charts.lostSamples());
        }
        DeskSnapshot s = setup.link().latest();
        if (s.version() != shownVersion) {
            apply(s);
        }
    }

    private void apply(DeskSnapshot s) {
        String lastVerdictPoint = shown.verdict() == null ? null : shown.verdict().pointId();
        shown = s;
        shownVersion = s.version();
        header.show(s.sortie(), Double.isNaN(charts.nowS()) ? s.dataTimeS() : charts.nowS(), s.health());
        alarms.show(s.alarms());
        card.show(s.card());
        point.show(s.active());
        verdict.show(s.verdict(), s.active() != null);
        log.show(s.log());
        charts.showPoint(s.active(), s.spans(), settings.spanS());
        transport.show(s.transport());
        if (s.verdict() != null && !s.verdict().pointId().equals(lastVerdictPoint)) {
            card.select(s.verdict().pointId());
        } else if (s.active() != null) {
            card.select(s.active().pointId());
        }
        point.ack.setDisable(alarms.pending() == null && (s.verdict() == null || s.verdict().acknowledged()));
    }

    private void onKey(KeyEvent e) {
        boolean typing = e.getTarget() instanceof TextInputControl;
        if (lanes.showing()) {
            if (e.getCode() == KeyCode.ESCAPE) {
                closeLanes();
                e.consume();
            } else if (e.getCode() == KeyCode.ENTER && e.isShortcutDown()) {
                applyLanes();
                e.consume();
            }
            return; // the editor has the keys while it is open
        }
        if (typing) {
            if (e.getCode() == KeyCode.ESCAPE) {
                cancelCall();
                e.consume();
            }
            return;
        }
        boolean handled = true;
        if (setup.watching() && (e.getCode() == KeyCode.A || e.getCode() == KeyCode.G || e.getCode() == KeyCode.R)) {
            point.hint.setText("watching: arming and calls are made at the first console");
            e.consume();
            return;
        }
        switch (e.getCode()) {
            case A -> arm();
            case G -> beginCall(Outcome.GOOD);
            case R -> beginCall(Outcome.REPEAT);
            case K -> acknowledge();
            case UP -> card.move(-1);
            case DOWN -> card.move(1);
            case OPEN_BRACKET -> stepSpan(-1);
            case CLOSE_BRACKET -> stepSpan(1);
            case ESCAPE -> cancelCall();
            case L -> {
                swallowTyped = true;
                lanes.show(settings.groups());
            }
            default -> handled = replayKey(e);
        }
        if (handled) {
            e.consume();
        }
    }

    private boolean replayKey(KeyEvent e) {
        if (!setup.replay()) {
            return false;
        }
        switch (e.getCode()) {
            case SPACE -> transport.togglePlay();
            case LEFT -> transport.seekBy(e.isShiftDown() ? -60 : -10);
            case RIGHT -> transport.seekBy(e.isShiftDown() ? 60 : 10);
            case PLUS, ADD, EQUALS -> transport.stepSpeed(1);
            case MINUS, SUBTRACT -> transport.stepSpeed(-1);
            case J -> {
                if (card.selected() != null) {
                    setup.link().send(new DeskCommand.JumpToPoint(card.selected()));
                }
            }
            default -> {
                return false;
            }
        }
        return true;
    }

    private void arm() {
        String id = card.selected();
        if (id == null) {
            return;
        }
        for (CardRow r : shown.card()) {
            if (r.pointId().equals(id) && (r.mark() == PointMark.FLYING || r.mark() == PointMark.PRIMED)) {
                point.hint.setText(id + " is already " + r.mark().word());
                return;
            }
        }
        setup.link().send(new DeskCommand.Arm(id));
        point.hint.setText("arm " + id + " sent");
    }

    /** The point a call is about: the one being flown, else the selected row. */
    private String callTarget() {
        if (shown.active() != null) {
            return shown.active().pointId();
        }
        return card.selected();
    }

    private void beginCall(Outcome o) {
        String id = callTarget();
        if (id == null) {
            return;
        }
        if (pendingCall == o && id.equals(pendingPoint)) {
            finishCall();
            return;
        }
        pendingCall = o;
        pendingPoint = id;
        point.note.setDisable(false);
        point.note.clear();
        point.note.requestFocus();
        point.hint.setText(String.format(Locale.ROOT, "%s call on %s: type a note, Enter sends, Esc cancels", o, id));
    }

    private void finishCall() {
        if (pendingCall == null) {
            return;
        }
        setup.link().send(new DeskCommand.Call(pendingPoint, pendingCall, point.note.getText()));
        point.hint.setText(pendingCall + " call on " + pendingPoint + " sent");
        pendingCall = null;
        pendingPoint = null;
        point.note.clear();
        point.note.setDisable(true);
        root.requestFocus();
    }

    private void cancelCall() {
        if (pendingCall != null) {
            point.hint.setText("call cancelled");
        }
        pendingCall = null;
        pendingPoint = null;
        point.note.clear();
        point.note.setDisable(true);
        root.requestFocus();
    }

    /** Applies the editor's groups: the charts change at once and the layout file is written straight away. */
    private void applyLanes() {
        List<TraceGroup> groups = lanes.groups();
        if (groups == null) {
            return;
        }
        try {
            charts.regroup(groups);
        } catch (IllegalArgumentException e) {
            lanes.problem(e.getMessage());
            return;
        }
        settings = settings.withGroups(groups);
        String saved = "";
        if (setup.settingsFile() != null) {
            try {
                SettingsFile.save(setup.settingsFile(), currentSettings());
                saved = "; saved to " + setup.settingsFile();
            } catch (PointcallException e) {
                saved = "; not saved: " + e.getMessage();
            }
        }
        closeLanes();
        point.hint.setText("chart groups applied" + saved);
    }

    private void closeLanes() {
        lanes.hide();
        root.requestFocus();
    }

    private void acknowledge() {
        if (alarms.pending() != null) {
            setup.link().send(new DeskCommand.AcknowledgeAlarm(alarms.pending().alarmId()));
            return;
        }
        if (shown.verdict() != null && !shown.verdict().acknowledged()) {
            setup.link().send(new DeskCommand.AcknowledgeVerdict(shown.verdict().pointId()));
        }
    }

    private void stepSpan(int dir) {
        int at = 0;
        for (int i = 0; i < SPANS.length; i++) {
            if (Math.abs(SPANS[i] - settings.spanS()) < Math.abs(SPANS[at] - settings.spanS())) {
                at = i;
            }
        }
        settings = settings.withSpanS(SPANS[Math.max(0, Math.min(SPANS.length - 1, at + dir))]);
        point.hint.setText(String.format(Locale.ROOT, "chart span %.0f s", settings.spanS()));
    }

    /** Span now shown, seconds. */
    public double spanS() {
        return settings.spanS();
    }

    /** Forgets the charted samples (the replay jumped). */
    public void clearTraces() {
        charts.clear();
    }

    /** Writes a PNG of the whole scene; JavaFX thread. */
    public static void savePng(Scene scene, Path file) {
        WritableImage img = scene.snapshot(null);
        try {
            Path parent = file.toAbsolutePath().getParent();
            if (parent != null) {
                Files.createDirectories(parent);
            }
            WriteFxImage.savePng(img, file.toFile());
        } catch (IOException e) {
            throw new PointcallException("cannot write the screenshot " + file + ": " + e.getMessage(), e);
        }
    }
}
