package org.pointcall.models.data;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;

import org.pointcall.ingest.file.ReadReport;

/**
 * What turning one recording into rows did, with exact counts: every decision tick is a kept row, an incomplete
 * one (a NaN feature, dropped) or an ambiguous one (within the boundary margin of a label, dropped).
 *
 * @param sortie            the sortie
 * @param read              what reading the recorded file did
 * @param ticks             decision ticks the feature extractor emitted
 * @param rows              rows kept
 * @param incomplete        ticks dropped for a NaN feature
 * @param nearBoundary      ticks dropped as ambiguous
 * @param rowsPerClass      kept rows per class name, classes with rows only
 * @param labelsWithoutRows labelled intervals no kept row fell in (outside the recording, or all dropped), each
 *                          described with its line; usually a label on the wrong file or in the wrong time
 */
public record SortieReport(SortieInfo sortie, ReadReport read, long ticks, int rows, long incomplete,
                           long nearBoundary, Map<String, Integer> rowsPerClass, List<String> labelsWithoutRows) {
    public SortieReport {
        rowsPerClass = Map.copyOf(rowsPerClass);
        labelsWithoutRows = List.copyOf(labelsWithoutRows);
    }

    /** The report in plain lines for a user. */
    public List<String> lines() {
        List<String> out = new ArrayList<>();
        out.add(sortie.name() + ": " + ticks + " decision ticks, " + rows + " rows kept, " + incomplete
                + " incomplete, " + nearBoundary + " near a label boundary");
        StringBuilder classes = new StringBuilder();
        for (String c : LabelledRows.CLASS_NAMES) {
            Integer k = rowsPerClass.get(c);
            if (k != null) {
                classes.append(classes.length() == 0 ? "" : ", ").append(c).append(' ').append(k);
            }
        }
        out.add("  rows per class: " + (classes.length() == 0 ? "none at all" : classes));
        for (String l : labelsWithoutRows) {
            out.add("  label with no row: " + l);
        }
        return out;
    }
}
