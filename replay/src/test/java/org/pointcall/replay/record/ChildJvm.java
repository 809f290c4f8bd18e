package org.pointcall.replay.record;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

/** Starts a real child JVM on the test class path. */
final class ChildJvm {
    private ChildJvm() {
    }

    static ProcessBuilder java(Class<?> main, String... args) {
        String classpath = System.getProperty("surefire.test.class.path", System.getProperty("java.class.path"));
        List<String> cmd = new ArrayList<>();
        cmd.add(Path.of(System.getProperty("java.home"), "bin", "java").toString());
        cmd.add("-Xmx256m");
        cmd.add("-cp");
        cmd.add(classpath);
        cmd.add(main.getName());
        cmd.addAll(List.of(args));
        return new ProcessBuilder(cmd).redirectErrorStream(true);
    }

    static Process start(Class<?> main, String... args) throws IOException {
        return java(main, args).start();
    }
}
