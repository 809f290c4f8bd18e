package org.pointcall.models.detect;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.SplittableRandom;

import org.junit.jupiter.api.Test;
import org.pointcall.shared.error.PointcallException;
import org.pointcall.shared.kind.ManoeuvreKind;

/** Guard rules alone, fed hand-built physical states. */
class GuardRuleTest {
    private static final long FRAME = 10_000_000L;
    private static final GuardSettings G = GuardSettings.defaults();

    private static PhysicalState at(PhysicalState s, long k) {
        s.advance(k * FRAME);
        return s;
    }

    @Test
    void rollCountsBankThroughTheWrapInEitherDirectionExactly() {
        for (double rate : new double[] {137.0, -211.0}) {
            GuardRule r = GuardRules.create(GuardRules.ROLL_360, ManoeuvreKind.AILERON_ROLL, G);
            r.start(0);
            PhysicalState s = new PhysicalState();
            double start = 170.0;
            double total = 0;
            for (long k = 0; total < 400; k++) {
                total = Math.abs(rate) * k * 0.01;
                // reported bank in (-180, 180], starting next to the wrap
                at(s, k).set(PhysicalQuantity.ROLL, Math.toRadians(Math.IEEEremainder(start + Math.signum(rate)
                        * total, 360.0)));
                r.onState(s);
                if (k == 0) {
                    assertEquals(RuleOutcome.NO_DATA, r.liveOutcome(), "one sample is no change yet");
                } else if (total < 300) {
                    assertEquals(RuleOutcome.FAILED, r.liveOutcome(), "not yet a full turn at " + total);
                }
            }
            assertEquals(RuleOutcome.PASSED, r.liveOutcome());
            // short-way steps telescope to the true change, to rounding
            assertEquals(Math.toRadians(total), ((RollRule) r).bankChangeRad(), 1e-9);
        }
    }

    @Test
    void rollRateIntegralUsesSampleTimes() {
        GuardRule r = GuardRules.create(GuardRules.ROLL_360, ManoeuvreKind.AILERON_ROLL, G);
        r.start(0);
        PhysicalState s = new PhysicalState();
        // 90 deg/s sampled unevenly for 4 s: trapezoids of a constant are exact
        long t = 0;
        SplittableRandom rnd = new SplittableRandom(1L);
        while (t < 4_000_000_000L) {
            s.advance(t);
            s.set(PhysicalQuantity.P, Math.toRadians(90));
            r.onState(s);
            t = Math.min(4_000_000_000L, t + 5_000_000L + rnd.nextLong(20_000_000L));
        }
        s.advance(t);
        s.set(PhysicalQuantity.P, Math.toRadians(90));
        r.onState(s);
        assertEquals(2 * Math.PI, ((RollRule) r).bankChangeRad(), 1e-9);
        assertEquals(RuleOutcome.PASSED, r.liveOutcome());
    }

    @Test
    void aLoopThatStepsOverTheVerticalPassesByBeingInverted() {
        GuardRule r = GuardRules.create(GuardRules.LOOP_PITCH_90, ManoeuvreKind.LOOP, G.withLoopPitchRad(
                Math.toRadians(89)));
        r.start(0);
        PhysicalState s = new PhysicalState();
        double[] pitch = {0, 30, 60, 85, 80, 50, 10, -5};
        double[] roll = {0, 0, 0, 0, 180, 180, 180, -180};
        for (int k = 0; k < pitch.length; k++) {
            at(s, k).set(PhysicalQuantity.PITCH, Math.toRadians(pitch[k]));
            s.set(PhysicalQuantity.ROLL, Math.toRadians(roll[k]));
            r.onState(s);
            assertEquals(k >= 4 ? RuleOutcome.PASSED : RuleOutcome.FAILED, r.liveOutcome(), "sample " + k);
        }
        List<KeyInstant> keys = new ArrayList<>();
        r.mark();
        r.keyInstants(false, keys);
        assertEquals(List.of(new KeyInstant("apex", 7 * FRAME)), keys, "smallest |pitch| while inverted");
    }

    @Test
    void aRollPastInvertedWithoutPitchingUpIsNotALoop() {
        GuardRule r = GuardRules.create(GuardRules.LOOP_PITCH_90, ManoeuvreKind.LOOP, G);
        r.start(0);
        PhysicalState s = new PhysicalState();
        for (int k = 0; k < 300; k++) {
            at(s, k).set(PhysicalQuantity.PITCH, Math.toRadians(5));
            s.set(PhysicalQuantity.ROLL, Math.toRadians(Math.IEEEremainder(1.2 * k, 360)));
            r.onState(s);
        }
        assertEquals(RuleOutcome.FAILED, r.liveOutcome());
    }

    @Test
    void theFinalOutcomeIsJudgedAsMarkedNotOnLaterFrames() {
        GuardRule r = GuardRules.create(GuardRules.WINDUP_NZ, ManoeuvreKind.WIND_UP_TURN, G);
        r.start(0);
        PhysicalState s = new PhysicalState();
        at(s, 1).set(PhysicalQuantity.NZ, 1.5);
        r.onState(s);
        r.mark();
        at(s, 2).set(PhysicalQuantity.NZ, 3.0);
        r.onState(s);
        assertEquals(RuleOutcome.PASSED, r.liveOutcome());
        assertEquals(RuleOutcome.FAILED, r.outcome(), "the 3 g frame came after the last mark");
        r.start(5 * FRAME);
        assertEquals(RuleOutcome.NO_DATA, r.outcome(), "start forgets everything");
    }

    @Test
    void onlyFreshSamplesCount() {
        GuardRule r = GuardRules.create(GuardRules.DOUBLET_Q_REVERSAL, ManoeuvreKind.PITCH_DOUBLET, G);
        r.start(0);
        PhysicalState s = new PhysicalState();
        at(s, 1).set(PhysicalQuantity.Q, Math.toRadians(10));
        r.onState(s);
        for (int k = 2; k < 50; k++) {
            at(s, k);
            r.onState(s); // Q held from frame 1, not re-sampled
        }
        at(s, 50).set(PhysicalQuantity.Q, Math.toRadians(-10));
        r.onState(s);
        at(s, 51).set(PhysicalQuantity.Q, Math.toRadians(10));
        r.onState(s);
        assertTrue(r.explain(true).startsWith("pitch rate reversed 2 times"), r.explain(true));
    }

    @Test
    void doubletKeepsTheLatestLobesWhenThereAreMany() {
        GuardRule r = GuardRules.create(GuardRules.DOUBLET_Q_REVERSAL, ManoeuvreKind.PITCH_DOUBLET, G);
        r.start(0);
        PhysicalState s = new PhysicalState();
        for (int k = 0; k < 100; k++) {
            at(s, k).set(PhysicalQuantity.Q, Math.toRadians(k % 2 == 0 ? 5 : -5));
            r.onState(s);
        }
        assertTrue(r.explain(true).startsWith("pitch rate reversed " + (DoubletQReversalRule.CAP - 1) + " times"),
                r.explain(true));
    }

    @Test
    void stabilisedStandardDeviationMatchesTheTwoPassFormula() {
        GuardRule r = GuardRules.create(GuardRules.STABILISED_STEADY, ManoeuvreKind.STABILISED,
                G.withStabilisedHpStdM(5.0));
        r.start(0);
        PhysicalState s = new PhysicalState();
        SplittableRandom rnd = new SplittableRandom(8L);
        double[] hp = new double[2000];
        for (int k = 0; k < hp.length; k++) {
            hp[k] = 3048.0 + 4.0 * rnd.nextGaussian();
            at(s, k).set(PhysicalQuantity.HP, hp[k]);
            r.onState(s);
        }
        double mean = 0;
        for (double h : hp) {
            mean += h;
        }
        mean /= hp.length;
        double ss = 0;
        for (double h : hp) {
            ss += (h - mean) * (h - mean);
        }
        double std = Math.sqrt(ss / (hp.length - 1));
        String expected = String.format(java.util.Locale.ROOT, "Hp standard deviation %.1f ft", std / 0.3048);
        assertTrue(r.explain(true).startsWith(expected), r.explain(true) + " vs " + expected);
        assertEquals(std <= 5.0 ? RuleOutcome.PASSED : RuleOutcome.FAILED, r.liveOutcome());
        assertTrue(r.explain(true).endsWith("no CAS"), "the CAS check is skipped without CAS");
        assertEquals(false, r.confirmsLive());
    }

    @Test
    void everyKindHasTheRulesTheDocumentationNamesAndUnknownPairsAreRefused() {
        assertEquals(List.of(GuardRules.STALL_AOA_PEAK), GuardRules.namesFor(ManoeuvreKind.STALL_TURN));
        assertEquals(List.of(), GuardRules.namesFor(ManoeuvreKind.PHUGOID));
        assertEquals(0, GuardRules.forKind(ManoeuvreKind.LOOP, DetectorSettings.defaults()
                .withDisabledRules(Set.of(GuardRules.LOOP_PITCH_90))).length);
        PointcallException e = assertThrows(PointcallException.class,
                () -> GuardRules.create(GuardRules.ROLL_360, ManoeuvreKind.LOOP, G));
        assertTrue(e.getMessage().contains("no guard rule 'roll-360' for loop"), e.getMessage());
        for (String name : GuardRules.NAMES) {
            boolean used = false;
            for (ManoeuvreKind k : ManoeuvreKind.values()) {
                if (GuardRules.namesFor(k).contains(name)) {
                    used = true;
                    GuardRule r = GuardRules.create(name, k, G);
                    assertEquals(name, r.name());
                    assertEquals(RuleOutcome.NO_DATA, r.outcome(), name + " without data cannot judge");
                    assertTrue(!r.meaning().isBlank());
                }
            }
            assertTrue(used, name + " checks some kind");
        }
    }
}
