package org.pointcall.ingest.file;

import org.pointcall.shared.dictionary.Calibration;
import org.pointcall.shared.dictionary.Parameter;
import org.pointcall.shared.units.Unit;

/**
 * The header binding resolved to arrays once, for the row loop: bound column k reads header column
 * {@code column[k]} into frame slot {@code slot[k]}.
 */
final class ColumnPlan {
    final HeaderBinding binding;
    /** Number of header cells. */
    final int width;
    final int timeColumn;
    final long timeNsPerUnit;
    final int[] column;
    final int[] slot;
    final String[] header;
    final Parameter[] parameter;
    /** Calibration to apply, or {@code null} for none. */
    final Calibration[] calibration;
    /** Unit to convert from, or {@code null} when the file is in the dictionary unit. */
    final Unit[] fromUnit;

    ColumnPlan(HeaderBinding binding, int width, int timeColumn, long timeNsPerUnit, int[] column, int[] slot,
               String[] header, Parameter[] parameter, Calibration[] calibration, Unit[] fromUnit) {
        this.binding = binding;
        this.width = width;
        this.timeColumn = timeColumn;
        this.timeNsPerUnit = timeNsPerUnit;
        this.column = column;
        this.slot = slot;
        this.header = header;
        this.parameter = parameter;
        this.calibration = calibration;
        this.fromUnit = fromUnit;
    }

    int bound() {
        return column.length;
    }
}
