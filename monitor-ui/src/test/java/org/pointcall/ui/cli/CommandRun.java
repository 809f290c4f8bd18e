package org.pointcall.ui.cli;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.util.LinkedHashMap;
import java.util.Map;

import picocli.CommandLine;

/** Runs the real command line in-process and keeps what it printed. */
record CommandRun(int exitCode, String out, String err) {

    static CommandRun of(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        CommandLine cl = PointcallCommand.newCommandLine();
        cl.setOut(new PrintWriter(out, true));
        cl.setErr(new PrintWriter(err, true));
        int code = cl.execute(args);
        return new CommandRun(code, out.toString(), err.toString());
    }

    /** The {@code name: value unit} lines of standard output, by name. */
    Map<String, String> figures() {
        Map<String, String> m = new LinkedHashMap<>();
        for (String line : out.split("\\R")) {
            int c = line.indexOf(": ");
            if (c > 0) {
                m.put(line.substring(0, c), line.substring(c + 2));
            }
        }
        return m;
    }

    /** The number of a figure, its unit dropped. */
    double number(String name) {
        String v = figures().get(name);
        if (v == null) {
            throw new AssertionError("no figure '" + name + "' in:\n" + out + err);
        }
        return Double.parseDouble(v.split(" ")[0]);
    }
}
