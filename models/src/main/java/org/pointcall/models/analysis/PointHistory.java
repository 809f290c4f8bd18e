package org.pointcall.models.analysis;

import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

import org.pointcall.ingest.frame.Frame;
import org.pointcall.shared.dictionary.Parameter;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.PointcallException;
import org.pointcall.shared.units.Unit;

/**
 * The time history of a stretch of a stream, column by column: one time per sample and, per kept parameter, its
 * value converted to SI (NaN where the frame had none). Analysers read it after a point has ended; the live side
 * appends one frame at a time and trims what it no longer needs.
 *
 * <p>Columns are addressed by dictionary name, resolved once when the history is made. Appending does not allocate
 * except when the arrays grow (doubling).
 */
public final class PointHistory {
    private final String[] names;
    private final int[] slots;
    private final Unit[] units;
    private final Map<String, Integer> columnOf = new LinkedHashMap<>();
    private long[] timesNs;
    private double[][] columns;
    private int size;

    private PointHistory(ParameterDictionary dictionary, List<String> keep, int initialCapacity) {
        Objects.requireNonNull(dictionary, "dictionary");
        int n = 0;
        String[] ns = new String[keep.size()];
        int[] ss = new int[keep.size()];
        Unit[] us = new Unit[keep.size()];
        for (String name : keep) {
            int slot = dictionary.indexOf(name);
            if (slot < 0 || columnOf.containsKey(name)) {
                continue;
            }
            Parameter p = dictionary.parameter(slot);
            ns[n] = name;
            ss[n] = slot;
            us[n] = p.unit();
            columnOf.put(name, n);
            n++;
        }
        names = Arrays.copyOf(ns, n);
        slots = Arrays.copyOf(ss, n);
        units = Arrays.copyOf(us, n);
        int cap = Math.max(16, initialCapacity);
        timesNs = new long[cap];
        columns = new double[n][cap];
    }

    /** A history of the named parameters that the dictionary holds; names it lacks are left out (see {@link #has}). */
    public static PointHistory of(ParameterDictionary dictionary, List<String> names, int initialCapacity) {
        return new PointHistory(dictionary, List.copyOf(names), initialCapacity);
    }

    /** A history of every parameter of the dictionary. */
    public static PointHistory ofAll(ParameterDictionary dictionary, int initialCapacity) {
        return of(dictionary, dictionary.parameters().stream().map(Parameter::name).toList(), initialCapacity);
    }

    /** Appends the frame's time and its kept values in SI. Frames must come in time order. */
    public void append(Frame frame) {
        if (size > 0 && frame.timeNs() < timesNs[size - 1]) {
            return; // a suspect, backwards time is not analysed; the stream's fault log has already counted it
        }
        if (size == timesNs.length) {
            int cap = size * 2;
            timesNs = Arrays.copyOf(timesNs, cap);
            for (int c = 0; c < columns.length; c++) {
                columns[c] = Arrays.copyOf(columns[c], cap);
            }
        }
        timesNs[size] = frame.timeNs();
        for (int c = 0; c < slots.length; c++) {
            double v = frame.value(slots[c]);
            columns[c][size] = Double.isFinite(v) ? units[c].toSi(v) : Double.NaN;
        }
        size++;
    }

    /** Drops every sample before {@code timeNs}, keeping the arrays. */
    public void trimBefore(long timeNs) {
        int first = firstAtOrAfter(timeNs);
        if (first == 0) {
            return;
        }
        int left = size - first;
        System.arraycopy(timesNs, first, timesNs, 0, left);
        for (double[] col : columns) {
            System.arraycopy(col, first, col, 0, left);
        }
        size = left;
    }

    /** Empties the history. */
    public void clear() {
        size = 0;
    }

    /** Index of the first sample at or after {@code timeNs} ({@link #size()} when there is none). */
    public int firstAtOrAfter(long timeNs) {
        int i = Arrays.binarySearch(timesNs, 0, size, timeNs);
        if (i < 0) {
            return -i - 1;
        }
        while (i > 0 && timesNs[i - 1] == timeNs) {
            i--;
        }
        return i;
    }

    /** A copy holding only the samples from {@code fromNs} to {@code toNs} inclusive. */
    public PointHistory slice(long fromNs, long toNs) {
        int a = firstAtOrAfter(fromNs);
        int b = firstAtOrAfter(toNs);
        while (b < size && timesNs[b] == toNs) {
            b++;
        }
        PointHistory s = new PointHistory(this, a, Math.max(a, b));
        return s;
    }

    private PointHistory(PointHistory from, int a, int b) {
        names = from.names;
        slots = from.slots;
        units = from.units;
        columnOf.putAll(from.columnOf);
        size = b - a;
        timesNs = Arrays.copyOfRange(from.timesNs, a, Math.max(b, a + 16));
        columns = new double[from.columns.length][];
        for (int c = 0; c < columns.length; c++) {
            columns[c] = Arrays.copyOfRange(from.columns[c], a, Math.max(b, a + 16));
        }
    }

    public int size() {
        return size;
    }

    public boolean isEmpty() {
        return size == 0;
    }

    public long timeNs(int i) {
        Objects.checkIndex(i, size);
        return timesNs[i];
    }

    /** Sample times in seconds relative to {@code originNs}, a new array. */
    public double[] timesS(long originNs) {
        double[] t = new double[size];
        for (int i = 0; i < size; i++) {
            t[i] = (timesNs[i] - originNs) * 1e-9;
        }
        return t;
    }

    public long firstNs() {
        if (size == 0) {
            throw new IllegalStateException("empty history");
        }
        return timesNs[0];
    }

    public long lastNs() {
        if (size == 0) {
            throw new IllegalStateException("empty history");
        }
        return timesNs[size - 1];
    }

    /** True when the dictionary supplied the parameter. */
    public boolean has(String name) {
        return columnOf.containsKey(name);
    }

    /** Kept parameter names, in the order asked for. */
    public List<String> names() {
        return List.of(names);
    }

    /** The dictionary unit of a kept parameter (values here are in SI whatever it is). */
    public Unit unit(String name) {
        return units[column(name)];
    }

    /** Value of {@code name} at sample {@code i}, SI, NaN when absent. */
    public double valueSi(String name, int i) {
        Objects.checkIndex(i, size);
        return columns[column(name)][i];
    }

    /** The column of {@code name} in SI, a new array of {@link #size()} values. */
    public double[] valuesSi(String name) {
        return Arrays.copyOf(columns[column(name)], size);
    }

    private int column(String name) {
        Integer c = columnOf.get(name);
        if (c == null) {
            throw new PointcallException("parameter '" + name + "' is not in this history; it holds " + columnOf.keySet());
        }
        return c;
    }
}
