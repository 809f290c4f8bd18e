package org.pointcall.models.detect;

import java.util.List;

import org.pointcall.shared.kind.ManoeuvreKind;

/**
 * {@code loop-pitch-90}: a loop passes through the vertical. Passed once |pitch| reaches the limit, or once the
 * aircraft is inverted (|bank| past the inverted limit) after |pitch| had passed half the limit: sampled Euler
 * angles may step over the vertical, where pitch peaks just short of 90 deg and bank flips to 180 deg. Marks
 * {@code apex} (inverted, |pitch| smallest) and {@code max-nz}.
 */
final class LoopPitchRule extends GuardRule {
    private static final int MAX_PITCH = 0;
    private static final int HALF = 1;
    private static final int INVERTED = 2;
    private static final int APEX_PITCH = 3;
    private static final int MAX_NZ = 4;
    private static final int T_MAX_PITCH = 0;
    private static final int T_APEX = 1;
    private static final int T_MAX_NZ = 2;

    private final double pitchLimit;
    private final double invertedRoll;

    LoopPitchRule(ManoeuvreKind kind, GuardSettings g) {
        super(GuardRules.LOOP_PITCH_90, kind, 5, 3);
        this.pitchLimit = g.loopPitchRad();
        this.invertedRoll = g.loopInvertedRollRad();
    }

    @Override
    public String meaning() {
        return "a loop must pass |pitch| >= " + deg(pitchLimit) + " deg, or be inverted (|bank| >= "
                + deg(invertedRoll) + " deg) after pitching past half of that";
    }

    @Override
    protected void clear(double[] v, long[] t) {
        v[MAX_PITCH] = Double.NaN;
        v[HALF] = 0;
        v[INVERTED] = 0;
        v[APEX_PITCH] = Double.NaN;
        v[MAX_NZ] = Double.NaN;
    }

    @Override
    public void onState(PhysicalState s) {
        if (s.fresh(PhysicalQuantity.PITCH)) {
            double ap = Math.abs(s.pitchRad());
            if (Double.isNaN(v[MAX_PITCH]) || ap > v[MAX_PITCH]) {
                v[MAX_PITCH] = ap;
                t[T_MAX_PITCH] = s.timeNs();
            }
            if (ap >= 0.5 * pitchLimit) {
                v[HALF] = 1;
            }
            double roll = s.rollRad();
            if (v[HALF] == 1 && Math.abs(roll) >= invertedRoll) {
                v[INVERTED] = 1;
                if (Double.isNaN(v[APEX_PITCH]) || ap < v[APEX_PITCH]) {
                    v[APEX_PITCH] = ap;
                    t[T_APEX] = s.timeNs();
                }
            }
        }
        if (s.fresh(PhysicalQuantity.NZ) && (Double.isNaN(v[MAX_NZ]) || s.nz() > v[MAX_NZ])) {
            v[MAX_NZ] = s.nz();
            t[T_MAX_NZ] = s.timeNs();
        }
    }

    @Override
    protected RuleOutcome judge(double[] v, long[] t) {
        if (Double.isNaN(v[MAX_PITCH])) {
            return RuleOutcome.NO_DATA;
        }
        return v[MAX_PITCH] >= pitchLimit || v[INVERTED] == 1 ? RuleOutcome.PASSED : RuleOutcome.FAILED;
    }

    @Override
    protected String describe(double[] v, long[] t) {
        if (Double.isNaN(v[MAX_PITCH])) {
            return "no pitch attitude";
        }
        return "highest |pitch| " + deg(v[MAX_PITCH]) + " deg (needs " + deg(pitchLimit) + "), "
                + (v[INVERTED] == 1 ? "inverted over the top" : "never inverted");
    }

    @Override
    protected void instants(double[] v, long[] t, List<KeyInstant> out) {
        if (v[INVERTED] == 1) {
            out.add(new KeyInstant("apex", t[T_APEX]));
        }
        if (!Double.isNaN(v[MAX_NZ])) {
            out.add(new KeyInstant("max-nz", t[T_MAX_NZ]));
        }
    }
}
