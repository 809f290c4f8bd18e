package org.pointcall.shared.card;

import java.util.Objects;

import org.pointcall.shared.error.Plain;
import org.pointcall.shared.units.Unit;

/**
 * A tolerance band of a test point, on a dictionary parameter or on a metric of the point's kind. Limits are stored
 * in SI; {@code unit} is the one the card was written in, kept for display and for writing the card back.
 *
 * <p>Two forms: a target with a tolerance each side ({@code targetSi}, {@code tolMinusSi}, {@code tolPlusSi}; min
 * and max NaN), or a range ({@code minSi}, {@code maxSi}, either of them infinite when open; target and tolerances
 * NaN). For a {@link BandPhase#RATE} band the values are rates (SI unit of the parameter per second).
 *
 * @param parameter  dictionary parameter name, or {@code null} for a metric band
 * @param metric     metric name of the point's kind, or {@code null} for a parameter band
 * @param phase      when it applies; {@link BandPhase#RESULT} exactly for metric bands
 * @param instant    key instant of the kind for {@code INSTANT} ("at") and {@code RATE} ("before") bands, else null
 * @param overS      length of the rate interval before the instant, seconds; NaN unless {@code RATE}
 * @param unit       the card's unit for this band
 * @param targetSi   target value, SI
 * @param tolMinusSi tolerance below the target, SI (a difference, no offset)
 * @param tolPlusSi  tolerance above the target, SI
 * @param minSi      lowest value in the band, SI; {@code -Infinity} when open
 * @param maxSi      highest value in the band, SI; {@code +Infinity} when open
 */
public record Band(String parameter, String metric, BandPhase phase, String instant, double overS, Unit unit,
                   double targetSi, double tolMinusSi, double tolPlusSi, double minSi, double maxSi) {

    public Band {
        Objects.requireNonNull(phase, "phase");
        Objects.requireNonNull(unit, "unit");
        if ((parameter == null) == (metric == null)) {
            throw new IllegalArgumentException("a band is on a parameter or on a metric, exactly one of them");
        }
        if ((metric != null) != (phase == BandPhase.RESULT)) {
            throw new IllegalArgumentException("a band on a metric has phase result, and only such a band");
        }
        boolean needsInstant = phase == BandPhase.INSTANT || phase == BandPhase.RATE;
        if (needsInstant != (instant != null)) {
            throw new IllegalArgumentException("a key instant goes with the instant and rate phases, and only them");
        }
        if (phase == BandPhase.RATE ? !(overS > 0 && Double.isFinite(overS)) : !Double.isNaN(overS)) {
            throw new IllegalArgumentException("a rate band needs a positive finite interval (other bands NaN), got "
                    + overS);
        }
        // -0.0 would survive a file only as 0.0; normalised so that a card equals itself read back
        targetSi += 0.0;
        tolMinusSi += 0.0;
        tolPlusSi += 0.0;
        minSi += 0.0;
        maxSi += 0.0;
        if (!Double.isNaN(targetSi)) {
            if (!Double.isFinite(targetSi) || !Double.isNaN(minSi) || !Double.isNaN(maxSi)) {
                throw new IllegalArgumentException("a target band has a finite target and no min or max");
            }
            if (!(tolMinusSi >= 0) || !(tolPlusSi >= 0) || Double.isInfinite(tolMinusSi)
                    || Double.isInfinite(tolPlusSi)) {
                throw new IllegalArgumentException("tolerances must be finite and not negative");
            }
            if (!(tolMinusSi + tolPlusSi > 0)) {
                throw new IllegalArgumentException("band on " + subject() + " has no width");
            }
        } else {
            if (!Double.isNaN(tolMinusSi) || !Double.isNaN(tolPlusSi)) {
                throw new IllegalArgumentException("tolerances go with a target");
            }
            if (Double.isNaN(minSi) || Double.isNaN(maxSi) || minSi == Double.POSITIVE_INFINITY
                    || maxSi == Double.NEGATIVE_INFINITY || (Double.isInfinite(minSi) && Double.isInfinite(maxSi))) {
                throw new IllegalArgumentException("a range band has min, max or both (open ends infinite)");
            }
            if (!(minSi < maxSi)) {
                throw new IllegalArgumentException("band on " + subject() + " has no width");
            }
        }
    }

    /** A band "target, minus tolMinus, plus tolPlus", the values in {@code unit}. */
    public static Band ofTarget(String parameter, String metric, BandPhase phase, String instant, double overS,
                                Unit unit, double target, double tolMinus, double tolPlus) {
        return new Band(parameter, metric, phase, instant, overS, unit, unit.toSi(target), unit.deltaToSi(tolMinus),
                unit.deltaToSi(tolPlus), Double.NaN, Double.NaN);
    }

    /** A band "from min to max", the values in {@code unit}; an open end is given as an infinity. */
    public static Band ofRange(String parameter, String metric, BandPhase phase, String instant, double overS,
                               Unit unit, double min, double max) {
        return new Band(parameter, metric, phase, instant, overS, unit,
                Double.NaN, Double.NaN, Double.NaN, Double.isInfinite(min) ? min : unit.toSi(min),
                Double.isInfinite(max) ? max : unit.toSi(max));
    }

    /** The parameter or metric name. */
    public String subject() {
        return parameter != null ? parameter : metric;
    }

    public boolean isTarget() {
        return !Double.isNaN(targetSi);
    }

    /** Lowest value inside the band, SI ({@code -Infinity} when open). */
    public double lowSi() {
        return isTarget() ? targetSi - tolMinusSi : minSi;
    }

    /** Highest value inside the band, SI ({@code +Infinity} when open). */
    public double highSi() {
        return isTarget() ? targetSi + tolPlusSi : maxSi;
    }

    /** True when {@code valueSi} lies in the band, ends included; NaN is never inside. */
    public boolean contains(double valueSi) {
        return valueSi >= lowSi() && valueSi <= highSi();
    }

    /**
     * The band in the card's own unit, as an engineer reads it: {@code 320 +/- 10 kt}, {@code -1 -0.2/+0.3 kt/s},
     * {@code 88 to 102 kt}, {@code at most 800 ft}, {@code at least 0.5}.
     */
    public String describe() {
        String u = unit.symbol().equals("1") ? "" : " " + unit.symbol();
        if (isTarget()) {
            String t = Plain.of(unit.fromSi(targetSi));
            double minus = unit.deltaFromSi(tolMinusSi);
            double plus = unit.deltaFromSi(tolPlusSi);
            if (Double.compare(tolMinusSi, tolPlusSi) == 0) {
                return t + " +/- " + Plain.of(plus) + u;
            }
            return t + " -" + Plain.of(minus) + "/+" + Plain.of(plus) + u;
        }
        if (Double.isInfinite(minSi)) {
            return "at most " + Plain.of(unit.fromSi(maxSi)) + u;
        }
        if (Double.isInfinite(maxSi)) {
            return "at least " + Plain.of(unit.fromSi(minSi)) + u;
        }
        return Plain.of(unit.fromSi(minSi)) + " to " + Plain.of(unit.fromSi(maxSi)) + u;
    }
}
