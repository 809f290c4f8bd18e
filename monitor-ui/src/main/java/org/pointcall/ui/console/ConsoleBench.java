package org.pointcall.ui.console;

import java.lang.management.ManagementFactory;
import java.lang.management.ThreadInfo;
import java.lang.management.ThreadMXBean;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicReference;
import java.util.concurrent.locks.LockSupport;

import javafx.application.Application;
import javafx.application.Platform;
import javafx.scene.Scene;
import javafx.stage.Stage;

import org.pointcall.ingest.frame.Frame;
import org.pointcall.ingest.pipeline.StreamStage;
import org.pointcall.ingest.udp.UdpSender;
import org.pointcall.ingest.udp.UdpSenderConfig;
import org.pointcall.ingest.window.W1Workload;
import org.pointcall.ingest.wire.StreamEncoder;
import org.pointcall.ingest.wire.WireOptions;
import org.pointcall.shared.dictionary.DictionaryFiles;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.ui.demo.LiveRig;
import org.pointcall.ui.desk.DeskLink;
import org.pointcall.ui.settings.ConsoleSettings;
import org.pointcall.ui.settings.TraceGroup;
import org.pointcall.ui.trace.TraceTap;

/**
 * Screen benchmark: the console with 8 strip-chart lanes of 20 s, each fed 1,000 samples/s by the full ingest
 * pipeline (workload W1 over UDP on loopback: 256 parameters at 1,000 frames/s, decoded, derived, windowed), first
 * with the console's own envelope, then the same charts fed every sample with ChartFX's reduction off (the plain
 * baseline), in one run. Measured: ChartFX renders per second per chart (counted in the renderer) and the CPU of
 * the JavaFX threads (application and render threads) as a share of one core.
 */
public final class ConsoleBench extends Application {
    /** What one phase measured. */
    public record Phase(String name, double rendersPerSecondPerChart, double minRendersPerSecond, double screenCores,
                        double fxThreadCores, double seconds) {
    }

    /** The run's figures. */
    public record Result(Phase console, Phase baseline, long framesSent, long framesSeen, long droppedDatagrams,
                         long samplesSkippedByScreen) {
        public List<String> lines() {
            List<String> out = new ArrayList<>();
            for (Phase p : List.of(console, baseline)) {
                out.add(String.format(Locale.ROOT, "%s.renders: %.1f per second per chart (slowest chart %.1f)",
                        p.name(), p.rendersPerSecondPerChart(), p.minRendersPerSecond()));
                out.add(String.format(Locale.ROOT, "%s.screen.cpu: %.2f cores (JavaFX threads; %.2f of it the "
                        + "application thread)", p.name(), p.screenCores(), p.fxThreadCores()));
            }
            out.add(String.format(Locale.ROOT, "ratio.renders: %.2f (console / plain)",
                    console.rendersPerSecondPerChart() / baseline.rendersPerSecondPerChart()));
            out.add(String.format(Locale.ROOT, "ratio.cpu.per.render: %.2f (plain / console)",
                    (baseline.screenCores() / baseline.rendersPerSecondPerChart())
                            / (console.screenCores() / console.rendersPerSecondPerChart())));
            out.add(String.format(Locale.ROOT, "pipeline.frames: %d sent, %d through the pipeline, %d datagrams dropped",
                    framesSent, framesSeen, droppedDatagrams));
            out.add("screen.samples.skipped: " + samplesSkippedByScreen);
            return out;
        }
    }

    private static final int LANES = 8;
    private static final AtomicReference<double[]> SECONDS = new AtomicReference<>();
    private static final AtomicReference<Result> RESULT = new AtomicReference<>();
    private static final AtomicReference<Throwable> FAILURE = new AtomicReference<>();
    private static final CountDownLatch DONE = new CountDownLatch(1);

    /** Runs the benchmark (needs a display); blocks until done. */
    public static Result run(double warmS, double measureS, double redrawHz) {
        SECONDS.set(new double[] {warmS, measureS, redrawHz});
        Application.launch(ConsoleBench.class);
        Throwable t = FAILURE.get();
        if (t != null) {
            throw t instanceof RuntimeException r ? r : new IllegalStateException(t);
        }
        return RESULT.get();
    }

    private volatile boolean sending = true;
    private long framesSent;

    @Override
    public void start(Stage stage) {
        ParameterDictionary dict = W1Workload.dictionary();
        List<String> params = new ArrayList<>();
        for (int i = 0; i < LANES; i++) {
            params.add(String.format("P%03d", i)); // slots 0..7 are the 1,000 Hz parameters of W1
        }
        ConsoleSettings settings = new ConsoleSettings(List.of(new TraceGroup("bench", params)), 20, 1500, 940,
                0.2, 0.27);
        TraceTap tap = new TraceTap(dict, params, 1 << 15);
        long[] seen = new long[1];
        LiveRig rig = new LiveRig(0, (id, d) -> {
            StreamStage stage1 = new StreamStage(id, d, W1Workload.specs(), W1Workload.settings(),
                    List.of(tap, f -> seen[0]++), (t, f, v, c) -> { }, null, System::nanoTime);
            return stage1::onFrame;
        }, null, line -> { });
        rig.start();
        Thread sender = new Thread(() -> send(dict, rig.port()), "bench-sender");
        sender.setDaemon(true);
        sender.start();
        DeskLink link = new DeskLink();
        Thread runner = new Thread(() -> {
            try {
                double[] s = SECONDS.get();
                // a first, unmeasured pass: JavaFX, ChartFX and the pipeline loaded and compiled before either
                // measured phase, so that the one measured first is not charged for it (it was, by about 0.1 core)
                phase(stage, "warm-up", link, tap, settings, TraceDrawing.ENVELOPE, s[2], s[0], s[0]);
                Phase a = phase(stage, "console", link, tap, settings, TraceDrawing.ENVELOPE, s[2], s[0], s[1]);
                Phase b = phase(stage, "plain", link, tap, settings, TraceDrawing.RAW, 1000, s[0], s[1]);
                sending = false;
                sender.join(5000);
                rig.awaitDrained(2_000_000_000L);
                rig.close();
                RESULT.set(new Result(a, b, framesSent, seen[0], rig.pipeline().droppedQueueFull(),
                        tap.ring().lost()));
            } catch (Throwable t) {
                FAILURE.set(t);
            } finally {
                Platform.exit();
            }
        }, "bench-runner");
        runner.setDaemon(true);
        runner.start();
    }

    private Phase phase(Stage stage, String name, DeskLink link, TraceTap tap, ConsoleSettings settings,
                        TraceDrawing drawing, double hz, double warmS, double measureS) throws Exception {
        AtomicReference<ConsoleView> view = new AtomicReference<>();
        onFx(() -> {
            ConsoleView v = new ConsoleView(new ConsoleSetup("bench " + name, link, tap.feed(), settings, null, false,
                    hz, drawing));
            stage.setScene(new Scene(v.root(), settings.widthPx(), settings.heightPx()));
            stage.setTitle("pointcall console bench: " + name);
            stage.show();
            v.start();
            view.set(v);
        });
        Thread.sleep((long) (warmS * 1000));
        long[][] r0 = new long[1][];
        onFx(() -> r0[0] = view.get().laneRenders());
        long c0 = fxCpuNs(false);
        long a0 = fxCpuNs(true);
        long t0 = System.nanoTime();
        Thread.sleep((long) (measureS * 1000));
        long[][] r1 = new long[1][];
        onFx(() -> r1[0] = view.get().laneRenders());
        long c1 = fxCpuNs(false);
        long a1 = fxCpuNs(true);
        long t1 = System.nanoTime();
        onFx(() -> view.get().stop());
        double secs = (t1 - t0) / 1e9;
        long total = 0;
        long min = Long.MAX_VALUE;
        for (int i = 0; i < r1[0].length; i++) {
            long d = r1[0][i] - r0[0][i];
            total += d;
            min = Math.min(min, d);
        }
        return new Phase(name, total / (double) r1[0].length / secs, min / secs, (c1 - c0) / 1e9 / secs,
                (a1 - a0) / 1e9 / secs, secs);
    }

    private static void onFx(Runnable r) throws Exception {
        CountDownLatch l = new CountDownLatch(1);
        AtomicReference<Throwable> err = new AtomicReference<>();
        Platform.runLater(() -> {
            try {
                r.run();
            } catch (Throwable t) {
                err.set(t);
            } finally {
                l.countDown();
            }
        });
        if (!l.await(30, TimeUnit.SECONDS)) {
            throw new IllegalStateException("the JavaFX thread did not answer in 30 s");
        }
        if (err.get() != null) {
            throw new IllegalStateException(err.get());
        }
    }

    /** CPU time of the JavaFX application thread and the render threads. */
    private static long fxCpuNs(boolean applicationThreadOnly) {
        ThreadMXBean mx = ManagementFactory.getThreadMXBean();
        long sum = 0;
        for (ThreadInfo ti : mx.getThreadInfo(mx.getAllThreadIds())) {
            if (ti == null) {
                continue;
            }
            String n = ti.getThreadName();
            boolean app = n.equals("JavaFX Application Thread");
            if (app || (!applicationThreadOnly
                    && (n.startsWith("JavaFX") || n.startsWith("QuantumRenderer") || n.startsWith("Prism")))) {
                long c = mx.getThreadCpuTime(ti.getThreadId());
                if (c > 0) {
                    sum += c;
                }
            }
        }
        return sum;
    }

    /** W1 at 1,000 frames/s in real time over UDP on loopback. */
    private void send(ParameterDictionary dict, int port) {
        Frame[] block = W1Workload.frames(W1Workload.FRAME_RATE_HZ, 20261201L);
        Frame f = Frame.forDictionary(dict);
        try (UdpSender sender = new UdpSender(UdpSenderConfig.loopback(port))) {
            StreamEncoder enc = sender.openStream(1, dict, DictionaryFiles.toYaml(dict), WireOptions.DEFAULT);
            long start = System.nanoTime();
            long k = 0;
            while (sending) {
                int i = (int) (k % block.length);
                long s = k / block.length;
                f.copyFrom(block[i]);
                f.timeNs(s * 1_000_000_000L + block[i].timeNs());
                f.sequence(k);
                enc.onFrame(f);
                k++;
                framesSent = k;
                long due = start + k * W1Workload.FRAME_INTERVAL_NS;
                long wait = due - System.nanoTime();
                if (wait > 200_000) {
                    LockSupport.parkNanos(wait);
                }
            }
            enc.flush();
        }
    }
}
