package org.pointcall.models.data;

import java.io.BufferedWriter;
import java.io.IOException;
import java.math.BigDecimal;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;

import org.pointcall.shared.error.PointcallException;

/**
 * Writes labelled rows as CSV for a person to look at (in a spreadsheet, or a plotting script): a header
 * {@code sortie,time_s,class,synthetic,<feature names...>}, then one line per row in the set's order. Times are
 * seconds of the recording's time line, exact to the nanosecond; values are Java's shortest round-trip form (they
 * read back as the same double); a NaN feature is an empty cell. Sortie names containing a comma or a quote are
 * quoted.
 */
public final class DatasetCsv {
    private DatasetCsv() {
    }

    public static void write(LabelledRows rows, Path file) {
        try (BufferedWriter out = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
            StringBuilder b = new StringBuilder(4096);
            b.append("sortie,time_s,class,synthetic");
            for (String f : rows.featureNames()) {
                b.append(',').append(quote(f));
            }
            b.append('\n');
            out.append(b);
            String[] sortieNames = new String[rows.sorties().size()];
            for (int s = 0; s < sortieNames.length; s++) {
                sortieNames[s] = quote(rows.sorties().get(s).name());
            }
            int d = rows.featureCount();
            for (int i = 0; i < rows.rows(); i++) {
                b.setLength(0);
                b.append(sortieNames[rows.sortieOf(i)]).append(',')
                        .append(BigDecimal.valueOf(rows.timeNs(i), 9).stripTrailingZeros().toPlainString())
                        .append(',').append(LabelledRows.CLASS_NAMES.get(rows.classOf(i))).append(',')
                        .append(rows.isSynthetic(i) ? "yes" : "no");
                for (int k = 0; k < d; k++) {
                    b.append(',');
                    double v = rows.value(i, k);
                    if (!Double.isNaN(v)) {
                        b.append(v);
                    }
                }
                b.append('\n');
                out.append(b);
            }
        } catch (IOException e) {
            throw new PointcallException("cannot write " + file + ": " + e.getMessage(), e);
        }
    }

    private static String quote(String s) {
        if (s.indexOf(',') < 0 && s.indexOf('"') < 0 && s.indexOf('\n') < 0) {
            return s;
        }
        return '"' + s.replace("\"", "\"\"") + '"';
    }
}
