package org.pointcall.ingest.kafka;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Comparator;
import java.util.Map;
import java.util.Properties;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;

import kafka.server.KafkaConfig;
import kafka.server.KafkaRaftServer;
import kafka.tools.StorageTool;
import org.apache.kafka.clients.admin.Admin;
import org.apache.kafka.clients.admin.AdminClientConfig;
import org.apache.kafka.common.Uuid;
import org.apache.kafka.common.utils.Time;
import org.junit.jupiter.api.extension.ExtensionContext;
import org.junit.jupiter.api.extension.ParameterContext;
import org.junit.jupiter.api.extension.ParameterResolver;

/**
 * A real Apache Kafka broker (KRaft, broker and controller in one node) inside the test JVM, on 127.0.0.1 with free
 * ports and a temporary log directory. {@link Shared} starts one per JVM for every test class that asks for it and
 * stops it when the test run ends. Public for the tests of the modules after ingest (through ingest's test jar).
 */
public final class LocalKafkaBroker implements AutoCloseable {
    private final Path dir;
    private final KafkaRaftServer server;
    private final String bootstrap;

    private LocalKafkaBroker(Path dir, KafkaRaftServer server, String bootstrap) {
        this.dir = dir;
        this.server = server;
        this.bootstrap = bootstrap;
    }

    public static LocalKafkaBroker start() throws Exception {
        Path dir = Files.createTempDirectory("pointcall-kafka-test");
        int brokerPort = BrokerProcess.freePort();
        int controllerPort = BrokerProcess.freePort();
        Map<String, String> props = BrokerProcess.serverProperties(brokerPort, controllerPort, dir.resolve("data"));
        Path config = dir.resolve("server.properties");
        Properties p = new Properties();
        p.putAll(props);
        try (OutputStream out = Files.newOutputStream(config)) {
            p.store(out, null);
        }
        ByteArrayOutputStream formatOut = new ByteArrayOutputStream();
        int rc = StorageTool.execute(new String[] {"format", "-t", Uuid.randomUuid().toString(), "-c",
            config.toString()}, new PrintStream(formatOut, true, StandardCharsets.UTF_8));
        if (rc != 0) {
            throw new IllegalStateException("storage format failed: " + formatOut.toString(StandardCharsets.UTF_8));
        }
        KafkaRaftServer server = new KafkaRaftServer(new KafkaConfig(props), Time.SYSTEM);
        server.startup();
        String bootstrap = "127.0.0.1:" + brokerPort;
        try (Admin admin = Admin.create(Map.of(AdminClientConfig.BOOTSTRAP_SERVERS_CONFIG, bootstrap))) {
            admin.describeCluster().nodes().get(60, TimeUnit.SECONDS);
        }
        return new LocalKafkaBroker(dir, server, bootstrap);
    }

    public String bootstrap() {
        return bootstrap;
    }

    /** Settings for this broker with a topic prefix of the test's own, so tests never share topics. */
    public KafkaSettings settings(String prefix) {
        return KafkaSettings.of(bootstrap).withTopicPrefix(prefix);
    }

    Admin admin() {
        return Admin.create(Map.of(AdminClientConfig.BOOTSTRAP_SERVERS_CONFIG, bootstrap));
    }

    @Override
    public void close() throws IOException {
        server.shutdown();
        server.awaitShutdown();
        deleteTree(dir);
    }

    static void deleteTree(Path root) throws IOException {
        if (!Files.exists(root)) {
            return;
        }
        try (Stream<Path> s = Files.walk(root)) {
            for (Path p : (Iterable<Path>) s.sorted(Comparator.reverseOrder())::iterator) {
                Files.deleteIfExists(p);
            }
        }
    }

    /**
     * JUnit 5 extension: {@code @ExtendWith(LocalKafkaBroker.Shared.class)}, then take a {@code LocalKafkaBroker}
     * parameter in {@code @BeforeAll} or a test. The broker lives in the root store, so it starts once per JVM
     * and JUnit closes it at the end of the run.
     */
    public static final class Shared implements ParameterResolver {
        @Override
        public boolean supportsParameter(ParameterContext parameter, ExtensionContext context) {
            return parameter.getParameter().getType() == LocalKafkaBroker.class;
        }

        @Override
        public Object resolveParameter(ParameterContext parameter, ExtensionContext context) {
            ExtensionContext.Store store = context.getRoot().getStore(ExtensionContext.Namespace.create(Shared.class));
            return store.getOrComputeIfAbsent(LocalKafkaBroker.class, k -> {
                try {
                    return start();
                } catch (Exception e) {
                    throw new IllegalStateException("cannot start the test Kafka broker", e);
                }
            }, LocalKafkaBroker.class);
        }
    }
}
