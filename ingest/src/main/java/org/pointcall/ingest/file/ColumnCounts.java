package org.pointcall.ingest.file;

import java.util.Objects;

/**
 * What happened to the cells of one bound column, over the rows that were delivered.
 *
 * @param header     the header as written
 * @param parameter  the dictionary parameter it feeds
 * @param blank      empty cells (not sampled at that instant, in a file of mixed rates): NaN
 * @param nonNumeric cells that were not a finite number (text, {@code NaN}, {@code Inf}, spreadsheet errors): NaN
 * @param wildPoints numbers outside the parameter's valid range after calibration and conversion: NaN
 */
public record ColumnCounts(String header, String parameter, long blank, long nonNumeric, long wildPoints) {
    public ColumnCounts {
        Objects.requireNonNull(header, "header");
        Objects.requireNonNull(parameter, "parameter");
        if (blank < 0 || nonNumeric < 0 || wildPoints < 0) {
            throw new IllegalArgumentException("counts must be >= 0");
        }
    }
}
