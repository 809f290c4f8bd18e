package org.pointcall.ingest.file;

import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Objects;

import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.InputRejectedException;
import org.pointcall.shared.error.Problem;

/** Opens a recorded time history with the reader its extension calls for. */
public final class RecordedFiles {
    private RecordedFiles() {
    }

    /**
     * Opens {@code file}: {@code .csv}, {@code .txt} or {@code .tsv} as delimited text, {@code .xlsx} or
     * {@code .xlsm} as a workbook.
     *
     * @throws InputRejectedException when the extension is not one of those, or the file is refused (see
     *                                {@link CsvSource#open}, {@link XlsxSource#open})
     */
    public static RecordedFileSource open(Path file, ParameterDictionary dictionary, ReadOptions options) {
        Objects.requireNonNull(file, "file");
        Path name = file.getFileName();
        String lower = name == null ? "" : name.toString().toLowerCase(Locale.ROOT);
        if (lower.endsWith(".csv") || lower.endsWith(".txt") || lower.endsWith(".tsv")) {
            return CsvSource.open(file, dictionary, options);
        }
        if (lower.endsWith(".xlsx") || lower.endsWith(".xlsm")) {
            return XlsxSource.open(file, dictionary, options);
        }
        String source = options.sourceName() != null ? options.sourceName() : file.toString();
        String message = lower.endsWith(".xls")
                ? "old binary Excel (.xls) files are not read; save the sheet as .xlsx or .csv"
                : "unknown kind of file: pointcall reads time histories from .csv, .txt, .tsv (comma, semicolon "
                + "or tab separated) and .xlsx files";
        throw new InputRejectedException(List.of(new Problem(source, 0, 0, message)));
    }

    /** {@link #open(Path, ParameterDictionary, ReadOptions)} with {@link ReadOptions#DEFAULTS}. */
    public static RecordedFileSource open(Path file, ParameterDictionary dictionary) {
        return open(file, dictionary, ReadOptions.DEFAULTS);
    }
}
