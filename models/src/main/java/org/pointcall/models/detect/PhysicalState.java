package org.pointcall.models.detect;

import java.util.Arrays;

/**
 * The latest value of each {@link PhysicalQuantity}, in SI, with the data time it was sampled. A value stays until
 * a newer sample replaces it (parameters slower than the frame rate hold their last value); a quantity never sampled
 * reads NaN. {@link #fresh} tells whether a quantity was sampled at the current instant, so rules that integrate or
 * count samples see each sample once.
 *
 * <p>Mutable and reused: a {@link StateBinder} fills it from every frame. Single-threaded.
 */
public final class PhysicalState {
    private final double[] values = new double[PhysicalQuantity.COUNT];
    private final long[] sampledNs = new long[PhysicalQuantity.COUNT];
    private long timeNs = PointEvent.UNKNOWN_NS;

    public PhysicalState() {
        clear();
    }

    /** Forgets every value. */
    public void clear() {
        Arrays.fill(values, Double.NaN);
        Arrays.fill(sampledNs, PointEvent.UNKNOWN_NS);
        timeNs = PointEvent.UNKNOWN_NS;
    }

    /** Moves to a new instant; values carry over until set again. */
    public void advance(long nowNs) {
        this.timeNs = nowNs;
    }

    /** Sets a quantity sampled at the current instant, in SI. */
    public void set(PhysicalQuantity q, double valueSi) {
        values[q.ordinal()] = valueSi;
        sampledNs[q.ordinal()] = timeNs;
    }

    /** Data time of the current instant, {@link PointEvent#UNKNOWN_NS} before the first. */
    public long timeNs() {
        return timeNs;
    }

    /** Latest value in SI, NaN when never sampled. */
    public double value(PhysicalQuantity q) {
        return values[q.ordinal()];
    }

    /** True when the quantity was sampled at the current instant. */
    public boolean fresh(PhysicalQuantity q) {
        return timeNs != PointEvent.UNKNOWN_NS && sampledNs[q.ordinal()] == timeNs;
    }

    /** Data time of the latest sample, {@link PointEvent#UNKNOWN_NS} when never sampled. */
    public long sampledNs(PhysicalQuantity q) {
        return sampledNs[q.ordinal()];
    }

    /** Copies every value and sample time into {@code v} and {@code s} from {@code offset}. */
    void copyTo(double[] v, long[] s, int offset) {
        System.arraycopy(values, 0, v, offset, values.length);
        System.arraycopy(sampledNs, 0, s, offset, sampledNs.length);
    }

    /** Becomes the state {@link #copyTo} saved, at instant {@code nowNs}. */
    void loadFrom(long nowNs, double[] v, long[] s, int offset) {
        timeNs = nowNs;
        System.arraycopy(v, offset, values, 0, values.length);
        System.arraycopy(s, offset, sampledNs, 0, sampledNs.length);
    }

    public double aoaRad() {
        return values[PhysicalQuantity.AOA.ordinal()];
    }

    public double aosRad() {
        return values[PhysicalQuantity.AOS.ordinal()];
    }

    public double pitchRad() {
        return values[PhysicalQuantity.PITCH.ordinal()];
    }

    public double rollRad() {
        return values[PhysicalQuantity.ROLL.ordinal()];
    }

    public double headingRad() {
        return values[PhysicalQuantity.HEADING.ordinal()];
    }

    public double pRadS() {
        return values[PhysicalQuantity.P.ordinal()];
    }

    public double qRadS() {
        return values[PhysicalQuantity.Q.ordinal()];
    }

    public double nz() {
        return values[PhysicalQuantity.NZ.ordinal()];
    }

    public double casMps() {
        return values[PhysicalQuantity.CAS.ordinal()];
    }

    public double mach() {
        return values[PhysicalQuantity.MACH.ordinal()];
    }

    public double hpM() {
        return values[PhysicalQuantity.HP.ordinal()];
    }
}
