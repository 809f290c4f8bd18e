package org.pointcall.ui.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.UncheckedIOException;
import java.nio.file.Path;

import org.pointcall.shared.demo.DemoFiles;
import org.pointcall.shared.error.PointcallException;

import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** Writes the demo dictionary and card, the starting point for a user's own files. */
@Command(name = "examples",
        header = "Write the demo dictionary and test card to a folder.",
        mixinStandardHelpOptions = true,
        description = {
            "Writes the demo parameter dictionary and test card (a fictional jet trainer on a",
            "fictional range) to a folder, to start your own files from."
        })
public final class ExamplesCommand implements Runnable {

    @Option(names = "--out", paramLabel = "DIR", required = true, description = "folder to write into")
    Path out;

    @Spec
    CommandSpec spec;

    @Override
    public void run() {
        PrintWriter w = spec.commandLine().getOut();
        try {
            for (Path p : DemoFiles.writeTo(out)) {
                w.println("wrote: " + p);
            }
        } catch (IOException | UncheckedIOException e) {
            throw new PointcallException("cannot write the examples to " + out + ": " + e.getMessage(), e);
        }
        w.flush();
    }
}
