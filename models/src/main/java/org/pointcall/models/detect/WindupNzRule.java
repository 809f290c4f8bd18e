package org.pointcall.models.detect;

import java.util.List;

import org.pointcall.shared.kind.ManoeuvreKind;

/**
 * {@code windup-nz}: a wind-up turn raises the load factor well above 1 g. A load factor is already normalised by
 * weight, so one limit suits any airframe. Marks {@code nz-max}.
 */
final class WindupNzRule extends GuardRule {
    private static final int MAX_NZ = 0;
    private static final int T_MAX = 0;

    private final double limit;

    WindupNzRule(ManoeuvreKind kind, GuardSettings g) {
        super(GuardRules.WINDUP_NZ, kind, 1, 1);
        this.limit = g.windupNz();
    }

    @Override
    public String meaning() {
        return "a wind-up turn must reach Nz >= " + num(limit, 1) + " g";
    }

    @Override
    protected void clear(double[] v, long[] t) {
        v[MAX_NZ] = Double.NaN;
    }

    @Override
    public void onState(PhysicalState s) {
        if (s.fresh(PhysicalQuantity.NZ) && (Double.isNaN(v[MAX_NZ]) || s.nz() > v[MAX_NZ])) {
            v[MAX_NZ] = s.nz();
            t[T_MAX] = s.timeNs();
        }
    }

    @Override
    protected RuleOutcome judge(double[] v, long[] t) {
        if (Double.isNaN(v[MAX_NZ])) {
            return RuleOutcome.NO_DATA;
        }
        return v[MAX_NZ] >= limit ? RuleOutcome.PASSED : RuleOutcome.FAILED;
    }

    @Override
    protected String describe(double[] v, long[] t) {
        return Double.isNaN(v[MAX_NZ]) ? "no Nz"
                : "highest Nz " + num(v[MAX_NZ], 2) + " g (needs " + num(limit, 2) + ")";
    }

    @Override
    protected void instants(double[] v, long[] t, List<KeyInstant> out) {
        if (!Double.isNaN(v[MAX_NZ])) {
            out.add(new KeyInstant("nz-max", t[T_MAX]));
        }
    }
}
