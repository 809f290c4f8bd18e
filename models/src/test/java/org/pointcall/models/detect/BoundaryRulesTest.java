package org.pointcall.models.detect;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.pointcall.models.detect.PointEvent.Type.DISCARDED;
import static org.pointcall.models.detect.PointEvent.Type.ENDED;
import static org.pointcall.models.detect.SyntheticSortie.assertWellFormed;

import java.util.List;
import java.util.Set;
import java.util.SplittableRandom;

import org.junit.jupiter.api.Test;
import org.pointcall.models.detect.SyntheticSortie.Bump;
import org.pointcall.models.detect.SyntheticSortie.Physics;
import org.pointcall.models.detect.SyntheticSortie.Probabilities;
import org.pointcall.shared.error.PointcallException;
import org.pointcall.shared.kind.ManoeuvreKind;

/**
 * The boundary rules on hand-built flights at 100 Hz with a classifier that is late, early or unsure: each rule
 * moves the begin or end to the physical instant the flight was built with, and switched off leaves the classifier's.
 */
class BoundaryRulesTest {
    private static final double KT = 1852.0 / 3600.0;

    private static double s(long ns) {
        return ns / 1e9;
    }

    private static SyntheticSortie run(DetectorSettings st, double untilS, Physics physics, Bump... bumps) {
        SyntheticSortie s = new SyntheticSortie(st).run(untilS, new Probabilities(7L, 0.05, 0.01, bumps), physics)
                .finish();
        assertWellFormed(s.events);
        return s;
    }

    private static DetectorSettings without(String... rules) {
        return DetectorSettings.defaults().withDisabledRules(Set.of(rules));
    }

    /** Level until 10 s, then a pull to 1.3 g for 2 s, a full roll at 150 deg/s from 12 s, wings level from 14.4 s. */
    private static Physics roll() {
        SplittableRandom r = new SplittableRandom(3L);
        return (t, f, s) -> {
            SyntheticSortie.level(t, f, s);
            s.set(f, "P", 0.2 * (2 * r.nextDouble() - 1));
            if (t >= 10 && t < 12) {
                s.set(f, "Nz", 1.3);
                s.set(f, "Q", 4.0);
            } else if (t >= 12 && t < 14.4) {
                s.set(f, "P", 150.0);
                s.set(f, "Roll", Math.IEEEremainder(150.0 * (t - 12), 360.0));
            }
        };
    }

    @Test
    void aLateRollBeginsWhereTheAircraftLeftItsSteadyEntryAndEndsOnceItIsSteadyAgain() {
        // the classifier rises a little after the roll began (the roll rule sees from its rise on)
        Bump late = new Bump(ManoeuvreKind.AILERON_ROLL, 12.2, 17, 0.9);
        SyntheticSortie run = run(DetectorSettings.defaults(), 30, roll(), late);
        PointEvent kept = run.onlyFinal();
        assertEquals(ENDED, kept.type(), kept.evidence()::toString);
        assertEquals(10.0, s(kept.beginNs()), 0.3, kept.evidence()::toString);
        assertTrue(run.ofType(PointEvent.Type.BEGUN).get(0).hasEvidence("begin at begin-departure"),
                run.events::toString);
        // steady from 14.4 s, for the 2 s dwell
        assertEquals(16.4, s(kept.endNs()), 0.2, kept.evidence()::toString);
        assertTrue(kept.hasEvidence("end moved to end-recovery"), kept.evidence()::toString);

        PointEvent plain = run(without(BoundaryRules.BEGIN_DEPARTURE, BoundaryRules.END_RECOVERY), 30, roll(), late)
                .onlyFinal();
        assertEquals(ENDED, plain.type());
        assertEquals(12.2, s(plain.beginNs()), 0.2, "the classifier's own begin");
        assertEquals(17.0, s(plain.endNs()), 0.2, "the classifier's own end");
    }

    @Test
    void theLiveBeginIsAlreadyTheDeparture() {
        SyntheticSortie s = run(DetectorSettings.defaults(), 30, roll(),
                new Bump(ManoeuvreKind.AILERON_ROLL, 12.2, 17, 0.9));
        PointEvent begun = s.ofType(PointEvent.Type.BEGUN).get(0);
        assertEquals(10.0, s(begun.beginNs()), 0.3, begun.evidence()::toString);
        assertTrue(s(begun.reportedAtNs()) < 14.0, "reported as soon as the classifier entered");
    }

    /**
     * A stall in a 30 deg bank: slowing at 1 kt/s from 10 s with AoA rising to its break at 20 s, a nose-down
     * unload to 22 s, a pull to level flight to 26 s, then steady and wings level.
     */
    private static Physics turningStall() {
        SplittableRandom r = new SplittableRandom(11L);
        return (t, f, s) -> {
            SyntheticSortie.level(t, f, s);
            double bank = t < 20 ? 30.0 : t < 26 ? 30.0 * (26 - t) / 6 : 0.0;
            s.set(f, "Roll", bank);
            s.set(f, "Nz", t < 20 ? 1 / Math.cos(Math.toRadians(bank)) : t < 22 ? 0.7 : t < 26 ? 1.5 : 1.0);
            s.set(f, "KCAS", 150 - Math.max(0, Math.min(t, 20) - 10) + Math.max(0, Math.min(t, 26) - 20) * 1.5);
            double aoa = t < 10 ? 4 : t < 20 ? 4 + 1.2 * (t - 10) : t < 22 ? 16 - 6 * (t - 20) : 4;
            s.set(f, "AoA", aoa + 0.2 * (2 * r.nextDouble() - 1));
            s.set(f, "Q", t >= 20 && t < 22 ? -5.0 : t >= 22 && t < 26 ? 5.0 : 0.0);
            s.set(f, "Pitch", t >= 20 && t < 26 ? -10.0 : aoa - 1.0);
        };
    }

    /**
     * A wings-level stall after a set-up: slowing at 0.5 kt/s to 6 s (the approach configuration), steady to 10 s,
     * the entry at 1 kt/s to the break at 20 s, a dive at 10 deg to 26 s, then a steady climb away at 5 deg to
     * regain the height.
     */
    private static Physics stallThenClimb() {
        SplittableRandom r = new SplittableRandom(13L);
        return (t, f, s) -> {
            SyntheticSortie.level(t, f, s);
            double kcas = t < 6 ? 160 - 0.5 * t : t < 10 ? 157 : t < 20 ? 157 - (t - 10) : t < 26 ? 147 + 2 * (t - 20)
                    : 159;
            s.set(f, "KCAS", kcas + 0.1 * (2 * r.nextDouble() - 1));
            double aoa = t < 10 ? 4 : t < 20 ? 4 + 1.2 * (t - 10) : t < 22 ? 16 - 6 * (t - 20) : 4;
            s.set(f, "AoA", aoa + 0.2 * (2 * r.nextDouble() - 1));
            s.set(f, "Nz", t < 20 ? 1.0 : t < 22 ? 0.7 : t < 26 ? 1.5 : 1.0);
            s.set(f, "Q", t >= 20 && t < 22 ? -5.0 : t >= 22 && t < 26 ? 5.0 : 0.0);
            s.set(f, "Pitch", t < 20 ? aoa - 1.0 : t < 26 ? -10.0 : 9.0);
            // 250 ft/s of true airspeed: -43 ft/s in the dive, +22 ft/s in the climb
            s.set(f, "Hp", t < 20 ? 10000 : t < 26 ? 10000 - 43 * (t - 20) : 10000 - 43 * 6 + 22 * (t - 26));
        };
    }

    /**
     * A steady-heading sideslip: sideslip building to 12 deg from 10 to 13 s (3 deg of bank against it), held to
     * 25 s, back to zero and wings level by 27 s; then a 10 deg dive for the next point's speed.
     */
    private static Physics sideslipThenDive() {
        SplittableRandom r = new SplittableRandom(17L);
        return (t, f, s) -> {
            SyntheticSortie.level(t, f, s);
            double beta = t < 10 ? 0 : t < 13 ? 4 * (t - 10) : t < 25 ? 12 : t < 27 ? 12 - 6 * (t - 25) : 0;
            s.set(f, "AoS", beta + 0.1 * (2 * r.nextDouble() - 1));
            s.set(f, "Roll", -beta / 4);
            s.set(f, "Pitch", t < 27 ? 2.0 : -8.0);
            s.set(f, "Hp", t < 27 ? 12000 : 12000 - 43 * (t - 27));
        };
    }

    @Test
    void aSideslipEndsBackAtZeroSideslipEvenWhenADiveFollows() {
        // the classifier holds the sideslip 3 s past its end
        Bump late = new Bump(ManoeuvreKind.SIDESLIP, 10.5, 30, 0.9);
        PointEvent kept = run(DetectorSettings.defaults(), 70, sideslipThenDive(), late).onlyFinal();
        assertEquals(ENDED, kept.type(), kept.evidence()::toString);
        // back inside 2 deg of sideslip at 26.7 s: the dive that follows does not keep the sideslip open
        assertEquals(26.7, s(kept.endNs()), 0.4, kept.evidence()::toString);
        assertTrue(kept.hasEvidence("end moved to end-recovery"), kept.evidence()::toString);
    }

    @Test
    void aStallsEntryIsTheSlowingIntoItsBreakAndItsRecoveryEndsAtThePullOutsBottom() {
        // the classifier rises in the set-up, at 3 s, and holds the stall to 24 s
        Bump early = new Bump(ManoeuvreKind.STALL_LEVEL, 3, 24, 0.9);
        PointEvent kept = run(DetectorSettings.defaults(), 60, stallThenClimb(), early).onlyFinal();
        assertEquals(ENDED, kept.type(), kept.evidence()::toString);
        assertEquals(20.0, s(kept.keyInstant("break").orElseThrow()), 0.3);
        // the set-up's slowing is a run of its own: the entry begins where the slowing into the break began
        assertEquals(10.0, s(kept.beginNs()), 0.6, kept.evidence()::toString);
        // climbing away is recovered: the end is 2 s of steady rates after the dive's bottom, not level flight
        assertEquals(28.0, s(kept.endNs()), 0.6, kept.evidence()::toString);
    }

    @Test
    void aTurningStallLostBeforeItsBreakIsKeptToItsRecoveryAndToldByItsBank() {
        // the classifier calls it wings-level and loses it a second before the break
        Bump lost = new Bump(ManoeuvreKind.STALL_LEVEL, 10.5, 19, 0.9);
        PointEvent kept = run(DetectorSettings.defaults(), 60, turningStall(), lost).onlyFinal();
        assertEquals(ENDED, kept.type(), kept.evidence()::toString);
        assertEquals(ManoeuvreKind.STALL_TURN, kept.kind(), kept.evidence()::toString);
        assertTrue(kept.hasEvidence("passed stall-aoa-peak"), kept.evidence()::toString);
        assertEquals(10.0, s(kept.beginNs()), 0.5, kept.evidence()::toString);
        assertEquals(28.0, s(kept.endNs()), 0.3, kept.evidence()::toString);
        assertEquals(20.0, s(kept.keyInstant("break").orElseThrow()), 0.3);

        PointEvent noRecovery = run(without(BoundaryRules.END_RECOVERY), 60, turningStall(), lost).onlyFinal();
        assertEquals(DISCARDED, noRecovery.type(), "without it the classifier's stretch has no break");
        assertTrue(noRecovery.hasEvidence("failed stall-aoa-peak"), noRecovery.evidence()::toString);

        PointEvent noBank = run(without(BoundaryRules.STALL_BANK), 60, turningStall(), lost).onlyFinal();
        assertEquals(ManoeuvreKind.STALL_LEVEL, noBank.kind(), "the classifier's kind stands");
    }

    /** Level; from 10 s gaining 1 kt/s up to 70 s, then slowing at 1 kt/s; CAS from {@code fromKt}. */
    private static Physics accel(double fromKt, double ktPerS) {
        SplittableRandom r = new SplittableRandom(5L);
        return (t, f, s) -> {
            SyntheticSortie.level(t, f, s);
            double v = fromKt + ktPerS * (Math.max(0, Math.min(t, 70) - 10)) - Math.max(0, t - 70);
            s.set(f, "KCAS", v + 0.2 * (2 * r.nextDouble() - 1));
        };
    }

    @Test
    void aLevelAccelerationSpansTheWholeGainOfSpeed() {
        Bump middle = new Bump(ManoeuvreKind.LEVEL_ACCEL, 30, 60, 0.9);
        PointEvent kept = run(DetectorSettings.defaults(), 120, accel(200, 1.0), middle).onlyFinal();
        assertEquals(ENDED, kept.type(), kept.evidence()::toString);
        assertEquals(10.0, s(kept.beginNs()), 1.0, kept.evidence()::toString);
        assertEquals(70.0, s(kept.endNs()), 1.0, kept.evidence()::toString);
        assertTrue(kept.hasEvidence("disabled accel-gain") || !kept.hasEvidence("accel-gain"),
                "accel-gain is off by default: " + kept.evidence());

        PointEvent plain = run(without(BoundaryRules.ACCEL_EXTENT), 120, accel(200, 1.0), middle).onlyFinal();
        assertEquals(30.0, s(plain.beginNs()), 0.2);
        assertEquals(60.0, s(plain.endNs()), 0.2);
    }

    @Test
    void aLevelAccelerationThatGainsLittleIsDiscarded() {
        // 200 to 206 kt: 3 %, a transit's drift rather than a sweep of speed
        Bump bump = new Bump(ManoeuvreKind.LEVEL_ACCEL, 10, 70, 0.9);
        // off by default (an underpowered airframe's runs gain little too): switched on here
        PointEvent dropped = run(DetectorSettings.defaults().withDisabledRules(Set.of()), 120, accel(200, 0.1), bump)
                .onlyFinal();
        assertEquals(DISCARDED, dropped.type(), dropped.evidence()::toString);
        assertTrue(dropped.hasEvidence("failed accel-gain"), dropped.evidence()::toString);
        PointEvent kept = run(DetectorSettings.defaults(), 120, accel(200, 0.1), bump).onlyFinal();
        assertEquals(ENDED, kept.type(), kept.evidence()::toString);
        assertTrue(DetectorSettings.defaults().disabledRules().contains(BoundaryRules.ACCEL_GAIN));
    }

    /** A doublet: Q +8 deg/s from 10 to 11 s, -8 deg/s to 12 s, the response's overshoot +3 deg/s to 13 s. */
    private static Physics doublet() {
        return (t, f, s) -> {
            SyntheticSortie.level(t, f, s);
            s.set(f, "Q", t >= 10 && t < 11 ? 8.0 : t >= 11 && t < 12 ? -8.0 : t >= 12 && t < 13 ? 3.0 : 0.0);
        };
    }

    @Test
    void anUnsureClassifierIsEnoughForADoubletWhoseReversalsAreSeen() {
        Bump unsure = new Bump(ManoeuvreKind.PITCH_DOUBLET, 10, 16, 0.45);
        SyntheticSortie s = run(DetectorSettings.defaults(), 30, doublet(), unsure);
        PointEvent kept = s.onlyFinal();
        assertEquals(ENDED, kept.type(), kept.evidence()::toString);
        assertTrue(s.ofType(PointEvent.Type.BEGUN).get(0).hasEvidence("entered: smoothed p(pitch-doublet) above 0.25"),
                s.events::toString);
        assertTrue(run(without(BoundaryRules.PHYSICS_ENTRY, BoundaryRules.DOUBLET_SIGNATURE), 30, doublet(), unsure)
                .events.isEmpty(), "below p_on and without the rules: nothing");
        // without the reversals the lower entry is not earned
        assertTrue(run(DetectorSettings.defaults(), 30, (t, f, x) -> SyntheticSortie.level(t, f, x), unsure)
                .events.isEmpty());
    }

    @Test
    void theDoubletSignatureFindsADoubletTheClassifierNeverSees() {
        // no probability rises at all: input lobes 10-11 s (+8 deg/s) and 11-12 s (-8), a 3 deg/s response to 13 s
        SyntheticSortie s = run(DetectorSettings.defaults(), 30, doublet());
        PointEvent kept = s.onlyFinal();
        assertEquals(ENDED, kept.type(), kept.evidence()::toString);
        assertEquals(ManoeuvreKind.PITCH_DOUBLET, kept.kind());
        assertTrue(kept.hasEvidence("passed doublet-signature: pitch-rate input from 10.000 s"),
                kept.evidence()::toString);
        // begin: the 2 s of trimmed flight before the input; end: 8 s of free response after the release at 12 s
        assertEquals(8.0, s(kept.beginNs()), 0.05);
        assertEquals(20.0, s(kept.endNs()), 0.05);
        PointEvent begun = s.ofType(PointEvent.Type.BEGUN).get(0);
        // reported live once the response had been quiet for 1 s, long before the end
        assertTrue(s(begun.reportedAtNs()) < 14.2 && s(begun.reportedAtNs()) > 13.9, begun::toString);
        assertTrue(run(without(BoundaryRules.DOUBLET_SIGNATURE), 30, doublet()).events.isEmpty());
    }

    @Test
    void thePilotsNextInputEndsADoubletsFreeResponse() {
        Physics thenPull = (t, f, s) -> {
            doublet().fill(t, f, s);
            if (t >= 17 && t < 25) {
                s.set(f, "Q", 2.0);
            }
        };
        PointEvent kept = run(DetectorSettings.defaults(), 30, thenPull).onlyFinal();
        assertEquals(ENDED, kept.type(), kept.evidence()::toString);
        assertEquals(17.0, s(kept.endNs()), 0.05);
    }

    @Test
    void aPitchUpWhileSlowingOrAPullIntoAClimbIsNoDoublet() {
        // the same two lobes at the start of a stall's slow-down at 1.5 kt/s: the speed is not held
        Physics slowing = (t, f, s) -> {
            doublet().fill(t, f, s);
            s.set(f, "KCAS", 250.0 - (t > 9 ? 1.5 * (t - 9) : 0));
        };
        SyntheticSortie stall = run(DetectorSettings.defaults(), 30, slowing);
        assertTrue(stall.ofType(ENDED).isEmpty(), stall.events::toString);
        assertTrue(stall.events.isEmpty() || stall.onlyFinal().hasEvidence("failed doublet-signature: CAS changed"),
                stall.events::toString);
        // 2 s of pull at 6 deg/s, then 1 s of push at 4 deg/s: the nose stays 8 deg up, the areas do not cancel
        Physics climb = (t, f, s) -> {
            SyntheticSortie.level(t, f, s);
            s.set(f, "Q", t >= 10 && t < 12 ? 6.0 : t >= 12 && t < 13 ? -4.0 : 0.0);
        };
        assertTrue(run(DetectorSettings.defaults(), 30, climb).events.isEmpty());
    }

    @Test
    void aLevelAccelerationOutOfAnotherManoeuvresRecoveryIsNoPoint() {
        // the same gain, once from settled level flight, once straight out of a sideslip at 30 deg of bank
        // the gain runs from 10 to 70 s; the classifier sees 30 to 60 s
        Bump run = new Bump(ManoeuvreKind.LEVEL_ACCEL, 30, 60, 0.9);
        PointEvent settled = run(DetectorSettings.defaults(), 120, accel(200, 1.0), run).onlyFinal();
        assertEquals(ENDED, settled.type(), settled.evidence()::toString);
        assertTrue(settled.hasEvidence("passed accel-settled-entry: 100 %"), settled.evidence()::toString);
        Physics outOfSideslip = (t, f, s) -> {
            accel(200, 1.0).fill(t, f, s);
            if (t < 10) {
                s.set(f, "Roll", 30.0);
                s.set(f, "AoS", 10.0);
            }
        };
        // refused before it begins: nothing is reported, and nothing waits for its end
        SyntheticSortie unsettled = run(DetectorSettings.defaults(), 120, outOfSideslip, run);
        assertTrue(unsettled.events.isEmpty(), unsettled.events::toString);
        PointEvent off = run(without(BoundaryRules.ACCEL_SETTLED_ENTRY), 120, outOfSideslip, run).onlyFinal();
        assertEquals(ENDED, off.type(), off.evidence()::toString);
    }

    @Test
    void theRollSignatureFindsARollTheClassifierNeverSees() {
        // no probability rises at all: the pull from 10 s, the full roll at 150 deg/s from 12 s, wings level from 14.4 s
        SyntheticSortie s = run(DetectorSettings.defaults(), 30, roll());
        PointEvent kept = s.onlyFinal();
        assertEquals(ENDED, kept.type(), kept.evidence()::toString);
        assertEquals(ManoeuvreKind.AILERON_ROLL, kept.kind());
        assertTrue(kept.hasEvidence("passed roll-signature: 360 deg of bank turned from 12.0"),
                kept.evidence()::toString);
        assertTrue(kept.hasEvidence("passed roll-360"), kept.evidence()::toString);
        // begun where the pull began, ended once back in steady flight (2 s of it after the roll)
        assertEquals(10.0, s(kept.beginNs()), 0.3, kept.evidence()::toString);
        assertEquals(16.4, s(kept.endNs()), 0.5, kept.evidence()::toString);
        assertTrue(run(without(BoundaryRules.ROLL_SIGNATURE), 30, roll()).events.isEmpty());
    }

    @Test
    void aRollWhoseSteadyRecoveryIsCutShortEndsWhereItCameNearestToSteadyFlight() {
        // the same roll, but 1.2 s after it (less than the 2 s dwell) the pilot rolls into a 45 deg turn and holds
        // it: never 2 s of steady flight after the roll, so at the end of the wait the roll ends at its 1.2 s of
        // steady flight (a Sparrel sortie's case: the roll had ended at the end of the rolling, 4 s short)
        Physics rollThenTurn = (t, f, x) -> {
            roll().fill(t, f, x);
            if (t >= 15.6) {
                x.set(f, "Roll", Math.min(45.0, 15.0 * (t - 15.6)));
                x.set(f, "P", t < 18.6 ? 15.0 : 0.0);
            }
        };
        PointEvent kept = run(DetectorSettings.defaults(), 60, rollThenTurn).onlyFinal();
        assertEquals(ENDED, kept.type(), kept.evidence()::toString);
        assertEquals(ManoeuvreKind.AILERON_ROLL, kept.kind());
        assertEquals(15.6, s(kept.endNs()), 0.3, kept.evidence()::toString);
    }

    @Test
    void aRollEndsTheSpeedUpStillWaitingForItsEndAndIsAPointOfItsOwn() {
        // a gain of speed from 10 to 70 s that then holds its highest speed (so the level acceleration waits for the
        // drop that ends it), then a full roll at 150 deg/s from 80 s
        Bump run = new Bump(ManoeuvreKind.LEVEL_ACCEL, 30, 60, 0.9);
        Physics gainThenRoll = (t, f, s) -> {
            SyntheticSortie.level(t, f, s);
            s.set(f, "KCAS", 200 + Math.max(0, Math.min(t, 70) - 10));
            if (t >= 80 && t < 82.4) {
                s.set(f, "P", 150.0);
                s.set(f, "Roll", Math.IEEEremainder(150.0 * (t - 80), 360.0));
            }
        };
        SyntheticSortie sortie = run(DetectorSettings.defaults(), 120, gainThenRoll, run);
        List<PointEvent> ended = sortie.ofType(ENDED);
        assertEquals(2, ended.size(), sortie.events::toString);
        assertEquals(ManoeuvreKind.LEVEL_ACCEL, ended.get(0).kind());
        assertTrue(s(ended.get(0).endNs()) <= 80.05, ended.get(0).evidence()::toString);
        assertEquals(ManoeuvreKind.AILERON_ROLL, ended.get(1).kind(), ended.get(1).evidence()::toString);
        assertEquals(80.0, s(ended.get(1).beginNs()), 0.3, ended.get(1).evidence()::toString);
    }

    @Test
    void halfARollAndBackIsNoRoll() {
        // 180 deg of bank one way at 150 deg/s, a second level, and back: the rate is up, but no full turn
        Physics half = (t, f, s) -> {
            SyntheticSortie.level(t, f, s);
            double p = t >= 12 && t < 13.2 ? 150 : t >= 14.2 && t < 15.4 ? -150 : 0;
            double bank = t < 12 ? 0 : t < 13.2 ? 150 * (t - 12) : t < 14.2 ? 180 : t < 15.4 ? 180 - 150 * (t - 14.2)
                    : 0;
            s.set(f, "P", p);
            s.set(f, "Roll", bank > 180 ? bank - 360 : bank);
        };
        assertTrue(run(DetectorSettings.defaults(), 30, half).events.isEmpty());
    }

    @Test
    void aSpeedUpInAClimbIsNoLevelAcceleration() {
        Bump run = new Bump(ManoeuvreKind.LEVEL_ACCEL, 30, 60, 0.9);
        // the same gain, once level, once climbing at 300 ft/min
        Physics climbing = (t, f, s) -> {
            accel(200, 1.0).fill(t, f, s);
            s.set(f, "Hp", 10000 + 5.0 * t);
        };
        PointEvent level = run(DetectorSettings.defaults(), 120, accel(200, 1.0), run).onlyFinal();
        assertEquals(ENDED, level.type(), level.evidence()::toString);
        assertTrue(level.hasEvidence("passed accel-level: Hp drifted 0 ft/min"), level.evidence()::toString);
        PointEvent climb = run(DetectorSettings.defaults(), 120, climbing, run).onlyFinal();
        assertEquals(DISCARDED, climb.type(), climb.evidence()::toString);
        assertTrue(climb.hasEvidence("failed accel-level: Hp drifted 300 ft/min (at most 100)"),
                climb.evidence()::toString);
        assertEquals(ENDED, run(without(BoundaryRules.ACCEL_LEVEL), 120, climbing, run).onlyFinal().type());
    }

    @Test
    void aLevelAccelerationFromSettledFlightNeedsNoLongStretchOfTheClassifier() {
        // the classifier sees only 5 s of a 60 s gain from settled flight (a fragment in transit would be discarded)
        Bump glimpse = new Bump(ManoeuvreKind.LEVEL_ACCEL, 50, 55, 0.9);
        PointEvent kept = run(DetectorSettings.defaults(), 120, accel(200, 1.0), glimpse).onlyFinal();
        assertEquals(ENDED, kept.type(), kept.evidence()::toString);
        assertEquals(10.0, s(kept.beginNs()), 1.0, kept.evidence()::toString);
    }

    @Test
    void anExtentRuleDoesNotMakeAShortFragmentLongEnough() {
        // the classifier sees 10 s of a 60 s gain: spread over the gain it would last 60 s, but 10 s is below the
        // 15 s minimum of a level acceleration
        // (from settled flight accel-settled-entry vouches for the run instead: with it off, the classifier's stretch
        // decides)
        Bump fragment = new Bump(ManoeuvreKind.LEVEL_ACCEL, 50, 60, 0.9);
        PointEvent d = run(without(BoundaryRules.ACCEL_SETTLED_ENTRY), 120, accel(200, 1.0), fragment).onlyFinal();
        assertEquals(DISCARDED, d.type(), d.evidence()::toString);
        assertTrue(d.hasEvidence("failed min-duration: 10.00 s (needs 15.00 s) as the classifier saw it"),
                d.evidence()::toString);
    }

    @Test
    void aLongPointBridgesALongerGapOfItsOwnKind() {
        Bump a = new Bump(ManoeuvreKind.PHUGOID, 10, 50, 0.9);
        Bump b = new Bump(ManoeuvreKind.PHUGOID, 55, 100, 0.9);
        SyntheticSortie merged = run(DetectorSettings.defaults(), 130, null, a, b);
        PointEvent one = merged.onlyFinal();
        assertEquals(10.0, s(one.beginNs()), 0.2);
        assertEquals(100.0, s(one.endNs()), 0.2);
        SyntheticSortie split = run(without(BoundaryRules.FRAGMENT_MERGE), 130, null, a, b);
        assertEquals(2, split.ofType(ENDED).size(), split.events::toString);
    }

    @Test
    void aStabilisedPointLastsAsLongAsItsHold() {
        SplittableRandom r = new SplittableRandom(9L);
        Physics holdThenClimb = (t, f, s) -> {
            SyntheticSortie.level(t, f, s);
            s.set(f, "Hp", 10000 + 10 * (2 * r.nextDouble() - 1) + (t >= 40 ? 50 * (t - 40) : 0));
            s.set(f, "KCAS", 250 + 0.5 * (2 * r.nextDouble() - 1));
            if (t >= 40) {
                s.set(f, "Pitch", 8.0);
                s.set(f, "Nz", t < 41 ? 1.2 : 1.0);
            }
        };
        Bump cut = new Bump(ManoeuvreKind.STABILISED, 10, 28, 0.9);
        PointEvent kept = run(DetectorSettings.defaults(), 70, holdThenClimb, cut).onlyFinal();
        assertEquals(ENDED, kept.type(), kept.evidence()::toString);
        assertEquals(10.0, s(kept.beginNs()), 0.2, "the begin stays the classifier's");
        assertEquals(40.0, s(kept.endNs()), 0.5, kept.evidence()::toString);
        assertTrue(kept.hasEvidence("passed stabilised-steady"), kept.evidence()::toString);
        PointEvent plain = run(without(BoundaryRules.STABILISED_EXTENT), 70, holdThenClimb, cut).onlyFinal();
        assertEquals(28.0, s(plain.endNs()), 0.2);
    }

    @Test
    void boundaryRulesAreNamedLikeGuardRulesAndUnknownNamesAreRefused() {
        for (String name : BoundaryRules.NAMES) {
            DetectorSettings.defaults().withDisabledRules(Set.of(name));
        }
        // switching one more off keeps those off by default off (accel-gain)
        DetectorSettings more = DetectorSettings.defaults().withRulesOff(Set.of(BoundaryRules.CARD_ONSET));
        assertFalse(more.ruleEnabled(BoundaryRules.ACCEL_GAIN));
        assertFalse(more.ruleEnabled(BoundaryRules.CARD_ONSET));
        assertTrue(more.ruleEnabled(BoundaryRules.HOLD_SIGNATURE));
        PointcallException e = org.junit.jupiter.api.Assertions.assertThrows(PointcallException.class,
                () -> DetectorSettings.defaults().withDisabledRules(Set.of("begin-departures")));
        assertTrue(e.getMessage().contains("begin-departure"), e.getMessage());
        PointcallException b = org.junit.jupiter.api.Assertions.assertThrows(PointcallException.class,
                () -> BoundarySettings.defaults().withSteadyDwellS(0));
        assertTrue(b.getMessage().contains("steadyDwellS must be a finite number above 0"), b.getMessage());
    }

    @Test
    void theHoldSignatureFindsAHoldTheClassifierNeverCallsAndEndsItWhereTheClimbBegins() {
        // level and steady at 250 KCAS and 10,000 ft until 40 s, then a 1,000 ft/min climb; the classifier sees
        // nothing (its probabilities are noise around 0.05)
        Physics holdThenClimb = (t, f, x) -> {
            SyntheticSortie.level(t, f, x);
            x.set(f, "Hp", t < 40 ? 10000.0 : 10000.0 + 1000.0 / 60 * (t - 40));
            x.set(f, "Pitch", t < 40 ? 3.0 : 6.0);
        };
        SyntheticSortie s = SyntheticSortie.withHolds(DetectorSettings.defaults())
                .run(60, new Probabilities(7L, 0.05, 0.01), holdThenClimb).finish();
        assertWellFormed(s.events);
        PointEvent hold = s.onlyFinal();
        assertEquals(ManoeuvreKind.STABILISED, hold.kind());
        assertEquals(ENDED, hold.type());
        // stabilised: 2 s into the steady run (which starts within the first 1.5 s of smoothing), not at its start
        assertTrue(hold.beginNs() / 1e9 >= PointDetector.STABILISE_NS / 1e9 && hold.beginNs() / 1e9 < 5,
                "begun once stabilised, 2 s into the steady run: " + hold);
        assertEquals(40.0, hold.endNs() / 1e9, 1.5, "ended where the climb began: " + hold);
        assertTrue(hold.hasEvidence("ended by " + BoundaryRules.HOLD_SIGNATURE + ": steady flight ended"),
                hold.evidence()::toString);
        PointEvent begun = s.events.get(0);
        assertEquals(PointEvent.Type.BEGUN, begun.type());
        assertTrue(begun.reportedAtNs() - begun.beginNs() >= 15_000_000_000L,
                "reported once held for the stabilised minimum duration: " + begun);
        // switched off: nothing (the classifier alone never calls it)
        SyntheticSortie off = SyntheticSortie.withHolds(without(BoundaryRules.HOLD_SIGNATURE))
                .run(60, new Probabilities(7L, 0.05, 0.01), holdThenClimb).finish();
        assertTrue(off.events.isEmpty(), off.events::toString);
        // 12 s of steady flight before the climb is shorter than the minimum: no point
        Physics shortHold = (t, f, x) -> {
            SyntheticSortie.level(t, f, x);
            x.set(f, "Hp", t < 12 ? 10000.0 : 10000.0 + 1000.0 / 60 * (t - 12));
        };
        assertTrue(SyntheticSortie.withHolds(DetectorSettings.defaults())
                .run(30, new Probabilities(7L, 0.05, 0.01), shortHold).finish().events.isEmpty());
    }

    /** Level until 10 s, a 4 g loop at 36 deg/s of pitch rate to 20 s, level after (a pilot cut short: a turn). */
    private static Physics loopThenLevel(double turnAtS) {
        return (t, f, x) -> {
            SyntheticSortie.level(t, f, x);
            if (t >= 10 && t < 20) {
                double g = 2 * Math.PI * (t - 10) / 10;
                boolean inverted = g > Math.PI / 2 && g < 1.5 * Math.PI;
                double pitch = g <= Math.PI / 2 ? g : inverted ? Math.PI - g : g - 2 * Math.PI;
                x.set(f, "Pitch", Math.toDegrees(pitch));
                x.set(f, "Roll", inverted ? 180.0 : 0.0);
                x.set(f, "Heading", inverted ? 270.0 : 90.0);
                x.set(f, "Q", 36.0);
                x.set(f, "Nz", 1.0 + 3.0 * Math.sin(Math.min(g, Math.PI)) + (g > Math.PI ? 3.0 : 0.0));
                x.set(f, "Hp", 10000.0 + 1500.0 * (1 - Math.cos(g)));
            } else if (t >= turnAtS) {
                x.set(f, "Roll", Math.min(45.0, 15.0 * (t - turnAtS)));
                x.set(f, "P", t < turnAtS + 3 ? 15.0 : 0.0);
            }
        };
    }

    @Test
    void aLoopEndsBackInSteadyFlightNotWhereTheClassifierLetsGo() {
        // the classifier lets go 5 s after the loop (its windows still hold it); steady level flight from 20 s
        Bump late = new Bump(ManoeuvreKind.LOOP, 10, 25, 0.9);
        PointEvent kept = run(DetectorSettings.defaults(), 60, loopThenLevel(1e9), late).onlyFinal();
        assertEquals(ENDED, kept.type(), kept.evidence()::toString);
        assertEquals(ManoeuvreKind.LOOP, kept.kind());
        // (the flight-path angle is a least-squares slope of Hp: it reads level a little after the loop)
        assertEquals(22.0, s(kept.endNs()), 0.8, "2 s of steady flight after the loop: " + kept.evidence());
        // the pilot rolls into a turn 1.2 s after the loop: it ends where that steady second ended
        PointEvent cut = run(DetectorSettings.defaults(), 60, loopThenLevel(21.2), late).onlyFinal();
        assertEquals(21.2, s(cut.endNs()), 0.8, cut.evidence()::toString);
        // without end-recovery, the classifier's end stays
        PointEvent off = run(without(BoundaryRules.END_RECOVERY), 60, loopThenLevel(1e9), late).onlyFinal();
        assertTrue(s(off.endNs()) > 24, off.evidence()::toString);
    }

    @Test
    void aRollOutOfALongSteadySetUpEndsTheHoldAndIsAPointOfItsOwn() {
        // 30 s of steady level flight (a hold by the signature from 15 s on), then the pull and the full roll of
        // roll() 20 s later; the classifier sees nothing
        Physics later = (t, f, x) -> roll().fill(t - 20, f, x);
        SyntheticSortie s = SyntheticSortie.withHolds(DetectorSettings.defaults())
                .run(60, new Probabilities(7L, 0.05, 0.01), later).finish();
        assertWellFormed(s.events);
        List<PointEvent> kept = s.ofType(ENDED);
        assertEquals(List.of(ManoeuvreKind.STABILISED, ManoeuvreKind.AILERON_ROLL, ManoeuvreKind.STABILISED),
                kept.stream().map(PointEvent::kind).toList(), s.events::toString);
        assertTrue(kept.get(0).endNs() / 1e9 <= 32.5, "the hold ends by the roll: " + kept.get(0));
        assertEquals(30.0, s(kept.get(1).beginNs()), 0.5, kept.get(1).evidence()::toString);
    }
}
