package org.pointcall.models.detect;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.pointcall.models.detect.PointEvent.Type.BEGUN;
import static org.pointcall.models.detect.PointEvent.Type.DISCARDED;
import static org.pointcall.models.detect.PointEvent.Type.ENDED;
import static org.pointcall.models.detect.PointEvent.Type.REFINED;
import static org.pointcall.models.detect.SyntheticSortie.assertWellFormed;

import java.util.List;
import java.util.Set;
import java.util.SplittableRandom;

import org.junit.jupiter.api.Test;
import org.pointcall.ingest.frame.Frame;
import org.pointcall.models.detect.SyntheticSortie.Bump;
import org.pointcall.models.detect.SyntheticSortie.Physics;
import org.pointcall.models.detect.SyntheticSortie.Probabilities;
import org.pointcall.models.detect.SyntheticSortie.Slots;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.kind.ManoeuvreKind;

/** Guard rules judging points inside the detector, on synthetic frames at 100 Hz. */
class GuardRulesInDetectorTest {

    private static long ns(double s) {
        return Math.round(s * 1e9);
    }

    private static SyntheticSortie run(DetectorSettings st, ParameterDictionary d, Bump bump, double untilS,
                                       Physics physics) {
        return new SyntheticSortie(st, d).run(untilS, new Probabilities(bump.hashCode(), 0.05, 0.01, bump), physics)
                .finish();
    }

    private static SyntheticSortie run(Bump bump, double untilS, Physics physics) {
        return run(DetectorSettings.defaults(), SyntheticSortie.dictionary(), bump, untilS, physics);
    }

    /**
     * Euler angles of a wings-level loop in the vertical plane with the flight-path angle going round once from
     * {@code t0} to {@code t1}: nose up to the vertical, then inverted (bank 180, heading reversed) with pitch
     * falling back through zero at the apex, then upright again past the bottom-going vertical.
     */
    private static Physics loop(double t0, double t1) {
        return (t, f, s) -> {
            SyntheticSortie.level(t, f, s);
            if (t < t0 || t >= t1) {
                return;
            }
            double g = 2 * Math.PI * (t - t0) / (t1 - t0);
            boolean inverted = g > Math.PI / 2 && g < 1.5 * Math.PI;
            double pitch = g <= Math.PI / 2 ? g : inverted ? Math.PI - g : g - 2 * Math.PI;
            s.set(f, "Pitch", Math.toDegrees(pitch));
            s.set(f, "Roll", inverted ? 180.0 : 0.0);
            s.set(f, "Heading", inverted ? 270.0 : 90.0);
            s.set(f, "Nz", 1.0 + 3.0 * Math.sin(Math.min(g, Math.PI)));
        };
    }

    @Test
    void aLoopThatPassesTheVerticalIsConfirmedLiveAndKeptWithItsApex() {
        SyntheticSortie s = run(new Bump(ManoeuvreKind.LOOP, 10, 20, 0.9), 30, loop(10, 20));
        assertEquals(List.of(BEGUN, REFINED, ENDED), s.types());
        assertWellFormed(s.events);
        PointEvent confirmed = s.events.get(1);
        assertTrue(confirmed.hasEvidence("confirmed by loop-pitch-90"), confirmed.evidence()::toString);
        // the 80 deg limit is reached 80/360 of the way round, at 12.222 s: confirmed on the next 20 Hz tick
        assertEquals(ns(12.25), confirmed.reportedAtNs());
        PointEvent end = s.events.get(2);
        assertTrue(end.hasEvidence("passed loop-pitch-90"), end.evidence()::toString);
        // half way round, at 15 s, the aircraft is inverted with the pitch attitude crossing zero (geometry of the
        // designed loop; samples every 10 ms, one of them exactly there)
        assertEquals(ns(15), end.keyInstant("apex").orElseThrow());
        // Nz = 1 + 3 sin(g) peaks at g = pi/2, the same 12.5 s
        assertEquals(ns(12.5), end.keyInstant("max-nz").orElseThrow());
    }

    @Test
    void aLoopBumpWithoutPitchThroughTheVerticalIsDiscardedNamingTheRuleAndKeptWithItOff() {
        Physics pullUp = (t, f, s) -> {
            SyntheticSortie.level(t, f, s);
            if (t >= 10 && t < 20) {
                s.set(f, "Pitch", 40 * Math.sin(Math.PI * (t - 10) / 10));
            }
        };
        Bump loop = new Bump(ManoeuvreKind.LOOP, 10, 20, 0.9);
        SyntheticSortie s = run(loop, 30, pullUp);
        assertEquals(List.of(BEGUN, DISCARDED), s.types());
        PointEvent d = s.onlyFinal();
        assertTrue(d.hasEvidence("failed loop-pitch-90: highest |pitch| 40.0 deg (needs 80.0), never inverted"),
                d.evidence()::toString);
        assertTrue(d.hasEvidence("passed min-duration"), "only the rule rejected it");

        SyntheticSortie off = run(DetectorSettings.defaults().withDisabledRules(Set.of(GuardRules.LOOP_PITCH_90)),
                SyntheticSortie.dictionary(), loop, 30, pullUp);
        assertEquals(List.of(BEGUN, ENDED), off.types());
        assertTrue(off.onlyFinal().hasEvidence("disabled loop-pitch-90"), off.onlyFinal().evidence()::toString);
    }

    @Test
    void withoutAPitchParameterTheLoopRuleCannotJudgeAndThePointIsKept() {
        SyntheticSortie s = run(DetectorSettings.defaults(), SyntheticSortie.dictionary("Pitch"),
                new Bump(ManoeuvreKind.LOOP, 10, 20, 0.9), 30, SyntheticSortie::level);
        PointEvent end = s.onlyFinal();
        assertEquals(ENDED, end.type());
        assertTrue(end.hasEvidence("unchecked loop-pitch-90: no pitch attitude"), end.evidence()::toString);
    }

    /** AoA climbing slowly to a peak at {@code peakS}, then the break: AoA and Nz fall; seeded sensor noise. */
    private static final class StallPhysics implements Physics {
        private final SplittableRandom random = new SplittableRandom(42L);
        private final boolean breaks;
        double maxAoaDeg = Double.NEGATIVE_INFINITY;
        double maxAtS = Double.NaN;

        StallPhysics(boolean breaks) {
            this.breaks = breaks;
        }

        @Override
        public void fill(double t, Frame f, Slots s) {
            SyntheticSortie.level(t, f, s);
            double aoa = 4.0;
            double nz = 1.0;
            if (t >= 10 && t < 20) {
                aoa = 4.0 + 1.2 * (t - 10);
            } else if (t >= 20 && t < 26) {
                aoa = breaks ? 16.0 - 3.0 * (t - 20) : 16.0 + 0.5 * (t - 20);
                nz = breaks ? 1.0 - 0.3 * Math.sin(Math.PI * (t - 20) / 6) : 1.0;
            } else if (t >= 26) {
                aoa = breaks ? 4.0 : 19.0;
            }
            aoa += 0.3 * (2 * random.nextDouble() - 1);
            s.set(f, "AoA", aoa);
            s.set(f, "Nz", nz + 0.01 * (2 * random.nextDouble() - 1));
            s.set(f, "KCAS", 180 - 4.0 * Math.max(0, Math.min(t, 20) - 10));
            if (t >= 10 && t < 25 && aoa > maxAoaDeg) {
                maxAoaDeg = aoa;
                maxAtS = t;
            }
        }
    }

    @Test
    void theStallBreakInstantIsTheAoaMaximum() {
        StallPhysics physics = new StallPhysics(true);
        SyntheticSortie s = run(new Bump(ManoeuvreKind.STALL_LEVEL, 10, 25, 0.9), 35, physics);
        PointEvent end = s.onlyFinal();
        assertEquals(ENDED, end.type(), end.evidence()::toString);
        assertTrue(end.hasEvidence("passed stall-aoa-peak"), end.evidence()::toString);
        // the highest noisy AoA sample the physics wrote inside the point, to the nanosecond
        assertEquals(ns(physics.maxAtS), end.keyInstant("break").orElseThrow());
        assertTrue(Math.abs(physics.maxAtS - 20.0) < 0.5, "the noise moves the maximum only near the designed peak");
    }

    @Test
    void aStallWithoutALiftBreakIsDiscarded() {
        SyntheticSortie s = run(new Bump(ManoeuvreKind.STALL_LEVEL, 10, 25, 0.9), 35, new StallPhysics(false));
        PointEvent d = s.onlyFinal();
        assertEquals(DISCARDED, d.type());
        assertTrue(d.hasEvidence("failed stall-aoa-peak"), d.evidence()::toString);
    }

    /** Wings level, then a roll at {@code rateDps} for {@code durationS} from 10.5 s, the bank angle wrapped. */
    private static Physics roll(double rateDps, double durationS, boolean andBack) {
        return (t, f, s) -> {
            SyntheticSortie.level(t, f, s);
            double dt = t - 10.5;
            double bank = 0;
            double p = 0;
            if (dt >= 0 && dt < durationS) {
                bank = rateDps * dt;
                p = rateDps;
            } else if (dt >= durationS && andBack && dt < 2 * durationS) {
                bank = rateDps * (2 * durationS - dt);
                p = -rateDps;
            } else if (dt >= durationS && !andBack) {
                bank = rateDps * durationS;
            }
            s.set(f, "Roll", Math.IEEEremainder(bank, 360.0));
            s.set(f, "P", p);
        };
    }

    @Test
    void anAileronRollCountsItsBankThroughTheWrapAtPlusMinus180() {
        Bump bump = new Bump(ManoeuvreKind.AILERON_ROLL, 10, 14.5, 0.9);
        SyntheticSortie s = run(bump, 25, roll(120, 3, false));
        PointEvent end = s.onlyFinal();
        assertEquals(ENDED, end.type(), end.evidence()::toString);
        // 120 deg/s for 3 s: exactly one turn, and the unwrapped sum telescopes to it
        assertTrue(end.hasEvidence("passed roll-360: bank changed 360.0 deg, from the bank angle"),
                end.evidence()::toString);
        assertEquals(ns(13.5), end.keyInstant("roll-end").orElseThrow(), 10_000_000L);

        SyntheticSortie fromRate = run(DetectorSettings.defaults(), SyntheticSortie.dictionary("Roll"), bump, 25,
                roll(120, 3, false));
        assertTrue(fromRate.onlyFinal().hasEvidence("passed roll-360: bank changed 360.0 deg, from the roll rate"),
                fromRate.onlyFinal().evidence()::toString);

        SyntheticSortie halfAndBack = run(bump, 25, roll(120, 1.5, true));
        assertEquals(DISCARDED, halfAndBack.onlyFinal().type());
        assertTrue(halfAndBack.onlyFinal().hasEvidence("failed roll-360: bank changed 180.0 deg"),
                halfAndBack.onlyFinal().evidence()::toString);
    }

    @Test
    void aWindUpTurnMustPullWellAboveOneG() {
        Bump bump = new Bump(ManoeuvreKind.WIND_UP_TURN, 10, 25, 0.9);
        Physics strong = (t, f, s) -> {
            SyntheticSortie.level(t, f, s);
            s.set(f, "Nz", t >= 10 && t < 25 ? 1.0 + 3.0 * Math.sin(Math.PI * (t - 10) / 15) : 1.0);
        };
        PointEvent kept = run(bump, 35, strong).onlyFinal();
        assertEquals(ENDED, kept.type());
        assertEquals(ns(17.5), kept.keyInstant("nz-max").orElseThrow(), "the sine peaks half way");
        Physics weak = (t, f, s) -> {
            SyntheticSortie.level(t, f, s);
            s.set(f, "Nz", t >= 10 && t < 25 ? 1.6 : 1.0);
        };
        PointEvent dropped = run(bump, 35, weak).onlyFinal();
        assertEquals(DISCARDED, dropped.type());
        assertTrue(dropped.hasEvidence("failed windup-nz: highest Nz 1.60 g (needs 2.00)"),
                dropped.evidence()::toString);
    }

    @Test
    void aPitchDoubletReversesItsPitchRate() {
        Bump bump = new Bump(ManoeuvreKind.PITCH_DOUBLET, 10, 16, 0.9);
        Physics doublet = (t, f, s) -> {
            SyntheticSortie.level(t, f, s);
            double q = 0;
            if (t >= 10.5 && t < 11.5) {
                q = 10;
            } else if (t >= 11.5 && t < 12.5) {
                q = -10;
            } else if (t >= 12.5 && t < 13.3) {
                q = 3;
            }
            s.set(f, "Q", q);
        };
        // the guard rule alone: the doublet watch, which would place the begin at its trimmed lead, is off
        DetectorSettings ruleOnly = DetectorSettings.defaults()
                .withDisabledRules(java.util.Set.of(BoundaryRules.DOUBLET_SIGNATURE));
        PointEvent kept = run(ruleOnly, SyntheticSortie.dictionary(), bump, 25, doublet).onlyFinal();
        assertEquals(ENDED, kept.type(), kept.evidence()::toString);
        assertTrue(kept.hasEvidence("passed doublet-q-reversal: pitch rate reversed 2 times"), kept.evidence()::toString);
        assertEquals(ns(10.5), kept.keyInstant("input").orElseThrow());

        Physics pull = (t, f, s) -> {
            SyntheticSortie.level(t, f, s);
            s.set(f, "Q", t >= 10.5 && t < 11.5 ? 10 : 0);
        };
        PointEvent dropped = run(bump, 25, pull).onlyFinal();
        assertEquals(DISCARDED, dropped.type());
        assertTrue(dropped.hasEvidence("failed doublet-q-reversal: pitch rate reversed 0 times"),
                dropped.evidence()::toString);
    }

    @Test
    void aDoubletWhoseInputCameBeforeTheClassifierRoseIsSeenWholeAndBeginsAtTheInput() {
        // the classifier wakes up only in the second lobe, at 12 s; the first lobe began at 10.5 s
        Bump bump = new Bump(ManoeuvreKind.PITCH_DOUBLET, 12, 18, 0.9);
        Physics doublet = (t, f, s) -> {
            SyntheticSortie.level(t, f, s);
            double q = 0;
            if (t >= 10.5 && t < 11.5) {
                q = 10;
            } else if (t >= 11.5 && t < 12.5) {
                q = -10;
            } else if (t >= 12.5 && t < 13.3) {
                q = 3;
            }
            s.set(f, "Q", q);
        };
        // the guard rule alone: the doublet watch, which would place the begin at its trimmed lead, is off
        DetectorSettings ruleOnly = DetectorSettings.defaults()
                .withDisabledRules(java.util.Set.of(BoundaryRules.DOUBLET_SIGNATURE));
        PointEvent kept = run(ruleOnly, SyntheticSortie.dictionary(), bump, 25, doublet).onlyFinal();
        assertEquals(ENDED, kept.type(), kept.evidence()::toString);
        assertTrue(kept.hasEvidence("passed doublet-q-reversal: pitch rate reversed 2 times"),
                kept.evidence()::toString);
        assertTrue(kept.hasEvidence("begin moved to doublet-q-reversal onset at 10.500 s"),
                kept.evidence()::toString);
        assertEquals(ns(10.5), kept.beginNs());
        assertEquals(ns(10.5), kept.keyInstant("input").orElseThrow());
    }

    @Test
    void aStabilisedPointHoldsAltitudeAndSpeedAndFramesAfterItsEndDoNotCount() {
        Bump bump = new Bump(ManoeuvreKind.STABILISED, 10, 30, 0.9);
        SplittableRandom r = new SplittableRandom(5L);
        // a zoom climb at 200 ft/s starts right at the end: 2 s of it before ENDED would give an Hp standard
        // deviation near 85 ft over the hold, beyond the 50 ft limit, if those frames counted
        Physics holdThenZoom = (t, f, s) -> {
            SyntheticSortie.level(t, f, s);
            s.set(f, "Hp", 10000 + 10 * (2 * r.nextDouble() - 1) + (t >= 30 ? 200 * (t - 30) : 0));
            s.set(f, "KCAS", 250 + 0.5 * (2 * r.nextDouble() - 1));
        };
        PointEvent kept = run(bump, 40, holdThenZoom).onlyFinal();
        assertEquals(ENDED, kept.type(), kept.evidence()::toString);
        assertTrue(kept.hasEvidence("passed stabilised-steady"), kept.evidence()::toString);
        assertTrue(kept.reportedAtNs() > ns(32), "the end was decided well into the zoom");

        Physics drifting = (t, f, s) -> {
            SyntheticSortie.level(t, f, s);
            s.set(f, "Hp", 10000 + 30 * (t - 10));
        };
        PointEvent dropped = run(bump, 40, drifting).onlyFinal();
        assertEquals(DISCARDED, dropped.type());
        assertTrue(dropped.hasEvidence("failed stabilised-steady: Hp standard deviation"), dropped.evidence()::toString);
    }

    @Test
    void aSideslipReachesAFewDegreesOfSideslip() {
        Bump bump = new Bump(ManoeuvreKind.SIDESLIP, 10, 25, 0.9);
        Physics slip = (t, f, s) -> {
            SyntheticSortie.level(t, f, s);
            s.set(f, "AoS", t >= 10 && t < 25 ? -6.0 * Math.sin(Math.PI * (t - 10) / 15) : 0.0);
        };
        PointEvent kept = run(bump, 35, slip).onlyFinal();
        assertEquals(ENDED, kept.type());
        assertEquals(ns(17.5), kept.keyInstant("max-beta").orElseThrow());
        Physics straight = (t, f, s) -> {
            SyntheticSortie.level(t, f, s);
            s.set(f, "AoS", 1.0);
        };
        PointEvent dropped = run(bump, 35, straight).onlyFinal();
        assertEquals(DISCARDED, dropped.type());
        assertTrue(dropped.hasEvidence("failed sideslip-beta: largest |AoS| 1.0 deg (needs 3.0)"),
                dropped.evidence()::toString);
    }
}
