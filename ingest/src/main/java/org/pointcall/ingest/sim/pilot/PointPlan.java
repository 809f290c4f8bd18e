package org.pointcall.ingest.sim.pilot;

import java.util.Locale;
import java.util.function.BiFunction;

import org.pointcall.shared.card.Band;
import org.pointcall.shared.card.BandPhase;
import org.pointcall.shared.card.TestPoint;
import org.pointcall.shared.kind.ManoeuvreKind;
import org.pointcall.shared.units.Units;

/**
 * What the pilot takes from a card point: the entry condition and the technique's numbers, read from the point's
 * bands (a target band gives its target, a range its middle, a one-sided band a little inside its edge), the
 * kind's usual values scaled to the airframe where the card is silent (common practice), clamped to what the
 * aircraft can fly, and then spoilt by the point's flaw, if any: the pilot believes the spoilt numbers.
 */
final class PointPlan {
    private static final double FT = Units.M_PER_FT;
    private static final double KT = Units.MPS_PER_KT;
    private static final double DEG = Units.RAD_PER_DEG;

    final TestPoint point;
    final ManoeuvreKind kind;
    final Flaw flaw;
    /** Entry pressure altitude, m. */
    final double hpM;
    /** True when the entry speed is a Mach number, false when it is a calibrated airspeed. */
    final boolean onMach;
    /** Entry calibrated airspeed, m/s (NaN on Mach). */
    final double casMps;
    /** Entry Mach number (NaN on calibrated airspeed). */
    final double mach;
    /** Entry bank, rad (a turning stall's bank; 0 otherwise). */
    final double bankRad;
    /** Load factor to pull (loop), to wind up to (wind-up turn). */
    final double nzTarget;
    /** Stall entry rate, calibrated airspeed lost per second, m/s^2. */
    final double entryRateMps2;
    /** Hold time, s. */
    final double holdS;
    /** Level acceleration Mach range. */
    final double machFrom;
    final double machTo;
    /** Largest sideslip the pilot will hold, rad. */
    final double betaMaxRad;
    /** Doublet input size as a multiple of the usual one. */
    final double inputScale;
    /** Bank held wings-level points are flown at (a bank-off flaw), rad. */
    final double wingsLevelBankRad;
    /** Tracking error factor for the point. */
    final double looseness;
    /** 1 rolling right, -1 rolling left. */
    final int rollDirection;
    /** 1 when the gear is to be down. */
    final int gear;
    /** Flap selector: 0 up, 1 take-off, 2 landing. */
    final int flap;

    /** The envelope of the point's configuration. */
    final Envelope envelope;

    /**
     * @param envelopes the pilot's envelope of a configuration (gear 0 or 1, flap 0 to 2)
     */
    PointPlan(TestPoint point, Flaw flaw, BiFunction<Integer, Integer, Envelope> envelopes, Limits limits,
              double massKg) {
        this.point = point;
        this.kind = point.kind();
        this.flaw = flaw;
        double g = value(point, "Gear", 0.1, BandPhase.ENTRY, BandPhase.THROUGHOUT);
        double f = value(point, "Flap", 0.1, BandPhase.ENTRY, BandPhase.THROUGHOUT);
        String config = point.config().toLowerCase(Locale.ROOT);
        if (Double.isNaN(g)) {
            g = config.contains("gear down") ? 1 : 0;
        }
        if (Double.isNaN(f)) {
            f = config.contains("flaps landing") || config.contains("landing flap") ? 2
                    : config.contains("flaps take-off") || config.contains("take-off flap") ? 1 : 0;
        }
        this.gear = g >= 0.5 ? 1 : 0;
        this.flap = (int) Math.max(0, Math.min(2, Math.round(f)));
        Envelope env = envelopes.apply(gear, flap);
        this.envelope = env;
        double hp = value(point, "Hp", 50 * FT, BandPhase.ENTRY, BandPhase.THROUGHOUT);
        if (Double.isNaN(hp)) {
            hp = 10000 * FT;
        }
        if (Double.isFinite(limits.hpMinM)) {
            hp = Math.max(hp, limits.hpMinM + 1500 * FT);
        }
        double vs = env.stallCasMps(hp, massKg);
        double vmax = env.maxLevelCasMps(hp, massKg);
        double nzLimit = limits.nzMax - 0.5;

        double bank = 0.0;
        if (kind == ManoeuvreKind.STALL_TURN) {
            bank = value(point, "Roll", 0.0, BandPhase.ENTRY, BandPhase.THROUGHOUT);
            if (Double.isNaN(bank) || bank == 0.0) {
                double atBreak = metric(point, "bank-at-break", 0.0);
                bank = Double.isNaN(atBreak) || atBreak == 0.0 ? -30 * DEG : atBreak;
            }
        }

        double rate = Double.NaN;
        for (Band b : point.bands()) {
            if ("KCAS".equals(b.parameter()) && b.phase() == BandPhase.RATE) {
                rate = -target(b, 0.1 * KT);
            }
        }
        if (Double.isNaN(rate)) {
            rate = metric(point, "entry-rate", 0.1 * KT);
        }
        entryRateMps2 = (Double.isNaN(rate) || rate <= 0 ? 1.0 * KT : rate) * (flaw == Flaw.ENTRY_RATE_FAST ? 2 : 1);

        double nz = value(point, "Nz", 0.1, BandPhase.INSTANT);
        if (kind == ManoeuvreKind.LOOP && Double.isNaN(nz)) {
            nz = metric(point, "pull-nz", 0.1);
        }
        if (kind == ManoeuvreKind.WIND_UP_TURN) {
            nz = metric(point, "nz-max", 0.1);
        }

        double cas = value(point, "KCAS", 2 * KT, BandPhase.ENTRY, BandPhase.THROUGHOUT);
        double m = value(point, "Mach", 0.005, BandPhase.ENTRY, BandPhase.THROUGHOUT);
        double from = Double.NaN;
        double to = Double.NaN;
        switch (kind) {
            case STALL_LEVEL, STALL_TURN -> {
                // trim at 1.3 times the stall speed of the load factor the turn needs (14 CFR 23.201 practice)
                if (Double.isNaN(cas)) {
                    cas = 1.3 * vs * Math.sqrt(1.0 / Math.cos(bank));
                }
                m = Double.NaN;
            }
            case LOOP -> {
                if (Double.isNaN(cas) && Double.isNaN(m)) {
                    cas = Math.min(2.7 * vs, 0.9 * vmax);
                }
                if (Double.isNaN(nz)) {
                    nz = 4.0;
                }
            }
            case WIND_UP_TURN -> {
                if (Double.isNaN(m) && Double.isNaN(cas)) {
                    m = machOfCas(0.75 * vmax, hp);
                }
                if (Double.isNaN(nz)) {
                    nz = 4.0;
                }
            }
            case LEVEL_ACCEL -> {
                from = metric(point, "mach-start", 0.02);
                to = metric(point, "mach-end", 0.02);
                if (Double.isNaN(from)) {
                    from = machOfCas(1.35 * vs, hp);
                }
                if (Double.isNaN(to)) {
                    to = machOfCas(0.95 * vmax, hp);
                }
                m = from;
                cas = Double.NaN;
            }
            case PITCH_DOUBLET, PHUGOID -> {
                if (Double.isNaN(cas) && Double.isNaN(m)) {
                    cas = 0.65 * vmax;
                }
            }
            case SIDESLIP -> {
                if (Double.isNaN(cas) && Double.isNaN(m)) {
                    cas = 0.55 * vmax;
                }
            }
            case AILERON_ROLL -> {
                if (Double.isNaN(cas) && Double.isNaN(m)) {
                    cas = 0.75 * vmax;
                }
            }
            case STABILISED -> {
                if (Double.isNaN(cas) && Double.isNaN(m)) {
                    cas = 0.7 * vmax;
                }
            }
        }
        boolean mach = Double.isNaN(cas);
        // the pilot flies only what the aircraft can: 1.2 Vs to 0.97 Vmax, and inside the card's limits
        double casFloor = 1.2 * vs;
        double casCeil = Math.min(0.97 * vmax, limits.casMaxMps - 10 * KT);
        if (Double.isFinite(limits.machMax)) {
            casCeil = Math.min(casCeil, Envelope.casOfMach(limits.machMax - 0.03, hp));
        }
        if (mach) {
            m = Math.max(machOfCas(casFloor, hp), Math.min(m, machOfCas(casCeil, hp)));
        } else {
            cas = Math.max(casFloor, Math.min(cas, casCeil));
        }
        if (kind == ManoeuvreKind.LEVEL_ACCEL) {
            to = Math.min(to, machOfCas(0.99 * vmax, hp));
            if (Double.isFinite(limits.machMax)) {
                to = Math.min(to, limits.machMax - 0.03);
            }
        }
        if (!Double.isNaN(nz)) {
            nz = Math.min(nz, nzLimit);
        }

        // the flaw, as the pilot (wrongly) believes the numbers
        switch (flaw) {
            case ENTRY_FAST -> {
                cas += 8 * KT;
                m += 0.015;
            }
            case ENTRY_SLOW -> {
                cas -= 8 * KT;
                m -= 0.015;
            }
            case ENTRY_HIGH -> hp += 400 * FT;
            case ENTRY_LOW -> hp -= 400 * FT;
            case OVER_PULL -> nz += 0.5;
            case BANK_OFF -> bank += Math.copySign(8 * DEG, bank);
            default -> {
                // the rest change the technique, below
            }
        }
        this.hpM = hp;
        this.onMach = mach;
        this.casMps = mach ? Double.NaN : cas;
        this.mach = mach ? m : Double.NaN;
        this.bankRad = bank;
        this.nzTarget = nz;
        this.machFrom = from;
        this.machTo = to;
        double hold = point.hasHold() ? point.holdS() : (kind == ManoeuvreKind.STABILISED ? 20.0 : Double.NaN);
        this.holdS = flaw == Flaw.SHORT_HOLD && !Double.isNaN(hold) ? 0.6 * hold : hold;
        double aos = Double.NaN;
        for (Band b : point.bands()) {
            if ("AoS".equals(b.parameter()) && b.phase() == BandPhase.THROUGHOUT) {
                aos = Math.min(Math.abs(b.lowSi()), Math.abs(b.highSi()));
            }
        }
        this.betaMaxRad = Double.isFinite(aos) && aos > 1 * DEG ? 0.85 * aos : 10 * DEG;
        this.inputScale = flaw == Flaw.OVER_PULL ? 2.5 : 1.0;
        this.wingsLevelBankRad = flaw == Flaw.BANK_OFF && kind != ManoeuvreKind.STALL_TURN ? 12 * DEG : 0.0;
        this.looseness = flaw == Flaw.LOOSE_TRACKING ? 4.0 : 1.0;
        this.rollDirection = point.title().toLowerCase(Locale.ROOT).contains("left") ? -1 : 1;
    }

    /** The entry speed as a calibrated airspeed at the entry altitude. */
    double entryCasMps() {
        return onMach ? Envelope.casOfMach(mach, hpM) : casMps;
    }

    private static double machOfCas(double casMps, double hpM) {
        return Envelope.tasOfCas(casMps, hpM)
                / org.pointcall.shared.atmosphere.StandardAtmosphere.speedOfSoundMps(hpM);
    }

    /** The value the pilot aims for in a band, SI; one-sided bands a margin inside their edge. */
    static double target(Band b, double marginSi) {
        if (b.isTarget()) {
            return b.targetSi();
        }
        double lo = b.lowSi();
        double hi = b.highSi();
        if (Double.isFinite(lo) && Double.isFinite(hi)) {
            return 0.5 * (lo + hi);
        }
        return Double.isFinite(hi) ? hi - marginSi : lo + marginSi;
    }

    /** Target of the first band on a parameter in one of the phases, SI; NaN when there is none. */
    static double value(TestPoint p, String parameter, double marginSi, BandPhase... phases) {
        for (BandPhase ph : phases) {
            for (Band b : p.bands()) {
                if (parameter.equals(b.parameter()) && b.phase() == ph) {
                    return target(b, marginSi);
                }
            }
        }
        return Double.NaN;
    }

    /** Target of the first band on a metric, in the metric's SI value; NaN when there is none. */
    static double metric(TestPoint p, String metric, double marginSi) {
        for (Band b : p.bands()) {
            if (metric.equals(b.metric())) {
                return target(b, marginSi);
            }
        }
        return Double.NaN;
    }
}
