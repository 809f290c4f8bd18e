package org.pointcall.models.detect;

import org.pointcall.shared.kind.ManoeuvreKind;
import org.pointcall.shared.units.Units;

/**
 * {@code stabilised-steady}: a stabilised point holds altitude and speed. The standard deviation of Hp over the
 * hold must stay within a limit and that of CAS within a fraction of its mean (a fraction, so that it scales with
 * the airframe's speeds); either check is skipped when its quantity is absent. Welford's running mean and variance,
 * exact enough at altitude-sized offsets. Only the whole hold can be judged, so it never confirms a point live.
 */
final class StabilisedSteadyRule extends GuardRule {
    private static final int N_H = 0;
    private static final int MEAN_H = 1;
    private static final int M2_H = 2;
    private static final int N_V = 3;
    private static final int MEAN_V = 4;
    private static final int M2_V = 5;

    private final double hpStd;
    private final double casCv;

    StabilisedSteadyRule(ManoeuvreKind kind, GuardSettings g) {
        super(GuardRules.STABILISED_STEADY, kind, 6, 0);
        this.hpStd = g.stabilisedHpStdM();
        this.casCv = g.stabilisedCasCv();
    }

    @Override
    public String meaning() {
        return "a stabilised point must hold Hp within a standard deviation of " + num(hpStd / Units.M_PER_FT, 0)
                + " ft and CAS within " + num(100 * casCv, 1) + " % of its mean";
    }

    @Override
    public boolean confirmsLive() {
        return false;
    }

    @Override
    protected void clear(double[] v, long[] t) {
        java.util.Arrays.fill(v, 0.0);
    }

    @Override
    public void onState(PhysicalState s) {
        if (s.fresh(PhysicalQuantity.HP)) {
            add(N_H, s.hpM());
        }
        if (s.fresh(PhysicalQuantity.CAS)) {
            add(N_V, s.casMps());
        }
    }

    private void add(int at, double x) {
        double n = ++v[at];
        double d = x - v[at + 1];
        v[at + 1] += d / n;
        v[at + 2] += d * (x - v[at + 1]);
    }

    private static double std(double[] v, int at) {
        return v[at] >= 2 ? Math.sqrt(v[at + 2] / (v[at] - 1)) : Double.NaN;
    }

    @Override
    protected RuleOutcome judge(double[] v, long[] t) {
        double h = std(v, N_H);
        double c = std(v, N_V);
        if (Double.isNaN(h) && Double.isNaN(c)) {
            return RuleOutcome.NO_DATA;
        }
        boolean hOk = Double.isNaN(h) || h <= hpStd;
        boolean cOk = Double.isNaN(c) || c <= casCv * Math.abs(v[MEAN_V]);
        return hOk && cOk ? RuleOutcome.PASSED : RuleOutcome.FAILED;
    }

    @Override
    protected String describe(double[] v, long[] t) {
        double h = std(v, N_H);
        double c = std(v, N_V);
        String hp = Double.isNaN(h) ? "no Hp" : "Hp standard deviation " + num(h / Units.M_PER_FT, 1) + " ft (at most "
                + num(hpStd / Units.M_PER_FT, 1) + ")";
        String cas = Double.isNaN(c) ? "no CAS" : "CAS standard deviation " + num(100 * c / Math.abs(v[MEAN_V]), 2)
                + " % of its mean (at most " + num(100 * casCv, 2) + ")";
        return hp + ", " + cas;
    }
}
