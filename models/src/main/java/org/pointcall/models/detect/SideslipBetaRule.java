package org.pointcall.models.detect;

import java.util.List;

import org.pointcall.shared.kind.ManoeuvreKind;

/**
 * {@code sideslip-beta}: a steady-heading sideslip reaches a few degrees of sideslip angle either way. Marks
 * {@code max-beta}.
 */
final class SideslipBetaRule extends GuardRule {
    private static final int MAX_BETA = 0;
    private static final int T_MAX = 0;

    private final double limit;

    SideslipBetaRule(ManoeuvreKind kind, GuardSettings g) {
        super(GuardRules.SIDESLIP_BETA, kind, 1, 1);
        this.limit = g.sideslipBetaRad();
    }

    @Override
    public String meaning() {
        return "a sideslip must reach |AoS| >= " + deg(limit) + " deg";
    }

    @Override
    protected void clear(double[] v, long[] t) {
        v[MAX_BETA] = Double.NaN;
    }

    @Override
    public void onState(PhysicalState s) {
        if (s.fresh(PhysicalQuantity.AOS)) {
            double b = Math.abs(s.aosRad());
            if (Double.isNaN(v[MAX_BETA]) || b > v[MAX_BETA]) {
                v[MAX_BETA] = b;
                t[T_MAX] = s.timeNs();
            }
        }
    }

    @Override
    protected RuleOutcome judge(double[] v, long[] t) {
        if (Double.isNaN(v[MAX_BETA])) {
            return RuleOutcome.NO_DATA;
        }
        return v[MAX_BETA] >= limit ? RuleOutcome.PASSED : RuleOutcome.FAILED;
    }

    @Override
    protected String describe(double[] v, long[] t) {
        return Double.isNaN(v[MAX_BETA]) ? "no sideslip angle"
                : "largest |AoS| " + deg(v[MAX_BETA]) + " deg (needs " + deg(limit) + ")";
    }

    @Override
    protected void instants(double[] v, long[] t, List<KeyInstant> out) {
        if (!Double.isNaN(v[MAX_BETA])) {
            out.add(new KeyInstant("max-beta", t[T_MAX]));
        }
    }
}
