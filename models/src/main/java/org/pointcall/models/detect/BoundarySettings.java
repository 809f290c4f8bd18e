package org.pointcall.models.detect;

import java.util.ArrayList;
import java.util.List;

import org.pointcall.shared.error.PointcallException;

/**
 * Thresholds of the {@link BoundaryRules boundary rules}, in SI. Like the guard rules' they are rates, angles and
 * load factors of steady flight, valid for any airframe, never a figure of one type.
 *
 * @param steadyRollRateRadS   steady flight: |P| below this...
 * @param steadyPitchRateRadS  ...|Q| below this...
 * @param steadyBankRad        ...|bank| below this...
 * @param steadyGammaRad       ...and |flight-path angle| (from the rate of Hp and the true airspeed) below this...
 * @param steadyDwellS         ...at every sample for this long: back in steady flight at the end of that stretch
 * @param recoveryWaitS        {@code end-recovery}: longest wait after the classifier's end for the steady stretch
 * @param departureLookS       {@code begin-departure}: the onset is looked for this far either side of the
 *                             classifier's begin
 * @param departureQuietS      {@code begin-departure}: the onset follows at least this long of quiet entry...
 * @param departureActiveS     ...and is followed by at least this long of departure
 * @param departureSpeedRateMps2 {@code begin-departure}: a speed rate beyond this departs (a stall's slow-down)
 * @param departureNz          {@code begin-departure}: Nz off the level-turn value (1 / cos bank) by this departs
 * @param departureBetaRad     {@code begin-departure}: |AoS| beyond this departs
 * @param departurePitchRateRadS {@code begin-departure}: |Q| (smoothed over half a second) beyond this departs
 * @param departureRollRateRadS  {@code begin-departure}: |P| (smoothed over half a second) beyond this departs
 * @param accelRateMps2        {@code accel-extent}: gaining speed while dCAS/dt is above this
 * @param accelLookBackS       {@code accel-extent}: how far before the classifier's begin the gain may have started
 * @param accelDropMps         {@code accel-extent}: the run has ended once CAS is this far below its highest
 * @param accelWaitS           {@code accel-extent}: longest wait after the classifier's end for that drop
 * @param fragmentGapS         {@code fragment-merge}: gap a long point of one kind bridges
 * @param accelGain            {@code accel-gain}: least CAS gain of a level acceleration, a fraction of its lowest
 * @param assistEnterProbability {@code physics-entry}: a kind whose live rules passed enters above this...
 * @param assistLeaveProbability ...and such a point leaves below this
 * @param turnBankRad          {@code stall-bank}: a stall whose median |bank| to the break is at least this turns
 */
public record BoundarySettings(double steadyRollRateRadS, double steadyPitchRateRadS, double steadyBankRad,
                               double steadyGammaRad, double steadyDwellS, double recoveryWaitS,
                               double departureLookS, double departureQuietS, double departureActiveS,
                               double departureSpeedRateMps2, double departureNz, double departureBetaRad,
                               double departurePitchRateRadS, double departureRollRateRadS, double accelRateMps2,
                               double accelLookBackS, double accelDropMps, double accelWaitS, double fragmentGapS,
                               double accelGain, double assistEnterProbability, double assistLeaveProbability,
                               double turnBankRad) {

    public BoundarySettings {
        List<String> bad = new ArrayList<>();
        double[] all = {steadyRollRateRadS, steadyPitchRateRadS, steadyBankRad, steadyGammaRad, steadyDwellS,
                recoveryWaitS, departureLookS, departureQuietS, departureActiveS, departureSpeedRateMps2, departureNz,
                departureBetaRad, departurePitchRateRadS, departureRollRateRadS, accelRateMps2, accelLookBackS,
                accelDropMps, accelWaitS, fragmentGapS, accelGain, assistEnterProbability, assistLeaveProbability, turnBankRad};
        String[] names = {"steadyRollRateRadS", "steadyPitchRateRadS", "steadyBankRad", "steadyGammaRad",
                "steadyDwellS", "recoveryWaitS", "departureLookS", "departureQuietS", "departureActiveS",
                "departureSpeedRateMps2", "departureNz", "departureBetaRad", "departurePitchRateRadS",
                "departureRollRateRadS", "accelRateMps2", "accelLookBackS", "accelDropMps", "accelWaitS",
                "fragmentGapS", "accelGain", "assistEnterProbability", "assistLeaveProbability", "turnBankRad"};
        for (int i = 0; i < all.length; i++) {
            if (!(all[i] > 0) || Double.isInfinite(all[i])) {
                bad.add(names[i] + " must be a finite number above 0, got " + all[i]);
            }
        }
        if (accelLookBackS > PhysicsHistory.CAPACITY * PhysicsHistory.STEP_NS / 1e9) {
            bad.add("accelLookBackS must not exceed the detector's physics history of "
                    + PhysicsHistory.CAPACITY * PhysicsHistory.STEP_NS / 1e9 + " s, got " + accelLookBackS);
        }
        if (!(assistLeaveProbability < assistEnterProbability && assistEnterProbability < 1)) {
            bad.add("assistLeaveProbability (" + assistLeaveProbability + ") must be below assistEnterProbability ("
                    + assistEnterProbability + "), which must be below 1");
        }
        if (!bad.isEmpty()) {
            throw new PointcallException("boundary settings: " + String.join("; ", bad));
        }
    }

    /**
     * Steady flight: |P| < 3 deg/s, |Q| < 1.5 deg/s, |bank| < 4 deg, |gamma| < 1.5 deg held for 2 s; wait up to 30 s
     * for it. Departure looked for 10 s either side, after 1 s quiet and followed by 1 s active, beyond 0.15 m/s2
     * (0.3 kt/s) of speed rate, 0.1 g of Nz, 1.5 deg of AoS, 2 deg/s of Q or 5 deg/s of P. Level acceleration gaining
     * above 0.05 m/s2, looked for up to 120 s back, ended 0.5 m/s (1 kt) below the highest CAS, waited up to 120 s.
     * Long points bridge 8 s gaps. A level acceleration gains at least 5 % of its lowest CAS (its purpose is a
     * sweep of speed; the demo card's runs gain over 15 %). A kind whose live rules passed enters above 0.25 (the
     * raw level from which its rules are fed) and leaves below 0.15. A stall held beyond 15 deg of bank to its break is a turning one.
     */
    public static BoundarySettings defaults() {
        double deg = Math.PI / 180;
        return new BoundarySettings(3 * deg, 1.5 * deg, 4 * deg, 1.5 * deg, 2.0, 30.0,
                10.0, 1.0, 1.0, 0.15, 0.1, 1.5 * deg, 2 * deg, 5 * deg,
                0.05, 120.0, 0.5, 120.0, 8.0, 0.05, 0.25, 0.15, 15 * deg);
    }

    public BoundarySettings withSteadyDwellS(double v) {
        return new BoundarySettings(steadyRollRateRadS, steadyPitchRateRadS, steadyBankRad, steadyGammaRad, v,
                recoveryWaitS, departureLookS, departureQuietS, departureActiveS, departureSpeedRateMps2, departureNz,
                departureBetaRad, departurePitchRateRadS, departureRollRateRadS, accelRateMps2, accelLookBackS,
                accelDropMps, accelWaitS, fragmentGapS, accelGain,
                assistEnterProbability, assistLeaveProbability, turnBankRad);
    }

    public BoundarySettings withAccelGain(double v) {
        return new BoundarySettings(steadyRollRateRadS, steadyPitchRateRadS, steadyBankRad, steadyGammaRad,
                steadyDwellS, recoveryWaitS, departureLookS, departureQuietS, departureActiveS,
                departureSpeedRateMps2, departureNz, departureBetaRad, departurePitchRateRadS, departureRollRateRadS,
                accelRateMps2, accelLookBackS, accelDropMps, accelWaitS, fragmentGapS, v, assistEnterProbability,
                assistLeaveProbability, turnBankRad);
    }

    public BoundarySettings withFragmentGapS(double v) {
        return new BoundarySettings(steadyRollRateRadS, steadyPitchRateRadS, steadyBankRad, steadyGammaRad,
                steadyDwellS, recoveryWaitS, departureLookS, departureQuietS, departureActiveS,
                departureSpeedRateMps2, departureNz, departureBetaRad, departurePitchRateRadS, departureRollRateRadS,
                accelRateMps2, accelLookBackS, accelDropMps, accelWaitS, v, accelGain, assistEnterProbability,
                assistLeaveProbability, turnBankRad);
    }
}
