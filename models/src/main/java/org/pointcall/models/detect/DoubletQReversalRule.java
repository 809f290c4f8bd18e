package org.pointcall.models.detect;

import java.util.List;

import org.pointcall.shared.kind.ManoeuvreKind;

/**
 * {@code doublet-q-reversal}: a pitch doublet drives the pitch rate one way, then the other. Pitch-rate samples
 * beyond a noise floor are grouped into lobes of one sign; a lobe counts when its peak is at least a fraction of the
 * largest lobe's, and the sign changes between counted lobes are the reversals. Relative to the largest lobe, so it
 * holds for any airframe's rates. Keeps the latest {@value #CAP} lobes. Marks {@code input} at the start of the
 * first counted lobe.
 */
final class DoubletQReversalRule extends GuardRule {
    static final int CAP = 16;
    /** Look-back before the candidate's start, s. */
    static final double LEAD_S = 4.0;
    private static final int MAX_Q = 0;
    private static final int LOBES = 1;
    private static final int FIRST = 2;

    private final double floor;
    private final double fraction;
    private final int needed;

    DoubletQReversalRule(ManoeuvreKind kind, GuardSettings g) {
        super(GuardRules.DOUBLET_Q_REVERSAL, kind, FIRST + 2 * CAP, CAP);
        this.floor = g.doubletQFloorRadS();
        this.fraction = g.doubletLobeFraction();
        this.needed = g.doubletReversals();
    }

    /**
     * The input's first lobe, and with it the first reversal, often lies before the classifier's probability rises
     * (it sees the response more than the input); a doublet input lasts at most a few seconds.
     */
    @Override
    public double leadS() {
        return LEAD_S;
    }

    @Override
    public String meaning() {
        return "a pitch doublet must reverse its pitch rate at least " + needed + " times between lobes of at least "
                + num(100 * fraction, 0) + " % of the largest (|Q| beyond " + deg(floor) + " deg/s)";
    }

    @Override
    protected void clear(double[] v, long[] t) {
        java.util.Arrays.fill(v, 0.0);
        v[MAX_Q] = Double.NaN;
    }

    @Override
    public void onState(PhysicalState s) {
        if (!s.fresh(PhysicalQuantity.Q)) {
            return;
        }
        double q = s.qRadS();
        double aq = Math.abs(q);
        v[MAX_Q] = max(v[MAX_Q], aq);
        if (aq <= floor) {
            return;
        }
        double sign = q > 0 ? 1 : -1;
        int n = (int) v[LOBES];
        if (n > 0 && v[FIRST + 2 * (n - 1)] == sign) {
            int peak = FIRST + 2 * (n - 1) + 1;
            v[peak] = Math.max(v[peak], aq);
            return;
        }
        if (n == CAP) {
            System.arraycopy(v, FIRST + 2, v, FIRST, 2 * (CAP - 1));
            System.arraycopy(t, 1, t, 0, CAP - 1);
            n--;
        }
        v[FIRST + 2 * n] = sign;
        v[FIRST + 2 * n + 1] = aq;
        t[n] = s.timeNs();
        v[LOBES] = n + 1;
    }

    private int reversals(double[] v) {
        int n = (int) v[LOBES];
        double largest = 0;
        for (int i = 0; i < n; i++) {
            largest = Math.max(largest, v[FIRST + 2 * i + 1]);
        }
        int count = 0;
        double last = 0;
        for (int i = 0; i < n; i++) {
            if (v[FIRST + 2 * i + 1] >= fraction * largest) {
                double sign = v[FIRST + 2 * i];
                if (last != 0 && sign != last) {
                    count++;
                }
                last = sign;
            }
        }
        return count;
    }

    @Override
    protected RuleOutcome judge(double[] v, long[] t) {
        if (Double.isNaN(v[MAX_Q])) {
            return RuleOutcome.NO_DATA;
        }
        return reversals(v) >= needed ? RuleOutcome.PASSED : RuleOutcome.FAILED;
    }

    @Override
    protected String describe(double[] v, long[] t) {
        if (Double.isNaN(v[MAX_Q])) {
            return "no pitch rate";
        }
        return "pitch rate reversed " + reversals(v) + " times (needs " + needed + "), largest |Q| "
                + deg(v[MAX_Q]) + " deg/s";
    }

    /** The start of the first counted lobe: where the input began. */
    @Override
    protected long onset(double[] v, long[] t) {
        int n = (int) v[LOBES];
        double largest = 0;
        for (int i = 0; i < n; i++) {
            largest = Math.max(largest, v[FIRST + 2 * i + 1]);
        }
        for (int i = 0; i < n; i++) {
            if (v[FIRST + 2 * i + 1] >= fraction * largest) {
                return t[i];
            }
        }
        return PointEvent.UNKNOWN_NS;
    }

    @Override
    protected void instants(double[] v, long[] t, List<KeyInstant> out) {
        int n = (int) v[LOBES];
        double largest = 0;
        for (int i = 0; i < n; i++) {
            largest = Math.max(largest, v[FIRST + 2 * i + 1]);
        }
        for (int i = 0; i < n; i++) {
            if (v[FIRST + 2 * i + 1] >= fraction * largest) {
                out.add(new KeyInstant("input", t[i]));
                return;
            }
        }
    }
}
