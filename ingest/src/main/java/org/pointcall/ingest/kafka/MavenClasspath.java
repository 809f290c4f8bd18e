package org.pointcall.ingest.kafka;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.TimeUnit;

import org.pointcall.shared.error.PointcallException;

/**
 * Resolves a class path of Maven artifacts with the user's own Maven (whoever built pointcall has one, with its
 * settings and repositories), so tools that must not be on pointcall's class path (Kafka's broker, Kafka's producer
 * performance tool) can run in a child JVM.
 */
final class MavenClasspath {
    private static final String DEPENDENCY_PLUGIN = "3.8.1";
    private static final long TIMEOUT_S = 600;

    private MavenClasspath() {
    }

    /** The Maven launcher name on this system. */
    static String defaultCommand() {
        return System.getProperty("os.name", "").toLowerCase(Locale.ROOT).startsWith("windows") ? "mvn.cmd" : "mvn";
    }

    /**
     * @param coordinates {@code groupId:artifactId:version} of each top-level artifact; their runtime dependencies
     *                    follow
     * @param workDir     empty directory for the generated pom, Maven's log and the class path file
     * @return the class path, entries joined by the platform's path separator
     */
    static String resolve(List<String> coordinates, Path workDir, String mvnCommand) {
        StringBuilder deps = new StringBuilder();
        for (String c : coordinates) {
            String[] p = c.split(":");
            if (p.length != 3) {
                throw new IllegalArgumentException("artifact needs groupId:artifactId:version, got " + c);
            }
            deps.append("    <dependency><groupId>").append(p[0]).append("</groupId><artifactId>").append(p[1])
                    .append("</artifactId><version>").append(p[2]).append("</version></dependency>\n");
        }
        String pom = "<project xmlns=\"http://maven.apache.org/POM/4.0.0\">\n"
                + "  <modelVersion>4.0.0</modelVersion>\n"
                + "  <groupId>org.pointcall.bench</groupId><artifactId>child-classpath</artifactId>"
                + "<version>1</version><packaging>pom</packaging>\n"
                + "  <dependencies>\n" + deps + "  </dependencies>\n"
                + "</project>\n";
        Path pomFile = workDir.resolve("pom.xml");
        Path out = workDir.resolve("classpath.txt");
        Path log = workDir.resolve("maven.log");
        String what = "resolving " + String.join(", ", coordinates) + " with " + mvnCommand;
        try {
            Files.writeString(pomFile, pom, StandardCharsets.UTF_8);
            Process p = new ProcessBuilder(mvnCommand, "-B", "-q", "-f", pomFile.toString(),
                    "org.apache.maven.plugins:maven-dependency-plugin:" + DEPENDENCY_PLUGIN + ":build-classpath",
                    "-Dmdep.outputFile=" + out, "-Dmdep.includeScope=runtime")
                    .redirectErrorStream(true).redirectOutput(log.toFile()).start();
            if (!p.waitFor(TIMEOUT_S, TimeUnit.SECONDS)) {
                p.destroyForcibly();
                throw new PointcallException(what + ": no result within " + TIMEOUT_S + " s");
            }
            if (p.exitValue() != 0 || !Files.exists(out)) {
                throw new PointcallException(what + " failed (exit " + p.exitValue() + "): " + tail(log));
            }
            return Files.readString(out, StandardCharsets.UTF_8).strip();
        } catch (IOException e) {
            throw new PointcallException(what + " failed: " + e.getMessage()
                    + " (is Maven installed and on the PATH?)", e);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new PointcallException(what + ": interrupted", e);
        }
    }

    /** Last few lines of a log, on one line, for an error message. */
    static String tail(Path log) {
        try {
            List<String> lines = Files.readAllLines(log, StandardCharsets.UTF_8);
            return String.join(" | ", lines.subList(Math.max(0, lines.size() - 5), lines.size())).strip();
        } catch (IOException e) {
            return "(no log)";
        }
    }
}
