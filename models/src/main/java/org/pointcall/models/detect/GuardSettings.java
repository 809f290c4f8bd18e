package org.pointcall.models.detect;

import java.util.ArrayList;
import java.util.List;

import org.pointcall.shared.error.PointcallException;
import org.pointcall.shared.units.Units;

/**
 * Thresholds of the guard rules, in SI. They are shapes and normalised values that hold for any airframe (a pitch
 * attitude through the vertical, a bank change of a full turn, a load factor, a fraction of a peak), never type data
 * such as a stall AoA. Defaults are the detector's own engineering choices unless a comment says otherwise.
 *
 * @param loopPitchRad         {@code loop-pitch-90}: |pitch| a loop must reach
 * @param loopInvertedRollRad  {@code loop-pitch-90}: |bank| that counts as inverted, once |pitch| passed half of
 *                             {@code loopPitchRad} (sampled data may step over the vertical)
 * @param stallAoaRiseRad      {@code stall-aoa-peak}: least AoA rise from the lowest value before the peak to the
 *                             peak (a noise floor, not a stall AoA)
 * @param stallAoaFallFraction {@code stall-aoa-peak}: after the peak, AoA must fall by this fraction of the rise...
 * @param stallNzDrop          {@code stall-aoa-peak}: ...or Nz must drop this much (g) below its value at the peak
 * @param rollBankRad          {@code roll-360}: least accumulated bank change of an aileron roll
 * @param windupNz             {@code windup-nz}: highest Nz a wind-up turn must reach, g
 * @param doubletQFloorRadS    {@code doublet-q-reversal}: |Q| below this is noise and starts no lobe
 * @param doubletLobeFraction  {@code doublet-q-reversal}: a lobe counts when its peak |Q| is at least this fraction
 *                             of the largest
 * @param doubletReversals     {@code doublet-q-reversal}: least number of sign changes between counted lobes
 * @param stabilisedHpStdM     {@code stabilised-steady}: largest standard deviation of Hp over the hold
 * @param stabilisedCasCv      {@code stabilised-steady}: largest standard deviation of CAS over its mean
 * @param sideslipBetaRad      {@code sideslip-beta}: |AoS| a sideslip must reach
 */
public record GuardSettings(double loopPitchRad, double loopInvertedRollRad, double stallAoaRiseRad,
                            double stallAoaFallFraction, double stallNzDrop, double rollBankRad, double windupNz,
                            double doubletQFloorRadS, double doubletLobeFraction, int doubletReversals,
                            double stabilisedHpStdM, double stabilisedCasCv, double sideslipBetaRad) {

    public GuardSettings {
        List<String> bad = new ArrayList<>();
        angle(bad, "loopPitchRad", loopPitchRad, Math.PI / 2);
        angle(bad, "loopInvertedRollRad", loopInvertedRollRad, Math.PI);
        angle(bad, "stallAoaRiseRad", stallAoaRiseRad, Math.PI / 2);
        fraction(bad, "stallAoaFallFraction", stallAoaFallFraction);
        positive(bad, "stallNzDrop", stallNzDrop);
        if (!(rollBankRad > 0 && rollBankRad <= 4 * Math.PI)) {
            bad.add("rollBankRad must be in (0, 4 pi], got " + rollBankRad);
        }
        if (!(windupNz > 1.0) || Double.isInfinite(windupNz)) {
            bad.add("windupNz must be a finite load factor above 1, got " + windupNz);
        }
        positive(bad, "doubletQFloorRadS", doubletQFloorRadS);
        fraction(bad, "doubletLobeFraction", doubletLobeFraction);
        if (doubletReversals < 1) {
            bad.add("doubletReversals must be at least 1, got " + doubletReversals);
        }
        positive(bad, "stabilisedHpStdM", stabilisedHpStdM);
        positive(bad, "stabilisedCasCv", stabilisedCasCv);
        angle(bad, "sideslipBetaRad", sideslipBetaRad, Math.PI / 2);
        if (!bad.isEmpty()) {
            throw new PointcallException("guard settings: " + String.join("; ", bad));
        }
    }

    private static void angle(List<String> bad, String name, double v, double max) {
        if (!(v > 0 && v <= max)) {
            bad.add(name + " must be in (0, " + max + "] rad, got " + v);
        }
    }

    private static void fraction(List<String> bad, String name, double v) {
        if (!(v > 0 && v < 1)) {
            bad.add(name + " must be in (0, 1), got " + v);
        }
    }

    private static void positive(List<String> bad, String name, double v) {
        if (!(v > 0) || Double.isInfinite(v)) {
            bad.add(name + " must be a finite number above 0, got " + v);
        }
    }

    /**
     * Loop 80 deg or inverted past 135 deg of bank; stall rise 2 deg, fall 20 % or Nz drop 0.1 g; roll 315 deg;
     * wind-up 2 g; doublet floor 1 deg/s, lobes of 25 % of the largest, 1 reversal (the input's own: a short period
     * damped beyond about 0.7 shows no overshoot past it); stabilised Hp standard deviation
     * 50 ft and CAS 1 %; sideslip 3 deg.
     */
    public static GuardSettings defaults() {
        return new GuardSettings(Math.toRadians(80), Math.toRadians(135), Math.toRadians(2), 0.2, 0.1,
                Math.toRadians(315), 2.0, Math.toRadians(1), 0.25, 1,
                // 50 ft: half of the 100 ft altitude band usual for stabilised points (flight-test practice notes,
                // [memory]); 1 % of CAS is about the 1 to 2 kt usual there, at trainer speeds
                50 * Units.M_PER_FT, 0.01, Math.toRadians(3));
    }

    public GuardSettings withLoopPitchRad(double v) {
        return new GuardSettings(v, loopInvertedRollRad, stallAoaRiseRad, stallAoaFallFraction, stallNzDrop,
                rollBankRad, windupNz, doubletQFloorRadS, doubletLobeFraction, doubletReversals, stabilisedHpStdM,
                stabilisedCasCv, sideslipBetaRad);
    }

    public GuardSettings withLoopInvertedRollRad(double v) {
        return new GuardSettings(loopPitchRad, v, stallAoaRiseRad, stallAoaFallFraction, stallNzDrop,
                rollBankRad, windupNz, doubletQFloorRadS, doubletLobeFraction, doubletReversals, stabilisedHpStdM,
                stabilisedCasCv, sideslipBetaRad);
    }

    public GuardSettings withStallAoaRiseRad(double v) {
        return new GuardSettings(loopPitchRad, loopInvertedRollRad, v, stallAoaFallFraction, stallNzDrop,
                rollBankRad, windupNz, doubletQFloorRadS, doubletLobeFraction, doubletReversals, stabilisedHpStdM,
                stabilisedCasCv, sideslipBetaRad);
    }

    public GuardSettings withStallAoaFallFraction(double v) {
        return new GuardSettings(loopPitchRad, loopInvertedRollRad, stallAoaRiseRad, v, stallNzDrop,
                rollBankRad, windupNz, doubletQFloorRadS, doubletLobeFraction, doubletReversals, stabilisedHpStdM,
                stabilisedCasCv, sideslipBetaRad);
    }

    public GuardSettings withStallNzDrop(double v) {
        return new GuardSettings(loopPitchRad, loopInvertedRollRad, stallAoaRiseRad, stallAoaFallFraction, v,
                rollBankRad, windupNz, doubletQFloorRadS, doubletLobeFraction, doubletReversals, stabilisedHpStdM,
                stabilisedCasCv, sideslipBetaRad);
    }

    public GuardSettings withRollBankRad(double v) {
        return new GuardSettings(loopPitchRad, loopInvertedRollRad, stallAoaRiseRad, stallAoaFallFraction,
                stallNzDrop, v, windupNz, doubletQFloorRadS, doubletLobeFraction, doubletReversals, stabilisedHpStdM,
                stabilisedCasCv, sideslipBetaRad);
    }

    public GuardSettings withWindupNz(double v) {
        return new GuardSettings(loopPitchRad, loopInvertedRollRad, stallAoaRiseRad, stallAoaFallFraction,
                stallNzDrop, rollBankRad, v, doubletQFloorRadS, doubletLobeFraction, doubletReversals,
                stabilisedHpStdM, stabilisedCasCv, sideslipBetaRad);
    }

    public GuardSettings withDoubletQFloorRadS(double v) {
        return new GuardSettings(loopPitchRad, loopInvertedRollRad, stallAoaRiseRad, stallAoaFallFraction,
                stallNzDrop, rollBankRad, windupNz, v, doubletLobeFraction, doubletReversals, stabilisedHpStdM,
                stabilisedCasCv, sideslipBetaRad);
    }

    public GuardSettings withDoubletLobeFraction(double v) {
        return new GuardSettings(loopPitchRad, loopInvertedRollRad, stallAoaRiseRad, stallAoaFallFraction,
                stallNzDrop, rollBankRad, windupNz, doubletQFloorRadS, v, doubletReversals, stabilisedHpStdM,
                stabilisedCasCv, sideslipBetaRad);
    }

    public GuardSettings withDoubletReversals(int v) {
        return new GuardSettings(loopPitchRad, loopInvertedRollRad, stallAoaRiseRad, stallAoaFallFraction,
                stallNzDrop, rollBankRad, windupNz, doubletQFloorRadS, doubletLobeFraction, v, stabilisedHpStdM,
                stabilisedCasCv, sideslipBetaRad);
    }

    public GuardSettings withStabilisedHpStdM(double v) {
        return new GuardSettings(loopPitchRad, loopInvertedRollRad, stallAoaRiseRad, stallAoaFallFraction,
                stallNzDrop, rollBankRad, windupNz, doubletQFloorRadS, doubletLobeFraction, doubletReversals, v,
                stabilisedCasCv, sideslipBetaRad);
    }

    public GuardSettings withStabilisedCasCv(double v) {
        return new GuardSettings(loopPitchRad, loopInvertedRollRad, stallAoaRiseRad, stallAoaFallFraction,
                stallNzDrop, rollBankRad, windupNz, doubletQFloorRadS, doubletLobeFraction, doubletReversals,
                stabilisedHpStdM, v, sideslipBetaRad);
    }

    public GuardSettings withSideslipBetaRad(double v) {
        return new GuardSettings(loopPitchRad, loopInvertedRollRad, stallAoaRiseRad, stallAoaFallFraction,
                stallNzDrop, rollBankRad, windupNz, doubletQFloorRadS, doubletLobeFraction, doubletReversals,
                stabilisedHpStdM, stabilisedCasCv, v);
    }
}
