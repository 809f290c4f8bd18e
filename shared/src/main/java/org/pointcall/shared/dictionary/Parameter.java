package org.pointcall.shared.dictionary;

import java.util.Objects;
import java.util.regex.Pattern;

import org.pointcall.shared.units.Unit;

/**
 * One measured or derived parameter of a stream. Its position in the {@link ParameterDictionary} is its frame slot.
 *
 * @param name        short trade name, unique in the dictionary (for example {@code KCAS}, {@code AoA}, {@code Nz})
 * @param unit        the unit values are carried in, after calibration
 * @param description plain words for the screen and reports
 * @param rateHz      nominal sample rate
 * @param validMin    lowest physically plausible value (in {@code unit}); below it a sample is a wild point
 * @param validMax    highest plausible value (in {@code unit})
 * @param column      column name in a recorded file (CSV/XLSX header); defaults to the name
 * @param calibration raw-to-engineering conversion applied at the source
 * @param derivation  how it is computed from other parameters, or {@code null} for a measured one
 */
public record Parameter(String name, Unit unit, String description, double rateHz, double validMin, double validMax,
                        String column, Calibration calibration, Derivation derivation) {

    private static final Pattern NAME = Pattern.compile("[A-Za-z][A-Za-z0-9_.]*");

    public Parameter {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(unit, "unit");
        if (!NAME.matcher(name).matches()) {
            throw new IllegalArgumentException("parameter name '" + name
                    + "' must start with a letter and hold only letters, digits, '_' and '.'");
        }
        if (!(rateHz > 0) || Double.isInfinite(rateHz)) {
            throw new IllegalArgumentException("rate of " + name + " must be a positive number of Hz, got " + rateHz);
        }
        if (!(validMax > validMin)) {
            throw new IllegalArgumentException("valid range of " + name + " must have max > min, got [" + validMin
                    + ", " + validMax + "]");
        }
        description = description == null ? "" : description;
        column = column == null || column.isBlank() ? name : column;
        calibration = calibration == null ? Calibration.IDENTITY : calibration;
    }

    public boolean isDerived() {
        return derivation != null;
    }

    /** True when {@code value} is a number inside the valid range. */
    public boolean isPlausible(double value) {
        return value >= validMin && value <= validMax;
    }
}
