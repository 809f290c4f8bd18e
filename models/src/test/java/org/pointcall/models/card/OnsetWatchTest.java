package org.pointcall.models.card;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Random;

import org.junit.jupiter.api.Test;
import org.pointcall.ingest.frame.Frame;
import org.pointcall.models.analysis.PointHistory;
import org.pointcall.models.detect.PhysicalQuantity;
import org.pointcall.models.detect.PhysicalState;
import org.pointcall.shared.card.Band;
import org.pointcall.shared.card.BandPhase;
import org.pointcall.shared.card.TestPoint;
import org.pointcall.shared.demo.DemoFiles;
import org.pointcall.shared.dictionary.ParameterDictionary;
import org.pointcall.shared.kind.ManoeuvreKind;
import org.pointcall.shared.units.Unit;
import org.pointcall.shared.units.Units;

/**
 * The onset watch fed at 64 Hz with sensor noise (0.02 g, 2 deg/s of roll rate, 0.5 deg/s of pitch rate, 0.3 kt,
 * 0.2 deg; several times the simulator's): armed on a steady entry, it sees a stall's first move within half a
 * second, and neither noise, the wrong kind's move nor flight away from the entry sets it off.
 */
class OnsetWatchTest {
    private static final ParameterDictionary DICT = DemoFiles.dictionary();
    private static final long S = 1_000_000_000L;
    private static final double DEG = Math.PI / 180;
    private static final Band AT_10000 = Band.ofTarget("Hp", null, BandPhase.ENTRY, null, Double.NaN, Unit.FOOT,
            10000, 500, 500);
    private static final TestPoint STALL = new TestPoint("SL-1", ManoeuvreKind.STALL_LEVEL, "stall", "", Double.NaN,
            List.of(AT_10000));
    private static final TestPoint LOOP = new TestPoint("LP-1", ManoeuvreKind.LOOP, "loop", "", Double.NaN,
            List.of(AT_10000));

    /**
     * What the aircraft does at time t, s: {Hp ft, KCAS kt, Nz g, P deg/s, Q deg/s, bank deg, throttle %}, and
     * optionally {R deg/s, AoS deg}.
     */
    private interface Flight {
        double[] at(double t);
    }

    /** Feeds the flight; returns the watch at the end. */
    private static OnsetWatch fly(TestPoint p, double seconds, Flight flight, long seed) {
        PointHistory h = PointHistory.of(DICT, List.of("Hp", "Throttle", "R"), 4096);
        Frame f = Frame.forDictionary(DICT);
        int hp = DICT.indexOf("Hp");
        int thr = DICT.indexOf("Throttle");
        int r = DICT.indexOf("R");
        PhysicalState s = new PhysicalState();
        Random noise = new Random(seed);
        OnsetWatch w = new OnsetWatch();
        for (int i = 0; i <= seconds * 64; i++) {
            long t = Math.round(i * S / 64.0);
            double[] v = flight.at(i / 64.0);
            f.clear();
            f.timeNs(t);
            f.value(hp, v[0] + 3 * noise.nextGaussian());
            f.value(thr, v[6] + 0.2 * noise.nextGaussian());
            f.value(r, (v.length > 7 ? v[7] : 0) + 0.3 * noise.nextGaussian());
            h.append(f);
            s.advance(t);
            s.set(PhysicalQuantity.HP, v[0] * Units.M_PER_FT);
            s.set(PhysicalQuantity.CAS, (v[1] + 0.3 * noise.nextGaussian()) * Units.MPS_PER_KT);
            s.set(PhysicalQuantity.NZ, v[2] + 0.02 * noise.nextGaussian());
            s.set(PhysicalQuantity.P, (v[3] + 2 * noise.nextGaussian()) * DEG);
            s.set(PhysicalQuantity.Q, (v[4] + 0.5 * noise.nextGaussian()) * DEG);
            s.set(PhysicalQuantity.ROLL, (v[5] + 0.2 * noise.nextGaussian()) * DEG);
            s.set(PhysicalQuantity.AOS, ((v.length > 8 ? v[8] : 0) + 0.2 * noise.nextGaussian()) * DEG);
            w.update(p, s, h, t);
            if (w.departed()) {
                break;
            }
        }
        return w;
    }

    /** Level at 10,000 ft and 100 kt, 60 % power, until {@code startS}; then idle and 1 kt/s slower. */
    private static double[] stallEntry(double t, double startS, double hpFt, double bankDeg) {
        double nz = 1 / Math.cos(bankDeg * DEG);
        double q = bankDeg == 0 ? 0 : 9.81 * Math.sin(bankDeg * DEG) * Math.tan(bankDeg * DEG) / 51.4 / DEG;
        boolean in = t >= startS;
        return new double[] {hpFt, in ? 100 - (t - startS) : 100, nz, 0, q, bankDeg, in ? 0 : 60};
    }

    private static double s(long ns) {
        return ns / 1e9;
    }

    @Test
    void aStallsFirstMoveFromItsSteadyEntryIsSeenAtOnce() {
        OnsetWatch w = fly(STALL, 40, t -> stallEntry(t, 20, 10000, 0), 1);
        assertTrue(w.departed(), "the stall's entry");
        assertTrue(s(w.departedNs()) >= 20 && s(w.departedNs()) <= 20.5, "seen at " + s(w.departedNs()) + " s");
        assertEquals(20.0, s(w.departureBeginNs()), 0.3, "dated to where the move began");
        assertTrue(w.cue().contains("throttle") || w.cue().contains("CAS rate"), w.cue());
    }

    @Test
    void aSteadyTurnIsASteadyEntryToo() {
        // a turning stall's entry: 30 deg of bank held, 1.15 g and a steady pitch rate of about 3.7 deg/s
        TestPoint turning = new TestPoint("ST-1", ManoeuvreKind.STALL_TURN, "turning stall", "", Double.NaN,
                List.of(AT_10000, Band.ofTarget("Roll", null, BandPhase.THROUGHOUT, null, Double.NaN, Unit.DEGREE, 30,
                        8, 8)));
        OnsetWatch w = fly(turning, 40, t -> stallEntry(t, 20, 10000, 30), 2);
        assertTrue(w.departed() && s(w.departedNs()) <= 20.5, "seen at " + s(w.departedNs()) + " s");
    }

    @Test
    void noiseTheWrongMoveAndFlightAwayFromTheEntryDoNotSetItOff() {
        OnsetWatch quiet = fly(STALL, 60, t -> stallEntry(t, 1e9, 10000, 0), 3);
        assertTrue(quiet.armed(), "steady at the entry");
        assertFalse(quiet.departed(), "noise alone: " + quiet.cue());
        // a loop begins with a pull, not by slowing down
        OnsetWatch loop = fly(LOOP, 40, t -> stallEntry(t, 20, 10000, 0), 4);
        assertTrue(loop.armed());
        assertFalse(loop.departed(), loop.cue());
        // 3,000 ft above the entry band (widened by its width): never armed, so the same stall entry is no onset
        OnsetWatch high = fly(STALL, 40, t -> stallEntry(t, 20, 13000, 0), 5);
        assertFalse(high.armed());
        assertFalse(high.departed());
        // and a loop's pull is a loop's first move
        OnsetWatch pull = fly(LOOP, 40, t -> {
            double[] v = stallEntry(t, 1e9, 10000, 0);
            v[2] = t < 20 ? 1 : 1 + Math.min(3, 3 * (t - 20));
            return v;
        }, 6);
        assertTrue(pull.departed() && s(pull.departedNs()) <= 20.5, "pull seen at " + s(pull.departedNs()) + " s");
        assertTrue(pull.cue().startsWith("Nz"), pull.cue());
    }

    @Test
    void aSideslipsRudderIsSeenInTheYawRateBeforeTheSideslipBuilds() {
        // from 20 s the rudder ramps in: the yaw rate 3 deg/s per second, the sideslip only 1 deg per second
        TestPoint slip = new TestPoint("SS-1", ManoeuvreKind.SIDESLIP, "sideslip", "", Double.NaN, List.of(AT_10000));
        OnsetWatch w = fly(slip, 40, t -> {
            double in = Math.max(0, t - 20);
            double[] v = stallEntry(t, 1e9, 10000, 0);
            return new double[] {v[0], v[1], v[2], v[3], v[4], v[5], v[6], -Math.min(3, 3 * in), Math.min(8, in)};
        }, 7);
        assertTrue(w.departed() && s(w.departedNs()) <= 20.9, "seen at " + s(w.departedNs()) + " s: " + w.cue());
        assertTrue(w.cue().startsWith("yaw rate"), w.cue());
    }

    @Test
    void rearmedAfterAMoveThatWasNotThePointItIsArmedAtOnce() {
        // a move seen (the session then found it was a set-up): re-armed on the values held now, no departure left
        OnsetWatch w = fly(STALL, 25, t -> stallEntry(t, 20, 10000, 0), 8);
        assertTrue(w.departed());
        w.rearm(w.departedNs());
        assertTrue(w.armed() && !w.departed());
        assertEquals(OnsetWatch.NONE, w.departureBeginNs());
    }
}
