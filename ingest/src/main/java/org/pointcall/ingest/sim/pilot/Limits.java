package org.pointcall.ingest.sim.pilot;

import org.pointcall.shared.card.SafetyLimit;
import org.pointcall.shared.card.TestCard;

/**
 * The card's sortie-wide safety limits the pilot respects, on the parameters it can see; where the card sets none,
 * the airframe's own sense (no stall beyond the stall angle plus 3 degrees, 6 g, -2 g).
 */
final class Limits {
    final double nzMax;
    final double nzMin;
    final double alphaMaxRad;
    final double casMaxMps;
    final double machMax;
    final double hpMinM;

    Limits(TestCard card, Envelope env) {
        double nzHi = 6.0;
        double nzLo = -2.0;
        double aoa = env.alphaStallRad() + Math.toRadians(3.0);
        double cas = Double.POSITIVE_INFINITY;
        double mach = Double.POSITIVE_INFINITY;
        double hp = Double.NEGATIVE_INFINITY;
        for (SafetyLimit l : card.limits()) {
            switch (l.parameter()) {
                case "Nz" -> {
                    if (l.hasMax()) {
                        nzHi = Math.min(nzHi, l.maxSi());
                    }
                    if (l.hasMin()) {
                        nzLo = Math.max(nzLo, l.minSi());
                    }
                }
                case "AoA" -> {
                    if (l.hasMax()) {
                        aoa = Math.min(aoa, l.maxSi());
                    }
                }
                case "KCAS" -> {
                    if (l.hasMax()) {
                        cas = Math.min(cas, l.maxSi());
                    }
                }
                case "Mach" -> {
                    if (l.hasMax()) {
                        mach = Math.min(mach, l.maxSi());
                    }
                }
                case "Hp" -> {
                    if (l.hasMin()) {
                        hp = Math.max(hp, l.minSi());
                    }
                }
                default -> {
                    // parameters the pilot cannot see (engine temperatures) are watched by the control room
                }
            }
        }
        nzMax = nzHi;
        nzMin = nzLo;
        alphaMaxRad = aoa;
        casMaxMps = cas;
        machMax = mach;
        hpMinM = hp;
    }
}
