package org.pointcall.ingest.derive;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

import org.pointcall.ingest.frame.Frame;
import org.pointcall.shared.airdata.AirData;
import org.pointcall.shared.atmosphere.StandardAtmosphere;
import org.pointcall.shared.dictionary.Derivation;
import org.pointcall.shared.dictionary.DerivationMethod;
import org.pointcall.shared.dictionary.Parameter;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.error.PointcallException;
import org.pointcall.shared.units.Unit;
import org.pointcall.shared.units.Units;

/**
 * Computes a dictionary's derived parameters into each frame, with the shared air-data core, in dependency order.
 *
 * <p>A derived value is computed at the frames where its first input is sampled; the other inputs are the latest
 * samples no older than {@link #holdIntervals} of their nominal sample interval (mixed rates). When any input is
 * missing, stale or invalid (NaN) the derived value is NaN: invalid in, invalid out. Rates are least-squares slopes
 * over the last {@link #rateSpanS} seconds. Everything is bound once; {@link #apply} allocates nothing.
 */
public final class DerivedParameters {
    /** Default span of the least-squares rate estimates, s (common practice: about a second smooths 20-50 Hz noise). */
    public static final double DEFAULT_RATE_SPAN_S = 1.0;
    /** An input sample is fresh for this many of its nominal intervals. */
    public static final double DEFAULT_HOLD_INTERVALS = 2.5;

    private final Derived[] derived;
    private final long[] lastNs;
    private final double[] lastSi;
    private final long[] holdNs;
    private final Unit[] units;
    private final double rateSpanS;
    private final double holdIntervals;

    private static final class Derived {
        final DerivationMethod method;
        final int out;
        final int[] in;
        RunningSlope slopeA;
        RunningSlope slopeB;

        Derived(DerivationMethod method, int out, int[] in) {
            this.method = method;
            this.out = out;
            this.in = in;
        }
    }

    private DerivedParameters(ParameterDictionary dict, double rateSpanS, double holdIntervals) {
        this.rateSpanS = rateSpanS;
        this.holdIntervals = holdIntervals;
        int n = dict.size();
        this.lastNs = new long[n];
        this.lastSi = new double[n];
        this.holdNs = new long[n];
        this.units = new Unit[n];
        for (int i = 0; i < n; i++) {
            Parameter p = dict.parameter(i);
            units[i] = p.unit();
            holdNs[i] = Math.round(holdIntervals / p.rateHz() * Units.NS_PER_S);
            lastNs[i] = Long.MIN_VALUE;
            lastSi[i] = Double.NaN;
        }
        this.derived = order(dict);
    }

    /** Binds to {@code dict} with the default rate span and hold. */
    public static DerivedParameters bind(ParameterDictionary dict) {
        return bind(dict, DEFAULT_RATE_SPAN_S, DEFAULT_HOLD_INTERVALS);
    }

    public static DerivedParameters bind(ParameterDictionary dict, double rateSpanS, double holdIntervals) {
        if (!(rateSpanS > 0) || !(holdIntervals > 0)) {
            throw new IllegalArgumentException("rate span and hold must be positive");
        }
        return new DerivedParameters(dict, rateSpanS, holdIntervals);
    }

    public double rateSpanS() {
        return rateSpanS;
    }

    public double holdIntervals() {
        return holdIntervals;
    }

    /** Number of derived parameters computed. */
    public int count() {
        return derived.length;
    }

    private Derived[] order(ParameterDictionary dict) {
        Map<Integer, Derived> bySlot = new HashMap<>();
        for (int i = 0; i < dict.size(); i++) {
            Derivation d = dict.parameter(i).derivation();
            if (d == null) {
                continue;
            }
            int[] in = new int[d.inputs().size()];
            for (int k = 0; k < in.length; k++) {
                in[k] = dict.indexOf(d.inputs().get(k));
                if (in[k] < 0) {
                    throw new PointcallException("derived parameter " + dict.parameter(i).name() + " needs '"
                            + d.inputs().get(k) + "', which is not in dictionary " + dict.name());
                }
            }
            Derived x = new Derived(d.method(), i, in);
            int capacity = 4096;
            if (d.method() == DerivationMethod.RATE) {
                x.slopeA = new RunningSlope(rateSpanS, capacity, 3);
            } else if (d.method() == DerivationMethod.SPECIFIC_EXCESS_POWER) {
                x.slopeA = new RunningSlope(rateSpanS, capacity, 3);
                x.slopeB = new RunningSlope(rateSpanS, capacity, 3);
            }
            bySlot.put(i, x);
        }
        List<Derived> sorted = new ArrayList<>();
        Map<Integer, Integer> state = new HashMap<>(); // 1 visiting, 2 done
        for (Integer slot : bySlot.keySet().stream().sorted().toList()) {
            visit(slot, bySlot, state, sorted, dict);
        }
        return sorted.toArray(new Derived[0]);
    }

    private static void visit(int slot, Map<Integer, Derived> bySlot, Map<Integer, Integer> state, List<Derived> out,
                              ParameterDictionary dict) {
        Derived d = bySlot.get(slot);
        if (d == null || state.getOrDefault(slot, 0) == 2) {
            return;
        }
        if (state.getOrDefault(slot, 0) == 1) {
            throw new PointcallException("derived parameters of dictionary " + dict.name() + " form a cycle through "
                    + dict.parameter(slot).name());
        }
        state.put(slot, 1);
        for (int in : d.in) {
            visit(in, bySlot, state, out, dict);
        }
        state.put(slot, 2);
        out.add(d);
    }

    /** Forgets held samples and rate history, as after a stream restart or a seek. */
    public void reset() {
        java.util.Arrays.fill(lastNs, Long.MIN_VALUE);
        java.util.Arrays.fill(lastSi, Double.NaN);
        for (Derived d : derived) {
            if (d.slopeA != null) {
                d.slopeA.reset();
            }
            if (d.slopeB != null) {
                d.slopeB.reset();
            }
        }
    }

    /** Computes every derived slot of {@code f} that its inputs allow. */
    public void apply(Frame f) {
        if (f.hasFlag(Frame.GAP_BEFORE)) {
            reset();
        }
        long t = f.timeNs();
        for (Derived d : derived) {
            for (int in : d.in) {
                remember(f, in, t);
            }
            int primary = d.in[0];
            if (Double.isNaN(f.value(primary))) {
                continue;
            }
            double si = compute(d, t);
            remember(f, d.out, t, si);
            f.value(d.out, Double.isNaN(si) ? Double.NaN : units[d.out].fromSi(si));
        }
    }

    private void remember(Frame f, int slot, long t) {
        double v = f.value(slot);
        if (!Double.isNaN(v) && lastNs[slot] != t) {
            lastNs[slot] = t;
            lastSi[slot] = units[slot].toSi(v);
        }
    }

    private void remember(Frame f, int slot, long t, double si) {
        lastNs[slot] = t;
        lastSi[slot] = si;
    }

    /** The latest SI value of {@code slot} if fresh at {@code t}, else NaN. */
    private double fresh(int slot, long t) {
        long age = t - lastNs[slot];
        return lastNs[slot] != Long.MIN_VALUE && age >= 0 && age <= holdNs[slot] ? lastSi[slot] : Double.NaN;
    }

    private double compute(Derived d, long t) {
        switch (d.method) {
            case PRESSURE_ALTITUDE: {
                double p = fresh(d.in[0], t);
                return p >= StandardAtmosphere.MIN_PRESSURE_PA && p <= StandardAtmosphere.MAX_PRESSURE_PA
                        ? StandardAtmosphere.pressureAltitudeM(p) : Double.NaN;
            }
            case CALIBRATED_AIRSPEED: {
                double qc = fresh(d.in[0], t);
                return qc == qc ? AirData.casFromImpactPressure(Math.max(qc, 0.0)) : Double.NaN;
            }
            case MACH: {
                double qc = fresh(d.in[0], t);
                double p = fresh(d.in[1], t);
                return qc == qc && p > 0 ? AirData.machFromImpactPressure(Math.max(qc, 0.0), p) : Double.NaN;
            }
            case TRUE_AIRSPEED: {
                double m = fresh(d.in[0], t);
                double tk = fresh(d.in[1], t);
                return m >= 0 && tk > 0 ? AirData.trueAirspeedMps(m, tk) : Double.NaN;
            }
            case RATE: {
                d.slopeA.add(t, fresh(d.in[0], t));
                return d.slopeA.slopePerS();
            }
            case SPECIFIC_EXCESS_POWER: {
                double h = fresh(d.in[0], t);
                double v = fresh(d.in[1], t);
                d.slopeA.add(t, h);
                d.slopeB.add(t, v);
                // Ps = dh/dt + (V/g) dV/dt (energy method, e.g. USNTPS FTM-108 ch. 5)
                return d.slopeA.slopePerS() + v / Units.G0_MPS2 * d.slopeB.slopePerS();
            }
            default:
                return Double.NaN;
        }
    }
}
