package org.pointcall.ingest.kafka;

import java.io.IOException;
import java.io.OutputStream;
import java.net.InetAddress;
import java.net.InetSocketAddress;
import java.net.ServerSocket;
import java.net.Socket;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Properties;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.TimeoutException;

import org.apache.kafka.clients.admin.Admin;
import org.apache.kafka.clients.admin.AdminClientConfig;
import org.apache.kafka.common.Uuid;
import org.pointcall.shared.error.PointcallException;

/**
 * A single-node Apache Kafka broker (KRaft, broker and controller in one) in a child JVM on 127.0.0.1, for the
 * benchmark and for fault tests that stop and restart it. The child runs {@code kafka.Kafka} from a class path the
 * caller gives (Kafka's server jars plus an SLF4J backend), so the server never sits on pointcall's class path.
 */
final class BrokerProcess implements AutoCloseable {
    private static final long READY_TIMEOUT_MS = 90_000;
    private static final long STOP_TIMEOUT_S = 30;

    private final String classpath;
    private final Path workDir;
    private final Path config;
    private final Path log;
    private final int heapMb;
    private final int brokerPort;
    private final Thread reaper = new Thread(this::kill, "kafka-broker-reaper");
    private Process process;

    private BrokerProcess(String classpath, Path workDir, int heapMb) throws IOException {
        this.classpath = classpath;
        this.workDir = workDir;
        this.heapMb = heapMb;
        this.config = workDir.resolve("server.properties");
        this.log = workDir.resolve("broker.log");
        this.brokerPort = freePort();
        int controllerPort = freePort();
        Properties p = new Properties();
        p.putAll(serverProperties(brokerPort, controllerPort, workDir.resolve("data")));
        try (OutputStream out = Files.newOutputStream(config)) {
            p.store(out, "single-node broker for pointcall benchmarks and tests");
        }
    }

    /**
     * Server settings of a single-node KRaft broker on 127.0.0.1 that runs in a small heap: replication factors
     * and minimum in-sync replicas of 1, no initial rebalance delay, no automatic topic creation (pointcall creates
     * its topics), and a small log-cleaner buffer (the 128 MiB default exhausts a small heap).
     */
    static Map<String, String> serverProperties(int brokerPort, int controllerPort, Path logDir) {
        Map<String, String> m = new LinkedHashMap<>();
        m.put("process.roles", "broker,controller");
        m.put("node.id", "1");
        m.put("controller.quorum.voters", "1@127.0.0.1:" + controllerPort);
        m.put("listeners", "PLAINTEXT://127.0.0.1:" + brokerPort + ",CONTROLLER://127.0.0.1:" + controllerPort);
        m.put("advertised.listeners", "PLAINTEXT://127.0.0.1:" + brokerPort);
        m.put("controller.listener.names", "CONTROLLER");
        m.put("listener.security.protocol.map", "PLAINTEXT:PLAINTEXT,CONTROLLER:PLAINTEXT");
        m.put("inter.broker.listener.name", "PLAINTEXT");
        m.put("log.dirs", logDir.toString());
        m.put("num.partitions", "1");
        m.put("auto.create.topics.enable", "false");
        m.put("offsets.topic.replication.factor", "1");
        m.put("offsets.topic.num.partitions", "1");
        m.put("transaction.state.log.replication.factor", "1");
        m.put("transaction.state.log.min.isr", "1");
        m.put("share.coordinator.state.topic.replication.factor", "1");
        m.put("share.coordinator.state.topic.min.isr", "1");
        m.put("min.insync.replicas", "1");
        m.put("default.replication.factor", "1");
        m.put("group.initial.rebalance.delay.ms", "0");
        m.put("log.cleaner.dedupe.buffer.size", "2097152");
        return m;
    }

    /**
     * Formats a fresh log directory under {@code workDir}, starts the broker and waits until it answers.
     *
     * @param classpath Kafka server class path for the child JVM
     * @param workDir   empty directory for settings, data and the broker's log; the caller deletes it
     */
    static BrokerProcess start(String classpath, Path workDir, int heapMb) {
        try {
            BrokerProcess b = new BrokerProcess(classpath, workDir, heapMb);
            b.format();
            Runtime.getRuntime().addShutdownHook(b.reaper);
            b.launch();
            return b;
        } catch (IOException e) {
            throw new PointcallException("cannot start a Kafka broker in " + workDir + ": " + e.getMessage(), e);
        }
    }

    String bootstrap() {
        return "127.0.0.1:" + brokerPort;
    }

    Path log() {
        return log;
    }

    boolean alive() {
        return process != null && process.isAlive();
    }

    /** Stops the broker with SIGTERM (a clean shutdown) and waits for it to exit. */
    void stop() {
        if (process == null) {
            return;
        }
        process.destroy();
        try {
            if (!process.waitFor(STOP_TIMEOUT_S, TimeUnit.SECONDS)) {
                process.destroyForcibly().waitFor();
            }
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            process.destroyForcibly();
        }
        process = null;
    }

    /** Starts the stopped broker again on the same ports and log directory, and waits until it answers. */
    void restart() throws IOException {
        if (alive()) {
            throw new IllegalStateException("broker still running");
        }
        launch();
    }

    @Override
    public void close() {
        stop();
        try {
            Runtime.getRuntime().removeShutdownHook(reaper);
        } catch (IllegalStateException e) {
            // the JVM is shutting down and the hook runs anyway
        }
    }

    private void kill() {
        Process p = process;
        if (p != null) {
            p.destroyForcibly();
        }
    }

    private List<String> java(String mainClass, String... args) {
        List<String> cmd = new ArrayList<>();
        cmd.add(Path.of(System.getProperty("java.home"), "bin", "java").toString());
        cmd.add("-Xmx" + heapMb + "m");
        cmd.add("-Dorg.slf4j.simpleLogger.defaultLogLevel=warn");
        // keep the start-up line in the broker's log, it helps when start-up is slow
        cmd.add("-Dorg.slf4j.simpleLogger.log.kafka.server.KafkaRaftServer=info");
        cmd.add("-cp");
        cmd.add(classpath);
        cmd.add(mainClass);
        cmd.addAll(List.of(args));
        return cmd;
    }

    private void format() throws IOException {
        Process p = new ProcessBuilder(java("kafka.tools.StorageTool", "format", "-t", Uuid.randomUuid().toString(),
                "-c", config.toString())).redirectErrorStream(true).redirectOutput(log.toFile()).start();
        try {
            if (!p.waitFor(120, TimeUnit.SECONDS)) {
                p.destroyForcibly();
                throw new PointcallException("formatting the Kafka log directory took over 120 s; see " + log);
            }
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            p.destroyForcibly();
            throw new PointcallException("interrupted while formatting the Kafka log directory", e);
        }
        if (p.exitValue() != 0) {
            throw new PointcallException("formatting the Kafka log directory failed (exit " + p.exitValue() + "): "
                    + MavenClasspath.tail(log));
        }
    }

    private void launch() throws IOException {
        process = new ProcessBuilder(java("kafka.Kafka", config.toString())).redirectErrorStream(true)
                .redirectOutput(ProcessBuilder.Redirect.appendTo(log.toFile())).start();
        awaitReady();
    }

    private void awaitReady() {
        long deadline = System.nanoTime() + TimeUnit.MILLISECONDS.toNanos(READY_TIMEOUT_MS);
        // a plain connect first: the admin client would log every refused connection
        while (!accepts()) {
            checkAlive(deadline);
            pause();
        }
        Map<String, Object> conf = Map.of(AdminClientConfig.BOOTSTRAP_SERVERS_CONFIG, bootstrap(),
                AdminClientConfig.REQUEST_TIMEOUT_MS_CONFIG, 3000,
                AdminClientConfig.DEFAULT_API_TIMEOUT_MS_CONFIG, 5000);
        try (Admin admin = Admin.create(conf)) {
            while (true) {
                checkAlive(deadline);
                try {
                    if (!admin.describeCluster().nodes().get(5, TimeUnit.SECONDS).isEmpty()) {
                        return;
                    }
                } catch (ExecutionException | TimeoutException e) {
                    pause();
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                    throw new PointcallException("interrupted while waiting for the Kafka broker", e);
                }
            }
        }
    }

    private boolean accepts() {
        try (Socket s = new Socket()) {
            s.connect(new InetSocketAddress(InetAddress.getLoopbackAddress(), brokerPort), 500);
            return true;
        } catch (IOException e) {
            return false;
        }
    }

    private void checkAlive(long deadline) {
        if (!process.isAlive()) {
            throw new PointcallException("the Kafka broker exited during start-up (exit " + process.exitValue()
                    + "): " + MavenClasspath.tail(log));
        }
        if (System.nanoTime() > deadline) {
            stop();
            throw new PointcallException("the Kafka broker did not answer within " + READY_TIMEOUT_MS / 1000
                    + " s; see " + log);
        }
    }

    private static void pause() {
        try {
            Thread.sleep(100);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new PointcallException("interrupted while waiting for the Kafka broker", e);
        }
    }

    static int freePort() throws IOException {
        try (ServerSocket s = new ServerSocket(0, 1, InetAddress.getLoopbackAddress())) {
            return s.getLocalPort();
        }
    }
}
