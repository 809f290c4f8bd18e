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
        header = "Speed benchmarks of the ingest stage.",
        mixinStandardHelpOptions = true,
        description = "Speed benchmarks; each prints its figures and ratios as 'name: value unit'.",
        subcommands = {BenchCommand.Ingest.class, BenchCommand.Udp.class, BenchCommand.Kafka.class})
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
