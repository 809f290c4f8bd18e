package org.pointcall.ui.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.Callable;

import org.pointcall.models.card.NextCard;
import org.pointcall.shared.card.CardFiles;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.card.TestPoint;
import org.pointcall.shared.demo.DemoFiles;
import org.pointcall.shared.dictionary.DictionaryFiles;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.PointcallException;
import org.pointcall.shared.outcome.PointsFile;
import org.pointcall.shared.outcome.PointsFiles;

import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** Writes the next sortie's card from a sortie's results. */
@Command(name = "next-card",
        header = "Write the next sortie's card: points not flown and points to repeat, with what to correct.",
        mixinStandardHelpOptions = true,
        description = {
            "Reads DIR/points.json (from analyze or monitor) and the card that was flown. Keeps every point not",
            "completed and every point whose standing call (the engineer's, else the tool's) is repeat, each",
            "repeat with what to correct, and orders them by altitude band, then kind. The card written is read",
            "back with the dictionary before the command ends."
        })
public final class NextCardCommand implements Callable<Integer> {

    @Option(names = "--results", required = true, paramLabel = "DIR", description = "folder with points.json")
    Path results;

    @Option(names = "--card", required = true, paramLabel = "CARD", description = "the card that was flown")
    Path cardFile;

    @Option(names = "--dictionary", paramLabel = "DICT", description = "parameter dictionary (default: the demo one)")
    Path dictionaryFile;

    @Option(names = "--out", required = true, paramLabel = "FILE", description = "the next card (YAML)")
    Path out;

    @Spec
    CommandSpec spec;

    @Override
    public Integer call() throws IOException {
        PrintWriter w = spec.commandLine().getOut();
        Path json = Files.isDirectory(results) ? results.resolve(PointsFiles.JSON_FILE) : results;
        if (!Files.isRegularFile(json)) {
            throw new PointcallException(json + ": no points file (run analyze or monitor with --out first)");
        }
        ParameterDictionary dict = dictionaryFile == null ? DemoFiles.dictionary()
                : DictionaryFiles.load(dictionaryFile);
        TestCard card = AnalyzeCommand.loadCard(cardFile, dict);
        PointsFile points = PointsFiles.read(json);
        TestCard next = NextCard.from(card, points);
        String yaml = CardFiles.toYaml(next);
        CardFiles.parse(yaml, out.toString(), dict); // what the loader refuses is never written
        if (out.toAbsolutePath().getParent() != null) {
            Files.createDirectories(out.toAbsolutePath().getParent());
        }
        Files.writeString(out, yaml, StandardCharsets.UTF_8);
        w.println("next card: " + next.sortie() + ", " + next.points().size() + " points");
        for (TestPoint p : next.points()) {
            w.println("  " + p.id() + "  " + p.title());
        }
        w.println("wrote: " + out);
        w.flush();
        return 0;
    }
}
