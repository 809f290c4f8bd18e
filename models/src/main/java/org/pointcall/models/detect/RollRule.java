package org.pointcall.models.detect;

import java.util.List;

import org.pointcall.shared.kind.ManoeuvreKind;

/**
 * {@code roll-360}: an aileron roll turns through a full circle of bank. The bank change is accumulated sample to
 * sample from the bank angle, each step taken the short way round so that the +-180 deg wrap costs nothing (this
 * assumes less than half a turn between samples, over 1,800 deg/s at 10 Hz); without a bank angle, the roll rate P
 * is integrated instead (trapezoids on sample times; P is a body rate, close to the bank rate near level pitch).
 * Marks {@code roll-end} where the accumulated change was largest.
 */
final class RollRule extends GuardRule {
    private static final int LAST_ROLL = 0;
    private static final int NET = 1;
    private static final int MAX_NET = 2;
    private static final int ROLL_SAMPLES = 3;
    private static final int LAST_P = 4;
    private static final int P_INT = 5;
    private static final int MAX_P_INT = 6;
    private static final int P_SAMPLES = 7;
    private static final int T_LAST_P = 0;
    private static final int T_MAX_NET = 1;
    private static final int T_MAX_P_INT = 2;

    private final double limit;

    RollRule(ManoeuvreKind kind, GuardSettings g) {
        super(GuardRules.ROLL_360, kind, 8, 3);
        this.limit = g.rollBankRad();
    }

    @Override
    public String meaning() {
        return "an aileron roll must accumulate at least " + deg(limit) + " deg of bank change (bank angle "
                + "unwrapped through +-180 deg, or roll rate integrated)";
    }

    @Override
    protected void clear(double[] v, long[] t) {
        v[LAST_ROLL] = Double.NaN;
        v[NET] = 0;
        v[MAX_NET] = 0;
        v[ROLL_SAMPLES] = 0;
        v[LAST_P] = Double.NaN;
        v[P_INT] = 0;
        v[MAX_P_INT] = 0;
        v[P_SAMPLES] = 0;
    }

    @Override
    public void onState(PhysicalState s) {
        if (s.fresh(PhysicalQuantity.ROLL)) {
            double r = s.rollRad();
            if (!Double.isNaN(v[LAST_ROLL])) {
                v[NET] += Math.IEEEremainder(r - v[LAST_ROLL], 2 * Math.PI);
                if (Math.abs(v[NET]) > v[MAX_NET]) {
                    v[MAX_NET] = Math.abs(v[NET]);
                    t[T_MAX_NET] = s.timeNs();
                }
            }
            v[LAST_ROLL] = r;
            v[ROLL_SAMPLES]++;
        }
        if (s.fresh(PhysicalQuantity.P)) {
            double p = s.pRadS();
            if (!Double.isNaN(v[LAST_P])) {
                v[P_INT] += 0.5 * (p + v[LAST_P]) * (s.timeNs() - t[T_LAST_P]) * 1e-9;
                if (Math.abs(v[P_INT]) > v[MAX_P_INT]) {
                    v[MAX_P_INT] = Math.abs(v[P_INT]);
                    t[T_MAX_P_INT] = s.timeNs();
                }
            }
            v[LAST_P] = p;
            t[T_LAST_P] = s.timeNs();
            v[P_SAMPLES]++;
        }
    }

    private static boolean fromBank(double[] v) {
        return v[ROLL_SAMPLES] >= 2;
    }

    @Override
    protected RuleOutcome judge(double[] v, long[] t) {
        if (fromBank(v)) {
            return v[MAX_NET] >= limit ? RuleOutcome.PASSED : RuleOutcome.FAILED;
        }
        if (v[P_SAMPLES] >= 2) {
            return v[MAX_P_INT] >= limit ? RuleOutcome.PASSED : RuleOutcome.FAILED;
        }
        return RuleOutcome.NO_DATA;
    }

    @Override
    protected String describe(double[] v, long[] t) {
        if (fromBank(v)) {
            return "bank changed " + deg(v[MAX_NET]) + " deg, from the bank angle (needs " + deg(limit) + ")";
        }
        if (v[P_SAMPLES] >= 2) {
            return "bank changed " + deg(v[MAX_P_INT]) + " deg, from the roll rate (needs " + deg(limit) + ")";
        }
        return "no bank angle or roll rate";
    }

    @Override
    protected void instants(double[] v, long[] t, List<KeyInstant> out) {
        long at = fromBank(v) ? t[T_MAX_NET] : t[T_MAX_P_INT];
        if (at != PointEvent.UNKNOWN_NS) {
            out.add(new KeyInstant("roll-end", at));
        }
    }

    /** Largest bank change accumulated so far (from the bank angle, else the roll rate), rad. */
    double bankChangeRad() {
        return fromBank(v) ? v[MAX_NET] : v[MAX_P_INT];
    }
}
