package org.pointcall.models.modelfile;

import java.util.Objects;

import org.pointcall.shared.units.Unit;

/**
 * A parameter a model's features are computed from, by name and the unit its training data were in.
 *
 * @param name dictionary name (for example {@code AoA})
 * @param unit unit of the training data; a source may carry another unit of the same dimension
 */
public record RequiredParameter(String name, Unit unit) {
    public RequiredParameter {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(unit, "unit");
        if (name.isBlank()) {
            throw new IllegalArgumentException("a required parameter needs a name");
        }
    }

    @Override
    public String toString() {
        return name + " [" + unit.symbol() + "]";
    }
}
