package org.pointcall.ingest.file;

import java.io.BufferedWriter;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;

import org.pointcall.ingest.frame.Frame;
import org.pointcall.ingest.frame.FrameSink;
import org.pointcall.shared.dictionary.Parameter;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.PointcallException;

/**
 * Writes frames as the CSV that {@link CsvSource} reads back: a header of {@code time [s]} and each measured
 * parameter's column name with its unit ({@code PS_ADC [hPa]}), then one row per frame, a blank cell where a
 * parameter was not sampled. A calibrated channel is written raw, as a recorder would (the reader calibrates it
 * back). Numbers are written with Java's shortest round-trip form, so an uncalibrated value reads back as the same
 * double; the same frames always give the same bytes.
 */
public final class CsvWriter implements FrameSink, AutoCloseable {
    private final Path file;
    private final Writer out;
    private final int[] slots;
    private final org.pointcall.shared.dictionary.Calibration[] calibrations;
    private final StringBuilder row = new StringBuilder(1024);
    private long rows;

    /** Writes the measured parameters as a recorder would (derived ones are left to the reader's dictionary). */
    public static CsvWriter create(Path file, ParameterDictionary dictionary) {
        return new CsvWriter(file, dictionary, false, false);
    }

    /**
     * Writes every parameter, derived ones included, in engineering units under the parameters' own names: an
     * export for a person or another tool, not a recording.
     */
    public static CsvWriter engineering(Path file, ParameterDictionary dictionary) {
        return new CsvWriter(file, dictionary, true, true);
    }

    private CsvWriter(Path file, ParameterDictionary dictionary, boolean includeDerived, boolean engineering) {
        this.file = file;
        int n = 0;
        for (Parameter p : dictionary.parameters()) {
            if (includeDerived || !p.isDerived()) {
                n++;
            }
        }
        this.slots = new int[n];
        this.calibrations = new org.pointcall.shared.dictionary.Calibration[n];
        int k = 0;
        StringBuilder header = new StringBuilder("time [s]");
        for (int i = 0; i < dictionary.size(); i++) {
            Parameter p = dictionary.parameter(i);
            if (includeDerived || !p.isDerived()) {
                calibrations[k] = engineering ? org.pointcall.shared.dictionary.Calibration.IDENTITY : p.calibration();
                slots[k++] = i;
                header.append(',').append(engineering ? p.name() : p.column()).append(" [").append(p.unit().symbol())
                        .append(']');
            }
        }
        try {
            this.out = new BufferedWriter(Files.newBufferedWriter(file, StandardCharsets.UTF_8), 1 << 16);
            out.write(header.toString());
            out.write('\n');
        } catch (IOException e) {
            throw new PointcallException("cannot write " + file + ": " + e.getMessage(), e);
        }
    }

    @Override
    public void onFrame(Frame f) {
        row.setLength(0);
        appendSeconds(row, f.timeNs());
        for (int k = 0; k < slots.length; k++) {
            row.append(',');
            double v = calibrations[k].toRaw(f.value(slots[k]));
            if (!Double.isNaN(v)) {
                row.append(v);
            }
        }
        row.append('\n');
        try {
            out.append(row);
        } catch (IOException e) {
            throw new UncheckedIOException("cannot write " + file + ": " + e.getMessage(), e);
        }
        rows++;
    }

    /** Exact decimal seconds of a nanosecond time (no binary rounding): 12.345678901. */
    static void appendSeconds(StringBuilder sb, long timeNs) {
        if (timeNs < 0) {
            sb.append('-');
            timeNs = -timeNs;
        }
        sb.append(timeNs / 1_000_000_000L).append('.');
        long frac = timeNs % 1_000_000_000L;
        String f = Long.toString(frac);
        for (int i = f.length(); i < 9; i++) {
            sb.append('0');
        }
        sb.append(f);
    }

    public long rows() {
        return rows;
    }

    @Override
    public void close() {
        try {
            out.close();
        } catch (IOException e) {
            throw new PointcallException("cannot finish " + file + ": " + e.getMessage(), e);
        }
    }
}
