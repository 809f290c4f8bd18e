package org.pointcall.ingest.file;

import java.util.Objects;

import org.pointcall.shared.units.Unit;

/**
 * A file column bound to a dictionary parameter.
 *
 * @param header         the header cell as written
 * @param position       1-based column of the header cell (character column for CSV, sheet column for XLSX)
 * @param parameter      the dictionary parameter's name
 * @param slot           its frame slot
 * @param fileUnit       the unit the file's values are in (the dictionary unit when the header gives none)
 * @param unitFromHeader true when the header declared the unit
 */
public record BoundColumn(String header, int position, String parameter, int slot, Unit fileUnit,
                          boolean unitFromHeader) {
    public BoundColumn {
        Objects.requireNonNull(header, "header");
        Objects.requireNonNull(parameter, "parameter");
        Objects.requireNonNull(fileUnit, "fileUnit");
        if (position < 1 || slot < 0) {
            throw new IllegalArgumentException("position must be >= 1 and slot >= 0");
        }
    }
}
