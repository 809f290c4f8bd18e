package org.pointcall.ingest.udp;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.NoSuchElementException;

/**
 * Figures of one bench run, printed as {@code name: value unit} lines.
 *
 * @param run the run's name, first line of the printout
 */
public record BenchReport(String run, List<Figure> figures) {
    public BenchReport {
        figures = List.copyOf(figures);
    }

    /** One measured or counted figure. */
    public record Figure(String name, double value, String unit) {
        public String line() {
            String v = value == Math.rint(value) && Math.abs(value) < 1e15
                    ? Long.toString((long) value)
                    : String.format(Locale.ROOT, "%.2f", value);
            return unit.isEmpty() ? name + ": " + v : name + ": " + v + " " + unit;
        }
    }

    public double value(String name) {
        for (Figure f : figures) {
            if (f.name().equals(name)) {
                return f.value();
            }
        }
        throw new NoSuchElementException("no figure " + name + " in run " + run);
    }

    public List<String> lines() {
        List<String> out = new ArrayList<>(figures.size() + 1);
        out.add("run: " + run);
        for (Figure f : figures) {
            out.add(f.line());
        }
        return out;
    }
}
