package org.pointcall.ingest.file;

import java.util.List;
import java.util.Objects;

/**
 * How a file's header row was bound to the dictionary, known as soon as the file is open.
 *
 * @param source            the file's name in problems
 * @param headerLine        line (CSV) or row (XLSX) of the header
 * @param timeHeader        the time column's header as written
 * @param timeUnit          symbol of the unit of a time in seconds form ({@code s}, {@code ms}...)
 * @param columns           bound columns in file order
 * @param ignoredColumns    headers of columns not in the dictionary, in file order
 * @param missingParameters measured dictionary parameters that no column carries: NaN in every frame
 */
public record HeaderBinding(String source, int headerLine, String timeHeader, String timeUnit,
                            List<BoundColumn> columns, List<String> ignoredColumns,
                            List<String> missingParameters) {
    public HeaderBinding {
        Objects.requireNonNull(source, "source");
        Objects.requireNonNull(timeHeader, "timeHeader");
        Objects.requireNonNull(timeUnit, "timeUnit");
        columns = List.copyOf(columns);
        ignoredColumns = List.copyOf(ignoredColumns);
        missingParameters = List.copyOf(missingParameters);
    }
}
