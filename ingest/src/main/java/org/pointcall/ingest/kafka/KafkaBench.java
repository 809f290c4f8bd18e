package org.pointcall.ingest.kafka;

import java.io.IOException;
import java.io.InputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.HashMap;
import java.util.Locale;
import java.util.Map;
import java.util.Properties;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.TimeoutException;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;

import org.apache.kafka.clients.admin.Admin;
import org.pointcall.shared.error.PointcallException;

/**
 * Frames per second that {@link KafkaFrameSink} delivers to a broker, against Kafka's own producer performance tool
 * on the same broker, with the same record size, keys, batching and acknowledgements, measured in the same run
 * (rounds alternate ours, tool, ours, tool...; the best of each is compared, and the median of the paired ratios).
 * Each measurement runs in a fresh child JVM with the same heap, so both start equally cold.
 *
 * <p>Neither the broker nor the tool is on pointcall's class path (the server would add tens of MB to the jar, the
 * tool pulls in Connect and Jetty): both run in child JVMs from class paths resolved by the user's Maven, at the
 * Kafka version pointcall was built with. Give {@code --bootstrap} to measure against a running broker instead.
 *
 * <p>Output: one {@code name: value unit} line per figure.
 */
public final class KafkaBench {
    private static final Pattern FIGURE = Pattern.compile("^([a-z ]+): ([0-9.]+) [a-z/]+$");
    private static final Pattern TOOL_TOTAL = Pattern.compile("^(\\d+) records sent, ([0-9.]+) records/sec");
    private static final int CHILD_HEAP_MB = 512;

    private KafkaBench() {
    }

    /**
     * What to measure.
     *
     * @param bootstrap       running broker to use, or null to start one in a child JVM
     * @param records         records per measurement
     * @param recordBytes     value size of each record
     * @param streams         stream ids (keys) cycled through, as a ground station with several aircraft
     * @param partitions      partitions of the topics written
     * @param lingerMs        producer linger, both producers
     * @param batchBytes      producer batch size, both producers
     * @param rounds          alternations of ours and the tool
     * @param mvnCommand      Maven launcher used to resolve the child class paths
     * @param toolClasspath   class path of kafka-tools, or null to resolve it with Maven
     * @param brokerClasspath class path of the Kafka server, or null to resolve it with Maven
     */
    public record Options(String bootstrap, long records, int recordBytes, int streams, int partitions, int lingerMs,
                          int batchBytes, int rounds, String mvnCommand, String toolClasspath,
                          String brokerClasspath) {
        public Options {
            if (records < 1 || recordBytes < 8 || streams < 1 || partitions < 1 || lingerMs < 0 || batchBytes < 1
                    || rounds < 1) {
                throw new IllegalArgumentException("records, streams, partitions, batch size and rounds must be"
                        + " >= 1, record size >= 8 bytes, linger >= 0");
            }
        }

        public static Options defaults() {
            return new Options(null, 1_000_000, 256, 8, 4, 20, 131_072, 3, MavenClasspath.defaultCommand(), null,
                    null);
        }
    }

    /**
     * Best rates of each producer.
     *
     * @param oursRecordsPerS best rate of {@link KafkaFrameSink}
     * @param toolRecordsPerS best rate of Kafka's producer performance tool
     */
    public record Result(double oursRecordsPerS, double toolRecordsPerS) {
        public double ratio() {
            return oursRecordsPerS / toolRecordsPerS;
        }
    }

    /** Command-line entry: {@code KafkaBench [--bootstrap host:port] [--records n] ...}; see {@link #parse}. */
    public static void main(String[] args) {
        try {
            run(parse(args), System.out);
        } catch (PointcallException | IllegalArgumentException e) {
            System.err.println("kafka bench: " + e.getMessage());
            System.exit(2);
        }
    }

    /**
     * Options from {@code --bootstrap, --records, --record-size, --streams, --partitions, --linger-ms,
     * --batch-size, --rounds, --mvn, --tool-classpath, --broker-classpath}, each followed by its value.
     */
    public static Options parse(String[] args) {
        Options d = Options.defaults();
        String bootstrap = d.bootstrap();
        String mvn = d.mvnCommand();
        String toolCp = null;
        String brokerCp = null;
        long records = d.records();
        int size = d.recordBytes();
        int streams = d.streams();
        int partitions = d.partitions();
        int linger = d.lingerMs();
        int batch = d.batchBytes();
        int rounds = d.rounds();
        for (int i = 0; i < args.length; i += 2) {
            String name = args[i];
            if (i + 1 >= args.length) {
                throw new PointcallException("option " + name + " needs a value");
            }
            String v = args[i + 1];
            switch (name) {
                case "--bootstrap": bootstrap = v; break;
                case "--records": records = number(name, v); break;
                case "--record-size": size = (int) number(name, v); break;
                case "--streams": streams = (int) number(name, v); break;
                case "--partitions": partitions = (int) number(name, v); break;
                case "--linger-ms": linger = (int) number(name, v); break;
                case "--batch-size": batch = (int) number(name, v); break;
                case "--rounds": rounds = (int) number(name, v); break;
                case "--mvn": mvn = v; break;
                case "--tool-classpath": toolCp = v; break;
                case "--broker-classpath": brokerCp = v; break;
                default: throw new PointcallException("unknown option " + name);
            }
        }
        return new Options(bootstrap, records, size, streams, partitions, linger, batch, rounds, mvn, toolCp,
                brokerCp);
    }

    private static long number(String option, String v) {
        try {
            long n = Long.parseLong(v.replace("_", ""));
            if (n > Integer.MAX_VALUE && !option.equals("--records")) {
                throw new NumberFormatException();
            }
            return n;
        } catch (NumberFormatException e) {
            throw new PointcallException("option " + option + " needs a whole number, got '" + v + "'");
        }
    }

    /** Runs the comparison and prints its figures to {@code out}. */
    public static Result run(Options o, PrintStream out) {
        Properties versions = childVersions();
        String kafkaVersion = versions.getProperty("kafka.version");
        Path work;
        try {
            work = Files.createTempDirectory("pointcall-kafka-bench");
        } catch (IOException e) {
            throw new PointcallException("cannot create a temporary directory: " + e.getMessage(), e);
        }
        BrokerProcess broker = null;
        try {
            String slf4j = "org.slf4j:slf4j-simple:" + versions.getProperty("slf4j.version");
            String toolCp = o.toolClasspath() != null ? o.toolClasspath()
                    : MavenClasspath.resolve(List.of("org.apache.kafka:kafka-tools:" + kafkaVersion, slf4j),
                            dir(work, "tool-classpath"), o.mvnCommand());
            String bootstrap = o.bootstrap();
            if (bootstrap == null) {
                String brokerCp = o.brokerClasspath() != null ? o.brokerClasspath()
                        : MavenClasspath.resolve(List.of("org.apache.kafka:kafka_2.13:" + kafkaVersion, slf4j),
                                dir(work, "broker-classpath"), o.mvnCommand());
                broker = BrokerProcess.start(brokerCp, dir(work, "broker"), CHILD_HEAP_MB);
                bootstrap = broker.bootstrap();
            }
            out.println("kafka version: " + kafkaVersion);
            out.println("broker: " + bootstrap + (broker != null ? " (child JVM started by the bench)" : ""));
            out.println("records: " + o.records() + " count");
            out.println("record size: " + o.recordBytes() + " B");
            out.println("streams: " + o.streams() + " count");
            out.println("partitions: " + o.partitions() + " count");
            out.println("linger: " + o.lingerMs() + " ms");
            out.println("batch size: " + o.batchBytes() + " B");
            KafkaSettings base = KafkaSettings.of(bootstrap);
            String run = "pointcall-bench-" + Long.toString(System.currentTimeMillis(), 36);
            double[] oursRates = new double[o.rounds()];
            double[] toolRates = new double[o.rounds()];
            double[] ratios = new double[o.rounds()];
            for (int r = 1; r <= o.rounds(); r++) {
                KafkaSettings ours = base.withTopicPrefix(run + "-ours-" + r);
                KafkaSettings tool = base.withTopicPrefix(run + "-tool-" + r);
                KafkaTopics.ensure(ours, o.partitions(), (short) 1);
                KafkaTopics.ensure(tool, o.partitions(), (short) 1);
                double a = measureOurs(ours, o, out, r, dir(work, "ours-" + r));
                out.println("round " + r + " ours: " + format(a) + " records/s");
                double b = measureTool(toolCp, tool.framesTopic(), bootstrap, o, dir(work, "tool-" + r));
                out.println("round " + r + " tool: " + format(b) + " records/s");
                oursRates[r - 1] = a;
                toolRates[r - 1] = b;
                ratios[r - 1] = a / b;
            }
            // best of each is the least disturbed run of each; the median of the paired ratios (each pair ran
            // back to back under about the same load) is a second, noise-resistant view
            Result result = new Result(max(oursRates), max(toolRates));
            out.println("ours: " + format(result.oursRecordsPerS()) + " records/s");
            out.println("tool: " + format(result.toolRecordsPerS()) + " records/s");
            out.println("ours median: " + format(median(oursRates)) + " records/s");
            out.println("tool median: " + format(median(toolRates)) + " records/s");
            out.println("ours MB/s: " + String.format(Locale.ROOT, "%.1f",
                    result.oursRecordsPerS() * o.recordBytes() / 1e6) + " MB/s");
            out.println("ratio: " + String.format(Locale.ROOT, "%.3f", result.ratio()) + " ours/tool");
            out.println("ratio median of pairs: " + String.format(Locale.ROOT, "%.3f", median(ratios))
                    + " ours/tool");
            deleteTopics(bootstrap, run, o.rounds());
            return result;
        } finally {
            if (broker != null) {
                broker.close();
            }
            deleteTree(work);
        }
    }

    /**
     * Runs our sink in a fresh child JVM, as the tool runs in one: both start cold, with the same heap, and neither
     * shares a JIT or a garbage collector with the bench.
     */
    private static double measureOurs(KafkaSettings settings, Options o, PrintStream out, int round, Path dir) {
        Path log = dir.resolve("sink-throughput.log");
        List<String> cmd = new ArrayList<>(childJava());
        cmd.addAll(List.of("-cp", System.getProperty("java.class.path"), SinkThroughput.class.getName(),
                settings.bootstrapServers(), settings.topicPrefix(), Long.toString(o.records()),
                Integer.toString(o.recordBytes()), Integer.toString(o.streams()), Integer.toString(o.lingerMs()),
                Integer.toString(o.batchBytes())));
        Map<String, String> figures = runChild(cmd, log, "our sink");
        long failed = Long.parseLong(figures.getOrDefault("failed", "-1"));
        long delivered = Long.parseLong(figures.getOrDefault("delivered", "-1"));
        if (failed != 0 || delivered != o.records()) {
            out.println("round " + round + " ours failed: " + failed + " count");
            out.println("round " + round + " ours delivered: " + delivered + " count");
        }
        return Double.parseDouble(figures.get("rate"));
    }

    private static List<String> childJava() {
        return List.of(Path.of(System.getProperty("java.home"), "bin", "java").toString(), "-Xmx" + CHILD_HEAP_MB
                + "m", "-Dorg.slf4j.simpleLogger.defaultLogLevel=warn");
    }

    /** Runs a child JVM to its end and returns its {@code name: value unit} lines as name to value. */
    private static Map<String, String> runChild(List<String> cmd, Path log, String what) {
        try {
            Process p = new ProcessBuilder(cmd).redirectErrorStream(true).redirectOutput(log.toFile()).start();
            if (!p.waitFor(30, TimeUnit.MINUTES)) {
                p.destroyForcibly();
                throw new PointcallException(what + " did not finish within 30 min");
            }
            Map<String, String> figures = new HashMap<>();
            for (String line : Files.readAllLines(log, StandardCharsets.UTF_8)) {
                Matcher m = FIGURE.matcher(line.strip());
                if (m.matches()) {
                    figures.put(m.group(1), m.group(2));
                }
            }
            if (p.exitValue() != 0 || !figures.containsKey("rate")) {
                throw new PointcallException(what + " failed (exit " + p.exitValue() + "): "
                        + MavenClasspath.tail(log));
            }
            return figures;
        } catch (IOException e) {
            throw new PointcallException("cannot run " + what + ": " + e.getMessage(), e);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new PointcallException("interrupted while running " + what, e);
        }
    }

    private static double measureTool(String classpath, String topic, String bootstrap, Options o, Path dir) {
        Path log = dir.resolve("producer-performance.log");
        List<String> cmd = new ArrayList<>(childJava());
        cmd.addAll(List.of("-cp", classpath, "org.apache.kafka.tools.ProducerPerformance",
                "--bootstrap-server", bootstrap, "--topic", topic,
                "--num-records", Long.toString(o.records()), "--record-size", Integer.toString(o.recordBytes()),
                "--throughput", "-1",
                "--key-distribution", "range", "--record-key-range", Integer.toString(o.streams()),
                "--command-property", "acks=all", "enable.idempotence=true",
                "linger.ms=" + o.lingerMs(), "batch.size=" + o.batchBytes()));
        try {
            Process p = new ProcessBuilder(cmd).redirectErrorStream(true).redirectOutput(log.toFile()).start();
            if (!p.waitFor(30, TimeUnit.MINUTES)) {
                p.destroyForcibly();
                throw new PointcallException("Kafka's producer performance tool did not finish within 30 min");
            }
            double rate = -1;
            for (String line : Files.readAllLines(log, StandardCharsets.UTF_8)) {
                Matcher m = TOOL_TOTAL.matcher(line.strip());
                if (m.find() && Long.parseLong(m.group(1)) == o.records()) {
                    rate = Double.parseDouble(m.group(2));
                }
            }
            if (p.exitValue() != 0 || rate < 0) {
                throw new PointcallException("Kafka's producer performance tool failed (exit " + p.exitValue()
                        + "): " + MavenClasspath.tail(log));
            }
            return rate;
        } catch (IOException e) {
            throw new PointcallException("cannot run Kafka's producer performance tool: " + e.getMessage(), e);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new PointcallException("interrupted while running Kafka's producer performance tool", e);
        }
    }

    private static Properties childVersions() {
        Properties p = new Properties();
        try (InputStream in = KafkaBench.class.getResourceAsStream("child-artifacts.properties")) {
            if (in == null) {
                throw new PointcallException("child-artifacts.properties missing from the build");
            }
            p.load(in);
        } catch (IOException e) {
            throw new PointcallException("cannot read child-artifacts.properties: " + e.getMessage(), e);
        }
        return p;
    }

    private static Path dir(Path parent, String name) {
        try {
            return Files.createDirectories(parent.resolve(name));
        } catch (IOException e) {
            throw new PointcallException("cannot create " + parent.resolve(name) + ": " + e.getMessage(), e);
        }
    }

    /** Removes the bench's topics, which matters on a broker that outlives the bench. */
    private static void deleteTopics(String bootstrap, String run, int rounds) {
        List<String> topics = new ArrayList<>();
        for (int r = 1; r <= rounds; r++) {
            for (String prefix : List.of(run + "-ours-" + r, run + "-tool-" + r)) {
                topics.add(KafkaTopics.frames(prefix));
                topics.add(KafkaTopics.events(prefix));
                topics.add(KafkaTopics.dictionary(prefix));
            }
        }
        try (Admin admin = Admin.create(KafkaSettings.of(bootstrap).adminConfig())) {
            admin.deleteTopics(topics).all().get(60, TimeUnit.SECONDS);
        } catch (ExecutionException | TimeoutException e) {
            System.err.println("kafka bench: could not delete its topics " + run + "-*: " + e.getMessage());
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
    }

    private static double max(double[] v) {
        double m = v[0];
        for (double x : v) {
            m = Math.max(m, x);
        }
        return m;
    }

    private static double median(double[] v) {
        double[] s = v.clone();
        java.util.Arrays.sort(s);
        int n = s.length;
        return (n & 1) == 1 ? s[n / 2] : (s[n / 2 - 1] + s[n / 2]) / 2;
    }

    private static String format(double v) {
        return String.format(Locale.ROOT, "%.0f", v);
    }

    private static void deleteTree(Path root) {
        try (Stream<Path> s = Files.walk(root)) {
            s.sorted(Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
        } catch (IOException e) {
            // temporary files only; the OS cleans its temp directory
        }
    }
}
