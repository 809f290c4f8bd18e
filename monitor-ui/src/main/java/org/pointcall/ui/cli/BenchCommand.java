package org.pointcall.ui.cli;

import java.io.PrintStream;
import java.io.PrintWriter;
import java.time.Duration;

import org.pointcall.ingest.kafka.KafkaBench;
import org.pointcall.ingest.pipeline.IngestBench;
import org.pointcall.ingest.udp.BenchReport;
import org.pointcall.ingest.udp.WireBench;

import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/**
 * Benchmarks that stand for the speed targets, printing {@code name: value unit} lines. Figures are measured in one
 * run against a baseline measured in the same run, and reported as ratios; nothing here is a pass/fail test.
 */
@Command(name = "bench",
        header = "Speed benchmarks: ingest, UDP, Kafka, simulator, recorder, replay.",
        mixinStandardHelpOptions = true,
        description = "Speed benchmarks; each prints its figures and ratios as 'name: value unit'.",
        subcommands = {BenchCommand.ConsoleScreen.class, BenchCommand.Ingest.class, BenchCommand.Udp.class, BenchCommand.Kafka.class, BenchCommand.Sim.class,
            BenchCommand.Record.class, BenchCommand.Replay.class})
public final class BenchCommand implements Runnable {
    @Spec
    CommandSpec spec;

    @Override
    public void run() {
        spec.commandLine().usage(spec.commandLine().getOut());
    }

    private static void print(PrintWriter out, Iterable<String> lines) {
        for (String l : lines) {
            out.println(l);
        }
        out.flush();
    }

    @Command(name = "console", mixinStandardHelpOptions = true,
            header = "Console screen: 8 strip charts at 1,000 samples/s against plain ChartFX.",
            description = {"The console with 8 strip-chart lanes of 20 s, each fed 1,000 samples/s by workload W1",
                "through the full ingest pipeline over UDP on loopback; first with the console's envelope, then the",
                "same charts fed every sample with ChartFX's own reduction off. Needs a display (an X server such",
                "as Xvfb; with software rendering pass -Dprism.order=sw to java)."})
    static final class ConsoleScreen implements Runnable {
        @Option(names = "--seconds", defaultValue = "15", description = "measured seconds per phase (default: ${DEFAULT-VALUE})")
        double seconds;
        @Option(names = "--redraw-hz", defaultValue = "25",
                description = "the console's redraw cap (default: ${DEFAULT-VALUE}); the plain charts redraw every pulse")
        double redrawHz;
        @Option(names = "--warm", defaultValue = "5", description = "warm-up seconds per phase (default: ${DEFAULT-VALUE})")
        double warm;
        @Spec
        CommandSpec spec;

        @Override
        public void run() {
            if (!org.pointcall.ui.console.ConsoleApp.displayAvailable()) {
                throw new org.pointcall.shared.error.PointcallException(
                        "bench console needs a window: " + org.pointcall.ui.console.ConsoleApp.windowProblem()
                                + " (start Xvfb, or run it on a desktop)");
            }
            if (!(seconds >= 1) || !(warm >= 0)) {
                throw new IllegalArgumentException("--seconds must be >= 1 and --warm >= 0");
            }
            print(spec.commandLine().getOut(), org.pointcall.ui.console.ConsoleBench.run(warm, seconds, redrawHz).lines());
        }
    }

    @Command(name = "ingest", mixinStandardHelpOptions = true, header = "W1 decode + features against a CRC-32C pass.",
            description = {"Workload W1 (256 parameters at 1,000 frames/s, features on 24) decoded from wire packets,",
                "derived and windowed on one thread, against a CRC-32C pass over the same bytes."})
    static final class Ingest implements Runnable {
        @Option(names = "--seconds", defaultValue = "10", description = "seconds of data per round (default: ${DEFAULT-VALUE})")
        int seconds;
        @Spec
        CommandSpec spec;

        @Override
        public void run() {
            print(spec.commandLine().getOut(), IngestBench.run(seconds).lines());
        }
    }

    @Command(name = "udp", mixinStandardHelpOptions = true, header = "UDP loopback: paced without loss, then overloaded.",
            description = {"UDP on loopback: a paced run that should lose nothing, then an overload run on purpose",
                "that proves the loss counters right (lost from sequence gaps = sent - received)."})
    static final class Udp implements Runnable {
        @Option(names = "--seconds", defaultValue = "60", description = "paced run length (default: ${DEFAULT-VALUE})")
        int seconds;
        @Option(names = "--rate", defaultValue = "20000", description = "packets per second (default: ${DEFAULT-VALUE})")
        double rate;
        @Option(names = "--overload-packets", defaultValue = "200000",
                description = "packets sent flat out into a 4 KiB receive buffer (default: ${DEFAULT-VALUE})")
        long overloadPackets;
        @Spec
        CommandSpec spec;

        @Override
        public void run() {
            if (seconds < 1 || !(rate > 0) || overloadPackets < 1) {
                throw new IllegalArgumentException("seconds, rate and overload packets must be positive");
            }
            PrintWriter out = spec.commandLine().getOut();
            BenchReport paced = WireBench.paced(rate, Duration.ofSeconds(seconds), 4 << 20);
            print(out, paced.lines());
            BenchReport over = WireBench.overload(overloadPackets, 4096);
            print(out, over.lines());
        }
    }

    @Command(name = "kafka", mixinStandardHelpOptions = true, header = "Kafka sink against Kafka's own producer tool.",
            description = {"Frames to a Kafka broker through pointcall's sink against Kafka's own producer",
                "performance tool, same broker, same record size, alternating rounds. Without --bootstrap it",
                "starts a broker in a child JVM. Needs Maven on the PATH: the broker and the tool run from",
                "class paths Maven resolves, so neither is bundled in pointcall's jar."})
    static final class Kafka implements Runnable {
        @Option(names = "--bootstrap", description = "an existing broker (host:port); default: start one")
        String bootstrap;
        @Option(names = "--records", defaultValue = "1000000", description = "records per round (default: ${DEFAULT-VALUE})")
        long records;
        @Option(names = "--record-size", defaultValue = "256", description = "bytes per record (default: ${DEFAULT-VALUE})")
        int recordBytes;
        @Option(names = "--rounds", defaultValue = "3", description = "rounds of each producer (default: ${DEFAULT-VALUE})")
        int rounds;
        @Spec
        CommandSpec spec;

        @Override
        public void run() {
            KafkaBench.Options d = KafkaBench.Options.defaults();
            KafkaBench.Options o = new KafkaBench.Options(bootstrap, records, recordBytes, d.streams(), d.partitions(),
                    d.lingerMs(), d.batchBytes(), rounds, d.mvnCommand(), d.toolClasspath(), d.brokerClasspath());
            PrintStream ps = new PrintStream(new WriterOutputStream(spec.commandLine().getOut()), true,
                    java.nio.charset.StandardCharsets.UTF_8);
            KafkaBench.run(o, ps);
            ps.flush();
        }
    }

    @Command(name = "sim", mixinStandardHelpOptions = true, header = "Simulator speed: a whole demo sortie, physics included.",
            description = {"Flies the demo card on the demo airframe (physics at 500 Hz, sensors, telemetry frames at",
                "the given rate) into a sink that keeps nothing, and reports sortie time over wall and CPU time."})
    static final class Sim implements Runnable {
        @Option(names = "--rate", defaultValue = "100", description = "frame rate, Hz (default: ${DEFAULT-VALUE})")
        double rateHz;
        @Option(names = "--seed", defaultValue = "1", description = "seed (default: ${DEFAULT-VALUE})")
        long seed;
        @Spec
        CommandSpec spec;

        @Override
        public void run() {
            PrintWriter out = spec.commandLine().getOut();
            org.pointcall.ingest.sim.SortieSimulator sim = new org.pointcall.ingest.sim.SortieSimulator(
                    org.pointcall.ingest.sim.airframe.Airframes.load("veskarn-02"),
                    org.pointcall.shared.demo.DemoFiles.card(), org.pointcall.shared.demo.DemoFiles.dictionary(), seed,
                    rateHz, org.pointcall.ingest.sim.sensor.SensorSettings.DEFAULT,
                    org.pointcall.ingest.sim.pilot.PilotSettings.DEFAULT);
            long[] frames = new long[1];
            java.lang.management.ThreadMXBean mx = java.lang.management.ManagementFactory.getThreadMXBean();
            long cpu0 = mx.getCurrentThreadCpuTime();
            long t0 = System.nanoTime();
            org.pointcall.ingest.sim.truth.SortieTruth t = sim.run(java.util.List.of(f -> frames[0]++));
            long wall = System.nanoTime() - t0;
            long cpu = mx.getCurrentThreadCpuTime() - cpu0;
            out.println("sortie: " + t.sortie() + " on " + t.airframe() + ", " + t.points().size() + " points");
            out.println(String.format(java.util.Locale.ROOT, "flight: %.1f s", t.durationS()));
            out.println(String.format(java.util.Locale.ROOT, "frames: %d at %.0f Hz", frames[0], rateHz));
            out.println(String.format(java.util.Locale.ROOT, "wall: %.2f s", wall / 1e9));
            out.println(String.format(java.util.Locale.ROOT, "sim.speed: %.1f x real time (wall)", t.durationS() / (wall / 1e9)));
            out.println(String.format(java.util.Locale.ROOT, "sim.speed.cpu: %.1f x real time (one core, thread CPU time)",
                    t.durationS() / (cpu / 1e9)));
            out.flush();
        }
    }

    @Command(name = "record", mixinStandardHelpOptions = true, header = "Recorder at W1: loss and its own CPU.",
            description = {"Feeds W1 (256 parameters at 1,000 frames/s, 2,000 packets/s) in real time to the recorder",
                "and reports packets not recorded and the recorder thread's CPU time as a share of one core;",
                "the archive is read back and counted, then deleted."})
    static final class Record implements java.util.concurrent.Callable<Integer> {
        @Option(names = "--seconds", defaultValue = "60", description = "run length (default: ${DEFAULT-VALUE})")
        int seconds;
        @Option(names = "--dir", description = "folder for the archive (default: the system's temporary folder)")
        java.nio.file.Path dir;
        @Spec
        CommandSpec spec;

        @Override
        public Integer call() throws java.io.IOException {
            java.nio.file.Path d = dir != null ? dir : java.nio.file.Path.of(System.getProperty("java.io.tmpdir"));
            print(spec.commandLine().getOut(), org.pointcall.replay.record.RecordBench.run(seconds, d,
                    org.pointcall.replay.record.RecorderPolicy.DEFAULT).lines());
            return 0;
        }
    }

    @Command(name = "replay", mixinStandardHelpOptions = true, header = "Replay at W1: max speed into the pipeline, 1x timing.",
            description = {"Writes an archive of W1, replays it as fast as possible into the full ingest pipeline",
                "(decode, derive, features) against a plain read of the archive, then replays at 1x and reports",
                "elapsed against data time. The archive is deleted afterwards."})
    static final class Replay implements java.util.concurrent.Callable<Integer> {
        @Option(names = "--seconds", defaultValue = "60", description = "seconds of data, max-speed rounds (default: ${DEFAULT-VALUE})")
        int seconds;
        @Option(names = "--paced-seconds", defaultValue = "60", description = "seconds replayed at 1x, 0 to skip (default: ${DEFAULT-VALUE})")
        int pacedSeconds;
        @Option(names = "--dir", description = "folder for the archive (default: the system's temporary folder)")
        java.nio.file.Path dir;
        @Spec
        CommandSpec spec;

        @Override
        public Integer call() throws java.io.IOException {
            java.nio.file.Path d = dir != null ? dir : java.nio.file.Path.of(System.getProperty("java.io.tmpdir"));
            print(spec.commandLine().getOut(), org.pointcall.replay.play.ReplayBench.run(seconds, pacedSeconds, d).lines());
            return 0;
        }
    }

    /** Lets a PrintStream API write to the command's writer. */
    private static final class WriterOutputStream extends java.io.OutputStream {
        private final PrintWriter w;
        private final java.io.ByteArrayOutputStream line = new java.io.ByteArrayOutputStream();

        WriterOutputStream(PrintWriter w) {
            this.w = w;
        }

        @Override
        public void write(int b) {
            line.write(b);
            if (b == '\n') {
                flush();
            }
        }

        @Override
        public void flush() {
            w.print(line.toString(java.nio.charset.StandardCharsets.UTF_8));
            w.flush();
            line.reset();
        }
    }
}
