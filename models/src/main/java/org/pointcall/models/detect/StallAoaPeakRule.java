package org.pointcall.models.detect;

import java.util.List;

import org.pointcall.shared.kind.ManoeuvreKind;

/**
 * {@code stall-aoa-peak}: a stall shows an AoA peak with a lift break. The AoA must rise from its lowest value
 * before the peak by at least a noise floor, and after the peak either AoA falls back by a fraction of that rise or
 * Nz drops below its value at the peak. Shapes only, no stall AoA: the same rule holds for any airframe. Marks
 * {@code break} at the AoA maximum.
 */
final class StallAoaPeakRule extends GuardRule {
    private static final int MIN_SO_FAR = 0;
    private static final int MIN_BEFORE = 1;
    private static final int MAX = 2;
    private static final int MIN_AFTER = 3;
    private static final int NZ_AT_MAX = 4;
    private static final int NZ_MIN_AFTER = 5;
    private static final int T_MAX = 0;

    private final double minRise;
    private final double fallFraction;
    private final double nzDrop;

    StallAoaPeakRule(ManoeuvreKind kind, GuardSettings g) {
        super(GuardRules.STALL_AOA_PEAK, kind, 6, 1);
        this.minRise = g.stallAoaRiseRad();
        this.fallFraction = g.stallAoaFallFraction();
        this.nzDrop = g.stallNzDrop();
    }

    @Override
    public String meaning() {
        return "a stall must show an AoA peak (a rise of at least " + deg(minRise) + " deg) followed by a lift "
                + "break: AoA falling by " + num(100 * fallFraction, 0) + " % of the rise, or Nz dropping "
                + num(nzDrop, 2) + " g";
    }

    @Override
    protected void clear(double[] v, long[] t) {
        java.util.Arrays.fill(v, Double.NaN);
    }

    @Override
    public void onState(PhysicalState s) {
        if (s.fresh(PhysicalQuantity.AOA)) {
            double a = s.aoaRad();
            v[MIN_SO_FAR] = min(v[MIN_SO_FAR], a);
            if (Double.isNaN(v[MAX]) || a > v[MAX]) {
                v[MAX] = a;
                t[T_MAX] = s.timeNs();
                v[MIN_BEFORE] = v[MIN_SO_FAR];
                v[MIN_AFTER] = a;
                v[NZ_AT_MAX] = s.nz();
                v[NZ_MIN_AFTER] = s.nz();
            } else {
                v[MIN_AFTER] = Math.min(v[MIN_AFTER], a);
            }
        }
        if (s.fresh(PhysicalQuantity.NZ) && !Double.isNaN(v[MAX])) {
            if (Double.isNaN(v[NZ_AT_MAX])) {
                v[NZ_AT_MAX] = s.nz();
            }
            v[NZ_MIN_AFTER] = min(v[NZ_MIN_AFTER], s.nz());
        }
    }

    @Override
    protected RuleOutcome judge(double[] v, long[] t) {
        if (Double.isNaN(v[MAX])) {
            return RuleOutcome.NO_DATA;
        }
        double rise = v[MAX] - v[MIN_BEFORE];
        if (!(rise >= minRise)) {
            return RuleOutcome.FAILED;
        }
        boolean aoaFell = v[MAX] - v[MIN_AFTER] >= fallFraction * rise;
        boolean nzDropped = v[NZ_AT_MAX] - v[NZ_MIN_AFTER] >= nzDrop;
        return aoaFell || nzDropped ? RuleOutcome.PASSED : RuleOutcome.FAILED;
    }

    @Override
    protected String describe(double[] v, long[] t) {
        if (Double.isNaN(v[MAX])) {
            return "no AoA";
        }
        double rise = v[MAX] - v[MIN_BEFORE];
        String nz = Double.isNaN(v[NZ_AT_MAX]) ? "no Nz"
                : "Nz dropped " + num(v[NZ_AT_MAX] - v[NZ_MIN_AFTER], 2) + " g (or " + num(nzDrop, 2) + ")";
        return "AoA rose " + deg(rise) + " deg to its peak (needs " + deg(minRise) + "), then fell "
                + deg(v[MAX] - v[MIN_AFTER]) + " deg (needs " + deg(fallFraction * Math.max(rise, 0)) + "); " + nz;
    }

    @Override
    protected void instants(double[] v, long[] t, List<KeyInstant> out) {
        if (!Double.isNaN(v[MAX])) {
            out.add(new KeyInstant("break", t[T_MAX]));
        }
    }
}
