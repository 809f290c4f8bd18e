package org.pointcall.models.modelfile;

import org.pointcall.shared.units.Unit;

/**
 * A model's required parameter found in a source's dictionary.
 *
 * @param name       the parameter's name
 * @param slot       its slot in the dictionary's frames
 * @param modelUnit  the unit the model was trained in
 * @param sourceUnit the unit the source carries it in (same dimension)
 */
public record BoundParameter(String name, int slot, Unit modelUnit, Unit sourceUnit) {
    /**
     * True when the source's unit differs from the model's: the features of this parameter must be converted to
     * the model's unit before classification (levels such as mean, min and max as values, spreads and rates such as
     * standard deviation, slope and change as differences).
     */
    public boolean needsConversion() {
        return modelUnit != sourceUnit;
    }
}
