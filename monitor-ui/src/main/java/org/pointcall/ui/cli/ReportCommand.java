package org.pointcall.ui.cli;

import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;

import org.pointcall.models.modelfile.LoadedModel;
import org.pointcall.models.train.Classifier;
import org.pointcall.replay.archive.ArchiveFormat;
import org.pointcall.replay.archive.ArchiveReader;
import org.pointcall.replay.report.ArchiveAnalysis;
import org.pointcall.replay.report.DebriefContent;
import org.pointcall.replay.report.DebriefReport;
import org.pointcall.replay.report.ReportProgress;
import org.pointcall.replay.report.SortieAnalysis;
import org.pointcall.shared.card.TestCard;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.PointcallException;
import org.pointcall.shared.outcome.PointsFile;
import org.pointcall.shared.outcome.PointsFiles;

import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** Writes a sortie's debrief report: HTML and PDF, one figure per point, the next card. */
@Command(name = "report",
        header = "Write a sortie's debrief report: self-contained HTML and a PDF, one figure per point.",
        mixinStandardHelpOptions = true,
        description = {
            "With --input, analyses the recording as analyze does (points.json and points.csv are written too);",
            "with --results, reads an earlier analyze or monitor folder, and --input then only gives the",
            "figures and the data quality. The report holds the sortie summary, the data quality (gaps, rows",
            "skipped, wild points), the point table with verdicts, reasons and metrics, one figure per point",
            "with its bands and key instants, the engineer's calls and notes, the next sortie's card and the",
            "safety caution. Progress goes to standard error: a bar on a terminal, plain lines otherwise."
        })
public final class ReportCommand implements Callable<Integer> {

    @Option(names = "--input", paramLabel = "FILE",
            description = "recorded sortie (.csv, .xlsx) or sortie archive (.pcsa)")
    Path input;

    @Option(names = "--results", paramLabel = "DIR", description = "folder with points.json (from analyze or monitor)")
    Path results;

    @Option(names = "--card", paramLabel = "CARD", description = "the card flown (without one: no bands, no next card)")
    Path cardFile;

    @Option(names = "--dictionary", paramLabel = "DICT",
            description = "parameter dictionary (default: dictionary.yaml beside the input or the results, else the "
                    + "demo one)")
    Path dictionaryFile;

    @Option(names = "--model", paramLabel = "MODEL", description = "detector model (default: the one in the jar)")
    Path modelFile;

    @Option(names = "--out", required = true, paramLabel = "DIR", description = "folder for the report")
    Path out;

    @Option(names = "--no-pdf", description = "write the HTML report only")
    boolean noPdf;

    @Spec
    CommandSpec spec;

    static {
        // PDFBox logs through commons-logging, which would pick the Log4j API that POI brings (and has no
        // backend here): send it to the application's SLF4J backend like everything else
        if (System.getProperty("org.apache.commons.logging.LogFactory") == null) {
            System.setProperty("org.apache.commons.logging.LogFactory",
                    "org.apache.commons.logging.impl.Slf4jLogFactory");
        }
        // the PDF's standard fonts are only measured, never embedded: that PDFBox maps them to a system font for
        // outlines it never draws is not news for the user
        String fonts = "org.slf4j.simpleLogger.log.org.apache.pdfbox.pdmodel.font";
        if (System.getProperty(fonts) == null) {
            System.setProperty(fonts, "error");
        }
    }

    @Override
    public Integer call() {
        PrintWriter w = spec.commandLine().getOut();
        if (input == null && results == null) {
            throw new PointcallException("give the recording (--input FILE) or an analysis folder (--results DIR)");
        }
        if (input != null && !Files.isRegularFile(input)) {
            throw new PointcallException(input + ": no such recording");
        }
        ParameterDictionary dict = AnalyzeCommand.dictionary(dictionaryFile,
                input != null ? input : results.resolve(PointsFiles.JSON_FILE));
        TestCard card = cardFile == null ? null : AnalyzeCommand.loadCard(cardFile, dict);
        ProgressBar bar = new ProgressBar(spec.commandLine().getErr(), System.console() != null);
        ReportProgress progress = bar::progress;

        PointsFile points;
        SortieAnalysis.Reading reading = null;
        String model;
        if (results != null) {
            Path json = Files.isDirectory(results) ? results.resolve(PointsFiles.JSON_FILE) : results;
            if (!Files.isRegularFile(json)) {
                throw new PointcallException(json + ": no points file (run analyze or monitor with --out first)");
            }
            points = PointsFiles.read(json);
            if (card != null && !points.sortie().isEmpty() && !points.sortie().equals(card.sortie())) {
                throw new PointcallException(json + ": the results are of sortie " + points.sortie()
                        + ", the card " + cardFile + " is of " + card.sortie());
            }
            if (input != null && isArchive(input)) {
                throw new PointcallException(input + ": with --results, give the recorded CSV/XLSX file for the "
                        + "figures; an archive is analysed on its own (--input ARCHIVE without --results)");
            }
            if (input != null) {
                reading = SortieAnalysis.observe(input, dict, card, progress.within(0, 0.4));
            }
            model = null;
        } else {
            LoadedModel<Classifier> loaded = DetectorModel.load(modelFile);
            if (isArchive(input)) {
                try (ArchiveReader reader = ArchiveReader.open(input)) {
                    reading = ArchiveAnalysis.analyse(reader, dict, card, loaded.model(),
                            loaded.metadata().description(), progress.within(0, 0.6));
                }
            } else {
                reading = SortieAnalysis.analyse(input, dict, card, loaded.model(), loaded.metadata().description(),
                        progress.within(0, 0.6));
            }
            points = reading.points();
            List<Path> files = PointsFiles.write(out, points);
            w.println("wrote: " + files.get(0) + ", " + files.get(1));
            model = describe(loaded, modelFile);
        }
        DebriefContent content = new DebriefContent(points, card,
                cardFile == null ? null : cardFile.getFileName().toString(), dict,
                reading == null ? null : reading.quality(), reading == null ? null : reading.trace(), model,
                Instant.now(), new PointcallCommand.Version().getVersion()[0]);
        DebriefReport.Written written = DebriefReport.write(content, out, !noPdf,
                progress.within(reading == null ? 0 : results != null ? 0.4 : 0.6, 1));
        AnalyzeCommand.summary(w, points);
        w.printf(Locale.ROOT, "figures: %d%n", written.figures().size());
        w.println("next card: " + (written.nextCard() != null ? written.nextCard() : written.next().why()));
        w.println("wrote: " + written.html() + (written.pdf() == null ? "" : ", " + written.pdf()));
        w.flush();
        return 0;
    }

    private static boolean isArchive(Path file) {
        return file.getFileName().toString().toLowerCase(Locale.ROOT).endsWith(ArchiveFormat.EXTENSION);
    }

    private static String describe(LoadedModel<Classifier> m, Path file) {
        String sha = m.metadata().payloadSha256();
        return (file == null ? "the default model in the jar" : file.getFileName().toString()) + ", "
                + m.metadata().description().training().classifier() + ", made "
                + m.metadata().created().toString().substring(0, 10)
                + (sha == null || sha.length() < 12 ? "" : ", sha-256 " + sha.substring(0, 12));
    }
}
