package org.pointcall.ui.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.Locale;

import org.pointcall.shared.card.Band;
import org.pointcall.shared.card.CardFiles;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.card.TestPoint;
import org.pointcall.shared.demo.DemoFiles;
import org.pointcall.shared.dictionary.DictionaryFiles;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.Plain;

import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** Validates a parameter dictionary and a test card before a sortie, listing every problem at once. */
@Command(name = "check",
        header = "Validate a parameter dictionary and a test card.",
        mixinStandardHelpOptions = true,
        description = {
            "Reads a parameter dictionary and, if given, a test card, and reports every problem",
            "with file, line and column. Without options it checks the built-in demo files.",
            "Exit code 0 when both are valid, 2 otherwise."
        })
public final class CheckCommand implements Runnable {

    @Option(names = "--dictionary", paramLabel = "FILE", description = "parameter dictionary (YAML)")
    Path dictionaryFile;

    @Option(names = "--card", paramLabel = "FILE", description = "test card (YAML), checked against the dictionary")
    Path cardFile;

    @Spec
    CommandSpec spec;

    @Override
    public void run() {
        PrintWriter out = spec.commandLine().getOut();
        ParameterDictionary dict = dictionaryFile == null ? DemoFiles.dictionary() : DictionaryFiles.load(dictionaryFile);
        String dictName = dictionaryFile == null ? "demo dictionary" : dictionaryFile.toString();
        out.printf(Locale.ROOT, "dictionary: %s (%s), %d parameters, %d derived, layout hash %016x%n", dict.name(),
                dictName, dict.size(), dict.parameters().stream().filter(p -> p.isDerived()).count(), dict.hash());
        TestCard card = null;
        if (cardFile != null) {
            card = CardFiles.load(cardFile, dict);
        } else if (dictionaryFile == null) {
            card = DemoFiles.card();
        }
        if (card != null) {
            out.printf(Locale.ROOT, "card: sortie %s, airframe %s, %d points, %d safety limits%n", card.sortie(),
                    card.airframe(), card.points().size(), card.limits().size());
            for (TestPoint p : card.points()) {
                out.printf(Locale.ROOT, "  %-8s %-16s %2d bands  %s%n", p.id(), p.kind().key(), p.bands().size(),
                        p.title());
                for (Band b : p.bands()) {
                    String when = switch (b.phase()) {
                        case RATE -> "rate over " + Plain.of(b.overS()) + " s before " + b.instant();
                        case INSTANT -> "at " + b.instant();
                        default -> b.phase().key();
                    };
                    out.printf(Locale.ROOT, "           %-14s %-30s %s%n", b.subject(), when, b.describe());
                }
            }
        }
        out.flush();
    }
}
