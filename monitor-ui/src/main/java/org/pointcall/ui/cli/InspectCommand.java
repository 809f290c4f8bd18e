package org.pointcall.ui.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.Locale;
import java.util.concurrent.Callable;

import org.pointcall.ingest.derive.DerivedParameters;
import org.pointcall.ingest.file.CsvWriter;
import org.pointcall.ingest.file.ReadOptions;
import org.pointcall.ingest.file.ReadReport;
import org.pointcall.ingest.file.RecordedFileSource;
import org.pointcall.ingest.file.RecordedFiles;
import org.pointcall.ingest.wire.DictionaryRegistry;
import org.pointcall.replay.archive.ArchiveFormat;
import org.pointcall.replay.archive.ArchiveReader;
import org.pointcall.replay.archive.ArchiveSummary;
import org.pointcall.shared.demo.DemoFiles;
import org.pointcall.shared.dictionary.DictionaryFiles;
import org.pointcall.shared.dictionary.Parameter;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.Problem;

import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** Reads a recorded time history through a dictionary and says what it found, before anyone analyses it. */
@Command(name = "inspect",
        header = "Read a recorded CSV/XLSX file or a sortie archive and report what it holds.",
        mixinStandardHelpOptions = true,
        description = {
            "Reads a recorded file (CSV or XLSX) through a parameter dictionary, computes the derived",
            "parameters, and reports the columns bound, rows read and skipped, wild points, and the span",
            "and range of every parameter. Exit code 2 when rows had to be skipped (each is listed).",
            "A sortie archive is summed up instead: span, chunks, packets per stream, frames decoded,",
            "records by type, and any damage or cut end (exit code 2 when chunks were damaged)."
        })
public final class InspectCommand implements Callable<Integer> {

    @Option(names = "--input", required = true, paramLabel = "FILE",
            description = "recorded file (.csv, .xlsx) or sortie archive (" + ArchiveFormat.EXTENSION + ")")
    Path input;

    @Option(names = "--dictionary", paramLabel = "FILE", description = "parameter dictionary (default: the demo one)")
    Path dictionaryFile;

    @Option(names = "--time-column", paramLabel = "NAME", description = "name of the time column (default: found)")
    String timeColumn;

    @Option(names = "--sheet", paramLabel = "NAME", description = "XLSX sheet (default: the first)")
    String sheet;

    @Option(names = "--export", paramLabel = "FILE",
            description = "also write every parameter, derived ones included, in engineering units to a CSV file")
    Path export;

    @Spec
    CommandSpec spec;

    @Override
    public Integer call() {
        ParameterDictionary dict = dictionaryFile == null ? DemoFiles.dictionary() : DictionaryFiles.load(dictionaryFile);
        if (input.getFileName() != null && input.getFileName().toString().toLowerCase(Locale.ROOT)
                .endsWith(ArchiveFormat.EXTENSION)) {
            return inspectArchive(dict);
        }
        ReadOptions opts = ReadOptions.DEFAULTS;
        if (timeColumn != null) {
            opts = opts.withTimeColumn(timeColumn);
        }
        if (sheet != null) {
            opts = opts.withSheet(sheet);
        }
        int n = dict.size();
        long[] count = new long[n];
        double[] min = new double[n];
        double[] max = new double[n];
        Arrays.fill(min, Double.POSITIVE_INFINITY);
        Arrays.fill(max, Double.NEGATIVE_INFINITY);
        DerivedParameters derived = DerivedParameters.bind(dict);
        ReadReport report;
        try (RecordedFileSource src = RecordedFiles.open(input, dict, opts);
             CsvWriter exported = export == null ? null : CsvWriter.engineering(export, dict)) {
            report = src.readAll(f -> {
                derived.apply(f);
                if (exported != null) {
                    exported.onFrame(f);
                }
                for (int i = 0; i < n; i++) {
                    double v = f.value(i);
                    if (!Double.isNaN(v)) {
                        count[i]++;
                        min[i] = Math.min(min[i], v);
                        max[i] = Math.max(max[i], v);
                    }
                }
            });
        }
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        for (String line : report.lines()) {
            out.println(line);
        }
        out.printf(Locale.ROOT, "%-12s %-8s %10s %14s %14s%n", "parameter", "unit", "samples", "min", "max");
        for (int i = 0; i < n; i++) {
            Parameter p = dict.parameter(i);
            if (count[i] == 0) {
                continue;
            }
            out.printf(Locale.ROOT, "%-12s %-8s %10d %14.6g %14.6g%s%n", p.name(), p.unit().symbol(), count[i], min[i],
                    max[i], p.isDerived() ? "  (derived)" : "");
        }
        out.flush();
        for (Problem pr : report.problems()) {
            err.println(pr);
        }
        err.flush();
        return report.rowsSkipped() > 0 ? PointcallCommand.EXIT_BAD_INPUT : 0;
    }

    /** A sortie archive: what it holds and whether any of it was damaged or cut. */
    private int inspectArchive(ParameterDictionary dict) {
        PrintWriter out = spec.commandLine().getOut();
        try (ArchiveReader r = ArchiveReader.open(input)) {
            for (String line : ArchiveSummary.lines(r, new DictionaryRegistry(java.util.List.of(dict)))) {
                out.println(line);
            }
            out.flush();
            return r.damage().isEmpty() ? 0 : PointcallCommand.EXIT_BAD_INPUT;
        }
    }
}
