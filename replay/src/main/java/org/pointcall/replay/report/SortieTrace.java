package org.pointcall.replay.report;

import java.util.Arrays;
import java.util.List;

import org.pointcall.ingest.frame.Frame;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.units.Unit;

/**
 * The parameters a report plots, kept over the whole sortie in primitive arrays, in the dictionary's units. Frames
 * closer together than {@link #stepNs()} are merged into one row (the first finite value of each parameter in the
 * step, at the step's first frame time), so a fast recording stays small while a parameter sampled on only some
 * frames (a file of mixed rates) keeps every step it was sampled in.
 *
 * <p>Fed on one thread, frame by frame, after the derived parameters were computed into the frame; no allocation
 * per frame beyond the arrays' growth.
 */
public final class SortieTrace {
    /** Default merge step: 100 rows per second are more than a figure's width can show for any point. */
    public static final double DEFAULT_STEP_S = 0.01;

    private final String[] names;
    private final Unit[] units;
    private final int[] slots;
    private final long stepNs;
    private final double[] pending;
    private long[] timeNs = new long[1024];
    private double[][] values;
    private int size;
    private boolean hasPending;
    private long pendingNs;

    /**
     * @param parameters the parameter names to keep (each must be in the dictionary)
     * @param stepS      frames closer than this are merged, s; 0 keeps every frame
     */
    public SortieTrace(ParameterDictionary dictionary, List<String> parameters, double stepS) {
        if (!(stepS >= 0) || !Double.isFinite(stepS)) {
            throw new IllegalArgumentException("trace step must be >= 0 s");
        }
        int n = parameters.size();
        names = parameters.toArray(new String[0]);
        units = new Unit[n];
        slots = new int[n];
        for (int i = 0; i < n; i++) {
            slots[i] = dictionary.indexOf(names[i]);
            if (slots[i] < 0) {
                throw new IllegalArgumentException("parameter " + names[i] + " is not in dictionary "
                        + dictionary.name());
            }
            units[i] = dictionary.parameter(slots[i]).unit();
        }
        stepNs = Math.round(stepS * 1e9);
        pending = new double[n];
        values = new double[n][timeNs.length];
    }

    /** One frame, its derived parameters already computed. */
    public void onFrame(Frame f) {
        long t = f.timeNs();
        if (hasPending && t - pendingNs >= stepNs) {
            flush();
        }
        if (!hasPending) {
            hasPending = true;
            pendingNs = t;
            Arrays.fill(pending, Double.NaN);
        }
        for (int i = 0; i < slots.length; i++) {
            double v = f.value(slots[i]);
            if (Double.isNaN(pending[i]) && Double.isFinite(v)) {
                pending[i] = v;
            }
        }
    }

    /** Ends the trace: the last step becomes a row. Further frames may still be added. */
    public void finish() {
        if (hasPending) {
            flush();
        }
    }

    private void flush() {
        if (size == timeNs.length) {
            int cap = size * 2;
            timeNs = Arrays.copyOf(timeNs, cap);
            for (int i = 0; i < values.length; i++) {
                values[i] = Arrays.copyOf(values[i], cap);
            }
        }
        timeNs[size] = pendingNs;
        for (int i = 0; i < slots.length; i++) {
            values[i][size] = pending[i];
        }
        size++;
        hasPending = false;
    }

    public long stepNs() {
        return stepNs;
    }

    /** Rows kept. */
    public int size() {
        return size;
    }

    public List<String> parameters() {
        return List.of(names);
    }

    /** Column of a parameter, or -1 when it is not traced. */
    public int column(String parameter) {
        for (int i = 0; i < names.length; i++) {
            if (names[i].equals(parameter)) {
                return i;
            }
        }
        return -1;
    }

    /** The dictionary's unit of a column (the unit of its values). */
    public Unit unit(int column) {
        return units[column];
    }

    public long timeNs(int row) {
        return timeNs[row];
    }

    /** A value in the dictionary's unit; NaN where the step had none. */
    public double value(int column, int row) {
        return values[column][row];
    }

    /** First row at or after {@code ns}; {@link #size()} when there is none. */
    public int firstAtOrAfter(long ns) {
        int lo = 0;
        int hi = size;
        while (lo < hi) {
            int mid = (lo + hi) >>> 1;
            if (timeNs[mid] < ns) {
                lo = mid + 1;
            } else {
                hi = mid;
            }
        }
        return lo;
    }
}
